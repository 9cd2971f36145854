import { and, asc, count, eq, ilike, inArray, isNotNull, isNull, ne, or, sql, type SQL } from 'drizzle-orm';
import { alias, type AnyPgColumn, type PgSelect } from 'drizzle-orm/pg-core';
import type { Db } from '../../db';
import {
  builds,
  designRevisions,
  findings,
  holes,
  kitModels,
  organizations,
  partDesigns,
  travelerEvents,
  travelerSteps,
  travelers,
  users,
  workPhotos,
  workSessions,
} from '../../db/schema';
import {
  holesAwaitingInspectorStatuses,
  holesDoneStatuses,
  openFindingStatuses,
  type Hole,
  type HoleStatus,
  stepCounts,
  type PartFacts,
  type PartRecord,
  type StepFact,
  type StepPerformer,
  type TravelerStepDetail,
  type TravelerSummary,
} from '../../db/contracts';
import { placeColumn, visibleBuilds } from '../builds/build-access';
import { preparedFor, viewerAsParams, type Viewer } from '../prepared';
import { afterKey } from '../pagination';
import { checkLayout } from '../designs/layout-check';
import { revisionMakeColumns } from '../designs/designs-repository';
import { newQrToken, newShortCode } from './codes';
import { placeHoles } from './hole-layout';
import type { BenchTime } from './device-time';

/** Live parts first, then by serial (kit serial and part number, a replacement right after its original), then id. */
const replacedRank = sql<boolean>`(${travelers.replacedById} is not null)`;

/** Filters of the travelers list, all applied in SQL. */
export type TravelerListFilter = {
  buildId?: string;
  id?: string;
  qrToken?: string;
  shortCode?: string;
  show?: 'open' | 'signed' | 'all';
  text?: string;
};

const likeText = (text: string) => `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

function listConditions(db: Db, user: Express.User, by: TravelerListFilter): SQL[] {
  const conditions: SQL[] = [visibleBuilds(db, user)];
  if (by.buildId) conditions.push(eq(travelers.buildId, by.buildId));
  if (by.id) conditions.push(eq(travelers.id, by.id));
  if (by.qrToken) conditions.push(eq(travelers.qrToken, by.qrToken));
  if (by.shortCode) conditions.push(eq(travelers.shortCode, by.shortCode));
  if (by.show === 'open') conditions.push(isNull(travelers.signedOffAt));
  if (by.show === 'signed') conditions.push(isNotNull(travelers.signedOffAt));
  if (by.text) {
    const like = likeText(by.text);
    conditions.push(
      or(
        ilike(partDesigns.partNumber, like),
        ilike(partDesigns.name, like),
        ilike(travelers.serial, like),
        ilike(travelers.shortCode, like),
        ilike(builds.kitSerial, like),
      )!,
    );
  }
  return conditions;
}

/** The open findings of the row's traveler, counted in the same statement. */
const openFindingsColumn = sql<number>`(select count(*)::int from ${findings} where ${findings.travelerId} = ${travelers.id}
  and ${inArray(findings.status, [...openFindingStatuses])})`;

/** The published letter of the part when the row's revision is superseded. */
const newerRevisionColumn = sql<string | null>`case when ${designRevisions.status} = 'superseded' then
  (select nr.letter from design_revisions nr where nr.part_design_id = ${partDesigns.id} and nr.status = 'published' limit 1) end`;

/**
 * Everything recorded on a part besides its holes and steps, counted by the database in one statement:
 * findings (open or closed), work sessions and work photos. The part's page and a move both read it.
 */
export const recordedColumn = (travelerId: SQL | AnyPgColumn | string) => sql<{
  findings: number;
  workSessions: number;
  workPhotos: number;
}>`json_build_object(
  'findings', (select count(*)::int from ${findings} where ${findings.travelerId} = ${travelerId}),
  'workSessions', (select count(*)::int from ${workSessions} where ${workSessions.travelerId} = ${travelerId}),
  'workPhotos', (select count(*)::int from ${workPhotos} where ${workPhotos.travelerId} = ${travelerId}))`;

/**
 * Joins a part's build, revision and design to a query that already reads `travelers`: the path from a
 * part to what it is and whose build it is on, which every list of parts, findings and bench events takes.
 */
export function joinTravelerPart<T extends PgSelect>(query: T) {
  return query
    .innerJoin(builds, eq(builds.id, travelers.buildId))
    .innerJoin(designRevisions, eq(designRevisions.id, travelers.revisionId))
    .innerJoin(partDesigns, eq(partDesigns.id, designRevisions.partDesignId));
}

/** The ids of the travelers the user may see, filtered: the inner query of a list. */
function pickIds(db: Db, user: Express.User, by: TravelerListFilter, after?: SQL) {
  return joinTravelerPart(db.select({ id: travelers.id }).from(travelers).$dynamic()).where(
    and(...listConditions(db, user, by), after),
  );
}

/**
 * Summaries of the travelers whose ids the inner query picks, every count done by the database for
 * those rows alone (a lateral count of holes, a counted subquery of open findings): one statement.
 */
function summaries(db: Db, picked: ReturnType<typeof pickIds>, order: 'list' | 'build') {
  const page = picked.as('page');
  const holeCounts = db
    .select({
      total: sql<number>`count(*)::int`.as('holes_total'),
      done: sql<number>`(count(*) filter (where ${inArray(holes.status, [...holesDoneStatuses])}))::int`.as(
        'holes_done',
      ),
      awaiting:
        sql<number>`(count(*) filter (where ${inArray(holes.status, [...holesAwaitingInspectorStatuses])}))::int`.as(
          'holes_awaiting',
        ),
    })
    .from(holes)
    .where(eq(holes.travelerId, travelers.id))
    .as('hole_counts');
  return joinTravelerPart(
    db
      .select({
        id: travelers.id,
        serial: travelers.serial,
        shortCode: travelers.shortCode,
        buildId: travelers.buildId,
        kitSerial: builds.kitSerial,
        partNumber: partDesigns.partNumber,
        partName: partDesigns.name,
        kind: partDesigns.kind,
        letter: designRevisions.letter,
        signedOffAt: travelers.signedOffAt,
        replacedById: travelers.replacedById,
        replacedReason: travelers.replacedReason,
        replacesId: travelers.replacesId,
        holesTotal: holeCounts.total,
        holesDone: holeCounts.done,
        holesAwaitingInspector: holeCounts.awaiting,
        openFindings: openFindingsColumn,
        newerRevision: newerRevisionColumn,
      })
      .from(page)
      .innerJoin(travelers, eq(travelers.id, page.id))
      .$dynamic(),
  )
    .leftJoinLateral(holeCounts, sql`true`)
    .orderBy(
      ...(order === 'list'
        ? [asc(replacedRank), asc(travelers.serial), asc(travelers.id)]
        : [asc(builds.kitSerial), asc(partDesigns.partNumber), asc(travelers.createdAt), asc(travelers.id)]),
    );
}

type SummaryRow = Awaited<ReturnType<typeof summaries>>[number];

function toSummary({ signedOffAt, replacedById, replacedReason, replacesId, ...t }: SummaryRow): TravelerSummary {
  return {
    ...t,
    holesTotal: t.holesTotal ?? 0,
    holesDone: t.holesDone ?? 0,
    holesAwaitingInspector: t.holesAwaitingInspector ?? 0,
    signedOff: signedOffAt !== null,
    replaced: replacedById ? { byId: replacedById, reason: replacedReason! } : null,
    replacesId,
  };
}

/** Travelers the user may see, with progress; `by` narrows further (one build, one traveler, a code). Unpaged: for one build or one part. */
export async function listTravelers(
  db: Db,
  user: Express.User,
  by: TravelerListFilter = {},
): Promise<TravelerSummary[]> {
  return (await summaries(db, pickIds(db, user, by), 'build')).map(toSummary);
}

/** Where a page of the travelers list starts: after [replaced 0/1, serial, id] of the last row shown. */
export type TravelerCursor = readonly [number, string, string];

/**
 * One page of the travelers the user may see, live parts first, then by serial and id. The inner query
 * picks the page's ids alone (visibility, filters, keyset, limit + 1), which an index on the order
 * answers without reading the rest; only those rows are then counted and joined.
 */
export async function listTravelerPage(
  db: Db,
  user: Express.User,
  by: TravelerListFilter,
  after: TravelerCursor | null,
  limit: number,
) {
  const key = after ? ([after[0] === 1 ? 'true' : 'false', after[1], after[2]] as const) : null;
  const ids = pickIds(db, user, by, afterKey([replacedRank, travelers.serial, travelers.id], key, 'asc'))
    .orderBy(asc(replacedRank), asc(travelers.serial), asc(travelers.id))
    .limit(limit + 1);
  return (await summaries(db, ids, 'list')).map(toSummary);
}

/**
 * Everything the part's page shows, in one statement: the part and its revision, design and kit; the
 * reader's place on its build; progress counted; who approved and signed; the parts it replaced or
 * was replaced by; its holes and steps as JSON. Visibility is part of the condition: nothing, not 403.
 */
export async function readTravelerPage(db: Db, user: Express.User, id: string) {
  const { shape, viewer, params } = viewerAsParams(user);
  const statement = preparedFor(db, `traveler_page_${shape}`, (name) => travelerPageQuery(db, viewer).prepare(name));
  const [row] = await statement.execute({ ...params, id });
  return row;
}

function travelerPageQuery(db: Db, user: Viewer) {
  return joinTravelerPart(
    db
      .select({
        traveler: travelers,
        // The revision's own columns the page shows, not its study basis (which can be large).
        revision: {
          ...revisionMakeColumns,
          publishedBy: designRevisions.publishedBy,
        },
        design: { partNumber: partDesigns.partNumber, name: partDesigns.name, kind: partDesigns.kind },
        kit: { airfoil: kitModels.airfoil },
        kitSerial: builds.kitSerial,
        place: placeColumn(user),
        openFindings: openFindingsColumn,
        newerRevision: newerRevisionColumn,
        recorded: recordedColumn(travelers.id),
        approvedByName: sql<string | null>`(select u.name from users u where u.id = ${designRevisions.publishedBy})`,
        signedOffByName: sql<string | null>`(select u.name from users u where u.id = ${travelers.signedOffBy})`,
        replacedBySerial: sql<string | null>`(select r.serial from travelers r where r.id = ${travelers.replacedById})`,
        replacesSerial: sql<string | null>`(select r.serial from travelers r where r.id = ${travelers.replacesId})`,
        holes: sql<
          Hole[]
        >`(select coalesce(json_agg(json_build_object('holeId', h.hole_id, 'line', h.line, 'seq', h.seq,
      'stationIn', h.station_in, 'status', h.status) order by h.line, h.seq), '[]'::json) from holes h where h.traveler_id = ${travelers.id})`,
        steps: sql<TravelerStepDetail[]>`(select coalesce(json_agg(json_build_object(
      'id', s.id, 'seq', s.seq, 'text', s.text, 'kind', s.kind, 'inspectionPoint', s.inspection_point,
      'doneAt', s.done_at, 'doneByName', u.name, 'by', s.performer, 'byName', s.performer_name,
      'stampedAt', s.stamped_at, 'stampedByName', st.name) order by s.seq), '[]'::json)
      from traveler_steps s left join users u on u.id = s.done_by left join users st on st.id = s.stamped_by
      where s.traveler_id = ${travelers.id})`,
      })
      .from(travelers)
      .$dynamic(),
  )
    .innerJoin(kitModels, eq(kitModels.id, partDesigns.kitModelId))
    .where(and(eq(travelers.id, sql.placeholder('id')), visibleBuilds(db, user)));
}

/**
 * Takes the row lock of a part the user may see, with their place on its build (null: not theirs).
 * The lock comes first and alone: what the rules count is read after it, in a statement of its own,
 * so it sees every write that held the lock before.
 */
export async function lockVisibleTraveler(tx: Db, user: Express.User, id: string) {
  const { shape, viewer, params } = viewerAsParams(user);
  // Prepared on the unit of work's connection (db/index.ts keeps one client per connection): every bench write starts here.
  const statement = preparedFor(tx, `traveler_lock_${shape}`, (name) =>
    tx
      .select({ traveler: travelers, place: placeColumn(viewer) })
      .from(travelers)
      .innerJoin(builds, eq(builds.id, travelers.buildId))
      .where(and(eq(travelers.id, sql.placeholder('id')), visibleBuilds(tx, viewer)))
      .for('no key update', { of: travelers })
      .prepare(name),
  );
  const [row] = await statement.execute({ ...params, id });
  return row;
}

export async function findTravelerParts(db: Db, id: string) {
  const [row] = await db
    .select({ traveler: travelers, revision: designRevisions, design: partDesigns, kit: kitModels })
    .from(travelers)
    .innerJoin(designRevisions, eq(designRevisions.id, travelers.revisionId))
    .innerJoin(partDesigns, eq(partDesigns.id, designRevisions.partDesignId))
    .innerJoin(kitModels, eq(kitModels.id, partDesigns.kitModelId))
    .where(eq(travelers.id, id));
  return row;
}

/**
 * Takes the traveler's row lock. Every write to a part (ticks, steps, findings, sign-off, replacement)
 * takes it first, so each sees the part as the one before it left it: a sign-off cannot pass its
 * checks while a tick, an undone step or a new finding is half-written, and no two writers deadlock.
 */
export async function lockTraveler(tx: Db, id: string) {
  const [row] = await tx.select().from(travelers).where(eq(travelers.id, id)).for('no key update');
  return row;
}

/**
 * What the part rules read, counted by the database in one statement (call it with the traveler locked);
 * with `holeIds`, those holes of the part as they stand, for a tick to check.
 */
export async function readPartFacts(
  tx: Db,
  t: typeof travelers.$inferSelect,
  holeIds?: string[],
): Promise<PartFacts & { picked: Hole[]; steps: StepFact[] }> {
  const picked = holeIds?.length
    ? sql`(select coalesce(json_agg(json_build_object('holeId', h.hole_id, 'line', h.line, 'seq', h.seq, 'stationIn', h.station_in, 'status', h.status)), '[]'::json)
        from holes h where h.traveler_id = ${t.id} and h.hole_id in ${holeIds})`
    : sql`'[]'::json`;
  const res = await tx.execute(sql`select
    (select coalesce(json_object_agg(c.status, c.n), '{}'::json)
      from (select status, count(*)::int as n from holes where traveler_id = ${t.id} group by status) c) as holes,
    (select coalesce(json_agg(json_build_object('id', s.id, 'seq', s.seq, 'inspectionPoint', s.inspection_point,
      'done', s.done_at is not null, 'stamped', s.stamped_at is not null) order by s.seq), '[]'::json)
      from traveler_steps s where s.traveler_id = ${t.id}) as steps,
    (select count(*)::int from findings where traveler_id = ${t.id} and ${inArray(findings.status, [...openFindingStatuses])}) as "openFindings",
    ${picked} as picked`);
  const row = res.rows[0] as {
    holes: Partial<Record<HoleStatus, number>>;
    steps: StepFact[];
    openFindings: number;
    picked: Hole[];
  };
  return {
    holes: row.holes,
    steps: row.steps,
    ...stepCounts(row.steps),
    openFindings: row.openFindings,
    signedOff: t.signedOffAt !== null,
    replaced: t.replacedById !== null,
    picked: row.picked,
  };
}

/**
 * Sets holes of a part from one status to another and writes the bench event, in one statement; the
 * event only when some hole changed. Returns the holes changed.
 */
export async function setHolesWithEvent(
  tx: Db,
  travelerId: string,
  actorId: string,
  holeIds: string[],
  from: HoleStatus,
  to: HoleStatus,
  when: BenchTime,
): Promise<Hole[]> {
  const doneAt = when.doneAt ? when.doneAt.toISOString() : null;
  const res = await tx.execute(sql`with changed as (
      update holes set status = ${to}, updated_by = ${actorId}, updated_at = now()
      where traveler_id = ${travelerId} and hole_id in ${holeIds} and status = ${from}
      returning hole_id, line, seq, station_in, status),
    arrived as (select clock_timestamp() as at),
    event as (
      insert into traveler_events (traveler_id, actor_id, created_at, done_at, clock_offset_ms, kind, detail)
      select ${travelerId}::uuid, ${actorId}::uuid, arrived.at, coalesce(${doneAt}::timestamptz, arrived.at),
        ${when.clockOffsetMs}::integer, ${`holes_${to}`}, jsonb_build_object('holeIds', jsonb_agg(hole_id))
      from changed, arrived group by arrived.at having count(*) > 0)
    select hole_id as "holeId", line, seq, station_in as "stationIn", status from changed`);
  return res.rows as Hole[];
}

/** A short code no traveler has yet: collisions are rare (one in hundreds of millions) but not impossible. */
async function freeShortCode(tx: Db): Promise<string> {
  for (let attempt = 0; attempt < 8; attempt++) {
    const code = newShortCode();
    const taken = await tx.select({ id: travelers.id }).from(travelers).where(eq(travelers.shortCode, code));
    if (!taken.length) return code;
  }
  throw new Error('could not find a free short code in 8 tries');
}

/** Holes go in batches: one insert per batch keeps under the driver's limit of 65535 parameters. */
const HOLE_BATCH = 2000;

/**
 * A traveler made from a published revision: its own serial, QR token and short code, its holes placed
 * from the schedule and its steps. Shipping a kit and replacing a scrapped part both make them here.
 */
export async function insertTraveler(
  tx: Db,
  t: { buildId: string; serial: string; revision: typeof designRevisions.$inferSelect; replacesId?: string },
) {
  const [traveler] = await tx
    .insert(travelers)
    .values({
      buildId: t.buildId,
      revisionId: t.revision.id,
      serial: t.serial,
      qrToken: newQrToken(),
      shortCode: await freeShortCode(tx),
      replacesId: t.replacesId ?? null,
    })
    .returning();
  await insertHolesAndSteps(tx, traveler.id, t.revision);
  return traveler;
}

/**
 * A part's holes placed from the revision's schedule and its steps, as every traveler gets them: a new
 * part, and a part moved to a newer revision before work on it started. Returns how many holes.
 */
async function insertHolesAndSteps(tx: Db, travelerId: string, revision: typeof designRevisions.$inferSelect) {
  const minPitch = checkLayout(revision);
  const placed = revision.lines.flatMap((line) => placeHoles(line, revision.edgeDistanceIn, minPitch));
  for (let i = 0; i < placed.length; i += HOLE_BATCH) {
    await tx.insert(holes).values(placed.slice(i, i + HOLE_BATCH).map((h) => ({ ...h, travelerId })));
  }
  if (revision.steps.length) {
    await tx.insert(travelerSteps).values(
      revision.steps.map((s, i) => ({
        travelerId,
        seq: i + 1,
        text: s.text,
        kind: s.kind,
        inspectionPoint: s.inspectionPoint,
      })),
    );
  }
  return placed.length;
}

/**
 * Moves a part (locked, nothing recorded on it: the caller has checked) to another revision: its holes
 * and steps are made again from that revision exactly as a new part's. Returns how many holes it has now.
 */
export async function remakeFromRevision(tx: Db, travelerId: string, revision: typeof designRevisions.$inferSelect) {
  await tx.delete(holes).where(eq(holes.travelerId, travelerId));
  await tx.delete(travelerSteps).where(eq(travelerSteps.travelerId, travelerId));
  await tx.update(travelers).set({ revisionId: revision.id }).where(eq(travelers.id, travelerId));
  return insertHolesAndSteps(tx, travelerId, revision);
}

/**
 * The part's revision letter and its design's published revision when that is another (newer) one, in
 * one statement: what a move to the newest revision reads, with the part locked.
 */
export async function readRevisionStanding(tx: Db, revisionId: string) {
  const newest = alias(designRevisions, 'newest');
  const [row] = await tx
    .select({ letter: designRevisions.letter, newest })
    .from(designRevisions)
    .leftJoin(
      newest,
      and(
        eq(newest.partDesignId, designRevisions.partDesignId),
        eq(newest.status, 'published'),
        ne(newest.id, designRevisions.id),
      ),
    )
    .where(eq(designRevisions.id, revisionId));
  return row;
}

/** What the revision-move rule reads of a locked part: its facts (readPartFacts) and what else is recorded. */
export async function readPartRecord(tx: Db, t: typeof travelers.$inferSelect): Promise<PartRecord> {
  const { holes, steps, signedOff, replaced } = await readPartFacts(tx, t);
  const res = await tx.execute(sql`select ${recordedColumn(t.id)} as recorded`);
  const { recorded } = res.rows[0] as { recorded: Omit<PartRecord, keyof PartFacts | 'steps'> };
  return { holes, steps, signedOff, replaced, ...recorded };
}

/** The revision a replacement part is made to: the part's current published one, else the one it had. */
export async function currentRevisionOf(tx: Db, revisionId: string) {
  const [old] = await tx.select().from(designRevisions).where(eq(designRevisions.id, revisionId));
  const [published] = await tx
    .select()
    .from(designRevisions)
    .where(and(eq(designRevisions.partDesignId, old.partDesignId), eq(designRevisions.status, 'published')));
  return published ?? old;
}

/** Replacement serials: <serial>-R1, -R2… counted along the chain of parts it replaces. */
export async function replacementSerial(tx: Db, t: typeof travelers.$inferSelect): Promise<string> {
  // Only a replacement carries an -R suffix of ours; a part number may end in R1 of its own.
  const base = t.replacesId ? t.serial.replace(/-R\d+$/, '') : t.serial;
  const [{ n }] = await tx
    .select({ n: count() })
    .from(travelers)
    .where(sql`${travelers.serial} like ${`${base}-R%`}`);
  return `${base}-R${n + 1}`;
}

/** What a QR label prints, for one part or a whole build (the caller has checked who may print). */
export async function listLabelRows(db: Db, by: { buildId: string } | { travelerId: string }) {
  return joinTravelerPart(
    db
      .select({
        travelerId: travelers.id,
        serial: travelers.serial,
        shortCode: travelers.shortCode,
        qrToken: travelers.qrToken,
        partNumber: partDesigns.partNumber,
        partName: partDesigns.name,
        letter: designRevisions.letter,
        kitModelCode: kitModels.code,
        kitModelName: kitModels.name,
        supplierName: organizations.name,
        kitSerial: builds.kitSerial,
      })
      .from(travelers)
      .$dynamic(),
  )
    .innerJoin(kitModels, eq(kitModels.id, partDesigns.kitModelId))
    .innerJoin(organizations, eq(organizations.id, kitModels.organizationId))
    .where('buildId' in by ? eq(travelers.buildId, by.buildId) : eq(travelers.id, by.travelerId))
    .orderBy(asc(partDesigns.partNumber), asc(travelers.serial));
}

/** Clears a part's sign-off (the withdrawal's event keeps who signed and when). */
export async function clearSignOff(tx: Db, id: string) {
  await tx.update(travelers).set({ signedOffAt: null, signedOffBy: null }).where(eq(travelers.id, id));
}

/** Marks a step of the part done by the person (or, with null, not done); undefined when the part has no such step. */
/**
 * A step recorded done by a builder (at the device's time when it sent one, else now), with who did the
 * work; or undone (null).
 */
export async function setStepDone(
  tx: Db,
  travelerId: string,
  stepId: string,
  done: { recordedBy: string; at: Date | null; performer: StepPerformer; performerName: string | null } | null,
) {
  const [step] = await tx
    .update(travelerSteps)
    .set(
      done
        ? {
            doneAt: done.at ?? new Date(),
            doneBy: done.recordedBy,
            performer: done.performer,
            performerName: done.performerName,
          }
        : { doneAt: null, doneBy: null, performer: null, performerName: null },
    )
    .where(and(eq(travelerSteps.id, stepId), eq(travelerSteps.travelerId, travelerId)))
    .returning();
  return step;
}

/** An inspector's stamp on an inspection point. */
export async function stampStep(tx: Db, travelerId: string, stepId: string, inspectorId: string) {
  const [step] = await tx
    .update(travelerSteps)
    .set({ stampedAt: new Date(), stampedBy: inspectorId })
    .where(and(eq(travelerSteps.id, stepId), eq(travelerSteps.travelerId, travelerId)))
    .returning();
  return step;
}

/** Signs the part off in the person's name. */
export async function signOffTraveler(tx: Db, id: string, userId: string) {
  await tx.update(travelers).set({ signedOffAt: new Date(), signedOffBy: userId }).where(eq(travelers.id, id));
}

/**
 * A bench event of the part, stamped the moment it is written, under the part's lock. The column's
 * default is the transaction's start, which puts a write that waited for the lock before the one it waited for.
 * Done then too, unless the device said when it was done.
 */
export async function insertTravelerEvent(
  tx: Db,
  values: Omit<typeof travelerEvents.$inferInsert, 'createdAt' | 'doneAt'> & { doneAt?: Date | null },
) {
  const now = sql`clock_timestamp()`;
  const [row] = await tx
    .insert(travelerEvents)
    .values({ ...values, createdAt: now, doneAt: values.doneAt ?? now })
    .returning({ id: travelerEvents.id });
  return row.id;
}

/** A person's name (a withdrawn sign-off's log entry keeps who had signed). */
export async function findUserName(db: Db, id: string): Promise<string | null> {
  const [row] = await db.select({ name: users.name }).from(users).where(eq(users.id, id));
  return row?.name ?? null;
}
