import { Pressable, StyleSheet, View } from 'react-native';
import type { TravelerSummary } from '@/db/contracts';
import { colors, hairline, space, statusColors, touch } from '@/constants/theme';
import { Mono, Txt } from '@/components/ui/text';

/** A traveler in a list: part, revision, serial and short code, and how far along it is. */
export function TravelerCard({ t, onPress }: { t: TravelerSummary; onPress: () => void }) {
  const frac = t.holesTotal ? t.holesDone / t.holesTotal : 0;
  return (
    <Pressable
      testID={`traveler-${t.shortCode}`}
      accessibilityRole="button"
      accessibilityLabel={`${t.partNumber} ${t.partName}, revision ${t.letter}, ${t.holesDone} of ${t.holesTotal} holes done`}
      onPress={onPress}
      style={({ pressed }) => [styles.row, pressed && { backgroundColor: colors.accentSoft }]}
    >
      <View style={{ flex: 1, gap: 2 }}>
        <Txt bold><Mono bold>{t.partNumber}</Mono> {t.partName}</Txt>
        <Txt variant="small" tone="soft">
          Rev <Mono variant="small" bold>{t.letter}</Mono> · <Mono variant="small">{t.serial}</Mono> · code <Mono variant="small" bold>{t.shortCode}</Mono> · build {t.kitSerial}
        </Txt>
        <View style={styles.bar}><View style={[styles.fill, { width: `${frac * 100}%` }]} /></View>
        <View style={styles.flags}>
          <Mono variant="small">{t.holesDone}/{t.holesTotal} holes</Mono>
          {t.openFindings ? <Txt variant="small" bold style={{ color: statusColors.flagged }}>▲ {t.openFindings} open finding{t.openFindings === 1 ? '' : 's'}</Txt> : null}
          {t.newerRevision ? <Txt variant="small" bold tone="caution">Rev {t.newerRevision} is out</Txt> : null}
          {t.signedOff ? <Txt variant="small" bold style={{ color: statusColors.accepted }}>Signed off</Txt> : null}
        </View>
      </View>
      <Txt tone="accent" bold>›</Txt>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: space.md, paddingVertical: space.md, paddingHorizontal: space.xs, minHeight: touch, borderBottomWidth: hairline, borderColor: colors.rule },
  bar: { height: 6, backgroundColor: colors.paperSunk, borderWidth: hairline, borderColor: colors.ruleStrong, marginTop: space.xs },
  fill: { height: '100%', backgroundColor: statusColors.installed },
  flags: { flexDirection: 'row', gap: space.md, flexWrap: 'wrap' },
});
