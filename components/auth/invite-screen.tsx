import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import { acceptInvitationInput, roleLabels, type InvitationView } from '@/db/contracts';
import { space } from '@/constants/theme';
import { FormError } from '@/components/forms/form-error';
import { FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { shortDate } from '@/components/findings/finding-row';
import { wrapAnywhere } from '@/components/people/long-words';
import { Button } from '@/components/ui/button';
import { KeyValue } from '@/components/ui/sheet';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { ApiError } from '@/lib/api-client';
import { useInvitationAcceptMutation, useInvitationQuery } from '@/hooks/queries/people';
import { AuthPage } from './auth-page';
import { asSentence, leftAfterFields } from './field-errors';
import { newPasswordHint, PasswordField } from './password-field';
import { SignedInElsewhere, useSignedIn } from './signed-in-elsewhere';
import { useLandSignedIn } from './use-land-signed-in';

/** The page an invitation mail links to: who asks, as what, and the person's own name and password. */
export function InviteScreen({ token }: { token: string }) {
  const router = useRouter();
  const valid = acceptInvitationInput.shape.token.safeParse(token).success;
  const q = useInvitationQuery(valid ? token : '');

  const gone = (message: string) => (
    <AuthPage heading="This invitation no longer works" testID="invite-screen">
      <Notice tone="caution" testID="invite-gone">
        {asSentence(message)}
      </Notice>
      <Txt>
        An invitation works once and for a week. Ask whoever invited you to send a new one. If you already joined, sign
        in.
      </Txt>
      <Button
        label="Go to sign in"
        variant="secondary"
        onPress={() => router.replace('/sign-in')}
        testID="back-to-sign-in"
      />
    </AuthPage>
  );

  if (!valid) return gone('This link is incomplete or damaged: open it again from the mail.');
  if (q.isPending)
    return (
      <AuthPage heading="Your invitation" testID="invite-screen">
        <LoadingState what="Reading the invitation" />
      </AuthPage>
    );
  if (q.isError) {
    if (q.error instanceof ApiError && q.error.status === 404) return gone(q.error.message);
    return (
      <AuthPage heading="Your invitation" testID="invite-screen">
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      </AuthPage>
    );
  }
  return <JoinForm token={token} invitation={q.data} onGone={gone} />;
}

type Values = z.input<typeof acceptInvitationInput>;

function JoinForm({
  token,
  invitation: i,
  onGone,
}: {
  token: string;
  invitation: InvitationView;
  onGone: (message: string) => React.ReactElement;
}) {
  const signedIn = useSignedIn();
  const accept = useInvitationAcceptMutation();
  const land = useLandSignedIn();
  const [formError, setFormError] = useState<string | null>(null);
  const [goneMessage, setGoneMessage] = useState<string | null>(null);
  const { control, handleSubmit, setError, formState } = useForm<
    Values,
    unknown,
    z.output<typeof acceptInvitationInput>
  >({
    resolver: zodResolver(acceptInvitationInput, plainParse),
    mode: 'onChange',
    defaultValues: { token, name: i.name, password: '' },
  });

  const submit = handleSubmit(async (v) => {
    setFormError(null);
    try {
      await accept.mutateAsync(v);
      land();
    } catch (e) {
      // Used meanwhile (another tab, a double press that got through) or expired while the page was open.
      if (e instanceof ApiError && e.status === 404) {
        setGoneMessage(e.message);
        return;
      }
      setFormError(leftAfterFields(setError, e, ['name', 'password']));
    }
  });

  if (goneMessage) return onGone(goneMessage);

  return (
    <AuthPage heading="Join Pitchcard" testID="invite-screen">
      <Txt testID="invite-what">
        <Txt bold>{i.invitedByName}</Txt> invites you as <Txt bold>{roleLabels[i.role].toLowerCase()}</Txt>
        {i.organizationName ? (
          <>
            {' '}
            of <Txt bold>{i.organizationName}</Txt>
          </>
        ) : null}
        .
      </Txt>
      <View style={{ gap: space.xs }}>
        <KeyValue label="You sign in with" testID="invite-email">
          <Mono style={wrapAnywhere}>{i.email}</Mono>
        </KeyValue>
        <KeyValue label="Invitation runs until">{shortDate(i.expiresAt)}</KeyValue>
      </View>
      {/* Once joined, the session is the new person's own: no need to ask them to sign out. */}
      {signedIn && accept.isIdle ? (
        <SignedInElsewhere what="join as yourself" />
      ) : (
        <>
          <FormTextField
            control={control}
            name="name"
            label="Your name"
            hint="As the people you work with know you: it shows on sign-offs and in the build log."
            testID="invite-name"
            autoComplete="name"
            textContentType="name"
            maxLength={120}
          />
          <PasswordField
            control={control}
            name="password"
            label="Choose a password"
            hint={newPasswordHint}
            testID="invite-password"
            onSubmit={() => void submit()}
          />
          <FormError message={formError} testID="invite-error" />
          <Button
            label={accept.isSuccess ? 'Joined: opening Pitchcard' : 'Join and sign in'}
            busyLabel="Joining"
            busy={formState.isSubmitting || accept.isSuccess}
            onPress={() => void submit()}
            testID="invite-accept"
          />
        </>
      )}
    </AuthPage>
  );
}
