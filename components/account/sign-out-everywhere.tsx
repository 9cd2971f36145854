import { useState } from 'react';
import { View } from 'react-native';
import { space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Section } from '@/components/ui/sheet';
import { Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { errorMessage } from '@/lib/api-client';
import { useAuthSignOutEverywhereMutation } from '@/hooks/queries/auth';

/** Ends every sign-in of the person at once (a lost phone, a shared shop computer), after saying what follows. */
export function SignOutEverywhere() {
  const end = useAuthSignOutEverywhereMutation();
  const [asking, setAsking] = useState(false);
  return (
    <Section title="Sign out everywhere" testID="sign-out-everywhere-section">
      <Txt variant="small" tone="soft">
        For a lost phone or a shop computer you forgot to sign out of. Work waiting to be sent from another device is
        lost there.
      </Txt>
      {asking ? (
        <View style={{ gap: space.sm }} testID="sign-out-everywhere-ask">
          <Notice tone="caution">
            Every device signs out now, this one too. You sign in again with your password.
          </Notice>
          {end.isError ? (
            <Notice tone="error" testID="sign-out-everywhere-error">
              {errorMessage(end.error)}
            </Notice>
          ) : null}
          <Button
            label="Sign out on every device"
            variant="danger"
            busyLabel="Signing out"
            busy={end.isPending}
            onPress={() => end.mutate()}
            testID="sign-out-everywhere-confirm"
          />
          <Button
            label="Keep my sign-ins"
            variant="quiet"
            disabled={end.isPending}
            onPress={() => {
              setAsking(false);
              end.reset();
            }}
            testID="sign-out-everywhere-cancel"
          />
        </View>
      ) : (
        <Button
          label="Sign out everywhere…"
          variant="secondary"
          onPress={() => setAsking(true)}
          testID="sign-out-everywhere"
        />
      )}
    </Section>
  );
}
