import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { changePasswordInput } from '@/db/contracts';
import { FormError } from '@/components/forms/form-error';
import { leftAfterFields } from '@/components/auth/field-errors';
import { newPasswordHint, PasswordField } from '@/components/auth/password-field';
import { plainParse } from '@/components/forms/plain-errors';
import { Button } from '@/components/ui/button';
import { Section } from '@/components/ui/sheet';
import { Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { useAuthChangePasswordMutation } from '@/hooks/queries/auth';

type Values = z.input<typeof changePasswordInput>;

/**
 * A new password, proven by the current one. Every other sign-in of the person ends; this device takes
 * the fresh token the answer carries and stays signed in.
 */
export function ChangePasswordForm() {
  const change = useAuthChangePasswordMutation();
  const [formError, setFormError] = useState<string | null>(null);
  const [changed, setChanged] = useState(false);
  const { control, handleSubmit, setError, formState, reset } = useForm<
    Values,
    unknown,
    z.output<typeof changePasswordInput>
  >({
    resolver: zodResolver(changePasswordInput, plainParse),
    mode: 'onChange',
    defaultValues: { currentPassword: '', newPassword: '' },
  });

  const submit = handleSubmit(async (v) => {
    setFormError(null);
    setChanged(false);
    try {
      await change.mutateAsync(v);
      reset({ currentPassword: '', newPassword: '' });
      setChanged(true);
    } catch (e) {
      setFormError(leftAfterFields(setError, e, ['currentPassword', 'newPassword']));
    }
  });

  return (
    <Section title="Change your password" testID="change-password-section">
      <Txt variant="small" tone="soft">
        Every other device where you are signed in is signed out. This one stays signed in.
      </Txt>
      <PasswordField
        control={control}
        name="currentPassword"
        label="Current password"
        autoComplete="current-password"
        testID="current-password"
      />
      <PasswordField
        control={control}
        name="newPassword"
        label="New password"
        hint={newPasswordHint}
        testID="new-password"
        onSubmit={() => void submit()}
      />
      <FormError message={formError} testID="password-error" />
      {changed ? (
        <Notice tone="ok" testID="password-changed">
          Password changed. Other devices were signed out; use the new password there.
        </Notice>
      ) : null}
      <Button
        label="Change password"
        busyLabel="Changing"
        busy={formState.isSubmitting}
        onPress={() => void submit()}
        testID="change-password"
      />
    </Section>
  );
}
