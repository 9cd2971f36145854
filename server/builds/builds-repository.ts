import { and, asc, count, desc, eq, inArray, isNotNull, isNull, ne, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db';
import {
  buildEvents,
  buildMembers,
  builds,
  findings,
  holes,
  invitations,
  kitModels,
  organizations,
  partDesigns,
  travelerEvents,
  travelerSteps,
  travelers,
  users,
} from '../../db/schema';
import {
  holesDoneStatuses,
  openFindingStatuses,
  type BuildPlace,
  type BuildSummary,
  type BuildWork,
  type FabricationPartInput,
  type FabricationStep,
  type MemberPlace,
  type Page,
  type PageQuery,
} from '../../db/contracts';
import { afterKey, decodeCursor, pageOf } from '../pagination';
import { joinTravelerPart } from '../travelers/travelers-repository';
import { visibleBuilds } from './build-access';

const person = (role: 'builder' | 'inspector') => sql<{ id: string; name: string; email: string }[]>`coalesce((
  select json_agg(json_build_object('id', ${users.id}, 'name', ${users.name}, 'email', ${users.email}) order by ${users.name}, ${users.id})
  from ${buildMembers} join ${users} on ${users.id} = ${buildMembers.userId}
  where ${buildMembers.buildId} = ${builds.id} and ${buildMembers.role} = ${role}), '[]'::json)`;
const ofBuild = (from: SQL, extra?: SQL) =>
  sql<number>`(select count(*) from ${from} where ${travelers.buildId} = ${builds.id}${extra ? sql` and ${extra}` : sql``})`.mapWith(
    Number,
  );
const holesOfBuild = sql`${holes} join ${travelers} on ${travelers.id} = ${holes.travelerId}`;
const findingsOfBuild = sql`${findings} join ${travelers} on ${travelers.id} = ${findings.travelerId}`;

/**
 * Builds as the list shows them, their people and counts worked out by PostgreSQL in the same query (one
 * correlated subquery each, answered from the build's own rows), newest first and then by id.
 */
function buildSummaries(db: Db, where: SQL | undefined, limit: number) {
  return db
    .select({
      id: builds.id,
      kitSerial: builds.kitSerial,
      kitName: kitModels.name,
      supplierName: organizations.name,
      createdAt: sql<string>`${builds.createdAt}::text`,
      builders: person('builder'),
      inspectors: person('inspector'),
      travelerCount: ofBuild(sql`${travelers}`),
      holesTotal: ofBuild(holesOfBuild),
      holesDone: ofBuild(holesOfBuild, inArray(holes.status, [...holesDoneStatuses])),
      openFindings: ofBuild(findingsOfBuild, inArray(findings.status, [...openFindingStatuses])),
    })
    .from(builds)
    .innerJoin(kitModels, eq(kitModels.id, builds.kitModelId))
    .innerJoin(organizations, eq(organizations.id, builds.organizationId))
    .where(where)
    .orderBy(desc(builds.createdAt), desc(builds.id))
    .limit(limit);
}

type SummaryRow = Awaited<ReturnType<typeof buildSummaries>>[number];
/** The key is the column's own text (microseconds); the answer carries the ISO time every other date has. */
const serialise = (b: SummaryRow): BuildSummary => ({ ...b, createdAt: new Date(b.createdAt).toISOString() });

/** One build as the list shows it, when the reader may see it. */
export async function listVisibleBuilds(db: Db, user: Express.User, onlyId: string): Promise<BuildSummary[]> {
  return (await buildSummaries(db, and(visibleBuilds(db, user), eq(builds.id, onlyId)), 1)).map(serialise);
}

/** One page of the builds the reader may see, newest first (ties by id). */
export async function pageVisibleBuilds(db: Db, user: Express.User, q: PageQuery): Promise<Page<BuildSummary>> {
  const key = decodeCursor(q.cursor, ['string', 'string']);
  const rows = await buildSummaries(
    db,
    and(visibleBuilds(db, user), afterKey([builds.createdAt, builds.id], key, 'desc')),
    q.limit + 1,
  );
  const page = pageOf(rows, q.limit, (b) => [b.createdAt, b.id]);
  return { items: page.items.map(serialise), next: page.next };
}

/** The people of one build with their places, oldest first. */
export async function listBuildMembers(db: Db, buildId: string) {
  return db
    .select({
      userId: users.id,
      name: users.name,
      email: users.email,
      place: buildMembers.place,
      role: buildMembers.role,
      addedAt: buildMembers.addedAt,
    })
    .from(buildMembers)
    .innerJoin(users, eq(users.id, buildMembers.userId))
    .where(eq(buildMembers.buildId, buildId))
    .orderBy(asc(buildMembers.addedAt), asc(users.name));
}

export async function removeBuildMember(db: Db, buildId: string, userId: string) {
  await db.delete(buildMembers).where(and(eq(buildMembers.buildId, buildId), eq(buildMembers.userId, userId)));
}

export async function setMemberPlace(db: Db, buildId: string, userId: string, place: MemberPlace) {
  await db
    .update(buildMembers)
    .set({ place })
    .where(and(eq(buildMembers.buildId, buildId), eq(buildMembers.userId, userId)));
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
  const [h] = await db
    .select({ n: count() })
    .from(holes)
    .where(and(inArray(holes.travelerId, mine), sql`${holes.status} <> 'pending'`));
  const [s] = await db
    .select({ n: count() })
    .from(travelerSteps)
    .where(and(inArray(travelerSteps.travelerId, mine), isNotNull(travelerSteps.doneAt)));
  const [f] = await db.select({ n: count() }).from(findings).where(inArray(findings.travelerId, mine));
  const [t] = await db
    .select({ n: count() })
    .from(travelers)
    .where(and(eq(travelers.buildId, buildId), isNotNull(travelers.signedOffAt)));
  const [e] = await db.select({ n: count() }).from(travelerEvents).where(inArray(travelerEvents.travelerId, mine));
  return { holesWorked: h.n, stepsDone: s.n, findings: f.n, signedOff: t.n, logEntries: e.n };
}

export async function findBuildRow(db: Db, buildId: string) {
  const [row] = await db.select().from(builds).where(eq(builds.id, buildId));
  return row;
}

/** Whether a build (other than `except`, when given) has this kit serial. */
export async function kitSerialTaken(db: Db, kitSerial: string, except?: string) {
  const rows = await db
    .select({ id: builds.id })
    .from(builds)
    .where(and(eq(builds.kitSerial, kitSerial), except ? ne(builds.id, except) : undefined));
  return rows.length > 0;
}

/** A new build; its row. */
export async function insertBuild(db: Db, values: typeof builds.$inferInsert) {
  const [row] = await db.insert(builds).values(values).returning();
  return row;
}

/** The build's new serial, and its travelers' serials that were made from the old one (kit serial, dash, part). */
export async function renameBuildSerial(db: Db, buildId: string, from: string, to: string) {
  await db.update(builds).set({ kitSerial: to }).where(eq(builds.id, buildId));
  const parts = await db
    .select({ id: travelers.id, serial: travelers.serial })
    .from(travelers)
    .where(eq(travelers.buildId, buildId));
  for (const p of parts) {
    if (p.serial.startsWith(`${from}-`))
      await db
        .update(travelers)
        .set({ serial: `${to}${p.serial.slice(from.length)}` })
        .where(eq(travelers.id, p.id));
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

/**
 * Where the person stands towards one build, which decides what they may do on it: a builder or an
 * inspector by membership, the supplier's engineer of the kit's own organisation as design authority.
 * (The same rule as a column of a query that reads `builds`: placeColumn in build-access.ts.)
 */
export async function placeOnBuild(db: Db, user: Express.User, buildId: string): Promise<BuildPlace> {
  switch (user.role) {
    case 'supplier': {
      const [b] = await db.select({ organizationId: builds.organizationId }).from(builds).where(eq(builds.id, buildId));
      return b && user.organizationId && b.organizationId === user.organizationId ? 'design_authority' : 'none';
    }
    case 'builder':
    case 'inspector': {
      const [m] = await db
        .select({ role: buildMembers.role })
        .from(buildMembers)
        .where(
          and(eq(buildMembers.buildId, buildId), eq(buildMembers.userId, user.id), eq(buildMembers.role, user.role)),
        );
      return m ? m.role : 'none';
    }
    case 'admin':
      return 'none';
  }
}

/**
 * The steps of the build's live parts (a replaced part's work is not in the aircraft), as the
 * fabrication table reads them, part by part and in step order; only when the build is visible.
 */
export async function listFabricationSteps(db: Db, user: Express.User, buildId: string) {
  const rows = await joinTravelerPart(
    db
      .select({
        travelerId: travelers.id,
        serial: travelers.serial,
        partNumber: partDesigns.partNumber,
        partName: partDesigns.name,
        kind: travelerSteps.kind,
        done: sql<boolean>`${travelerSteps.doneAt} is not null`,
        by: travelerSteps.performer,
      })
      .from(travelers)
      .$dynamic(),
  )
    .leftJoin(travelerSteps, eq(travelerSteps.travelerId, travelers.id))
    .where(and(eq(travelers.buildId, buildId), isNull(travelers.replacedById), visibleBuilds(db, user)))
    .orderBy(asc(partDesigns.partNumber), asc(travelers.serial), asc(travelerSteps.seq));
  const parts = new Map<string, FabricationPartInput & { steps: FabricationStep[] }>();
  for (const r of rows) {
    let p = parts.get(r.travelerId);
    if (!p) {
      p = { travelerId: r.travelerId, serial: r.serial, partNumber: r.partNumber, partName: r.partName, steps: [] };
      parts.set(r.travelerId, p);
    }
    if (r.kind) p.steps.push({ kind: r.kind, done: r.done, by: r.by });
  }
  return [...parts.values()];
}
