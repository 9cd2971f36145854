/**
 * The stored result of a rib study, as the screen reads it. The engine's own types live in
 * server/engineering/rib-study.ts, which the app may not import; this is the part of that shape the
 * pictures and tables use (in, lb, psi, KEAS). `readStudyResult` checks it before anything is drawn.
 */
export type Pt = [number, number];

export type CpSample = { xc: number; cp: number };

export type StudyCondition = {
  id: string;
  label: string;
  kind: 'maneuver' | 'gust';
  n: number;
  speedKeas: number;
  qPsi: number;
  clNeeded: number;
  alphaDeg: number;
  pressureSource: string;
  cp: { upper: CpSample[]; lower: CpSample[] };
};

export type EnvelopePoint = { stationIn: number; xc: number; xIn: number; yIn: number; limitLbPerIn: number; ultimateLbPerIn: number; governing: string | null };

export type LineLoads = {
  name: string;
  surface: 'upper' | 'lower';
  startXc: number;
  endXc: number;
  holePrefix: string;
  lengthIn: number;
  fromStationIn: number;
  toStationIn: number;
  envelope: EnvelopePoint[];
};

export type ScheduleZone = {
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
  msLimit: number | null;
  msUltimate: number | null;
};

export type ScheduleHole = {
  id: string;
  stationIn: number;
  xIn?: number;
  yIn?: number;
  zone: number;
  appliedLimitLb: number;
  appliedUltimateLb: number;
  msLimit: number | null;
  msUltimate: number | null;
};

export type Allowables = {
  tensionLimitLb: number;
  tensionUltimateLb: number;
  tensionBasis: 'coupons' | 'fallback';
  tensionGoverning?: string;
};

export type LineSchedule = {
  line: string;
  rivetSpec: string;
  drill: { name: string; diameterIn: number };
  gaugeIn: number;
  feasible: boolean;
  reasons: string[];
  lengthIn: number;
  layout: { edgeDistanceIn: number; minPitchIn: number; maxPitchIn: number; pitchIncrementIn: number };
  allowables: Allowables;
  zones: ScheduleZone[];
  holes: ScheduleHole[];
  insufficient?: { fromIn: number; toIn: number; neededPitchIn: number }[];
  warnings?: string[];
};

export type StudyCandidate = {
  gaugeIn: number;
  rivet: string;
  feasible: boolean;
  reasons: string[];
  warnings: string[];
  pullThroughBasis: 'coupons' | 'fallback';
  flangeWidthIn: number;
  lines: LineSchedule[];
};

export type TradeRow = {
  gaugeIn: number;
  rivet: string;
  feasible: boolean;
  rivetCount: number;
  flangeWeightLb: number;
  webWeightLb?: number;
  rivetWeightLb: number;
  totalWeightLb: number;
  buildMinutes: number;
  pullThroughBasis?: 'coupons' | 'fallback';
  rank: number | null;
};

export type CandidateKey = { gaugeIn: number; rivet: string };

export type StudyResult = {
  conditions: StudyCondition[];
  outline: { chordIn: number; points: Pt[] };
  airfoil?: { name: string; panels: number };
  design?: { wingLoadingPsf: number; loadFactors: { positive: number; negative: number }; speeds: Record<string, number> };
  lines: LineLoads[];
  candidates: StudyCandidate[];
  trade: TradeRow[];
  recommended: CandidateKey | null;
  rules: string[];
  warnings: string[];
  caution: string;
};

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
  const c = findCandidate(result, result.recommended) ?? result.candidates.find((x) => x.feasible) ?? result.candidates[0];
  return c ? { gaugeIn: c.gaugeIn, rivet: c.rivet } : null;
}

/** The testID of a trade row: "trade-row-0.02-PULLED-4" (the gauge as JavaScript prints it). */
export const tradeRowTestId = (k: CandidateKey): string => `trade-row-${String(k.gaugeIn)}-${k.rivet}`;
