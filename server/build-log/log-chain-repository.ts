import { and, count, desc, eq, inArray, or, sql } from 'drizzle-orm';
import type { Db } from '../../db';
import type { LogChainProblem } from '../../db/contracts';
import { builds, logChain } from '../../db/schema';
import { visibleBuilds } from '../builds/build-access';

/**
 * The chain's queries. The links are written by the database (migration 0008: a trigger on each event
 * table); the canonical text and the hash exist only as SQL functions there, so the check recomputes with
 * the very definition that wrote them. Each query carries `visibleBuilds`, so a build the person may not
 * see yields nothing even if a caller forgot to check it first.
 */

export type LogSourceLetter = 'b' | 'f' | 't';
export type ChainBreakRow = { seq: number | null; source: LogSourceLetter; eventId: string; problem: LogChainProblem };

/** Most entries one `storedHashes` call looks up: a caller with more reads in batches. */
export const STORED_HASHES_MAX = 1000;

const visible = (db: Db, user: Express.User, buildId: string) =>
  db
    .select({ id: builds.id })
    .from(builds)
    .where(and(eq(builds.id, buildId), visibleBuilds(db, user)));

/** How many links the build has and its last one (null before the first event). */
export async function chainHead(db: Db, user: Express.User, buildId: string) {
  const where = and(eq(logChain.buildId, buildId), inArray(logChain.buildId, visible(db, user, buildId)));
  const [[{ n }], [last]] = await Promise.all([
    db.select({ n: count() }).from(logChain).where(where),
    db
      .select({ seq: logChain.seq, hash: logChain.hash })
      .from(logChain)
      .where(where)
      .orderBy(desc(logChain.seq))
      .limit(1),
  ]);
  return { length: n, head: last ?? null };
}

/** The database's own check of the build's chain (log_chain_check): at most 50 breaks, in chain order. */
export async function checkChain(db: Db, user: Express.User, buildId: string): Promise<ChainBreakRow[]> {
  const res = await db.execute(sql`select c.seq, c.source, c.event_id as "eventId", c.problem
    from log_chain_check(${buildId}::uuid) c
    where exists (${visible(db, user, buildId)})`);
  return res.rows as ChainBreakRow[];
}

/**
 * The stored hash of each of these entries of the build, keyed `source:eventId` (the log's entry id);
 * an entry the build's chain does not have is absent. At most STORED_HASHES_MAX entries per call.
 */
export async function storedHashes(
  db: Db,
  user: Express.User,
  buildId: string,
  entries: readonly { source: LogSourceLetter; eventId: string }[],
): Promise<Map<string, string>> {
  if (entries.length > STORED_HASHES_MAX)
    throw new Error(`storedHashes takes at most ${STORED_HASHES_MAX} entries, got ${entries.length}`);
  const found = new Map<string, string>();
  if (!entries.length) return found;
  // One IN list per source, so each reads the (source, event_id) unique index.
  const bySource = (['b', 'f', 't'] as const)
    .map((s) => ({ s, ids: entries.filter((e) => e.source === s).map((e) => e.eventId) }))
    .filter((x) => x.ids.length)
    .map((x) => and(eq(logChain.source, x.s), inArray(logChain.eventId, x.ids)));
  const rows = await db
    .select({ source: logChain.source, eventId: logChain.eventId, hash: logChain.hash })
    .from(logChain)
    .where(and(eq(logChain.buildId, buildId), inArray(logChain.buildId, visible(db, user, buildId)), or(...bySource)));
  for (const r of rows) found.set(`${r.source}:${r.eventId}`, r.hash);
  return found;
}
