/**
 * Scales, ticks and rib geometry for the study's pictures. Pure numbers in whatever unit the caller
 * chose (the plots convert to the display units first, so ticks land on round millimetres or newtons
 * too); kept free of React so it can be tested on simple shapes.
 */
import type { CpSample, Pt } from './study-result';

export type Box = { minX: number; maxX: number; minY: number; maxY: number };

/** Maps [d0, d1] onto [r0, r1]; a zero-width domain maps to the middle of the range. */
export function linearScale(d0: number, d1: number, r0: number, r1: number): (v: number) => number {
  if (d1 === d0) return () => (r0 + r1) / 2;
  const k = (r1 - r0) / (d1 - d0);
  return (v) => r0 + (v - d0) * k;
}

/** A round step (1, 2 or 5 × 10^k) that cuts `span` into at most `maxTicks` intervals. */
export function niceStep(span: number, maxTicks = 5): number {
  if (!(span > 0) || !Number.isFinite(span)) return 1;
  const raw = span / Math.max(1, maxTicks);
  const mag = 10 ** Math.floor(Math.log10(raw));
  const f = raw / mag;
  const m = f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10;
  return m * mag;
}

/** The domain widened to whole steps, and the ticks on it: [lo, hi] always contains [min, max]. */
export function niceAxis(
  min: number,
  max: number,
  maxTicks = 5,
): { lo: number; hi: number; step: number; ticks: number[] } {
  let a = Math.min(min, max);
  let b = Math.max(min, max);
  if (!Number.isFinite(a) || !Number.isFinite(b)) {
    a = 0;
    b = 1;
  }
  if (a === b) {
    b = a + 1;
  }
  const step = niceStep(b - a, maxTicks);
  const lo = Math.floor(a / step + 1e-9) * step;
  const hi = Math.ceil(b / step - 1e-9) * step;
  const ticks: number[] = [];
  for (let v = lo; v <= hi + step * 1e-6; v += step) ticks.push(Number(v.toPrecision(12)));
  return { lo, hi, step, ticks };
}

/** Digits enough to tell neighbouring ticks apart, no more. */
export function tickLabel(v: number, step: number): string {
  const decimals = Math.max(0, Math.min(4, -Math.floor(Math.log10(step) + 1e-9)));
  return v.toFixed(decimals);
}

export function boundsOf(points: readonly Pt[]): Box {
  let minX = Infinity,
    maxX = -Infinity,
    minY = Infinity,
    maxY = -Infinity;
  for (const [x, y] of points) {
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
  }
  if (!points.length) return { minX: 0, maxX: 1, minY: 0, maxY: 1 };
  return { minX, maxX, minY, maxY };
}

export function growBox(b: Box, by: { left?: number; right?: number; top?: number; bottom?: number }): Box {
  return {
    minX: b.minX - (by.left ?? 0),
    maxX: b.maxX + (by.right ?? 0),
    minY: b.minY - (by.bottom ?? 0),
    maxY: b.maxY + (by.top ?? 0),
  };
}

export type Projection = {
  scale: number;
  width: number;
  height: number;
  x: (v: number) => number;
  y: (v: number) => number;
};

/**
 * True-scale drawing of `box` into `width` px (y up on paper, down on screen), with `pad` px round it.
 * Height follows from the box; `maxHeight` shrinks the scale when a deep picture would not fit.
 */
export function fitProjection(box: Box, width: number, pad: number, maxHeight = Infinity): Projection {
  const spanX = Math.max(1e-9, box.maxX - box.minX);
  const spanY = Math.max(1e-9, box.maxY - box.minY);
  let scale = Math.max(0, (width - 2 * pad) / spanX);
  if (spanY * scale + 2 * pad > maxHeight) scale = Math.max(0, (maxHeight - 2 * pad) / spanY);
  return {
    scale,
    width,
    height: spanY * scale + 2 * pad,
    x: (v) => pad + (v - box.minX) * scale,
    y: (v) => pad + (box.maxY - v) * scale,
  };
}

/**
 * The outline split at its leading edge (its foremost point) into the upper and lower surfaces, each
 * from the leading edge aft. Which half is upper is read from the shape, not from the point order.
 */
export function splitOutline(points: readonly Pt[]): { upper: Pt[]; lower: Pt[] } {
  if (points.length < 3) return { upper: [...points], lower: [...points] };
  let le = 0;
  for (let i = 1; i < points.length; i++) if (points[i][0] < points[le][0]) le = i;
  const first = points.slice(0, le + 1).reverse();
  const second = points.slice(le);
  const meanY = (ps: Pt[]) => ps.reduce((s, p) => s + p[1], 0) / Math.max(1, ps.length);
  return meanY(first) >= meanY(second) ? { upper: first, lower: second } : { upper: second, lower: first };
}

/**
 * The point of a surface (leading edge aft) at chordwise x, with the unit normal pointing out of the
 * section (up on the upper surface, down on the lower, forward at the nose).
 */
export function surfaceAt(
  surface: readonly Pt[],
  x: number,
  side: 'upper' | 'lower',
): { x: number; y: number; nx: number; ny: number } {
  const n = surface.length;
  if (n < 2) return { x, y: surface[0]?.[1] ?? 0, nx: 0, ny: side === 'upper' ? 1 : -1 };
  let i = 1;
  while (i < n - 1 && surface[i][0] < x) i++;
  const [x0, y0] = surface[i - 1];
  const [x1, y1] = surface[i];
  const t = x1 === x0 ? 0 : Math.min(1, Math.max(0, (x - x0) / (x1 - x0)));
  const dx = x1 - x0;
  const dy = y1 - y0;
  const len = Math.hypot(dx, dy) || 1;
  // Walking aft, the outside is to the left on the upper surface and to the right on the lower.
  const [nx, ny] = side === 'upper' ? [-dy / len, dx / len] : [dy / len, -dx / len];
  return { x: x0 + t * dx, y: y0 + t * dy, nx, ny };
}

export type PressureArrow = {
  /** on the surface */
  x0: number;
  y0: number;
  /** outside the surface, |Cp| × lengthPerCp away along the outward normal */
  x1: number;
  y1: number;
  cp: number;
  /** suction (Cp below the inside pressure) pulls the skin outward: the arrow points away */
  suction: boolean;
  xc: number;
};

/**
 * Cp drawn normal to the surface, outside it: the length is |Cp − Cp,int|, suction pointing away from
 * the surface, pressure pointing at it. In the outline's units (inches).
 */
export function pressureArrows(
  surface: readonly Pt[],
  samples: readonly CpSample[],
  side: 'upper' | 'lower',
  chordIn: number,
  lengthPerCp: number,
  internalCp = 0,
): PressureArrow[] {
  return samples.map((s) => {
    const p = surfaceAt(surface, s.xc * chordIn, side);
    const d = s.cp - internalCp;
    const len = Math.abs(d) * lengthPerCp;
    return { x0: p.x, y0: p.y, x1: p.x + p.nx * len, y1: p.y + p.ny * len, cp: s.cp, suction: d < 0, xc: s.xc };
  });
}

/** The largest |Cp − Cp,int| over every condition and both surfaces: one length scale for them all. */
export function largestCp(
  conditions: readonly { cp: { upper: readonly CpSample[]; lower: readonly CpSample[] } }[],
  internalCp = 0,
): number {
  let m = 0;
  for (const c of conditions)
    for (const s of [...c.cp.upper, ...c.cp.lower]) m = Math.max(m, Math.abs(s.cp - internalCp));
  return m;
}

/** The part of a surface between two chordwise stations, as a polyline (ends interpolated). */
export function surfaceBetween(surface: readonly Pt[], fromX: number, toX: number, side: 'upper' | 'lower'): Pt[] {
  const a = Math.min(fromX, toX);
  const b = Math.max(fromX, toX);
  const start = surfaceAt(surface, a, side);
  const end = surfaceAt(surface, b, side);
  return [[start.x, start.y], ...surface.filter(([x]) => x > a && x < b).map((p): Pt => [p[0], p[1]]), [end.x, end.y]];
}

/**
 * Rows for labels along one axis so none overlaps: each item is its extent [x0, x1] in px; it goes into
 * the first row whose last label ends at least `gap` before it starts. Returns the row of each item.
 */
export function stackLabels(items: readonly { x0: number; x1: number }[], gap = 6): number[] {
  const rowEnds: number[] = [];
  const order = items.map((it, i) => ({ ...it, i })).sort((p, q) => p.x0 - q.x0);
  const rows = new Array<number>(items.length).fill(0);
  for (const it of order) {
    let r = rowEnds.findIndex((end) => end + gap <= it.x0);
    if (r < 0) {
      r = rowEnds.length;
      rowEnds.push(it.x1);
    } else rowEnds[r] = it.x1;
    rows[it.i] = r;
  }
  return rows;
}

/** Approximate width of a label in px: the monospaced face is about 0.6 em a character. */
export const monoWidth = (text: string, fontSize: number): number => text.length * fontSize * 0.6;
