import { buildAirfoil, type AirfoilGeometry, type AirfoilInput } from './airfoil';
import type { CouponTest } from './coupons';
import { validateCoupons } from './coupons';
import { cpFromTables, validateCpTables, type CpTableInput } from './cp-table';
import { designConditions, type DesignCondition, type DesignConditionsResult, type KitInput } from './design-conditions';
import { EngineeringInputError } from './errors';
import { layoutRules, rivetWeightLb } from './layout';
import { findMaterial, findRivet, type RivetSpec, type SheetMaterial } from './materials';
import { alphaForLiftCoefficient, cpOnSurface, pressureDistribution, solvePanelMethod, type CpSample, type PanelSolution } from './panel-method';
import { holePrefixFor, pitchSchedule, prepareStations, requirePitchGrid, validateScheduleSettings, type PitchScheduleResult, type PreparedLine, type StationLoad } from './pitch-schedule';
import { compactNumbers, envelope, type EngineeringResult } from './result';
import { lineStations, outlineAreaSqIn, ribOutline, validateLine, type FastenerLineInput } from './rib-geometry';
import { loadEnvelope, shearFlowLbPerIn, ULTIMATE_FACTOR } from './rivet-loads';
import { tradeStudy, type RankBy, type TradeCandidate, type TradeRow } from './trade-study';
import { radToDeg } from './units';
import { roundStored } from './rounding';
import { requireCount, requireStudyBound, STUDY_BOUNDS } from './bounds';
import { estimateStudyWork, requireStudyBudget, type StudyWork } from './study-work';
import { requireArray, requireOneOf, requirePositive } from './validate';

/**
 * The whole chain for one rib (step 1–8 of the chain): kit data → flight conditions → airfoil →
 * pressure for each condition → pull along each fastener line → pitch schedules for every gauge × rivet
 * candidate → trade table → recommendation. Plain JSON in and out: the server stores both as jsonb.
 */

export interface RibInput {
  chordIn: number;
  /** tributary width of the rib: half the bay each side (the rib spacing for an inner rib), in */
  spacingIn: number;
  /** pressure coefficient inside the wing (vents, leaks); 0 when absent */
  internalCp?: number;
  /** flange width for the weight and the edge-distance fit; 4D of each rivet when absent */
  flangeWidthIn?: number;
  /** skin gauge for the rivet grip; the flange gauge when absent */
  skinGaugeIn?: number;
}

export interface RibStudyInput {
  kit: KitInput;
  airfoil: AirfoilInput;
  /** measured or computed pressure tables to use instead of the panel method */
  cpTables?: CpTableInput[];
  rib: RibInput;
  lines: FastenerLineInput[];
  material: string;
  gaugeCandidates: number[];
  rivetCandidates: string[];
  maxPitchDiameters: number;
  pitchIncrementIn: number;
  maxZones: number;
  /** panels of the pressure solution; 160 when absent */
  panels?: number;
  coupons?: CouponTest[];
  /** limit torque on the wing cell at this rib, in·lb, with the cell's enclosed area, in² (Bredt–Batho) */
  wingTorqueInLb?: number;
  cellAreaSqIn?: number;
  /** build-time proxy; 1.5 min per solid rivet and 1.0 per pulled rivet when absent */
  minutesPerHole?: number;
  rankBy?: RankBy;
  pullThroughFallbackFraction?: number;
  materialData?: SheetMaterial[];
  rivetData?: RivetSpec[];
}

export interface StudyCondition extends DesignCondition {
  alphaRad: number;
  alphaDeg: number;
  pressureSource: 'panel method' | 'Cp table';
  cp: { upper: CpSample[]; lower: CpSample[] };
}

export interface EnvelopePoint {
  stationIn: number;
  xc: number;
  alongIn: number;
  xIn: number;
  yIn: number;
  /** limit pull per inch of pitch, lb/in (ultimate = 1.5 ×) */
  limitLbPerIn: number;
  ultimateLbPerIn: number;
  governing: string | null;
}

export interface LineLoads {
  name: string;
  surface: 'upper' | 'lower';
  startXc: number;
  endXc: number;
  holePrefix: string;
  lengthIn: number;
  fromStationIn: number;
  toStationIn: number;
  shearFlowLbPerIn: number;
  envelope: EnvelopePoint[];
}

export type LineSchedule = Omit<PitchScheduleResult, 'inputs' | 'rules' | 'caution'>;

export interface StudyCandidate {
  gaugeIn: number;
  rivet: string;
  feasible: boolean;
  reasons: string[];
  warnings: string[];
  pullThroughBasis: 'coupons' | 'fallback';
  flangeWidthIn: number;
  lines: LineSchedule[];
}

export interface RibStudyResult extends EngineeringResult<RibStudyInput> {
  design: Pick<DesignConditionsResult, 'wingLoadingPsf' | 'loadFactors' | 'speeds' | 'gust'>;
  conditions: StudyCondition[];
  airfoil: { name: string; panels: number; trailingEdgeGap: number };
  outline: { chordIn: number; points: [number, number][] };
  lines: LineLoads[];
  candidates: StudyCandidate[];
  trade: TradeRow[];
  recommended: { gaugeIn: number; rivet: string } | null;
  /** what the study cost, as counted before it ran (see study-work.ts) */
  work: StudyWork;
}

const DEFAULT_PANELS = 160;
const MINUTES_PER_HOLE = { solid: 1.5, pulled: 1.0 };
/** largest spacing of load stations along a line, in */
const STATION_STEP_IN = 0.1;
/** envelope points kept per line in the stored result */
const ENVELOPE_POINTS = 150;
/** beyond this angle of attack the inviscid pressure peak is well past what real flow sustains */
const HIGH_ALPHA_DEG = 10;

/** Ranges and counts of everything the study takes; returns the rivet specs of the candidates. */
function validateStudy(input: RibStudyInput): RivetSpec[] {
  if (input === null || typeof input !== 'object') throw new EngineeringInputError('input', 'the study input is missing');
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
    if (names.indexOf(n) !== i) throw new EngineeringInputError(`lines[${i}].name`, `two lines are called "${lines[i].name}"`);
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
  return rivets;
}

function thin<T>(items: T[], keep: number): T[] {
  if (items.length <= keep) return items;
  const step = (items.length - 1) / (keep - 1);
  return Array.from({ length: keep }, (_, k) => items[Math.round(k * step)]);
}

const unique = (xs: string[]): string[] => [...new Set(xs)];

/** A line's schedule without what the study already carries once (its inputs, rules and caution). */
function withoutEnvelope(s: PitchScheduleResult): LineSchedule {
  const { inputs, rules, caution, ...rest } = s;
  void inputs, void rules, void caution;
  return rest;
}

interface PreparedStudyLine {
  line: FastenerLineInput;
  prefix: string;
  loads: StationLoad[];
  prepared: PreparedLine;
  summary: LineLoads;
}

/** Pressure for every condition: from the Cp tables where they cover it, else from the panel method. */
function conditionPressures(input: RibStudyInput, design: DesignConditionsResult, flow: PanelSolution, warnings: string[]): StudyCondition[] {
  const tables = input.cpTables ? validateCpTables(input.cpTables) : null;
  return design.conditions.map((c) => {
    const alphaRad = alphaForLiftCoefficient(flow, c.clNeeded);
    const alphaDeg = radToDeg(alphaRad);
    const fromTable = tables ? cpFromTables(tables, c.clNeeded) : null;
    if (tables && !fromTable) warnings.push(`${c.label}: no Cp table for a lift coefficient of this sign; panel-method pressures used`);
    if (fromTable?.warning) warnings.push(`${c.label}: ${fromTable.warning}`);
    const cp = fromTable ?? pressureDistribution(flow, alphaRad);
    if (!fromTable && (c.id === 'maneuver-up-va' || Math.abs(alphaDeg) > HIGH_ALPHA_DEG)) {
      warnings.push(`${c.label} (CL ${c.clNeeded.toFixed(2)}, α ${alphaDeg.toFixed(1)}°): inviscid suction peak near stall is conservative`);
    }
    return { ...c, alphaRad, alphaDeg, pressureSource: fromTable ? 'Cp table' : 'panel method', cp: { upper: cp.upper, lower: cp.lower } };
  });
}

/** Stations along each fastener line with the largest pull of any condition, and the torque shear. */
function lineLoads(input: RibStudyInput, geometry: AirfoilGeometry, conditions: StudyCondition[], shearFlow: number): PreparedStudyLine[] {
  const { rib } = input;
  const internalCp = rib.internalCp ?? 0;
  const prefixes = input.lines.map((l) => holePrefixFor(l.name));
  return input.lines.map((line, i) => {
    const prefix = prefixes.indexOf(prefixes[i]) === i ? prefixes[i] : `${prefixes[i]}${i + 1}`;
    const stations = lineStations(geometry, line, rib.chordIn, STATION_STEP_IN);
    const env = loadEnvelope(
      stations.map((s) => s.xc),
      conditions.map((c) => ({ id: c.id, qPsi: c.qPsi, cpAt: (xc: number) => cpOnSurface(c.cp, line.surface, xc) })),
      internalCp,
      rib.spacingIn,
    );
    const loads: StationLoad[] = stations.map((s, k) => ({
      stationIn: s.stationIn,
      alongIn: s.alongIn,
      limitTensionLbPerIn: env[k].limitLbPerIn,
      limitShearLbPerIn: shearFlow,
      xIn: s.xIn,
      yIn: s.yIn,
    }));
    const kept = thin(
      stations.map((_, k) => k),
      ENVELOPE_POINTS,
    );
    const summary: LineLoads = {
      name: line.name,
      surface: line.surface,
      startXc: line.startXc,
      endXc: line.endXc,
      holePrefix: prefix,
      lengthIn: stations[stations.length - 1].alongIn,
      fromStationIn: stations[0].stationIn,
      toStationIn: stations[stations.length - 1].stationIn,
      shearFlowLbPerIn: Math.abs(shearFlow),
      envelope: kept.map((k) => ({ ...stations[k], limitLbPerIn: env[k].limitLbPerIn, ultimateLbPerIn: ULTIMATE_FACTOR * env[k].limitLbPerIn, governing: env[k].governing })),
    };
    return { line, prefix, loads, prepared: prepareStations(loads), summary };
  });
}

/** One gauge × rivet candidate: a schedule for every line, and whether the flange fits the rivet. */
function candidate(input: RibStudyInput, lines: PreparedStudyLine[], gaugeIn: number, rivet: RivetSpec): { candidate: StudyCandidate; rules: string[] } {
  const { rib } = input;
  const layout = layoutRules(rivet);
  const schedules = lines.map((d) =>
    pitchSchedule(
      {
        line: d.line.name,
        holePrefix: d.prefix,
        stations: d.loads,
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
    ),
  );
  const reasons = schedules.flatMap((s) => s.reasons.map((r) => `${s.line}: ${r}`));
  if (rib.flangeWidthIn !== undefined && rib.flangeWidthIn < 2 * layout.minEdgeIn - 1e-9) {
    reasons.push(`the ${rib.flangeWidthIn} in flange is narrower than twice the ${layout.minEdgeIn.toFixed(3)} in edge distance of ${rivet.code}`);
  }
  return {
    candidate: {
      gaugeIn,
      rivet: rivet.code,
      feasible: reasons.length === 0,
      reasons,
      warnings: unique(schedules.flatMap((s) => s.warnings)),
      pullThroughBasis: schedules[0].allowables.tensionBasis,
      flangeWidthIn: rib.flangeWidthIn ?? 2 * layout.minEdgeIn,
      lines: schedules.map(withoutEnvelope),
    },
    rules: schedules.flatMap((s) => s.rules),
  };
}

/** Weights and build time of a candidate, for the trade table. */
function tradeCandidate(input: RibStudyInput, c: StudyCandidate, webAreaSqIn: number, density: number): TradeCandidate {
  const rivet = findRivet(c.rivet, input.rivetData);
  const rivetCount = c.lines.reduce((n, l) => n + l.holes.length, 0);
  const lengthIn = c.lines.reduce((n, l) => n + l.lengthIn, 0);
  const grip = c.gaugeIn + (input.rib.skinGaugeIn ?? c.gaugeIn);
  return {
    gaugeIn: c.gaugeIn,
    rivet: c.rivet,
    feasible: c.feasible,
    rivetCount,
    flangeWeightLb: lengthIn * c.flangeWidthIn * c.gaugeIn * density,
    webWeightLb: webAreaSqIn * c.gaugeIn * density,
    rivetWeightLb: rivetCount * rivetWeightLb(rivet, grip),
    buildMinutes: rivetCount * (input.minutesPerHole ?? MINUTES_PER_HOLE[rivet.kind]),
    pullThroughBasis: c.pullThroughBasis,
  };
}

export function ribStudy(input: RibStudyInput): RibStudyResult {
  const rivets = validateStudy(input);
  const { rib } = input;
  const panels = input.panels ?? DEFAULT_PANELS;
  const warnings: string[] = [];

  const design = designConditions(input.kit);
  const geometry = buildAirfoil(input.airfoil, panels);
  // Everything so far is small and capped; what follows runs on counts the input multiplies up.
  const work = estimateStudyWork(input, geometry, rivets, design.conditions.length, STATION_STEP_IN);
  requireStudyBudget(input, work, rivets.length);
  // The panel matrix depends on the geometry only: one factorisation serves every condition.
  const flow = solvePanelMethod(geometry.points, geometry.leadingEdgeIndex);
  warnings.push(...design.warnings, ...geometry.warnings);
  const conditions = conditionPressures(input, design, flow, warnings);
  const rules = [
    ...design.rules,
    ...geometry.rules,
    'pressure: 2-D inviscid linear-vortex panel method (stream-function form) with the Kutta condition; the angle of each condition from its CL',
    `rivet tension T = max(0, Cp,int − Cp)·q·s·b with b = ${rib.spacingIn} in, Cp,int = ${rib.internalCp ?? 0}; envelope of all conditions; ultimate = 1.5 × limit`,
  ];
  if (input.cpTables) rules.push('Cp tables: interpolated in CL between tables of the same sign, scaled by CL/CL_table outside them');

  const shearFlow = input.wingTorqueInLb !== undefined && input.cellAreaSqIn !== undefined ? shearFlowLbPerIn(input.wingTorqueInLb, input.cellAreaSqIn) : 0;
  if (shearFlow !== 0) rules.push(`skin shear flow from wing torque q = T/(2A) = ${Math.abs(shearFlow).toFixed(2)} lb/in (Bredt–Batho), taken together with the largest pull at every station`);
  const lines = lineLoads(input, geometry, conditions, shearFlow);

  const candidates: StudyCandidate[] = [];
  const candidateRules: string[] = [];
  for (const gaugeIn of input.gaugeCandidates) {
    for (const code of input.rivetCandidates) {
      const c = candidate(input, lines, gaugeIn, findRivet(code, input.rivetData));
      candidates.push(c.candidate);
      candidateRules.push(...c.rules);
    }
  }
  if (rib.flangeWidthIn === undefined) warnings.push('flange width not given: taken as twice the edge distance (4D) of each rivet for its weight');
  if (rib.skinGaugeIn === undefined) warnings.push('skin gauge not given: the rivet grip is taken as twice the flange gauge');
  const fallbacks = candidates.filter((c) => c.pullThroughBasis === 'fallback').length;
  if (fallbacks > 0) warnings.push(`${fallbacks} of ${candidates.length} candidates have no coupon data and use the conservative pull-through fallback: see their warnings`);

  const outline = ribOutline(geometry, rib.chordIn);
  const density = findMaterial(input.material, input.materialData).densityLbPerIn3;
  const trade = tradeStudy(
    candidates.map((c) => tradeCandidate(input, c, outlineAreaSqIn(outline), density)),
    input.rankBy ?? 'weight',
  );
  rules.push(
    ...unique(candidateRules),
    ...trade.rules,
    'web weight is that of an unlightened web; flange weight along the fastener lines',
    input.minutesPerHole
      ? `build-time proxy: ${input.minutesPerHole} min per hole`
      : `build-time proxy: ${MINUTES_PER_HOLE.solid} min per solid and ${MINUTES_PER_HOLE.pulled} min per pulled rivet (common practice)`,
  );
  warnings.push(...trade.warnings);

  return {
    ...envelope(input, unique(rules), unique(warnings)),
    // Stored numbers rounded to what they mean (rounding.ts; pressures and geometry to 0.0001 in their
    // units), after every check above was made at full precision.
    design: roundStored({ wingLoadingPsf: design.wingLoadingPsf, loadFactors: design.loadFactors, speeds: design.speeds, gust: design.gust }),
    conditions: conditions.map(({ cp, ...c }) => ({ ...roundStored(c), cp: compactNumbers(cp) })),
    airfoil: roundStored({ name: geometry.name, panels, trailingEdgeGap: geometry.trailingEdgeGap }),
    outline: { chordIn: rib.chordIn, points: compactNumbers(outline) },
    lines: compactNumbers(lines.map((d) => d.summary)),
    candidates: compactNumbers(candidates),
    trade: roundStored(trade.rows),
    recommended: trade.recommended,
    work: { stations: work.stations, conditions: work.conditions, candidates: work.candidates, pitchGrid: work.pitchGrid, gridCells: work.gridCells, stationChecks: work.stationChecks, holes: work.holes },
  };
}
