import { packed } from './arrays';
import { buildAirfoil, type AirfoilGeometry } from './airfoil';
import { validateCoupons } from './coupons';
import { cpFromTables, validateCpTables } from './cp-table';
import { designConditions } from './design-conditions';
import { EngineeringInputError } from './errors';
import { layoutRules, rivetWeightLb } from './layout';
import { findMaterial, findRivet } from './materials';
import { alphaForLiftCoefficient, pressureDistribution, solvePanelMethod, type PanelSolution } from './panel-method';
import {
  holePrefixFor,
  prepareColumns,
  scheduleAllowables,
  scheduleLine,
  requirePitchGrid,
  validateScheduleSettings,
  type PreparedLine,
  type ScheduledLine,
} from './pitch-schedule';
import { compactNumbers, ENGINEERING_CAUTION } from './result';
import { lineStationColumns, outlineAreaSqIn, ribOutline, validateLine } from './rib-geometry';
import { envelopeColumns, shearFlowLbPerIn, ULTIMATE_FACTOR } from './rivet-loads';
import { tradeStudy } from './trade-study';
import { radToDeg } from './units';
import { roundStored } from './rounding';
import { requireCount, requireStudyBound, STUDY_BOUNDS, WING_BOUNDS } from './bounds';
import { estimateStudyWork, requireStudyBudget } from './study-work';
import { requireArray, requireOneOf, requirePositive } from './validate';
import { COMPRESSIBILITY_RULE_TEXT, correctCpDistribution, correctFlowPressures, machNumber } from './compressibility';
import { envelopeConditions } from './envelope-corners';
import {
  COMPRESSIBILITY_RULES,
  type CpSample,
  type DesignCondition,
  type DesignConditionsResult,
  type EnvelopePoint,
  type FastenerLineInput,
  type InsufficientRange,
  type LineLoads,
  type LineSchedule,
  type Point,
  type PressureRule,
  type RibStudyInput,
  type RibStudyResult,
  type RivetSpec,
  type ScheduleZone,
  type StudyCandidate,
  type StudyCondition,
  type StudyWork,
  type TradeCandidate,
} from '../../lib/engineering-results';

/**
 * The whole chain for one rib (step 1–8 of the chain): kit data → flight conditions → airfoil →
 * pressure for each condition → pull along each fastener line → pitch schedules for every gauge × rivet
 * candidate → trade table → recommendation. Plain JSON in and out: the server stores both as jsonb.
 */

export const PRESSURE_RULES = [...COMPRESSIBILITY_RULES, 'none'] as const;

const DEFAULT_PANELS = 160;
const MINUTES_PER_HOLE = { solid: 1.5, pulled: 1.0 };
/** largest spacing of load stations along a line, in */
const STATION_STEP_IN = 0.1;
/** envelope points kept per line in the stored result */
const ENVELOPE_POINTS = 20;
/** Cp samples kept per surface and condition in the stored result (for the pressure picture) */
const CP_POINTS = 41;
/** beyond this angle of attack the inviscid pressure peak is well past what real flow sustains */
const HIGH_ALPHA_DEG = 10;

/** Ranges and counts of everything the study takes; returns the rivet specs of the candidates. */
export function validateStudy(input: RibStudyInput): RivetSpec[] {
  if (input === null || typeof input !== 'object')
    throw new EngineeringInputError('input', 'the study input is missing');
  const rib = input.rib;
  if (rib === null || typeof rib !== 'object') throw new EngineeringInputError('rib', 'the rib data are missing');
  requirePositive(rib.chordIn, 'rib.chordIn', 'the rib chord');
  requirePositive(rib.spacingIn, 'rib.spacingIn', 'the rib spacing');
  requireStudyBound(rib.chordIn, 'rib.chordIn');
  requireStudyBound(rib.spacingIn, 'rib.spacingIn');
  if (rib.internalCp !== undefined) requireStudyBound(rib.internalCp, 'rib.internalCp');
  if (rib.flangeWidthIn !== undefined) requireStudyBound(rib.flangeWidthIn, 'rib.flangeWidthIn');
  if (rib.skinGaugeIn !== undefined) requireStudyBound(rib.skinGaugeIn, 'rib.skinGaugeIn');
  const lines = requireArray<FastenerLineInput>(input.lines, 'lines', 1, 'list of fastener lines');
  requireCount(lines, 'lines', STUDY_BOUNDS.lines);
  lines.forEach((l, i) => validateLine(l, `lines[${i}]`));
  const names = lines.map((l) => l.name.trim().toLowerCase());
  names.forEach((n, i) => {
    if (names.indexOf(n) !== i)
      throw new EngineeringInputError(`lines[${i}].name`, `two lines are called "${lines[i].name}"`);
  });
  findMaterial(input.material, input.materialData, 'material');
  const gauges = requireArray<number>(input.gaugeCandidates, 'gaugeCandidates', 1, 'list of gauges');
  requireCount(gauges, 'gaugeCandidates', STUDY_BOUNDS.gaugeCandidates);
  gauges.forEach((g, i) => requireStudyBound(g, 'gaugeCandidates[]', `gaugeCandidates[${i}]`));
  const codes = requireArray<string>(input.rivetCandidates, 'rivetCandidates', 1, 'list of rivet specs');
  requireCount(codes, 'rivetCandidates', STUDY_BOUNDS.rivetCandidates);
  const rivets = codes.map((c, i) => findRivet(c, input.rivetData, `rivetCandidates[${i}]`));
  // The smallest rivet has the smallest maximum pitch: the settings must suit it; the largest has the
  // longest pitch grid: the increment must keep it within the budget.
  const smallest = Math.min(...rivets.map((r) => r.nominalDiameterIn));
  validateScheduleSettings(input, smallest);
  requirePitchGrid(input, Math.max(...rivets.map((r) => r.nominalDiameterIn)));
  if (input.panels !== undefined) requireStudyBound(input.panels, 'panels');
  if (input.coupons !== undefined) validateCoupons(input.coupons, 'coupons');
  if (input.cpTables !== undefined) validateCpTables(input.cpTables, 'cpTables');
  if ((input.wingTorqueInLb === undefined) !== (input.cellAreaSqIn === undefined)) {
    const missing = input.wingTorqueInLb === undefined ? 'wingTorqueInLb' : 'cellAreaSqIn';
    throw new EngineeringInputError(missing, 'the wing torque and the cell area go together: give both or neither');
  }
  if (input.wingTorqueInLb !== undefined) requireStudyBound(input.wingTorqueInLb, 'wingTorqueInLb');
  if (input.cellAreaSqIn !== undefined) {
    requirePositive(input.cellAreaSqIn, 'cellAreaSqIn', 'the cell area');
    requireStudyBound(input.cellAreaSqIn, 'cellAreaSqIn');
  }
  if (input.minutesPerHole !== undefined) {
    requirePositive(input.minutesPerHole, 'minutesPerHole', 'the minutes per hole');
    requireStudyBound(input.minutesPerHole, 'minutesPerHole');
  }
  if (input.rankBy !== undefined) requireOneOf(input.rankBy, 'rankBy', ['weight', 'buildTime'] as const);
  if (input.compressibility !== undefined) requireOneOf(input.compressibility, 'compressibility', PRESSURE_RULES);
  return rivets;
}

function thin<T>(items: T[], keep: number): T[] {
  if (items.length <= keep) return items;
  const step = (items.length - 1) / (keep - 1);
  const out: T[] = new Array(keep);
  for (let k = 0; k < keep; k++) out[k] = items[Math.round(k * step)];
  return out;
}

/** The indices `thin` keeps of `count` items. */
function thinIndices(count: number, keep: number): number[] {
  if (count <= keep) return Array.from({ length: count }, (_, k) => k);
  const step = (count - 1) / (keep - 1);
  const out: number[] = new Array(keep);
  for (let k = 0; k < keep; k++) out[k] = Math.round(k * step);
  return out;
}

const unique = (xs: string[]): string[] => [...new Set(xs)];

/*
 * The stored candidates, Cp samples and outline, to 4 decimals (3 for Cp): what `compactNumbers` makes of
 * them, written out field by field. A study stores some 2,000 objects, and the generic walk (a key list and
 * a new object built key by key for each) cost as much as all the pitch schedules' zoning. A field added
 * to these types must be added here too (the literals are typed: a required one is asked for).
 */
const d4 = (v: number): number => (Number.isFinite(v) ? Math.round(v * 1e4) / 1e4 : v);
const d3 = (v: number): number => (Number.isFinite(v) ? Math.round(v * 1e3) / 1e3 : v);
const d4OrNull = (v: number | null): number | null => (v === null ? null : d4(v));

function storedZone(z: ScheduleZone): ScheduleZone {
  return {
    fromIn: d4(z.fromIn),
    toIn: d4(z.toIn),
    fromAlongIn: d4(z.fromAlongIn),
    toAlongIn: d4(z.toAlongIn),
    pitchIn: d4(z.pitchIn),
    count: d4(z.count),
    worstStationIn: d4(z.worstStationIn),
    worstHoleId: z.worstHoleId,
    appliedLimitLb: d4(z.appliedLimitLb),
    appliedUltimateLb: d4(z.appliedUltimateLb),
    limitAllowableLb: d4(z.limitAllowableLb),
    ultimateAllowableLb: d4(z.ultimateAllowableLb),
    appliedLimitShearLb: d4(z.appliedLimitShearLb),
    msLimit: d4OrNull(z.msLimit),
    msUltimate: d4OrNull(z.msUltimate),
  };
}

const storedRange = (r: InsufficientRange): InsufficientRange => ({
  fromIn: d4(r.fromIn),
  toIn: d4(r.toIn),
  neededPitchIn: d4(r.neededPitchIn),
});

/**
 * A line's schedule as stored: without what the study already carries once (its inputs, rules, caution
 * and warnings), and with its holes or none; a hole without the line's name (the line says it once).
 */
function storedLine(s: ScheduledLine, withHoles: boolean): LineSchedule {
  const b = s.body;
  const a = b.allowables;
  return {
    line: b.line,
    rivetSpec: b.rivetSpec,
    drill: { name: b.drill.name, diameterIn: d4(b.drill.diameterIn) },
    gaugeIn: d4(b.gaugeIn),
    feasible: b.feasible,
    reasons: b.reasons,
    lengthIn: d4(b.lengthIn),
    layout: {
      edgeDistanceIn: d4(b.layout.edgeDistanceIn),
      minPitchIn: d4(b.layout.minPitchIn),
      maxPitchIn: d4(b.layout.maxPitchIn),
      pitchIncrementIn: d4(b.layout.pitchIncrementIn),
    },
    allowables: {
      tensionLimitLb: d4(a.tensionLimitLb),
      tensionUltimateLb: d4(a.tensionUltimateLb),
      tensionBasis: a.tensionBasis,
      tensionGoverning: a.tensionGoverning,
      shearLimitLb: d4(a.shearLimitLb),
      shearUltimateLb: d4(a.shearUltimateLb),
      shearGoverning: a.shearGoverning,
    },
    zones: b.zones.map(storedZone),
    holes: withHoles ? s.holes.objects(null, d4) : [],
    insufficient: b.insufficient.map(storedRange),
  };
}

/** Cp samples as stored for the pressure picture: thinned, to 0.001. */
function storedCp(samples: CpSample[]): CpSample[] {
  const kept = thin(samples, CP_POINTS);
  const out: CpSample[] = new Array(kept.length);
  for (let i = 0; i < kept.length; i++) out[i] = { xc: d3(kept[i].xc), cp: d3(kept[i].cp) };
  return out;
}

/** A condition as stored: its figures to six significant figures (roundStored), its Cp thinned (storedCp), last. */
function storedCondition(c: StudyCondition): StudyCondition {
  const out: Record<string, unknown> = {};
  for (const key of Object.keys(c) as (keyof StudyCondition)[]) if (key !== 'cp') out[key] = roundStored(c[key]);
  out.cp = { upper: storedCp(c.cp.upper), lower: storedCp(c.cp.lower) };
  return out as unknown as StudyCondition;
}

interface PreparedStudyLine {
  line: FastenerLineInput;
  prefix: string;
  prepared: PreparedLine;
  summary: LineLoads;
}

/**
 * What the ribs of one wing share, worked out once: the flight conditions, the section's flow (one
 * factorisation serves every rib, the airfoil being the same at unit chord), and the pressure rule. A
 * lone rib study makes its own with a section ratio of 1.
 */
export interface SectionContext {
  design: DesignConditionsResult;
  /** every condition of the envelope, with the wing's CL */
  conditions: DesignCondition[];
  geometry: AirfoilGeometry;
  flow: PanelSolution;
  tables: ReturnType<typeof validateCpTables> | null;
  pressureRule: PressureRule;
  altitudeFt: number;
  rules: string[];
  warnings: string[];
}

export function sectionContext(
  input: Pick<RibStudyInput, 'kit' | 'airfoil' | 'cpTables' | 'panels' | 'flaps' | 'compressibility'>,
  /** called with the outline and the number of conditions before the flow is solved: the work budget's place */
  beforeFlow: (geometry: AirfoilGeometry, conditions: number) => void = () => {},
): SectionContext {
  const design = designConditions(input.kit);
  const env = envelopeConditions(input.kit, input.flaps, design);
  const geometry = buildAirfoil(input.airfoil, input.panels ?? DEFAULT_PANELS);
  beforeFlow(geometry, env.conditions.length);
  // The panel matrix depends on the geometry only: one factorisation serves every condition (and rib).
  const flow = solvePanelMethod(geometry.points, geometry.leadingEdgeIndex);
  const pressureRule = input.compressibility ?? 'karman-tsien';
  const rules = [
    ...env.rules,
    ...geometry.rules,
    'pressure: 2-D inviscid linear-vortex panel method (stream-function form) with the Kutta condition; the angle of each condition from its section CL',
    pressureRule === 'none'
      ? 'compressibility: none (incompressible pressures, as asked)'
      : COMPRESSIBILITY_RULE_TEXT[pressureRule],
  ];
  if (input.cpTables)
    rules.push('Cp tables: interpolated in CL between tables of the same sign, scaled by CL/CL_table outside them');
  return {
    design,
    conditions: env.conditions,
    geometry,
    flow,
    tables: input.cpTables ? validateCpTables(input.cpTables) : null,
    pressureRule,
    altitudeFt: input.kit.altitudeFt ?? 0,
    rules,
    warnings: [...env.warnings, ...geometry.warnings],
  };
}

/**
 * Pressure for every condition at a section working at `sectionRatio` × the condition's lift (Schrenk and
 * the tail for a rib of a wing, 1 for a lone rib): from the Cp tables where they cover it, else from the
 * panel method; then corrected to the condition's Mach number.
 */
export function conditionPressures(
  ctx: SectionContext,
  sectionRatio: (c: DesignCondition) => number,
  warnings: string[],
): StudyCondition[] {
  const { flow, tables } = ctx;
  return ctx.conditions.map((c) => {
    const sectionCl = c.clNeeded * sectionRatio(c);
    const alphaRad = alphaForLiftCoefficient(flow, sectionCl);
    const alphaDeg = radToDeg(alphaRad);
    const fromTable = tables ? cpFromTables(tables, sectionCl) : null;
    if (tables && !fromTable)
      warnings.push(`${c.label}: no Cp table for a lift coefficient of this sign; panel-method pressures used`);
    if (fromTable?.warning) warnings.push(`${c.label}: ${fromTable.warning}`);
    if (!fromTable && (c.id === 'maneuver-up-va' || Math.abs(alphaDeg) > HIGH_ALPHA_DEG)) {
      warnings.push(
        `${c.label} (CL ${sectionCl.toFixed(2)}, α ${alphaDeg.toFixed(1)}°): inviscid suction peak near stall is conservative`,
      );
    }
    const mach = machNumber(c.speedKeas, ctx.altitudeFt);
    let cp: { upper: CpSample[]; lower: CpSample[] };
    if (ctx.pressureRule !== 'none') {
      if (mach >= WING_BOUNDS.mach.max) {
        throw new EngineeringInputError(
          'kit.diveSpeedKeas',
          `${c.label} is at Mach ${mach.toFixed(2)}: this tool stops below Mach ${WING_BOUNDS.mach.max}, where neither compressibility rule holds`,
        );
      }
      // From the flow's surface speeds straight to the corrected pressures where that is sound (see
      // correctFlowPressures), else by way of the incompressible samples.
      const corrected =
        (fromTable ? null : correctFlowPressures(flow, alphaRad, mach, ctx.pressureRule)) ??
        correctCpDistribution(fromTable ?? pressureDistribution(flow, alphaRad), mach, ctx.pressureRule);
      warnings.push(...corrected.warnings.map((w) => `${c.label}: ${w}`));
      cp = { upper: corrected.upper, lower: corrected.lower };
    } else cp = fromTable ?? pressureDistribution(flow, alphaRad);
    // Spelled out rather than `{ ...c, more }`, which V8 builds some hundred times slower.
    const condition: StudyCondition = {
      id: c.id,
      label: c.label,
      kind: c.kind,
      n: c.n,
      speedKeas: c.speedKeas,
      qPsi: c.qPsi,
      clNeeded: c.clNeeded,
      sectionCl,
      mach,
      alphaRad,
      alphaDeg,
      pressureSource: fromTable ? 'Cp table' : 'panel method',
      cp: { upper: cp.upper, lower: cp.lower },
    };
    return condition;
  });
}

/** Stations along each fastener line with the largest pull of any condition, and the torque shear. */
function lineLoads(
  input: RibStudyInput,
  geometry: AirfoilGeometry,
  conditions: StudyCondition[],
  shearFlow: number,
): PreparedStudyLine[] {
  const { rib } = input;
  const internalCp = rib.internalCp ?? 0;
  const prefixes = input.lines.map((l) => holePrefixFor(l.name));
  return input.lines.map((line, i) => {
    const prefix = prefixes.indexOf(prefixes[i]) === i ? prefixes[i] : `${prefixes[i]}${i + 1}`;
    // Columns, not an object per station: some 600 stations a line go from the outline to the schedules.
    const st = lineStationColumns(geometry, line, rib.chordIn, STATION_STEP_IN);
    const n = st.along.length;
    const env = envelopeColumns(
      st.xc,
      conditions.map((c) => ({
        id: c.id,
        qPsi: c.qPsi,
        cpSamples: line.surface === 'upper' ? c.cp.upper : c.cp.lower,
      })),
      internalCp,
      rib.spacingIn,
    );
    const prepared = prepareColumns({
      along: st.along,
      tension: env.limitLbPerIn,
      shear: packed(n, shearFlow),
      station: st.x,
      x: st.x,
      y: st.y,
    });
    const envelopePoints: EnvelopePoint[] = [];
    for (const k of thinIndices(n, ENVELOPE_POINTS)) {
      const w = env.limitLbPerIn[k];
      envelopePoints.push({
        xc: st.xc[k],
        stationIn: st.x[k],
        alongIn: st.along[k],
        xIn: st.x[k],
        yIn: st.y[k],
        limitLbPerIn: w,
        ultimateLbPerIn: ULTIMATE_FACTOR * w,
        governing: env.governingAt(k),
      });
    }
    const summary: LineLoads = {
      name: line.name,
      surface: line.surface,
      startXc: line.startXc,
      endXc: line.endXc,
      holePrefix: prefix,
      lengthIn: st.along[n - 1],
      fromStationIn: st.x[0],
      toStationIn: st.x[n - 1],
      shearFlowLbPerIn: Math.abs(shearFlow),
      envelope: envelopePoints,
    };
    return { line, prefix, prepared, summary };
  });
}

/**
 * A candidate as worked out: its verdict, its lines' schedules with their holes as numbers, and the
 * number of holes. Every candidate needs its count (the trade table); the stored result keeps the holes
 * of one (`storedCandidate`).
 */
interface BuiltCandidate {
  gaugeIn: number;
  rivet: RivetSpec;
  feasible: boolean;
  reasons: string[];
  warnings: string[];
  pullThroughBasis: 'coupons' | 'fallback';
  flangeWidthIn: number;
  rivetCount: number;
  schedules: ScheduledLine[];
}

/** The candidate as stored, with the holes of every line or without. */
function storedCandidate(b: BuiltCandidate, withHoles: boolean): StudyCandidate {
  const lines: LineSchedule[] = new Array(b.schedules.length);
  for (let i = 0; i < lines.length; i++) lines[i] = storedLine(b.schedules[i], withHoles);
  return {
    holesStored: withHoles,
    gaugeIn: d4(b.gaugeIn),
    rivet: b.rivet.code,
    feasible: b.feasible,
    reasons: b.reasons,
    warnings: b.warnings,
    pullThroughBasis: b.pullThroughBasis,
    flangeWidthIn: d4(b.flangeWidthIn),
    lines,
  };
}

/** One gauge × rivet candidate: a schedule for every line, and whether the flange fits the rivet. */
function candidate(
  input: RibStudyInput,
  lines: PreparedStudyLine[],
  gaugeIn: number,
  rivet: RivetSpec,
): BuiltCandidate {
  const { rib } = input;
  const layout = layoutRules(rivet);
  // One joint, one set of allowables: worked out once for every line of the candidate.
  const allowables = scheduleAllowables({
    material: input.material,
    gaugeIn,
    rivetSpec: rivet.code,
    coupons: input.coupons,
    pullThroughFallbackFraction: input.pullThroughFallbackFraction,
    materialData: input.materialData,
    rivetData: input.rivetData,
  });
  const schedules = lines.map((d) =>
    scheduleLine(
      {
        line: d.line.name,
        holePrefix: d.prefix,
        material: input.material,
        gaugeIn,
        rivetSpec: rivet.code,
        coupons: input.coupons,
        maxPitchDiameters: input.maxPitchDiameters,
        pitchIncrementIn: input.pitchIncrementIn,
        maxZones: input.maxZones,
        pullThroughFallbackFraction: input.pullThroughFallbackFraction,
        materialData: input.materialData,
        rivetData: input.rivetData,
      },
      d.prepared,
      allowables,
    ),
  );
  // Loops rather than flatMap, which V8 runs far slower (18 candidates, each with its lines).
  const reasons: string[] = [];
  for (const s of schedules) for (const r of s.body.reasons) reasons.push(`${s.body.line}: ${r}`);
  if (rib.flangeWidthIn !== undefined && rib.flangeWidthIn < 2 * layout.minEdgeIn - 1e-9) {
    reasons.push(
      `the ${rib.flangeWidthIn} in flange is narrower than twice the ${layout.minEdgeIn.toFixed(3)} in edge distance of ${rivet.code}`,
    );
  }
  let rivetCount = 0;
  const warnings = new Set<string>();
  for (const s of schedules) {
    rivetCount += s.holes.count;
    for (const w of s.warnings) warnings.add(w);
  }
  return {
    gaugeIn,
    rivet,
    feasible: reasons.length === 0,
    reasons,
    warnings: [...warnings],
    pullThroughBasis: schedules[0].body.allowables.tensionBasis,
    flangeWidthIn: rib.flangeWidthIn ?? 2 * layout.minEdgeIn,
    rivetCount,
    schedules,
  };
}

/** Weights and build time of a candidate, for the trade table. */
function tradeCandidate(input: RibStudyInput, c: BuiltCandidate, webAreaSqIn: number, density: number): TradeCandidate {
  const { rivet, rivetCount } = c;
  let lengthIn = 0;
  for (const s of c.schedules) lengthIn += s.body.lengthIn;
  const grip = c.gaugeIn + (input.rib.skinGaugeIn ?? c.gaugeIn);
  return {
    gaugeIn: c.gaugeIn,
    rivet: rivet.code,
    feasible: c.feasible,
    rivetCount,
    flangeWeightLb: lengthIn * c.flangeWidthIn * c.gaugeIn * density,
    webWeightLb: webAreaSqIn * c.gaugeIn * density,
    rivetWeightLb: rivetCount * rivetWeightLb(rivet, grip),
    buildMinutes: rivetCount * (input.minutesPerHole ?? MINUTES_PER_HOLE[rivet.kind]),
    pullThroughBasis: c.pullThroughBasis,
  };
}

/** Where a rib sits in its wing: its share of each condition's lift and the skin's shear flow there. */
export interface RibPlace {
  sectionRatio: (c: DesignCondition) => number;
  shearFlowLbPerIn: number;
  rules: string[];
  warnings: string[];
}

/** A rib alone: the section works at the wing's CL, the wing torque (if given) by Bredt–Batho. */
function lonePlace(input: RibStudyInput): RibPlace {
  const rules = [
    'lone rib: the section taken at the wing CL of each condition (no spanwise distribution, no tail load)',
  ];
  const q =
    input.wingTorqueInLb !== undefined && input.cellAreaSqIn !== undefined
      ? shearFlowLbPerIn(input.wingTorqueInLb, input.cellAreaSqIn)
      : 0;
  if (q !== 0)
    rules.push(
      `skin shear flow from wing torque q = T/(2A) = ${Math.abs(q).toFixed(2)} lb/in (Bredt–Batho), taken together with the largest pull at every station`,
    );
  return { sectionRatio: () => 1, shearFlowLbPerIn: q, rules, warnings: [] };
}

/** Checks the input and counts the work before the flow is solved (refusing what is over budget). */
function prepareRib(input: RibStudyInput): { rivets: RivetSpec[]; ctx: SectionContext; work: StudyWork } {
  const rivets = validateStudy(input);
  let work: StudyWork | null = null;
  const ctx = sectionContext(input, (geometry, conditions) => {
    // Everything so far is small and capped; what follows runs on counts the input multiplies up.
    const w = estimateStudyWork(input, geometry, rivets, conditions, STATION_STEP_IN);
    requireStudyBudget(input, w, rivets.length);
    work = w;
  });
  return { rivets, ctx, work: work! };
}

/** The pressures and the loads along every line of a rib at its place. */
function ribLoads(input: RibStudyInput, ctx: SectionContext, place: RibPlace) {
  const warnings: string[] = [];
  const conditions = conditionPressures(ctx, place.sectionRatio, warnings);
  const lines = lineLoads(input, ctx.geometry, conditions, place.shearFlowLbPerIn);
  return { conditions, lines, warnings };
}

/** Keeps the holes of one candidate only: the rest can be recomputed (ribCandidate) when someone asks. */
function keepHolesOf(candidates: BuiltCandidate[], keep: { gaugeIn: number; rivet: string } | null): StudyCandidate[] {
  return candidates.map((b) => storedCandidate(b, !!keep && b.gaugeIn === keep.gaugeIn && b.rivet.code === keep.rivet));
}

/**
 * The study of a rib at its place, given its section context: the rib study of a lone rib, and of every
 * rib of a wing (wing-study.ts).
 */
export function studyRibAt(
  input: RibStudyInput,
  ctx: SectionContext,
  place: RibPlace,
  work: StudyWork,
): RibStudyResult {
  const { rib } = input;
  const { conditions, lines, warnings: pressureWarnings } = ribLoads(input, ctx, place);
  const warnings: string[] = [...ctx.warnings, ...place.warnings, ...pressureWarnings];
  const rules = [
    ...ctx.rules,
    ...place.rules,
    `rivet tension T = max(0, Cp,int − Cp)·q·s·b with b = ${rib.spacingIn} in, Cp,int = ${rib.internalCp ?? 0}; envelope of all conditions; ultimate = 1.5 × limit`,
  ];

  const built: BuiltCandidate[] = [];
  // Every schedule states its rules, mostly the same ones: merged as they come, first ones first.
  const candidateRules = new Set<string>();
  for (const gaugeIn of input.gaugeCandidates) {
    for (const code of input.rivetCandidates) {
      const c = candidate(input, lines, gaugeIn, findRivet(code, input.rivetData));
      built.push(c);
      for (const sl of c.schedules) for (const r of sl.rules) candidateRules.add(r);
    }
  }
  if (rib.flangeWidthIn === undefined)
    warnings.push('flange width not given: taken as twice the edge distance (4D) of each rivet for its weight');
  if (rib.skinGaugeIn === undefined)
    warnings.push('skin gauge not given: the rivet grip is taken as twice the flange gauge');
  const fallbacks = built.filter((c) => c.pullThroughBasis === 'fallback').length;
  if (fallbacks > 0)
    warnings.push(
      `${fallbacks} of ${built.length} candidates have no coupon data and use the conservative pull-through fallback: see their warnings`,
    );

  const outline = ribOutline(ctx.geometry, rib.chordIn);
  const density = findMaterial(input.material, input.materialData).densityLbPerIn3;
  const webAreaSqIn = outlineAreaSqIn(outline);
  const trade = tradeStudy(
    built.map((b) => tradeCandidate(input, b, webAreaSqIn, density)),
    input.rankBy ?? 'weight',
  );
  rules.push(
    ...candidateRules,
    ...trade.rules,
    'web weight is that of an unlightened web; flange weight along the fastener lines',
    input.minutesPerHole
      ? `build-time proxy: ${input.minutesPerHole} min per hole`
      : `build-time proxy: ${MINUTES_PER_HOLE.solid} min per solid and ${MINUTES_PER_HOLE.pulled} min per pulled rivet (common practice)`,
  );
  warnings.push(...trade.warnings);
  const { design } = ctx;

  // Spelled out rather than `...envelope(…)` followed by more fields: V8 builds such a literal far slower.
  return {
    inputs: input,
    rules: unique(rules),
    warnings: unique(warnings),
    caution: ENGINEERING_CAUTION,
    // Stored numbers rounded to what they mean (rounding.ts; pressures and geometry to 0.0001 in their
    // units), after every check above was made at full precision.
    design: roundStored({
      wingLoadingPsf: design.wingLoadingPsf,
      loadFactors: design.loadFactors,
      speeds: design.speeds,
      gust: design.gust,
    }),
    // Pressures and loads to 0.001 (Cp, lb, in): finer than anything they are read or drawn to.
    conditions: conditions.map(storedCondition),
    airfoil: roundStored({
      name: ctx.geometry.name,
      panels: input.panels ?? DEFAULT_PANELS,
      trailingEdgeGap: ctx.geometry.trailingEdgeGap,
    }),
    outline: { chordIn: rib.chordIn, points: outline.map((p): Point => [d4(p[0]), d4(p[1])]) },
    lines: compactNumbers(lines.map((d) => d.summary)),
    // To 0.0001: a 3D pitch of a 3/32 in rivet is 0.28125 in, and 0.281 would be under the layout minimum.
    candidates: keepHolesOf(built, trade.recommended),
    trade: roundStored(trade.rows),
    recommended: trade.recommended,
    work: {
      stations: work.stations,
      conditions: work.conditions,
      candidates: work.candidates,
      pitchGrid: work.pitchGrid,
      gridCells: work.gridCells,
      stationChecks: work.stationChecks,
      holes: work.holes,
    },
  };
}

export function ribStudy(input: RibStudyInput): RibStudyResult {
  const { ctx, work } = prepareRib(input);
  return studyRibAt(input, ctx, lonePlace(input), work);
}

/**
 * One candidate of a lone rib study with its holes: the stored result keeps the holes of the recommended
 * candidate only, and this recomputes another's when someone looks at it. Refuses a candidate the study
 * did not have.
 */
export function ribCandidate(
  input: RibStudyInput,
  pick: { gaugeIn: number; rivet: string },
  place?: RibPlace,
): StudyCandidate {
  const gaugeIndex = input.gaugeCandidates?.findIndex((g) => Math.abs(g - pick.gaugeIn) < 1e-9) ?? -1;
  if (gaugeIndex < 0) throw new EngineeringInputError('gaugeIn', `${pick.gaugeIn} in is not one of the study's gauges`);
  if (!input.rivetCandidates?.includes(pick.rivet))
    throw new EngineeringInputError('rivet', `${pick.rivet} is not one of the study's rivets`);
  const { ctx } = prepareRib(input);
  const { lines } = ribLoads(input, ctx, place ?? lonePlace(input));
  return storedCandidate(
    candidate(input, lines, input.gaugeCandidates[gaugeIndex], findRivet(pick.rivet, input.rivetData)),
    true,
  );
}
