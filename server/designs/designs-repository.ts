import { and, asc, desc, eq, sql } from 'drizzle-orm';
import type { Page, PageQuery, PartDesignSummary } from '../../db/contracts';
import { afterKey, decodeCursor, pageOf } from '../pagination';
import type { Db } from '../../db';
import { designRevisions, findings, kitModels, partDesigns, travelers, users } from '../../db/schema';

/** What a revision makes a part to: its letter and state, sheet, rivet and drill, and its fastener lines. */
export const revisionMakeColumns = {
  letter: designRevisions.letter,
  status: designRevisions.status,
  material: designRevisions.material,
  gaugeIn: designRevisions.gaugeIn,
  rivetSpec: designRevisions.rivetSpec,
  drillSize: designRevisions.drillSize,
  drillDiameterIn: designRevisions.drillDiameterIn,
  edgeDistanceIn: designRevisions.edgeDistanceIn,
  chordIn: designRevisions.chordIn,
  lines: designRevisions.lines,
};

const revisionColumns = {
  id: designRevisions.id,
  partDesignId: designRevisions.partDesignId,
  ...revisionMakeColumns,
  steps: designRevisions.steps,
  changeNote: designRevisions.changeNote,
  basis: designRevisions.basis,
  studyId: designRevisions.studyId,
  createdAt: designRevisions.createdAt,
  publishedAt: designRevisions.publishedAt,
  publishedByName: users.name,
};

/**
 * One page of the organisation's part designs (of one kit, or all), by part number then id. Each row's
 * latest revision and its published letter come from PostgreSQL in the same query.
 */
export async function pageDesigns(
  db: Db,
  organizationId: string,
  q: PageQuery & { kitModelId?: string },
): Promise<Page<PartDesignSummary>> {
  const key = decodeCursor(q.cursor, ['string', 'string']);
  const rows = await db
    .select({
      id: partDesigns.id,
      kitModelId: partDesigns.kitModelId,
      kitName: kitModels.name,
      partNumber: partDesigns.partNumber,
      name: partDesigns.name,
      kind: partDesigns.kind,
      latest: sql<
        PartDesignSummary['latest']
      >`(select json_build_object('id', ${designRevisions.id}, 'letter', ${designRevisions.letter}, 'status', ${designRevisions.status})
      from ${designRevisions} where ${designRevisions.partDesignId} = ${partDesigns.id}
      order by ${designRevisions.createdAt} desc, ${designRevisions.id} desc limit 1)`,
      publishedLetter: sql<string | null>`(select ${designRevisions.letter} from ${designRevisions}
      where ${designRevisions.partDesignId} = ${partDesigns.id} and ${designRevisions.status} = 'published'
      order by ${designRevisions.createdAt} desc limit 1)`,
    })
    .from(partDesigns)
    .innerJoin(kitModels, eq(kitModels.id, partDesigns.kitModelId))
    .where(
      and(
        eq(kitModels.organizationId, organizationId),
        q.kitModelId ? eq(partDesigns.kitModelId, q.kitModelId) : undefined,
        afterKey([partDesigns.partNumber, partDesigns.id], key, 'asc'),
      ),
    )
    .orderBy(asc(partDesigns.partNumber), asc(partDesigns.id))
    .limit(q.limit + 1);
  return pageOf(rows, q.limit, (d) => [d.partNumber, d.id]);
}

export async function findDesign(db: Db, id: string) {
  const [row] = await db
    .select({
      id: partDesigns.id,
      kitModelId: partDesigns.kitModelId,
      kitName: kitModels.name,
      organizationId: kitModels.organizationId,
      partNumber: partDesigns.partNumber,
      name: partDesigns.name,
      kind: partDesigns.kind,
    })
    .from(partDesigns)
    .innerJoin(kitModels, eq(kitModels.id, partDesigns.kitModelId))
    .where(eq(partDesigns.id, id));
  return row;
}

export const listRevisions = (db: Db, partDesignId: string) =>
  db
    .select(revisionColumns)
    .from(designRevisions)
    .leftJoin(users, eq(users.id, designRevisions.publishedBy))
    .where(eq(designRevisions.partDesignId, partDesignId))
    .orderBy(desc(designRevisions.createdAt));

export async function findRevision(db: Db, id: string) {
  const [row] = await db
    .select(revisionColumns)
    .from(designRevisions)
    .leftJoin(users, eq(users.id, designRevisions.publishedBy))
    .where(eq(designRevisions.id, id));
  return row;
}

/** Every finding on travelers made from this design's revisions, one row per finding and hole. */
export const listDesignFindingHoles = (db: Db, partDesignId: string) =>
  db
    .select({
      letter: designRevisions.letter,
      holeIds: findings.holeIds,
      kind: findings.kind,
      status: findings.status,
      buildId: travelers.buildId,
      createdAt: findings.createdAt,
    })
    .from(findings)
    .innerJoin(travelers, eq(travelers.id, findings.travelerId))
    .innerJoin(designRevisions, eq(designRevisions.id, travelers.revisionId))
    .where(eq(designRevisions.partDesignId, partDesignId));

/** Whether the kit already has a part of this number. */
export async function partNumberTaken(tx: Db, kitModelId: string, partNumber: string) {
  const clash = await tx
    .select({ id: partDesigns.id })
    .from(partDesigns)
    .where(and(eq(partDesigns.kitModelId, kitModelId), eq(partDesigns.partNumber, partNumber)));
  return clash.length > 0;
}

/** A new part design with its first revision; the design's id. */
export async function insertDesignWithFirstRevision(
  tx: Db,
  design: typeof partDesigns.$inferInsert,
  revision: Omit<typeof designRevisions.$inferInsert, 'partDesignId'>,
): Promise<string> {
  const [row] = await tx.insert(partDesigns).values(design).returning();
  await tx.insert(designRevisions).values({ ...revision, partDesignId: row.id });
  return row.id;
}

/** The letters and states of a part's revisions, their rows locked: the next letter and the one-draft rule read them. */
export const lockRevisionLetters = (tx: Db, partDesignId: string) =>
  tx
    .select({ letter: designRevisions.letter, status: designRevisions.status })
    .from(designRevisions)
    .where(eq(designRevisions.partDesignId, partDesignId))
    .for('update');

/** A new revision of a part; its id. */
export async function insertRevision(tx: Db, values: typeof designRevisions.$inferInsert): Promise<string> {
  const [row] = await tx.insert(designRevisions).values(values).returning({ id: designRevisions.id });
  return row.id;
}

/**
 * Changes a revision while it is a draft. The status guard in the WHERE makes a publish that slips in
 * between win: the edit then changes nothing (false).
 */
export async function updateDraftRevision(
  db: Db,
  id: string,
  values: Partial<typeof designRevisions.$inferInsert>,
): Promise<boolean> {
  const updated = await db
    .update(designRevisions)
    .set(values)
    .where(and(eq(designRevisions.id, id), eq(designRevisions.status, 'draft')))
    .returning({ id: designRevisions.id });
  return updated.length > 0;
}

/** Deletes a revision while it is a draft; false when a publish came first (the status guard in the WHERE). */
export async function deleteDraftRevision(db: Db, id: string): Promise<boolean> {
  const gone = await db
    .delete(designRevisions)
    .where(and(eq(designRevisions.id, id), eq(designRevisions.status, 'draft')))
    .returning({ id: designRevisions.id });
  return gone.length > 0;
}

/** A revision's state, its row locked (undefined: no such revision). */
export async function lockRevisionStatus(tx: Db, id: string) {
  const [row] = await tx
    .select({ status: designRevisions.status })
    .from(designRevisions)
    .where(eq(designRevisions.id, id))
    .for('update');
  return row?.status;
}

/** Publishes a revision: the part's published one (if any) is superseded by it. Call with the revision locked. */
export async function publishRevision(tx: Db, id: string, partDesignId: string, userId: string) {
  await tx
    .update(designRevisions)
    .set({ status: 'superseded' })
    .where(and(eq(designRevisions.partDesignId, partDesignId), eq(designRevisions.status, 'published')));
  await tx
    .update(designRevisions)
    .set({ status: 'published', publishedAt: new Date(), publishedBy: userId })
    .where(eq(designRevisions.id, id));
}

/** The published revisions of a kit's parts, with their designs: what shipping the kit makes travelers of. */
export const listPublishedParts = (db: Db, kitModelId: string) =>
  db
    .select()
    .from(designRevisions)
    .innerJoin(partDesigns, eq(partDesigns.id, designRevisions.partDesignId))
    .where(and(eq(partDesigns.kitModelId, kitModelId), eq(designRevisions.status, 'published')));
