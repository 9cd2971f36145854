import { and, asc, desc, eq, sql } from 'drizzle-orm';
import type { Page, PageQuery, PartDesignSummary } from '../../db/contracts';
import { afterKey, decodeCursor, pageOf } from '../pagination';
import type { Db } from '../../db';
import { designRevisions, findings, kitModels, partDesigns, travelers, users } from '../../db/schema';

export const revisionColumns = {
  id: designRevisions.id,
  partDesignId: designRevisions.partDesignId,
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
