import { useState } from 'react';
import type { Control, FieldValues, Path } from 'react-hook-form';
import { FormTextField } from '@/components/forms/form-fields';
import { Button } from '@/components/ui/button';

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
    <FormTextField
      control={control}
      name={name}
      label={label}
      hint={hint}
      testID={testID}
      secureTextEntry={!shown}
      autoCapitalize="none"
      autoCorrect={false}
      autoComplete={autoComplete}
      textContentType={autoComplete === 'new-password' ? 'newPassword' : 'password'}
      returnKeyType={onSubmit ? 'go' : undefined}
      onSubmitEditing={onSubmit}
      maxLength={200}
      style={{ flex: 1 }}
      beside={
        <Button
          label={shown ? 'Hide' : 'Show'}
          accessibilityLabel={shown ? `Hide ${label.toLowerCase()}` : `Show ${label.toLowerCase()}`}
          variant="secondary"
          compact
          onPress={() => setShown((s) => !s)}
          testID={`${testID}-show`}
        />
      }
    />
  );
}

/** Said under every new-password box: the server judges strength, these words help pass it first time. */
export const newPasswordHint =
  'At least 10 characters. Four or five unrelated words, with a number, make one that is strong and easy to remember.';
