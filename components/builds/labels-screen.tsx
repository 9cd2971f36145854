import { useEffect } from 'react';
import { Image, Platform, StyleSheet, View } from 'react-native';
import type { QrLabel } from '@/db/contracts';
import { colors, space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { useBuildLabelsQuery, useBuildQuery } from '@/hooks/queries/builds';

/**
 * Printing on the web: hide everything but the label sheet and let it flow over pages. `:has()` finds
 * the sheet's ancestors so their scroll boxes do not clip it.
 */
const printCss = `
@media print {
  @page { margin: 10mm; }
  html, body, #root { height: auto !important; overflow: visible !important; background: #fff !important; }
  body *:not(:has(#print-area)):not(#print-area):not(#print-area *) { display: none !important; }
  :has(#print-area) { background: #fff !important; overflow: visible !important; height: auto !important; max-height: none !important; flex: none !important; position: static !important; }
  #print-area [data-testid^="label-"] { break-inside: avoid; page-break-inside: avoid; }
  #print-area [data-testid="print-bar"] { display: none !important; }
}`;

function usePrintCss() {
  useEffect(() => {
    if (Platform.OS !== 'web' || typeof document === 'undefined') return;
    const el = document.createElement('style');
    el.setAttribute('data-pitchcard', 'labels-print');
    el.textContent = printCss;
    document.head.appendChild(el);
    return () => { el.remove(); };
  }, []);
}

function LabelCard({ l }: { l: QrLabel }) {
  return (
    <View style={styles.card} testID={`label-${l.shortCode}`}>
      <Image source={{ uri: l.qrDataUrl }} style={styles.qr} accessibilityLabel={`QR code for ${l.serial}`} />
      <View style={{ flex: 1, gap: 2 }}>
        <Mono bold style={styles.code}>{l.shortCode}</Mono>
        <Mono variant="small">{l.serial}</Mono>
        <Txt variant="small"><Mono variant="small" bold>{l.partNumber}</Mono> rev <Mono variant="small" bold>{l.letter}</Mono></Txt>
        <Txt variant="small" numberOfLines={2}>{l.partName}</Txt>
      </View>
    </View>
  );
}

export function LabelsScreen({ buildId }: { buildId: string }) {
  usePrintCss();
  const build = useBuildQuery(buildId);
  const q = useBuildLabelsQuery(buildId);
  const title = build.data ? `Labels · build ${build.data.kitSerial}` : 'QR labels';
  return (
    <Screen title={title} subtitle="One label per part: stick it where the builder will scan it" backTo={`/builds/${buildId}`} full testID="labels-screen">
      {q.isPending ? <LoadingState what="Making the labels" />
        : q.isError ? <ErrorState error={q.error} onRetry={() => void q.refetch()} />
          : !q.data.length ? <EmptyState title="No labels." body="This build has no parts." />
            : (
              <View nativeID="print-area" style={{ gap: space.lg }}>
                <View style={styles.bar} testID="print-bar">
                  <Txt tone="soft" style={{ flex: 1 }}>{q.data.length} label{q.data.length === 1 ? '' : 's'}. The short code under each QR can be typed on the bench if the camera cannot read it.</Txt>
                  {Platform.OS === 'web' ? <Button label="Print" onPress={() => window.print()} testID="print" /> : null}
                </View>
                <View style={styles.grid} testID="labels">
                  {q.data.map((l) => <LabelCard key={l.travelerId} l={l} />)}
                </View>
              </View>
            )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  bar: { flexDirection: 'row', alignItems: 'center', gap: space.md, flexWrap: 'wrap' },
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  card: {
    width: 320,
    flexDirection: 'row',
    gap: space.md,
    padding: space.md,
    borderWidth: 1,
    borderColor: colors.ink,
    borderStyle: 'dashed',
    backgroundColor: '#FFFFFF',
    alignItems: 'center',
  },
  qr: { width: 120, height: 120 },
  code: { fontSize: 26, lineHeight: 32, letterSpacing: 1 },
});
