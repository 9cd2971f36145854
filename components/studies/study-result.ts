import type {
  AllowableSummary,
  CpSample,
  EnvelopePoint,
  LineLoads,
  LineSchedule,
  RibStudyResult,
  ScheduleHole,
  ScheduleZone,
  StudyCandidate,
  StudyCondition,
  TradeRow,
} from '@/lib/engineering-results';

/**
 * The stored result of a rib study as the screen reads it: the engine's own types (in, lb, psi, KEAS),
 * less what the pictures do not use. `readStudyResult` checks it before anything is drawn.
 */
export type {
  CpSample,
  EnvelopePoint,
  LineLoads,
  LineSchedule,
  ScheduleHole,
  ScheduleZone,
  StudyCandidate,
  StudyCondition,
  TradeRow,
};
export type Pt = [number, number];
export type Allowables = AllowableSummary;
export type CandidateKey = { gaugeIn: number; rivet: string };
export type StudyResult = Pick<
  RibStudyResult,
  | 'conditions'
  | 'outline'
  | 'airfoil'
  | 'design'
  | 'lines'
  | 'candidates'
  | 'trade'
  | 'recommended'
  | 'rules'
  | 'warnings'
  | 'caution'
>;

const isArr = (v: unknown): v is unknown[] => Array.isArray(v);

/** The result when it has everything the screen draws; null for a stored result of another shape. */
export function readStudyResult(raw: unknown): StudyResult | null {
  if (!raw || typeof raw !== 'object') return null;
  const r = raw as Partial<StudyResult>;
  if (!isArr(r.conditions) || !isArr(r.lines) || !isArr(r.candidates) || !isArr(r.trade)) return null;
  if (!r.outline || !isArr(r.outline.points) || r.outline.points.length < 3) return null;
  return {
    ...(r as StudyResult),
    rules: isArr(r.rules) ? (r.rules as string[]) : [],
    warnings: isArr(r.warnings) ? (r.warnings as string[]) : [],
    caution: typeof r.caution === 'string' ? r.caution : '',
    recommended: r.recommended ?? null,
  };
}

/** Gauges compare as numbers that went through JSON: equal within a ten-thousandth of an inch. */
export const sameCandidate = (a: CandidateKey | null | undefined, b: CandidateKey | null | undefined): boolean =>
  !!a && !!b && Math.abs(a.gaugeIn - b.gaugeIn) < 1e-6 && a.rivet === b.rivet;

export function findCandidate(result: StudyResult, key: CandidateKey | null | undefined): StudyCandidate | null {
  return result.candidates.find((c) => sameCandidate(c, key)) ?? null;
}

/** What the pictures show first: the recommended candidate, else the first feasible, else the first. */
export function initialCandidate(result: StudyResult): CandidateKey | null {
  const c =
    findCandidate(result, result.recommended) ?? result.candidates.find((x) => x.feasible) ?? result.candidates[0];
  return c ? { gaugeIn: c.gaugeIn, rivet: c.rivet } : null;
}

/** The testID of a trade row: "trade-row-0.02-PULLED-4" (the gauge as JavaScript prints it). */
export const tradeRowTestId = (k: CandidateKey): string => `trade-row-${String(k.gaugeIn)}-${k.rivet}`;
