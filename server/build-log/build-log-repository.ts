import { and, asc, desc, eq, gte, inArray, lt, notInArray, or, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db';
import { findingEventActions, findingLogKindOfAction, type BuildLogKind } from '../../db/contracts';

export type FindingLogKind = Extract<BuildLogKind, `finding_${string}`>;

/** Which finding events a log kind means: the rules module names the log kind of each action. */
function findingKindCondition(kind: FindingLogKind): SQL {
  const actions = findingEventActions.filter((a) => findingLogKindOfAction[a] === kind);
  return actions.length ? inArray(findingEvents.action, actions) : sql`false`;
}
import { buildEvents, builds, designRevisions, findingEvents, findingPhotos, findings, partDesigns, travelerEvents, travelers, users } from '../../db/schema';
import { visibleBuilds } from '../builds/build-access';

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

/** Microsecond-exact UTC sort key: two events in the same millisecond still keep their order. */
const sortKey = (col: typeof travelerEvents.createdAt | typeof findingEvents.createdAt | typeof buildEvents.createdAt) =>
  sql<string>`to_char(${col} at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US')`;

function travelerScope(db: Db, user: Express.User, w: LogWindow): SQL[] {
  const c: SQL[] = [visibleBuilds(db, user), eq(travelers.buildId, w.buildId)];
  if (w.travelerId) c.push(eq(travelers.id, w.travelerId));
  return c;
}

export async function listLogParts(db: Db, user: Express.User, buildId: string) {
  return db.select({ travelerId: travelers.id, serial: travelers.serial, partNumber: partDesigns.partNumber, partName: partDesigns.name })
    .from(travelers)
    .innerJoin(builds, eq(builds.id, travelers.buildId))
    .innerJoin(designRevisions, eq(designRevisions.id, travelers.revisionId))
    .innerJoin(partDesigns, eq(partDesigns.id, designRevisions.partDesignId))
    .where(and(visibleBuilds(db, user), eq(travelers.buildId, buildId)))
    .orderBy(asc(partDesigns.partNumber), asc(travelers.serial));
}

export async function listBenchEvents(db: Db, user: Express.User, w: LogWindow) {
  if (w.benchKinds && w.benchKinds.length === 0 && !w.otherBench) return [];
  const c = travelerScope(db, user, w);
  if (w.from) c.push(gte(travelerEvents.createdAt, w.from));
  if (w.before) c.push(lt(travelerEvents.createdAt, w.before));
  if (w.benchKinds) {
    const kinds: SQL[] = [];
    if (w.benchKinds.length) kinds.push(inArray(travelerEvents.kind, w.benchKinds));
    if (w.otherBench) kinds.push(notInArray(travelerEvents.kind, [...w.knownBenchKinds]));
    c.push(or(...kinds)!);
  }
  return db.select({
    id: travelerEvents.id, kind: travelerEvents.kind, detail: travelerEvents.detail, createdAt: travelerEvents.createdAt,
    sortKey: sortKey(travelerEvents.createdAt), actorName: users.name, actorRole: users.role,
    travelerId: travelers.id, serial: travelers.serial, partNumber: partDesigns.partNumber, partName: partDesigns.name,
  }).from(travelerEvents)
    .innerJoin(travelers, eq(travelers.id, travelerEvents.travelerId))
    .innerJoin(builds, eq(builds.id, travelers.buildId))
    .innerJoin(designRevisions, eq(designRevisions.id, travelers.revisionId))
    .innerJoin(partDesigns, eq(partDesigns.id, designRevisions.partDesignId))
    .innerJoin(users, eq(users.id, travelerEvents.actorId))
    .where(and(...c))
    .orderBy(desc(travelerEvents.createdAt), desc(travelerEvents.id));
}

export async function listFindingLogEvents(db: Db, user: Express.User, w: LogWindow) {
  if (w.findingKinds && w.findingKinds.length === 0) return [];
  const c = travelerScope(db, user, w);
  if (w.from) c.push(gte(findingEvents.createdAt, w.from));
  if (w.before) c.push(lt(findingEvents.createdAt, w.before));
  if (w.findingKinds) c.push(or(...w.findingKinds.map(findingKindCondition))!);
  return db.select({
    id: findingEvents.id, findingId: findings.id, action: findingEvents.action, toStatus: findingEvents.toStatus, fromStatus: findingEvents.fromStatus,
    disposition: findingEvents.disposition, note: findingEvents.note, createdAt: findingEvents.createdAt,
    sortKey: sortKey(findingEvents.createdAt), actorName: users.name, actorRole: users.role,
    holeIds: findings.holeIds, findingKind: findings.kind, closure: findings.closure,
    travelerId: travelers.id, serial: travelers.serial, partNumber: partDesigns.partNumber, partName: partDesigns.name,
  }).from(findingEvents)
    .innerJoin(findings, eq(findings.id, findingEvents.findingId))
    .innerJoin(travelers, eq(travelers.id, findings.travelerId))
    .innerJoin(builds, eq(builds.id, travelers.buildId))
    .innerJoin(designRevisions, eq(designRevisions.id, travelers.revisionId))
    .innerJoin(partDesigns, eq(partDesigns.id, designRevisions.partDesignId))
    .innerJoin(users, eq(users.id, findingEvents.actorId))
    .where(and(...c))
    .orderBy(desc(findingEvents.createdAt), desc(findingEvents.id));
}

/** Photos of these findings (as found: no event; of the work: its event), oldest first, only where the finding's build is visible. */
export async function listLogPhotos(db: Db, user: Express.User, buildId: string, findingIds: string[]) {
  if (findingIds.length === 0) return [];
  return db.select({ id: findingPhotos.id, findingId: findingPhotos.findingId, eventId: findingPhotos.eventId, thumbKey: findingPhotos.thumbKey })
    .from(findingPhotos)
    .innerJoin(findings, eq(findings.id, findingPhotos.findingId))
    .innerJoin(travelers, eq(travelers.id, findings.travelerId))
    .innerJoin(builds, eq(builds.id, travelers.buildId))
    .where(and(visibleBuilds(db, user), eq(travelers.buildId, buildId), inArray(findingPhotos.findingId, findingIds)))
    .orderBy(asc(findingPhotos.createdAt), asc(findingPhotos.id));
}

/** What happened to the build itself (its people), in the window; only when the build is visible. */
export async function listBuildEvents(db: Db, user: Express.User, w: LogWindow) {
  if (w.travelerId || (w.buildKinds && w.buildKinds.length === 0)) return [];
  const c: SQL[] = [visibleBuilds(db, user), eq(buildEvents.buildId, w.buildId)];
  if (w.from) c.push(gte(buildEvents.createdAt, w.from));
  if (w.before) c.push(lt(buildEvents.createdAt, w.before));
  if (w.buildKinds) c.push(inArray(buildEvents.kind, w.buildKinds));
  return db.select({
    id: buildEvents.id, kind: buildEvents.kind, detail: buildEvents.detail, createdAt: buildEvents.createdAt,
    sortKey: sortKey(buildEvents.createdAt), actorName: users.name, actorRole: users.role, kitSerial: builds.kitSerial,
  }).from(buildEvents)
    .innerJoin(builds, eq(builds.id, buildEvents.buildId))
    .innerJoin(users, eq(users.id, buildEvents.actorId))
    .where(and(...c))
    .orderBy(desc(buildEvents.createdAt), desc(buildEvents.id));
}
