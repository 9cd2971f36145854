import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { resetPasswordInput, RESET_TTL_MINUTES } from '@/db/contracts';
import { FormError } from '@/components/forms/form-error';
import { plainParse } from '@/components/forms/plain-errors';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { ApiError } from '@/lib/api-client';
import { useAuthResetMutation } from '@/hooks/queries/auth';
import { AuthPage } from './auth-page';
import { leftAfterFields } from './field-errors';
import { newPasswordHint, PasswordField } from './password-field';
import { SignedInElsewhere, useSignedIn } from './signed-in-elsewhere';
import { useLandSignedIn } from './use-land-signed-in';

type Values = z.input<typeof resetPasswordInput>;

/** The page a password-reset mail links to: choose a new password, and be signed in with it. */
export function ResetScreen({ token }: { token: string }) {
  const router = useRouter();
  const reset = useAuthResetMutation();
  const signedIn = useSignedIn();
  const land = useLandSignedIn();
  // A link cut short by a mail program is known to be useless before anything is sent.
  const [gone, setGone] = useState<string | null>(() =>
    resetPasswordInput.shape.token.safeParse(token).success ? null : 'This link is incomplete or damaged.',
  );
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, formState } = useForm<Values, unknown, z.output<typeof resetPasswordInput>>({
    resolver: zodResolver(resetPasswordInput, plainParse),
    mode: 'onChange',
    defaultValues: { token, password: '' },
  });

  const submit = handleSubmit(async (v) => {
    setFormError(null);
    try {
      await reset.mutateAsync(v);
      land();
    } catch (e) {
      // The token is no field of the form: a refused one means the link itself is spent.
      if (e instanceof ApiError && e.fields?.token) {
        setGone('This link has expired or was already used.');
        return;
      }
      setFormError(leftAfterFields(setError, e, ['password']));
    }
  });

  if (gone) {
    return (
      <AuthPage heading="This link no longer works" testID="reset-screen">
        <Notice tone="caution" testID="reset-gone">
          {gone}
        </Notice>
        <Txt>
          A link to set a new password works once, for {RESET_TTL_MINUTES} minutes. Ask for a fresh one: it comes by
          mail at once.
        </Txt>
        <Button label="Send me a new link" onPress={() => router.replace('/forgot')} testID="reset-ask-again" />
        <Button
          label="Back to sign in"
          variant="quiet"
          onPress={() => router.replace('/sign-in')}
          testID="back-to-sign-in"
        />
      </AuthPage>
    );
  }

  return (
    <AuthPage heading="Choose a new password" testID="reset-screen">
      <Txt>
        Your old password stops working, and every device where you are signed in is signed out. This one signs in with
        the new password.
      </Txt>
      {signedIn && reset.isIdle ? (
        <SignedInElsewhere what="set the new password" />
      ) : (
        <>
          <PasswordField
            control={control}
            name="password"
            label="New password"
            hint={newPasswordHint}
            testID="reset-password"
            onSubmit={() => void submit()}
          />
          <FormError message={formError} testID="reset-error" />
          <Button
            label={reset.isSuccess ? 'Password set: opening Pitchcard' : 'Set the password and sign in'}
            busyLabel="Setting the password"
            busy={formState.isSubmitting || reset.isSuccess}
            onPress={() => void submit()}
            testID="reset-submit"
          />
        </>
      )}
    </AuthPage>
  );
}
