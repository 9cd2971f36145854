import { surfacePoints, type AirfoilGeometry } from './airfoil';
import { requireCount, requireWingBound, STUDY_BUDGET } from './bounds';
import { EngineeringInputError } from './errors';
import { findRivet } from './materials';
import { cpOnSurface, pressureDistribution, alphaForLiftCoefficient } from './panel-method';
import { compactNumbers, envelope } from './result';
import { lineStationCount, lineStations, validateLine } from './rib-geometry';
import {
  PRESSURE_RULES,
  sectionContext,
  studyRibAt,
  validateStudy,
  type RibPlace,
  type SectionContext,
} from './rib-study';
import { loadEnvelope } from './rivet-loads';
import { roundStored } from './rounding';
import { chordAt, planformGeometry, schrenkStationOf, SCHRENK_ASSUMPTIONS, SCHRENK_RULE } from './schrenk';
import { skinPanelStudy, SKIN_RULES, type SkinPanelSpec } from './skin-panel';
import { estimateStudyWork, requireStudyBudget } from './study-work';
import { momentCoefficientAbout, spanwiseLoads, type SectionMoment, type StationLoads } from './wing-loads';
import { requireArray, requireOneOf } from './validate';
import { conditionPressures } from './rib-study';
import { SQIN_PER_SQFT } from './units';
import { machNumber } from './compressibility';
import type {
  DesignCondition,
  FastenerLineInput,
  Planform,
  Point,
  RankBy,
  RibStudyInput,
  RibStudyResult,
  SkinPanelResult,
  StudyWork,
  WingCondition,
  WingRib,
  WingRibInput,
  WingStudyInput,
  WingStudyResult,
  WingTradeRow,
} from '../../lib/engineering-results';
import { countText } from '../../lib/number-text';

/**
 * The whole wing: every rib at its own span station and every skin panel between two ribs, for the whole
 * flight envelope (design-conditions.ts, the negative corners of envelope-corners.ts, the flaps of
 * flap-conditions.ts when given).
 *
 * - The wing's lift in each condition is n·W plus the tail's balancing download (given, or estimated
 *   from the section's zero-lift moment over the tail arm), so the wing lifts what the tail pushes down.
 * - Each rib's section works at its own lift coefficient, the wing's CL times Schrenk's cl/CL at its
 *   station (schrenk.ts), and is studied at its own chord and tributary width (rib-study.ts).
 * - Shear, bending and torque at every station come from the spanwise integration of that lift and of
 *   the sections' moment about the box (wing-loads.ts); the skin's shear flow goes to the rib lines and
 *   to the skin panels (skin-panel.ts).
 * - A trade table across the ribs: one gauge and rivet for every rib against a choice per rib.
 */

/** Ribs a wing study takes at once: a light aircraft's wing has fewer. */
export const MAX_WING_RIBS = 24;
/** A whole wing's work: its ribs' and panels' counts summed, against this many single-rib budgets. */
export const WING_BUDGET_FACTOR = 6;
/** Skin load stations × skin candidates a wing may schedule (the demo wing: about 130,000). */
export const WING_SKIN_BUDGET = 1_000_000;
/** x/c of the section's aerodynamic centre for the tail estimate (thin-airfoil theory) */
const QUARTER_CHORD = 0.25;
const STATION_STEP_IN = 0.1;

function validateWing(input: WingStudyInput): Planform {
  if (input === null || typeof input !== 'object')
    throw new EngineeringInputError('input', 'the study input is missing');
  const planform = planformGeometry(input.planform);
  const half = planform.spanIn / 2;
  const ribs = requireArray<WingRibInput>(input.ribs, 'ribs', 2, 'list of ribs');
  requireCount(ribs, 'ribs', { what: 'the number of ribs', min: 2, max: MAX_WING_RIBS, unit: 'ribs', integer: true });
  let last = -Infinity;
  ribs.forEach((r, i) => {
    if (r === null || typeof r !== 'object')
      throw new EngineeringInputError(`ribs[${i}]`, 'each rib needs a name and a station');
    if (typeof r.name !== 'string' || !r.name.trim())
      throw new EngineeringInputError(`ribs[${i}].name`, 'name the rib');
    const y = requireWingBound(r.stationIn, 'ribs[].stationIn', `ribs[${i}].stationIn`);
    if (y > half)
      throw new EngineeringInputError(
        `ribs[${i}].stationIn`,
        `a rib ${y} in from the centre line is beyond the ${half} in half-span`,
      );
    if (y <= last + 0.5)
      throw new EngineeringInputError(
        `ribs[${i}].stationIn`,
        `ribs go from root to tip, each at least 0.5 in outboard of the one before (got ${y} in after ${last} in)`,
      );
    last = y;
  });
  const names = ribs.map((r) => r.name.trim().toLowerCase());
  names.forEach((n, i) => {
    if (names.indexOf(n) !== i)
      throw new EngineeringInputError(`ribs[${i}].name`, `two ribs are called "${ribs[i].name}"`);
  });
  if (input.tail === null || typeof input.tail !== 'object')
    throw new EngineeringInputError(
      'tail',
      'give the tail arm (and its balancing load, or leave that to the estimate)',
    );
  requireWingBound(input.tail.armIn, 'tail.armIn');
  if (input.tail.balancingLoadLb !== undefined) requireWingBound(input.tail.balancingLoadLb, 'tail.balancingLoadLb');
  const spars = input.spars;
  if (spars === null || typeof spars !== 'object')
    throw new EngineeringInputError('spars', 'give the front and rear spar positions');
  requireWingBound(spars.frontXc, 'spars.frontXc');
  requireWingBound(spars.rearXc, 'spars.rearXc');
  if (spars.rearXc - spars.frontXc < 0.1)
    throw new EngineeringInputError('spars.rearXc', 'the rear spar must be at least 0.1 chord aft of the front spar');
  if (spars.capAreaSqIn !== undefined) requireWingBound(spars.capAreaSqIn, 'spars.capAreaSqIn');
  const rib = input.rib;
  if (rib === null || typeof rib !== 'object') throw new EngineeringInputError('rib', 'the rib data are missing');
  const skin = input.skin;
  if (skin === null || typeof skin !== 'object')
    throw new EngineeringInputError('skin', 'choose the skin gauges and rivets');
  requireArray<number>(skin.gaugeCandidates, 'skin.gaugeCandidates', 1, 'list of gauges');
  requireCount(skin.gaugeCandidates, 'skin.gaugeCandidates', {
    what: 'the number of skin gauges',
    min: 1,
    max: 6,
    unit: 'gauges',
    integer: true,
  });
  skin.gaugeCandidates.forEach((g, i) => requireWingBound(g, 'panel.thicknessIn', `skin.gaugeCandidates[${i}]`));
  requireArray<string>(skin.rivetCandidates, 'skin.rivetCandidates', 1, 'list of rivet specs');
  requireCount(skin.rivetCandidates, 'skin.rivetCandidates', {
    what: 'the number of skin rivets',
    min: 1,
    max: 4,
    unit: 'rivets',
    integer: true,
  });
  skin.rivetCandidates.forEach((c, i) => findRivet(c, input.rivetData, `skin.rivetCandidates[${i}]`));
  if (input.compressibility !== undefined) requireOneOf(input.compressibility, 'compressibility', PRESSURE_RULES);
  const lines = requireArray<FastenerLineInput>(rib.lines, 'rib.lines', 1, 'list of fastener lines');
  lines.forEach((l, i) => validateLine(l, `rib.lines[${i}]`));
  return planform;
}

/** A rib's tributary width: half of each neighbouring bay; the last rib also carries the tip beyond it. */
function tributaryWidths(stations: number[], halfSpanIn: number): number[] {
  return stations.map((y, i) => {
    const inboard = i > 0 ? (y - stations[i - 1]) / 2 : 0;
    const outboard = i < stations.length - 1 ? (stations[i + 1] - y) / 2 : halfSpanIn - y;
    return inboard + outboard;
  });
}

/** Thickness of the section at x/c (upper minus lower), unit chord. */
function thicknessAt(geometry: AirfoilGeometry, xc: number): number {
  const at = (pts: Point[]) => {
    for (let i = 1; i < pts.length; i++) {
      const [x0, y0] = pts[i - 1];
      const [x1, y1] = pts[i];
      if ((x0 <= xc && xc <= x1) || (x1 <= xc && xc <= x0))
        return x1 === x0 ? y0 : y0 + ((y1 - y0) * (xc - x0)) / (x1 - x0);
    }
    return 0;
  };
  return at(surfacePoints(geometry, 'upper')) - at(surfacePoints(geometry, 'lower'));
}

/** The box between the spars at unit chord: width, mean depth and enclosed area. */
function boxAtUnitChord(geometry: AirfoilGeometry, frontXc: number, rearXc: number) {
  const steps = 50;
  let area = 0;
  for (let k = 0; k < steps; k++) {
    const a = frontXc + ((rearXc - frontXc) * k) / steps;
    const b = frontXc + ((rearXc - frontXc) * (k + 1)) / steps;
    area += 0.5 * (b - a) * (thicknessAt(geometry, a) + thicknessAt(geometry, b));
  }
  const width = rearXc - frontXc;
  return { width, depth: area / width, area };
}

/** The section's moment about x/c = xRef, linear in cl, from its incompressible pressures at cl 0 and 1. */
function sectionMoment(ctx: SectionContext, xRef: number): SectionMoment & { cmAc: number } {
  const at = (cl: number) => pressureDistribution(ctx.flow, alphaForLiftCoefficient(ctx.flow, cl));
  const cm0 = momentCoefficientAbout(at(0), xRef);
  const cm1 = momentCoefficientAbout(at(0.5), xRef);
  return { cm0, perCl: (cm1 - cm0) / 0.5, cmAc: momentCoefficientAbout(at(0), QUARTER_CHORD) };
}

export function wingStudy(input: WingStudyInput): WingStudyResult {
  const planform = validateWing(input);
  const half = planform.spanIn / 2;
  const kit = input.kit;
  const stations = input.ribs.map((r) => r.stationIn);
  const spacings = tributaryWidths(stations, half);
  const ribInputs: RibStudyInput[] = input.ribs.map((r, i) => ({
    kit,
    airfoil: input.airfoil,
    cpTables: input.cpTables,
    panels: input.panels,
    flaps: input.flaps,
    compressibility: input.compressibility,
    rib: {
      chordIn: chordAt(planform, r.stationIn / half),
      spacingIn: Math.min(60, Math.max(2, spacings[i])),
      internalCp: input.rib.internalCp,
      flangeWidthIn: input.rib.flangeWidthIn,
      skinGaugeIn: input.rib.skinGaugeIn,
    },
    lines: input.rib.lines,
    material: input.material,
    gaugeCandidates: input.gaugeCandidates,
    rivetCandidates: input.rivetCandidates,
    maxPitchDiameters: input.maxPitchDiameters,
    pitchIncrementIn: input.pitchIncrementIn,
    maxZones: input.maxZones,
    minutesPerHole: input.minutesPerHole,
    rankBy: input.rankBy,
    coupons: input.coupons,
    pullThroughFallbackFraction: input.pullThroughFallbackFraction,
    materialData: input.materialData,
    rivetData: input.rivetData,
  }));
  // Everything a rib takes (material, candidates, layout, lines, flange) is checked as a rib study checks
  // it, its refusals placed where the wing input has the field.
  try {
    validateStudy(ribInputs[0]);
  } catch (e) {
    if (e instanceof EngineeringInputError)
      throw new EngineeringInputError(e.field.startsWith('lines') ? `rib.${e.field}` : e.field, e.reason);
    throw e;
  }
  spacings.forEach((s, i) => {
    if (s > 60)
      throw new EngineeringInputError(
        `ribs[${i}].stationIn`,
        `rib ${input.ribs[i].name} carries a ${s.toFixed(1)} in wide strip of wing: at most 60 in; add a rib`,
      );
  });

  // The work of every rib, counted before anything is solved; the sum against the wing's budget.
  const rivets = input.rivetCandidates.map((c, i) => findRivet(c, input.rivetData, `rivetCandidates[${i}]`));
  let works: (StudyWork & { lineLengthsIn: number[] })[] = [];
  const ctx = sectionContext(input, (geometry, conditions) => {
    works = ribInputs.map((ri, i) => {
      try {
        const w = estimateStudyWork(ri, geometry, rivets, conditions, STATION_STEP_IN);
        requireStudyBudget(ri, w, rivets.length);
        return w;
      } catch (e) {
        if (e instanceof EngineeringInputError)
          throw new EngineeringInputError(
            e.field.startsWith('rib.') ? `ribs[${i}].stationIn` : e.field,
            `rib ${input.ribs[i].name}: ${e.reason}`,
          );
        throw e;
      }
    });
    const total = works.reduce((n, w) => n + w.stationChecks, 0);
    if (total > STUDY_BUDGET.stationChecks * WING_BUDGET_FACTOR) {
      throw new EngineeringInputError(
        'gaugeCandidates',
        `${input.ribs.length} ribs make ${countText(total)} load checks; at most ${countText(STUDY_BUDGET.stationChecks * WING_BUDGET_FACTOR)}: study fewer gauges or rivets at once`,
      );
    }
    // The skin panels: two spar lines across each bay and two rib lines between the spars, every one
    // scheduled for each skin candidate, on both surfaces.
    const skinCandidates = input.skin.gaugeCandidates.length * input.skin.rivetCandidates.length;
    let skinStations = 0;
    for (let i = 0; i + 1 < stations.length; i++) {
      for (const surface of ['upper', 'lower'] as const) {
        const ribLine = (k: number) =>
          lineStationCount(
            geometry,
            { name: 'skin', surface, startXc: input.spars.frontXc, endXc: input.spars.rearXc },
            ribInputs[k].rib.chordIn,
            STATION_STEP_IN,
          ).count;
        skinStations +=
          2 * (Math.ceil((stations[i + 1] - stations[i]) / STATION_STEP_IN) + 1) + ribLine(i) + ribLine(i + 1);
      }
    }
    if (skinStations * skinCandidates > WING_SKIN_BUDGET) {
      throw new EngineeringInputError(
        skinCandidates > 1 ? 'skin.gaugeCandidates' : 'ribs',
        `the skin panels have ${countText(skinStations)} load stations × ${skinCandidates} candidates to schedule; at most ${countText(WING_SKIN_BUDGET)}: study fewer skin gauges or rivets at once`,
      );
    }
  });
  const wingAreaSqIn = kit.wingAreaSqFt * SQIN_PER_SQFT;
  const warnings: string[] = [];
  if (Math.abs(planform.areaSqIn - wingAreaSqIn) > 0.05 * wingAreaSqIn) {
    warnings.push(
      `the planform's area (${(planform.areaSqIn / SQIN_PER_SQFT).toFixed(1)} ft²) differs from the kit's wing area (${kit.wingAreaSqFt} ft²) by more than 5 %: the lift is spread over the planform as given`,
    );
  }

  // The tail: its 1-g balancing download, given or from the section's zero-lift moment, scaled with q.
  const mid = (input.spars.frontXc + input.spars.rearXc) / 2;
  const moment = sectionMoment(ctx, mid);
  const tailEstimated = input.tail.balancingLoadLb === undefined;
  const cruiseQ = ctx.conditions.find((c) => c.id.endsWith('-vc'))?.qPsi ?? ctx.conditions[0].qPsi;
  const oneGTail = tailEstimated
    ? (-moment.cmAc * cruiseQ * wingAreaSqIn * kit.meanChordIn) / input.tail.armIn
    : input.tail.balancingLoadLb!;
  const conditions: WingCondition[] = ctx.conditions.map((c) => {
    // The moment part grows with q (cm_ac·q·S·c̄): a download at speed whatever the load factor.
    const tailLoadLb = tailEstimated
      ? (-moment.cmAc * c.qPsi * wingAreaSqIn * kit.meanChordIn) / input.tail.armIn
      : (input.tail.balancingLoadLb! * c.qPsi) / cruiseQ;
    const wingLiftLb = c.n * kit.weightLb + tailLoadLb;
    const wingCl = wingLiftLb / (c.qPsi * wingAreaSqIn);
    return { ...c, mach: machNumber(c.speedKeas, ctx.altitudeFt), tailLoadLb, wingLiftLb, wingCl };
  });
  const byId = new Map(conditions.map((c) => [c.id, c]));

  const grading = {
    loadRatio: (eta: number) => schrenkStationOf(planform, eta).loadRatio,
    clRatio: (eta: number) => schrenkStationOf(planform, eta).clRatio,
  };
  /**
   * A section's share of each condition's lift at η: the wing's CL (the tail changes the wing's lift) graded
   * by Schrenk, as a ratio to the condition's n·W-based CL.
   */
  const sectionRatioAt = (eta: number) => {
    const clRatio = grading.clRatio(eta);
    return (c: DesignCondition) => (c.clNeeded === 0 ? 0 : (byId.get(c.id)!.wingCl / c.clNeeded) * clRatio);
  };
  const box = boxAtUnitChord(ctx.geometry, input.spars.frontXc, input.spars.rearXc);
  // Loads at every rib, per condition.
  const perCondition = conditions.map((c) =>
    spanwiseLoads(planform, grading, moment, { wingLiftLb: c.wingLiftLb, wingCl: c.wingCl, qPsi: c.qPsi }, stations),
  );
  const envelopeAt = (i: number) => {
    const pick = (f: (l: StationLoads) => number) => {
      let best = 0;
      let id = conditions[0].id;
      perCondition.forEach((loads, k) => {
        if (Math.abs(f(loads[i])) > Math.abs(best)) {
          best = f(loads[i]);
          id = conditions[k].id;
        }
      });
      return { value: Math.abs(best), id };
    };
    return { shear: pick((l) => l.shearLb), bending: pick((l) => l.bendingInLb), torque: pick((l) => l.torqueInLb) };
  };

  const rules = [
    ...ctx.rules,
    SCHRENK_RULE,
    SCHRENK_ASSUMPTIONS,
    tailEstimated
      ? `tail balancing load estimated from the section's zero-lift moment cm_ac = ${moment.cmAc.toFixed(4)}: P = −cm_ac·q·S·c̄ / l_t (download +), l_t = ${input.tail.armIn} in; c.g. at the wing's aerodynamic centre`
      : `tail balancing load ${input.tail.balancingLoadLb} lb (down +) at VC as given, scaled with the dynamic pressure`,
    "wing lift in each condition L = n·W + tail download; each rib's section at the wing CL × its Schrenk cl/CL",
    "spanwise shear, bending and torque by integrating the lift and the sections' moment about the mid-box from the tip inward (trapezoid rule, 2,000 steps)",
    "rib lines carry the skin's torsion shear flow at their station, q = T/(2A), together with the largest pull",
    `one gauge and rivet for every rib: feasible on every rib, ranked with pull-through backed by coupons on every rib first, then by ${input.rankBy === 'buildTime' ? 'build time' : 'weight'}`,
    ...SKIN_RULES,
  ];

  // Every rib at its own station.
  const ribs: WingRib[] = input.ribs.map((r, i) => {
    const eta = r.stationIn / half;
    const clRatio = grading.clRatio(eta);
    const env = envelopeAt(i);
    const chord = ribInputs[i].rib.chordIn;
    const cellAreaSqIn = box.area * chord * chord;
    const shearFlowLbPerIn = env.torque.value / (2 * cellAreaSqIn);
    const place: RibPlace = {
      sectionRatio: sectionRatioAt(eta),
      shearFlowLbPerIn,
      rules: [],
      warnings:
        eta > 0.95
          ? ["Schrenk overstates the lift close to the tip: this rib's loads are approximate (conservative)"]
          : [],
    };
    let study: RibStudyResult;
    try {
      study = studyRibAt(ribInputs[i], ctx, place, works[i]);
    } catch (e) {
      if (e instanceof EngineeringInputError) throw new EngineeringInputError(e.field, `rib ${r.name}: ${e.reason}`);
      throw e;
    }
    const {
      inputs: _i,
      rules: _r,
      caution: _c,
      design: _d,
      airfoil: _a,
      outline: _o,
      conditions: conds,
      ...rest
    } = study;
    void _i;
    void _r;
    void _c;
    void _d;
    void _a;
    void _o;
    return {
      name: r.name,
      stationIn: r.stationIn,
      eta,
      chordIn: chord,
      spacingIn: ribInputs[i].rib.spacingIn,
      clRatio,
      loads: {
        shearLb: env.shear.value,
        bendingInLb: env.bending.value,
        torqueInLb: env.torque.value,
        shearFlowLbPerIn,
        governing: { shear: env.shear.id, bending: env.bending.id, torque: env.torque.id },
      },
      study: { ...rest, conditions: conds.map(({ cp: _cp, ...c }) => (void _cp, c)) },
    };
  });
  for (const rib of ribs) warnings.push(...rib.study.warnings);

  // Skin panels between every two neighbouring ribs, on both surfaces.
  const capArea = input.spars.capAreaSqIn ?? 0;
  if (input.spars.capAreaSqIn === undefined)
    warnings.push(
      'spar-cap area not given: the skin alone is taken to carry the bending (conservative for the skin, not for the caps)',
    );
  const skins: SkinPanelResult[] = [];
  let skinSchedules = 0;
  // Each rib's pressures, made once: an inner rib bounds the bay on each side of it.
  const pressuresAtRib = stations.map((y) => conditionPressures(ctx, sectionRatioAt(y / half), []));
  for (let i = 0; i + 1 < input.ribs.length; i++) {
    const chord = ribInputs[i].rib.chordIn;
    const inner = perCondition.map((l) => l[i]);
    const ribPressures = [pressuresAtRib[i], pressuresAtRib[i + 1]];
    for (const surface of ['upper', 'lower'] as const) {
      // Positive bending (lift up) compresses the upper skin; negative, the lower.
      const compressionMomentInLb = Math.max(
        0,
        ...inner.map((l) => (surface === 'upper' ? l.bendingInLb : -l.bendingInLb)),
      );
      const pullAt = (xc: number, width: number) =>
        Math.max(
          0,
          ...ribPressures.flatMap(
            (conds) =>
              loadEnvelope(
                [xc],
                conds.map((c) => ({ id: c.id, qPsi: c.qPsi, cpAt: (x: number) => cpOnSurface(c.cp, surface, x) })),
                input.rib.internalCp ?? 0,
                width,
              )[0].limitLbPerIn,
          ),
        );
      const widthIn = stations[i + 1] - stations[i];
      const shortSide = Math.min(widthIn, box.width * chord);
      const ribLine = (k: number) => {
        const c = ribInputs[k].rib.chordIn;
        const st = lineStations(
          ctx.geometry,
          { name: 'skin', surface, startXc: input.spars.frontXc, endXc: input.spars.rearXc },
          c,
          STATION_STEP_IN,
        );
        const env = loadEnvelope(
          st.map((s) => s.xc),
          ribPressures[k - i].map((cd) => ({
            id: cd.id,
            qPsi: cd.qPsi,
            cpAt: (x: number) => cpOnSurface(cd.cp, surface, x),
          })),
          input.rib.internalCp ?? 0,
          ribInputs[k].rib.spacingIn,
        );
        return st.map((s, j) => ({
          stationIn: s.stationIn,
          alongIn: s.alongIn,
          limitTensionLbPerIn: env[j].limitLbPerIn,
          limitShearLbPerIn: 0,
          xIn: s.xIn,
          yIn: s.yIn,
        }));
      };
      const spec: SkinPanelSpec = {
        name: `${input.ribs[i].name}–${input.ribs[i + 1].name} ${surface}`,
        surface,
        innerRib: input.ribs[i].name,
        outerRib: input.ribs[i + 1].name,
        innerStationIn: stations[i],
        outerStationIn: stations[i + 1],
        boxWidthIn: box.width * chord,
        boxDepthIn: box.depth * chord,
        cellAreaSqIn: box.area * chord * chord,
        capAreaSqIn: capArea,
        torqueInLb: Math.max(...inner.map((l) => Math.abs(l.torqueInLb))),
        shearLb: Math.max(...inner.map((l) => Math.abs(l.shearLb))),
        compressionMomentInLb,
        sparPullLbPerIn: {
          front: pullAt(input.spars.frontXc, shortSide / 2),
          rear: pullAt(input.spars.rearXc, shortSide / 2),
        },
        ribLines: { inner: ribLine(i), outer: ribLine(i + 1) },
      };
      try {
        skins.push(
          skinPanelStudy(spec, {
            material: input.material,
            gaugeCandidates: input.skin.gaugeCandidates,
            rivetCandidates: input.skin.rivetCandidates,
            maxPitchDiameters: input.maxPitchDiameters,
            pitchIncrementIn: input.pitchIncrementIn,
            maxZones: input.maxZones,
            minutesPerHole: input.minutesPerHole,
            coupons: input.coupons,
            pullThroughFallbackFraction: input.pullThroughFallbackFraction,
            materialData: input.materialData,
            rivetData: input.rivetData,
          }),
        );
      } catch (e) {
        if (e instanceof EngineeringInputError)
          throw new EngineeringInputError(
            e.field.startsWith('panel.') ? 'skin.gaugeCandidates' : e.field,
            `skin panel ${spec.name}: ${e.reason}`,
          );
        throw e;
      }
      skinSchedules += input.skin.gaugeCandidates.length * input.skin.rivetCandidates.length * 4;
    }
  }
  warnings.push(
    "a skin's rib line and the rib's flange line are one row of holes: lay out the tighter pitch of the two",
    ...skins.flatMap((s) => (s.recommended ? [] : [`skin panel ${s.name}: no candidate carries its loads`])),
  );

  const trade = wingTrade(ribs, input.rankBy ?? 'weight');
  // What is kept of each rib's candidates: see WingRib.study.
  for (const rib of ribs) {
    rib.study.candidates = rib.study.candidates.map((c) =>
      c.holesStored || sameKey(c, trade.recommendedUniform)
        ? withoutHoles(c)
        : { ...c, holesStored: false, warnings: [], lines: [] },
    );
  }
  const totalWork = works.reduce(
    (t, w) => ({
      stations: t.stations + w.stations,
      conditions: w.conditions,
      candidates: t.candidates + w.candidates,
      pitchGrid: Math.max(t.pitchGrid, w.pitchGrid),
      gridCells: t.gridCells + w.gridCells,
      stationChecks: t.stationChecks + w.stationChecks,
      holes: t.holes + w.holes,
    }),
    { stations: 0, conditions: 0, candidates: 0, pitchGrid: 0, gridCells: 0, stationChecks: 0, holes: 0 },
  );
  const { design } = ctx;
  return {
    ...envelope(input, [...new Set(rules)], [...new Set(warnings)]),
    kind: 'wing',
    design: roundStored({
      wingLoadingPsf: design.wingLoadingPsf,
      loadFactors: design.loadFactors,
      speeds: design.speeds,
      gust: design.gust,
    }),
    planform: roundStored(planform),
    tail: roundStored({
      armIn: input.tail.armIn,
      estimated: tailEstimated,
      balancingLoadLb: oneGTail,
      cmAc: moment.cmAc,
    }),
    airfoil: roundStored({
      name: ctx.geometry.name,
      panels: input.panels ?? 160,
      trailingEdgeGap: ctx.geometry.trailingEdgeGap,
    }),
    outline: { chordIn: 1, points: compactNumbers(ctx.geometry.points, 5) },
    conditions: roundStored(conditions),
    ribs: roundStored(ribs),
    // A panel keeps its recommended candidate whole; the others as their verdicts and figures.
    skins: compactNumbers(
      skins.map((s) => ({
        ...s,
        candidates: s.candidates.map((c) =>
          sameKey(c, s.recommended) ? withoutHoles(c) : { ...c, warnings: [], lines: [] },
        ),
      })),
    ),
    trade: roundStored(trade),
    work: { ...totalWork, ribs: ribs.length, skinPanels: skins.length, skinSchedules },
  };
}

/**
 * A whole wing stores zones, not holes: a part revision places its holes from the zones when the study is
 * applied, and a wing's holes (tens of thousands) would make the stored result megabytes.
 */
function withoutHoles<T extends { lines: { holes: unknown[] }[] }>(c: T): T & { holesStored: false } {
  return { ...c, holesStored: false, lines: c.lines.map((l) => ({ ...l, holes: [] })) };
}

const sameKey = (a: { gaugeIn: number; rivet: string }, b: { gaugeIn: number; rivet: string } | null) =>
  !!b && a.gaugeIn === b.gaugeIn && a.rivet === b.rivet;

/**
 * One gauge and rivet on every rib, against each rib with its own recommendation. Ranked as a rib's trade
 * table ranks (trade-study.ts): backed by coupons on every rib first, then by the chosen measure.
 */
function wingTrade(ribs: WingRib[], rankBy: RankBy): WingStudyResult['trade'] {
  const keys = ribs[0].study.trade.map((t) => ({ gaugeIn: t.gaugeIn, rivet: t.rivet }));
  const uniform: WingTradeRow[] = keys.map((k) => {
    const rows = ribs.map((r) => r.study.trade.find((t) => sameKey(t, k))!);
    const infeasibleRibs = ribs.filter((_, i) => !rows[i].feasible).map((r) => r.name);
    return {
      ...k,
      feasible: infeasibleRibs.length === 0,
      pullThroughBasis: rows.every((t) => t.pullThroughBasis === 'coupons')
        ? ('coupons' as const)
        : ('fallback' as const),
      infeasibleRibs,
      rivetCount: rows.reduce((n, t) => n + t.rivetCount, 0),
      weightLb: rows.reduce((n, t) => n + t.totalWeightLb, 0),
      buildMinutes: rows.reduce((n, t) => n + t.buildMinutes, 0),
      rank: null,
    };
  });
  const tested = (u: WingTradeRow) => (u.pullThroughBasis === 'coupons' ? 0 : 1);
  const order =
    rankBy === 'weight'
      ? (a: WingTradeRow, b: WingTradeRow) => a.weightLb - b.weightLb || a.buildMinutes - b.buildMinutes
      : (a: WingTradeRow, b: WingTradeRow) => a.buildMinutes - b.buildMinutes || a.weightLb - b.weightLb;
  const ranked = uniform.filter((u) => u.feasible).sort((a, b) => tested(a) - tested(b) || order(a, b));
  ranked.forEach((u, i) => (u.rank = i + 1));
  uniform.sort((a, b) => (a.rank ?? Infinity) - (b.rank ?? Infinity) || a.weightLb - b.weightLb);
  const choices = ribs.map((r) => ({
    rib: r.name,
    gaugeIn: r.study.recommended?.gaugeIn ?? NaN,
    rivet: r.study.recommended?.rivet ?? '',
  }));
  const chosenRows = ribs.map((r) =>
    r.study.recommended ? r.study.trade.find((t) => sameKey(t, r.study.recommended)) : undefined,
  );
  const feasible = chosenRows.every((t) => t !== undefined);
  return {
    uniform,
    perRib: {
      choices: choices.filter((c) => c.rivet !== ''),
      feasible,
      rivetCount: chosenRows.reduce((n, t) => n + (t?.rivetCount ?? 0), 0),
      weightLb: chosenRows.reduce((n, t) => n + (t?.totalWeightLb ?? 0), 0),
      buildMinutes: chosenRows.reduce((n, t) => n + (t?.buildMinutes ?? 0), 0),
    },
    recommendedUniform: ranked.length ? { gaugeIn: ranked[0].gaugeIn, rivet: ranked[0].rivet } : null,
  };
}
