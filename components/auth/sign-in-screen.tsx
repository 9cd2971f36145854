import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { signInInput, type SignInInput } from '@/db/contracts';
import { emailInputProps, FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { applyServerErrors } from '@/components/forms/server-errors';
import { signInMessage } from '@/components/navigation/pending-link';
import { Button } from '@/components/ui/button';
import { cancelHeadingFocus, focusNextHeading } from '@/components/ui/focus';
import { Notice } from '@/components/ui/states';
import { useAuthSignInMutation } from '@/hooks/queries/auth';
import { useSession } from '@/hooks/use-session';
import { AuthPage } from './auth-page';

export function SignInScreen() {
  const router = useRouter();
  const session = useSession();
  const signIn = useAuthSignInMutation();
  const [formError, setFormError] = useState<string | null>(null);
  const waiting = signInMessage(session.pendingHref);
  const { control, handleSubmit, setError, formState } = useForm<SignInInput, unknown, z.output<typeof signInInput>>({
    resolver: zodResolver(signInInput, plainParse),
    mode: 'onChange',
    defaultValues: { email: '', password: '' },
  });

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    // Asked before the request: the home screen may open before the answer is read here.
    focusNextHeading();
    try {
      await signIn.mutateAsync(values);
      // The root guard swaps the sign-in screen for the app once the session is stored; the app's first
      // screen then opens the pending page, if one waits.
    } catch (e) {
      cancelHeadingFocus();
      setFormError(applyServerErrors(setError, e));
    }
  });

  return (
    <AuthPage heading="Sign in">
      {session.endedBecause ? <Notice tone="caution">{session.endedBecause}</Notice> : null}
      {waiting ? <Notice testID="pending-link">{waiting}</Notice> : null}
      <FormTextField
        control={control}
        name="email"
        label="E-mail"
        testID="email"
        {...emailInputProps}
        returnKeyType="next"
      />
      <FormTextField
        control={control}
        name="password"
        label="Password"
        testID="password"
        secureTextEntry
        autoComplete="current-password"
        textContentType="password"
        returnKeyType="go"
        onSubmitEditing={() => void submit()}
      />
      {/* Focused when it shows: a keyboard or screen-reader user hears why, and is back in the form. */}
      {formError ? (
        <Notice tone="error" testID="sign-in-error" focusOnShow>
          {formError}
        </Notice>
      ) : null}
      <Button
        label="Sign in"
        busyLabel="Signing in"
        busy={formState.isSubmitting}
        onPress={() => void submit()}
        testID="sign-in"
      />
      <Button
        label="Forgot your password?"
        variant="quiet"
        onPress={() => router.push('/forgot')}
        testID="forgot-password"
      />
    </AuthPage>
  );
}
