import { Redirect, type Href } from 'expo-router';
import { useEffect } from 'react';
import type { Role } from '@/db/contracts';
import { useSession } from '@/hooks/use-session';

export const homeFor: Record<Role, Href> = {
  builder: '/bench',
  inspector: '/findings',
  supplier: '/catalogue',
  admin: '/admin',
};

/** The first screen after sign-in: a label scanned before signing in, or the role's own first tab. */
export function HomeRedirect() {
  const { user, pendingHref, setPendingHref } = useSession();
  const target = pendingHref ?? (user ? homeFor[user.role] : '/sign-in');
  useEffect(() => {
    if (pendingHref) setPendingHref(null);
  }, [pendingHref, setPendingHref]);
  return <Redirect href={target as Href} />;
}
