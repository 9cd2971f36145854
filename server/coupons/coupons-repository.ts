import { and, asc, eq, inArray, isNotNull, isNull, sql, type SQL } from 'drizzle-orm';
import { COUPON_GAUGE_TOLERANCE_IN, type Page, type PageQuery } from '../../db/contracts';
import { afterKey, decodeCursor, pageOf } from '../pagination';
import { alias } from 'drizzle-orm/pg-core';
import type { Db } from '../../db';
import type { CouponTest as EngineCouponTest } from '../engineering';
import { couponTests, designRevisions, kitModels, partDesigns, users } from '../../db/schema';

const corrector = alias(couponTests, 'corrector');
const correctorUser = alias(users, 'corrector_user');

/**
 * The published revisions (of the test's organisation, made from a study) that a test may stand behind:
 * any entry of its record (it and, step by step, the entries it corrected) of the same rivet at the same
 * gauge or thicker, on record before the revision was published. The rule is couponBacks' (db/contracts/coupons.ts),
 * answered by PostgreSQL for each row of the page.
 */
const backsOf = sql<string[]>`coalesce((
  with recursive chain as (
    select e.id, e.rivet_spec, e.gauge_in, e.created_at from coupon_tests e where e.id = ${couponTests.id}
    union all
    select e.id, e.rivet_spec, e.gauge_in, e.created_at from coupon_tests e join chain c on e.superseded_by_id = c.id
  )
  select array_agg(p.part_number || ' revision ' || r.letter order by p.part_number, r.letter)
  from design_revisions r join part_designs p on p.id = r.part_design_id join kit_models k on k.id = p.kit_model_id
  where k.organization_id = ${couponTests.organizationId} and r.status in ('published', 'superseded')
    and r.published_at is not null and r.study_id is not null
    and exists (select 1 from chain e where upper(btrim(e.rivet_spec)) = upper(btrim(r.rivet_spec))
      and e.gauge_in::numeric >= r.gauge_in::numeric - ${COUPON_GAUGE_TOLERANCE_IN} and e.created_at <= r.published_at)
), '{}')`;

/** The order of the record: material, gauge, rivet, load, then when it was recorded and its id. */
const order = [
  couponTests.material,
  couponTests.gaugeIn,
  couponTests.rivetSpec,
  couponTests.loadLb,
  couponTests.createdAt,
  couponTests.id,
] as const;
const keyShape = ['string', 'number', 'string', 'number', 'string', 'string'] as const;

export type CouponFilter = { material?: string; rivetSpec?: string; current?: boolean; id?: string };

/** A test as the engine reads it: what was pulled, with which rivet, and what the sheet did. */
const engineCouponColumns = {
  material: couponTests.material,
  gaugeIn: couponTests.gaugeIn,
  couponWidthIn: couponTests.couponWidthIn,
  rivetSpec: couponTests.rivetSpec,
  loadLb: couponTests.loadLb,
  outcome: couponTests.outcome,
  note: couponTests.note,
};

/**
 * The supplier's record of tests, corrected entries included (with who corrected them, when and why), and
 * what each may back: `current` leaves corrected entries out, as everything that derives allowables must.
 */
function couponRows(db: Db, organizationId: string, filter: CouponFilter, after: SQL | undefined, limit: number) {
  return db
    .select({
      id: couponTests.id,
      ...engineCouponColumns,
      testedOn: couponTests.testedOn,
      createdAt: sql<string>`${couponTests.createdAt}::text`,
      createdByName: users.name,
      correctionReason: couponTests.correctionReason,
      supersededById: couponTests.supersededById,
      correctedAt: couponTests.supersededAt,
      correctedReason: corrector.correctionReason,
      correctedByName: correctorUser.name,
      backs: sql<string[]>`case when ${couponTests.supersededById} is null then ${backsOf} else '{}' end`,
    })
    .from(couponTests)
    .innerJoin(users, eq(users.id, couponTests.createdBy))
    .leftJoin(corrector, eq(corrector.id, couponTests.supersededById))
    .leftJoin(correctorUser, eq(correctorUser.id, corrector.createdBy))
    .where(
      and(
        eq(couponTests.organizationId, organizationId),
        filter.material ? eq(couponTests.material, filter.material) : undefined,
        filter.rivetSpec ? eq(couponTests.rivetSpec, filter.rivetSpec) : undefined,
        filter.current ? isNull(couponTests.supersededById) : undefined,
        filter.id ? eq(couponTests.id, filter.id) : undefined,
        after,
      ),
    )
    .orderBy(...order.map((c) => asc(c)))
    .limit(limit);
}
export type CouponRow = Awaited<ReturnType<typeof couponRows>>[number];

/** One page of the record. */
export async function pageCoupons(
  db: Db,
  organizationId: string,
  q: PageQuery & CouponFilter,
): Promise<Page<CouponRow>> {
  const key = decodeCursor(q.cursor, keyShape);
  const rows = await couponRows(db, organizationId, q, afterKey(order, key, 'asc'), q.limit + 1);
  return pageOf(rows, q.limit, (c) => [c.material, c.gaugeIn, c.rivetSpec, c.loadLb, c.createdAt, c.id]);
}

/** Rows of the record without a page, read up to `max` (one more says the record is longer). */
export const couponRowsUpTo = (db: Db, organizationId: string, filter: CouponFilter, max: number) =>
  couponRows(db, organizationId, filter, undefined, max + 1);

export async function insertCoupon(db: Db, values: typeof couponTests.$inferInsert) {
  const [row] = await db.insert(couponTests).values(values).returning({ id: couponTests.id });
  return row.id;
}

/** One test row locked: a correction or a delete of it goes one at a time. */
export async function lockCoupon(db: Db, id: string) {
  const [row] = await db.select().from(couponTests).where(eq(couponTests.id, id)).for('update');
  return row;
}

export async function findCouponOrganization(db: Db, id: string) {
  const [row] = await db
    .select({ organizationId: couponTests.organizationId })
    .from(couponTests)
    .where(eq(couponTests.id, id));
  return row?.organizationId;
}

export async function markSuperseded(db: Db, id: string, byId: string) {
  await db.update(couponTests).set({ supersededById: byId, supersededAt: new Date() }).where(eq(couponTests.id, id));
}

/** The entries a current one corrected, back to the first record, oldest last (bounded by `max`). */
export async function correctionChain(db: Db, currentId: string, max = 200) {
  const chain: (typeof couponTests.$inferSelect)[] = [];
  let next: string | null = currentId;
  // Each step finds the entry superseded by the last one: a chain is as long as the corrections made.
  while (next && chain.length < max) {
    const [row] = await db
      .select()
      .from(couponTests)
      .where(chain.length ? eq(couponTests.supersededById, next) : eq(couponTests.id, next))
      .for('update');
    if (!row) break;
    chain.push(row);
    next = row.id;
  }
  return chain;
}

export async function deleteCoupons(db: Db, ids: string[]) {
  if (ids.length) await db.delete(couponTests).where(inArray(couponTests.id, ids));
}

/** Published (or since superseded) revisions of the supplier's parts, with whether a study made them. */
export const listPublishedRevisions = (db: Db, organizationId: string) =>
  db
    .select({
      partNumber: partDesigns.partNumber,
      letter: designRevisions.letter,
      rivetSpec: designRevisions.rivetSpec,
      gaugeIn: designRevisions.gaugeIn,
      publishedAt: designRevisions.publishedAt,
      studyId: designRevisions.studyId,
    })
    .from(designRevisions)
    .innerJoin(partDesigns, eq(partDesigns.id, designRevisions.partDesignId))
    .innerJoin(kitModels, eq(kitModels.id, partDesigns.kitModelId))
    .where(
      and(
        eq(kitModels.organizationId, organizationId),
        inArray(designRevisions.status, ['published', 'superseded']),
        isNotNull(designRevisions.publishedAt),
      ),
    )
    .orderBy(asc(partDesigns.partNumber), asc(designRevisions.letter));

/** A supplier's current tests of one material in the engine's shape: what studies and rework checks allow from. Corrected entries are left out. */
export async function couponsForEngine(db: Db, organizationId: string, material: string): Promise<EngineCouponTest[]> {
  return db
    .select(engineCouponColumns)
    .from(couponTests)
    .where(
      and(
        eq(couponTests.organizationId, organizationId),
        eq(couponTests.material, material),
        isNull(couponTests.supersededById),
      ),
    )
    .orderBy(...order.map((c) => asc(c)));
}
