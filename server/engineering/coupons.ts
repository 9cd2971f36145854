import { EngineeringInputError } from './errors';
import { ENGINEERING_CAUTION } from './result';
import { requireCount, requireStudyBound, STUDY_BOUNDS, type Bound } from './bounds';
import { requireArray, requireOneOf, requirePositive } from './validate';
import {
  COUPON_OUTCOMES,
  type CouponOutcome,
  type CouponTest,
  type EngineeringResult,
} from '../../lib/engineering-results';

/**
 * Pull-through allowables of a rivet in a thin flange, from the supplier's coupon tests (step 6 of the
 * chain, with 14 CFR 23.305's two criteria):
 * - limit allowable: the highest load that left no permanent deformation;
 * - ultimate allowable: the highest load carried without failure, slight deformation allowed.
 * Excessive deformation is not acceptable at ultimate either: it counts like a failure. A good result
 * above a load at which another coupon of the same set already did worse is not credited (scatter is
 * resolved towards the weaker coupon).
 */

export interface CouponQuery {
  material: string;
  gaugeIn: number;
  rivetSpec: string;
}

export interface CouponAllowables extends EngineeringResult<CouponQuery & { tests: CouponTest[] }> {
  matched: CouponTest[];
  /** null when there are no tests for this material, gauge and rivet */
  limitLb: number | null;
  ultimateLb: number | null;
}

/** 0.050 and 0.051, 0.063 and 0.064 in are the same stock gauge; anything closer than this is. */
export const GAUGE_MATCH_TOLERANCE_IN = 0.0011;

export const COUPON_RULES = [
  'coupon limit allowable: highest load with no permanent deformation, below any load that deformed or broke a coupon',
  'coupon ultimate allowable: highest load carried without failure (slight deformation allowed), below any load with excessive deformation or failure; excessive deformation counts as failure',
];

export function validateCouponTest(test: unknown, field: string): CouponTest {
  if (test === null || typeof test !== 'object')
    throw new EngineeringInputError(field, 'each coupon test must be an object');
  const t = test as CouponTest;
  if (typeof t.material !== 'string' || !t.material.trim())
    throw new EngineeringInputError(`${field}.material`, 'the material is missing');
  if (typeof t.rivetSpec !== 'string' || !t.rivetSpec.trim())
    throw new EngineeringInputError(`${field}.rivetSpec`, 'the rivet spec is missing');
  requirePositive(t.gaugeIn, `${field}.gaugeIn`, 'the gauge');
  requirePositive(t.loadLb, `${field}.loadLb`, 'the test load');
  requireStudyBound(t.gaugeIn, 'coupons[].gaugeIn', `${field}.gaugeIn`);
  requireStudyBound(t.loadLb, 'coupons[].loadLb', `${field}.loadLb`);
  if (t.couponWidthIn !== undefined)
    requireStudyBound(t.couponWidthIn, 'coupons[].couponWidthIn', `${field}.couponWidthIn`);
  requireOneOf(t.outcome, `${field}.outcome`, COUPON_OUTCOMES);
  return t;
}

export function validateCoupons(tests: unknown, field = 'coupons'): CouponTest[] {
  const list = requireArray<unknown>(tests, field, 0);
  // Every candidate reads every test: the count is part of a study's work.
  requireCount(list, field, STUDY_BOUNDS.coupons);
  // Every candidate validates every test: a sound one is passed on a quick look, and the checks that
  // name the field (and build its name) run only for one that is not.
  return list.map((t, i) => (soundCoupon(t) ? (t as CouponTest) : validateCouponTest(t, `${field}[${i}]`)));
}

const within = (v: unknown, b: Bound): boolean =>
  typeof v === 'number' &&
  Number.isFinite(v) &&
  (!b.integer || Number.isInteger(v)) &&
  v >= b.min &&
  (b.maxExclusive ? v < b.max : v <= b.max);

/** What `validateCouponTest` lets through (it may let through more: it has the last word). */
function soundCoupon(test: unknown): boolean {
  if (test === null || typeof test !== 'object') return false;
  const t = test as CouponTest;
  return (
    typeof t.material === 'string' &&
    t.material.trim() !== '' &&
    typeof t.rivetSpec === 'string' &&
    t.rivetSpec.trim() !== '' &&
    within(t.gaugeIn, STUDY_BOUNDS['coupons[].gaugeIn']) &&
    t.gaugeIn > 0 &&
    within(t.loadLb, STUDY_BOUNDS['coupons[].loadLb']) &&
    t.loadLb > 0 &&
    (t.couponWidthIn === undefined || within(t.couponWidthIn, STUDY_BOUNDS['coupons[].couponWidthIn'])) &&
    (COUPON_OUTCOMES as readonly unknown[]).includes(t.outcome)
  );
}

export function matchesCoupon(test: CouponTest, q: CouponQuery): boolean {
  return (
    test.material.trim().toUpperCase() === q.material.trim().toUpperCase() &&
    test.rivetSpec.trim().toUpperCase() === q.rivetSpec.trim().toUpperCase() &&
    Math.abs(test.gaugeIn - q.gaugeIn) <= GAUGE_MATCH_TOLERANCE_IN
  );
}

/** The tests `matchesCoupon` takes, with the query normalised once rather than once per test. */
function matchingCoupons(tests: CouponTest[], q: CouponQuery): CouponTest[] {
  if (tests.length === 0) return [];
  const material = q.material.trim().toUpperCase();
  const rivetSpec = q.rivetSpec.trim().toUpperCase();
  return tests.filter(
    (t) =>
      t.material.trim().toUpperCase() === material &&
      t.rivetSpec.trim().toUpperCase() === rivetSpec &&
      Math.abs(t.gaugeIn - q.gaugeIn) <= GAUGE_MATCH_TOLERANCE_IN,
  );
}

const highestBelow = (tests: CouponTest[], good: CouponOutcome[], bad: CouponOutcome[]): number => {
  const worst = Math.min(Infinity, ...tests.filter((t) => bad.includes(t.outcome)).map((t) => t.loadLb));
  return Math.max(0, ...tests.filter((t) => good.includes(t.outcome) && t.loadLb < worst).map((t) => t.loadLb));
};

export function couponAllowables(tests: CouponTest[], query: CouponQuery): CouponAllowables {
  const all = validateCoupons(tests);
  const { matched, limitLb, ultimateLb, warnings } = matchedCouponAllowables(all, query);
  // Spelled out rather than `...envelope(…)` followed by more fields: V8 builds such a literal some 50
  // times slower, and every candidate of a study comes through here.
  return {
    inputs: { ...query, tests: all },
    rules: COUPON_RULES,
    warnings,
    caution: ENGINEERING_CAUTION,
    matched,
    limitLb,
    ultimateLb,
  };
}

/**
 * `couponAllowables` on tests already validated, without the record of its inputs: what a study's
 * allowables read. Limit and ultimate are null when no test matches.
 */
export function matchedCouponAllowables(
  tests: CouponTest[],
  query: CouponQuery,
): { matched: CouponTest[]; limitLb: number | null; ultimateLb: number | null; warnings: string[] } {
  const matched = matchingCoupons(tests, query);
  const label = `${query.gaugeIn} in ${query.material} with ${query.rivetSpec}`;
  if (matched.length === 0)
    return { matched, limitLb: null, ultimateLb: null, warnings: [`no coupon tests for ${label}`] };
  const warnings: string[] = [];
  const limitLb = highestBelow(matched, ['no_deformation'], ['slight_deformation', 'excessive_deformation', 'failure']);
  const ultimateLb = highestBelow(
    matched,
    ['no_deformation', 'slight_deformation'],
    ['excessive_deformation', 'failure'],
  );
  if (limitLb === 0)
    warnings.push(`no coupon of ${label} came through without permanent deformation: limit allowable 0`);
  if (ultimateLb === 0)
    warnings.push(
      `no coupon of ${label} carried its load without excessive deformation or failure: ultimate allowable 0`,
    );
  return { matched, limitLb, ultimateLb, warnings };
}

export interface CouponGroup<T extends CouponTest = CouponTest> {
  material: string;
  gaugeIn: number;
  rivetSpec: string;
  /** the group's tests by load */
  tests: T[];
  limitLb: number;
  ultimateLb: number;
  warnings: string[];
}

/**
 * Every (material, stock gauge, rivet) the tests cover, with the allowables a study takes from them:
 * the supplier's coupon table and the study read the same numbers.
 */
export function groupCouponAllowables<T extends CouponTest>(tests: T[]): CouponGroup<T>[] {
  const groups: CouponGroup<T>[] = [];
  for (const t of tests) {
    const g = groups.find((x) => matchesCoupon(t, x));
    if (g) g.tests.push(t);
    else
      groups.push({
        material: t.material.trim(),
        gaugeIn: t.gaugeIn,
        rivetSpec: t.rivetSpec.trim(),
        tests: [t],
        limitLb: 0,
        ultimateLb: 0,
        warnings: [],
      });
  }
  for (const g of groups) {
    const a = matchedCouponAllowables(validateCoupons(g.tests), g);
    g.tests.sort((x, y) => x.loadLb - y.loadLb);
    Object.assign(g, { limitLb: a.limitLb ?? 0, ultimateLb: a.ultimateLb ?? 0, warnings: a.warnings });
  }
  const key = (s: string) => s.toUpperCase();
  return groups.sort(
    (a, b) =>
      key(a.material).localeCompare(key(b.material)) ||
      a.gaugeIn - b.gaugeIn ||
      key(a.rivetSpec).localeCompare(key(b.rivetSpec)),
  );
}
