// Public API of the engineering core: pure functions, plain data in and out, no I/O.

// The input and result shapes are defined once, beside the app's code, for the server and the screens alike.
export {
  type AirfoilInput,
  type AllowableSummary,
  type CandidateSettings,
  CATEGORIES,
  type Category,
  COMPRESSIBILITY_RULES,
  type CompressibilityRule,
  type CountersinkCheck,
  COUPON_OUTCOMES,
  type CouponOutcome,
  type CouponTest,
  type CpSample,
  type CpTableInput,
  type DesignCondition,
  type DesignConditionsResult,
  type EngineeringResult,
  type EnvelopePoint,
  type FastenerLineInput,
  type FlapInput,
  type InsufficientRange,
  type KitInput,
  type LineLoads,
  type LineSchedule,
  type PitchScheduleInput,
  type PitchScheduleResult,
  type Planform,
  type PlanformInput,
  type Point,
  type PressureRule,
  type RankBy,
  type RepairAlternative,
  type RepairCheckInput,
  type RepairCheckResult,
  type RepairHoleInput,
  type RepairHoleResult,
  type ReworkInput,
  type ReworkMargins,
  type ReworkResult,
  type RibInput,
  type RibStudyInput,
  type RibStudyResult,
  type RivetSpec,
  type ScheduleHole,
  type ScheduleSettings,
  type ScheduleZone,
  type SheetMaterial,
  type SkinCandidate,
  type SkinLineSchedule,
  type SkinPanelResult,
  type StationLoad,
  type StudyCandidate,
  type StudyCondition,
  type StudyWork,
  type Surface,
  type TailInput,
  type TradeCandidate,
  type TradeRow,
  type WingCondition,
  type WingRib,
  type WingRibInput,
  type WingStudyInput,
  type WingStudyResult,
  type WingTradeRow,
} from '../../lib/engineering-results';
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
  WING_BOUNDS,
  WING_LOADING_RANGE_PSF,
  requireWingBound,
  type Bound,
  type StudyBoundKey,
  type WingBoundKey,
} from './bounds';
export { roundSignificant, roundStored, STORED_SIGNIFICANT_DIGITS, STORED_ZERO } from './rounding';
export { estimateStudyWork, requireStudyBudget } from './study-work';
export { ENGINEERING_CAUTION, marginOfSafety } from './result';
export * from './units';
export {
  densitySlugPerFt3,
  dynamicPressurePsf,
  dynamicPressurePsi,
  speedOfSoundFtPerS,
  temperatureRatio,
  SEA_LEVEL_DENSITY_SLUG_FT3,
  SEA_LEVEL_SPEED_OF_SOUND_FT_S,
  GRAVITY_FT_S2,
} from './atmosphere';
export {
  designConditions,
  estimatedWingLiftSlope,
  gustLoadFactors,
  gustVelocitiesFps,
  limitManeuverFactors,
  maneuveringSpeedKeas,
  minimumCruiseSpeedKeas,
  minimumDiveSpeedKeas,
  type GustInput,
} from './design-conditions';
export {
  flapConditions,
  flapDesignSpeedKeas,
  FLAP_GUST_FPS,
  FLAP_MANEUVER_FACTOR,
  FLAP_SPEED_FACTORS,
  type FlapConditionsResult,
} from './flap-conditions';
export {
  envelopeConditions,
  negativeEnvelopeCorners,
  NEGATIVE_FACTOR_AT_DIVE,
  type EnvelopeConditionsResult,
  type EnvelopeCorner,
  type NegativeCornersResult,
} from './envelope-corners';
export {
  chordAt,
  planformGeometry,
  schrenkDistribution,
  schrenkLiftRatio,
  schrenkStation,
  stationEta,
  MAX_SCHRENK_STATIONS,
  SCHRENK_ASSUMPTIONS,
  SCHRENK_RULE,
  type SchrenkResult,
  type SchrenkStation,
} from './schrenk';
export {
  compressibilityBeta,
  compressibleCp,
  correctCpDistribution,
  criticalPressureCoefficient,
  karmanTsienCp,
  machNumber,
  prandtlGlauertCp,
  requireMach,
  trueAirspeedKnots,
  vacuumPressureCoefficient,
  COMPRESSIBILITY_RULE_TEXT,
  GAMMA_AIR,
  MAX_CP_SAMPLES,
  type CorrectedDistribution,
} from './compressibility';
export {
  johnsonElasticFor,
  johnsonReduced,
  panelBuckling,
  plateBucklingStressPsi,
  sheetBucklingProperties,
  PANEL_EDGES,
  PANEL_LOADINGS,
  PLATE_BUCKLING_COEFFICIENTS,
  type PanelBucklingInput,
  type PanelBucklingResult,
  type PanelEdges,
  type PanelLoading,
} from './plate-buckling';
export {
  endFixity,
  interRivetBuckling,
  interRivetElasticStressPsi,
  interRivetPitchLimitIn,
  rivetHeadOf,
  END_FIXITY,
  RIVET_HEADS,
  type InterRivetInput,
  type InterRivetResult,
  type RivetHead,
} from './inter-rivet-buckling';
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
  UPSIDE_DOWN_CAMBER,
  parseNacaDesignation,
  surfacePoints,
  MIN_AIRFOIL_POINTS,
  MAX_TRAILING_EDGE_GAP,
  type AirfoilGeometry,
  type AirfoilResult,
} from './airfoil';
export { luFactor, luSolve, solveLinear, SingularMatrixError, type LuFactors } from './linear-solve';
export {
  alphaForLiftCoefficient,
  cpOnSurface,
  interpolateCp,
  liftCoefficientAt,
  pressureDistribution,
  solvePanelMethod,
  type PanelSolution,
  type PressureDistribution,
} from './panel-method';
export { flatPlatePressureJump, thinAirfoilLiftCoefficient, THIN_AIRFOIL_LIFT_SLOPE } from './thin-airfoil';
export { joukowskiSection, type JoukowskiSection } from './joukowski';
export { cpFromTables, validateCpTables, type CpTable } from './cp-table';
export {
  loadEnvelope,
  rivetShearLb,
  rivetTensionLb,
  shearFlowLbPerIn,
  suctionForRivetLoadPsi,
  suctionIntensityLbPerIn,
  ULTIMATE_FACTOR,
} from './rivet-loads';
export {
  findMaterial,
  findRivet,
  findRivetByCallout,
  nextRivetSize,
  MATERIALS,
  RIVETS,
  STOCK_GAUGES_IN,
} from './materials';
export {
  layoutRules,
  rivetLengthDash,
  rivetLengthIn,
  rivetWeightLb,
  transversePitchIn,
  type LayoutRules,
} from './layout';
export {
  couponAllowables,
  groupCouponAllowables,
  validateCoupons,
  validateCouponTest,
  type CouponAllowables,
  type CouponGroup,
} from './coupons';
export {
  bearingStrengthPsi,
  combinedMargin,
  jointAllowables,
  pullThroughFallback,
  rivetShearStrengthLb,
  rivetsPerInchOfWidth,
  rivetTensionStrengthLb,
  DEFAULT_PULL_THROUGH_FRACTION,
  type JointAllowables,
  type JointInput,
} from './allowables';
export { pitchGridSize, pitchSchedule, requirePitchGrid } from './pitch-schedule';
export { tradeStudy, type TradeStudyResult } from './trade-study';
export { LAYOUT_TOLERANCE_IN, reworkCheck } from './rework-check';
export { countersunkHeadHeightIn, repairCheck, COUNTERSINK_MAX_DEPTH_FRACTION, MAX_REPAIR_HOLES } from './repair-check';
export { lineStations, ribOutline } from './rib-geometry';
export { coarsenRuns, estimateHoles, groupIntoZones, placeHoles, type Zone } from './zoning';
export { ribCandidate, ribStudy, PRESSURE_RULES } from './rib-study';
export { wingStudy, MAX_WING_RIBS } from './wing-study';
export { compressionBucklingCoefficient, effectiveWidthIn, skinPanelStudy, type SkinPanelSpec } from './skin-panel';
export { momentCoefficientAbout, spanwiseLoads, type SectionMoment, type StationLoads } from './wing-loads';
