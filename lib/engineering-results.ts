/**
 * The engineering core's input and result shapes, as the engine computes them, the database keeps them
 * (jsonb) and the API sends them: one definition that the engine (server/engineering), the tables
 * (db/schema), the contracts (db/contracts) and the screens all import. Plain data only: no imports, no
 * functions. The lists here (categories, coupon outcomes, compressibility rules) are the words that
 * define their types, and the tables' enums of the same words are made from them.
 * Units are the engine's own: in, lb, psi, KEAS, radians unless a name says otherwise.
 */

// What every result carries (made by server/engineering/result.ts).

export interface EngineeringResult<I> {
  inputs: I;
  rules: string[];
  warnings: string[];
  caution: string;
}

// Kit data and flight conditions after 14 CFR 23 (made by server/engineering/design-conditions.ts).

export const CATEGORIES = ['normal', 'utility', 'acrobatic'] as const;

export type Category = (typeof CATEGORIES)[number];

export interface KitInput {
  weightLb: number;
  wingAreaSqFt: number;
  /** Mean geometric chord of the wing, inches (the gust formula converts it to ft). */
  meanChordIn: number;
  /** Wing (3-D) lift-curve slope per radian; estimated from the aspect ratio when absent. */
  liftSlopePerRad?: number;
  stallSpeedKeas: number;
  /** Design cruising speed VC; the rule minimum 33√(W/S) is used when absent or lower. */
  cruiseSpeedKeas?: number;
  /** Design dive speed VD; the rule minimum is used when absent or lower. */
  diveSpeedKeas?: number;
  category: Category;
  /** Altitude of the gust conditions (density in the gust formula), ft; sea level when absent. */
  altitudeFt?: number;
}

export interface DesignCondition {
  id: string;
  label: string;
  kind: 'maneuver' | 'gust';
  n: number;
  speedKeas: number;
  qPsi: number;
  /** n·W/(q·S): the wing lift coefficient the condition needs (negative for down-loads). */
  clNeeded: number;
}

export interface DesignConditionsResult extends EngineeringResult<KitInput> {
  wingLoadingPsf: number;
  loadFactors: { positive: number; negative: number };
  speeds: {
    stallKeas: number;
    maneuveringKeas: number;
    cruiseKeas: number;
    diveKeas: number;
    cruiseMinKeas: number;
    diveMinKeas: number;
  };
  gust: {
    liftSlopePerRad: number;
    densitySlugFt3: number;
    massRatio: number;
    alleviationFactor: number;
    atCruiseFps: number;
    atDiveFps: number;
  };
  conditions: DesignCondition[];
}

// Flaps-extended conditions (made by server/engineering/flap-conditions.ts).

export interface FlapInput {
  /** VSF: computed stalling speed with flaps fully extended at the design weight, KEAS */
  stallSpeedKeas: number;
  /** VF chosen by the supplier; the rule minimum is used when absent or lower */
  designSpeedKeas?: number;
}

// Compressibility rules (made by server/engineering/compressibility.ts).

export const COMPRESSIBILITY_RULES = ['prandtl-glauert', 'karman-tsien'] as const;

export type CompressibilityRule = (typeof COMPRESSIBILITY_RULES)[number];

// Airfoil geometry (made by server/engineering/airfoil.ts).

export type Point = [number, number];

export type Surface = 'upper' | 'lower';

export type AirfoilInput =
  { kind: 'naca'; designation: string } | { kind: 'coordinates'; points: Point[]; name?: string };

// Pressure coefficients (made by server/engineering/panel-method.ts).

export interface CpSample {
  xc: number;
  cp: number;
}

// A supplier's own pressure tables (made by server/engineering/cp-table.ts).

/** A supplier's pressure table for one lift coefficient: rows of (x/c, Cp upper, Cp lower). */
export interface CpTableInput {
  cl: number;
  rows: [number, number, number][];
}

// Wing planform (made by server/engineering/schrenk.ts).

export type PlanformInput =
  | { kind: 'rectangle'; spanIn: number; chordIn: number }
  | { kind: 'tapered'; spanIn: number; rootChordIn: number; tipChordIn: number };

export interface Planform {
  spanIn: number;
  rootChordIn: number;
  tipChordIn: number;
  /** c̄ = S/b, in */
  meanChordIn: number;
  areaSqIn: number;
  /** b²/S */
  aspectRatio: number;
  /** tip chord / root chord */
  taperRatio: number;
}

// Sheet and rivet catalogue entries (made by server/engineering/materials.ts).

export interface SheetMaterial {
  key: string;
  description: string;
  ftuPsi: number;
  ftyPsi: number;
  fsuPsi: number;
  /** bearing ultimate and yield strengths at edge distance e/D = 1.5 and 2.0 */
  fbruPsi: { e15: number; e20: number };
  fbryPsi: { e15: number; e20: number };
  densityLbPerIn3: number;
  /** compressive yield strength, psi (buckling and crippling of compression skin) */
  fcyPsi?: number;
  /** elastic modulus in compression, psi */
  compressiveModulusPsi?: number;
  poissonRatio?: number;
  source: string;
}

export interface RivetSpec {
  code: string;
  description: string;
  kind: 'solid' | 'pulled';
  /** family and dash size, for "the next size up" in a rework */
  family: string;
  dash: number;
  countersunk: boolean;
  nominalDiameterIn: number;
  /** hole diameter the strengths are based on */
  holeDiameterIn: number;
  drill: { name: string; diameterIn: number };
  /** solid rivets: shear strength of the driven rivet; single shear = F_su·π/4·d_hole² */
  fsuPsi?: number;
  /** tabulated ultimate single-shear strength, lb (pulled rivets) */
  shearLb?: number;
  /** tabulated ultimate tension strength, lb */
  tensionLb?: number;
  densityLbPerIn3: number;
  source: string;
}

// Coupon tests (made by server/engineering/coupons.ts).

export const COUPON_OUTCOMES = ['no_deformation', 'slight_deformation', 'excessive_deformation', 'failure'] as const;

export type CouponOutcome = (typeof COUPON_OUTCOMES)[number];

export interface CouponTest {
  material: string;
  gaugeIn: number;
  couponWidthIn?: number;
  rivetSpec: string;
  loadLb: number;
  outcome: CouponOutcome;
  note?: string;
  photo?: string;
}

// Fastener lines (made by server/engineering/rib-geometry.ts).

export interface FastenerLineInput {
  name: string;
  surface: Surface;
  startXc: number;
  endXc: number;
}

// Loads along a line (made by server/engineering/station-loads.ts).

export interface StationLoad {
  /** chordwise station from the rib's leading edge, in */
  stationIn: number;
  /** distance along the fastener line (along the flange) from the line's start, in */
  alongIn: number;
  /** limit pull on the flange per inch of pitch, lb/in */
  limitTensionLbPerIn: number;
  /** limit skin shear flow, lb/in */
  limitShearLbPerIn?: number;
  /** position on the rib drawing, in */
  xIn?: number;
  yIn?: number;
}

// Pitch schedule of one line (made by server/engineering/pitch-schedule.ts).

/** The supplier's layout choices for a line. */
export interface ScheduleSettings {
  /** largest pitch, in rivet diameters (typically 8 to 10) */
  maxPitchDiameters: number;
  pitchIncrementIn: number;
  maxZones: number;
}

/**
 * What every study that schedules candidates takes beside its loads: the sheet, the gauge × rivet
 * candidates, the layout, the build-time proxy, and the supplier's coupons and catalogue data.
 */
export interface CandidateSettings extends ScheduleSettings {
  material: string;
  gaugeCandidates: number[];
  rivetCandidates: string[];
  /** build-time proxy; 1.5 min per solid rivet and 1.0 per pulled rivet when absent */
  minutesPerHole?: number;
  coupons?: CouponTest[];
  pullThroughFallbackFraction?: number;
  materialData?: SheetMaterial[];
  rivetData?: RivetSpec[];
}

export interface PitchScheduleInput extends ScheduleSettings {
  line: string;
  /** hole id prefix, "U" gives U-01, U-02…; from the line name when absent */
  holePrefix?: string;
  stations: StationLoad[];
  material: string;
  gaugeIn: number;
  rivetSpec: string;
  coupons?: CouponTest[];
  pullThroughFallbackFraction?: number;
  materialData?: SheetMaterial[];
  rivetData?: RivetSpec[];
}

export interface ScheduleZone {
  fromIn: number;
  toIn: number;
  fromAlongIn: number;
  toAlongIn: number;
  pitchIn: number;
  count: number;
  worstStationIn: number;
  worstHoleId: string | null;
  appliedLimitLb: number;
  appliedUltimateLb: number;
  limitAllowableLb: number;
  ultimateAllowableLb: number;
  appliedLimitShearLb: number;
  msLimit: number | null;
  msUltimate: number | null;
}

export interface ScheduleHole {
  id: string;
  line: string;
  stationIn: number;
  alongIn: number;
  xIn?: number;
  yIn?: number;
  zone: number;
  tributaryIn: number;
  appliedLimitLb: number;
  appliedUltimateLb: number;
  appliedLimitShearLb: number;
  msLimit: number | null;
  msUltimate: number | null;
}

export interface InsufficientRange {
  fromIn: number;
  toIn: number;
  /** the pitch the worst station there would need, in (below the 3D minimum) */
  neededPitchIn: number;
}

export interface AllowableSummary {
  tensionLimitLb: number;
  tensionUltimateLb: number;
  tensionBasis: 'coupons' | 'fallback';
  tensionGoverning: string;
  shearLimitLb: number;
  shearUltimateLb: number;
  shearGoverning: string;
}

export interface PitchScheduleResult extends EngineeringResult<PitchScheduleInput> {
  line: string;
  rivetSpec: string;
  drill: { name: string; diameterIn: number };
  gaugeIn: number;
  feasible: boolean;
  reasons: string[];
  lengthIn: number;
  layout: { edgeDistanceIn: number; minPitchIn: number; maxPitchIn: number; pitchIncrementIn: number };
  allowables: AllowableSummary;
  zones: ScheduleZone[];
  holes: ScheduleHole[];
  insufficient: InsufficientRange[];
}

// Trade table (made by server/engineering/trade-study.ts).

export type RankBy = 'weight' | 'buildTime';

export interface TradeCandidate {
  gaugeIn: number;
  rivet: string;
  feasible: boolean;
  rivetCount: number;
  flangeWeightLb: number;
  webWeightLb: number;
  rivetWeightLb: number;
  buildMinutes: number;
  /** where the pull-through allowable came from */
  pullThroughBasis: 'coupons' | 'fallback';
}

export interface TradeRow extends TradeCandidate {
  totalWeightLb: number;
  /** 1 = recommended; null when not feasible */
  rank: number | null;
}

// What a study costs (made by server/engineering/study-work.ts).

/**
 * What a rib study will cost, counted before the flow is solved: the counts the loops of the chain run
 * on. Every one of them comes from the input (a chord, an increment, the candidate lists), so each is
 * held to a budget, and a refusal names the field that drives it and what would bring it in.
 */
export interface StudyWork {
  /** load stations over every line (one every `stationStepIn` along the surface) */
  stations: number;
  /** flight conditions the pressure is worked out for */
  conditions: number;
  /** gauge × rivet candidates */
  candidates: number;
  /** pitches tried for the largest rivet */
  pitchGrid: number;
  /** stations × pitches: largest-load windows looked up */
  gridCells: number;
  /** stations × conditions × candidates */
  stationChecks: number;
  /** holes every candidate could place at its 3D minimum pitch, summed */
  holes: number;
}

// Rib study (made by server/engineering/rib-study.ts).

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

export interface RibStudyInput extends CandidateSettings {
  kit: KitInput;
  airfoil: AirfoilInput;
  /** measured or computed pressure tables to use instead of the panel method */
  cpTables?: CpTableInput[];
  rib: RibInput;
  lines: FastenerLineInput[];
  /** panels of the pressure solution; 160 when absent */
  panels?: number;
  /** limit torque on the wing cell at this rib, in·lb, with the cell's enclosed area, in² (Bredt–Batho) */
  wingTorqueInLb?: number;
  cellAreaSqIn?: number;
  rankBy?: RankBy;
  /** flaps-extended conditions (14 CFR 23.345) are studied when given */
  flaps?: FlapInput;
  /** the correction of Cp to each condition's Mach number; Kármán–Tsien when absent */
  compressibility?: PressureRule;
}

/** A compressibility rule, or 'none' for incompressible pressures (low-speed kits, or checks against them). */
export type PressureRule = CompressibilityRule | 'none';

export interface StudyCondition extends DesignCondition {
  /** the section's own lift coefficient: the wing's CL × its spanwise (Schrenk) ratio × the tail's share */
  sectionCl: number;
  /** flight Mach number of the condition (its speed at the kit's altitude) */
  mach: number;
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

/** A line's schedule as stored: its warnings are the candidate's, its holes' line is the line's (each said once). */
export type LineSchedule = Omit<PitchScheduleResult, 'inputs' | 'rules' | 'caution' | 'warnings' | 'holes'> & {
  holes: Omit<ScheduleHole, 'line'>[];
};

export interface StudyCandidate {
  /** the holes of each line are kept for the recommended candidate only; others are recomputed on demand */
  holesStored: boolean;
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
  /** what the study cost, as counted before it ran (see server/engineering/study-work.ts) */
  work: StudyWork;
}

// Whole-wing study (made by server/engineering/wing-study.ts).

export interface WingRibInput {
  name: string;
  /** distance from the aeroplane's centre line, in */
  stationIn: number;
}

export interface TailInput {
  /** from the wing's quarter chord to the tail's, in */
  armIn: number;
  /** the tail's balancing load at 1 g, lb, positive down; estimated from the wing section's moment when absent */
  balancingLoadLb?: number;
}

export interface WingStudyInput extends CandidateSettings {
  kit: KitInput;
  flaps?: FlapInput;
  compressibility?: PressureRule;
  planform: PlanformInput;
  tail: TailInput;
  airfoil: AirfoilInput;
  cpTables?: CpTableInput[];
  panels?: number;
  /** the ribs from root to tip */
  ribs: WingRibInput[];
  /** what every rib has: its fastener lines (x/c, as on a lone rib) and flange */
  rib: { lines: FastenerLineInput[]; internalCp?: number; flangeWidthIn?: number; skinGaugeIn?: number };
  /** the box the skin panels close: front and rear spar at x/c, and the spar-cap area on each surface (both caps) */
  spars: { frontXc: number; rearXc: number; capAreaSqIn?: number };
  /** skin panels between every two neighbouring ribs, on both surfaces, between the spars */
  skin: { gaugeCandidates: number[]; rivetCandidates: string[] };
  rankBy?: RankBy;
}

export interface WingCondition extends DesignCondition {
  mach: number;
  /** tail load, lb, positive down */
  tailLoadLb: number;
  /** lift of the whole wing, lb = n·W + tail download */
  wingLiftLb: number;
  /** the wing's CL for that lift */
  wingCl: number;
}

/** A rib of the wing: its place, the loads there, and its own study. */
export interface WingRib {
  name: string;
  stationIn: number;
  eta: number;
  chordIn: number;
  /** tributary width, in: half of each neighbouring bay (the outermost rib also carries the tip beyond it) */
  spacingIn: number;
  /** Schrenk's section cl / wing CL */
  clRatio: number;
  /** limit loads at the station, the largest magnitude over all conditions, with the condition */
  loads: {
    shearLb: number;
    bendingInLb: number;
    torqueInLb: number;
    shearFlowLbPerIn: number;
    governing: { shear: string; bending: string; torque: string };
  };
  /**
   * The rib's own study, slimmed for a whole wing: the recommended candidate with its holes, the wing's
   * one-for-all choice with its zones, and every other candidate as its verdict only (feasible, reasons;
   * its figures are in the trade rows). Its outline is the wing's at this chord.
   */
  study: Omit<RibStudyResult, 'inputs' | 'rules' | 'caution' | 'design' | 'conditions' | 'airfoil' | 'outline'> & {
    conditions: Omit<StudyCondition, 'cp'>[];
  };
}

export interface WingTradeRow {
  gaugeIn: number;
  rivet: string;
  /** feasible on every rib */
  feasible: boolean;
  /** 'coupons' when every rib's pull-through allowable for it comes from the supplier's coupons */
  pullThroughBasis: 'coupons' | 'fallback';
  infeasibleRibs: string[];
  rivetCount: number;
  weightLb: number;
  buildMinutes: number;
  rank: number | null;
}

export interface WingStudyResult extends EngineeringResult<WingStudyInput> {
  kind: 'wing';
  design: RibStudyResult['design'];
  planform: Planform;
  tail: { armIn: number; estimated: boolean; balancingLoadLb: number; cmAc: number };
  airfoil: RibStudyResult['airfoil'];
  /** the section at unit chord (each rib's outline is this times its chord) */
  outline: { chordIn: 1; points: [number, number][] };
  conditions: WingCondition[];
  ribs: WingRib[];
  skins: SkinPanelResult[];
  trade: {
    /** one gauge and rivet for every rib, ranked */
    uniform: WingTradeRow[];
    /** each rib its own recommendation */
    perRib: {
      choices: { rib: string; gaugeIn: number; rivet: string }[];
      feasible: boolean;
      rivetCount: number;
      weightLb: number;
      buildMinutes: number;
    };
    recommendedUniform: { gaugeIn: number; rivet: string } | null;
  };
  work: StudyWork & { ribs: number; skinPanels: number; skinSchedules: number };
}

// Skin panels (made by server/engineering/skin-panel.ts).

export type SkinLineSchedule = Omit<PitchScheduleResult, 'inputs' | 'rules' | 'caution' | 'warnings'>;

export interface SkinCandidate {
  gaugeIn: number;
  rivet: string;
  feasible: boolean;
  reasons: string[];
  warnings: string[];
  /** the shear flows on this gauge, lb/in (limit) */
  torsionShearFlowLbPerIn: number;
  bendingShearFlowLbPerIn: number;
  /** spanwise compression in the skin beside the spars, psi (limit; past buckling, in the effective width); 0 on the tension surface */
  compressionPsi: number;
  interRivet: { endFixity: number; source: string; pitchLimitIn: number | null };
  shearBuckling: { criticalPsi: number; appliedPsi: number; marginOfSafety: number | null; diagonalTension: boolean };
  /** of the whole panel between the spars, at the stress it would carry unbuckled; then the width that carries the load */
  compressionBuckling: {
    criticalPsi: number;
    appliedPsi: number;
    marginOfSafety: number | null;
    effectiveWidthIn: number;
  };
  rivetCount: number;
  weightLb: number;
  buildMinutes: number;
  lines: SkinLineSchedule[];
}

/** Where a skin panel is: its surface between two ribs, and the spar box under it at the inner rib. */
export interface SkinPanelPlace {
  name: string;
  surface: Surface;
  innerRib: string;
  outerRib: string;
  innerStationIn: number;
  outerStationIn: number;
  /** the box's width between the spars (w) and depth between the skins (h), at the inner rib, in */
  boxWidthIn: number;
  boxDepthIn: number;
}

export interface SkinPanelResult extends SkinPanelPlace {
  widthIn: number;
  candidates: SkinCandidate[];
  /** the lightest feasible candidate (fewest rivets between equals) */
  recommended: { gaugeIn: number; rivet: string } | null;
}

// Rework of one hole (made by server/engineering/rework-check.ts).

export interface ReworkInput {
  rivetSpec: string;
  proposedSpec: string;
  /**
   * Positions along the fastener line, in (a scheduled hole's `alongIn`; on a straight line its
   * station): the pitch to each neighbour is their difference. null where the hole has no neighbour.
   */
  holeStationIn: number;
  neighbourStationsIn: [number | null, number | null];
  /** from the hole's centre to the nearest sheet edge, in */
  edgeDistanceIn: number;
  gaugeIn: number;
  material: string;
  appliedLimitTensionLb?: number;
  appliedLimitShearLb?: number;
  coupons?: CouponTest[];
  materialData?: SheetMaterial[];
  rivetData?: RivetSpec[];
}

export interface ReworkMargins {
  shearLimit: number | null;
  shearUltimate: number | null;
  tensionLimit: number | null;
  tensionUltimate: number | null;
  combinedLimit: number | null;
  combinedUltimate: number | null;
}

export interface ReworkResult extends EngineeringResult<ReworkInput> {
  pass: boolean;
  reasons: string[];
  newDrill: { name: string; diameterIn: number };
  requiredEdgeIn: number;
  requiredPitchIn: number;
  pitchToNeighboursIn: [number | null, number | null];
  margins: ReworkMargins;
  alternative: 'repair with doubler' | 'scrap' | null;
}

// Repair check over the holes of a finding (made by server/engineering/repair-check.ts).

export interface RepairHoleInput {
  /** the hole's name on the traveler (U-04); 1–64 characters, unique within the finding */
  holeId: string;
  /** position along the fastener line, in; −1000…1000 */
  stationIn: number;
  /**
   * previous and next hole, in; −1000…1000, null where there is none. They may be holes of this same
   * finding (a run drilled out together): the pitch to them is checked against 3D of the new rivet all
   * the same, since both will be at the new size.
   */
  neighbourStationsIn: [number | null, number | null];
  /** nominal edge distance from the drawing, in; above 0, at most 10 */
  edgeDistanceIn: number;
  /** what the inspector measured: hole diameter 0.02–1 in, edge distance above 0, at most 10 in */
  measured?: { holeDiameterIn?: number; edgeDistanceIn?: number };
  /** limit loads on the rivet, lb; 0–100000 */
  appliedLimitTensionLb?: number;
  appliedLimitShearLb?: number;
}

export interface RepairCheckInput {
  rivetSpec: string;
  proposedSpec: string;
  /** sheet thickness, in; 0.005–0.5 */
  gaugeIn: number;
  material: string;
  /** 1–50 holes */
  holes: RepairHoleInput[];
  coupons?: CouponTest[];
  materialData?: SheetMaterial[];
  rivetData?: RivetSpec[];
}

export type RepairAlternative = 'repair with doubler' | 'scrap' | null;

export interface RepairHoleResult {
  holeId: string;
  pass: boolean;
  reasons: string[];
  edgeDistanceUsedIn: number;
  /** true when the measured edge distance replaced the nominal one */
  edgeDistanceMeasured: boolean;
  pitchToNeighboursIn: [number | null, number | null];
  margins: ReworkMargins;
  alternative: RepairAlternative;
}

export interface CountersinkCheck {
  /** the proposed head needs a countersunk seat (always true: the check is null for protruding heads) */
  required: boolean;
  /** depth of the head's cone, in; null when the head's dimensions are not known here */
  headHeightIn: number | null;
  /** deepest countersink the sheet allows, in */
  limitIn: number | null;
  pass: boolean;
}

export interface RepairCheckResult extends EngineeringResult<RepairCheckInput> {
  pass: boolean;
  holes: RepairHoleResult[];
  /** every failing hole's reasons, each prefixed with its hole id ("U-04: …") */
  reasons: string[];
  newDrill: { name: string; diameterIn: number };
  requiredEdgeIn: number;
  requiredPitchIn: number;
  /** null when the proposed rivet has a protruding head */
  countersink: CountersinkCheck | null;
  /** the worst over the holes: scrap beats a doubler */
  alternative: RepairAlternative;
}
