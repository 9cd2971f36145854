import { dynamicPressurePsi } from './atmosphere';
import { designConditions } from './design-conditions';
import { flapConditions } from './flap-conditions';
import { ENGINEERING_CAUTION } from './result';
import { SQIN_PER_SQFT } from './units';
import type {
  Category,
  DesignCondition,
  DesignConditionsResult,
  EngineeringResult,
  FlapInput,
  KitInput,
} from '../../lib/engineering-results';

/**
 * The negative corners of the flight envelope at VC and VD (14 CFR 23.333(d), the flight envelope drawn
 * from the maneuvering envelope of 23.333(b) and the gust envelope of 23.333(c)). Checked against a
 * published copy of 23.333(b):
 *
 *   (b) Maneuvering envelope. Except where limited by maximum (static) lift coefficients, the airplane is
 *       assumed to be subjected to symmetrical maneuvers resulting in the following limit load factors:
 *       (1) The positive maneuvering load factor specified in § 23.337 at speeds up to VD;
 *       (2) The negative maneuvering load factor specified in § 23.337 at VC; and
 *       (3) Factors varying linearly with speed from the specified value at VC to 0.0 at VD for the
 *           normal and commuter category, and −1.0 at VD for the acrobatic and utility categories.
 *
 * The envelope's negative corner at each speed is the more negative of the maneuver factor there and
 * the down-gust factor of 23.341 at that speed. design-conditions.ts already studies the negative
 * maneuver at VC and the down-gusts at VC and VD; the maneuver factor at VD, (b)(3), is added here.
 */

/** 23.333(b)(3): the negative maneuvering factor at VD. */
export const NEGATIVE_FACTOR_AT_DIVE: Record<Category, number> = { normal: 0, utility: -1, acrobatic: -1 };

export interface EnvelopeCorner {
  speedKeas: number;
  /** the corner: the more negative of the two */
  n: number;
  governing: 'maneuver' | 'gust';
  maneuverN: number;
  gustN: number;
  /** id of the condition that is the corner */
  conditionId: string;
}

export interface NegativeCornersResult extends EngineeringResult<KitInput> {
  atCruise: EnvelopeCorner;
  atDive: EnvelopeCorner;
  /** the condition design-conditions.ts does not already give: the negative maneuver at VD */
  conditions: DesignCondition[];
}

export function negativeEnvelopeCorners(
  kit: KitInput,
  /** `designConditions(kit)`, when the caller has it already */
  known?: DesignConditionsResult,
): NegativeCornersResult {
  const design = known ?? designConditions(kit);
  const byId = (id: string) => design.conditions.find((c) => c.id === id) as DesignCondition;
  const diveKeas = design.speeds.diveKeas;
  const qPsi = dynamicPressurePsi(diveKeas);
  const nDive = NEGATIVE_FACTOR_AT_DIVE[kit.category];
  const maneuverAtDive: DesignCondition = {
    id: 'maneuver-down-vd',
    label: 'negative maneuver at VD',
    kind: 'maneuver',
    n: nDive,
    speedKeas: diveKeas,
    qPsi,
    clNeeded: (nDive * kit.weightLb) / (qPsi * kit.wingAreaSqFt * SQIN_PER_SQFT),
  };
  const corner = (maneuver: DesignCondition, gust: DesignCondition): EnvelopeCorner => {
    const gustGoverns = gust.n < maneuver.n;
    return {
      speedKeas: maneuver.speedKeas,
      n: Math.min(maneuver.n, gust.n),
      governing: gustGoverns ? 'gust' : 'maneuver',
      maneuverN: maneuver.n,
      gustN: gust.n,
      conditionId: gustGoverns ? gust.id : maneuver.id,
    };
  };
  const rules = [
    `negative maneuvering factor ${design.loadFactors.negative.toFixed(2)} at VC, varying linearly to ${nDive.toFixed(1)} at VD (14 CFR 23.333(b)(2), (3))`,
    'negative corners of the flight envelope at VC and VD: the more negative of the maneuver and down-gust factors (14 CFR 23.333(d))',
  ];
  // Spelled out rather than `...envelope(…)` followed by more fields: V8 builds such a literal far slower.
  return {
    inputs: kit,
    rules,
    warnings: [],
    caution: ENGINEERING_CAUTION,
    atCruise: corner(byId('maneuver-down-vc'), byId('gust-down-vc')),
    atDive: corner(maneuverAtDive, byId('gust-down-vd')),
    conditions: [maneuverAtDive],
  };
}

export interface EnvelopeConditionsResult extends EngineeringResult<{ kit: KitInput; flaps?: FlapInput }> {
  conditions: DesignCondition[];
}

/**
 * Every condition of the envelope a wing study takes: the clean conditions of design-conditions.ts, the
 * negative maneuver at VD, and, when the kit has flaps, the flaps-extended conditions of 23.345.
 */
export function envelopeConditions(
  kit: KitInput,
  flaps?: FlapInput,
  /** `designConditions(kit)`, when the caller has it already: the clean conditions are worked out once */
  known?: DesignConditionsResult,
): EnvelopeConditionsResult {
  const design = known ?? designConditions(kit);
  const corners = negativeEnvelopeCorners(kit, design);
  const flapped = flaps === undefined ? null : flapConditions(kit, flaps, design);
  const rules = [...design.rules, ...corners.rules, ...(flapped ? flapped.rules : [])];
  const warnings = [...design.warnings, ...(flapped ? flapped.warnings : [])];
  // Spelled out rather than `...envelope(…)` followed by more fields: V8 builds such a literal far slower.
  return {
    inputs: { kit, flaps },
    rules,
    warnings,
    caution: ENGINEERING_CAUTION,
    conditions: [...design.conditions, ...corners.conditions, ...(flapped ? flapped.conditions : [])],
  };
}
