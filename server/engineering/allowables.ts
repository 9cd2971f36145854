import {
  COUPON_RULES,
  GAUGE_MATCH_TOLERANCE_IN,
  groupCouponAllowables,
  matchedCouponAllowables,
  validateCoupons,
} from './coupons';
import { EngineeringInputError } from './errors';
import { layoutRules } from './layout';
import { findMaterial, findRivet } from './materials';
import { ENGINEERING_CAUTION } from './result';
import { requireInRange, requireNonNegative, requirePositive } from './validate';
import type { CouponTest, EngineeringResult, RivetSpec, SheetMaterial } from '../../lib/engineering-results';

/**
 * Allowable loads of one rivet in one flange: rivet single shear, sheet bearing by e/D, rivet tension and
 * flange pull-through; limit and ultimate values kept apart because 14 CFR 23.305 asks two questions
 * (no detrimental permanent deformation at limit, no failure at ultimate).
 */

export interface JointInput {
  material: string;
  gaugeIn: number;
  rivetSpec: string;
  /** defaults to the layout minimum (2D, 2.5D countersunk) */
  edgeDistanceIn?: number;
  coupons?: CouponTest[];
  /** pull-through fallback without coupons, fraction of the sheet's bearing strength at the hole (default 8 %) */
  pullThroughFallbackFraction?: number;
  materialData?: SheetMaterial[];
  rivetData?: RivetSpec[];
}

export interface JointAllowables extends EngineeringResult<JointInput> {
  material: string;
  rivetSpec: string;
  gaugeIn: number;
  holeDiameterIn: number;
  edgeDistanceIn: number;
  eOverD: number;
  shear: {
    rivetLb: number;
    bearingUltimateLb: number;
    bearingYieldLb: number;
    limitLb: number;
    ultimateLb: number;
    governing: 'rivet shear' | 'sheet bearing';
  };
  tension: {
    rivetLb: number;
    pullThroughLimitLb: number;
    pullThroughUltimateLb: number;
    basis: 'coupons' | 'fallback';
    limitLb: number;
    ultimateLb: number;
    governing: 'rivet tension' | 'flange pull-through';
  };
}

export const DEFAULT_PULL_THROUGH_FRACTION = 0.08;
/**
 * Solid rivets carry tension only through their heads; with no published value we take 70 % of the
 * single-shear strength for a protruding head and 50 % for a countersunk one (our conservative
 * assumption). In a thin flange the flange lets go long before either.
 */
export const SOLID_RIVET_TENSION_FRACTION = { protruding: 0.7, countersunk: 0.5 };

const SOLID_TENSION_RULES = {
  countersunk: 'solid rivet tension taken as 50 % of its shear strength (head-limited; our assumption)',
  protruding: 'solid rivet tension taken as 70 % of its shear strength (head-limited; our assumption)',
};

export const COMBINED_RULE = 'combined tension + shear: (Rt)² + (Rs)² ≤ 1, MS = 1/√(Rt² + Rs²) − 1';

/** Single-shear strength of the rivet: tabulated, or F_su·π/4·d_hole². */
export function rivetShearStrengthLb(spec: RivetSpec): number {
  if (spec.shearLb !== undefined) return spec.shearLb;
  if (spec.fsuPsi === undefined)
    throw new EngineeringInputError('rivetSpec', `${spec.code} has neither a shear strength nor an F_su`);
  return (spec.fsuPsi * Math.PI * spec.holeDiameterIn * spec.holeDiameterIn) / 4;
}

export function rivetTensionStrengthLb(spec: RivetSpec): number {
  if (spec.tensionLb !== undefined) return spec.tensionLb;
  return (
    rivetShearStrengthLb(spec) *
    (spec.countersunk ? SOLID_RIVET_TENSION_FRACTION.countersunk : SOLID_RIVET_TENSION_FRACTION.protruding)
  );
}

/**
 * Bearing strength (psi) at edge distance ratio e/D: linear between the e/D 1.5 and 2.0 values, no credit
 * above 2.0, and below 1.5 (outside the published data) reduced in proportion to e/D.
 */
export function bearingStrengthPsi(values: { e15: number; e20: number }, eOverD: number): number {
  if (eOverD >= 2) return values.e20;
  if (eOverD >= 1.5) return values.e15 + ((values.e20 - values.e15) * (eOverD - 1.5)) / 0.5;
  return (values.e15 * eOverD) / 1.5;
}

/**
 * Rivets per inch of joint width for a joint as strong as the sheet (FAA AC 43.13-1B Tables 4-9, 4-10):
 * F_tu·t over the lesser of rivet single shear and sheet bearing (both on the hole diameter).
 */
export function rivetsPerInchOfWidth(p: {
  sheetFtuPsi: number;
  sheetFbruPsi: number;
  thicknessIn: number;
  rivetFsuPsi: number;
  holeDiameterIn: number;
}): number {
  const shear = (p.rivetFsuPsi * Math.PI * p.holeDiameterIn ** 2) / 4;
  const bearing = p.sheetFbruPsi * p.holeDiameterIn * p.thicknessIn;
  return (p.sheetFtuPsi * p.thicknessIn) / Math.min(shear, bearing);
}

/** MS of a rivet under tension and shear together; null when it carries nothing. */
export function combinedMargin(
  tensionLb: number,
  shearLb: number,
  tensionAllowableLb: number,
  shearAllowableLb: number,
): number | null {
  if (tensionLb <= 0 && shearLb <= 0) return null;
  const rt = tensionLb <= 0 ? 0 : tensionAllowableLb > 0 ? tensionLb / tensionAllowableLb : Infinity;
  const rs = shearLb <= 0 ? 0 : shearAllowableLb > 0 ? shearLb / shearAllowableLb : Infinity;
  // hypot is slow in V8; with one ratio zero it is exactly the other, which is the common case (no torque).
  const r = rs === 0 ? rt : rt === 0 ? rs : Math.hypot(rt, rs);
  return Number.isFinite(r) ? 1 / r - 1 : -1;
}

/**
 * The pull-through allowable of a flange with no coupons of its own:
 * - ultimate = fraction × the sheet's bearing strength at the hole, F_bru(e/D)·d·t: in proportion to the
 *   gauge, so it falls with thinner sheet (the rivet's own shear strength, which does not, is no part
 *   of it); limit = ultimate / 1.5;
 * - never more than the supplier's coupons show for the same rivet in the same or a thicker gauge, of
 *   any sheet material: a thinner flange does not hold more than a thicker one was shown to.
 */
/**
 * The fallback's rules by fraction, the same strings from call to call (the last few kept): a study
 * states them for most of its candidates, and merges them by value.
 */
const fallbackRuleMemo: { fraction: number; rules: string[] }[] = [];
function fallbackRules(fraction: number): string[] {
  for (const m of fallbackRuleMemo) if (m.fraction === fraction) return m.rules;
  const rules = [
    `pull-through without coupons: ultimate ${(fraction * 100).toFixed(0)} % of the sheet's bearing strength at the hole (F_bru·d·t, in proportion to the gauge), limit = ultimate / 1.5`,
    "pull-through without coupons: never above the coupons' allowables for the same rivet in the same or a thicker gauge (any sheet material)",
  ];
  if (fallbackRuleMemo.length >= 4) fallbackRuleMemo.shift();
  fallbackRuleMemo.push({ fraction, rules });
  return rules;
}

export function pullThroughFallback(
  p: { fraction: number; bearingUltimateLb: number; rivetCode: string; gaugeIn: number; coupons: CouponTest[] },
  /** `validateCoupons(p.coupons)`, when the caller has it already */
  validated?: CouponTest[],
): {
  limitLb: number;
  ultimateLb: number;
  cappedBy: { gaugeIn: number; material: string } | null;
  rules: string[];
  warnings: string[];
} {
  requireInRange(p.fraction, 'pullThroughFallbackFraction', 0.001, 0.5, 'the pull-through fallback fraction');
  requireInRange(p.gaugeIn, 'gaugeIn', 0.005, 0.5, 'the gauge (in)');
  requireNonNegative(p.bearingUltimateLb, 'bearingUltimateLb', 'the bearing strength');
  let ultimateLb = p.fraction * p.bearingUltimateLb;
  let limitLb = ultimateLb / 1.5;
  const rules = [...fallbackRules(p.fraction)];
  const warnings: string[] = [];
  const code = p.rivetCode.trim().toUpperCase();
  const sameRivet = (validated ?? validateCoupons(p.coupons)).filter(
    (t) => t.rivetSpec.trim().toUpperCase() === code && t.gaugeIn >= p.gaugeIn - GAUGE_MATCH_TOLERANCE_IN,
  );
  let cappedBy: { gaugeIn: number; material: string } | null = null;
  // Groups come sorted by material, then gauge: the thinnest binding one is named.
  for (const g of groupCouponAllowables(sameRivet)) {
    if (g.limitLb >= limitLb && g.ultimateLb >= ultimateLb) continue;
    limitLb = Math.min(limitLb, g.limitLb);
    ultimateLb = Math.min(ultimateLb, g.ultimateLb);
    if (!cappedBy || g.gaugeIn < cappedBy.gaugeIn) cappedBy = { gaugeIn: g.gaugeIn, material: g.material };
  }
  if (cappedBy) {
    warnings.push(
      `${p.rivetCode} in ${p.gaugeIn} in: the pull-through fallback is held to what the coupons of the same rivet in ${cappedBy.gaugeIn} in ${cappedBy.material} or thicker show: limit ${limitLb.toFixed(1)} lb, ultimate ${ultimateLb.toFixed(1)} lb`,
    );
  }
  return { limitLb, ultimateLb, cappedBy, rules, warnings };
}

export function jointAllowables(input: JointInput): JointAllowables {
  const material = findMaterial(input.material, input.materialData);
  const rivet = findRivet(input.rivetSpec, input.rivetData);
  const gaugeIn = requireInRange(input.gaugeIn, 'gaugeIn', 0.005, 0.5, 'the gauge (in)');
  const layout = layoutRules(rivet);
  const edgeDistanceIn =
    input.edgeDistanceIn === undefined
      ? layout.minEdgeIn
      : requirePositive(input.edgeDistanceIn, 'edgeDistanceIn', 'the edge distance');
  const fraction = input.pullThroughFallbackFraction ?? DEFAULT_PULL_THROUGH_FRACTION;
  requireInRange(fraction, 'pullThroughFallbackFraction', 0.001, 0.5, 'the pull-through fallback fraction');
  const rules: string[] = [
    'rivet single shear: F_su·π/4·d_hole² or the tabulated strength (ultimate)',
    'sheet bearing: F_bru·d·t at ultimate, F_bry·d·t at limit, by e/D (linear between 1.5 and 2.0, no credit above 2.0)',
    'limit: sheet bearing yield and coupon no-deformation load; ultimate: the lesser of rivet and sheet strengths',
    COMBINED_RULE,
  ];
  const warnings: string[] = [];

  const d = rivet.holeDiameterIn;
  // e/D in nominal diameters, as the layout rules are written: a 2D edge distance earns the e/D 2.0 value.
  const eOverD = edgeDistanceIn / rivet.nominalDiameterIn;
  if (eOverD < 1.5)
    warnings.push(
      `edge distance ${edgeDistanceIn.toFixed(3)} in is below 1.5D: bearing taken in proportion to e/D, outside published data`,
    );
  const rivetShear = rivetShearStrengthLb(rivet);
  const bearingUltimateLb = bearingStrengthPsi(material.fbruPsi, eOverD) * d * gaugeIn;
  const bearingYieldLb = bearingStrengthPsi(material.fbryPsi, eOverD) * d * gaugeIn;
  const shearUltimate = Math.min(rivetShear, bearingUltimateLb);

  const rivetTension = rivetTensionStrengthLb(rivet);
  if (rivet.tensionLb === undefined)
    rules.push(rivet.countersunk ? SOLID_TENSION_RULES.countersunk : SOLID_TENSION_RULES.protruding);
  const tests = validateCoupons(input.coupons ?? []);
  const coupons = matchedCouponAllowables(tests, { material: material.key, gaugeIn, rivetSpec: rivet.code });
  let basis: 'coupons' | 'fallback';
  let pullThroughLimitLb: number;
  let pullThroughUltimateLb: number;
  if (coupons.limitLb !== null && coupons.ultimateLb !== null) {
    basis = 'coupons';
    pullThroughLimitLb = coupons.limitLb;
    pullThroughUltimateLb = coupons.ultimateLb;
    rules.push(...COUPON_RULES);
    warnings.push(...coupons.warnings);
  } else {
    basis = 'fallback';
    const fallback = pullThroughFallback(
      { fraction, bearingUltimateLb, rivetCode: rivet.code, gaugeIn, coupons: input.coupons ?? [] },
      tests,
    );
    pullThroughUltimateLb = fallback.ultimateLb;
    pullThroughLimitLb = fallback.limitLb;
    rules.push(...fallback.rules);
    warnings.push(
      `no coupon data for ${gaugeIn} in ${material.key} with ${rivet.code}: pull-through allowable is a conservative fraction (${(fraction * 100).toFixed(0)} %) of the sheet's bearing strength at the hole (in proportion to the gauge)`,
      ...fallback.warnings,
    );
  }
  if (rivet.kind === 'pulled') warnings.push(`${rivet.code}: ${rivet.source}`);

  // Spelled out rather than `...envelope(…)` followed by more fields: V8 builds such a literal some 50
  // times slower, and a rib study asks for the allowables of every candidate on every line.
  return {
    inputs: input,
    rules,
    warnings,
    caution: ENGINEERING_CAUTION,
    material: material.key,
    rivetSpec: rivet.code,
    gaugeIn,
    holeDiameterIn: d,
    edgeDistanceIn,
    eOverD,
    shear: {
      rivetLb: rivetShear,
      bearingUltimateLb,
      bearingYieldLb,
      limitLb: bearingYieldLb,
      ultimateLb: shearUltimate,
      governing: rivetShear <= bearingUltimateLb ? 'rivet shear' : 'sheet bearing',
    },
    tension: {
      rivetLb: rivetTension,
      pullThroughLimitLb,
      pullThroughUltimateLb,
      basis,
      limitLb: pullThroughLimitLb,
      ultimateLb: Math.min(rivetTension, pullThroughUltimateLb),
      governing: pullThroughUltimateLb <= rivetTension ? 'flange pull-through' : 'rivet tension',
    },
  };
}
