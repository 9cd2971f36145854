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
  WING_BOUNDS,
  WING_LOADING_RANGE_PSF,
  requireWingBound,
  type Bound,
  type StudyBoundKey,
  type WingBoundKey,
} from './bounds';
export { roundSignificant, roundStored, STORED_SIGNIFICANT_DIGITS, STORED_ZERO } from './rounding';
export { estimateStudyWork, requireStudyBudget, type StudyWork } from './study-work';
export { ENGINEERING_CAUTION, marginOfSafety, type EngineeringResult } from './result';
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
  flapConditions,
  flapDesignSpeedKeas,
  FLAP_GUST_FPS,
  FLAP_MANEUVER_FACTOR,
  FLAP_SPEED_FACTORS,
  type FlapConditionsResult,
  type FlapInput,
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
  type Planform,
  type PlanformInput,
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
  COMPRESSIBILITY_RULES,
  COMPRESSIBILITY_RULE_TEXT,
  GAMMA_AIR,
  MAX_CP_SAMPLES,
  type CompressibilityRule,
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
export {
  findMaterial,
  findRivet,
  findRivetByCallout,
  nextRivetSize,
  MATERIALS,
  RIVETS,
  STOCK_GAUGES_IN,
  type RivetSpec,
  type SheetMaterial,
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
  pullThroughFallback,
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
export {
  LAYOUT_TOLERANCE_IN,
  reworkCheck,
  type ReworkInput,
  type ReworkMargins,
  type ReworkResult,
} from './rework-check';
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
  ribCandidate,
  ribStudy,
  PRESSURE_RULES,
  type PressureRule,
  type EnvelopePoint,
  type LineLoads,
  type LineSchedule,
  type RibInput,
  type RibStudyInput,
  type RibStudyResult,
  type StudyCandidate,
  type StudyCondition,
} from './rib-study';
export {
  wingStudy,
  MAX_WING_RIBS,
  type WingCondition,
  type WingRib,
  type WingRibInput,
  type WingStudyInput,
  type WingStudyResult,
  type WingTradeRow,
} from './wing-study';
export {
  compressionBucklingCoefficient,
  effectiveWidthIn,
  skinPanelStudy,
  type SkinCandidate,
  type SkinLineSchedule,
  type SkinPanelResult,
  type SkinPanelSpec,
} from './skin-panel';
export { momentCoefficientAbout, spanwiseLoads, type SectionMoment, type StationLoads } from './wing-loads';
