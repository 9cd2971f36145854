import type { CouponOutcome } from '@/db/contracts';

/**
 * Coupon tests grouped by material, gauge and rivet, with the two loads a study takes as the
 * pull-through allowables (14 CFR 23.305's two criteria):
 * - limit basis: the highest load that left no permanent deformation;
 * - ultimate basis: the highest load carried without failure, slight deformation allowed (excessive
 *   deformation counts as a failure).
 * A good result at or above a load where another coupon of the same group already did worse is not
 * credited: scatter is resolved towards the weaker coupon. With tests but none that qualifies the load
 * is 0. This mirrors the server's rule, so what the table shows is what the next computed study uses;
 * a material, gauge and rivet with no tests at all gets the study's conservative fallback instead.
 */
export type CouponLike = { material: string; gaugeIn: number; rivetSpec: string; loadLb: number; outcome: CouponOutcome };

export type CouponGroup<T extends CouponLike = CouponLike> = {
  key: string;
  material: string;
  gaugeIn: number;
  rivetSpec: string;
  tests: T[];
  /** 0 when no coupon of the group qualifies: a study then finds this pair cannot carry any pull */
  limitLb: number;
  ultimateLb: number;
};

/** Gauges this close are the same stock sheet (0.050 and 0.051 in). */
export const GAUGE_TOLERANCE_IN = 0.0011;

const LIMIT_OK: CouponOutcome[] = ['no_deformation'];
const LIMIT_BAD: CouponOutcome[] = ['slight_deformation', 'excessive_deformation', 'failure'];
const ULT_OK: CouponOutcome[] = ['no_deformation', 'slight_deformation'];
const ULT_BAD: CouponOutcome[] = ['excessive_deformation', 'failure'];

function highestBelowWorst(tests: readonly CouponLike[], ok: CouponOutcome[], bad: CouponOutcome[]): number {
  const worst = Math.min(Infinity, ...tests.filter((t) => bad.includes(t.outcome)).map((t) => t.loadLb));
  return Math.max(0, ...tests.filter((t) => ok.includes(t.outcome) && t.loadLb < worst).map((t) => t.loadLb));
}

export function couponBasis(tests: readonly CouponLike[]): { limitLb: number; ultimateLb: number } {
  return { limitLb: highestBelowWorst(tests, LIMIT_OK, LIMIT_BAD), ultimateLb: highestBelowWorst(tests, ULT_OK, ULT_BAD) };
}

const norm = (s: string) => s.trim().toUpperCase();

/** Groups in material, gauge, rivet order; the tests of each group by load. */
export function groupCoupons<T extends CouponLike>(tests: readonly T[]): CouponGroup<T>[] {
  const sorted = [...tests].sort((a, b) => norm(a.material).localeCompare(norm(b.material)) || norm(a.rivetSpec).localeCompare(norm(b.rivetSpec)) || a.gaugeIn - b.gaugeIn);
  const groups: CouponGroup<T>[] = [];
  for (const t of sorted) {
    const g = groups.find((x) => norm(x.material) === norm(t.material) && norm(x.rivetSpec) === norm(t.rivetSpec) && Math.abs(x.gaugeIn - t.gaugeIn) <= GAUGE_TOLERANCE_IN);
    if (g) g.tests.push(t);
    else groups.push({ key: `${norm(t.material)}|${t.gaugeIn}|${norm(t.rivetSpec)}`, material: t.material.trim(), gaugeIn: t.gaugeIn, rivetSpec: t.rivetSpec.trim(), tests: [t], limitLb: 0, ultimateLb: 0 });
  }
  for (const g of groups) {
    g.tests.sort((a, b) => a.loadLb - b.loadLb);
    Object.assign(g, couponBasis(g.tests));
  }
  return groups.sort((a, b) => norm(a.material).localeCompare(norm(b.material)) || a.gaugeIn - b.gaugeIn || norm(a.rivetSpec).localeCompare(norm(b.rivetSpec)));
}

export type CouponFilters = { material: string; gauge: string; rivet: string };
export const ALL = 'all';

export function filterCoupons<T extends CouponLike>(tests: readonly T[], f: CouponFilters): T[] {
  return tests.filter((t) =>
    (f.material === ALL || norm(t.material) === norm(f.material))
    && (f.gauge === ALL || Math.abs(t.gaugeIn - Number(f.gauge)) <= GAUGE_TOLERANCE_IN)
    && (f.rivet === ALL || norm(t.rivetSpec) === norm(f.rivet)));
}

/** The distinct values a filter offers, as the tests spell them. */
export function filterValues(tests: readonly CouponLike[]): { materials: string[]; gauges: number[]; rivets: string[] } {
  const uniq = (xs: string[]) => [...new Map(xs.map((x) => [norm(x), x.trim()])).values()].sort();
  const gauges: number[] = [];
  for (const g of [...tests.map((t) => t.gaugeIn)].sort((a, b) => a - b)) if (!gauges.some((x) => Math.abs(x - g) <= GAUGE_TOLERANCE_IN)) gauges.push(g);
  return { materials: uniq(tests.map((t) => t.material)), gauges, rivets: uniq(tests.map((t) => t.rivetSpec)) };
}

export type CouponSortKey = 'tested' | 'material' | 'gauge' | 'rivet' | 'load' | 'outcome';

const outcomeOrder: Record<CouponOutcome, number> = { no_deformation: 0, slight_deformation: 1, excessive_deformation: 2, failure: 3 };

export function sortCoupons<T extends CouponLike & { testedOn?: string; createdAt?: string }>(tests: readonly T[], s: { key: CouponSortKey; dir: 'asc' | 'desc' }): T[] {
  const sign = s.dir === 'asc' ? 1 : -1;
  const by: Record<CouponSortKey, (a: T, b: T) => number> = {
    tested: (a, b) => (a.testedOn ?? '').localeCompare(b.testedOn ?? '') || (a.createdAt ?? '').localeCompare(b.createdAt ?? ''),
    material: (a, b) => norm(a.material).localeCompare(norm(b.material)),
    gauge: (a, b) => a.gaugeIn - b.gaugeIn,
    rivet: (a, b) => norm(a.rivetSpec).localeCompare(norm(b.rivetSpec)),
    load: (a, b) => a.loadLb - b.loadLb,
    outcome: (a, b) => outcomeOrder[a.outcome] - outcomeOrder[b.outcome],
  };
  return [...tests].sort((a, b) => sign * by[s.key](a, b) || a.gaugeIn - b.gaugeIn || a.loadLb - b.loadLb);
}
