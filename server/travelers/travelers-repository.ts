import { and, asc, count, eq, inArray, isNull, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db';
import { builds, designRevisions, findings, holes, kitModels, organizations, partDesigns, travelerSteps, travelers } from '../../db/schema';
import {
  holesAwaitingInspectorStatuses, holesDoneStatuses, openFindingStatuses,
  type HoleStatus, type PartFacts, type TravelerSummary,
} from '../../db/contracts';
import { visibleBuilds } from '../builds/build-access';
import { checkLayout } from '../designs/layout-check';
import { newQrToken, newShortCode } from './codes';
import { placeHoles } from './hole-layout';


/** Travelers the user may see, with progress; `by` narrows further (one build, one traveler, a code). */
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
    replacedById: travelers.replacedById, replacedReason: travelers.replacedReason, replacesId: travelers.replacesId,
  }).from(travelers)
    .innerJoin(builds, eq(builds.id, travelers.buildId))
    .innerJoin(designRevisions, eq(designRevisions.id, travelers.revisionId))
    .innerJoin(partDesigns, eq(partDesigns.id, designRevisions.partDesignId))
    .where(and(...conditions)).orderBy(asc(builds.kitSerial), asc(partDesigns.partNumber), asc(travelers.createdAt));
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.id);
  const [holeCounts, openFindings, published] = await Promise.all([
    db.select({
      travelerId: holes.travelerId, total: count(),
      done: sql<number>`count(*) filter (where ${inArray(holes.status, [...holesDoneStatuses])})`.mapWith(Number),
      awaiting: sql<number>`count(*) filter (where ${inArray(holes.status, [...holesAwaitingInspectorStatuses])})`.mapWith(Number),
    }).from(holes).where(inArray(holes.travelerId, ids)).groupBy(holes.travelerId),
    db.select({ travelerId: findings.travelerId, n: count() }).from(findings)
      .where(and(inArray(findings.travelerId, ids), inArray(findings.status, [...openFindingStatuses]))).groupBy(findings.travelerId),
    db.select({ partDesignId: designRevisions.partDesignId, letter: designRevisions.letter }).from(designRevisions)
      .where(and(inArray(designRevisions.partDesignId, rows.map((r) => r.partDesignId)), eq(designRevisions.status, 'published'))),
  ]);
  return rows.map(({ revisionStatus, partDesignId, signedOffAt, replacedById, replacedReason, replacesId, ...t }) => {
    const c = holeCounts.find((x) => x.travelerId === t.id);
    return {
      ...t,
      holesTotal: c?.total ?? 0,
      holesDone: c?.done ?? 0,
      holesAwaitingInspector: c?.awaiting ?? 0,
      openFindings: openFindings.find((x) => x.travelerId === t.id)?.n ?? 0,
      signedOff: signedOffAt !== null,
      replaced: replacedById ? { byId: replacedById, reason: replacedReason! } : null,
      replacesId,
      newerRevision: revisionStatus === 'superseded' ? published.find((p) => p.partDesignId === partDesignId)?.letter ?? null : null,
    };
  });
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

/**
 * Takes the traveler's row lock. Every write to a part (ticks, steps, findings, sign-off, replacement)
 * takes it first, so each sees the part as the one before it left it: a sign-off cannot pass its
 * checks while a tick, an undone step or a new finding is half-written, and no two writers deadlock.
 */
export async function lockTraveler(tx: Db, id: string) {
  const [row] = await tx.select().from(travelers).where(eq(travelers.id, id)).for('no key update');
  return row;
}

/** What the part rules read, counted by the database (call it with the traveler locked). */
export async function readPartFacts(tx: Db, t: typeof travelers.$inferSelect): Promise<PartFacts> {
  // One after the other: inside a transaction they share one connection.
  const holeRows = await tx.select({ status: holes.status, n: count() }).from(holes).where(eq(holes.travelerId, t.id)).groupBy(holes.status);
  const [steps] = await tx.select({ n: count() }).from(travelerSteps).where(and(eq(travelerSteps.travelerId, t.id), isNull(travelerSteps.doneAt)));
  const [open] = await tx.select({ n: count() }).from(findings)
    .where(and(eq(findings.travelerId, t.id), inArray(findings.status, [...openFindingStatuses])));
  return {
    holes: Object.fromEntries(holeRows.map((r) => [r.status, r.n])) as Partial<Record<HoleStatus, number>>,
    stepsOpen: steps.n, openFindings: open.n, signedOff: t.signedOffAt !== null, replaced: t.replacedById !== null,
  };
}

/** A short code no traveler has yet: collisions are rare (one in hundreds of millions) but not impossible. */
async function freeShortCode(tx: Db): Promise<string> {
  for (let attempt = 0; attempt < 8; attempt++) {
    const code = newShortCode();
    const taken = await tx.select({ id: travelers.id }).from(travelers).where(eq(travelers.shortCode, code));
    if (!taken.length) return code;
  }
  throw new Error('could not find a free short code in 8 tries');
}

/** Holes go in batches: one insert per batch keeps under the driver's limit of 65535 parameters. */
const HOLE_BATCH = 2000;

/**
 * A traveler made from a published revision: its own serial, QR token and short code, its holes placed
 * from the schedule and its steps. Shipping a kit and replacing a scrapped part both make them here.
 */
export async function insertTraveler(
  tx: Db,
  t: { buildId: string; serial: string; revision: typeof designRevisions.$inferSelect; replacesId?: string },
) {
  const [traveler] = await tx.insert(travelers).values({
    buildId: t.buildId, revisionId: t.revision.id, serial: t.serial, qrToken: newQrToken(), shortCode: await freeShortCode(tx),
    replacesId: t.replacesId ?? null,
  }).returning();
  const minPitch = checkLayout(t.revision);
  const placed = t.revision.lines.flatMap((line) => placeHoles(line, t.revision.edgeDistanceIn, minPitch));
  for (let i = 0; i < placed.length; i += HOLE_BATCH) {
    await tx.insert(holes).values(placed.slice(i, i + HOLE_BATCH).map((h) => ({ ...h, travelerId: traveler.id })));
  }
  if (t.revision.steps.length) {
    await tx.insert(travelerSteps).values(t.revision.steps.map((text, i) => ({ travelerId: traveler.id, seq: i + 1, text })));
  }
  return traveler;
}

/** The revision a replacement part is made to: the part's current published one, else the one it had. */
export async function currentRevisionOf(tx: Db, revisionId: string) {
  const [old] = await tx.select().from(designRevisions).where(eq(designRevisions.id, revisionId));
  const [published] = await tx.select().from(designRevisions)
    .where(and(eq(designRevisions.partDesignId, old.partDesignId), eq(designRevisions.status, 'published')));
  return published ?? old;
}

/** Replacement serials: <serial>-R1, -R2… counted along the chain of parts it replaces. */
export async function replacementSerial(tx: Db, t: typeof travelers.$inferSelect): Promise<string> {
  // Only a replacement carries an -R suffix of ours; a part number may end in R1 of its own.
  const base = t.replacesId ? t.serial.replace(/-R\d+$/, '') : t.serial;
  const [{ n }] = await tx.select({ n: count() }).from(travelers).where(sql`${travelers.serial} like ${`${base}-R%`}`);
  return `${base}-R${n + 1}`;
}

/** What a QR label prints, for one part or a whole build (the caller has checked who may print). */
export async function listLabelRows(db: Db, by: { buildId: string } | { travelerId: string }) {
  return db.select({
    travelerId: travelers.id, serial: travelers.serial, shortCode: travelers.shortCode, qrToken: travelers.qrToken,
    partNumber: partDesigns.partNumber, partName: partDesigns.name, letter: designRevisions.letter,
    kitModelCode: kitModels.code, kitModelName: kitModels.name, supplierName: organizations.name, kitSerial: builds.kitSerial,
  }).from(travelers)
    .innerJoin(builds, eq(builds.id, travelers.buildId))
    .innerJoin(designRevisions, eq(designRevisions.id, travelers.revisionId))
    .innerJoin(partDesigns, eq(partDesigns.id, designRevisions.partDesignId))
    .innerJoin(kitModels, eq(kitModels.id, partDesigns.kitModelId))
    .innerJoin(organizations, eq(organizations.id, kitModels.organizationId))
    .where('buildId' in by ? eq(travelers.buildId, by.buildId) : eq(travelers.id, by.travelerId))
    .orderBy(asc(partDesigns.partNumber), asc(travelers.serial));
}

/** Clears a part's sign-off (the withdrawal's event keeps who signed and when). */
export async function clearSignOff(tx: Db, id: string) {
  await tx.update(travelers).set({ signedOffAt: null, signedOffBy: null }).where(eq(travelers.id, id));
}
