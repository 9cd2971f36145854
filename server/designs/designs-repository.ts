import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import type { Db } from '../../db';
import { designRevisions, findings, kitModels, partDesigns, travelers, users } from '../../db/schema';

export const revisionColumns = {
  id: designRevisions.id, partDesignId: designRevisions.partDesignId, letter: designRevisions.letter, status: designRevisions.status,
  material: designRevisions.material, gaugeIn: designRevisions.gaugeIn, rivetSpec: designRevisions.rivetSpec,
  drillSize: designRevisions.drillSize, drillDiameterIn: designRevisions.drillDiameterIn, edgeDistanceIn: designRevisions.edgeDistanceIn,
  chordIn: designRevisions.chordIn, lines: designRevisions.lines, steps: designRevisions.steps, changeNote: designRevisions.changeNote,
  basis: designRevisions.basis, studyId: designRevisions.studyId, createdAt: designRevisions.createdAt,
  publishedAt: designRevisions.publishedAt, publishedByName: users.name,
};

export async function listDesigns(db: Db, organizationId: string, kitModelId?: string) {
  const where = kitModelId
    ? and(eq(kitModels.organizationId, organizationId), eq(partDesigns.kitModelId, kitModelId))
    : eq(kitModels.organizationId, organizationId);
  const designs = await db.select({
    id: partDesigns.id, kitModelId: partDesigns.kitModelId, kitName: kitModels.name, organizationId: kitModels.organizationId,
    partNumber: partDesigns.partNumber, name: partDesigns.name, kind: partDesigns.kind,
  }).from(partDesigns).innerJoin(kitModels, eq(kitModels.id, partDesigns.kitModelId)).where(where).orderBy(asc(partDesigns.partNumber));
  const revisions = designs.length === 0 ? [] : await db.select({
    id: designRevisions.id, partDesignId: designRevisions.partDesignId, letter: designRevisions.letter, status: designRevisions.status,
  }).from(designRevisions).where(inArray(designRevisions.partDesignId, designs.map((d) => d.id))).orderBy(desc(designRevisions.createdAt));
  return { designs, revisions };
}

export async function findDesign(db: Db, id: string) {
  const [row] = await db.select({
    id: partDesigns.id, kitModelId: partDesigns.kitModelId, kitName: kitModels.name, organizationId: kitModels.organizationId,
    partNumber: partDesigns.partNumber, name: partDesigns.name, kind: partDesigns.kind,
  }).from(partDesigns).innerJoin(kitModels, eq(kitModels.id, partDesigns.kitModelId)).where(eq(partDesigns.id, id));
  return row;
}

export const listRevisions = (db: Db, partDesignId: string) =>
  db.select(revisionColumns).from(designRevisions).leftJoin(users, eq(users.id, designRevisions.publishedBy))
    .where(eq(designRevisions.partDesignId, partDesignId)).orderBy(desc(designRevisions.createdAt));

export async function findRevision(db: Db, id: string) {
  const [row] = await db.select(revisionColumns).from(designRevisions).leftJoin(users, eq(users.id, designRevisions.publishedBy))
    .where(eq(designRevisions.id, id));
  return row;
}

/** Every finding on travelers made from this design's revisions, one row per finding and hole. */
export const listDesignFindingHoles = (db: Db, partDesignId: string) =>
  db.select({
    letter: designRevisions.letter, holeIds: findings.holeIds, kind: findings.kind, status: findings.status,
    buildId: travelers.buildId, createdAt: findings.createdAt,
  }).from(findings)
    .innerJoin(travelers, eq(travelers.id, findings.travelerId))
    .innerJoin(designRevisions, eq(designRevisions.id, travelers.revisionId))
    .where(eq(designRevisions.partDesignId, partDesignId));
