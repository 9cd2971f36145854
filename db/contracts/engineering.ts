/**
 * The engine's result shapes as the API sends them. Type-only: the engine is pure TypeScript with no
 * I/O, and these re-exports vanish at compile time, so the app gets one definition without importing
 * any server code.
 */
export type {
  ReworkResult, ReworkMargins, RibStudyResult, StudyCandidate, StudyCondition, LineLoads, EnvelopePoint,
  LineSchedule, TradeRow, ScheduleZone, ScheduleHole, AllowableSummary, DesignCondition, CpSample,
} from '../../server/engineering';
