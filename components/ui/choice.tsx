import { StyleSheet, View } from 'react-native';
import { colors, radius, space, touch } from '@/constants/theme';
import { Txt } from './text';
import { Toggle } from './toggle';

/** `key` names the chip's testID when the value is not readable (an id): `${testIDPrefix}-${key}`. */
export type ChoiceOption<T extends string> = { value: T; label: string; hint?: string; key?: string };

/**
 * A row of large chips of which one can be chosen: a radio group, by tap, Enter or Space. Each chip's
 * testID is `${testIDPrefix}-${value}` (or its `key`). `label` names the group for a screen reader
 * (a Field's label above it, or what the chips choose: "Zoom").
 */
export function Choice<T extends string>({
  options,
  value,
  onChange,
  testIDPrefix,
  invalid,
  columns,
  label,
}: {
  options: readonly ChoiceOption<T>[];
  value: T | null | undefined;
  onChange: (v: T) => void;
  testIDPrefix: string;
  invalid?: boolean;
  columns?: boolean;
  label?: string;
}) {
  return (
    <View
      style={[styles.row, columns && { flexDirection: 'column' }]}
      accessibilityRole="radiogroup"
      accessibilityLabel={label}
      aria-invalid={invalid || undefined}
    >
      {options.map((o) => {
        const on = o.value === value;
        return (
          <Toggle
            key={o.value}
            kind="radio"
            checked={on}
            testID={`${testIDPrefix}-${o.key ?? o.value}`}
            // The hint is part of what the option means ("Rework: back to the drawing…").
            accessibilityLabel={o.hint ? `${o.label}: ${o.hint}` : o.label}
            onPress={() => onChange(o.value)}
            style={({ pressed }) => [
              styles.chip,
              on && styles.on,
              invalid && !on && { borderColor: colors.error },
              pressed && { opacity: 0.75 },
            ]}
          >
            <Txt bold={on} tone={on ? 'inverse' : 'ink'}>
              {o.label}
            </Txt>
            {o.hint ? (
              <Txt variant="small" tone={on ? 'inverse' : 'faint'}>
                {o.hint}
              </Txt>
            ) : null}
          </Toggle>
        );
      })}
    </View>
  );
}

/** Several chips on/off: each a checkbox, by tap, Enter or Space. */
export function MultiChoice<T extends string>({
  options,
  values,
  onToggle,
  testIDPrefix,
  label,
}: {
  options: readonly ChoiceOption<T>[];
  values: readonly T[];
  onToggle: (v: T) => void;
  testIDPrefix: string;
  label?: string;
}) {
  return (
    <View style={styles.row} accessibilityRole={label ? ('group' as never) : undefined} accessibilityLabel={label}>
      {options.map((o) => {
        const on = values.includes(o.value);
        return (
          <Toggle
            key={o.value}
            kind="checkbox"
            checked={on}
            testID={`${testIDPrefix}-${o.key ?? o.value}`}
            accessibilityLabel={o.hint ? `${o.label}: ${o.hint}` : o.label}
            onPress={() => onToggle(o.value)}
            style={({ pressed }) => [styles.chip, on && styles.on, pressed && { opacity: 0.75 }]}
          >
            <Txt bold={on} tone={on ? 'inverse' : 'ink'}>
              {o.label}
            </Txt>
          </Toggle>
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
