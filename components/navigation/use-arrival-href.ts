import { useGlobalSearchParams, usePathname, useSegments } from 'expo-router';
import { useState } from 'react';
import { hiddenPageHref } from './pending-link';

/**
 * The page the app was opened at, when it lies behind the sign-in guard; null otherwise.
 *
 * Read on the first render only, while the session is still loading and no navigator is drawn: the
 * router's location is then still the one the app was opened with. Once the guard has run, a hidden
 * page has already been swapped for the sign-in screen and its path is gone.
 */
export function useArrivalHref(): string | null {
  const pathname = usePathname();
  const segments = useSegments();
  const params = useGlobalSearchParams();
  const [arrival] = useState(() => hiddenPageHref({ pathname, segments, params }));
  return arrival;
}
