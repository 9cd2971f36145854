import { and, asc, eq, inArray, isNotNull, isNull } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Db } from '../../db';
import type { CouponTest as EngineCouponTest } from '../engineering';
import { couponTests, designRevisions, kitModels, partDesigns, users } from '../../db/schema';

/** A client or a transaction of it: the guards of a write read inside the transaction that writes. */
type Conn = Db | Parameters<Parameters<Db['transaction']>[0]>[0];

const corrector = alias(couponTests, 'corrector');
const correctorUser = alias(users, 'corrector_user');

/**
 * The supplier's record of tests, corrected entries included (with who corrected them, when and why):
 * `current` leaves those out, as everything that derives allowables must.
 */
export const listCoupons = (db: Db, organizationId: string, filter: { material?: string; rivetSpec?: string; current?: boolean } = {}) =>
  db.select({
    id: couponTests.id, material: couponTests.material, gaugeIn: couponTests.gaugeIn, couponWidthIn: couponTests.couponWidthIn,
    rivetSpec: couponTests.rivetSpec, loadLb: couponTests.loadLb, outcome: couponTests.outcome, note: couponTests.note,
    testedOn: couponTests.testedOn, createdAt: couponTests.createdAt, createdByName: users.name,
    correctionReason: couponTests.correctionReason, supersededById: couponTests.supersededById,
    correctedAt: couponTests.supersededAt, correctedReason: corrector.correctionReason, correctedByName: correctorUser.name,
  }).from(couponTests).innerJoin(users, eq(users.id, couponTests.createdBy))
    .leftJoin(corrector, eq(corrector.id, couponTests.supersededById))
    .leftJoin(correctorUser, eq(correctorUser.id, corrector.createdBy))
    .where(and(
      eq(couponTests.organizationId, organizationId),
      filter.material ? eq(couponTests.material, filter.material) : undefined,
      filter.rivetSpec ? eq(couponTests.rivetSpec, filter.rivetSpec) : undefined,
      filter.current ? isNull(couponTests.supersededById) : undefined,
    ))
    .orderBy(asc(couponTests.material), asc(couponTests.gaugeIn), asc(couponTests.rivetSpec), asc(couponTests.loadLb), asc(couponTests.createdAt));

export async function insertCoupon(db: Conn, values: typeof couponTests.$inferInsert) {
  const [row] = await db.insert(couponTests).values(values).returning({ id: couponTests.id });
  return row.id;
}

/** One test row locked: a correction or a delete of it goes one at a time. */
export async function lockCoupon(db: Conn, id: string) {
  const [row] = await db.select().from(couponTests).where(eq(couponTests.id, id)).for('update');
  return row;
}

export async function findCouponOrganization(db: Db, id: string) {
  const [row] = await db.select({ organizationId: couponTests.organizationId }).from(couponTests).where(eq(couponTests.id, id));
  return row?.organizationId;
}

export async function markSuperseded(db: Conn, id: string, byId: string) {
  await db.update(couponTests).set({ supersededById: byId, supersededAt: new Date() }).where(eq(couponTests.id, id));
}

/** The entries a current one corrected, back to the first record, oldest last (bounded by `max`). */
export async function correctionChain(db: Conn, currentId: string, max = 200) {
  const chain: (typeof couponTests.$inferSelect)[] = [];
  let next: string | null = currentId;
  // Each step finds the entry superseded by the last one: a chain is as long as the corrections made.
  while (next && chain.length < max) {
    const [row] = await db.select().from(couponTests).where(chain.length ? eq(couponTests.supersededById, next) : eq(couponTests.id, next)).for('update');
    if (!row) break;
    chain.push(row);
    next = row.id;
  }
  return chain;
}

export async function deleteCoupons(db: Conn, ids: string[]) {
  if (ids.length) await db.delete(couponTests).where(inArray(couponTests.id, ids));
}

/** Published (or since superseded) revisions of the supplier's parts, with whether a study made them. */
export const listPublishedRevisions = (db: Conn, organizationId: string) =>
  db.select({
    partNumber: partDesigns.partNumber, letter: designRevisions.letter, rivetSpec: designRevisions.rivetSpec,
    gaugeIn: designRevisions.gaugeIn, publishedAt: designRevisions.publishedAt, studyId: designRevisions.studyId,
  }).from(designRevisions).innerJoin(partDesigns, eq(partDesigns.id, designRevisions.partDesignId))
    .innerJoin(kitModels, eq(kitModels.id, partDesigns.kitModelId))
    .where(and(eq(kitModels.organizationId, organizationId), inArray(designRevisions.status, ['published', 'superseded']), isNotNull(designRevisions.publishedAt)))
    .orderBy(asc(partDesigns.partNumber), asc(designRevisions.letter));

/** A supplier's current tests of one material in the engine's shape: what studies and rework checks allow from. Corrected entries are left out. */
export async function couponsForEngine(db: Db, organizationId: string, material: string): Promise<EngineCouponTest[]> {
  const rows = await listCoupons(db, organizationId, { material, current: true });
  return rows.map(({ material: m, gaugeIn, couponWidthIn, rivetSpec, loadLb, outcome, note }) => ({ material: m, gaugeIn, couponWidthIn, rivetSpec, loadLb, outcome, note }));
}
