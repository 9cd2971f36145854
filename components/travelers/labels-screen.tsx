import { useEffect, useState } from 'react';
import { Image, Platform, StyleSheet, View } from 'react-native';
import { labelSizeInfo, labelSizes, type LabelSize, type PartLabel } from '@/db/contracts';
import { colors, space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Choice } from '@/components/ui/choice';
import { Field } from '@/components/ui/field';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { useLabelsQuery } from '@/hooks/queries/travelers';

/** CSS pixels per millimetre: the browser prints 96 px to the inch, so a label drawn in these is its real size on paper. */
const PX_PER_MM = 96 / 25.4;
const px = (mm: number) => Math.round(mm * PX_PER_MM * 10) / 10;

/** How each stock lays a label out: the QR as large as the label's height allows, the type to fit beside it. */
const layouts: Record<LabelSize, { qrMm: number; code: number; line: number; padMm: number }> = {
  sheet: { qrMm: 32, code: 26, line: 13, padMm: 3 },
  '2x1in': { qrMm: 23, code: 11, line: 7.5, padMm: 1.2 },
  '62mm': { qrMm: 29, code: 14, line: 9, padMm: 1.5 },
};

/**
 * Printing on the web: hide everything but the labels, and give the page the chosen stock's size. A roll
 * or die-cut stock takes one label a page; the sheet lets them flow. `:has()` finds the labels' ancestors so
 * their scroll boxes do not clip them.
 */
export function labelPrintCss(size: LabelSize): string {
  const roll = size !== 'sheet';
  return `
@media print {
  @page { ${labelSizeInfo[size].pageCss} }
  html, body, #root { height: auto !important; overflow: visible !important; background: #fff !important; }
  body *:not(:has(#print-area)):not(#print-area):not(#print-area *) { display: none !important; }
  :has(#print-area) { background: #fff !important; overflow: visible !important; height: auto !important; max-height: none !important; flex: none !important; position: static !important;${roll ? ' padding: 0 !important; margin: 0 !important; border: none !important;' : ''} }
  #print-area [data-testid="print-bar"] { display: none !important; }
  #print-area [data-testid^="part-label-"] { break-inside: avoid; page-break-inside: avoid; }${
    roll
      ? `
  #print-area, #print-area [data-testid="part-labels"] { gap: 0 !important; display: block !important; padding: 0 !important; }
  #print-area [data-testid^="part-label-"] { border: none !important; margin: 0 !important; }
  #print-area [data-testid^="part-label-"]:not(:last-child) { break-after: page; page-break-after: always; }`
      : ''
  }
}`;
}

function usePrintCss(size: LabelSize) {
  useEffect(() => {
    if (Platform.OS !== 'web' || typeof document === 'undefined') return;
    const el = document.createElement('style');
    el.setAttribute('data-pitchcard', 'labels-print');
    el.setAttribute('data-label-size', size);
    el.textContent = labelPrintCss(size);
    document.head.appendChild(el);
    return () => {
      el.remove();
    };
  }, [size]);
}

/** One label: QR, the short code to type, then what tells the part apart on a shelf. */
export function PartLabelCard({ l, size }: { l: PartLabel; size: LabelSize }) {
  const info = labelSizeInfo[size];
  const k = layouts[size];
  const line = { fontSize: k.line, lineHeight: Math.round(k.line * 1.25) };
  // Small stocks keep each line to one row: a label has no room to grow, and a cut line still reads.
  const one = size === 'sheet' ? undefined : 1;
  return (
    <View
      style={[
        styles.card,
        { width: px(info.widthMm), padding: px(k.padMm), gap: px(k.padMm) },
        info.heightMm ? { height: px(info.heightMm) } : null,
      ]}
      testID={`part-label-${l.shortCode}`}
    >
      <Image
        source={{ uri: l.qrDataUrl }}
        style={{ width: px(k.qrMm), height: px(k.qrMm) }}
        accessibilityLabel={`QR code for ${l.serial}`}
      />
      <View style={{ flex: 1, minWidth: 0 }}>
        <Mono bold style={{ fontSize: k.code, lineHeight: Math.round(k.code * 1.2) }} testID="label-code">
          {l.shortCode}
        </Mono>
        <Mono style={line} numberOfLines={one} testID="label-serial">
          {l.serial}
        </Mono>
        <Txt style={line} numberOfLines={one} testID="label-part">
          <Mono bold style={line}>
            {l.partNumber}
          </Mono>{' '}
          rev{' '}
          <Mono bold style={line} testID="label-revision">
            {l.letter}
          </Mono>{' '}
          {l.partName}
        </Txt>
        <Txt style={line} numberOfLines={one} testID="label-kit">
          <Mono style={line}>{l.kitModelCode}</Mono> {l.kitModelName} · kit <Mono style={line}>{l.kitSerial}</Mono>
        </Txt>
        <Txt style={line} numberOfLines={one} tone="soft" testID="label-supplier">
          {l.supplierName}
        </Txt>
      </View>
    </View>
  );
}

/** A whole build's labels (`buildId`, for the supplier shipping it) or one part's (`travelerId`, to reprint one). */
export function LabelsScreen({ buildId, travelerId }: { buildId?: string; travelerId?: string }) {
  const [size, setSize] = useState<LabelSize>('sheet');
  usePrintCss(size);
  const q = useLabelsQuery(travelerId ? { travelerId } : { buildId });
  const first = q.data?.[0];
  const title = travelerId
    ? first
      ? `Label · ${first.serial}`
      : 'QR label'
    : first
      ? `Labels · build ${first.kitSerial}`
      : 'QR labels';
  const n = q.data?.length ?? 0;
  return (
    <Screen
      title={title}
      subtitle={
        travelerId
          ? 'Print this part’s label again: for one lost, worn or unreadable'
          : 'One label per part: stick it where the builder will scan it'
      }
      backTo={travelerId ? `/travelers/${travelerId}` : `/builds/${buildId}`}
      full
      testID="labels-screen"
    >
      {q.isPending ? (
        <LoadingState what="Making the labels" />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      ) : !q.data.length ? (
        <EmptyState title="No labels." body="This build has no parts." />
      ) : (
        <View nativeID="print-area" style={{ gap: space.lg }}>
          <View style={{ gap: space.md }} testID="print-bar">
            <Field label="Label stock" hint={labelSizeInfo[size].hint}>
              <Choice
                label="Label stock"
                testIDPrefix="label-size"
                value={size}
                onChange={setSize}
                options={labelSizes.map((s) => ({ value: s, label: labelSizeInfo[s].name }))}
              />
            </Field>
            <View style={styles.bar}>
              <Txt tone="soft" style={{ flex: 1, minWidth: 200 }}>
                {n} label{n === 1 ? '' : 's'}, shown at print size. The short code under each QR can be typed on the
                bench if the camera cannot read it.
              </Txt>
              {Platform.OS === 'web' ? <Button label="Print" onPress={() => window.print()} testID="print" /> : null}
            </View>
          </View>
          <View style={styles.grid} testID="part-labels">
            {q.data.map((l) => (
              <PartLabelCard key={l.travelerId} l={l} size={size} />
            ))}
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
    flexDirection: 'row',
    borderWidth: 1,
    borderColor: colors.ink,
    borderStyle: 'dashed',
    backgroundColor: '#FFFFFF',
    alignItems: 'center',
    overflow: 'hidden',
  },
});
