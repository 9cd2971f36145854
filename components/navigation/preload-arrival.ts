import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';
import { Platform } from 'react-native';
import { travelerQueries } from '@/hooks/queries/travelers';

const travelerPath = /^\/travelers\/([0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12})\/?$/i;

/**
 * The data of a traveler opened straight from its link (a mail, a bookmark, the home screen), asked
 * for as soon as the session is known rather than once its page's code has loaded and drawn: on the
 * web the route's code comes in several chunks, one after another, and the request would otherwise
 * wait for all of them. The same query (key and options) as the page's own, so the page finds it in
 * the cache or on its way. Once, for the address the app opened at.
 */
export function usePreloadArrival(status: 'loading' | 'signed-out' | 'signed-in'): void {
  const queryClient = useQueryClient();
  const done = useRef(false);
  useEffect(() => {
    if (done.current || status === 'loading') return;
    done.current = true;
    if (status !== 'signed-in' || Platform.OS !== 'web' || typeof window === 'undefined') return;
    const traveler = travelerPath.exec(window.location.pathname);
    // A failure is the page's to show: its own query asks again when it mounts.
    if (traveler) void queryClient.prefetchQuery(travelerQueries.detail(traveler[1]));
  }, [status, queryClient]);
}
