import { StyleSheet, View } from 'react-native';
import { colors, hairline, space, statusColors } from '@/constants/theme';
import { Mono, Txt } from './text';

/** Done over total, drawn as a scale bar with tick marks every tenth. */
export function ProgressBar({ done, total, label = 'holes done', testID = 'progress' }: { done: number; total: number; label?: string; testID?: string }) {
  const frac = total > 0 ? Math.min(1, done / total) : 0;
  const pct = Math.round(frac * 100);
  return (
    <View
      testID={testID}
      accessibilityRole="progressbar"
      accessibilityValue={{ min: 0, max: total, now: done, text: `${done} of ${total} ${label}` }}
      style={{ gap: space.xs }}
    >
      <View style={styles.row}>
        <Mono bold testID={`${testID}-count`}>{done} / {total}</Mono>
        <Txt variant="small" tone="soft">{label}</Txt>
        <Mono variant="small" tone="soft" style={{ marginLeft: 'auto' }}>{pct}%</Mono>
      </View>
      <View style={styles.track}>
        <View style={[styles.fill, { width: `${frac * 100}%` }]} />
        {Array.from({ length: 9 }, (_, i) => (
          <View key={i} style={[styles.tick, { left: `${(i + 1) * 10}%` }]} />
        ))}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm },
  track: { height: 14, borderWidth: hairline, borderColor: colors.ink, backgroundColor: colors.paperRaised, overflow: 'hidden' },
  fill: { position: 'absolute', left: 0, top: 0, bottom: 0, backgroundColor: statusColors.installed },
  tick: { position: 'absolute', top: 0, width: hairline, height: 5, backgroundColor: colors.ink },
});
