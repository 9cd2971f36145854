import type { FastenerLine, Hole, HoleStatus } from '@/db/contracts';

/**
 * Where things sit on the drawing, in the part's own inches (x aft from the leading edge, y up).
 * Kept free of React so it can be tested against simple shapes.
 */
export type Point = [number, number];
export type Side = 'upper' | 'lower';

export type Bounds = { minX: number; maxX: number; minY: number; maxY: number };

export function outlineBounds(outline: readonly Point[]): Bounds {
  if (!outline.length) return { minX: 0, maxX: 1, minY: 0, maxY: 1 };
  let minX = Infinity,
    maxX = -Infinity,
    minY = Infinity,
    maxY = -Infinity;
  for (const [x, y] of outline) {
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
  }
  return { minX, maxX, minY, maxY };
}

/** Every y where the vertical line at x crosses the closed polygon's edges. */
export function crossings(outline: readonly Point[], x: number): number[] {
  const ys: number[] = [];
  const n = outline.length;
  for (let i = 0; i < n; i++) {
    const [x1, y1] = outline[i];
    const [x2, y2] = outline[(i + 1) % n];
    if (x1 === x2) {
      if (Math.abs(x - x1) < 1e-9) ys.push(y1, y2);
      continue;
    }
    const lo = Math.min(x1, x2);
    const hi = Math.max(x1, x2);
    if (x < lo - 1e-9 || x > hi + 1e-9) continue;
    ys.push(y1 + ((x - x1) * (y2 - y1)) / (x2 - x1));
  }
  return ys;
}

/**
 * The y of the outline's upper (highest) or lower (lowest) side at x, interpolated along the
 * polygon's edges. Outside the outline's span x is clamped to its nearest end.
 */
export function surfaceY(outline: readonly Point[], x: number, side: Side): number {
  if (!outline.length) return 0;
  return surfaceYWithin(outline, outlineBounds(outline), x, side);
}

/** surfaceY with the outline's bounds worked out once by the caller (a walker samples a side 1000 times). */
function surfaceYWithin(outline: readonly Point[], b: Bounds, x: number, side: Side): number {
  if (!outline.length) return 0;
  const cx = Math.min(b.maxX, Math.max(b.minX, x));
  const ys = crossings(outline, cx);
  if (!ys.length) return side === 'upper' ? b.maxY : b.minY;
  return side === 'upper' ? Math.max(...ys) : Math.min(...ys);
}

/** Flat lines (panels) have no surface to follow: spread them evenly across the part's height. */
export function flatLineY(
  outline: readonly Point[],
  lines: readonly Pick<FastenerLine, 'code' | 'surface'>[],
  code: string,
): number {
  const b = outlineBounds(outline);
  const flats = lines.filter((l) => l.surface === 'flat');
  const i = Math.max(
    0,
    flats.findIndex((l) => l.code === code),
  );
  return b.minY + ((i + 1) / (flats.length + 1)) * (b.maxY - b.minY);
}

export type PlacedHole = {
  holeId: string;
  line: string;
  seq: number;
  stationIn: number;
  status: HoleStatus;
  x: number;
  y: number;
};

/**
 * Distance along the outline's upper or lower side from x0 → the x reached: a hole's station is
 * measured along the flange, which is longer than its chordwise run where the side curves. The side
 * is sampled once (1000 steps over the chord), so placing every hole of a line stays cheap.
 */
export function surfaceWalker(outline: readonly Point[], side: Side, x0: number): (distance: number) => number {
  // Kept per outline: the drawing asks again for the same line's walker on every render (its path,
  // its holes), and sampling a side costs 1000 crossings of the outline. Outlines come from query data,
  // which is replaced, never changed in place.
  let walkers = walkerCache.get(outline);
  if (!walkers) {
    walkers = new Map();
    walkerCache.set(outline, walkers);
  }
  const key = `${side} ${x0}`;
  let walk = walkers.get(key);
  if (!walk) {
    walk = makeWalker(outline, side, x0);
    walkers.set(key, walk);
  }
  return walk;
}

const walkerCache = new WeakMap<readonly Point[], Map<string, (distance: number) => number>>();

function makeWalker(outline: readonly Point[], side: Side, x0: number): (distance: number) => number {
  const b = outlineBounds(outline);
  return walkerOver(sideSweep(outline, b, side), x0, b.maxX);
}

/**
 * The walk itself over a side given as x → y (`sideAt`, read at rising x): sampled in 1000 steps from x0
 * to maxX, then distance → x by halving the sampled lengths. Exported so a test can walk the same way
 * over the side read edge by edge.
 */
export function walkerOver(sideAt: (x: number) => number, x0: number, maxX: number): (distance: number) => number {
  const n = 1000;
  const xs: number[] = [x0];
  const along: number[] = [0];
  let y = sideAt(x0);
  for (let i = 1; i <= n && xs[xs.length - 1] < maxX; i++) {
    const x = Math.min(maxX, x0 + ((maxX - x0) * i) / n);
    const ny = sideAt(x);
    along.push(along[along.length - 1] + Math.hypot(x - xs[xs.length - 1], ny - y));
    xs.push(x);
    y = ny;
  }
  return (distance) => {
    if (distance <= 0) return x0;
    let lo = 0;
    let hi = along.length - 1;
    if (distance >= along[hi]) return xs[hi];
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (along[mid] < distance) lo = mid;
      else hi = mid;
    }
    return xs[lo] + ((xs[hi] - xs[lo]) * (distance - along[lo])) / (along[hi] - along[lo]);
  };
}

/**
 * surfaceYWithin for x that never decreases from one call to the next, as a walker samples a side: the
 * same crossings, worked out the same way, but only of the edges whose span can still hold x (kept in
 * order of where they start, and let go once x has passed their end), not of every edge for every x.
 * A part's first drawing sampled its sides edge by edge, 1000 times over.
 */
function sideSweep(outline: readonly Point[], b: Bounds, side: Side): (x: number) => number {
  const n = outline.length;
  const edges: { x1: number; y1: number; x2: number; y2: number; lo: number; hi: number }[] = [];
  for (let i = 0; i < n; i++) {
    const [x1, y1] = outline[i];
    const [x2, y2] = outline[(i + 1) % n];
    edges.push({ x1, y1, x2, y2, lo: Math.min(x1, x2), hi: Math.max(x1, x2) });
  }
  edges.sort((p, q) => p.lo - q.lo);
  let next = 0;
  let open: typeof edges = [];
  return (x) => {
    if (!n) return 0;
    const cx = Math.min(b.maxX, Math.max(b.minX, x));
    while (next < edges.length && edges[next].lo - 1e-9 <= cx) open.push(edges[next++]);
    open = open.filter((e) => e.hi + 1e-9 >= cx);
    // As crossings() does, edge by edge.
    let found = false;
    let best = 0;
    const take = (y: number) => {
      best = !found ? y : side === 'upper' ? Math.max(best, y) : Math.min(best, y);
      found = true;
    };
    for (const { x1, y1, x2, y2, lo, hi } of open) {
      if (x1 === x2) {
        if (Math.abs(cx - x1) < 1e-9) {
          take(y1);
          take(y2);
        }
        continue;
      }
      if (cx < lo - 1e-9 || cx > hi + 1e-9) continue;
      take(y1 + ((cx - x1) * (y2 - y1)) / (x2 - x1));
    }
    if (!found) return side === 'upper' ? b.maxY : b.minY;
    return best;
  };
}

export const xAlongSurface = (outline: readonly Point[], side: Side, x0: number, distance: number): number =>
  surfaceWalker(outline, side, x0)(distance);

/** Holes' places: each station walked along its line's side from the line's start (straight for a flat line). */
export function placeHoles(
  outline: readonly Point[],
  lines: readonly FastenerLine[],
  holes: readonly Hole[],
): PlacedHole[] {
  const walkers = new Map<string, (d: number) => number>();
  return holes.map((h) => {
    const line = lines.find((l) => l.code === h.line);
    if (!line || line.surface === 'flat') {
      const x = (line?.startIn ?? 0) + h.stationIn;
      return { ...h, x, y: line ? flatLineY(outline, lines, line.code) : surfaceY(outline, x, 'upper') };
    }
    let walk = walkers.get(line.code);
    if (!walk) {
      walk = surfaceWalker(outline, line.surface, line.startIn);
      walkers.set(line.code, walk);
    }
    const x = walk(h.stationIn);
    return { ...h, x, y: surfaceY(outline, x, line.surface) };
  });
}

export const placeHole = (outline: readonly Point[], lines: readonly FastenerLine[], hole: Hole): PlacedHole =>
  placeHoles(outline, lines, [hole])[0];

/** Points that trace a fastener line along its surface, for drawing it as a polyline. */
export function linePath(
  outline: readonly Point[],
  lines: readonly FastenerLine[],
  line: FastenerLine,
  samples = 48,
): Point[] {
  const x0 = line.startIn;
  if (line.surface === 'flat') {
    const y = flatLineY(outline, lines, line.code);
    return [
      [x0, y],
      [x0 + line.lengthIn, y],
    ];
  }
  const x1 = xAlongSurface(outline, line.surface, x0, line.lengthIn);
  const pts: Point[] = [];
  for (let i = 0; i <= samples; i++) {
    const x = x0 + ((x1 - x0) * i) / samples;
    pts.push([x, surfaceY(outline, x, line.surface)]);
  }
  return pts;
}

/** The smallest pitch on any line, to size hole marks so neighbours do not overlap. */
export function smallestPitch(lines: readonly FastenerLine[]): number {
  let p = Infinity;
  for (const l of lines) for (const z of l.zones) p = Math.min(p, z.pitchIn);
  return Number.isFinite(p) ? p : 1;
}

/** Maps part inches to drawing pixels (y flipped so up is up). */
export function makeProjection(b: Bounds, scale: number, pad: number) {
  return {
    x: (x: number) => pad + (x - b.minX) * scale,
    y: (y: number) => pad + (b.maxY - y) * scale,
    width: (b.maxX - b.minX) * scale + 2 * pad,
    height: (b.maxY - b.minY) * scale + 2 * pad,
  };
}
