import { and, asc, count, countDistinct, desc, eq, inArray, ne } from 'drizzle-orm';
import type { Db } from '../../db';
import type { KitReliance, Page, PageQuery } from '../../db/contracts';
import { afterKey, decodeCursor, pageOf } from '../pagination';
import { builds, designRevisions, kitModelChanges, kitModels, loadStudies, partDesigns, users } from '../../db/schema';

/** One page of the organisation's kit models by code (then id; a code is the organisation's own, so ties do not occur). */
export async function pageKits(
  db: Db,
  organizationId: string,
  q: PageQuery,
): Promise<Page<typeof kitModels.$inferSelect>> {
  const key = decodeCursor(q.cursor, ['string', 'string']);
  const rows = await db
    .select()
    .from(kitModels)
    .where(and(eq(kitModels.organizationId, organizationId), afterKey([kitModels.code, kitModels.id], key, 'asc')))
    .orderBy(asc(kitModels.code), asc(kitModels.id))
    .limit(q.limit + 1);
  return pageOf(rows, q.limit, (k) => [k.code, k.id]);
}

/** Whether another kit of the organisation has this code (answered from the (organisation, code) index). */
export async function kitCodeTaken(db: Db, organizationId: string, code: string, except?: string) {
  const rows = await db
    .select({ id: kitModels.id })
    .from(kitModels)
    .where(
      and(
        eq(kitModels.organizationId, organizationId),
        eq(kitModels.code, code),
        except ? ne(kitModels.id, except) : undefined,
      ),
    )
    .limit(1);
  return rows.length > 0;
}

export async function findKit(db: Db, id: string) {
  const [row] = await db.select().from(kitModels).where(eq(kitModels.id, id));
  return row;
}

export async function insertKit(db: Db, values: typeof kitModels.$inferInsert) {
  const [row] = await db.insert(kitModels).values(values).returning();
  return row;
}

/** The kit row locked for the change or delete: shipping a build or starting a study on it waits (their foreign key). */
export async function lockKit(db: Db, id: string) {
  const [row] = await db.select().from(kitModels).where(eq(kitModels.id, id)).for('update');
  return row;
}

/**
 * What relies on the kit. With `lock`, its part revisions are locked too, so none is published between
 * this count and the delete.
 */
export async function kitReliance(db: Db, id: string, lock = false): Promise<KitReliance> {
  if (lock) {
    await db
      .select({ id: designRevisions.id })
      .from(designRevisions)
      .innerJoin(partDesigns, eq(partDesigns.id, designRevisions.partDesignId))
      .where(eq(partDesigns.kitModelId, id))
      .for('update', { of: designRevisions });
  }
  // One after another: inside a transaction they share one connection.
  const [studies] = await db.select({ n: count() }).from(loadStudies).where(eq(loadStudies.kitModelId, id));
  const [parts] = await db
    .select({ n: countDistinct(partDesigns.id) })
    .from(partDesigns)
    .innerJoin(designRevisions, eq(designRevisions.partDesignId, partDesigns.id))
    .where(and(eq(partDesigns.kitModelId, id), inArray(designRevisions.status, ['published', 'superseded'])));
  const [shipped] = await db.select({ n: count() }).from(builds).where(eq(builds.kitModelId, id));
  return { studies: studies.n, publishedParts: parts.n, builds: shipped.n };
}

export async function updateKit(db: Db, id: string, values: Partial<typeof kitModels.$inferInsert>) {
  await db.update(kitModels).set(values).where(eq(kitModels.id, id));
}

export async function insertKitChange(db: Db, values: typeof kitModelChanges.$inferInsert) {
  await db.insert(kitModelChanges).values(values);
}

export const listKitChanges = (db: Db, kitModelId: string) =>
  db
    .select({
      id: kitModelChanges.id,
      changedByName: users.name,
      reason: kitModelChanges.reason,
      before: kitModelChanges.before,
      after: kitModelChanges.after,
      createdAt: kitModelChanges.createdAt,
    })
    .from(kitModelChanges)
    .innerJoin(users, eq(users.id, kitModelChanges.changedBy))
    .where(eq(kitModelChanges.kitModelId, kitModelId))
    .orderBy(desc(kitModelChanges.createdAt));

/** The kit with its draft-only part designs (the caller has checked that nothing relies on it). */
export async function deleteKit(db: Db, id: string) {
  const designs = db.select({ id: partDesigns.id }).from(partDesigns).where(eq(partDesigns.kitModelId, id));
  await db.delete(designRevisions).where(inArray(designRevisions.partDesignId, designs));
  await db.delete(partDesigns).where(eq(partDesigns.kitModelId, id));
  await db.delete(kitModels).where(eq(kitModels.id, id));
}
