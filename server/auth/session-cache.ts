import type { SessionUser } from '../../db/contracts';
import { BoundedMap } from '../bounded-map';

export type SessionRow = SessionUser & { active: boolean; sessionVersion: number };

/**
 * Signed-in people read in the last second (SESSION_CACHE_MS; the README's "many builds" section says
 * how long another process may still accept a token this one has ended), by id: a bench ticking holes or a reviewer paging the
 * queue sends request after request with one token, and reading their row for each was the one
 * statement every request paid for on top of its own.
 *
 * A change of role or standing, a new password or "sign out everywhere" forgets the person here at
 * once (auth and people repositories); another server process sees it when its own copy ages out,
 * within SESSION_CACHE_MS. User ids are random UUIDs, so one map serves every database a test process opens.
 */
export const SESSION_CACHE_MS = 1000;
/** Bounded whatever the traffic: the oldest entry goes first when it is full. */
const MAX_ENTRIES = 10_000;

const entries = new BoundedMap<string, { row: SessionRow | undefined; until: number }>(MAX_ENTRIES);

/**
 * The person behind a token of version `ver`: from memory when read within the last second at that
 * version, otherwise read again by `load` (a token newer than the copy means the copy is stale).
 */
export async function cachedSessionUser(
  id: string,
  ver: number,
  load: (id: string) => Promise<SessionRow | undefined>,
): Promise<SessionRow | undefined> {
  const now = Date.now();
  const hit = entries.get(id);
  if (hit && hit.until > now && hit.row?.sessionVersion === ver) return hit.row;
  const row = await load(id);
  entries.set(id, { row, until: now + SESSION_CACHE_MS });
  return row;
}

/** Called by every write that changes who a person is or whether their sign-ins stand. */
export function forgetSessionUser(id: string): void {
  entries.delete(id);
}
