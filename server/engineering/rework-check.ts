import { combinedMargin, jointAllowables } from './allowables';
import { EngineeringInputError } from './errors';
import { layoutRules, layoutRuleText } from './layout';
import { findRivet, nextRivetSize } from './materials';
import { envelope, marginOfSafety } from './result';
import { ULTIMATE_FACTOR } from './rivet-loads';
import { requireFinite, requireNonNegative, requirePositive } from './validate';
import type { ReworkInput, ReworkMargins, ReworkResult } from '../../lib/engineering-results';

/**
 * The inspector's question (step 9 of the chain): can this hole be drilled out for the next rivet size?
 * New drill; edge distance ≥ 2D (2.5D countersunk) and pitch to both neighbours ≥ 3D of the new
 * diameter; the new shear, bearing and tension margins; pass or fail with reasons, and when it fails
 * the alternative.
 */

/**
 * Below these the enlarged hole all but breaks into the sheet edge or its neighbour, and a doubler has
 * nothing sound to hold on to: scrap rather than repair (our rule, stated with the result).
 */
const SCRAP_EDGE_DIAMETERS = 1;
const SCRAP_PITCH_DIAMETERS = 1.5;

/**
 * A pitch or edge distance this close below its limit meets it. Half a thousandth of an inch is the
 * resolution an inspector measures to, and it also absorbs stations stored as float32 (`real` in the
 * database): below 1000 in a float32 is off by at most 6e-5 in, so a run laid out at exactly 3D reads
 * back a hair short of it and must not fail for that.
 */
export const LAYOUT_TOLERANCE_IN = 0.0005;

export function reworkCheck(input: ReworkInput): ReworkResult {
  const current = findRivet(input.rivetSpec, input.rivetData, 'rivetSpec');
  const proposed = findRivet(input.proposedSpec, input.rivetData, 'proposedSpec');
  if (proposed.nominalDiameterIn <= current.nominalDiameterIn) {
    throw new EngineeringInputError(
      'proposedSpec',
      `${proposed.code} is not larger than the ${current.code} it would replace`,
    );
  }
  const hole = requireFinite(input.holeStationIn, 'holeStationIn');
  const edge = requirePositive(input.edgeDistanceIn, 'edgeDistanceIn', 'the edge distance');
  requirePositive(input.gaugeIn, 'gaugeIn', 'the gauge');
  if (!Array.isArray(input.neighbourStationsIn) || input.neighbourStationsIn.length !== 2) {
    throw new EngineeringInputError(
      'neighbourStationsIn',
      'give the previous and the next hole station (null where there is none)',
    );
  }
  const neighbours = input.neighbourStationsIn.map((s, i) => {
    if (s === null) return null;
    const v = requireFinite(s, `neighbourStationsIn[${i}]`);
    if (v === hole)
      throw new EngineeringInputError(`neighbourStationsIn[${i}]`, 'a neighbour cannot sit at the hole itself');
    return v;
  }) as [number | null, number | null];
  const tension =
    input.appliedLimitTensionLb === undefined
      ? undefined
      : requireNonNegative(input.appliedLimitTensionLb, 'appliedLimitTensionLb', 'the load');
  const shear =
    input.appliedLimitShearLb === undefined
      ? undefined
      : requireNonNegative(input.appliedLimitShearLb, 'appliedLimitShearLb', 'the load');

  const layout = layoutRules(proposed);
  const d = layout.diameterIn;
  const rules = [
    `${layoutRuleText(proposed.countersunk)} of the new diameter (FAA AC 43.13-1B 4-57)`,
    `a pitch or edge distance within ${LAYOUT_TOLERANCE_IN} in below its limit meets it (measurement resolution)`,
    `alternative on failure: scrap when the new hole would leave less than ${SCRAP_EDGE_DIAMETERS}D of edge distance or less than ${SCRAP_PITCH_DIAMETERS}D to a neighbour (our rule), otherwise repair with a doubler`,
  ];
  const warnings: string[] = [];
  const reasons: string[] = [];
  const next = nextRivetSize(current, input.rivetData);
  if (next && next.code !== proposed.code && next.nominalDiameterIn < proposed.nominalDiameterIn) {
    warnings.push(`${proposed.code} skips a size: the next size up from ${current.code} is ${next.code}`);
  }
  if (proposed.family !== current.family)
    warnings.push(`${proposed.code} is of another rivet family than ${current.code}`);

  if (edge < layout.minEdgeIn - LAYOUT_TOLERANCE_IN) {
    reasons.push(
      `edge distance ${edge.toFixed(4)} in is less than ${proposed.countersunk ? '2.5' : '2'}D = ${layout.minEdgeIn.toFixed(4)} in for ${proposed.code}`,
    );
  }
  const pitches = neighbours.map((n) => (n === null ? null : Math.abs(hole - n))) as [number | null, number | null];
  pitches.forEach((p, i) => {
    if (p !== null && p < layout.minPitchIn - LAYOUT_TOLERANCE_IN) {
      reasons.push(
        `pitch to the ${i === 0 ? 'previous' : 'next'} hole ${p.toFixed(4)} in is less than 3D = ${layout.minPitchIn.toFixed(4)} in for ${proposed.code}`,
      );
    }
  });

  const allow = jointAllowables({
    material: input.material,
    gaugeIn: input.gaugeIn,
    rivetSpec: proposed.code,
    edgeDistanceIn: edge,
    coupons: input.coupons,
    materialData: input.materialData,
    rivetData: input.rivetData,
  });
  rules.push(...allow.rules);
  warnings.push(...allow.warnings);
  const t = tension ?? 0;
  const v = shear ?? 0;
  const margins: ReworkMargins = {
    shearLimit: marginOfSafety(allow.shear.limitLb, v),
    shearUltimate: marginOfSafety(allow.shear.ultimateLb, ULTIMATE_FACTOR * v),
    tensionLimit: marginOfSafety(allow.tension.limitLb, t),
    tensionUltimate: marginOfSafety(allow.tension.ultimateLb, ULTIMATE_FACTOR * t),
    combinedLimit: combinedMargin(t, v, allow.tension.limitLb, allow.shear.limitLb),
    combinedUltimate: combinedMargin(
      ULTIMATE_FACTOR * t,
      ULTIMATE_FACTOR * v,
      allow.tension.ultimateLb,
      allow.shear.ultimateLb,
    ),
  };
  if (tension === undefined && shear === undefined)
    warnings.push('no applied loads given: strength margins are not checked, only the layout');
  if (margins.combinedLimit !== null && margins.combinedLimit < 0)
    reasons.push(`margin of safety at limit load is ${margins.combinedLimit.toFixed(2)} with ${proposed.code}`);
  if (margins.combinedUltimate !== null && margins.combinedUltimate < 0)
    reasons.push(`margin of safety at ultimate load is ${margins.combinedUltimate.toFixed(2)} with ${proposed.code}`);

  const pass = reasons.length === 0;
  const ruinedEdge = edge < SCRAP_EDGE_DIAMETERS * d;
  const ruinedPitch = pitches.some((p) => p !== null && p < SCRAP_PITCH_DIAMETERS * d);
  return {
    ...envelope(input, rules, warnings),
    pass,
    reasons,
    newDrill: proposed.drill,
    requiredEdgeIn: layout.minEdgeIn,
    requiredPitchIn: layout.minPitchIn,
    pitchToNeighboursIn: pitches,
    margins,
    alternative: pass ? null : ruinedEdge || ruinedPitch ? 'scrap' : 'repair with doubler',
  };
}
