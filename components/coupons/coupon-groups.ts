import type { CouponAllowance, CouponOutcome } from '@/db/contracts';

/**
 * Filtering and ordering of the coupon table. The allowables per material, gauge and rivet come from
 * the server, derived by the engine's own rule, so the table shows what the next study will use.
 */
export type CouponLike = {
  material: string;
  gaugeIn: number;
  rivetSpec: string;
  loadLb: number;
  outcome: CouponOutcome;
};

/** Gauges this close are the same stock sheet (0.050 and 0.051 in), as the engine matches them. */
export const GAUGE_TOLERANCE_IN = 0.0011;

const norm = (s: string) => s.trim().toUpperCase();

export type CouponFilters = { material: string; gauge: string; rivet: string };
export const ALL = 'all';

const passes = (t: Pick<CouponLike, 'material' | 'gaugeIn' | 'rivetSpec'>, f: CouponFilters) =>
  (f.material === ALL || norm(t.material) === norm(f.material)) &&
  (f.gauge === ALL || Math.abs(t.gaugeIn - Number(f.gauge)) <= GAUGE_TOLERANCE_IN) &&
  (f.rivet === ALL || norm(t.rivetSpec) === norm(f.rivet));

export function filterCoupons<T extends CouponLike>(tests: readonly T[], f: CouponFilters): T[] {
  return tests.filter((t) => passes(t, f));
}

/** The allowance groups the filters leave on show. */
export function filterAllowances(groups: readonly CouponAllowance[], f: CouponFilters): CouponAllowance[] {
  return groups.filter((g) => passes(g, f));
}

/** The distinct values a filter offers, as the tests spell them. */
export function filterValues(tests: readonly CouponLike[]): {
  materials: string[];
  gauges: number[];
  rivets: string[];
} {
  const uniq = (xs: string[]) => [...new Map(xs.map((x) => [norm(x), x.trim()])).values()].sort();
  const gauges: number[] = [];
  for (const g of [...tests.map((t) => t.gaugeIn)].sort((a, b) => a - b))
    if (!gauges.some((x) => Math.abs(x - g) <= GAUGE_TOLERANCE_IN)) gauges.push(g);
  return { materials: uniq(tests.map((t) => t.material)), gauges, rivets: uniq(tests.map((t) => t.rivetSpec)) };
}

export type CouponSortKey = 'tested' | 'material' | 'gauge' | 'rivet' | 'load' | 'outcome';

const outcomeOrder: Record<CouponOutcome, number> = {
  no_deformation: 0,
  slight_deformation: 1,
  excessive_deformation: 2,
  failure: 3,
};

export function sortCoupons<T extends CouponLike & { testedOn?: string; createdAt?: string }>(
  tests: readonly T[],
  s: { key: CouponSortKey; dir: 'asc' | 'desc' },
): T[] {
  const sign = s.dir === 'asc' ? 1 : -1;
  const by: Record<CouponSortKey, (a: T, b: T) => number> = {
    tested: (a, b) =>
      (a.testedOn ?? '').localeCompare(b.testedOn ?? '') || (a.createdAt ?? '').localeCompare(b.createdAt ?? ''),
    material: (a, b) => norm(a.material).localeCompare(norm(b.material)),
    gauge: (a, b) => a.gaugeIn - b.gaugeIn,
    rivet: (a, b) => norm(a.rivetSpec).localeCompare(norm(b.rivetSpec)),
    load: (a, b) => a.loadLb - b.loadLb,
    outcome: (a, b) => outcomeOrder[a.outcome] - outcomeOrder[b.outcome],
  };
  return [...tests].sort((a, b) => sign * by[s.key](a, b) || a.gaugeIn - b.gaugeIn || a.loadLb - b.loadLb);
}
