import { and, asc, count, desc, eq, inArray, isNotNull, isNull, ne, sql } from 'drizzle-orm';
import type { Db } from '../../db';
import { buildEvents, buildMembers, builds, findings, holes, invitations, kitModels, organizations, travelerEvents, travelerSteps, travelers, users } from '../../db/schema';
import { holesDoneStatuses, openFindingStatuses, type BuildWork, type MemberPlace } from '../../db/contracts';
import { visibleBuilds } from './build-access';

export async function listVisibleBuilds(db: Db, user: Express.User, onlyId?: string) {
  const where = onlyId ? and(visibleBuilds(db, user), eq(builds.id, onlyId)) : visibleBuilds(db, user);
  const rows = await db.select({
    id: builds.id, kitSerial: builds.kitSerial, kitName: kitModels.name, supplierName: organizations.name,
    organizationId: builds.organizationId, createdAt: builds.createdAt,
  }).from(builds).innerJoin(kitModels, eq(kitModels.id, builds.kitModelId)).innerJoin(organizations, eq(organizations.id, builds.organizationId))
    .where(where).orderBy(desc(builds.createdAt));
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.id);
  const [members, travelerCounts, holeCounts, openFindings] = await Promise.all([
    db.select({ buildId: buildMembers.buildId, role: buildMembers.role, id: users.id, name: users.name, email: users.email })
      .from(buildMembers).innerJoin(users, eq(users.id, buildMembers.userId)).where(inArray(buildMembers.buildId, ids)).orderBy(asc(users.name)),
    db.select({ buildId: travelers.buildId, n: count() }).from(travelers).where(inArray(travelers.buildId, ids)).groupBy(travelers.buildId),
    db.select({
      buildId: travelers.buildId, total: count(),
      done: sql<number>`count(*) filter (where ${inArray(holes.status, [...holesDoneStatuses])})`.mapWith(Number),
    }).from(holes).innerJoin(travelers, eq(travelers.id, holes.travelerId)).where(inArray(travelers.buildId, ids)).groupBy(travelers.buildId),
    db.select({ buildId: travelers.buildId, n: count() }).from(findings).innerJoin(travelers, eq(travelers.id, findings.travelerId))
      .where(and(inArray(travelers.buildId, ids), inArray(findings.status, [...openFindingStatuses]))).groupBy(travelers.buildId),
  ]);
  const person = ({ id, name, email }: { id: string; name: string; email: string }) => ({ id, name, email });
  return rows.map(({ organizationId: _, ...b }) => ({
    ...b,
    createdAt: b.createdAt.toISOString(),
    builders: members.filter((m) => m.buildId === b.id && m.role === 'builder').map(person),
    inspectors: members.filter((m) => m.buildId === b.id && m.role === 'inspector').map(person),
    travelerCount: travelerCounts.find((c) => c.buildId === b.id)?.n ?? 0,
    holesTotal: holeCounts.find((c) => c.buildId === b.id)?.total ?? 0,
    holesDone: holeCounts.find((c) => c.buildId === b.id)?.done ?? 0,
    openFindings: openFindings.find((c) => c.buildId === b.id)?.n ?? 0,
  }));
}

/** The people of one build with their places, oldest first. */
export async function listBuildMembers(db: Db, buildId: string) {
  return db.select({ userId: users.id, name: users.name, email: users.email, place: buildMembers.place, role: buildMembers.role, addedAt: buildMembers.addedAt })
    .from(buildMembers).innerJoin(users, eq(users.id, buildMembers.userId))
    .where(eq(buildMembers.buildId, buildId)).orderBy(asc(buildMembers.addedAt), asc(users.name));
}

export async function removeBuildMember(db: Db, buildId: string, userId: string) {
  await db.delete(buildMembers).where(and(eq(buildMembers.buildId, buildId), eq(buildMembers.userId, userId)));
}

export async function setMemberPlace(db: Db, buildId: string, userId: string, place: MemberPlace) {
  await db.update(buildMembers).set({ place }).where(and(eq(buildMembers.buildId, buildId), eq(buildMembers.userId, userId)));
}

/** Locks the build's row: membership changes (add, remove, hand over) go one at a time per build. */
export async function lockBuild(db: Db, buildId: string) {
  const [row] = await db.select().from(builds).where(eq(builds.id, buildId)).for('no key update');
  return row;
}

export async function insertBuildEvent(db: Db, values: typeof buildEvents.$inferInsert) {
  await db.insert(buildEvents).values(values);
}

/**
 * What is recorded on the build's travelers. With `lock`, its travelers are locked first: every write to
 * a part takes its traveler's lock, so no tick or finding lands between this count and the change.
 */
export async function buildWork(db: Db, buildId: string, lock = false): Promise<BuildWork> {
  if (lock) await db.select({ id: travelers.id }).from(travelers).where(eq(travelers.buildId, buildId)).for('update');
  const mine = db.select({ id: travelers.id }).from(travelers).where(eq(travelers.buildId, buildId));
  // One after another: inside a transaction they share one connection.
  const [h] = await db.select({ n: count() }).from(holes).where(and(inArray(holes.travelerId, mine), sql`${holes.status} <> 'pending'`));
  const [s] = await db.select({ n: count() }).from(travelerSteps).where(and(inArray(travelerSteps.travelerId, mine), isNotNull(travelerSteps.doneAt)));
  const [f] = await db.select({ n: count() }).from(findings).where(inArray(findings.travelerId, mine));
  const [t] = await db.select({ n: count() }).from(travelers).where(and(eq(travelers.buildId, buildId), isNotNull(travelers.signedOffAt)));
  const [e] = await db.select({ n: count() }).from(travelerEvents).where(inArray(travelerEvents.travelerId, mine));
  return { holesWorked: h.n, stepsDone: s.n, findings: f.n, signedOff: t.n, logEntries: e.n };
}

export async function findBuildRow(db: Db, buildId: string) {
  const [row] = await db.select().from(builds).where(eq(builds.id, buildId));
  return row;
}

export async function kitSerialTaken(db: Db, kitSerial: string, except: string) {
  const rows = await db.select({ id: builds.id }).from(builds).where(and(eq(builds.kitSerial, kitSerial), ne(builds.id, except)));
  return rows.length > 0;
}

/** The build's new serial, and its travelers' serials that were made from the old one (kit serial, dash, part). */
export async function renameBuildSerial(db: Db, buildId: string, from: string, to: string) {
  await db.update(builds).set({ kitSerial: to }).where(eq(builds.id, buildId));
  const parts = await db.select({ id: travelers.id, serial: travelers.serial }).from(travelers).where(eq(travelers.buildId, buildId));
  for (const p of parts) {
    if (p.serial.startsWith(`${from}-`)) await db.update(travelers).set({ serial: `${to}${p.serial.slice(from.length)}` }).where(eq(travelers.id, p.id));
  }
}

export async function setBuildNote(db: Db, buildId: string, note: string) {
  await db.update(builds).set({ note }).where(eq(builds.id, buildId));
}

/** The build with its travelers, people and events (cascades), and the invitations that would have joined it. */
export async function deleteBuild(db: Db, buildId: string) {
  await db.delete(invitations).where(and(eq(invitations.buildId, buildId), isNull(invitations.acceptedAt)));
  await db.delete(builds).where(eq(builds.id, buildId));
}
