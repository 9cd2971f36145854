import { useRouter } from 'expo-router';
import { View } from 'react-native';
import { roleLabels } from '@/db/contracts';
import { shortDate } from '@/components/findings/finding-row';
import { wrapAnywhere } from '@/components/people/long-words';
import { Button } from '@/components/ui/button';
import { Screen } from '@/components/ui/screen';
import { KeyValue, Section } from '@/components/ui/sheet';
import { EmptyState } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { TwoPane } from '@/components/ui/two-pane';
import { useSession } from '@/hooks/use-session';
import { ChangePasswordForm } from './change-password-form';
import { SignOutEverywhere } from './sign-out-everywhere';

/** The signed-in person's own page: who they are here, their password, and ending every sign-in. */
export function AccountScreen() {
  const { user, expiresAt } = useSession();
  const router = useRouter();
  if (!user) {
    return (
      <Screen title="Your account" backTo="/" accountLink={false}>
        <EmptyState title="Not signed in." />
      </Screen>
    );
  }
  return (
    <Screen
      title="Your account"
      subtitle={user.name}
      backTo="/"
      account
      accountLink={false}
      full
      testID="account-screen"
    >
      <View style={{ width: '100%', maxWidth: 1100, alignSelf: 'center' }}>
        <TwoPane
          leftWidth={0.5}
          left={
            <>
              <Section title="You">
                <KeyValue label="Name" testID="account-name">
                  {user.name}
                </KeyValue>
                <KeyValue label="E-mail" testID="account-email">
                  <Mono style={wrapAnywhere}>{user.email}</Mono>
                </KeyValue>
                <KeyValue label="Role" testID="account-role">
                  {user.role === 'supplier' && user.lead
                    ? `${roleLabels[user.role]}, lead engineer`
                    : roleLabels[user.role]}
                </KeyValue>
                <KeyValue label="Organisation" testID="account-organization">
                  {user.organizationName ?? 'None'}
                </KeyValue>
                <KeyValue label="This sign-in ends">{expiresAt ? shortDate(expiresAt) : '–'}</KeyValue>
                <Txt variant="small" tone="faint">
                  Your name, address and role are kept by{' '}
                  {user.role === 'admin' ? 'the administrators' : 'your administrator'}: ask them to change these.
                </Txt>
              </Section>
              {user.role === 'supplier' || user.role === 'admin' ? (
                <Section title="Phones at the bench">
                  <Txt>
                    How the shop’s phones open Pitchcard: the address as a QR code, and the certificate to trust.
                  </Txt>
                  <Button
                    label="Set up phones"
                    variant="secondary"
                    onPress={() => router.push('/phone')}
                    testID="account-phones"
                  />
                </Section>
              ) : null}
              <SignOutEverywhere />
            </>
          }
          right={<ChangePasswordForm />}
        />
      </View>
    </Screen>
  );
}
