import { Pressable, StyleSheet, View } from 'react-native';
import type { BuildSummary } from '@/db/contracts';
import { colors, hairline, space, statusColors, touch } from '@/constants/theme';
import { Mono, Txt } from '@/components/ui/text';

export function BuildRow({ b, onPress }: { b: BuildSummary; onPress: () => void }) {
  const frac = b.holesTotal ? b.holesDone / b.holesTotal : 0;
  return (
    <Pressable
      testID={`build-${b.kitSerial}`}
      accessibilityRole="button"
      // Everything the row shows in words, its warning included: a button's name is all that is read of it.
      accessibilityLabel={`Build ${b.kitSerial}, ${b.kitName}, builder ${b.builders.map((x) => x.name).join(', ') || 'none'}, inspector ${b.inspectors.map((x) => x.name).join(', ') || 'none'}, ${b.travelerCount} parts, ${b.holesDone} of ${b.holesTotal} holes${b.openFindings ? `, ${b.openFindings} open finding${b.openFindings === 1 ? '' : 's'}` : ''}`}
      onPress={onPress}
      style={({ pressed }) => [styles.row, pressed && { backgroundColor: colors.accentSoft }]}
    >
      <View style={{ flex: 1, gap: 2 }}>
        <Txt bold>
          <Mono bold>{b.kitSerial}</Mono> {b.kitName}
        </Txt>
        <Txt variant="small" tone="soft">
          Builder {b.builders.map((x) => x.name).join(', ') || '–'} · inspector{' '}
          {b.inspectors.map((x) => x.name).join(', ') || '–'}
        </Txt>
        <View style={styles.bar}>
          <View style={[styles.fill, { width: `${frac * 100}%` }]} />
        </View>
        <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap' }}>
          <Mono variant="small">
            {b.travelerCount} parts · {b.holesDone}/{b.holesTotal} holes
          </Mono>
          {b.openFindings ? (
            <Txt variant="small" bold tone="warning">
              ▲ {b.openFindings} open
            </Txt>
          ) : null}
        </View>
      </View>
      <Txt tone="accent" bold aria-hidden>
        ›
      </Txt>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    minHeight: touch,
    paddingVertical: space.md,
    borderBottomWidth: hairline,
    borderColor: colors.rule,
  },
  bar: {
    height: 6,
    backgroundColor: colors.paperSunk,
    borderWidth: hairline,
    borderColor: colors.ruleStrong,
    marginTop: space.xs,
  },
  fill: { height: '100%', backgroundColor: statusColors.installed },
});
