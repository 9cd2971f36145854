import { ctx } from 'expo-router/_ctx';
import { noticeListFirstPath } from '@/hooks/queries/notices';
import { travelerDetailPath } from '@/hooks/queries/travelers';
import { isLive, type StoredSession } from '@/hooks/use-session';
import { startEarlyGet } from '@/lib/api-client';
import { readJsonNow, storageKeys } from '@/lib/storage';
import { arrivalTravelerId } from './preload-arrival';

/**
 * Called by the entry (index.ts) before the app first draws, for a person already signed in on this
 * device: the chunk of the page the app opened at starts loading, and a part's traveler and the notices
 * of its banner are asked for (the requests its screen makes first, taken up by them in lib/api-client.ts).
 * Otherwise each waited on the one before: the entry's script, the session read from storage, the
 * layouts drawn down to the page, its chunk, then the traveler, and only once that was drawn the notices.
 * Signed out, nothing starts: the sign-in page shows instead.
 */
export function startEarlyArrival(): void {
  if (typeof window === 'undefined') return;
  const session = readJsonNow<StoredSession>(storageKeys.session);
  if (!isLive(session)) return;
  const pathname = window.location.pathname;
  (ctx as unknown as { preload?: (pathname: string) => void }).preload?.(pathname);
  const travelerId = arrivalTravelerId(pathname);
  if (travelerId) {
    startEarlyGet(travelerDetailPath(travelerId), session.token);
    startEarlyGet(noticeListFirstPath({ travelerId }), session.token);
  }
}
