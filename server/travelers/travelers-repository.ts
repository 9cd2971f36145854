import { and, asc, count, eq, inArray, ne, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db';
import { builds, designRevisions, findings, holes, kitModels, partDesigns, travelers } from '../../db/schema';
import { doneStatuses, type TravelerSummary } from '../../db/contracts';
import { visibleBuilds } from '../builds/build-access';

/** Travelers the user may see, with progress; `where` narrows further (one build, one traveler, a code). */
export async function listTravelers(db: Db, user: Express.User, by: { buildId?: string; id?: string; qrToken?: string; shortCode?: string } = {}): Promise<TravelerSummary[]> {
  const conditions: SQL[] = [visibleBuilds(db, user)];
  if (by.buildId) conditions.push(eq(travelers.buildId, by.buildId));
  if (by.id) conditions.push(eq(travelers.id, by.id));
  if (by.qrToken) conditions.push(eq(travelers.qrToken, by.qrToken));
  if (by.shortCode) conditions.push(eq(travelers.shortCode, by.shortCode));
  const rows = await db.select({
    id: travelers.id, serial: travelers.serial, shortCode: travelers.shortCode, buildId: travelers.buildId, kitSerial: builds.kitSerial,
    partNumber: partDesigns.partNumber, partName: partDesigns.name, kind: partDesigns.kind, letter: designRevisions.letter,
    revisionStatus: designRevisions.status, partDesignId: partDesigns.id, signedOffAt: travelers.signedOffAt,
  }).from(travelers)
    .innerJoin(builds, eq(builds.id, travelers.buildId))
    .innerJoin(designRevisions, eq(designRevisions.id, travelers.revisionId))
    .innerJoin(partDesigns, eq(partDesigns.id, designRevisions.partDesignId))
    .where(and(...conditions)).orderBy(asc(builds.kitSerial), asc(partDesigns.partNumber));
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.id);
  const [holeCounts, openFindings, published] = await Promise.all([
    db.select({
      travelerId: holes.travelerId, total: count(),
      done: sql<number>`count(*) filter (where ${inArray(holes.status, [...doneStatuses])})`.mapWith(Number),
    }).from(holes).where(inArray(holes.travelerId, ids)).groupBy(holes.travelerId),
    db.select({ travelerId: findings.travelerId, n: count() }).from(findings)
      .where(and(inArray(findings.travelerId, ids), ne(findings.status, 'closed'))).groupBy(findings.travelerId),
    db.select({ partDesignId: designRevisions.partDesignId, letter: designRevisions.letter }).from(designRevisions)
      .where(and(inArray(designRevisions.partDesignId, rows.map((r) => r.partDesignId)), eq(designRevisions.status, 'published'))),
  ]);
  return rows.map(({ revisionStatus, partDesignId, signedOffAt, ...t }) => ({
    ...t,
    holesTotal: holeCounts.find((c) => c.travelerId === t.id)?.total ?? 0,
    holesDone: holeCounts.find((c) => c.travelerId === t.id)?.done ?? 0,
    openFindings: openFindings.find((c) => c.travelerId === t.id)?.n ?? 0,
    signedOff: signedOffAt !== null,
    newerRevision: revisionStatus === 'superseded' ? published.find((p) => p.partDesignId === partDesignId)?.letter ?? null : null,
  }));
}

export async function findTravelerParts(db: Db, id: string) {
  const [row] = await db.select({ traveler: travelers, revision: designRevisions, design: partDesigns, kit: kitModels })
    .from(travelers)
    .innerJoin(designRevisions, eq(designRevisions.id, travelers.revisionId))
    .innerJoin(partDesigns, eq(partDesigns.id, designRevisions.partDesignId))
    .innerJoin(kitModels, eq(kitModels.id, partDesigns.kitModelId))
    .where(eq(travelers.id, id));
  return row;
}
