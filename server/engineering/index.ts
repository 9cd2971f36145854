// Public API of the engineering core: pure functions, plain data in and out, no I/O.
export { EngineeringInputError, fieldAt } from './errors';
export {
  requireCount,
  requireStudyBound,
  requireWithin,
  ASPECT_RATIO_RANGE,
  MAX_LINE_HOLES,
  MAX_REVISION_HOLES,
  MAX_ZONING_RUNS,
  STUDY_BOUNDS,
  STUDY_BUDGET,
  WING_LOADING_RANGE_PSF,
  type Bound,
  type StudyBoundKey,
} from './bounds';
export { estimateStudyWork, requireStudyBudget, type StudyWork } from './study-work';
export { ENGINEERING_CAUTION, marginOfSafety, type EngineeringResult } from './result';
export * from './units';
export { densitySlugPerFt3, dynamicPressurePsf, dynamicPressurePsi, SEA_LEVEL_DENSITY_SLUG_FT3, GRAVITY_FT_S2 } from './atmosphere';
export {
  CATEGORIES,
  designConditions,
  estimatedWingLiftSlope,
  gustLoadFactors,
  gustVelocitiesFps,
  limitManeuverFactors,
  maneuveringSpeedKeas,
  minimumCruiseSpeedKeas,
  minimumDiveSpeedKeas,
  type Category,
  type DesignCondition,
  type DesignConditionsResult,
  type GustInput,
  type KitInput,
} from './design-conditions';
export {
  buildAirfoil,
  closeTrailingEdge,
  cosineSpacing,
  findSelfCrossing,
  nacaFiveDigitMeanLine,
  nacaFourDigitMeanLine,
  nacaGeometry,
  nacaThickness,
  normaliseCoordinates,
  parseNacaDesignation,
  surfacePoints,
  MIN_AIRFOIL_POINTS,
  MAX_TRAILING_EDGE_GAP,
  type AirfoilGeometry,
  type AirfoilInput,
  type AirfoilResult,
  type Point,
  type Surface,
} from './airfoil';
export { luFactor, luSolve, solveLinear, SingularMatrixError, type LuFactors } from './linear-solve';
export {
  alphaForLiftCoefficient,
  cpOnSurface,
  interpolateCp,
  liftCoefficientAt,
  pressureDistribution,
  solvePanelMethod,
  type CpSample,
  type PanelSolution,
  type PressureDistribution,
} from './panel-method';
export { flatPlatePressureJump, thinAirfoilLiftCoefficient, THIN_AIRFOIL_LIFT_SLOPE } from './thin-airfoil';
export { joukowskiSection, type JoukowskiSection } from './joukowski';
export { cpFromTables, validateCpTables, type CpTable, type CpTableInput } from './cp-table';
export {
  loadEnvelope,
  rivetShearLb,
  rivetTensionLb,
  shearFlowLbPerIn,
  suctionForRivetLoadPsi,
  suctionIntensityLbPerIn,
  ULTIMATE_FACTOR,
} from './rivet-loads';
export { findMaterial, findRivet, findRivetByCallout, nextRivetSize, MATERIALS, RIVETS, STOCK_GAUGES_IN, type RivetSpec, type SheetMaterial } from './materials';
export { layoutRules, rivetLengthDash, rivetLengthIn, rivetWeightLb, transversePitchIn, type LayoutRules } from './layout';
export {
  couponAllowables,
  groupCouponAllowables,
  validateCoupons,
  validateCouponTest,
  COUPON_OUTCOMES,
  type CouponAllowables,
  type CouponGroup,
  type CouponOutcome,
  type CouponTest,
} from './coupons';
export {
  bearingStrengthPsi,
  combinedMargin,
  jointAllowables,
  rivetShearStrengthLb,
  rivetsPerInchOfWidth,
  rivetTensionStrengthLb,
  DEFAULT_PULL_THROUGH_FRACTION,
  type JointAllowables,
  type JointInput,
} from './allowables';
export {
  pitchGridSize,
  pitchSchedule,
  requirePitchGrid,
  type AllowableSummary,
  type PitchScheduleInput,
  type PitchScheduleResult,
  type ScheduleHole,
  type ScheduleZone,
  type StationLoad,
} from './pitch-schedule';
export { tradeStudy, type RankBy, type TradeCandidate, type TradeRow, type TradeStudyResult } from './trade-study';
export { LAYOUT_TOLERANCE_IN, reworkCheck, type ReworkInput, type ReworkMargins, type ReworkResult } from './rework-check';
export {
  countersunkHeadHeightIn,
  repairCheck,
  COUNTERSINK_MAX_DEPTH_FRACTION,
  MAX_REPAIR_HOLES,
  type CountersinkCheck,
  type RepairAlternative,
  type RepairCheckInput,
  type RepairCheckResult,
  type RepairHoleInput,
  type RepairHoleResult,
} from './repair-check';
export { lineStations, ribOutline, type FastenerLineInput } from './rib-geometry';
export { coarsenRuns, estimateHoles, groupIntoZones, placeHoles, type Zone } from './zoning';
export {
  ribStudy,
  type EnvelopePoint,
  type LineLoads,
  type LineSchedule,
  type RibInput,
  type RibStudyInput,
  type RibStudyResult,
  type StudyCandidate,
  type StudyCondition,
} from './rib-study';
