import { and, asc, desc, eq, inArray, or, sql, type SQL } from 'drizzle-orm';
import type { SelectedFields } from 'drizzle-orm/pg-core';
import type { Db } from '../../db';
import {
  workRecorded,
  type ComplianceCounts,
  type ComplianceStatus,
  type MemberPlace,
  type PageQuery,
  type PartRecord,
} from '../../db/contracts';
import {
  buildEvents,
  buildMembers,
  builds,
  designRevisions,
  kitModels,
  noticeBuilds,
  noticeFiles,
  noticeMails,
  noticePhotos,
  notices,
  partDesigns,
  travelers,
  users,
} from '../../db/schema';
import { visibleBuilds } from '../builds/build-access';
import { afterKey, decodeCursor, pageOf } from '../pagination';
import { recordedColumn } from '../travelers/travelers-repository';

/**
 * The one rule of who sees a notice, as a condition on `notices`: its supplier, an admin, and the people
 * of a build it reached (the build seen through `visibleBuilds`).
 */
function visibleNotices(db: Db, user: Express.User): SQL {
  if (user.role === 'admin') return sql`true`;
  if (user.role === 'supplier')
    return user.organizationId ? eq(notices.organizationId, user.organizationId) : sql`false`;
  return sql`exists (select 1 from ${noticeBuilds} inner join ${builds} on ${builds.id} = ${noticeBuilds.buildId}
    where ${noticeBuilds.noticeId} = ${notices.id} and ${visibleBuilds(db, user)})`;
}

/** The answers of the builds the reader sees, as a condition on `notice_builds`. */
const visibleAnswers = (db: Db, user: Express.User) =>
  sql`exists (select 1 from ${builds} where ${builds.id} = ${noticeBuilds.buildId} and ${visibleBuilds(db, user)})`;

/** The supplier's kit model, or nothing when it is another's. */
export async function findOwnKitModel(db: Db, organizationId: string, id: string) {
  const [row] = await db
    .select({ id: kitModels.id, name: kitModels.name, code: kitModels.code })
    .from(kitModels)
    .where(and(eq(kitModels.id, id), eq(kitModels.organizationId, organizationId)));
  return row ?? null;
}

/** The kit's part designs with the letters of their revisions: what a notice may name. */
export async function listKitDesigns(db: Db, kitModelId: string) {
  return db
    .select({
      id: partDesigns.id,
      partNumber: partDesigns.partNumber,
      name: partDesigns.name,
      letters: sql<string[]>`(select coalesce(json_agg(r.letter order by r.letter), '[]'::json) from design_revisions r
        where r.part_design_id = part_designs.id and r.status <> 'draft')`,
    })
    .from(partDesigns)
    .where(eq(partDesigns.kitModelId, kitModelId));
}

/** The supplier's next notice number; the lock holds other issues of the same supplier until this one commits. */
export async function nextNoticeNumber(tx: Db, organizationId: string): Promise<number> {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${'notices:' + organizationId}))`);
  const [row] = await tx
    .select({ n: sql<number>`coalesce(max(${notices.number}), 0)::int + 1` })
    .from(notices)
    .where(eq(notices.organizationId, organizationId));
  return row.n;
}

export async function insertNotice(tx: Db, values: typeof notices.$inferInsert) {
  const [row] = await tx.insert(notices).values(values).returning({ id: notices.id, issuedAt: notices.issuedAt });
  return row;
}

export async function insertNoticeFiles(tx: Db, values: (typeof noticeFiles.$inferInsert)[]) {
  if (values.length) await tx.insert(noticeFiles).values(values);
}

/** The row's part's holes counted by status and its steps' state: with `recordedColumn`, its PartRecord. */
const holeCounts = sql<PartRecord['holes']>`(select coalesce(json_object_agg(x.status, x.n), '{}'::json)
  from (select h.status, count(*)::int as n from holes h where h.traveler_id = ${travelers.id} group by h.status) x)`;
const stepStates = sql<PartRecord['steps']>`(select coalesce(json_agg(json_build_object('done', s.done_at is not null,
  'stamped', s.stamped_at is not null)), '[]'::json) from traveler_steps s where s.traveler_id = ${travelers.id})`;

/**
 * Every build of the supplier's kit model with its live parts (a replaced part's replacement carries on),
 * each part with its design, revision and whether work is recorded on it: what effectivity picks from.
 */
export async function listBuildsForNotice(tx: Db, organizationId: string, kitModelId: string) {
  const rows = await tx
    .select({
      buildId: builds.id,
      kitSerial: builds.kitSerial,
      travelerId: travelers.id,
      serial: travelers.serial,
      partDesignId: designRevisions.partDesignId,
      letter: designRevisions.letter,
      holes: holeCounts,
      steps: stepStates,
      signedOffAt: travelers.signedOffAt,
      recorded: recordedColumn(travelers.id),
    })
    .from(builds)
    .leftJoin(travelers, and(eq(travelers.buildId, builds.id), sql`${travelers.replacedById} is null`))
    .leftJoin(designRevisions, eq(designRevisions.id, travelers.revisionId))
    .where(and(eq(builds.kitModelId, kitModelId), eq(builds.organizationId, organizationId)))
    .orderBy(asc(builds.kitSerial), asc(travelers.serial));
  const byBuild = new Map<
    string,
    {
      buildId: string;
      kitSerial: string;
      parts: { travelerId: string; partDesignId: string; letter: string; started: boolean }[];
    }
  >();
  for (const r of rows) {
    const b = byBuild.get(r.buildId) ?? { buildId: r.buildId, kitSerial: r.kitSerial, parts: [] };
    byBuild.set(r.buildId, b);
    if (!r.travelerId || !r.partDesignId || !r.letter) continue;
    // "Built or being built" is the one definition of a started part (workRecorded), as a move to a new revision reads it.
    const record = {
      holes: r.holes,
      steps: r.steps,
      signedOff: r.signedOffAt !== null,
      replaced: false,
      ...r.recorded,
    };
    b.parts.push({
      travelerId: r.travelerId,
      partDesignId: r.partDesignId,
      letter: r.letter,
      started: workRecorded(record).length > 0,
    });
  }
  return [...byBuild.values()];
}

export async function insertNoticeBuilds(tx: Db, values: (typeof noticeBuilds.$inferInsert)[]) {
  if (values.length) await tx.insert(noticeBuilds).values(values);
}

/** The members of these builds (each person once per build). */
export async function listMembersOfBuilds(tx: Db, buildIds: string[]) {
  if (!buildIds.length) return [];
  return tx
    .select({ buildId: buildMembers.buildId, userId: buildMembers.userId })
    .from(buildMembers)
    .innerJoin(users, eq(users.id, buildMembers.userId))
    .where(and(inArray(buildMembers.buildId, buildIds), eq(users.active, true)));
}

const countsColumn = (db: Db, user: Express.User) => sql<ComplianceCounts>`(select json_build_object(
    'builds', count(*)::int,
    'open', (count(*) filter (where ${noticeBuilds.status} = 'open'))::int,
    'acknowledged', (count(*) filter (where ${noticeBuilds.status} = 'acknowledged'))::int,
    'done', (count(*) filter (where ${noticeBuilds.status} = 'done'))::int,
    'not_applicable', (count(*) filter (where ${noticeBuilds.status} = 'not_applicable'))::int)
  from ${noticeBuilds} where ${noticeBuilds.noticeId} = ${notices.id} and ${visibleAnswers(db, user)})`;

const summaryColumns = (db: Db, user: Express.User) => ({
  id: notices.id,
  number: notices.number,
  title: notices.title,
  level: notices.level,
  kitModelId: notices.kitModelId,
  kitName: kitModels.name,
  issuedAt: sql<string>`${notices.issuedAt}::text`,
  issuedByName: users.name,
  counts: countsColumn(db, user),
});

/** Notices with their summary columns and `more`, beside the kit model and the issuer those columns read. */
const selectSummaries = <T extends SelectedFields>(db: Db, user: Express.User, more: T) =>
  db
    .select({ ...summaryColumns(db, user), ...more })
    .from(notices)
    .innerJoin(kitModels, eq(kitModels.id, notices.kitModelId))
    .innerJoin(users, eq(users.id, notices.issuedBy))
    .$dynamic();

/**
 * One page of the notices the reader sees, newest first: of a kit model, or those that reached one build
 * or one part (then each row carries that build's answer).
 */
export async function pageNotices(
  db: Db,
  user: Express.User,
  by: { kitModelId?: string; buildId?: string; travelerId?: string },
  q: PageQuery,
) {
  const key = decodeCursor(q.cursor, ['string', 'string']);
  const scoped = by.buildId || by.travelerId;
  const answerOn = scoped
    ? and(
        eq(noticeBuilds.noticeId, notices.id),
        by.buildId ? eq(noticeBuilds.buildId, by.buildId) : undefined,
        by.travelerId ? sql`${by.travelerId}::uuid = any(${noticeBuilds.travelerIds})` : undefined,
        visibleAnswers(db, user),
      )
    : sql`false`;
  const rows = await selectSummaries(db, user, {
    buildId: noticeBuilds.buildId,
    kitSerial: builds.kitSerial,
    status: noticeBuilds.status,
  })
    [scoped ? 'innerJoin' : 'leftJoin'](noticeBuilds, answerOn)
    .leftJoin(builds, eq(builds.id, noticeBuilds.buildId))
    .where(
      and(
        visibleNotices(db, user),
        by.kitModelId ? eq(notices.kitModelId, by.kitModelId) : undefined,
        afterKey([sql`${notices.issuedAt}::text`, notices.id], key, 'desc'),
      ),
    )
    .orderBy(desc(notices.issuedAt), desc(notices.id))
    .limit(q.limit + 1);
  return pageOf(rows, q.limit, (r) => [r.issuedAt, r.id]);
}

/** One notice the reader sees, with its summary columns and the stored effectivity. */
export async function findVisibleNotice(db: Db, user: Express.User, id: string) {
  const [row] = await selectSummaries(db, user, {
    organizationId: notices.organizationId,
    body: notices.body,
    serialFrom: notices.serialFrom,
    serialTo: notices.serialTo,
    parts: notices.parts,
    reaches: notices.reaches,
  }).where(and(eq(notices.id, id), visibleNotices(db, user)));
  return row ?? null;
}

export async function listNoticeFiles(db: Db, noticeId: string) {
  return db
    .select({ id: noticeFiles.id, kind: noticeFiles.kind, name: noticeFiles.name })
    .from(noticeFiles)
    .where(eq(noticeFiles.noticeId, noticeId))
    .orderBy(asc(noticeFiles.position));
}

export async function findDesignNames(db: Db, ids: string[]) {
  if (!ids.length) return [];
  return db
    .select({ id: partDesigns.id, partNumber: partDesigns.partNumber, name: partDesigns.name })
    .from(partDesigns)
    .where(inArray(partDesigns.id, ids));
}

/** The answers of the builds the reader sees (all of them for the supplier), by kit serial, with the reader's place on each. */
export async function listAnswers(db: Db, user: Express.User, noticeId: string, buildId?: string) {
  const acknowledger = sql<string | null>`(select u.name from users u where u.id = ${noticeBuilds.acknowledgedBy})`;
  const answerer = sql<string | null>`(select u.name from users u where u.id = ${noticeBuilds.answeredBy})`;
  return db
    .select({
      buildId: noticeBuilds.buildId,
      kitSerial: builds.kitSerial,
      status: noticeBuilds.status,
      acknowledgedAt: noticeBuilds.acknowledgedAt,
      acknowledgedByName: acknowledger,
      answeredAt: noticeBuilds.answeredAt,
      answeredByName: answerer,
      note: noticeBuilds.note,
      reason: noticeBuilds.reason,
      place: sql<MemberPlace | null>`(select m.place from build_members m where m.build_id = ${noticeBuilds.buildId}
        and m.user_id = ${user.id} and m.role::text = ${user.role})`,
      parts: sql<
        { travelerId: string; serial: string; partNumber: string; letter: string }[]
      >`(select coalesce(json_agg(
        json_build_object('travelerId', t.id, 'serial', t.serial, 'partNumber', d.part_number, 'letter', r.letter)
        order by t.serial), '[]'::json) from travelers t join design_revisions r on r.id = t.revision_id
        join part_designs d on d.id = r.part_design_id where t.id = any(${noticeBuilds.travelerIds}))`,
    })
    .from(noticeBuilds)
    .innerJoin(builds, eq(builds.id, noticeBuilds.buildId))
    .where(
      and(
        eq(noticeBuilds.noticeId, noticeId),
        buildId ? eq(noticeBuilds.buildId, buildId) : undefined,
        visibleBuilds(db, user),
      ),
    )
    .orderBy(asc(builds.kitSerial));
}

/** The answers' photos, oldest first. */
export async function listAnswerPhotos(db: Db, noticeId: string, buildIds: string[]) {
  if (!buildIds.length) return [];
  return db
    .select({ id: noticePhotos.id, buildId: noticePhotos.buildId })
    .from(noticePhotos)
    .where(and(eq(noticePhotos.noticeId, noticeId), inArray(noticePhotos.buildId, buildIds)))
    .orderBy(asc(noticePhotos.createdAt), asc(noticePhotos.id));
}

/** Locks one build's answer to a notice; with the notice's title and number for the log. */
export async function lockAnswer(tx: Db, noticeId: string, buildId: string) {
  const [row] = await tx
    .select({ status: noticeBuilds.status })
    .from(noticeBuilds)
    .where(and(eq(noticeBuilds.noticeId, noticeId), eq(noticeBuilds.buildId, buildId)))
    .for('update');
  return row ?? null;
}

export async function setAnswer(
  tx: Db,
  noticeId: string,
  buildId: string,
  values: Partial<typeof noticeBuilds.$inferInsert> & { status: ComplianceStatus },
) {
  await tx
    .update(noticeBuilds)
    .set(values)
    .where(and(eq(noticeBuilds.noticeId, noticeId), eq(noticeBuilds.buildId, buildId)));
}

/** A build's log entry about a notice; its id (photos of the answer hang on it). */
export async function insertNoticeEvent(tx: Db, values: typeof buildEvents.$inferInsert): Promise<string> {
  const [row] = await tx.insert(buildEvents).values(values).returning({ id: buildEvents.id });
  return row.id;
}

export async function insertNoticePhotos(tx: Db, values: (typeof noticePhotos.$inferInsert)[]) {
  if (values.length) await tx.insert(noticePhotos).values(values);
}

/** A notice's file or an answer's photo, with what the photo route needs to check the reader. */
export async function findNoticeFileRow(db: Db, id: string) {
  const [file] = await db
    .select({ noticeId: noticeFiles.noticeId, fileKey: noticeFiles.fileKey, thumbKey: noticeFiles.thumbKey })
    .from(noticeFiles)
    .where(eq(noticeFiles.id, id));
  if (file) return { ...file, buildId: null };
  const [photo] = await db
    .select({
      noticeId: noticePhotos.noticeId,
      buildId: noticePhotos.buildId,
      fileKey: noticePhotos.fileKey,
      thumbKey: noticePhotos.thumbKey,
    })
    .from(noticePhotos)
    .where(eq(noticePhotos.id, id));
  return photo ?? null;
}

/** Whether the reader sees the notice (and, for an answer's photo, that build). */
export async function noticeVisibleTo(db: Db, user: Express.User, noticeId: string, buildId: string | null) {
  if (buildId) {
    const [b] = await db
      .select({ id: builds.id })
      .from(builds)
      .where(and(eq(builds.id, buildId), visibleBuilds(db, user)));
    if (!b) return false;
  }
  const [n] = await db
    .select({ id: notices.id })
    .from(notices)
    .where(and(eq(notices.id, noticeId), visibleNotices(db, user)));
  return !!n;
}

/** Of these storage keys, those a notice file or answer photo points to (the photo sweep keeps them). */
export async function noticeKeysInUse(db: Db, keys: string[]): Promise<Set<string>> {
  const [files, photos] = await Promise.all([
    db
      .select({ a: noticeFiles.fileKey, b: noticeFiles.thumbKey })
      .from(noticeFiles)
      .where(or(inArray(noticeFiles.fileKey, keys), inArray(noticeFiles.thumbKey, keys))),
    db
      .select({ a: noticePhotos.fileKey, b: noticePhotos.thumbKey })
      .from(noticePhotos)
      .where(or(inArray(noticePhotos.fileKey, keys), inArray(noticePhotos.thumbKey, keys))),
  ]);
  return new Set([...files, ...photos].flatMap((r) => [r.a, r.b]).filter((k): k is string => !!k));
}

/** What one person's mail about a notice says: the notice and the builds of theirs it reached. */
export async function readNoticeMail(db: Db, noticeId: string, userId: string) {
  const [notice] = await db
    .select({
      number: notices.number,
      title: notices.title,
      level: notices.level,
      body: notices.body,
      kitName: kitModels.name,
      supplierName: sql<string>`(select o.name from organizations o where o.id = ${notices.organizationId})`,
    })
    .from(notices)
    .innerJoin(kitModels, eq(kitModels.id, notices.kitModelId))
    .where(eq(notices.id, noticeId));
  if (!notice) return null;
  const [person] = await db
    .select({ email: users.email, active: users.active })
    .from(users)
    .where(eq(users.id, userId));
  if (!person?.active) return null;
  // Only the builds the person is still on: someone taken off a build since is not mailed about it.
  const reached = await db
    .select({
      kitSerial: builds.kitSerial,
      parts: sql<string[]>`(select coalesce(array_agg(t.serial order by t.serial), '{}') from travelers t
        where t.id = any(${noticeBuilds.travelerIds}))`,
    })
    .from(noticeBuilds)
    .innerJoin(builds, eq(builds.id, noticeBuilds.buildId))
    .innerJoin(buildMembers, and(eq(buildMembers.buildId, builds.id), eq(buildMembers.userId, userId)))
    .where(eq(noticeBuilds.noticeId, noticeId))
    .orderBy(asc(builds.kitSerial));
  return reached.length ? { notice, to: person.email, reached } : null;
}

export async function noticeMailSent(db: Db, noticeId: string, userId: string) {
  const [row] = await db
    .select({ sentAt: noticeMails.sentAt })
    .from(noticeMails)
    .where(and(eq(noticeMails.noticeId, noticeId), eq(noticeMails.userId, userId)));
  return !!row;
}

export async function recordNoticeMail(db: Db, values: typeof noticeMails.$inferInsert) {
  await db.insert(noticeMails).values(values).onConflictDoNothing();
}

/** The photos of these answers' log entries (a build's `notice_answered` events), oldest first. */
export async function listNoticePhotosOfEvents(db: Db, eventIds: string[]) {
  if (eventIds.length === 0) return [];
  return db
    .select({ id: noticePhotos.id, eventId: noticePhotos.eventId, thumbKey: noticePhotos.thumbKey })
    .from(noticePhotos)
    .where(inArray(noticePhotos.eventId, eventIds))
    .orderBy(asc(noticePhotos.createdAt), asc(noticePhotos.id));
}

/** The most notices a printed summary lists (the log itself carries every entry). */
export const SUMMARY_NOTICES_MAX = 200;

/** The notices that reached one build the reader sees and its answer to each, oldest first: the printed summary's. */
export async function listBuildAnswers(db: Db, user: Express.User, buildId: string) {
  const rows = await db
    .select({
      number: notices.number,
      title: notices.title,
      level: notices.level,
      issuedAt: notices.issuedAt,
      status: noticeBuilds.status,
      answeredAt: noticeBuilds.answeredAt,
      answeredByName: sql<string | null>`(select u.name from users u where u.id = ${noticeBuilds.answeredBy})`,
      note: noticeBuilds.note,
      reason: noticeBuilds.reason,
      total: sql<number>`(count(*) over ())::int`,
    })
    .from(noticeBuilds)
    .innerJoin(notices, eq(notices.id, noticeBuilds.noticeId))
    .innerJoin(builds, eq(builds.id, noticeBuilds.buildId))
    .where(and(eq(noticeBuilds.buildId, buildId), visibleBuilds(db, user)))
    .orderBy(asc(notices.issuedAt), asc(notices.id))
    .limit(SUMMARY_NOTICES_MAX);
  return { rows: rows.map(({ total: _t, ...r }) => r), total: rows[0]?.total ?? 0 };
}
