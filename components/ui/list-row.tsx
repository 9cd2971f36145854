import type { ReactNode } from 'react';
import { Pressable, StyleSheet, View, type StyleProp, type ViewStyle } from 'react-native';
import { colors, hairline, space, statusColors, touch } from '@/constants/theme';
import { Txt } from './text';

/**
 * One row of a list that opens something: a button named by `label` (everything the row shows in words,
 * since a button's name is all that is read of it), tinted while pressed, with a chevron at its end
 * when `chevron` is set.
 */
export function ListRow({
  testID,
  label,
  onPress,
  style,
  chevron,
  children,
}: {
  testID: string;
  label: string;
  onPress: () => void;
  style?: StyleProp<ViewStyle>;
  chevron?: boolean;
  children: ReactNode;
}) {
  return (
    <Pressable
      testID={testID}
      accessibilityRole="button"
      accessibilityLabel={label}
      onPress={onPress}
      style={({ pressed }) => [styles.row, style, pressed && { backgroundColor: colors.accentSoft }]}
    >
      {children}
      {chevron ? (
        <Txt tone="accent" bold aria-hidden>
          ›
        </Txt>
      ) : null}
    </Pressable>
  );
}

/** A row's thin bar of holes done, and after them (`awaiting`) those waiting for the inspector. */
export function RowBar({ done, total, awaiting = 0 }: { done: number; total: number; awaiting?: number }) {
  const frac = total ? done / total : 0;
  const waitFrac = total ? Math.min(1 - frac, awaiting / total) : 0;
  return (
    <View style={styles.bar}>
      <View style={[styles.fill, { width: `${frac * 100}%` }]} />
      {waitFrac > 0 ? <View style={[styles.wait, { left: `${frac * 100}%`, width: `${waitFrac * 100}%` }]} /> : null}
    </View>
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
    overflow: 'hidden',
    backgroundColor: colors.paperSunk,
    borderWidth: hairline,
    borderColor: colors.ruleStrong,
    marginTop: space.xs,
  },
  fill: { height: '100%', backgroundColor: statusColors.installed },
  wait: { position: 'absolute', top: 0, bottom: 0, backgroundColor: statusColors.reworked, opacity: 0.45 },
});
