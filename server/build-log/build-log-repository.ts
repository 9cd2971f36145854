import {
  and,
  asc,
  count,
  desc,
  eq,
  gt,
  gte,
  inArray,
  lt,
  lte,
  max,
  min,
  notInArray,
  or,
  sql,
  type AnyColumn,
  type SQL,
} from 'drizzle-orm';
import type { Db } from '../../db';
import { findingEventActions, findingLogKindOfAction, type BuildLogKind } from '../../db/contracts';
import {
  buildEvents,
  builds,
  findingEvents,
  findingPhotos,
  findings,
  logChain,
  partDesigns,
  travelerEvents,
  travelers,
  users,
} from '../../db/schema';
import { visibleBuilds } from '../builds/build-access';
import { joinTravelerPart } from '../travelers/travelers-repository';

export type FindingLogKind = Extract<BuildLogKind, `finding_${string}`>;

/** Which finding events a log kind means: the rules module names the log kind of each action. */
function findingKindCondition(kind: FindingLogKind): SQL {
  const actions = findingEventActions.filter((a) => findingLogKindOfAction[a] === kind);
  return actions.length ? inArray(findingEvents.action, actions) : sql`false`;
}

/**
 * What to read of one build's history. Every query below also carries `visibleBuilds`, so a build the
 * person may not see yields nothing even if a caller forgot to check it first.
 */
export type LogWindow = {
  buildId: string;
  travelerId?: string;
  from?: Date;
  /** Exclusive. */
  before?: Date;
  /** Bench kinds to read; null reads all. `otherBench` adds the kinds not in `knownBenchKinds`. */
  benchKinds: string[] | null;
  otherBench: boolean;
  knownBenchKinds: readonly string[];
  /** Finding event kinds to read; null reads all. */
  findingKinds: FindingLogKind[] | null;
  /** Build event kinds (its people) to read; null reads all. */
  buildKinds: string[] | null;
};

/** Where a row comes from: build events, finding events, traveler (bench) events; also the tie-break at one instant. */
export type LogSource = 'b' | 'f' | 't';
/**
 * A row's place in the log: its microsecond UTC time as text, its source, its id. The log is ordered by
 * this triple (newest first on screen, oldest first in the exports), so every row has one stable place.
 */
export type LogKey = readonly [at: string, src: LogSource, id: string];
export type LogOrder = 'asc' | 'desc';
/** One keyset read: the rows after `after` in `order`, at most `limit`. */
export type LogRead = { after: LogKey | null; order: LogOrder; limit: number };

/** -1 when a comes before b in `order`, 1 after, 0 equal: the same order the queries below sort by. */
export function compareKeys(a: LogKey, b: LogKey, order: LogOrder): number {
  for (let i = 0; i < 3; i++) {
    if (a[i] !== b[i]) return (a[i] < b[i] ? -1 : 1) * (order === 'asc' ? 1 : -1);
  }
  return 0;
}

/**
 * "After this key" for one source. The order is (time, source, id), so at the key's own instant a source
 * that sorts later than the key's (asc) or earlier (desc) still has rows to come, the key's own source only
 * those past its id, and the others none.
 */
function afterKeyOf(src: LogSource, col: AnyColumn, idCol: AnyColumn, r: LogRead): SQL | undefined {
  if (!r.after) return undefined;
  const [at, s, id] = r.after;
  const t = sql`(${at}::timestamp at time zone 'UTC')`;
  if (src === s)
    return r.order === 'desc'
      ? sql`(${col}, ${idCol}) < (${t}, ${id}::uuid)`
      : sql`(${col}, ${idCol}) > (${t}, ${id}::uuid)`;
  const sameInstantFollows = r.order === 'desc' ? src < s : src > s;
  if (r.order === 'desc') return sameInstantFollows ? lte(col, t) : lt(col, t);
  return sameInstantFollows ? gte(col, t) : gt(col, t);
}

const ordered = (order: LogOrder, col: AnyColumn, id: AnyColumn) =>
  order === 'desc' ? [desc(col), desc(id)] : [asc(col), asc(id)];

/** A moment as UTC text to the microsecond, as PostgreSQL keeps it (a JS Date would drop the last three digits). */
const utcMicros = <T extends string | null>(moment: AnyColumn | SQL) =>
  sql<T>`to_char(${moment} at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US')`;
/** A row's place in time for the keyset: two events in the same millisecond still keep their order. */
const sortKey = (createdAt: AnyColumn) => utcMicros<string>(createdAt);

/** An event's link hash in the build's chain, read through the chain's (source, event) index. */
const chainHash = (source: 'b' | 'f' | 't', eventId: AnyColumn) =>
  sql<
    string | null
  >`(select ${logChain.hash} from ${logChain} where ${logChain.source} = ${source} and ${logChain.eventId} = ${eventId})`;

/** When a bench or build event was done (its place in the log) and how far off the device's clock was. */
const timeColumns = (t: typeof travelerEvents | typeof buildEvents, source: 'b' | 't') => ({
  doneAt: t.doneAt,
  clockOffsetMs: t.clockOffsetMs,
  hash: chainHash(source, t.id),
});

/** The window's bounds in time, on one source's time of work (`done_at`; a finding's `created_at`), added to its conditions. */
function withinWindow(c: SQL[], createdAt: AnyColumn, w: LogWindow): SQL[] {
  if (w.from) c.push(gte(createdAt, w.from));
  if (w.before) c.push(lt(createdAt, w.before));
  return c;
}

function travelerScope(db: Db, user: Express.User, w: LogWindow): SQL[] {
  const c: SQL[] = [visibleBuilds(db, user), eq(travelers.buildId, w.buildId)];
  if (w.travelerId) c.push(eq(travelers.id, w.travelerId));
  return c;
}

/** Which part an entry is about, as every read of the log names it. */
const partColumns = {
  travelerId: travelers.id,
  serial: travelers.serial,
  partNumber: partDesigns.partNumber,
  partName: partDesigns.name,
};
/** Who acted, as every entry of the log names them. */
const actorColumns = { actorName: users.name, actorRole: users.role };

export async function listLogParts(db: Db, user: Express.User, buildId: string) {
  return joinTravelerPart(db.select(partColumns).from(travelers).$dynamic())
    .where(and(visibleBuilds(db, user), eq(travelers.buildId, buildId)))
    .orderBy(asc(partDesigns.partNumber), asc(travelers.serial));
}

function benchConditions(db: Db, user: Express.User, w: LogWindow): SQL[] | null {
  if (w.benchKinds && w.benchKinds.length === 0 && !w.otherBench) return null;
  const c = withinWindow(travelerScope(db, user, w), travelerEvents.doneAt, w);
  if (w.benchKinds) {
    const kinds: SQL[] = [];
    if (w.benchKinds.length) kinds.push(inArray(travelerEvents.kind, w.benchKinds));
    if (w.otherBench) kinds.push(notInArray(travelerEvents.kind, [...w.knownBenchKinds]));
    c.push(or(...kinds)!);
  }
  return c;
}

/** Bench events of the window, one keyset read. */
export async function listBenchEvents(db: Db, user: Express.User, w: LogWindow, r: LogRead) {
  const c = benchConditions(db, user, w);
  if (!c) return [];
  return joinTravelerPart(
    db
      .select({
        id: travelerEvents.id,
        kind: travelerEvents.kind,
        detail: travelerEvents.detail,
        createdAt: travelerEvents.createdAt,
        sortKey: sortKey(travelerEvents.doneAt),
        ...timeColumns(travelerEvents, 't'),
        ...actorColumns,
        ...partColumns,
      })
      .from(travelerEvents)
      .innerJoin(travelers, eq(travelers.id, travelerEvents.travelerId))
      .$dynamic(),
  )
    .innerJoin(users, eq(users.id, travelerEvents.actorId))
    .where(and(...c, afterKeyOf('t', travelerEvents.doneAt, travelerEvents.id, r)))
    .orderBy(...ordered(r.order, travelerEvents.doneAt, travelerEvents.id))
    .limit(r.limit);
}

function findingConditions(db: Db, user: Express.User, w: LogWindow): SQL[] | null {
  if (w.findingKinds && w.findingKinds.length === 0) return null;
  const c = withinWindow(travelerScope(db, user, w), findingEvents.createdAt, w);
  if (w.findingKinds) c.push(or(...w.findingKinds.map(findingKindCondition))!);
  return c;
}

/** Finding events of the window, one keyset read. */
export async function listFindingLogEvents(db: Db, user: Express.User, w: LogWindow, r: LogRead) {
  const c = findingConditions(db, user, w);
  if (!c) return [];
  return joinTravelerPart(
    db
      .select({
        id: findingEvents.id,
        findingId: findings.id,
        action: findingEvents.action,
        toStatus: findingEvents.toStatus,
        fromStatus: findingEvents.fromStatus,
        disposition: findingEvents.disposition,
        note: findingEvents.note,
        createdAt: findingEvents.createdAt,
        sortKey: sortKey(findingEvents.createdAt),
        doneAt: findingEvents.createdAt,
        clockOffsetMs: sql<number | null>`null::integer`,
        hash: chainHash('f', findingEvents.id),
        ...actorColumns,
        holeIds: findings.holeIds,
        findingKind: findings.kind,
        closure: findings.closure,
        ...partColumns,
      })
      .from(findingEvents)
      .innerJoin(findings, eq(findings.id, findingEvents.findingId))
      .innerJoin(travelers, eq(travelers.id, findings.travelerId))
      .$dynamic(),
  )
    .innerJoin(users, eq(users.id, findingEvents.actorId))
    .where(and(...c, afterKeyOf('f', findingEvents.createdAt, findingEvents.id, r)))
    .orderBy(...ordered(r.order, findingEvents.createdAt, findingEvents.id))
    .limit(r.limit);
}

/** Photos of these findings (as found: no event; of the work: its event), oldest first, only where the finding's build is visible. */
export async function listLogPhotos(db: Db, user: Express.User, buildId: string, findingIds: string[]) {
  if (findingIds.length === 0) return [];
  return db
    .select({
      id: findingPhotos.id,
      findingId: findingPhotos.findingId,
      eventId: findingPhotos.eventId,
      thumbKey: findingPhotos.thumbKey,
    })
    .from(findingPhotos)
    .innerJoin(findings, eq(findings.id, findingPhotos.findingId))
    .innerJoin(travelers, eq(travelers.id, findings.travelerId))
    .innerJoin(builds, eq(builds.id, travelers.buildId))
    .where(and(visibleBuilds(db, user), eq(travelers.buildId, buildId), inArray(findingPhotos.findingId, findingIds)))
    .orderBy(asc(findingPhotos.createdAt), asc(findingPhotos.id));
}

function buildConditions(db: Db, user: Express.User, w: LogWindow): SQL[] | null {
  if (w.travelerId || (w.buildKinds && w.buildKinds.length === 0)) return null;
  const c = withinWindow([visibleBuilds(db, user), eq(buildEvents.buildId, w.buildId)], buildEvents.doneAt, w);
  if (w.buildKinds) c.push(inArray(buildEvents.kind, w.buildKinds));
  return c;
}

/** What happened to the build itself (its people) in the window, one keyset read; only when the build is visible. */
export async function listBuildEvents(db: Db, user: Express.User, w: LogWindow, r: LogRead) {
  const c = buildConditions(db, user, w);
  if (!c) return [];
  return db
    .select({
      id: buildEvents.id,
      kind: buildEvents.kind,
      detail: buildEvents.detail,
      createdAt: buildEvents.createdAt,
      sortKey: sortKey(buildEvents.doneAt),
      ...timeColumns(buildEvents, 'b'),
      ...actorColumns,
      kitSerial: builds.kitSerial,
    })
    .from(buildEvents)
    .innerJoin(builds, eq(builds.id, buildEvents.buildId))
    .innerJoin(users, eq(users.id, buildEvents.actorId))
    .where(and(...c, afterKeyOf('b', buildEvents.doneAt, buildEvents.id, r)))
    .orderBy(...ordered(r.order, buildEvents.doneAt, buildEvents.id))
    .limit(r.limit);
}

type Tally = { n: number; first: string | null; last: string | null };
const tallyOf = (col: AnyColumn) => ({
  n: count(),
  first: utcMicros<string | null>(min(col)),
  last: utcMicros<string | null>(max(col)),
});

/**
 * How many entries the window holds and their first and last moment, counted by PostgreSQL, for the
 * PDF's title block, which is printed before any entry is read.
 */
export async function tallyLog(db: Db, user: Express.User, w: LogWindow): Promise<Tally> {
  const bc = benchConditions(db, user, w);
  const fc = findingConditions(db, user, w);
  const uc = buildConditions(db, user, w);
  const none: Tally[] = [{ n: 0, first: null, last: null }];
  const parts = await Promise.all([
    bc
      ? db
          .select(tallyOf(travelerEvents.doneAt))
          .from(travelerEvents)
          .innerJoin(travelers, eq(travelers.id, travelerEvents.travelerId))
          .innerJoin(builds, eq(builds.id, travelers.buildId))
          .where(and(...bc))
      : none,
    fc
      ? db
          .select(tallyOf(findingEvents.createdAt))
          .from(findingEvents)
          .innerJoin(findings, eq(findings.id, findingEvents.findingId))
          .innerJoin(travelers, eq(travelers.id, findings.travelerId))
          .innerJoin(builds, eq(builds.id, travelers.buildId))
          .where(and(...fc))
      : none,
    uc
      ? db
          .select(tallyOf(buildEvents.doneAt))
          .from(buildEvents)
          .innerJoin(builds, eq(builds.id, buildEvents.buildId))
          .where(and(...uc))
      : none,
  ]);
  const all = parts.map((p) => p[0]);
  /** The sources' moments that exist, in order (the text sorts as the time does). */
  const moments = (of: 'first' | 'last') =>
    all
      .map((t) => t[of])
      .filter((x): x is string => !!x)
      .sort();
  return {
    n: all.reduce((s, t) => s + Number(t.n), 0),
    first: moments('first')[0] ?? null,
    last: moments('last').at(-1) ?? null,
  };
}

/** How many findings the printed summary lists one by one; the count says how many there are in all. */
export const SUMMARY_FINDINGS_MAX = 200;

/** The build's parts for the printed summary: which are signed off, by whom and when; only when visible. */
export async function listSummaryParts(db: Db, user: Express.User, buildId: string) {
  return joinTravelerPart(
    db
      .select({
        partNumber: partDesigns.partNumber,
        serial: travelers.serial,
        signedOffAt: travelers.signedOffAt,
        signedOffByName: sql<string | null>`(select u.name from users u where u.id = ${travelers.signedOffBy})`,
        replaced: sql<boolean>`${travelers.replacedById} is not null`,
      })
      .from(travelers)
      .$dynamic(),
  )
    .where(and(eq(travelers.buildId, buildId), visibleBuilds(db, user)))
    .orderBy(asc(partDesigns.partNumber), asc(travelers.serial));
}

/** The build's findings for the printed summary, oldest first, and how many there are in all. */
export async function listSummaryFindings(db: Db, user: Express.User, buildId: string) {
  const where = and(eq(travelers.buildId, buildId), visibleBuilds(db, user));
  const [rows, [{ n }]] = await Promise.all([
    joinTravelerPart(
      db
        .select({
          partNumber: partDesigns.partNumber,
          holeIds: findings.holeIds,
          kind: findings.kind,
          status: findings.status,
          disposition: findings.disposition,
          closure: findings.closure,
          raisedAt: findings.createdAt,
        })
        .from(findings)
        .innerJoin(travelers, eq(travelers.id, findings.travelerId))
        .$dynamic(),
    )
      .where(where)
      .orderBy(asc(findings.createdAt), asc(findings.id))
      .limit(SUMMARY_FINDINGS_MAX),
    joinTravelerPart(
      db.select({ n: count() }).from(findings).innerJoin(travelers, eq(travelers.id, findings.travelerId)).$dynamic(),
    ).where(where),
  ]);
  return { rows, total: n };
}
