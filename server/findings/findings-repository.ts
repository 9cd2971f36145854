import { and, asc, desc, eq, inArray, ne, type SQL } from 'drizzle-orm';
import type { Db } from '../../db';
import { builds, designRevisions, findingEvents, findingPhotos, findings, partDesigns, travelers, users } from '../../db/schema';
import type { FindingStatus } from '../../db/contracts';
import { visibleBuilds } from '../builds/build-access';

export type FindingFilter = { id?: string; travelerId?: string; buildId?: string; status?: FindingStatus | 'open' };

export async function listFindingRows(db: Db, user: Express.User, filter: FindingFilter) {
  const conditions: SQL[] = [visibleBuilds(db, user)];
  if (filter.id) conditions.push(eq(findings.id, filter.id));
  if (filter.travelerId) conditions.push(eq(findings.travelerId, filter.travelerId));
  if (filter.buildId) conditions.push(eq(travelers.buildId, filter.buildId));
  if (filter.status === 'open') conditions.push(ne(findings.status, 'closed'));
  else if (filter.status) conditions.push(eq(findings.status, filter.status));
  const rows = await db.select({
    id: findings.id, travelerId: findings.travelerId, serial: travelers.serial, partNumber: partDesigns.partNumber,
    kitSerial: builds.kitSerial, buildId: builds.id, holeIds: findings.holeIds, kind: findings.kind, status: findings.status,
    disposition: findings.disposition, flaggedByName: users.name, createdAt: findings.createdAt, updatedAt: findings.updatedAt,
    note: findings.note, dispositionNote: findings.dispositionNote,
  }).from(findings)
    .innerJoin(travelers, eq(travelers.id, findings.travelerId))
    .innerJoin(builds, eq(builds.id, travelers.buildId))
    .innerJoin(designRevisions, eq(designRevisions.id, travelers.revisionId))
    .innerJoin(partDesigns, eq(partDesigns.id, designRevisions.partDesignId))
    .innerJoin(users, eq(users.id, findings.flaggedBy))
    .where(and(...conditions)).orderBy(desc(findings.createdAt));
  const photos = rows.length === 0 ? [] : await db.select().from(findingPhotos)
    .where(inArray(findingPhotos.findingId, rows.map((r) => r.id))).orderBy(asc(findingPhotos.createdAt));
  return rows.map((r) => ({ ...r, photos: photos.filter((p) => p.findingId === r.id) }));
}

export const listEvents = (db: Db, findingId: string) =>
  db.select({
    id: findingEvents.id, actorName: users.name, fromStatus: findingEvents.fromStatus, toStatus: findingEvents.toStatus,
    disposition: findingEvents.disposition, note: findingEvents.note, createdAt: findingEvents.createdAt,
  }).from(findingEvents).innerJoin(users, eq(users.id, findingEvents.actorId))
    .where(eq(findingEvents.findingId, findingId)).orderBy(asc(findingEvents.createdAt));
