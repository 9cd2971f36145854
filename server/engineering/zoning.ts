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
 * Contiguous grouping of runs of equal pitch into at most maxZones zones, minimising the estimated rivet
 * count Σ length / pitch (dynamic programming). A zone is only added if it saves at least one rivet.
 */
export function groupIntoZones(runs: Zone[], maxZones: number): Zone[] {
  const r = runs.length;
  const kMax = Math.min(maxZones, r);
  const cost = (a: number, b: number) => {
    let p = Infinity;
    for (let i = a; i <= b; i++) p = Math.min(p, runs[i].pitch);
    return (runs[b].to - runs[a].from) / p;
  };
  const best: number[][] = [runs.map((_, b) => cost(0, b))];
  const from: number[][] = [runs.map(() => 0)];
  for (let k = 1; k < kMax; k++) {
    best.push(runs.map(() => Infinity));
    from.push(runs.map(() => 0));
    for (let b = k; b < r; b++) {
      for (let a = k; a <= b; a++) {
        const c = best[k - 1][a - 1] + cost(a, b);
        if (c < best[k][b]) {
          best[k][b] = c;
          from[k][b] = a;
        }
      }
    }
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
 * Hole positions from the first hole at the start edge distance to the last at the end edge distance,
 * stepping by the tightest zone pitch the step touches. A last gap shorter than the minimum pitch is
 * evened out with the one before it, or else left as a longer end distance.
 */
export function placeHoles(zones: Zone[], start: number, end: number, minPitch: number): { positions: number[]; note: string | null } {
  if (end < start - EPS) return { positions: [], note: null };
  if (end - start < minPitch - EPS) return { positions: [(start + end) / 2], note: null };
  const tightest = (a: number, b: number) => Math.min(...zones.filter((z) => z.from <= b + EPS && z.to >= a - EPS).map((z) => z.pitch));
  const positions = [start];
  let note: string | null = null;
  for (;;) {
    const h = positions[positions.length - 1];
    let p = tightest(h, h);
    for (let q = tightest(h, h + p); q < p - EPS; q = tightest(h, h + p)) p = q;
    if (h + p < end - EPS) {
      positions.push(h + p);
      continue;
    }
    const rest = end - h;
    const prev = positions.length > 1 ? positions[positions.length - 2] : null;
    const even = prev === null ? 0 : (end - prev) / 2;
    if (rest <= EPS) return { positions, note };
    if (rest >= minPitch - EPS) positions.push(end);
    else if (prev !== null && even >= minPitch - EPS && even <= tightest(prev, end) + EPS) {
      positions[positions.length - 1] = prev + even;
      positions.push(end);
    } else {
      note = `the last hole sits ${rest.toFixed(3)} in further from the line end than the edge distance, to keep the ${minPitch.toFixed(3)} in minimum pitch`;
    }
    return { positions, note };
  }
}
