import { useState } from 'react';
import { Controller, type Control, type FieldValues, type Path } from 'react-hook-form';
import { View } from 'react-native';
import { space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Field, TextBox } from '@/components/ui/field';

/**
 * A password field with a "Show" switch instead of a second box to type it again: with gloves on a
 * phone, seeing what you typed catches more slips than typing it twice. The server's advice on a weak
 * password lands under the box like any other error.
 */
export function PasswordField<T extends FieldValues>({
  control,
  name,
  label,
  hint,
  testID,
  autoComplete = 'new-password',
  onSubmit,
}: {
  control: Control<T>;
  name: Path<T>;
  label: string;
  hint?: string;
  testID: string;
  autoComplete?: 'new-password' | 'current-password';
  onSubmit?: () => void;
}) {
  const [shown, setShown] = useState(false);
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) => (
        <Field label={label} hint={hint} error={fieldState.error?.message} testID={`${testID}-field`}>
          <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center' }}>
            <TextBox
              testID={testID}
              accessibilityLabel={label}
              value={field.value == null ? '' : String(field.value)}
              onChangeText={field.onChange}
              onBlur={field.onBlur}
              invalid={!!fieldState.error}
              ref={field.ref}
              secureTextEntry={!shown}
              autoCapitalize="none"
              autoCorrect={false}
              autoComplete={autoComplete}
              textContentType={autoComplete === 'new-password' ? 'newPassword' : 'password'}
              returnKeyType={onSubmit ? 'go' : undefined}
              onSubmitEditing={onSubmit}
              maxLength={200}
              style={{ flex: 1 }}
            />
            <Button
              label={shown ? 'Hide' : 'Show'}
              accessibilityLabel={shown ? `Hide ${label.toLowerCase()}` : `Show ${label.toLowerCase()}`}
              variant="secondary"
              compact
              onPress={() => setShown((s) => !s)}
              testID={`${testID}-show`}
            />
          </View>
        </Field>
      )}
    />
  );
}

/** Said under every new-password box: the server judges strength, these words help pass it first time. */
export const newPasswordHint =
  'At least 10 characters. Four or five unrelated words, with a number, make one that is strong and easy to remember.';
