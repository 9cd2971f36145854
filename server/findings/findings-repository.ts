import { and, asc, desc, eq, inArray, or, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db';
import {
  buildMembers,
  builds,
  designRevisions,
  findingEvents,
  findingPhotos,
  findings,
  holes,
  partDesigns,
  sentMails,
  travelerEvents,
  travelers,
  users,
} from '../../db/schema';
import { openFindingStatuses, type FindingStatus, type HoleStatus, type MailAudience } from '../../db/contracts';
import { visibleBuilds } from '../builds/build-access';
import { joinTravelerPart } from '../travelers/travelers-repository';
import { afterKey } from '../pagination';
import { preparedFor, viewerAsParams, type Viewer } from '../prepared';

export type FindingFilter = { id?: string; travelerId?: string; buildId?: string; status?: FindingStatus | 'open' };

/** A status filter as a condition: "open" is written as `status <> 'closed'`, the very predicate of the partial index `findings_open_created`. */
function statusCondition(status: FindingFilter['status']): SQL | undefined {
  // A literal, not a bound value, so the planner can match it to the index's predicate in any plan.
  if (status === 'open') return sql`${findings.status} <> 'closed'`;
  return status ? eq(findings.status, status) : undefined;
}

/**
 * One finding (or a few) with all its photos, for the detail and the photo check. Not for lists:
 * a list reads its pages through `listFindingPage`.
 */
export async function listFindingRows(db: Db, user: Express.User, filter: FindingFilter) {
  const conditions: SQL[] = [visibleBuilds(db, user)];
  if (filter.id) conditions.push(eq(findings.id, filter.id));
  if (filter.travelerId) conditions.push(eq(findings.travelerId, filter.travelerId));
  if (filter.buildId) conditions.push(eq(travelers.buildId, filter.buildId));
  const byStatus = statusCondition(filter.status);
  if (byStatus) conditions.push(byStatus);
  const rows = await joinTravelerPart(
    db
      .select({
        id: findings.id,
        travelerId: findings.travelerId,
        serial: travelers.serial,
        partNumber: partDesigns.partNumber,
        kitSerial: builds.kitSerial,
        buildId: builds.id,
        holeIds: findings.holeIds,
        kind: findings.kind,
        status: findings.status,
        disposition: findings.disposition,
        closure: findings.closure,
        raisedByName: users.name,
        createdAt: findings.createdAt,
        updatedAt: findings.updatedAt,
        note: findings.note,
        dispositionNote: findings.dispositionNote,
        measurements: findings.measurements,
        repair: findings.repair,
        workReportedAt: findings.workReportedAt,
        signedOffAt: travelers.signedOffAt,
        replacedById: travelers.replacedById,
      })
      .from(findings)
      .innerJoin(travelers, eq(travelers.id, findings.travelerId))
      .$dynamic(),
  )
    .innerJoin(users, eq(users.id, findings.raisedBy))
    .where(and(...conditions))
    .orderBy(desc(findings.createdAt));
  const photos =
    rows.length === 0
      ? []
      : await db
          .select()
          .from(findingPhotos)
          .where(
            inArray(
              findingPhotos.findingId,
              rows.map((r) => r.id),
            ),
          )
          .orderBy(asc(findingPhotos.createdAt), asc(findingPhotos.id));
  return rows.map((r) => ({ ...r, photos: photos.filter((p) => p.findingId === r.id) }));
}
export type FindingRow = Awaited<ReturnType<typeof listFindingRows>>[number];

export type FindingOrder = 'newest' | 'oldest';

/**
 * One page of findings in one statement. The inner query picks the page's rows (visibility, filters,
 * keyset, limit) from findings, travelers and builds, so an index on the sort key can stop after
 * `limit + 1` rows; only those rows are then joined to their part, raiser and photos (a lateral count
 * and first photo per row, served by `finding_photos_finding`).
 * `after` is [created_at as PostgreSQL's text, id] of the last row shown; `limit` null reads every row (one traveler's).
 */
export async function listFindingPage(
  db: Db,
  user: Express.User,
  filter: Omit<FindingFilter, 'id'>,
  order: FindingOrder,
  after: readonly [string, string] | null,
  limit: number | null,
) {
  const { shape: viewerShape, viewer, params } = viewerAsParams(user);
  // Every part of the SQL that a request can change, spelled out: the statement is prepared once per shape.
  const shape = [
    viewerShape,
    filter.travelerId ? 't' : '',
    filter.buildId ? 'b' : '',
    filter.status === 'open' ? 'o' : filter.status ? 's' : '',
    order === 'oldest' ? 'a' : 'd',
    after ? 'k' : '',
    limit === null ? '' : 'l',
  ].join('');
  const statement = preparedFor(db, `finding_page_${shape}`, (name) =>
    findingPageQuery(db, viewer, {
      travelerId: !!filter.travelerId,
      buildId: !!filter.buildId,
      status: filter.status === 'open' ? 'open' : filter.status ? 'one' : null,
      order,
      after: !!after,
      limit: limit !== null,
    }).prepare(name),
  );
  return statement.execute({
    ...params,
    travelerId: filter.travelerId,
    buildId: filter.buildId,
    status: filter.status,
    afterAt: after?.[0],
    afterId: after?.[1],
    limit: limit === null ? undefined : limit + 1,
  });
}
export type FindingPageRow = Awaited<ReturnType<typeof listFindingPage>>[number];

/** The page's statement for one shape: which filters it has (their values are placeholders), its order, keyset and limit. */
function findingPageQuery(
  db: Db,
  user: Viewer,
  has: {
    travelerId: boolean;
    buildId: boolean;
    status: 'open' | 'one' | null;
    order: FindingOrder;
    after: boolean;
    limit: boolean;
  },
) {
  const dir = has.order === 'oldest' ? 'asc' : 'desc';
  const by = dir === 'asc' ? asc : desc;
  const conditions: (SQL | undefined)[] = [
    visibleBuilds(db, user),
    has.travelerId ? eq(findings.travelerId, sql.placeholder('travelerId')) : undefined,
    has.buildId ? eq(travelers.buildId, sql.placeholder('buildId')) : undefined,
    has.status === 'open'
      ? statusCondition('open')
      : has.status
        ? eq(findings.status, sql.placeholder('status'))
        : undefined,
    afterKey(
      [findings.createdAt, findings.id],
      has.after ? [sql.placeholder('afterAt'), sql.placeholder('afterId')] : null,
      dir,
    ),
  ];
  // The page's rows carry every column the list shows from findings, travelers and builds: those rows are
  // read by then, and joining findings again by id would let the planner scan the whole table to do it.
  const keys = db
    .select({
      at: sql<string>`${findings.createdAt}::text`.as('at'),
      id: findings.id,
      travelerId: findings.travelerId,
      holeIds: findings.holeIds,
      kind: findings.kind,
      status: findings.status,
      disposition: findings.disposition,
      closure: findings.closure,
      raisedBy: findings.raisedBy,
      createdAt: findings.createdAt,
      updatedAt: findings.updatedAt,
      serial: travelers.serial,
      revisionId: travelers.revisionId,
      buildId: travelers.buildId,
      kitSerial: builds.kitSerial,
    })
    .from(findings)
    .innerJoin(travelers, eq(travelers.id, findings.travelerId))
    .innerJoin(builds, eq(builds.id, travelers.buildId))
    .where(and(...conditions))
    .orderBy(by(findings.createdAt), by(findings.id))
    .$dynamic();
  const page = (has.limit ? keys.limit(sql.placeholder('limit')) : keys).as('page');
  const photos = db
    .select({
      count: sql<number>`count(*)::int`.as('photo_count'),
      firstId: sql<
        string | null
      >`(array_agg(${findingPhotos.id} order by ${findingPhotos.createdAt}, ${findingPhotos.id}))[1]`.as(
        'first_photo_id',
      ),
    })
    .from(findingPhotos)
    .where(eq(findingPhotos.findingId, page.id))
    .as('photos');
  return db
    .select({
      at: page.at,
      id: page.id,
      travelerId: page.travelerId,
      serial: page.serial,
      partNumber: partDesigns.partNumber,
      kitSerial: page.kitSerial,
      buildId: page.buildId,
      holeIds: page.holeIds,
      kind: page.kind,
      status: page.status,
      disposition: page.disposition,
      closure: page.closure,
      raisedByName: users.name,
      createdAt: page.createdAt,
      updatedAt: page.updatedAt,
      photoCount: photos.count,
      firstPhotoId: photos.firstId,
    })
    .from(page)
    .innerJoin(designRevisions, eq(designRevisions.id, page.revisionId))
    .innerJoin(partDesigns, eq(partDesigns.id, designRevisions.partDesignId))
    .innerJoin(users, eq(users.id, page.raisedBy))
    .leftJoinLateral(photos, sql`true`)
    .orderBy(by(page.createdAt), by(page.id));
}

export const listEvents = (db: Db, findingId: string) =>
  db
    .select({
      id: findingEvents.id,
      action: findingEvents.action,
      actorName: users.name,
      actorPlace: findingEvents.actorPlace,
      fromStatus: findingEvents.fromStatus,
      toStatus: findingEvents.toStatus,
      disposition: findingEvents.disposition,
      note: findingEvents.note,
      createdAt: findingEvents.createdAt,
    })
    .from(findingEvents)
    .innerJoin(users, eq(users.id, findingEvents.actorId))
    .where(eq(findingEvents.findingId, findingId))
    .orderBy(asc(findingEvents.createdAt));

/** The finding as it stands now, read inside the unit of work that holds its traveler's lock. */
export async function findFinding(tx: Db, id: string) {
  const [row] = await tx.select().from(findings).where(eq(findings.id, id));
  return row;
}

export const openFindingsOf = (tx: Db, travelerId: string) =>
  tx
    .select()
    .from(findings)
    .where(and(eq(findings.travelerId, travelerId), inArray(findings.status, [...openFindingStatuses])));

export const holesOf = (tx: Db, travelerId: string, holeIds?: string[]) =>
  tx
    .select()
    .from(holes)
    .where(
      holeIds
        ? and(eq(holes.travelerId, travelerId), inArray(holes.holeId, holeIds))
        : eq(holes.travelerId, travelerId),
    )
    .orderBy(asc(holes.line), asc(holes.seq));

export async function setHoleStatus(tx: Db, travelerId: string, holeIds: string[], status: HoleStatus, userId: string) {
  if (!holeIds.length) return;
  await tx
    .update(holes)
    .set({ status, updatedBy: userId, updatedAt: new Date() })
    .where(and(eq(holes.travelerId, travelerId), inArray(holes.holeId, holeIds)));
}

export async function insertFinding(tx: Db, values: typeof findings.$inferInsert) {
  const [row] = await tx.insert(findings).values(values).returning();
  return row;
}

export async function updateFinding(tx: Db, id: string, values: Partial<typeof findings.$inferInsert>) {
  await tx
    .update(findings)
    .set({ ...values, updatedAt: new Date() })
    .where(eq(findings.id, id));
}

export async function insertFindingEvent(tx: Db, values: typeof findingEvents.$inferInsert) {
  const [row] = await tx.insert(findingEvents).values(values).returning();
  return row;
}

export async function insertFindingPhotos(tx: Db, values: (typeof findingPhotos.$inferInsert)[]) {
  if (values.length) await tx.insert(findingPhotos).values(values);
}

export async function markTravelerReplaced(
  tx: Db,
  oldId: string,
  newId: string,
  reason: 'scrap' | 'return_to_supplier',
  actorId: string,
  newSerial: string,
) {
  await tx
    .update(travelers)
    .set({ replacedById: newId, replacedAt: new Date(), replacedReason: reason })
    .where(eq(travelers.id, oldId));
  await tx
    .insert(travelerEvents)
    .values({ travelerId: oldId, actorId, kind: 'part_replaced', detail: { reason, replacementSerial: newSerial } });
}

export async function findTravelerBrief(db: Db, id: string) {
  const [t] = await db
    .select({ id: travelers.id, serial: travelers.serial })
    .from(travelers)
    .where(eq(travelers.id, id));
  return t ?? null;
}

/** The e-mail addresses behind each audience of a build, less the person who acted. */
export async function recipientsOf(
  db: Db,
  buildId: string,
  audiences: MailAudience[],
  exceptUserId: string,
): Promise<string[]> {
  const out = new Set<string>();
  const memberRoles = audiences.flatMap((a) =>
    a === 'builders' ? ['builder' as const] : a === 'inspectors' ? ['inspector' as const] : [],
  );
  if (memberRoles.length) {
    const rows = await db
      .select({ id: users.id, email: users.email })
      .from(buildMembers)
      .innerJoin(users, eq(users.id, buildMembers.userId))
      .where(and(eq(buildMembers.buildId, buildId), inArray(buildMembers.role, memberRoles)));
    for (const r of rows) if (r.id !== exceptUserId) out.add(r.email);
  }
  if (audiences.includes('design_authority')) {
    const rows = await db
      .select({ id: users.id, email: users.email })
      .from(users)
      .innerJoin(builds, eq(builds.organizationId, users.organizationId))
      .where(and(eq(builds.id, buildId), eq(users.role, 'supplier')));
    for (const r of rows) if (r.id !== exceptUserId) out.add(r.email);
  }
  return [...out].sort();
}

export async function findPhotoRow(db: Db, id: string) {
  const [row] = await db.select().from(findingPhotos).where(eq(findingPhotos.id, id));
  return row;
}

/** A finding event as its mail tells it: the event, its finding, who acted, the part's build (undefined: deleted since). */
export async function findEventForMail(db: Db, eventId: string) {
  const [row] = await db
    .select({
      event: findingEvents,
      finding: findings,
      actorName: users.name,
      buildId: travelers.buildId,
      kitSerial: builds.kitSerial,
    })
    .from(findingEvents)
    .innerJoin(findings, eq(findings.id, findingEvents.findingId))
    .innerJoin(users, eq(users.id, findingEvents.actorId))
    .innerJoin(travelers, eq(travelers.id, findings.travelerId))
    .innerJoin(builds, eq(builds.id, travelers.buildId))
    .where(eq(findingEvents.id, eventId));
  return row;
}

/** A finding's photos, oldest first. */
export const listFindingPhotos = (db: Db, findingId: string) =>
  db.select().from(findingPhotos).where(eq(findingPhotos.findingId, findingId)).orderBy(asc(findingPhotos.createdAt));

/** Whether the mail of this event already went to this address (the queue may run a job twice). */
export async function mailSent(db: Db, eventId: string, recipient: string) {
  const [already] = await db
    .select({ id: sentMails.id })
    .from(sentMails)
    .where(and(eq(sentMails.eventId, eventId), eq(sentMails.recipient, recipient)));
  return already !== undefined;
}

/** Records a mail of an event as sent (once per event and address). */
export async function recordSentMail(db: Db, values: typeof sentMails.$inferInsert) {
  await db.insert(sentMails).values(values).onConflictDoNothing();
}

/** Of these storage keys, those a photo row points to (as its file or its thumbnail). */
export async function photoKeysInUse(db: Db, keys: string[]): Promise<Set<string>> {
  const rows = await db
    .select({ fileKey: findingPhotos.fileKey, thumbKey: findingPhotos.thumbKey })
    .from(findingPhotos)
    .where(or(inArray(findingPhotos.fileKey, keys), inArray(findingPhotos.thumbKey, keys)));
  return new Set(rows.flatMap((r) => [r.fileKey, r.thumbKey]));
}
