import { EngineeringInputError } from './errors';
import { layoutRules } from './layout';
import { findRivet } from './materials';
import { envelope } from './result';
import { LAYOUT_TOLERANCE_IN, reworkCheck } from './rework-check';
import { requireArray, requireFinite, requireInRange } from './validate';
import type {
  CountersinkCheck,
  RepairAlternative,
  RepairCheckInput,
  RepairCheckResult,
  RepairHoleInput,
  RepairHoleResult,
  RivetSpec,
} from '../../lib/engineering-results';

/**
 * The inspector's repair check over every hole of a finding: a finding often covers a run of holes
 * (a row drilled out together), and the repair passes only if every one of them takes the proposed rivet.
 * Each hole goes through the single-hole rework check (`rework-check.ts`) with the edge distance as
 * measured where the inspector measured it; on top of that, the hole as measured must be cleaned up by
 * the new drill, and a countersunk head must leave the thin sheet a cylindrical bore.
 */

/** One finding is one run of holes on one part; a bound keeps the work (and the stored result) small. */
export const MAX_REPAIR_HOLES = 50;
const MAX_HOLE_ID_LENGTH = 64;
const STATION_RANGE_IN = 1000;
const EDGE_MAX_IN = 10;
const DIAMETER_RANGE_IN: [number, number] = [0.02, 1];
const LOAD_MAX_LB = 100000;

/**
 * Machine countersinking is acceptable only while the countersink (about the head height) takes no more
 * than two thirds of the sheet, so a third remains a cylindrical bore that bears on the shank; deeper, the
 * sheet is knife-edged and must be dimpled. The FAA texts give the floor (countersink only sheet thicker
 * than the head, dimple thinner sheet); two thirds is the shop's design rule of thumb, from memory.
 */
export const COUNTERSINK_MAX_DEPTH_FRACTION = 2 / 3;
const HEAD_INCLUDED_ANGLE_DEG = 100;
/** MS20426 (100°) head diameters by dash, in: from memory, check against the standard's sheet. */
const MS20426_HEAD_DIAMETER_IN: Record<number, number> = { 3: 0.182, 4: 0.225, 5: 0.285, 6: 0.343 };

/**
 * A measured hole counts as larger than the drill only beyond float noise: a reading stored as float32
 * is off by less than 1e-7 in. The layout tolerance is not granted here, because a drill no larger than
 * the hole cuts nothing and leaves the damaged wall in place.
 */
const DIAMETER_FLOAT_SLACK_IN = 1e-6;

const ALTERNATIVE_RANK: Record<string, number> = { none: 0, 'repair with doubler': 1, scrap: 2 };

/** Depth of a countersunk head's cone, h = (Dh − D)/2 / tan(angle/2); null when its head is not known. */
export function countersunkHeadHeightIn(
  spec: Pick<RivetSpec, 'family' | 'dash' | 'nominalDiameterIn' | 'countersunk'>,
): number | null {
  if (!spec.countersunk || !spec.family.startsWith('MS20426')) return null;
  const head = MS20426_HEAD_DIAMETER_IN[spec.dash];
  if (head === undefined) return null;
  const halfAngle = ((HEAD_INCLUDED_ANGLE_DEG / 2) * Math.PI) / 180;
  return (head - spec.nominalDiameterIn) / 2 / Math.tan(halfAngle);
}

export function repairCheck(input: RepairCheckInput): RepairCheckResult {
  const current = findRivet(input.rivetSpec, input.rivetData, 'rivetSpec');
  const proposed = findRivet(input.proposedSpec, input.rivetData, 'proposedSpec');
  const gaugeIn = requireInRange(input.gaugeIn, 'gaugeIn', 0.005, 0.5, 'the gauge (in)');
  const holes = validateHoles(input.holes);
  const layout = layoutRules(proposed);
  const drill = { ...proposed.drill };

  const rules = [
    'each hole is checked as a single rework at the new size; ' +
      'the measured edge distance, where given, replaces the nominal one',
    'a hole measuring larger than the new drill fails: the drill would not clean it up',
  ];
  const countersink = countersinkCheck(proposed, gaugeIn);
  if (countersink) {
    rules.push(
      `countersunk head: machine countersink only where the head height h = (Dh − D)/2 / tan 50° is at most ` +
        `2/3 of the sheet thickness, leaving a third as a cylindrical bore; otherwise dimple ` +
        `(shop rule of thumb, from memory; FAA-H-8083-31 ch. 4: countersink only sheet thicker than the head)`,
    );
  }
  const countersinkReason = countersinkFailure(countersink, proposed, gaugeIn);

  const holeWarnings: { holeId: string; text: string }[] = [];
  const results = holes.map((hole): RepairHoleResult => {
    const measuredEdge = hole.measured?.edgeDistanceIn;
    const edgeUsed = measuredEdge ?? hole.edgeDistanceIn;
    const single = reworkCheck({
      rivetSpec: input.rivetSpec,
      proposedSpec: input.proposedSpec,
      holeStationIn: hole.stationIn,
      neighbourStationsIn: hole.neighbourStationsIn,
      edgeDistanceIn: edgeUsed,
      gaugeIn,
      material: input.material,
      appliedLimitTensionLb: hole.appliedLimitTensionLb,
      appliedLimitShearLb: hole.appliedLimitShearLb,
      coupons: input.coupons,
      materialData: input.materialData,
      rivetData: input.rivetData,
    });
    for (const rule of single.rules) if (!rules.includes(rule)) rules.push(rule);
    for (const text of single.warnings) holeWarnings.push({ holeId: hole.holeId, text });

    const reasons = [...single.reasons];
    let alternative: RepairAlternative = single.alternative;
    const diameter = hole.measured?.holeDiameterIn;
    if (diameter !== undefined) {
      if (diameter > drill.diameterIn + DIAMETER_FLOAT_SLACK_IN) {
        reasons.push(
          `the hole measures ${inches(diameter)} in, larger than the ${drill.name} drill ` +
            `(${inches(drill.diameterIn)} in) of ${proposed.code}: the next size does not clean it up`,
        );
        alternative = worse(alternative, 'repair with doubler');
      } else if (diameter > drill.diameterIn - LAYOUT_TOLERANCE_IN) {
        holeWarnings.push({
          holeId: hole.holeId,
          text:
            `the ${drill.name} drill cuts less than ${LAYOUT_TOLERANCE_IN} in from the hole: ` +
            'make sure it cleans the wall up all round',
        });
      }
      if (diameter < current.drill.diameterIn - LAYOUT_TOLERANCE_IN) {
        holeWarnings.push({
          holeId: hole.holeId,
          text:
            `the hole measures ${inches(diameter)} in, smaller than the ${current.drill.name} drill ` +
            `of ${current.code}: check the measurement`,
        });
      }
    }
    // A knife-edge countersink asks for a dimple, not a doubler or scrap: it sets no alternative.
    if (countersinkReason) reasons.push(countersinkReason);

    const pass = reasons.length === 0;
    return {
      holeId: hole.holeId,
      pass,
      reasons,
      edgeDistanceUsedIn: edgeUsed,
      edgeDistanceMeasured: measuredEdge !== undefined,
      pitchToNeighboursIn: single.pitchToNeighboursIn,
      margins: single.margins,
      alternative: pass ? null : alternative,
    };
  });

  return {
    ...envelope(input, rules, groupWarnings(holeWarnings, results.length)),
    pass: results.every((h) => h.pass),
    holes: results,
    reasons: results.flatMap((h) => h.reasons.map((r) => `${h.holeId}: ${r}`)),
    newDrill: drill,
    requiredEdgeIn: layout.minEdgeIn,
    requiredPitchIn: layout.minPitchIn,
    countersink,
    alternative: results.reduce<RepairAlternative>((worst, h) => worse(worst, h.alternative), null),
  };
}

function countersinkCheck(proposed: RivetSpec, gaugeIn: number): CountersinkCheck | null {
  if (!proposed.countersunk) return null;
  const headHeightIn = countersunkHeadHeightIn(proposed);
  const limitIn = COUNTERSINK_MAX_DEPTH_FRACTION * gaugeIn;
  // Not a measurement: the head height comes from the catalogue, so only float noise is allowed for.
  const pass = headHeightIn !== null && headHeightIn <= limitIn + 1e-9;
  return { required: true, headHeightIn, limitIn, pass };
}

function countersinkFailure(check: CountersinkCheck | null, proposed: RivetSpec, gaugeIn: number): string | null {
  if (!check || check.pass) return null;
  if (check.headHeightIn === null) {
    return (
      `the head height of ${proposed.code} is not known here, so the countersink depth cannot be checked: ` +
      `dimple, or check it against the supplier's head dimensions`
    );
  }
  return (
    'countersink would knife-edge the sheet: dimple instead ' +
    `(the ${proposed.code} head is ${inches(check.headHeightIn)} in deep, ` +
    `more than 2/3 of the ${inches(gaugeIn)} in sheet = ${inches(check.limitIn as number)} in)`
  );
}

function validateHoles(value: unknown): RepairHoleInput[] {
  const holes = requireArray<RepairHoleInput>(value, 'holes', 1, 'list of holes');
  if (holes.length > MAX_REPAIR_HOLES) {
    const got = holes.length;
    throw new EngineeringInputError('holes', `at most ${MAX_REPAIR_HOLES} holes in one repair check (got ${got})`);
  }
  const seen = new Set<string>();
  holes.forEach((hole, i) => {
    const at = `holes[${i}]`;
    if (hole === null || typeof hole !== 'object') throw new EngineeringInputError(at, 'must be a hole');
    const id = hole.holeId;
    if (typeof id !== 'string' || id.trim() === '' || id.length > MAX_HOLE_ID_LENGTH) {
      throw new EngineeringInputError(`${at}.holeId`, `give the hole's name (1–${MAX_HOLE_ID_LENGTH} characters)`);
    }
    if (seen.has(id)) throw new EngineeringInputError(`${at}.holeId`, `hole ${id} is listed twice`);
    seen.add(id);
    const station = requireStation(hole.stationIn, `${at}.stationIn`);
    const neighbours = hole.neighbourStationsIn;
    if (!Array.isArray(neighbours) || neighbours.length !== 2) {
      const why = 'give the previous and the next hole station (null where there is none)';
      throw new EngineeringInputError(`${at}.neighbourStationsIn`, why);
    }
    neighbours.forEach((s, j) => {
      if (s === null) return;
      const field = `${at}.neighbourStationsIn[${j}]`;
      const v = requireStation(s, field);
      if (v === station) throw new EngineeringInputError(field, 'a neighbour cannot sit at the hole itself');
    });
    requireEdge(hole.edgeDistanceIn, `${at}.edgeDistanceIn`);
    if (hole.measured !== undefined) {
      if (hole.measured === null || typeof hole.measured !== 'object') {
        throw new EngineeringInputError(`${at}.measured`, 'must hold the measured hole diameter and/or edge distance');
      }
      const { holeDiameterIn, edgeDistanceIn } = hole.measured;
      if (holeDiameterIn !== undefined) {
        requireInRange(holeDiameterIn, `${at}.measured.holeDiameterIn`, ...DIAMETER_RANGE_IN, 'the hole diameter (in)');
      }
      if (edgeDistanceIn !== undefined) requireEdge(edgeDistanceIn, `${at}.measured.edgeDistanceIn`);
    }
    for (const key of ['appliedLimitTensionLb', 'appliedLimitShearLb'] as const) {
      if (hole[key] !== undefined) requireInRange(hole[key], `${at}.${key}`, 0, LOAD_MAX_LB, 'the load (lb)');
    }
  });
  return holes;
}

function requireStation(value: unknown, field: string): number {
  return requireInRange(value, field, -STATION_RANGE_IN, STATION_RANGE_IN, 'the station (in)');
}

/** An edge distance of zero puts the hole's centre on the edge: refused with the rest of the range. */
function requireEdge(value: unknown, field: string): number {
  const v = requireFinite(value, field);
  if (v <= 0 || v > EDGE_MAX_IN) {
    const why = `the edge distance (in) must be above 0 and at most ${EDGE_MAX_IN} (got ${v})`;
    throw new EngineeringInputError(field, why);
  }
  return v;
}

/** Warnings every hole shares are said once; the others name the holes they concern. */
function groupWarnings(items: { holeId: string; text: string }[], holeCount: number): string[] {
  const byText = new Map<string, string[]>();
  for (const { holeId, text } of items) {
    const ids = byText.get(text) ?? [];
    if (!ids.includes(holeId)) ids.push(holeId);
    byText.set(text, ids);
  }
  return [...byText].map(([text, ids]) => (ids.length === holeCount ? text : `${ids.join(', ')}: ${text}`));
}

function worse(a: RepairAlternative, b: RepairAlternative): RepairAlternative {
  return ALTERNATIVE_RANK[b ?? 'none'] > ALTERNATIVE_RANK[a ?? 'none'] ? b : a;
}

/** Inches to the thousandth, or the ten-thousandth where a drill needs it (#30 is 0.1285). */
function inches(x: number): string {
  return x.toFixed(4).replace(/0$/, '');
}
