import { densitySlugPerFt3, dynamicPressurePsi, GRAVITY_FT_S2 } from './atmosphere';
import { EngineeringInputError } from './errors';
import { ASPECT_RATIO_RANGE, requireStudyBound, WING_LOADING_RANGE_PSF } from './bounds';
import { ENGINEERING_CAUTION } from './result';
import { THIN_AIRFOIL_LIFT_SLOPE } from './thin-airfoil';
import { inToFt, SQIN_PER_SQFT } from './units';
import { requireNonNegative, requireOneOf, requirePositive } from './validate';
import {
  CATEGORIES,
  type Category,
  type DesignCondition,
  type DesignConditionsResult,
  type KitInput,
} from '../../lib/engineering-results';

/**
 * Flight-envelope design conditions after 14 CFR part 23 as written before the 2017 rewrite
 * (23.333, 23.335, 23.337, 23.341). The FAR formulas are in lb, ft², psf, ft/s and knots EAS; they are
 * evaluated in those units here and the conditions handed on carry q in psi.
 */

const POSITIVE_FACTOR: Record<Category, (weightLb: number) => number> = {
  normal: (w) => Math.min(3.8, 2.1 + 24000 / (w + 10000)),
  utility: () => 4.4,
  acrobatic: () => 6.0,
};
const NEGATIVE_RATIO: Record<Category, number> = { normal: 0.4, utility: 0.4, acrobatic: 0.5 };
const CRUISE_FACTOR: Record<Category, number> = { normal: 33, utility: 33, acrobatic: 36 };
const DIVE_FACTOR: Record<Category, number> = { normal: 1.4, utility: 1.5, acrobatic: 1.55 };

/** 23.337: limit maneuvering load factors. */
export function limitManeuverFactors(category: Category, weightLb: number): { positive: number; negative: number } {
  requireOneOf(category, 'kit.category', CATEGORIES);
  requirePositive(weightLb, 'kit.weightLb', 'the weight');
  const positive = POSITIVE_FACTOR[category](weightLb);
  return { positive, negative: -NEGATIVE_RATIO[category] * positive };
}

/** 23.335(c): VA = VS·√n (it need not exceed VC; the caller caps it). */
export function maneuveringSpeedKeas(stallSpeedKeas: number, n: number): number {
  return stallSpeedKeas * Math.sqrt(n);
}

/** Above W/S = 20 psf the 23.335 multiplying factors fall linearly to their value at W/S = 100. */
function wingLoadingTaper(factor: number, floor: number, wingLoadingPsf: number): number {
  if (wingLoadingPsf <= 20) return factor;
  const f = Math.min(1, (wingLoadingPsf - 20) / 80);
  return factor + (floor - factor) * f;
}

/** 23.335(a): VC,min = 33√(W/S) kt (36 for acrobatic), W/S in psf. */
export function minimumCruiseSpeedKeas(wingLoadingPsf: number, category: Category): number {
  return wingLoadingTaper(CRUISE_FACTOR[category], 28.6, wingLoadingPsf) * Math.sqrt(wingLoadingPsf);
}

/** 23.335(b): VD,min = 1.40·VC,min (1.50 utility, 1.55 acrobatic). */
export function minimumDiveSpeedKeas(cruiseMinKeas: number, wingLoadingPsf: number, category: Category): number {
  return wingLoadingTaper(DIVE_FACTOR[category], 1.35, wingLoadingPsf) * cruiseMinKeas;
}

/** 23.333(c): derived gust velocities Ude, ft/s; reduced linearly from 20 000 ft to half at 50 000 ft. */
export function gustVelocitiesFps(altitudeFt: number): { atCruise: number; atDive: number } {
  const f = altitudeFt <= 20000 ? 1 : 1 - 0.5 * Math.min(1, (altitudeFt - 20000) / 30000);
  return { atCruise: 50 * f, atDive: 25 * f };
}

export interface GustInput {
  wingLoadingPsf: number;
  meanChordFt: number;
  liftSlopePerRad: number;
  densitySlugFt3: number;
  speedKeas: number;
  gustFps: number;
}

/** 23.341: μ = 2(W/S)/(ρ c a g), Kg = 0.88μ/(5.3+μ), n = 1 ± Kg·Ude·V·a/(498·W/S) (ft, psf, ft/s, kt EAS). */
export function gustLoadFactors(g: GustInput): {
  massRatio: number;
  alleviationFactor: number;
  positive: number;
  negative: number;
} {
  requirePositive(g.wingLoadingPsf, 'wingLoadingPsf', 'the wing loading');
  requirePositive(g.meanChordFt, 'meanChordFt', 'the mean chord');
  requirePositive(g.liftSlopePerRad, 'liftSlopePerRad', 'the lift slope');
  requirePositive(g.densitySlugFt3, 'densitySlugFt3', 'the air density');
  requireNonNegative(g.speedKeas, 'speedKeas', 'the speed');
  requireNonNegative(g.gustFps, 'gustFps', 'the gust velocity');
  const massRatio = (2 * g.wingLoadingPsf) / (g.densitySlugFt3 * g.meanChordFt * g.liftSlopePerRad * GRAVITY_FT_S2);
  const alleviationFactor = (0.88 * massRatio) / (5.3 + massRatio);
  const dn = (alleviationFactor * g.gustFps * g.speedKeas * g.liftSlopePerRad) / (498 * g.wingLoadingPsf);
  return { massRatio, alleviationFactor, positive: 1 + dn, negative: 1 - dn };
}

/** Helmbold's estimate of a straight wing's lift slope from its aspect ratio, with the thin-airfoil 2π. */
export function estimatedWingLiftSlope(aspectRatio: number): number {
  return (THIN_AIRFOIL_LIFT_SLOPE * aspectRatio) / (2 + Math.sqrt(aspectRatio * aspectRatio + 4));
}

function validateKit(kit: KitInput): void {
  if (kit === null || typeof kit !== 'object') throw new EngineeringInputError('kit', 'the kit data are missing');
  requirePositive(kit.weightLb, 'kit.weightLb', 'the weight');
  requirePositive(kit.wingAreaSqFt, 'kit.wingAreaSqFt', 'the wing area');
  requirePositive(kit.meanChordIn, 'kit.meanChordIn', 'the mean chord');
  requirePositive(kit.stallSpeedKeas, 'kit.stallSpeedKeas', 'the stall speed');
  requireStudyBound(kit.weightLb, 'kit.weightLb');
  requireStudyBound(kit.wingAreaSqFt, 'kit.wingAreaSqFt');
  requireStudyBound(kit.meanChordIn, 'kit.meanChordIn');
  requireStudyBound(kit.stallSpeedKeas, 'kit.stallSpeedKeas');
  requireOneOf(kit.category, 'kit.category', CATEGORIES);
  if (kit.liftSlopePerRad !== undefined) requireStudyBound(kit.liftSlopePerRad, 'kit.liftSlopePerRad');
  if (kit.altitudeFt !== undefined) requireStudyBound(kit.altitudeFt, 'kit.altitudeFt');
  // Derived quantities checked against the field that makes them absurd, before they reach a formula
  // that would only fail later and name something the supplier never typed (the lift slope).
  const aspectRatio = (kit.wingAreaSqFt * SQIN_PER_SQFT) / (kit.meanChordIn * kit.meanChordIn);
  if (aspectRatio < ASPECT_RATIO_RANGE.min || aspectRatio > ASPECT_RATIO_RANGE.max) {
    throw new EngineeringInputError(
      'kit.meanChordIn',
      `a mean chord of ${kit.meanChordIn} in on ${kit.wingAreaSqFt} ft² gives an aspect ratio S/c² of ${aspectRatio.toPrecision(3)}: a wing has ${ASPECT_RATIO_RANGE.min} to ${ASPECT_RATIO_RANGE.max}`,
    );
  }
  const wingLoading = kit.weightLb / kit.wingAreaSqFt;
  if (wingLoading < WING_LOADING_RANGE_PSF.min || wingLoading > WING_LOADING_RANGE_PSF.max) {
    throw new EngineeringInputError(
      'kit.weightLb',
      `${kit.weightLb} lb on ${kit.wingAreaSqFt} ft² is a wing loading of ${wingLoading.toPrecision(3)} psf: this tool takes ${WING_LOADING_RANGE_PSF.min} to ${WING_LOADING_RANGE_PSF.max} psf`,
    );
  }
  if (kit.cruiseSpeedKeas !== undefined) {
    requirePositive(kit.cruiseSpeedKeas, 'kit.cruiseSpeedKeas', 'the cruise speed');
    requireStudyBound(kit.cruiseSpeedKeas, 'kit.cruiseSpeedKeas');
    if (kit.stallSpeedKeas >= kit.cruiseSpeedKeas) {
      throw new EngineeringInputError(
        'kit.stallSpeedKeas',
        `the stall speed (${kit.stallSpeedKeas} kt) must be below the cruise speed (${kit.cruiseSpeedKeas} kt)`,
      );
    }
  }
  if (kit.diveSpeedKeas !== undefined) {
    requirePositive(kit.diveSpeedKeas, 'kit.diveSpeedKeas', 'the dive speed');
    requireStudyBound(kit.diveSpeedKeas, 'kit.diveSpeedKeas');
    if (kit.cruiseSpeedKeas !== undefined && kit.diveSpeedKeas <= kit.cruiseSpeedKeas) {
      throw new EngineeringInputError(
        'kit.diveSpeedKeas',
        `the dive speed (${kit.diveSpeedKeas} kt) must be above the cruise speed (${kit.cruiseSpeedKeas} kt)`,
      );
    }
  }
}

export function designConditions(kit: KitInput): DesignConditionsResult {
  validateKit(kit);
  const rules: string[] = [];
  const warnings: string[] = [];
  const { category, weightLb, wingAreaSqFt } = kit;
  const wingLoadingPsf = weightLb / wingAreaSqFt;

  const loadFactors = limitManeuverFactors(category, weightLb);
  rules.push(
    category === 'normal'
      ? 'limit maneuvering load factor, normal category: n = 2.1 + 24000/(W + 10000), not more than 3.8 (14 CFR 23.337)'
      : `limit maneuvering load factor, ${category} category: n = ${loadFactors.positive} (14 CFR 23.337)`,
    `negative limit maneuvering load factor: ${NEGATIVE_RATIO[category]} × positive (14 CFR 23.337)`,
  );

  const cruiseMinKeas = minimumCruiseSpeedKeas(wingLoadingPsf, category);
  const diveMinKeas = minimumDiveSpeedKeas(cruiseMinKeas, wingLoadingPsf, category);
  rules.push(
    `VC,min = ${CRUISE_FACTOR[category]}·√(W/S) kt, VD,min = ${DIVE_FACTOR[category]}·VC,min, VD ≥ 1.25·VC (14 CFR 23.335)`,
  );
  if (kit.stallSpeedKeas >= cruiseMinKeas && kit.cruiseSpeedKeas === undefined) {
    throw new EngineeringInputError(
      'kit.stallSpeedKeas',
      `the stall speed (${kit.stallSpeedKeas} kt) is not below the minimum design cruise speed (${cruiseMinKeas.toFixed(1)} kt) for this wing loading`,
    );
  }
  let cruiseKeas = kit.cruiseSpeedKeas ?? cruiseMinKeas;
  if (cruiseKeas < cruiseMinKeas) {
    warnings.push(
      `the given cruise speed ${cruiseKeas} kt is below the rule minimum ${cruiseMinKeas.toFixed(1)} kt for W/S = ${wingLoadingPsf.toFixed(2)} psf: the minimum is used`,
    );
    cruiseKeas = cruiseMinKeas;
  }
  const diveFloor = Math.max(diveMinKeas, 1.25 * cruiseKeas);
  let diveKeas = kit.diveSpeedKeas ?? diveFloor;
  if (diveKeas < diveFloor) {
    warnings.push(
      `the given dive speed ${diveKeas} kt is below the rule minimum ${diveFloor.toFixed(1)} kt: the minimum is used`,
    );
    diveKeas = diveFloor;
  }
  const maneuveringKeas = Math.min(maneuveringSpeedKeas(kit.stallSpeedKeas, loadFactors.positive), cruiseKeas);
  rules.push('VA = VS·√n, not more than VC (14 CFR 23.335)');

  const aspectRatio = (wingAreaSqFt * SQIN_PER_SQFT) / (kit.meanChordIn * kit.meanChordIn);
  const liftSlopePerRad = kit.liftSlopePerRad ?? estimatedWingLiftSlope(aspectRatio);
  if (kit.liftSlopePerRad === undefined) {
    warnings.push(
      `wing lift slope not given: estimated ${liftSlopePerRad.toFixed(3)}/rad from aspect ratio S/c² = ${aspectRatio.toFixed(2)} (Helmbold, straight wing)`,
    );
  }
  const altitudeFt = kit.altitudeFt ?? 0;
  const densitySlugFt3 = densitySlugPerFt3(altitudeFt);
  const ude = gustVelocitiesFps(altitudeFt);
  const gustAt = (speedKeas: number, gustFps: number) =>
    gustLoadFactors({
      wingLoadingPsf,
      meanChordFt: inToFt(kit.meanChordIn),
      liftSlopePerRad,
      densitySlugFt3,
      speedKeas,
      gustFps,
    });
  const gustC = gustAt(cruiseKeas, ude.atCruise);
  const gustD = gustAt(diveKeas, ude.atDive);
  rules.push(
    `gust: μ = 2(W/S)/(ρ·c·a·g), Kg = 0.88μ/(5.3+μ), n = 1 ± Kg·Ude·V·a/(498·W/S); Ude ${ude.atCruise} ft/s at VC, ${ude.atDive} ft/s at VD (14 CFR 23.341, 23.333(c))`,
    'lift coefficient needed CL = n·W/(q·S); the rib section is taken to work at the wing CL (uniform spanwise lift)',
  );

  const make = (
    id: string,
    label: string,
    kind: 'maneuver' | 'gust',
    n: number,
    speedKeas: number,
  ): DesignCondition => {
    const qPsi = dynamicPressurePsi(speedKeas);
    return { id, label, kind, n, speedKeas, qPsi, clNeeded: (n * weightLb) / (qPsi * wingAreaSqFt * SQIN_PER_SQFT) };
  };
  const conditions = [
    make('maneuver-up-va', 'positive maneuver at VA', 'maneuver', loadFactors.positive, maneuveringKeas),
    make('maneuver-up-vd', 'positive maneuver at VD', 'maneuver', loadFactors.positive, diveKeas),
    make('gust-up-vc', 'up-gust at VC', 'gust', gustC.positive, cruiseKeas),
    make('gust-up-vd', 'up-gust at VD', 'gust', gustD.positive, diveKeas),
    make('maneuver-down-vc', 'negative maneuver at VC', 'maneuver', loadFactors.negative, cruiseKeas),
    make('gust-down-vc', 'down-gust at VC', 'gust', gustC.negative, cruiseKeas),
    make('gust-down-vd', 'down-gust at VD', 'gust', gustD.negative, diveKeas),
  ];

  // Spelled out rather than `...envelope(…)` followed by more fields: V8 builds such a literal far slower.
  return {
    inputs: kit,
    rules,
    warnings,
    caution: ENGINEERING_CAUTION,
    wingLoadingPsf,
    loadFactors,
    speeds: { stallKeas: kit.stallSpeedKeas, maneuveringKeas, cruiseKeas, diveKeas, cruiseMinKeas, diveMinKeas },
    gust: {
      liftSlopePerRad,
      densitySlugFt3,
      massRatio: gustC.massRatio,
      alleviationFactor: gustC.alleviationFactor,
      atCruiseFps: ude.atCruise,
      atDiveFps: ude.atDive,
    },
    conditions,
  };
}
