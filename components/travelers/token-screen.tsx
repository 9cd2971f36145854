import { useRouter } from 'expo-router';
import { useEffect } from 'react';
import { safeInAppPath } from '@/components/navigation/pending-link';
import { Button } from '@/components/ui/button';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { useTravelerLookupQuery } from '@/hooks/queries/travelers';
import { useSession } from '@/hooks/use-session';

/** A QR label is a link to <origin>/t/<token>: find the traveler it names and open it. */
export function TokenScreen({ token }: { token: string }) {
  const router = useRouter();
  const { status, setPendingHref } = useSession();
  const signedIn = status === 'signed-in';
  const q = useTravelerLookupQuery(signedIn ? token : '');

  useEffect(() => {
    if (q.data?.id) router.replace(`/travelers/${q.data.id}`);
  }, [q.data?.id, router]);

  // A label scanned while signed out goes straight to sign-in, which comes back here afterwards.
  // The message below stays for the moment before, or if the link cannot be kept.
  const labelHref = safeInAppPath(`/t/${encodeURIComponent(token)}`);
  useEffect(() => {
    if (signedIn || !labelHref) return;
    setPendingHref(labelHref);
    router.replace('/sign-in');
  }, [signedIn, labelHref, setPendingHref, router]);

  if (!signedIn) {
    return (
      <Screen title="Scanned label">
        <EmptyState
          title="Sign in to open this part."
          body="The label names a traveler. After you sign in it opens by itself."
          action={
            <Button
              label="Sign in"
              testID="token-sign-in"
              onPress={() => {
                setPendingHref(labelHref);
                router.replace('/sign-in');
              }}
            />
          }
        />
      </Screen>
    );
  }
  if (token.length < 4) {
    return (
      <Screen title="Scanned label" backTo="/">
        <EmptyState
          title="This label link is incomplete."
          body="Scan the label again, or type the short code on the bench."
        />
      </Screen>
    );
  }
  return (
    <Screen title="Scanned label" backTo="/">
      {q.isError ? (
        <ErrorState error={q.error} title="No part for this label" onRetry={() => void q.refetch()} />
      ) : (
        <LoadingState what="Finding the part" />
      )}
    </Screen>
  );
}
