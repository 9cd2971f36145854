import { useRouter } from 'expo-router';
import { useEffect, useState } from 'react';
import { useSession } from '@/hooks/use-session';

/**
 * For the pages open to everyone that end in a sign-in (joining, a new password): once the new session
 * is in place, go to the app's first page, which picks the person's own first tab. Waiting for the
 * session rather than navigating straight after the request keeps the router from looking for the
 * app's pages while the sign-in guard still hides them.
 */
export function useLandSignedIn(): () => void {
  const router = useRouter();
  const { status, user } = useSession();
  const [done, setDone] = useState(false);
  useEffect(() => {
    if (done && status === 'signed-in' && user) router.replace('/');
  }, [done, status, user, router]);
  return () => setDone(true);
}
