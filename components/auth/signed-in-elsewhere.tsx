import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/states';
import { useSession } from '@/hooks/use-session';

/**
 * On a one-time link opened on a device where someone is signed in: the link is for another person (or
 * for a fresh start), so the present session ends first. Switching people without signing out would
 * leave the first person's cached pages in reach of the second.
 */
export function SignedInElsewhere({ what }: { what: string }) {
  const session = useSession();
  if (session.status !== 'signed-in' || !session.user) return null;
  return (
    <>
      <Notice tone="caution" testID="signed-in-other">
        {`This device is signed in as ${session.user.name}. Sign out first, then ${what}.`}
      </Notice>
      <Button
        label={`Sign ${session.user.name.split(/\s+/)[0]} out`}
        variant="secondary"
        onPress={() => void session.signOut()}
        testID="signed-in-other-sign-out"
      />
    </>
  );
}

export function useSignedIn(): boolean {
  return useSession().status === 'signed-in';
}
