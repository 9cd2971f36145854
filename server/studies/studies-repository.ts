import { and, desc, eq } from 'drizzle-orm';
import type { Db } from '../../db';
import { kitModels, loadStudies, loadStudyRevisions, users } from '../../db/schema';

export const listStudyRows = (db: Db, organizationId: string) =>
  db.select({
    id: loadStudies.id, kitModelId: loadStudies.kitModelId, kitName: kitModels.name, name: loadStudies.name,
    revision: loadStudies.latestRevision, updatedAt: loadStudies.updatedAt, result: loadStudyRevisions.result,
  }).from(loadStudies)
    .innerJoin(kitModels, eq(kitModels.id, loadStudies.kitModelId))
    .innerJoin(loadStudyRevisions, and(eq(loadStudyRevisions.studyId, loadStudies.id), eq(loadStudyRevisions.revision, loadStudies.latestRevision)))
    .where(eq(loadStudies.organizationId, organizationId)).orderBy(desc(loadStudies.updatedAt));

export async function findStudy(db: Db, id: string) {
  const [row] = await db.select().from(loadStudies).where(eq(loadStudies.id, id));
  return row;
}

export async function findStudyRevision(db: Db, studyId: string, revision: number) {
  const [row] = await db.select().from(loadStudyRevisions)
    .where(and(eq(loadStudyRevisions.studyId, studyId), eq(loadStudyRevisions.revision, revision)));
  return row;
}

export const listStudyRevisions = (db: Db, studyId: string) =>
  db.select({ revision: loadStudyRevisions.revision, createdAt: loadStudyRevisions.createdAt, createdByName: users.name })
    .from(loadStudyRevisions).innerJoin(users, eq(users.id, loadStudyRevisions.createdBy))
    .where(eq(loadStudyRevisions.studyId, studyId)).orderBy(desc(loadStudyRevisions.revision));
