import { and, desc, eq, sql } from 'drizzle-orm';
import type { Db } from '../../db';
import { kitModels, loadStudies, loadStudyRevisions, users } from '../../db/schema';
import type { PageQuery } from '../../db/contracts';
import { afterKey, decodeCursor, pageOf } from '../pagination';

type Choice = { gaugeIn: number; rivet: string } | null;

/**
 * One page of the organisation's studies, last changed first (then id). The list reads each study's one recommended choice out of its latest result in the database, never
 * the result itself: a whole wing's is some 400 KB. A rib study recommends one gauge and rivet; a wing
 * study's headline is its one-for-all choice.
 */
export async function pageStudyRows(db: Db, organizationId: string, q: PageQuery) {
  const key = decodeCursor(q.cursor, ['string', 'string']);
  const rows = await db
    .select({
      id: loadStudies.id,
      kind: loadStudies.kind,
      kitModelId: loadStudies.kitModelId,
      kitName: kitModels.name,
      name: loadStudies.name,
      revision: loadStudies.latestRevision,
      updatedAt: sql<string>`${loadStudies.updatedAt}::text`,
      recommended: sql<Choice>`case when ${loadStudies.kind} = 'wing'
      then ${loadStudyRevisions.result} -> 'trade' -> 'recommendedUniform'
      else ${loadStudyRevisions.result} -> 'recommended' end`,
    })
    .from(loadStudies)
    .innerJoin(kitModels, eq(kitModels.id, loadStudies.kitModelId))
    .innerJoin(
      loadStudyRevisions,
      and(eq(loadStudyRevisions.studyId, loadStudies.id), eq(loadStudyRevisions.revision, loadStudies.latestRevision)),
    )
    .where(
      and(
        eq(loadStudies.organizationId, organizationId),
        afterKey([loadStudies.updatedAt, loadStudies.id], key, 'desc'),
      ),
    )
    .orderBy(desc(loadStudies.updatedAt), desc(loadStudies.id))
    .limit(q.limit + 1);
  return pageOf(rows, q.limit, (s) => [s.updatedAt, s.id]);
}

export async function findStudy(db: Db, id: string) {
  const [row] = await db.select().from(loadStudies).where(eq(loadStudies.id, id));
  return row;
}

export async function findStudyRevision(db: Db, studyId: string, revision: number) {
  const [row] = await db
    .select()
    .from(loadStudyRevisions)
    .where(and(eq(loadStudyRevisions.studyId, studyId), eq(loadStudyRevisions.revision, revision)));
  return row;
}

/** The engine's input a revision was computed from (with the coupons it used), without the result. */
export async function findStudyEngineInput(db: Db, studyId: string, revision: number) {
  const [row] = await db
    .select({ input: sql<Record<string, unknown> | null>`${loadStudyRevisions.result} -> 'inputs'` })
    .from(loadStudyRevisions)
    .where(and(eq(loadStudyRevisions.studyId, studyId), eq(loadStudyRevisions.revision, revision)));
  return row;
}

export const listStudyRevisions = (db: Db, studyId: string) =>
  db
    .select({
      revision: loadStudyRevisions.revision,
      createdAt: loadStudyRevisions.createdAt,
      createdByName: users.name,
    })
    .from(loadStudyRevisions)
    .innerJoin(users, eq(users.id, loadStudyRevisions.createdBy))
    .where(eq(loadStudyRevisions.studyId, studyId))
    .orderBy(desc(loadStudyRevisions.revision));

type RevisionBody = Pick<typeof loadStudyRevisions.$inferInsert, 'inputs' | 'result'>;

/** A new study with its first revision; the study's id. */
export async function insertStudy(
  tx: Db,
  study: typeof loadStudies.$inferInsert & { createdBy: string },
  first: RevisionBody,
): Promise<string> {
  const [row] = await tx.insert(loadStudies).values(study).returning();
  await tx
    .insert(loadStudyRevisions)
    .values({ studyId: row.id, revision: 1, inputs: first.inputs, result: first.result, createdBy: study.createdBy });
  return row.id;
}

/**
 * The study's next numbered revision: the count goes up (the update locks the study's row, so two
 * changes at once number theirs one after the other) and the revision is written under that number.
 */
export async function addStudyRevision(
  tx: Db,
  id: string,
  study: { name: string; kitModelId: string },
  revision: RevisionBody & { createdBy: string },
) {
  const [row] = await tx
    .update(loadStudies)
    .set({
      latestRevision: sql`${loadStudies.latestRevision} + 1`,
      name: study.name,
      kitModelId: study.kitModelId,
      updatedAt: new Date(),
    })
    .where(eq(loadStudies.id, id))
    .returning();
  await tx.insert(loadStudyRevisions).values({
    studyId: id,
    revision: row.latestRevision,
    inputs: revision.inputs,
    result: revision.result,
    createdBy: revision.createdBy,
  });
}
