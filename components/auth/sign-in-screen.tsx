import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { KeyboardAvoidingView, Platform, ScrollView, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import type { z } from 'zod';
import { signInInput, type SignInInput } from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { applyServerErrors } from '@/components/forms/server-errors';
import { signInMessage } from '@/components/navigation/pending-link';
import { Button } from '@/components/ui/button';
import { Rule, Sheet } from '@/components/ui/sheet';
import { Notice } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { useAuthSignInMutation } from '@/hooks/queries/auth';
import { useSession } from '@/hooks/use-session';

export function SignInScreen() {
  const insets = useSafeAreaInsets();
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
    try {
      await signIn.mutateAsync(values);
      // The root guard swaps the sign-in screen for the app once the session is stored; the app's first
      // screen then opens the pending page, if one waits.
    } catch (e) {
      setFormError(applyServerErrors(setError, e));
    }
  });

  return (
    <KeyboardAvoidingView behavior={Platform.OS === 'ios' ? 'padding' : undefined} style={styles.page}>
      <ScrollView contentContainerStyle={[styles.scroll, { paddingTop: insets.top + space.xxl }]} keyboardShouldPersistTaps="handled">
        <View style={styles.titleBlock}>
          <Txt variant="display">Pitchcard</Txt>
          <Txt tone="soft">Travelers and rivet inspection for riveted aluminum airframes.</Txt>
        </View>
        <Sheet style={styles.sheet}>
          <Txt variant="heading" accessibilityRole="header">Sign in</Txt>
          <Rule />
          {session.endedBecause ? <Notice tone="caution">{session.endedBecause}</Notice> : null}
          {waiting ? <Notice testID="pending-link">{waiting}</Notice> : null}
          <FormTextField
            control={control}
            name="email"
            label="E-mail"
            testID="email"
            autoCapitalize="none"
            autoComplete="email"
            keyboardType="email-address"
            inputMode="email"
            textContentType="username"
            autoCorrect={false}
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
          {formError ? <Notice tone="error" testID="sign-in-error">{formError}</Notice> : null}
          <Button
            label="Sign in"
            busyLabel="Signing in"
            busy={formState.isSubmitting}
            onPress={() => void submit()}
            testID="sign-in"
          />
        </Sheet>
        <View style={styles.foot}>
          <Mono variant="small" tone="faint">in · lb / mm · N</Mono>
          <Txt variant="small" tone="faint">An aid for the shop floor. The supplier’s approved data and your authority govern.</Txt>
        </View>
      </ScrollView>
    </KeyboardAvoidingView>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, backgroundColor: colors.paper },
  scroll: { padding: space.lg, gap: space.xl, alignItems: 'stretch', width: '100%', maxWidth: 480, alignSelf: 'center' },
  titleBlock: { gap: space.xs, borderBottomWidth: 2, borderBottomColor: colors.ink, paddingBottom: space.md },
  sheet: { gap: space.lg },
  foot: { gap: space.xs, borderTopWidth: hairline, borderTopColor: colors.rule, paddingTop: space.md },
});
