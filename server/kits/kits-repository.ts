import { asc, eq } from 'drizzle-orm';
import type { Db } from '../../db';
import { kitModels } from '../../db/schema';

export const listKits = (db: Db, organizationId: string) =>
  db.select().from(kitModels).where(eq(kitModels.organizationId, organizationId)).orderBy(asc(kitModels.code));

export async function findKit(db: Db, id: string) {
  const [row] = await db.select().from(kitModels).where(eq(kitModels.id, id));
  return row;
}

export async function insertKit(db: Db, values: typeof kitModels.$inferInsert) {
  const [row] = await db.insert(kitModels).values(values).returning();
  return row;
}
