import { forwardRef } from 'react';
import { StyleSheet, TextInput, View, type TextInputProps } from 'react-native';
import { colors, fonts, radius, space, touch, type as typeScale } from '@/constants/theme';
import { installFocusRing } from './focus-ring';
import { Txt } from './text';

installFocusRing();

type FieldProps = {
  label: string;
  hint?: string;
  error?: string;
  /** Shown at the right of the label, e.g. the unit. */
  unit?: string;
  children: React.ReactNode;
  testID?: string;
};

/** Label above, the control, then the plain-words error right under it. */
export function Field({ label, hint, error, unit, children, testID }: FieldProps) {
  return (
    <View style={styles.field} testID={testID}>
      <View style={styles.labelRow}>
        <Txt variant="small" bold style={{ flex: 1 }}>
          {label}
        </Txt>
        {unit ? (
          <Txt variant="small" tone="faint">
            {unit}
          </Txt>
        ) : null}
      </View>
      {children}
      {error ? (
        <Txt
          variant="small"
          tone="error"
          accessibilityRole="alert"
          accessibilityLiveRegion="polite"
          testID={testID ? `${testID}-error` : undefined}
        >
          {error}
        </Txt>
      ) : hint ? (
        <Txt variant="small" tone="faint">
          {hint}
        </Txt>
      ) : null}
    </View>
  );
}

export type TextBoxProps = TextInputProps & { invalid?: boolean; mono?: boolean };

export const TextBox = forwardRef<TextInput, TextBoxProps>(function TextBox(
  { invalid, mono, style, multiline, ...rest },
  ref,
) {
  return (
    <TextInput
      ref={ref}
      placeholderTextColor={colors.inkFaint}
      multiline={multiline}
      aria-invalid={invalid || undefined}
      {...rest}
      style={[
        styles.box,
        { fontFamily: mono ? fonts.mono : fonts.text },
        multiline && { minHeight: 96, textAlignVertical: 'top', paddingTop: space.md },
        invalid && { borderColor: colors.error, borderWidth: 2 },
        style,
      ]}
    />
  );
});

const styles = StyleSheet.create({
  field: { gap: space.xs },
  labelRow: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm },
  box: {
    ...typeScale.body,
    minHeight: touch,
    borderWidth: 1,
    borderColor: colors.ruleStrong,
    borderRadius: radius.sm,
    backgroundColor: colors.paperRaised,
    color: colors.ink,
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
  },
});

/** The "Find" box of a list: narrows what is shown as the person types. */
export function FindField({
  value,
  onChange,
  placeholder,
  where,
  testID,
}: {
  value: string;
  onChange: (text: string) => void;
  placeholder: string;
  where: string;
  testID: string;
}) {
  return (
    <Field label="Find">
      <TextBox
        value={value}
        onChangeText={onChange}
        placeholder={placeholder}
        testID={testID}
        accessibilityLabel={`Find in ${where}`}
        autoCorrect={false}
      />
    </Field>
  );
}
