import { packed, room } from './arrays';
import { MAX_LINE_HOLES, MAX_ZONING_RUNS } from './bounds';
import { EngineeringInputError } from './errors';
import { countText } from '../../lib/number-text';

/**
 * Grouping a line's stations into zones of one pitch, and placing the holes along the zones.
 */

const EPS = 1e-9;

/** A stretch of the line, in inches along it, and the one pitch it is riveted at. */
export interface Zone {
  from: number;
  to: number;
  pitch: number;
}

/**
 * At most `max` runs: neighbours are merged pairwise, each pair keeping the tighter pitch (never less
 * safe, only a few more rivets), until few enough remain. A line whose needed pitch changes hundreds of
 * times (a saw-tooth Cp table, a very fine increment) would otherwise make the grouping below cost
 * maxZones × runs² for every candidate.
 */
export function coarsenRuns(runs: Zone[], max = MAX_ZONING_RUNS): { runs: Zone[]; merged: boolean } {
  let out = runs;
  let merged = false;
  while (out.length > max) {
    merged = true;
    const next: Zone[] = [];
    for (let i = 0; i < out.length; i += 2) {
      const a = out[i];
      const b = out[i + 1];
      const z = b ? { from: a.from, to: b.to, pitch: Math.min(a.pitch, b.pitch) } : { ...a };
      const last = next[next.length - 1];
      if (last && Math.abs(last.pitch - z.pitch) < EPS) last.to = z.to;
      else next.push(z);
    }
    out = next;
  }
  return { runs: out, merged };
}

/**
 * Contiguous grouping of runs of equal pitch into at most maxZones zones, minimising the estimated rivet
 * count Σ length / pitch (dynamic programming, maxZones × runs²). A zone is only added if it saves at
 * least one rivet.
 */
export function groupIntoZones(runs: Zone[], maxZones: number): Zone[] {
  const r = runs.length;
  const kMax = Math.min(maxZones, r);
  // Loops rather than runs.map(() => …): a schedule groups its runs for every candidate (arrays.ts).
  const first = room(r);
  let p0 = Infinity;
  for (let b = 0; b < r; b++) {
    p0 = Math.min(p0, runs[b].pitch);
    first[b] = (runs[b].to - runs[0].from) / p0;
  }
  const best: number[][] = [first];
  const from: number[][] = [packed(r, 0)];
  for (let k = 1; k < kMax; k++) {
    const prev = best[k - 1];
    const row = packed(r, Infinity);
    const rowFrom = packed(r, 0);
    for (let b = k; b < r; b++) {
      const to = runs[b].to;
      // The zone a..b takes the tightest pitch in it: kept as a running minimum while a moves back.
      let p = Infinity;
      for (let a = b; a >= k; a--) {
        p = Math.min(p, runs[a].pitch);
        const c = prev[a - 1] + (to - runs[a].from) / p;
        // "≤" walking backwards keeps the earliest start among equal costs.
        if (c <= row[b]) {
          row[b] = c;
          rowFrom[b] = a;
        }
      }
    }
    best.push(row);
    from.push(rowFrom);
  }
  const totals = best.map((row) => row[r - 1]);
  const least = Math.min(...totals);
  const k = totals.findIndex((t) => t < least + 1);
  const zones: Zone[] = [];
  let b = r - 1;
  for (let kk = k; kk >= 0; kk--) {
    const a = from[kk][b];
    let p = Infinity;
    for (let i = a; i <= b; i++) p = Math.min(p, runs[i].pitch);
    zones.unshift({ from: runs[a].from, to: runs[b].to, pitch: p });
    b = a - 1;
  }
  return zones;
}

/**
 * How many holes `placeHoles` can put between start and end at most: each zone's overlap over its
 * pitch, plus one where each zone begins and one at the end. Cheap, and never an underestimate, so a
 * caller can refuse a schedule before placing a single hole.
 */
export function estimateHoles(zones: Zone[], start: number, end: number, minPitch: number): number {
  if (end < start - EPS) return 0;
  let n = 1;
  for (const z of zones) {
    const overlap = Math.min(z.to, end) - Math.max(z.from, start);
    if (overlap > 0) n += Math.ceil(overlap / Math.max(z.pitch, minPitch, EPS)) + 1;
  }
  return n;
}

/**
 * The tightest pitch of the zones that [a, b] touches, never below `floor`. A loop, not filter/map/spread:
 * it runs a few times for every hole.
 */
function tightestPitch(zones: Zone[], a: number, b: number, floor: number): number {
  let p = Infinity;
  for (const z of zones) if (z.from <= b + EPS && z.to >= a - EPS) p = Math.min(p, z.pitch);
  return Math.max(floor, p);
}

/**
 * Hole positions from the first hole at the start edge distance to the last at the end edge distance,
 * stepping by the tightest zone pitch the step touches, never closer than the minimum pitch. A last gap
 * shorter than the minimum pitch is evened out with as few of the gaps before it as will do, or else left
 * as a longer end distance. Refuses (field "zones") a line that would take more than `maxHoles` holes.
 */
export function placeHoles(
  zones: Zone[],
  start: number,
  end: number,
  minPitch: number,
  maxHoles = MAX_LINE_HOLES,
): { positions: number[]; note: string | null } {
  if (end < start - EPS) return { positions: [], note: null };
  if (end - start < minPitch - EPS) return { positions: [(start + end) / 2], note: null };
  // A zero or negative minimum would let a step stand still: the loop below must always advance.
  const floor = Math.max(minPitch, EPS);
  const estimate = estimateHoles(zones, start, end, floor);
  if (estimate > maxHoles) {
    throw new EngineeringInputError(
      'zones',
      `these zones would place about ${countText(estimate)} holes on one line; at most ${countText(maxHoles)}`,
    );
  }
  const positions = [start];
  let note: string | null = null;
  // Bounded by the estimate: every step advances by at least the minimum pitch.
  while (positions.length <= maxHoles) {
    const h = positions[positions.length - 1];
    let p = tightestPitch(zones, h, h, floor);
    for (let q = tightestPitch(zones, h, h + p, floor); q < p - EPS; q = tightestPitch(zones, h, h + p, floor)) p = q;
    if (h + p < end - EPS) {
      positions.push(h + p);
      continue;
    }
    const rest = end - h;
    if (rest <= EPS) return { positions, note };
    if (rest >= minPitch - EPS) {
      positions.push(end);
      return { positions, note };
    }
    // A last gap shorter than the minimum pitch: the last m gaps and it are evened out over m + 1 gaps
    // ending at `end`, with the fewest m that keeps them at the minimum pitch or more, and never more than
    // any zone they touch allows. The last hole then sits at the edge distance, and the last rivet's
    // share (the edge distance and half a gap) stays what the schedule allowed for. It adds a hole, and
    // is done only while the holes stay within the estimate (which callers and contracts rely on).
    for (let m = 1; m < positions.length && positions.length < estimate; m++) {
      const from = positions[positions.length - 1 - m];
      const gap = (end - from) / (m + 1);
      if (gap < minPitch - EPS) continue;
      if (gap > tightestPitch(zones, from, end, floor) + EPS) break;
      positions.length -= m;
      for (let i = 0; i < m; i++) positions.push(from + gap * (i + 1));
      positions.push(end);
      return { positions, note };
    }
    note = `the last hole sits ${rest.toFixed(3)} in further from the line end than the edge distance, to keep the ${minPitch.toFixed(3)} in minimum pitch`;
    return { positions, note };
  }
  throw new EngineeringInputError('zones', `these zones place more than ${countText(maxHoles)} holes on one line`);
}
