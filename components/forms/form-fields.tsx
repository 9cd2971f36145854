import { useState } from 'react';
import { Controller, type Control, type ControllerRenderProps, type FieldValues, type Path } from 'react-hook-form';
import { View } from 'react-native';
import { EMAIL_MAX } from '@/db/contracts';
import { space } from '@/constants/theme';
import { editableNumber, fromDisplay, parseNumber, type Quantity } from '@/constants/units';
import { useUnits } from '@/hooks/use-units';
import { Choice, type ChoiceOption } from '@/components/ui/choice';
import { Field, TextBox, type TextBoxProps } from '@/components/ui/field';

type Base<T extends FieldValues> = {
  control: Control<T>;
  name: Path<T>;
  label: string;
  hint?: string;
  testID: string;
};

/** How someone else's e-mail address is typed (an invitation, a build's people): no capitals, no corrections, the address keyboard. */
export const addressInputProps = {
  autoCapitalize: 'none',
  keyboardType: 'email-address',
  inputMode: 'email',
  autoCorrect: false,
  maxLength: EMAIL_MAX,
} as const;

/** One's own address at sign-in: typed the same way, and filled in by the device as the account's name. */
export const emailInputProps = { ...addressInputProps, autoComplete: 'email', textContentType: 'username' } as const;

/** A field bound to react-hook-form under its label, with its error right under it; `children` draws the input. */
function BoundField<T extends FieldValues>({
  control,
  name,
  label,
  hint,
  testID,
  children,
}: Base<T> & { children: (field: ControllerRenderProps<T, Path<T>>, invalid: boolean) => React.ReactNode }) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) => (
        <Field label={label} hint={hint} error={fieldState.error?.message} testID={`${testID}-field`}>
          {children(field, !!fieldState.error)}
        </Field>
      )}
    />
  );
}

/**
 * A text field bound to react-hook-form, with its error right under it. `beside` stands to the right of
 * the box (a password's "Show").
 */
export function FormTextField<T extends FieldValues>({
  control,
  name,
  label,
  hint,
  testID,
  beside,
  ...input
}: Base<T> & Omit<TextBoxProps, 'value' | 'onChangeText' | 'testID'> & { beside?: React.ReactNode }) {
  return (
    <BoundField control={control} name={name} label={label} hint={hint} testID={testID}>
      {(field, invalid) => {
        const box = (
          <TextBox
            {...input}
            testID={testID}
            accessibilityLabel={label}
            value={field.value == null ? '' : String(field.value)}
            onChangeText={field.onChange}
            onBlur={field.onBlur}
            invalid={invalid}
            ref={field.ref}
          />
        );
        return beside ? (
          <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center' }}>
            {box}
            {beside}
          </View>
        ) : (
          box
        );
      }}
    </BoundField>
  );
}

/**
 * A number field. The form holds the stored value (inches, pounds); with `quantity` the person types
 * in the unit they chose and the field converts. What they typed stays as typed while they type.
 */
export function FormNumberField<T extends FieldValues>({
  control,
  name,
  label,
  hint,
  testID,
  quantity,
  unit,
}: Base<T> & { quantity?: Quantity; unit?: string }) {
  const units = useUnits();
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) => (
        <NumberBox
          label={label}
          hint={hint}
          testID={testID}
          unit={quantity ? units.label(quantity) : unit}
          error={fieldState.error?.message}
          value={field.value as number | undefined}
          toText={(v) =>
            quantity ? editableNumber(quantity, v, units.system) : editableNumber('length', v, 'imperial')
          }
          fromText={(t) => {
            const n = parseNumber(t);
            if (n === undefined || Number.isNaN(n) || !quantity) return n;
            return fromDisplay(quantity, n, units.system);
          }}
          onChange={field.onChange}
          onBlur={field.onBlur}
          system={units.system}
        />
      )}
    />
  );
}

function NumberBox({
  label,
  hint,
  testID,
  unit,
  error,
  value,
  toText,
  fromText,
  onChange,
  onBlur,
  system,
}: {
  label: string;
  hint?: string;
  testID: string;
  unit?: string;
  error?: string;
  value: number | undefined;
  toText: (v: number | undefined) => string;
  fromText: (t: string) => number | undefined;
  onChange: (v: number | undefined) => void;
  onBlur: () => void;
  system: string;
}) {
  const [text, setText] = useState(() => toText(value));
  // Follow outside changes (a reset, a units switch), but not the echo of our own typing: compared with
  // the value and system of the last render while rendering, rather than set again from an effect.
  const [seen, setSeen] = useState({ value, system });
  if (!Object.is(seen.value, value) || seen.system !== system) {
    setSeen({ value, system });
    const mine = fromText(text);
    const same =
      (mine === undefined && value === undefined) ||
      (typeof mine === 'number' && typeof value === 'number' && Math.abs(mine - value) < 1e-9) ||
      (Number.isNaN(mine) && Number.isNaN(value));
    if (seen.system !== system || !same) setText(toText(value));
  }
  return (
    <Field label={label} hint={hint} error={error} unit={unit} testID={`${testID}-field`}>
      <TextBox
        mono
        testID={testID}
        accessibilityLabel={unit ? `${label} (${unit})` : label}
        value={text}
        inputMode="decimal"
        keyboardType="decimal-pad"
        onChangeText={(t) => {
          setText(t);
          onChange(fromText(t));
        }}
        onBlur={onBlur}
        invalid={!!error}
      />
    </Field>
  );
}

export function FormChoiceField<T extends FieldValues, V extends string>({
  control,
  name,
  label,
  hint,
  testID,
  options,
}: Base<T> & { options: readonly ChoiceOption<V>[] }) {
  return (
    <BoundField control={control} name={name} label={label} hint={hint} testID={testID}>
      {(field, invalid) => (
        <Choice
          options={options}
          value={field.value as V | undefined}
          onChange={(v) => {
            field.onChange(v);
            field.onBlur();
          }}
          testIDPrefix={testID}
          invalid={invalid}
          label={label}
        />
      )}
    </BoundField>
  );
}
