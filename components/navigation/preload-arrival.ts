import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';
import { Platform } from 'react-native';
import { noticeQueries } from '@/hooks/queries/notices';
import { travelerQueries } from '@/hooks/queries/travelers';

const travelerPath = /^\/travelers\/([0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12})\/?$/i;

/** The part whose traveler the address opens, if it opens one. */
export function arrivalTravelerId(pathname: string): string | null {
  return travelerPath.exec(pathname)?.[1] ?? null;
}

/**
 * The data of a traveler opened straight from its link (a mail, a bookmark, the home screen), asked
 * for as soon as the session is known rather than once its page's code has loaded and drawn: on the
 * web the route's code comes in several chunks, one after another, and the request would otherwise
 * wait for all of them. The same queries (key and options) as the page's own, so the page finds them in
 * the cache or on their way: the traveler and its notices banner's. Once, for the address the app
 * opened at. The requests themselves have usually started before the app drew (early-arrival.web.ts).
 */
export function usePreloadArrival(status: 'loading' | 'signed-out' | 'signed-in'): void {
  const queryClient = useQueryClient();
  const done = useRef(false);
  useEffect(() => {
    if (done.current || status === 'loading') return;
    done.current = true;
    if (status !== 'signed-in' || Platform.OS !== 'web' || typeof window === 'undefined') return;
    const travelerId = arrivalTravelerId(window.location.pathname);
    // A failure is the page's to show: its own query asks again when it mounts.
    if (travelerId) {
      void queryClient.prefetchQuery(travelerQueries.detail(travelerId));
      void queryClient.prefetchInfiniteQuery(noticeQueries.list({ travelerId }));
    }
  }, [status, queryClient]);
}
