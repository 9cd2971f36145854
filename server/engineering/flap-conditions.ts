import { requireWingBound } from './bounds';
import { designConditions, gustLoadFactors } from './design-conditions';
import { dynamicPressurePsi } from './atmosphere';
import { EngineeringInputError } from './errors';
import { ENGINEERING_CAUTION } from './result';
import { inToFt, SQIN_PER_SQFT } from './units';
import type {
  DesignCondition,
  DesignConditionsResult,
  EngineeringResult,
  FlapInput,
  KitInput,
} from '../../lib/engineering-results';

/**
 * Flaps-extended design conditions after 14 CFR 23.345 (High lift devices) as written before the 2017
 * rewrite (Amdt. 23-50, 1996). The paragraphs relied on, as we read them:
 *
 *   (a) If flaps or similar high lift devices are to be used for takeoff, approach or landing, the
 *       airplane, with the flaps fully extended at VF, is assumed to be subjected to symmetrical
 *       maneuvers and gusts within the range determined by—
 *       (1) Maneuvering, to a positive limit load factor of 2.0; and
 *       (2) Positive and negative gust of 25 feet per second acting normal to the flight path in level
 *           flight.
 *   (b) VF must be assumed to be not less than 1.4 VS or 1.8 VSF, whichever is greater, where—
 *       (1) VS is the computed stalling speed with flaps retracted at the design weight; and
 *       (2) VSF is the computed stalling speed with flaps fully extended at the design weight.
 *       (3) If an automatic flap load limiting device is used, the airplane may be designed for the
 *           critical combinations of airspeed and flap position allowed by that device.
 *   (c) In determining external loads on the airplane as a whole, thrust, slipstream, and pitching
 *       acceleration may be assumed to be zero.
 *   (d) The flaps, their operating mechanism and supporting structures must in addition withstand a
 *       head-on gust of 25 ft/s (EAS) with slipstream, and the slipstream at maximum takeoff power.
 *
 * (a)(1), (a)(2), (b)'s structure and (c), (d) were checked against a published copy of the rule; the
 * factors of (b), 1.4 VS and 1.8 VSF, are from memory: verify them against the rule before relying on
 * this. (d) loads the flap itself, not the wing's ribs, and is not computed here; nor is (b)(3).
 *
 * The gust factor is 23.341's formula at VF with Ude = 25 ft/s (no reduction with altitude is given in
 * 23.345), using the kit's lift slope: the flapped wing's lift slope is close to the clean wing's.
 */

export const FLAP_MANEUVER_FACTOR = 2.0;
export const FLAP_GUST_FPS = 25;
/** 23.345(b), from memory: VF ≥ 1.4 VS and ≥ 1.8 VSF. */
export const FLAP_SPEED_FACTORS = { clean: 1.4, flapped: 1.8 } as const;

export interface FlapConditionsResult extends EngineeringResult<{ kit: KitInput; flaps: FlapInput }> {
  /** VF used, and the rule minimum max(1.4 VS, 1.8 VSF) */
  speeds: { stallCleanKeas: number; stallFlapsKeas: number; designMinKeas: number; designKeas: number };
  loadFactors: { maneuver: number; gustUp: number; gustDown: number };
  conditions: DesignCondition[];
}

/** 23.345(b): VF,min = max(1.4·VS, 1.8·VSF). */
export function flapDesignSpeedKeas(stallSpeedKeas: number, stallSpeedFlapsKeas: number): number {
  return Math.max(FLAP_SPEED_FACTORS.clean * stallSpeedKeas, FLAP_SPEED_FACTORS.flapped * stallSpeedFlapsKeas);
}

function validateFlaps(flaps: FlapInput, kit: KitInput): void {
  if (flaps === null || typeof flaps !== 'object')
    throw new EngineeringInputError('flaps', 'the flap data are missing');
  requireWingBound(flaps.stallSpeedKeas, 'flaps.stallSpeedKeas');
  if (flaps.stallSpeedKeas > kit.stallSpeedKeas) {
    throw new EngineeringInputError(
      'flaps.stallSpeedKeas',
      `the stall speed with flaps extended (${flaps.stallSpeedKeas} kt) is above the stall speed with flaps retracted (${kit.stallSpeedKeas} kt): flaps lower it`,
    );
  }
  if (flaps.designSpeedKeas !== undefined) requireWingBound(flaps.designSpeedKeas, 'flaps.designSpeedKeas');
}

/**
 * The flaps-extended conditions of a kit: the 2.0 maneuver and the ±25 ft/s gusts at VF, each with its
 * CL needed = nW/(qS) in the form of the clean-wing conditions (design-conditions.ts).
 */
export function flapConditions(
  kit: KitInput,
  flaps: FlapInput,
  /** `designConditions(kit)`, when the caller has it already */
  design?: DesignConditionsResult,
): FlapConditionsResult {
  // The clean conditions validate the kit and give the lift slope, density and VC the flaps case reads.
  const clean = design ?? designConditions(kit);
  validateFlaps(flaps, kit);
  const warnings: string[] = [];
  const designMinKeas = flapDesignSpeedKeas(kit.stallSpeedKeas, flaps.stallSpeedKeas);
  let designKeas = flaps.designSpeedKeas ?? designMinKeas;
  if (designKeas < designMinKeas) {
    warnings.push(
      `the given flap design speed ${designKeas} kt is below the rule minimum ${designMinKeas.toFixed(1)} kt (1.4 VS, 1.8 VSF): the minimum is used`,
    );
    designKeas = designMinKeas;
  }
  if (designKeas > clean.speeds.cruiseKeas) {
    warnings.push(
      `the flap design speed ${designKeas.toFixed(1)} kt is above VC (${clean.speeds.cruiseKeas.toFixed(1)} kt): flaps used en route are a separate case of 23.345 not covered here`,
    );
  }
  const gust = gustLoadFactors({
    wingLoadingPsf: clean.wingLoadingPsf,
    meanChordFt: inToFt(kit.meanChordIn),
    liftSlopePerRad: clean.gust.liftSlopePerRad,
    densitySlugFt3: clean.gust.densitySlugFt3,
    speedKeas: designKeas,
    gustFps: FLAP_GUST_FPS,
  });
  const qPsi = dynamicPressurePsi(designKeas);
  const make = (id: string, label: string, kind: 'maneuver' | 'gust', n: number): DesignCondition => ({
    id,
    label,
    kind,
    n,
    speedKeas: designKeas,
    qPsi,
    clNeeded: (n * kit.weightLb) / (qPsi * kit.wingAreaSqFt * SQIN_PER_SQFT),
  });
  const conditions = [
    make('flaps-maneuver-up-vf', 'flaps extended: maneuver to n = 2.0 at VF', 'maneuver', FLAP_MANEUVER_FACTOR),
    make('flaps-gust-up-vf', 'flaps extended: up-gust 25 ft/s at VF', 'gust', gust.positive),
    make('flaps-gust-down-vf', 'flaps extended: down-gust 25 ft/s at VF', 'gust', gust.negative),
  ];
  const rules = [
    'flaps extended at VF: maneuvering to a positive limit load factor of 2.0, and positive and negative gusts of 25 ft/s normal to the flight path in level flight (14 CFR 23.345(a))',
    'VF not less than 1.4 VS or 1.8 VSF, whichever is greater (14 CFR 23.345(b); factors from memory: verify)',
    `flap gust factor by 23.341 at VF with Ude = ${FLAP_GUST_FPS} ft/s and the clean wing's lift slope ${clean.gust.liftSlopePerRad.toFixed(3)}/rad`,
  ];
  warnings.push(
    "flaps extended: the section pressure with the flap deflected differs from the clean section's (more load aft); give a Cp table of the flapped section for these conditions",
    'the flap itself, its mechanism and supports (23.345(d): head-on gust and slipstream) are not checked here',
  );
  // Spelled out rather than `...envelope(…)` followed by more fields: V8 builds such a literal far slower.
  return {
    inputs: { kit, flaps },
    rules,
    warnings,
    caution: ENGINEERING_CAUTION,
    speeds: { stallCleanKeas: kit.stallSpeedKeas, stallFlapsKeas: flaps.stallSpeedKeas, designMinKeas, designKeas },
    loadFactors: { maneuver: FLAP_MANEUVER_FACTOR, gustUp: gust.positive, gustDown: gust.negative },
    conditions,
  };
}
