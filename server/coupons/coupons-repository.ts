import { and, asc, eq } from 'drizzle-orm';
import type { Db } from '../../db';
import type { CouponTest as EngineCouponTest } from '../engineering';
import { couponTests, users } from '../../db/schema';

export const listCoupons = (db: Db, organizationId: string, filter: { material?: string; rivetSpec?: string } = {}) =>
  db.select({
    id: couponTests.id, material: couponTests.material, gaugeIn: couponTests.gaugeIn, couponWidthIn: couponTests.couponWidthIn,
    rivetSpec: couponTests.rivetSpec, loadLb: couponTests.loadLb, outcome: couponTests.outcome, note: couponTests.note,
    testedOn: couponTests.testedOn, createdAt: couponTests.createdAt, createdByName: users.name,
  }).from(couponTests).innerJoin(users, eq(users.id, couponTests.createdBy))
    .where(and(
      eq(couponTests.organizationId, organizationId),
      filter.material ? eq(couponTests.material, filter.material) : undefined,
      filter.rivetSpec ? eq(couponTests.rivetSpec, filter.rivetSpec) : undefined,
    ))
    .orderBy(asc(couponTests.material), asc(couponTests.gaugeIn), asc(couponTests.rivetSpec), asc(couponTests.loadLb));

export async function insertCoupon(db: Db, values: typeof couponTests.$inferInsert) {
  const [row] = await db.insert(couponTests).values(values).returning({ id: couponTests.id });
  return row.id;
}

/** A supplier's tests of one material in the engine's shape: what studies and rework checks allow from. */
export async function couponsForEngine(db: Db, organizationId: string, material: string): Promise<EngineCouponTest[]> {
  const rows = await listCoupons(db, organizationId, { material });
  return rows.map(({ material: m, gaugeIn, couponWidthIn, rivetSpec, loadLb, outcome, note }) => ({ material: m, gaugeIn, couponWidthIn, rivetSpec, loadLb, outcome, note }));
}
