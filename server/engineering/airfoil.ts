import { EngineeringInputError } from './errors';
import { ENGINEERING_CAUTION, envelope } from './result';
import { evaluateSpline, naturalSpline } from './spline';
import { requireCount, requireStudyBound, STUDY_BOUNDS } from './bounds';
import { requireArray } from './validate';
import type { AirfoilInput, EngineeringResult, Point, Surface } from '../../lib/engineering-results';

/**
 * Airfoil geometry at unit chord, as one contour in the usual file order: trailing edge, over the upper
 * surface to the leading edge, back along the lower surface to the trailing edge (counter-clockwise).
 * NACA sections follow NACA Report 824; uploaded coordinates are validated, normalised and re-panelled.
 */

export interface AirfoilGeometry {
  name: string;
  /** Contour at unit chord, leading edge at (0, 0), trailing edge at x = 1. */
  points: Point[];
  leadingEdgeIndex: number;
  /** Distance between the two trailing-edge points of the section as defined or uploaded, fraction of chord. */
  trailingEdgeGap: number;
}

export interface AirfoilResult extends EngineeringResult<AirfoilInput>, AirfoilGeometry {}

/** Trailing-edge gaps up to this fraction of chord count as "nearly closed". */
export const MAX_TRAILING_EDGE_GAP = 0.02;
export const MIN_AIRFOIL_POINTS = 10;

/** n+1 stations from 0 to 1 bunched at both ends, where the surface curvature and the loads change fastest. */
export function cosineSpacing(n: number): number[] {
  return Array.from({ length: n + 1 }, (_, i) => 0.5 * (1 - Math.cos((Math.PI * i) / n)));
}

/** NACA 4-digit thickness distribution (Report 824); the closed variant ends at zero thickness. */
export function nacaThickness(x: number, thickness: number, closedTrailingEdge = false): number {
  const a4 = closedTrailingEdge ? -0.1036 : -0.1015;
  return 5 * thickness * (0.2969 * Math.sqrt(x) - 0.126 * x - 0.3516 * x * x + 0.2843 * x ** 3 + a4 * x ** 4);
}

export interface MeanLine {
  camber(x: number): { yc: number; slope: number };
}

/** NACA 4-digit mean line: two parabolas meeting at the point of maximum camber. */
export function nacaFourDigitMeanLine(maxCamber: number, position: number): MeanLine {
  return {
    camber(x) {
      if (maxCamber === 0 || position === 0) return { yc: 0, slope: 0 };
      if (x < position) {
        const k = maxCamber / (position * position);
        return { yc: k * (2 * position * x - x * x), slope: 2 * k * (position - x) };
      }
      const k = maxCamber / ((1 - position) * (1 - position));
      return { yc: k * (1 - 2 * position + 2 * position * x - x * x), slope: 2 * k * (position - x) };
    },
  };
}

// Report 824's standard (non-reflexed) 5-digit mean lines for a design CL of 0.3: position → (r, k1).
const FIVE_DIGIT_MEAN_LINES: Record<number, { r: number; k1: number }> = {
  1: { r: 0.058, k1: 361.4 },
  2: { r: 0.126, k1: 51.64 },
  3: { r: 0.2025, k1: 15.957 },
  4: { r: 0.29, k1: 6.643 },
  5: { r: 0.391, k1: 3.23 },
};

/** NACA 5-digit mean line LPQ: design CL = 0.15·L (k1 scales with it), max camber at 0.05·P. */
export function nacaFiveDigitMeanLine(designCl: number, positionDigit: number): MeanLine {
  const entry = FIVE_DIGIT_MEAN_LINES[positionDigit];
  const k1 = (entry.k1 * designCl) / 0.3;
  const r = entry.r;
  return {
    camber(x) {
      if (x < r) {
        return {
          yc: (k1 / 6) * (x ** 3 - 3 * r * x * x + r * r * (3 - r) * x),
          slope: (k1 / 6) * (3 * x * x - 6 * r * x + r * r * (3 - r)),
        };
      }
      return { yc: ((k1 * r ** 3) / 6) * (1 - x), slope: (-k1 * r ** 3) / 6 };
    },
  };
}

export interface NacaSection {
  name: string;
  thickness: number;
  meanLine: MeanLine;
}

export function parseNacaDesignation(designation: string): NacaSection {
  const field = 'airfoil.designation';
  const digits = String(designation ?? '')
    .toUpperCase()
    .replace(/^NACA/, '')
    .replace(/[\s-]/g, '');
  if (/^\d{4}$/.test(digits)) {
    const m = Number(digits[0]) / 100;
    const p = Number(digits[1]) / 10;
    const t = Number(digits.slice(2)) / 100;
    if (t <= 0) throw new EngineeringInputError(field, `NACA ${digits} has no thickness`);
    if (m > 0 && p === 0)
      throw new EngineeringInputError(field, `NACA ${digits} has camber but no position of maximum camber`);
    return { name: `NACA ${digits}`, thickness: t, meanLine: nacaFourDigitMeanLine(m, p) };
  }
  if (/^\d{5}$/.test(digits)) {
    const l = Number(digits[0]);
    const p = Number(digits[1]);
    const q = Number(digits[2]);
    const t = Number(digits.slice(3)) / 100;
    if (q !== 0)
      throw new EngineeringInputError(
        field,
        `NACA ${digits} has a reflexed mean line, which is not supported: upload its coordinates instead`,
      );
    if (!FIVE_DIGIT_MEAN_LINES[p])
      throw new EngineeringInputError(field, `NACA ${digits}: the second digit must be 1 to 5`);
    if (t <= 0) throw new EngineeringInputError(field, `NACA ${digits} has no thickness`);
    return { name: `NACA ${digits}`, thickness: t, meanLine: nacaFiveDigitMeanLine(0.15 * l, p) };
  }
  throw new EngineeringInputError(field, `"${designation}" is not a NACA 4- or 5-digit designation`);
}

function requirePanels(panels: number): number {
  requireStudyBound(panels, 'panels');
  if (panels % 2 !== 0)
    throw new EngineeringInputError('panels', 'the number of panels must be even (half on each surface)');
  return panels;
}

/** NACA section with `panels` panels, half per surface, cosine-spaced; thickness laid normal to the mean line. */
export function nacaGeometry(designation: string, panels: number, closedTrailingEdge = false): AirfoilGeometry {
  requirePanels(panels);
  const section = parseNacaDesignation(designation);
  const xs = cosineSpacing(panels / 2);
  const surfacePoint = (x: number, sign: 1 | -1): Point => {
    const { yc, slope } = section.meanLine.camber(x);
    const yt = nacaThickness(x, section.thickness, closedTrailingEdge);
    const th = Math.atan(slope);
    return [x - sign * yt * Math.sin(th), yc + sign * yt * Math.cos(th)];
  };
  const upper = xs.map((x) => surfacePoint(x, 1)).reverse();
  const lower = xs.slice(1).map((x) => surfacePoint(x, -1));
  const points = [...upper, ...lower];
  const first = points[0];
  const last = points[points.length - 1];
  return {
    name: section.name,
    points,
    leadingEdgeIndex: panels / 2,
    trailingEdgeGap: Math.hypot(first[0] - last[0], first[1] - last[1]),
  };
}

function cross(o: Point, a: Point, b: Point): number {
  return (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
}

/** True when two segments cross at a point inside both (touching ends of neighbours does not count). */
function segmentsCross(a: Point, b: Point, c: Point, d: Point): boolean {
  const d1 = cross(a, b, c);
  const d2 = cross(a, b, d);
  const d3 = cross(c, d, a);
  const d4 = cross(c, d, b);
  return d1 * d2 < 0 && d3 * d4 < 0;
}

/** Index pairs of crossing segments of the closed polygon (closing segment included), first one found. */
export function findSelfCrossing(points: Point[]): [number, number] | null {
  const n = points.length;
  for (let i = 0; i < n; i++) {
    const a = points[i];
    const b = points[(i + 1) % n];
    for (let j = i + 2; j < n; j++) {
      if (i === 0 && j === n - 1) continue; // neighbours through the closing segment
      if (segmentsCross(a, b, points[j], points[(j + 1) % n])) return [i, j];
    }
  }
  return null;
}

function signedArea(points: Point[]): number {
  let a = 0;
  for (let i = 0; i < points.length; i++) {
    const p = points[i];
    const q = points[(i + 1) % points.length];
    a += p[0] * q[1] - q[0] * p[1];
  }
  return a / 2;
}

/**
 * Puts an uploaded contour into file order TE → upper → LE → lower → TE. Two layouts are accepted, in
 * either direction and with the nose at either end of the x axis:
 * - one continuous loop starting at the trailing edge, its last point back at (or repeating) the first;
 *   a closed loop starting anywhere else (at the nose) is turned to start at the point farthest from
 *   where it starts;
 * - the two surfaces each listed from the leading edge to the trailing edge, one after the other.
 */
function toContour(raw: Point[]): Point[] {
  const xs = raw.map((p) => p[0]);
  const ys = raw.map((p) => p[1]);
  const xmin = Math.min(...xs);
  const xspan = Math.max(...xs) - xmin;
  const size = Math.max(xspan, Math.max(...ys) - Math.min(...ys));
  const dist = (a: Point, b: Point) => Math.hypot(a[0] - b[0], a[1] - b[1]);
  const first = raw[0];
  // The last point that is not the first again: a closing repeat says nothing about the shape.
  let lastIndex = raw.length - 1;
  while (lastIndex > 0 && dist(raw[lastIndex], first) <= 1e-9 * size) lastIndex--;
  const last = raw[lastIndex];
  const closedEnds = lastIndex < raw.length - 1 || dist(first, last) <= 0.1 * size;
  // Starting well aft of the smallest x: a loop from the trailing edge, the usual file.
  const startsAft = first[0] - xmin > 0.25 * xspan;
  if (!closedEnds) {
    // Two surfaces: somewhere the list jumps from one surface's trailing edge back to the nose.
    const split = raw.findIndex((p, i) => i > 0 && dist(p, raw[i - 1]) > 0.5 * size);
    if (split > 0) {
      const upper = raw.slice(0, split).reverse();
      const lower = raw.slice(split);
      const sameNose = dist(upper[upper.length - 1], lower[0]) < 1e-9 * size;
      return [...upper, ...(sameNose ? lower.slice(1) : lower)];
    }
    if (startsAft) return raw; // an open loop: refused below with the size of its gap
    throw new EngineeringInputError(
      'airfoil.points',
      'the points neither go round from the trailing edge and back, nor list two surfaces one after the other from the nose: list them in one of those orders',
    );
  }
  if (startsAft || lastIndex < 2) return raw;
  // A closed loop starting at the small-x end: a file drawn nose to the right starting at its trailing
  // edge, or a loop starting at its nose. At a trailing edge the surfaces meet at a sharp angle (a
  // blunt base at about a right angle); at a rounded nose neighbouring panels run on almost straight.
  const a: Point = [raw[1][0] - first[0], raw[1][1] - first[1]];
  const b: Point = [last[0] - first[0], last[1] - first[1]];
  const cosAngle = (a[0] * b[0] + a[1] * b[1]) / (Math.hypot(...a) * Math.hypot(...b));
  if (cosAngle > Math.cos((120 * Math.PI) / 180)) return raw;
  // From the nose: start instead at the point farthest from it, the trailing edge.
  const loop = raw.slice(0, lastIndex + 1);
  let k = 0;
  loop.forEach((p, i) => {
    if (dist(p, first) > dist(loop[k], first)) k = i;
  });
  return [...loop.slice(k), ...loop.slice(0, k)];
}

function dropRepeats(points: Point[], tolerance: number): Point[] {
  const out: Point[] = [];
  for (const p of points) {
    const q = out[out.length - 1];
    if (!q || Math.hypot(p[0] - q[0], p[1] - q[1]) > tolerance) out.push(p);
  }
  return out;
}

/**
 * The trailing edge of a closed polygon listed from it: either a single vertex (a sharp edge) or the
 * short base between the first and the last point (a blunt, "open" edge). The closing segment, last
 * point → first, decides: running along the chord it is the last panel of a surface that ends in a
 * sharp edge at whichever of its ends lies further aft, which is then put at both ends of the list;
 * running across the chord it is the base of a blunt edge, and the list is left as it is.
 */
function closeContour(contour: Point[]): Point[] {
  const first = contour[0];
  const last = contour[contour.length - 1];
  // The nose is the point farthest from the trailing-edge end of the list; the chord runs from it.
  let nose = first;
  let far = -1;
  for (const p of contour) {
    const d = Math.hypot(p[0] - first[0], p[1] - first[1]);
    if (d > far) {
      far = d;
      nose = p;
    }
  }
  if (!(far > 0)) return contour;
  const ux = (first[0] - nose[0]) / far;
  const uy = (first[1] - nose[1]) / far;
  const dx = first[0] - last[0];
  const dy = first[1] - last[1];
  const along = Math.abs(dx * ux + dy * uy);
  const across = Math.abs(dx * uy - dy * ux);
  if (along <= across) return contour;
  const aft = (p: Point) => (p[0] - nose[0]) * ux + (p[1] - nose[1]) * uy;
  return aft(first) >= aft(last) ? [...contour, first] : [last, ...contour];
}

/** Below this mean camber (fraction of chord, negative) a section is reported as possibly upside down. */
export const UPSIDE_DOWN_CAMBER = 0.002;

/**
 * Mean camber of a unit-chord contour (TE → upper → LE → lower → TE): ∫ ½(y_upper + y_lower) dx over
 * the chord, from the two surfaces' trapezoid integrals, both taken with x increasing. Positive for a
 * section that lifts at zero angle of attack (NACA 2412: 0.0133).
 */
function meanCamberArea(unit: Point[]): number {
  const le = unit.reduce((best, p, i) => (p[0] < unit[best][0] ? i : best), 0);
  const integral = (pts: Point[]) => {
    let a = 0;
    for (let i = 1; i < pts.length; i++) a += ((pts[i][0] - pts[i - 1][0]) * (pts[i][1] + pts[i - 1][1])) / 2;
    return a;
  };
  const upper = unit.slice(0, le + 1).reverse();
  const lower = unit.slice(le);
  return (integral(upper) + integral(lower)) / 2;
}

export interface CoordinateCheck {
  contour: Point[];
  trailingEdgeGap: number;
  warnings: string[];
}

/** Validates and normalises uploaded coordinates to unit chord; throws EngineeringInputError for nonsense. */
export function normaliseCoordinates(input: unknown): CoordinateCheck {
  const field = 'airfoil.points';
  const raw = requireArray<unknown>(input, field, MIN_AIRFOIL_POINTS, 'list of [x, y] points');
  // The self-crossing check is quadratic in the points: the count is capped before it runs.
  requireCount(raw, field, STUDY_BOUNDS['airfoil.points']);
  const pts: Point[] = raw.map((p, i) => {
    if (!Array.isArray(p) || p.length !== 2 || !p.every((v) => typeof v === 'number' && Number.isFinite(v))) {
      throw new EngineeringInputError(`${field}[${i}]`, 'each point must be a pair of numbers [x, y]');
    }
    p.forEach((v, k) => requireStudyBound(v, 'airfoil.points[][]', `${field}[${i}][${k}]`));
    return [p[0], p[1]];
  });
  const warnings: string[] = [];
  const xs = pts.map((p) => p[0]);
  const size = Math.max(...xs) - Math.min(...xs);
  // Normalising divides by the extent: one too small for its own rounding would blow the shape up.
  if (!(size > 1e-6 * Math.max(1, ...xs.map(Math.abs))))
    throw new EngineeringInputError(field, 'the points have no extent along the chord');
  let contour = dropRepeats(toContour(pts), 1e-9 * size);
  const head = contour[0];
  const tail = contour[contour.length - 1];
  // A list of points is a closed polygon whether or not its last point repeats the first: the repeat is
  // dropped, and where the trailing edge lies is decided from the polygon alone (closeContour), so a
  // file reads the same with or without it.
  if (contour.length > 2 && Math.hypot(head[0] - tail[0], head[1] - tail[1]) <= 1e-9 * size)
    contour = contour.slice(0, -1);
  if (contour.length < MIN_AIRFOIL_POINTS) {
    throw new EngineeringInputError(
      field,
      `needs at least ${MIN_AIRFOIL_POINTS} distinct points (got ${contour.length})`,
    );
  }
  contour = closeContour(contour);
  const crossing = findSelfCrossing(contour);
  if (crossing) {
    throw new EngineeringInputError(
      field,
      `the outline crosses itself (segments after points ${crossing[0] + 1} and ${crossing[1] + 1})`,
    );
  }

  // Chord line: from the point farthest from the trailing-edge midpoint (the nose) to that midpoint.
  const te: Point = [
    (contour[0][0] + contour[contour.length - 1][0]) / 2,
    (contour[0][1] + contour[contour.length - 1][1]) / 2,
  ];
  let le = 0;
  let far = -1;
  contour.forEach((p, i) => {
    const d = Math.hypot(p[0] - te[0], p[1] - te[1]);
    if (d > far) {
      far = d;
      le = i;
    }
  });
  const ux = (te[0] - contour[le][0]) / far;
  const uy = (te[1] - contour[le][1]) / far;
  let unit: Point[] = contour.map((p) => {
    const dx = p[0] - contour[le][0];
    const dy = p[1] - contour[le][1];
    return [(dx * ux + dy * uy) / far, (-dx * uy + dy * ux) / far];
  });
  const area = signedArea(unit);
  if (Math.abs(area) < 1e-4)
    throw new EngineeringInputError(field, 'the outline encloses (almost) no area: it is not an airfoil contour');
  // The file's own frame: a nose at larger x than the trailing edge means the outline was drawn or
  // exported turned round.
  if (ux < -0.5)
    warnings.push(
      'the outline runs with its nose to the right (at larger x than the trailing edge): it was turned round to put the nose at x = 0; check the file is the section meant',
    );
  if (area < 0) {
    // clockwise file: make the first surface the upper one
    unit = unit.reverse();
    warnings.push('the points run clockwise (lower surface first): read in the other direction, upper surface first');
  }
  const camber = meanCamberArea(unit);
  if (camber < -UPSIDE_DOWN_CAMBER) {
    warnings.push(
      `the section's mean line lies below its chord (mean camber ${(camber * 100).toFixed(2)} % of chord): is the file upside down? It is used as given, lifting downward at positive angles; turn it over if it was not meant so`,
    );
  }
  if (le === 0 || le === contour.length - 1) {
    throw new EngineeringInputError(
      field,
      'the nose of the outline is at one end of the list: the contour must start and end at the trailing edge',
    );
  }
  const gap = Math.hypot(unit[0][0] - unit[unit.length - 1][0], unit[0][1] - unit[unit.length - 1][1]);
  if (gap > MAX_TRAILING_EDGE_GAP) {
    throw new EngineeringInputError(
      field,
      `the outline is not a closed contour: its ends are ${(gap * 100).toFixed(1)} % of the chord apart (at most ${MAX_TRAILING_EDGE_GAP * 100} %)`,
    );
  }
  if (gap > 0.005)
    warnings.push(
      `the trailing edge is open by ${(gap * 100).toFixed(2)} % of the chord; it is treated as nearly closed`,
    );
  return { contour: unit, trailingEdgeGap: gap, warnings };
}

/** Re-panels a unit-chord contour along its arc length, cosine-bunched at the nose and the tail. */
export function repanel(contour: Point[], panels: number): { points: Point[]; leadingEdgeIndex: number } {
  requirePanels(panels);
  const le = contour.reduce((best, p, i) => (p[0] < contour[best][0] ? i : best), 0);
  const s = [0];
  for (let i = 1; i < contour.length; i++)
    s.push(s[i - 1] + Math.hypot(contour[i][0] - contour[i - 1][0], contour[i][1] - contour[i - 1][1]));
  const sx = naturalSpline(
    s,
    contour.map((p) => p[0]),
  );
  const sy = naturalSpline(
    s,
    contour.map((p) => p[1]),
  );
  const half = panels / 2;
  const spacing = cosineSpacing(half);
  const sLe = s[le];
  const sEnd = s[s.length - 1];
  const params = [...spacing.map((f) => f * sLe), ...spacing.slice(1).map((f) => sLe + f * (sEnd - sLe))];
  const points = params.map((t): Point => [evaluateSpline(sx, t), evaluateSpline(sy, t)]);
  return { points, leadingEdgeIndex: half };
}

/**
 * Closes a small trailing-edge gap by moving each surface towards the other with weight (x/x_TE)⁴, the
 * same shape as the difference between NACA's open and closed thickness formulas: the nose and the
 * forward part of the section are untouched and both ends meet at the old gap's midpoint (the panel
 * method needs a sharp edge).
 */
export function closeTrailingEdge(points: Point[], leadingEdgeIndex: number): Point[] {
  const first = points[0];
  const last = points[points.length - 1];
  const hx = (first[0] - last[0]) / 2;
  const hy = (first[1] - last[1]) / 2;
  if (hx === 0 && hy === 0) return points;
  const closed = points.map(([x, y], i): Point => {
    const upper = i <= leadingEdgeIndex;
    const w = (Math.max(0, x) / (upper ? first[0] : last[0])) ** 4;
    const side = upper ? -1 : 1;
    return [x + side * hx * w, y + side * hy * w];
  });
  closed[closed.length - 1] = [closed[0][0], closed[0][1]];
  return closed;
}

/**
 * The airfoil for a study: NACA by designation, or uploaded coordinates checked and re-panelled; either
 * way with its trailing edge closed, ready for the panel method and for drawing the rib.
 */
export function buildAirfoil(input: AirfoilInput, panels: number): AirfoilResult {
  if (input === null || typeof input !== 'object') throw new EngineeringInputError('airfoil', 'the airfoil is missing');
  const rules: string[] = [];
  if (input.kind === 'naca') {
    const g = nacaGeometry(input.designation, panels);
    rules.push(
      `${g.name}: NACA Report 824 ordinates, cosine spacing, ${panels} panels`,
      `trailing edge closed (gap ${(g.trailingEdgeGap * 100).toFixed(3)} % of chord taken out with weight (x/c)⁴)`,
    );
    // Spelled out rather than spreads followed by more fields: V8 builds such a literal far slower.
    return {
      inputs: input,
      rules,
      warnings: [],
      caution: ENGINEERING_CAUTION,
      name: g.name,
      points: closeTrailingEdge(g.points, g.leadingEdgeIndex),
      leadingEdgeIndex: g.leadingEdgeIndex,
      trailingEdgeGap: g.trailingEdgeGap,
    };
  }
  if (input.kind === 'coordinates') {
    const check = normaliseCoordinates(input.points);
    const { points, leadingEdgeIndex } = repanel(check.contour, panels);
    rules.push(
      'uploaded outline normalised: nose (point farthest from the trailing edge) at (0, 0), trailing edge at (1, 0)',
      `re-panelled along its arc length by a cubic spline, cosine spacing, ${panels} panels`,
      'trailing edge closed, any gap taken out with weight (x/c)⁴',
    );
    return {
      ...envelope(input, rules, check.warnings),
      name: input.name ?? 'uploaded airfoil',
      points: closeTrailingEdge(points, leadingEdgeIndex),
      leadingEdgeIndex,
      trailingEdgeGap: check.trailingEdgeGap,
    };
  }
  throw new EngineeringInputError('airfoil.kind', 'must be "naca" or "coordinates"');
}

/** One surface of the contour from the leading edge to the trailing edge. */
export function surfacePoints(geometry: AirfoilGeometry, surface: Surface): Point[] {
  const le = geometry.leadingEdgeIndex;
  return surface === 'upper' ? geometry.points.slice(0, le + 1).reverse() : geometry.points.slice(le);
}
