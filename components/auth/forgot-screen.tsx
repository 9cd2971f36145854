import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { forgotPasswordInput } from '@/db/contracts';
import { FormError } from '@/components/forms/form-error';
import { emailInputProps, FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { useAuthForgotMutation } from '@/hooks/queries/auth';
import { AuthPage } from './auth-page';

type Values = z.input<typeof forgotPasswordInput>;

/**
 * Asks for a link to set a new password. The answer is the same whether or not the address has an
 * account, so the page never tells who has one; it says so, and what to do if no mail comes.
 */
export function ForgotScreen() {
  const router = useRouter();
  const forgot = useAuthForgotMutation();
  const [sent, setSent] = useState<{ to: string; message: string } | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, formState, reset } = useForm<
    Values,
    unknown,
    z.output<typeof forgotPasswordInput>
  >({
    resolver: zodResolver(forgotPasswordInput, plainParse),
    mode: 'onChange',
    defaultValues: { email: '' },
  });

  const submit = handleSubmit(async (v) => {
    setFormError(null);
    try {
      const r = await forgot.mutateAsync(v);
      setSent({ to: v.email, message: r.message });
      reset({ email: '' });
    } catch (e) {
      setFormError(applyServerErrors(setError, e));
    }
  });

  const backToSignIn = (
    <Button
      label="Back to sign in"
      variant="quiet"
      onPress={() => (router.canGoBack() ? router.back() : router.replace('/sign-in'))}
      testID="back-to-sign-in"
    />
  );

  if (sent) {
    return (
      <AuthPage heading="Check your mail" testID="forgot-screen">
        <Notice tone="ok" testID="forgot-sent">
          {sent.message}
        </Notice>
        <Txt>
          We wrote to <Txt bold>{sent.to}</Txt> if it has an account. Open the link in the mail on this device or any
          other.
        </Txt>
        <Txt variant="small" tone="soft">
          No mail after a few minutes? Look in the junk folder, check the address, or ask your shop’s administrator:
          they can see whether you have an account.
        </Txt>
        <Button label="Use another address" variant="secondary" onPress={() => setSent(null)} testID="forgot-again" />
        {backToSignIn}
      </AuthPage>
    );
  }

  return (
    <AuthPage heading="Set a new password" testID="forgot-screen">
      <Txt>
        Give the address you sign in with. We send it a link that lets you choose a new password; it works once, for one
        hour.
      </Txt>
      <FormTextField
        control={control}
        name="email"
        label="E-mail"
        testID="forgot-email"
        {...emailInputProps}
        returnKeyType="send"
        onSubmitEditing={() => void submit()}
      />
      <FormError message={formError} testID="forgot-error" />
      <Button
        label="Send me the link"
        busyLabel="Sending"
        busy={formState.isSubmitting}
        onPress={() => void submit()}
        testID="forgot-send"
      />
      {backToSignIn}
    </AuthPage>
  );
}
