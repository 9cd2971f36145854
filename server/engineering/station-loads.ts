import { packed, room } from './arrays';
import { STUDY_BUDGET } from './bounds';
import { EngineeringInputError } from './errors';
import { requireArray, requireFinite, requireNonNegative } from './validate';
import type { StationLoad } from '../../lib/engineering-results';
import { countText } from '../../lib/number-text';

/**
 * The loads along one fastener line as the pitch schedule reads them: stations with the pull and shear
 * per inch, linear in between, with quick "largest load over an interval" queries.
 */

/**
 * A load sampled along the line, linear between samples. `maxOver` answers "the largest load anywhere in
 * [a, b]" from the samples bracketing the interval (a sparse table, O(1) per query): a slight
 * overestimate, never an underestimate, which is the side to err on.
 */
export class LineFunction {
  /** the sparse table, built on the first `maxOver`: a line's station, x and y are only ever read with `at` */
  private table: number[][] | null = null;

  constructor(
    readonly along: number[],
    readonly values: number[],
  ) {}

  /** the sparse table: row k holds the largest of every 2^k neighbouring samples */
  levels(): number[][] {
    return this.table ?? this.sparseTable();
  }

  private sparseTable(): number[][] {
    if (this.table) return this.table;
    const values = this.values;
    // Plain arrays: a typed array of more than a few numbers is made outside the heap, which costs
    // microseconds each, and a study makes hundreds of these small tables and windows.
    // (packed arrays: see arrays.ts)
    const first = room(values.length);
    for (let i = 0; i < values.length; i++) first[i] = values[i];
    const table: number[][] = [first];
    for (let w = 1; 2 * w <= values.length; w *= 2) {
      const prev = table[table.length - 1];
      const next = room(values.length - 2 * w + 1);
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
  /** stations per inch, on average: where evenly spaced stations would put x */
  private readonly perIn: number;

  constructor(private readonly along: number[]) {
    const n = along.length;
    this.perIn = n > 1 ? (n - 1) / (along[n - 1] - along[0]) : 0;
  }

  /** first sample index with along > x */
  after(x: number): number {
    const a = this.along;
    let i = this.i;
    // A query well ahead (the next hole, some ten stations on) starts where evenly spaced stations would
    // put it; the walk below makes the answer exact however they are spaced.
    const guess = Math.floor((x - a[0]) * this.perIn);
    if (guess > i + 2 && guess < a.length) i = guess;
    while (i > 0 && a[i - 1] > x) i--;
    while (i < a.length && a[i] <= x) i++;
    this.i = i;
    return i;
  }
}

/** The loads of one line, prepared once and shared by every gauge × rivet candidate scheduled on it. */
export interface PreparedLine {
  along: number[];
  lengthIn: number;
  /** largest distance between neighbouring stations */
  spacingIn: number;
  tension: LineFunction;
  shear: LineFunction;
  station: LineFunction;
  x: LineFunction | null;
  y: LineFunction | null;
  /** true when the shear is zero all along (no wing torque): every largest shear is then zero */
  noShear: boolean;
  /**
   * Largest tension and shear within ±(pitch/2 + one station spacing) of each station, by pitch: the
   * same few pitches come up for every candidate, so they are kept for the line (see LoadWindow).
   */
  window(pitchIn: number): LoadWindow;
  /**
   * Largest tension and shear over the first (last) `share` inches of the line: what an end rivet
   * carries. The same shares come up for every candidate with the same rivet, so they are kept.
   */
  endMax(end: 'first' | 'last', share: number): { tension: number; shear: number };
}

export function prepareStations(stations: StationLoad[]): PreparedLine {
  const list = validateStations(stations);
  const n = list.length;
  // One pass over the stations for every sampled quantity (a study prepares some 600 a line).
  // (packed arrays: see arrays.ts)
  const along = room(n);
  const tension = room(n);
  const shear = room(n);
  const station = room(n);
  let x: number[] | null = room(n);
  let y: number[] | null = room(n);
  for (let i = 0; i < n; i++) {
    const s = list[i];
    along[i] = s.alongIn;
    tension[i] = s.limitTensionLbPerIn;
    shear[i] = s.limitShearLbPerIn ?? 0;
    station[i] = s.stationIn;
    if (x !== null) {
      if (s.xIn === undefined) x = null;
      else x[i] = s.xIn;
    }
    if (y !== null) {
      if (s.yIn === undefined) y = null;
      else y[i] = s.yIn;
    }
  }
  return preparedLine({ along, tension, shear, station, x, y });
}

/** A line's loads as columns, one entry per station: what `StationLoad`s say, without an object each. */
export interface LineColumns {
  along: number[];
  tension: number[];
  /** limit shear flow (its sign is dropped) */
  shear: number[];
  station: number[];
  x: number[] | null;
  y: number[] | null;
}

/**
 * `prepareStations` for loads a caller made as columns (the rib study's, some 600 a line). Held to the
 * same checks: columns it would refuse go through it as stations, to be refused naming the station.
 */
export function prepareColumns(c: LineColumns): PreparedLine {
  const n = c.along.length;
  let sound = n >= 2 && n <= STUDY_BUDGET.stations;
  for (let i = 0; sound && i < n; i++) {
    sound =
      finite(c.station[i]) &&
      finite(c.along[i]) &&
      finite(c.tension[i]) &&
      c.tension[i] >= 0 &&
      finite(c.shear[i]) &&
      (c.x === null || finite(c.x[i])) &&
      (c.y === null || finite(c.y[i])) &&
      (i === 0 || c.along[i] > c.along[i - 1]);
  }
  if (sound) return preparedLine(c);
  const stations: StationLoad[] = c.along.map((alongIn, i) => ({
    stationIn: c.station[i],
    alongIn,
    limitTensionLbPerIn: c.tension[i],
    limitShearLbPerIn: c.shear[i],
    ...(c.x && c.y ? { xIn: c.x[i], yIn: c.y[i] } : {}),
  }));
  return prepareStations(stations);
}

function preparedLine(c: LineColumns): PreparedLine {
  const { along } = c;
  const n = along.length;
  let spacingIn = 0;
  for (let i = 1; i < along.length; i++) spacingIn = Math.max(spacingIn, along[i] - along[i - 1]);
  const shears = room(n);
  let anyShear = false;
  for (let i = 0; i < n; i++) {
    shears[i] = Math.abs(c.shear[i]);
    if (shears[i] !== 0) anyShear = true;
  }
  const tension = new LineFunction(along, c.tension);
  const shear = new LineFunction(along, shears);
  // Without wing torque the shear is zero everywhere, and so is every window of it: one array serves.
  const noShear = anyShear ? null : new Float64Array(n);
  const cache = new Map<number, LoadWindow>();
  const window = (pitchIn: number) => {
    const key = Math.round(pitchIn * 1e6);
    let hit = cache.get(key);
    if (!hit) {
      hit = new LoadWindow(along, pitchIn / 2 + spacingIn, tension, noShear ? null : shear, noShear);
      cache.set(key, hit);
    }
    return hit;
  };
  const ends = {
    first: new Map<number, { tension: number; shear: number }>(),
    last: new Map<number, { tension: number; shear: number }>(),
  };
  const endMax = (end: 'first' | 'last', share: number) => {
    const kept = ends[end];
    let hit = kept.get(share);
    if (!hit) {
      const a0 = along[0];
      const a1 = along[n - 1];
      const lo = end === 'first' ? a0 : Math.max(a0, a1 - share);
      const hi = end === 'first' ? Math.min(a1, a0 + share) : a1;
      hit = { tension: tension.maxOver(lo, hi), shear: noShear ? 0 : shear.maxOver(lo, hi) };
      kept.set(share, hit);
    }
    return hit;
  };
  return {
    along,
    lengthIn: along[along.length - 1] - along[0],
    spacingIn,
    tension,
    shear,
    station: new LineFunction(along, c.station),
    x: c.x && new LineFunction(along, c.x),
    y: c.y && new LineFunction(along, c.y),
    noShear: noShear !== null,
    window,
    endMax,
  };
}

/**
 * The largest tension and shear over the samples bracketing [along[i] − half, along[i] + half], station by
 * station as they are asked for (`at`) and kept (NaN until then): the schedules of all candidates read
 * about a third of a line's windows, a few pitches about each station's own.
 */
export class LoadWindow {
  readonly tension: number[];
  /** all zeros (one array for every window) when the line has no shear; typed, so every read is a double */
  readonly shear: Float64Array;
  /** stations per half window, on average: where the search for a window's ends starts */
  private readonly reach: number;

  constructor(
    private readonly along: number[],
    private readonly half: number,
    private readonly tensionFn: LineFunction,
    private readonly shearFn: LineFunction | null,
    zeros: Float64Array | null,
  ) {
    const n = along.length;
    this.tension = packed(n, NaN);
    this.shear = zeros ?? new Float64Array(n);
    this.reach = n > 1 ? Math.floor(half / ((along[n - 1] - along[0]) / (n - 1))) : 0;
  }

  /**
   * Works out station i's window: from index lo, the last sample at or before along[i] − half (else 0),
   * to hi, the first at or after along[i] + half (else the last). (It returns nothing: a number returned
   * from a call V8 does not inline is boxed, and this runs some 8,000 times a study.)
   */
  at(i: number): void {
    const along = this.along;
    const n = along.length;
    const a = along[i];
    const from = a - this.half;
    const to = a + this.half;
    // Start where evenly spaced stations would put the ends, then step to them (exact however spaced).
    let lo = Math.max(0, Math.min(n - 1, i - this.reach));
    while (lo > 0 && along[lo] > from) lo--;
    while (lo + 1 < n && along[lo + 1] <= from) lo++;
    let hi = Math.max(0, Math.min(n - 1, i + this.reach));
    while (hi > 0 && along[hi - 1] >= to) hi--;
    while (hi < n - 1 && along[hi] < to) hi++;
    // maxBetween(lo, hi), written out: the level's row read from the sparse tables directly
    const level = 31 - Math.clz32(hi - lo + 1);
    const at = hi - (1 << level) + 1;
    const t = this.tensionFn.levels()[level];
    this.tension[i] = Math.max(t[lo], t[at]);
    if (this.shearFn) {
      const q = this.shearFn.levels()[level];
      this.shear[i] = Math.max(q[lo], q[at]);
    }
  }
}

function validateStations(stations: unknown): StationLoad[] {
  const list = requireArray<StationLoad>(stations, 'stations', 2, 'list of station loads');
  if (list.length > STUDY_BUDGET.stations) {
    throw new EngineeringInputError(
      'stations',
      `at most ${countText(STUDY_BUDGET.stations)} stations on a line (got ${countText(list.length)})`,
    );
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
  if (i > 0 && !(s.alongIn > list[i - 1].alongIn))
    throw new EngineeringInputError(`stations[${i}].alongIn`, 'stations must be in order along the line');
}
