import { STUDY_BUDGET } from './bounds';
import { EngineeringInputError } from './errors';
import { requireArray, requireFinite, requireNonNegative } from './validate';

/**
 * The loads along one fastener line as the pitch schedule reads them: stations with the pull and shear
 * per inch, linear in between, with quick "largest load over an interval" queries.
 */

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

/**
 * A load sampled along the line, linear between samples. `maxOver` answers "the largest load anywhere in
 * [a, b]" from the samples bracketing the interval (a sparse table, O(1) per query): a slight
 * overestimate, never an underestimate, which is the side to err on.
 */
export class LineFunction {
  /** the sparse table, built on the first `maxOver`: a line's station, x and y are only ever read with `at` */
  private table: Float64Array[] | null = null;

  constructor(
    readonly along: number[],
    readonly values: number[],
  ) {}

  private sparseTable(): Float64Array[] {
    if (this.table) return this.table;
    const values = this.values;
    const table = [Float64Array.from(values)];
    for (let w = 1; 2 * w <= values.length; w *= 2) {
      const prev = table[table.length - 1];
      const next = new Float64Array(values.length - 2 * w + 1);
      for (let i = 0; i < next.length; i++) next[i] = Math.max(prev[i], prev[i + w]);
      table.push(next);
    }
    this.table = table;
    return table;
  }

  at(x: number): number {
    return this.atIndex(x, this.indexAfter(x));
  }

  /** `at(x)` given `indexAfter(x)`: functions sampled at the same stations (a line's station, x, y) share one search */
  atIndex(x: number, after: number): number {
    const a = this.along;
    if (x <= a[0]) return this.values[0];
    if (x >= a[a.length - 1]) return this.values[a.length - 1];
    const i = after;
    const t = (x - a[i - 1]) / (a[i] - a[i - 1]);
    return this.values[i - 1] + t * (this.values[i] - this.values[i - 1]);
  }

  /** first sample index with along > x */
  indexAfter(x: number): number {
    let lo = 0;
    let hi = this.along.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (this.along[mid] <= x) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  }

  maxOver(from: number, to: number): number {
    const n = this.along.length;
    return this.maxBetween(Math.max(0, this.indexAfter(from) - 1), Math.min(n - 1, this.indexAfter(to)));
  }

  /** largest sample value with index in [lo, hi] */
  maxBetween(lo: number, hi: number): number {
    const level = 31 - Math.clz32(hi - lo + 1);
    const row = (this.table ?? this.sparseTable())[level];
    return Math.max(row[lo], row[hi - (1 << level) + 1]);
  }
}

/**
 * `LineFunction.indexAfter` by walking on from where the last call ended rather than bisecting: for
 * queries that ascend along the line (the holes of a schedule) that is a step or two each. Exact for
 * queries in any order.
 */
export class StationCursor {
  private i = 0;

  constructor(private readonly along: number[]) {}

  /** first sample index with along > x */
  after(x: number): number {
    const a = this.along;
    let i = this.i;
    while (i > 0 && a[i - 1] > x) i--;
    while (i < a.length && a[i] <= x) i++;
    this.i = i;
    return i;
  }
}

/** The loads of one line, prepared once and shared by every gauge × rivet candidate scheduled on it. */
export interface PreparedLine {
  stations: StationLoad[];
  along: number[];
  lengthIn: number;
  /** largest distance between neighbouring stations */
  spacingIn: number;
  tension: LineFunction;
  shear: LineFunction;
  station: LineFunction;
  x: LineFunction | null;
  y: LineFunction | null;
  /**
   * Largest tension and shear within ±(pitch/2 + one station spacing) of every station, by pitch: the
   * same few pitches come up for every candidate, so they are worked out once per line.
   */
  windowMax(pitchIn: number): { tension: Float64Array; shear: Float64Array };
}

export function prepareStations(stations: StationLoad[]): PreparedLine {
  const list = validateStations(stations);
  const along = list.map((s) => s.alongIn);
  const fn = (values: number[]) => new LineFunction(along, values);
  let spacingIn = 0;
  for (let i = 1; i < along.length; i++) spacingIn = Math.max(spacingIn, along[i] - along[i - 1]);
  const tension = fn(list.map((s) => s.limitTensionLbPerIn));
  const shear = fn(list.map((s) => Math.abs(s.limitShearLbPerIn ?? 0)));
  const n = along.length;
  // Without wing torque the shear is zero everywhere, and so is every window of it: one array serves.
  const noShear = shear.values.every((v) => v === 0) ? new Float64Array(n) : null;
  const cache = new Map<number, { tension: Float64Array; shear: Float64Array }>();
  const windowMax = (pitchIn: number) => {
    const key = Math.round(pitchIn * 1e6);
    let hit = cache.get(key);
    if (!hit) {
      const half = pitchIn / 2 + spacingIn;
      const t = new Float64Array(n);
      const q = noShear ?? new Float64Array(n);
      // Sliding window over the sorted stations: the samples bracketing [x − half, x + half].
      let lo = 0;
      let hi = 0;
      for (let i = 0; i < n; i++) {
        while (lo + 1 < n && along[lo + 1] <= along[i] - half) lo++;
        while (hi < n - 1 && along[hi] < along[i] + half) hi++;
        t[i] = tension.maxBetween(lo, hi);
        if (!noShear) q[i] = shear.maxBetween(lo, hi);
      }
      hit = { tension: t, shear: q };
      cache.set(key, hit);
    }
    return hit;
  };
  return {
    stations: list,
    along,
    lengthIn: along[along.length - 1] - along[0],
    spacingIn,
    tension,
    shear,
    station: fn(list.map((s) => s.stationIn)),
    x: list.every((s) => s.xIn !== undefined) ? fn(list.map((s) => s.xIn as number)) : null,
    y: list.every((s) => s.yIn !== undefined) ? fn(list.map((s) => s.yIn as number)) : null,
    windowMax,
  };
}

function validateStations(stations: unknown): StationLoad[] {
  const list = requireArray<StationLoad>(stations, 'stations', 2, 'list of station loads');
  if (list.length > STUDY_BUDGET.stations) {
    throw new EngineeringInputError('stations', `at most ${STUDY_BUDGET.stations.toLocaleString('en-US')} stations on a line (got ${list.length.toLocaleString('en-US')})`);
  }
  // Every station of every line comes through here: a sound one is passed on a quick look, and the
  // checks that name the field (and build its name) run only for one that is not.
  for (let i = 0; i < list.length; i++) {
    if (!soundStation(list[i], i > 0 ? list[i - 1] : null)) validateStation(list, i);
  }
  return list;
}

const finite = (v: unknown): boolean => typeof v === 'number' && Number.isFinite(v);

/** What `validateStation` lets through (it may let through more: it has the last word). */
function soundStation(s: StationLoad, prev: StationLoad | null): boolean {
  return (
    finite(s.stationIn) &&
    finite(s.alongIn) &&
    finite(s.limitTensionLbPerIn) &&
    s.limitTensionLbPerIn >= 0 &&
    (s.limitShearLbPerIn === undefined || finite(s.limitShearLbPerIn)) &&
    (prev === null || s.alongIn > prev.alongIn)
  );
}

function validateStation(list: StationLoad[], i: number): void {
  const s = list[i];
  requireFinite(s.stationIn, `stations[${i}].stationIn`);
  requireFinite(s.alongIn, `stations[${i}].alongIn`);
  requireNonNegative(s.limitTensionLbPerIn, `stations[${i}].limitTensionLbPerIn`, 'the load');
  if (s.limitShearLbPerIn !== undefined) requireFinite(s.limitShearLbPerIn, `stations[${i}].limitShearLbPerIn`);
  if (i > 0 && !(s.alongIn > list[i - 1].alongIn)) throw new EngineeringInputError(`stations[${i}].alongIn`, 'stations must be in order along the line');
}
