import { and, asc, count, countDistinct, desc, eq, inArray } from 'drizzle-orm';
import type { Db } from '../../db';
import type { KitReliance } from '../../db/contracts';
import { builds, designRevisions, kitModelChanges, kitModels, loadStudies, partDesigns, users } from '../../db/schema';

/** A client or a transaction of it: the guards of a write read inside the transaction that writes. */
type Conn = Db | Parameters<Parameters<Db['transaction']>[0]>[0];

export const listKits = (db: Db, organizationId: string) =>
  db.select().from(kitModels).where(eq(kitModels.organizationId, organizationId)).orderBy(asc(kitModels.code));

export async function findKit(db: Conn, id: string) {
  const [row] = await db.select().from(kitModels).where(eq(kitModels.id, id));
  return row;
}

export async function insertKit(db: Db, values: typeof kitModels.$inferInsert) {
  const [row] = await db.insert(kitModels).values(values).returning();
  return row;
}

/** The kit row locked for the change or delete: shipping a build or starting a study on it waits (their foreign key). */
export async function lockKit(db: Conn, id: string) {
  const [row] = await db.select().from(kitModels).where(eq(kitModels.id, id)).for('update');
  return row;
}

/**
 * What relies on the kit. With `lock`, its part revisions are locked too, so none is published between
 * this count and the delete.
 */
export async function kitReliance(db: Conn, id: string, lock = false): Promise<KitReliance> {
  if (lock) {
    await db.select({ id: designRevisions.id }).from(designRevisions).innerJoin(partDesigns, eq(partDesigns.id, designRevisions.partDesignId))
      .where(eq(partDesigns.kitModelId, id)).for('update', { of: designRevisions });
  }
  // One after another: inside a transaction they share one connection.
  const [studies] = await db.select({ n: count() }).from(loadStudies).where(eq(loadStudies.kitModelId, id));
  const [parts] = await db.select({ n: countDistinct(partDesigns.id) }).from(partDesigns).innerJoin(designRevisions, eq(designRevisions.partDesignId, partDesigns.id))
    .where(and(eq(partDesigns.kitModelId, id), inArray(designRevisions.status, ['published', 'superseded'])));
  const [shipped] = await db.select({ n: count() }).from(builds).where(eq(builds.kitModelId, id));
  return { studies: studies.n, publishedParts: parts.n, builds: shipped.n };
}

export async function updateKit(db: Conn, id: string, values: Partial<typeof kitModels.$inferInsert>) {
  await db.update(kitModels).set(values).where(eq(kitModels.id, id));
}

export async function insertKitChange(db: Conn, values: typeof kitModelChanges.$inferInsert) {
  await db.insert(kitModelChanges).values(values);
}

export const listKitChanges = (db: Db, kitModelId: string) =>
  db.select({
    id: kitModelChanges.id, changedByName: users.name, reason: kitModelChanges.reason, before: kitModelChanges.before,
    after: kitModelChanges.after, createdAt: kitModelChanges.createdAt,
  }).from(kitModelChanges).innerJoin(users, eq(users.id, kitModelChanges.changedBy))
    .where(eq(kitModelChanges.kitModelId, kitModelId)).orderBy(desc(kitModelChanges.createdAt));

/** The kit with its draft-only part designs (the caller has checked that nothing relies on it). */
export async function deleteKit(db: Conn, id: string) {
  const designs = db.select({ id: partDesigns.id }).from(partDesigns).where(eq(partDesigns.kitModelId, id));
  await db.delete(designRevisions).where(inArray(designRevisions.partDesignId, designs));
  await db.delete(partDesigns).where(eq(partDesigns.kitModelId, id));
  await db.delete(kitModels).where(eq(kitModels.id, id));
}
