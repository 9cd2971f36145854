import { Pressable, StyleSheet, View } from 'react-native';
import { colors, radius, space, touch } from '@/constants/theme';
import { Txt } from './text';

/** `key` names the chip's testID when the value is not readable (an id): `${testIDPrefix}-${key}`. */
export type ChoiceOption<T extends string> = { value: T; label: string; hint?: string; key?: string };

/**
 * A row of large chips where one (or, with `multiple`, several) can be chosen. Each chip's testID is
 * `${testIDPrefix}-${value}`.
 */
export function Choice<T extends string>({ options, value, onChange, testIDPrefix, invalid, columns }: {
  options: readonly ChoiceOption<T>[];
  value: T | null | undefined;
  onChange: (v: T) => void;
  testIDPrefix: string;
  invalid?: boolean;
  columns?: boolean;
}) {
  return (
    <View style={[styles.row, columns && { flexDirection: 'column' }]} accessibilityRole="radiogroup">
      {options.map((o) => {
        const on = o.value === value;
        return (
          <Pressable
            key={o.value}
            testID={`${testIDPrefix}-${o.key ?? o.value}`}
            accessibilityRole="radio"
            aria-checked={on}
            accessibilityLabel={o.label}
            onPress={() => onChange(o.value)}
            style={({ pressed }) => [
              styles.chip,
              on && styles.on,
              invalid && !on && { borderColor: colors.error },
              pressed && { opacity: 0.75 },
            ]}
          >
            <Txt bold={on} tone={on ? 'inverse' : 'ink'}>{o.label}</Txt>
            {o.hint ? <Txt variant="small" tone={on ? 'inverse' : 'faint'}>{o.hint}</Txt> : null}
          </Pressable>
        );
      })}
    </View>
  );
}

/** Several chips on/off. */
export function MultiChoice<T extends string>({ options, values, onToggle, testIDPrefix }: {
  options: readonly ChoiceOption<T>[]; values: readonly T[]; onToggle: (v: T) => void; testIDPrefix: string;
}) {
  return (
    <View style={styles.row}>
      {options.map((o) => {
        const on = values.includes(o.value);
        return (
          <Pressable
            key={o.value}
            testID={`${testIDPrefix}-${o.key ?? o.value}`}
            accessibilityRole="checkbox"
            aria-checked={on}
            accessibilityLabel={o.label}
            onPress={() => onToggle(o.value)}
            style={({ pressed }) => [styles.chip, on && styles.on, pressed && { opacity: 0.75 }]}
          >
            <Txt bold={on} tone={on ? 'inverse' : 'ink'}>{o.label}</Txt>
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  chip: {
    minHeight: touch,
    paddingHorizontal: space.lg,
    paddingVertical: space.sm,
    borderWidth: 1.5,
    borderColor: colors.ruleStrong,
    borderRadius: radius.md,
    backgroundColor: colors.paperRaised,
    justifyContent: 'center',
  },
  on: { backgroundColor: colors.ink, borderColor: colors.ink },
});
