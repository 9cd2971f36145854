import { useFocusEffect, useRouter, type Href } from 'expo-router';
import { useCallback } from 'react';
import type { Role } from '@/db/contracts';
import { useSession } from '@/hooks/use-session';
import { mayOpenPath } from './role-tabs';

export const homeFor: Record<Role, Href> = {
  builder: '/bench',
  inspector: '/findings',
  supplier: '/catalogue',
  admin: '/people',
};

/**
 * The first screen after sign-in: the page the person opened before signing in (a mail's link, a
 * scanned label), or else the role's own first tab.
 *
 * The pending path is taken once per visit here, not read from render: clearing it re-renders this
 * screen, and a target computed from render would then send the person on a second time, to home.
 */
export function HomeRedirect() {
  const router = useRouter();
  const { user, takePendingHref } = useSession();
  const role = user?.role ?? null;
  useFocusEffect(
    useCallback(() => {
      // A link to another role's page (the last page of whoever used this browser before) is dropped.
      const pending = takePendingHref();
      const usable = pending && role && mayOpenPath(role, pending) ? pending : null;
      router.replace((usable ?? (role ? homeFor[role] : '/sign-in')) as Href);
    }, [router, role, takePendingHref]),
  );
  return null;
}
