import { EngineeringInputError } from './errors';
import { luFactorInPlace, luSolve, SingularMatrixError } from './linear-solve';
import type { CpSample, Point, Surface } from '../../lib/engineering-results';

/**
 * Two-dimensional inviscid flow about an airfoil: linear-strength vortex panels in the stream-function
 * formulation (the body's inside is stagnant, so the surface speed is the local vortex strength γ).
 * Unknowns are γ at the N nodes and the body's stream function ψ₀: ψ = ψ₀ at every node, the Kutta
 * condition γ_first + γ_last = 0, and, because the first and last node coincide at a sharp trailing edge
 * (their ψ equations are the same), zero flow along the trailing-edge bisector just inside the body.
 * That last condition is what keeps cusped trailing edges (the Joukowski check) well posed.
 *
 * The matrix depends on the geometry only; the free stream enters the right-hand side as
 * cos α·(…) + sin α·(…). It is factored once; two solves give γ(α) = cos α·γ₀ + sin α·γ₉₀ for any α,
 * CL(α) = A cos α + B sin α, and the angle for a wanted CL follows in closed form.
 */

export interface SurfaceSolution {
  /** node indices into the contour as given, from the leading edge to the trailing edge */
  node: number[];
  /** x/c and y/c of those nodes */
  x: number[];
  y: number[];
  /** surface speed / V∞ = cos α·ga + sin α·gb (signed along the contour) */
  ga: number[];
  gb: number[];
}

export interface PanelSolution {
  panels: number;
  chord: number;
  /** CL(α) = clCos·cos α + clSin·sin α */
  clCos: number;
  clSin: number;
  upper: SurfaceSolution;
  lower: SurfaceSolution;
}

export interface PressureDistribution {
  alphaRad: number;
  cl: number;
  upper: CpSample[];
  lower: CpSample[];
}

const TWO_PI = 2 * Math.PI;

/**
 * Stream function at (x, y), in the panel's own axes, of a vortex panel from (0, 0) to (s, 0) whose
 * strength runs linearly from γa to γb: ψ = (1/2π)∫γ ln r dξ. Returns the coefficients of γa and γb.
 * r1s, r2s are the squared distances to the panel's ends and ln1, ln2 their ln r: a node's distance to
 * each other node serves the two panels that meet there, so the caller takes each logarithm once.
 * Written with an output buffer (no allocation): this is the inner loop of building the matrix.
 */
function streamCoefficients(
  x: number,
  y: number,
  s: number,
  r1s: number,
  r2s: number,
  ln1: number,
  ln2: number,
  out: Float64Array,
): void {
  const xs = x - s;
  const subtended = r1s > 0 && r2s > 0 ? Math.atan2(y * s, x * xs + y * y) : 0;
  const i0 = x * ln1 - xs * ln2 - s + y * subtended; // ∫ ln r dξ
  const i1 = x * i0 - (0.5 * r1s * ln1 - 0.25 * x * x - 0.5 * r2s * ln2 + 0.25 * xs * xs); // ∫ ξ ln r dξ
  out[0] = (i0 - i1 / s) / TWO_PI;
  out[1] = i1 / s / TWO_PI;
}

/**
 * Room for the node-to-node tables, kept from one solution to the next (every entry a solution reads it
 * writes first): two n² tables per study are some 400 kB that would otherwise be made and collected.
 */
let tables: { dist2: Float64Array; lnDist: Float64Array } | null = null;
let matrix: Float64Array | null = null;

/**
 * The m × m matrix, zeroed, in room kept from one solution to the next: it is factored where it lies and
 * read by the two solves only, all within one call (a fresh one is some 200 kB made and collected).
 */
function zeroedMatrix(m: number): Float64Array {
  if (!matrix || matrix.length !== m * m) matrix = new Float64Array(m * m);
  else matrix.fill(0);
  return matrix;
}
function distanceTables(n: number): { dist2: Float64Array; lnDist: Float64Array } {
  if (!tables || tables.dist2.length < n * n)
    tables = { dist2: new Float64Array(n * n), lnDist: new Float64Array(n * n) };
  return tables;
}

/** Node i's distances to the nodes after it, and their ln r, into both halves of the tables. */
function distanceRow(nx: Float64Array, ny: Float64Array, i: number, dist2: Float64Array, lnDist: Float64Array): void {
  const n = nx.length;
  const xi = nx[i];
  const yi = ny[i];
  dist2[i * n + i] = 0;
  lnDist[i * n + i] = 0;
  for (let k = i + 1; k < n; k++) {
    const dx = xi - nx[k];
    const dy = yi - ny[k];
    const d2 = dx * dx + dy * dy;
    const ln = d2 > 0 ? 0.5 * Math.log(d2) : 0;
    dist2[i * n + k] = d2;
    dist2[k * n + i] = d2;
    lnDist[i * n + k] = ln;
    lnDist[k * n + i] = ln;
  }
}

/** Row i of the matrix: ψ at node i from every panel's vortex sheet, less the body's ψ₀. */
function streamRow(
  nx: Float64Array,
  ny: Float64Array,
  i: number,
  m: number,
  len: Float64Array,
  tx: Float64Array,
  ty: Float64Array,
  dist2: Float64Array,
  lnDist: Float64Array,
  a: Float64Array,
  c: Float64Array,
): void {
  const n = nx.length;
  const panels = n - 1;
  const row = i * m;
  const xi = nx[i];
  const yi = ny[i];
  const at = i * n;
  for (let j = 0; j < panels; j++) {
    const dx = xi - nx[j];
    const dy = yi - ny[j];
    streamCoefficients(
      dx * tx[j] + dy * ty[j],
      -dx * ty[j] + dy * tx[j],
      len[j],
      dist2[at + j],
      dist2[at + j + 1],
      lnDist[at + j],
      lnDist[at + j + 1],
      c,
    );
    a[row + j] += c[0];
    a[row + j + 1] += c[1];
  }
  a[row + n] = -1;
}

/** Velocity (u along the panel, v normal to it) at (x, y) off the panel, coefficients of γa and γb. */
function velocityCoefficients(x: number, y: number, s: number): { ua: number; ub: number; va: number; vb: number } {
  const subtended = Math.atan2(y * s, x * (x - s) + y * y);
  const logRatio = 0.5 * Math.log((x * x + y * y) / ((x - s) * (x - s) + y * y));
  const j1 = x * subtended - y * logRatio;
  const k1 = x * logRatio - s + y * subtended;
  return {
    ua: (subtended - j1 / s) / TWO_PI,
    ub: j1 / s / TWO_PI,
    va: -(logRatio - k1 / s) / TWO_PI,
    vb: -k1 / s / TWO_PI,
  };
}

/**
 * Solves the flow about a contour given TE → upper → LE → lower → TE (counter-clockwise, as in
 * airfoil.ts) with both ends at the same trailing-edge point, chord along x, unit free-stream speed.
 * The surfaces part at `leadingEdgeIndex` (a NACA section's nose point), else at the smallest x;
 * x/c and CL are referred to the chord from there to the trailing edge.
 */
export function solvePanelMethod(contour: Point[], leadingEdgeIndex?: number): PanelSolution {
  const nodes = contour;
  const n = nodes.length;
  if (n < 11) throw new EngineeringInputError('airfoil.points', 'too few points for the panel method');
  const gap = Math.hypot(nodes[0][0] - nodes[n - 1][0], nodes[0][1] - nodes[n - 1][1]);
  if (gap > 1e-9)
    throw new EngineeringInputError(
      'airfoil.points',
      'the panel method needs the trailing edge closed (first and last point the same)',
    );
  const panels = n - 1;
  const len = new Float64Array(panels);
  const tx = new Float64Array(panels);
  const ty = new Float64Array(panels);
  for (let j = 0; j < panels; j++) {
    const dx = nodes[j + 1][0] - nodes[j][0];
    const dy = nodes[j + 1][1] - nodes[j][1];
    len[j] = Math.hypot(dx, dy);
    if (!(len[j] > 0))
      throw new EngineeringInputError('airfoil.points', `two consecutive points coincide (point ${j + 1})`);
    tx[j] = dx / len[j];
    ty[j] = dy / len[j];
  }

  // Unknowns: γ at nodes 0…n−1, then ψ₀. Rows: ψ at nodes 0…n−2, the bisector row, the Kutta row.
  const m = n + 1;
  const a = zeroedMatrix(m);
  const c = new Float64Array(2);
  // Squared distances between nodes and their ln r, row by row. The distance from i to k is the one from
  // k to i (the same bits: only the signs of dx, dy differ), so each logarithm is taken once for the
  // pair: half the logarithms. ln r at a panel's own end node is multiplied by zero: take the limit (0).
  const { dist2, lnDist } = distanceTables(n);
  // The nodes' coordinates as two arrays of numbers: the rows read them n² times. Row by row, each in a
  // function of its own: V8 compiles such a function whole, where a loop this long in here was compiled
  // from inside it and the code after it, not yet run, then threw that away.
  const nx = new Float64Array(n);
  const ny = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    nx[k] = nodes[k][0];
    ny[k] = nodes[k][1];
  }
  for (let i = 0; i < n; i++) distanceRow(nx, ny, i, dist2, lnDist);
  for (let i = 0; i < n - 1; i++) streamRow(nx, ny, i, m, len, tx, ty, dist2, lnDist, a, c);

  const te = nodes[0];
  const d1x = nodes[1][0] - te[0];
  const d1y = nodes[1][1] - te[1];
  const d2x = nodes[n - 2][0] - te[0];
  const d2y = nodes[n - 2][1] - te[1];
  const l1 = Math.hypot(d1x, d1y);
  const l2 = Math.hypot(d2x, d2y);
  let bx = d1x / l1 + d2x / l2;
  let by = d1y / l1 + d2y / l2;
  const bl = Math.hypot(bx, by);
  if (!(bl > 1e-9)) throw new EngineeringInputError('airfoil.points', 'the trailing edge folds back on itself');
  bx /= bl;
  by /= bl;
  // A point on the bisector a tenth of the shorter trailing-edge panel inside the body.
  const px = te[0] + 0.1 * Math.min(l1, l2) * bx;
  const py = te[1] + 0.1 * Math.min(l1, l2) * by;
  const bisectorRow = (n - 1) * m;
  for (let j = 0; j < panels; j++) {
    const dx = px - nodes[j][0];
    const dy = py - nodes[j][1];
    const v = velocityCoefficients(dx * tx[j] + dy * ty[j], -dx * ty[j] + dy * tx[j], len[j]);
    const along = tx[j] * bx + ty[j] * by; // panel tangent · bisector
    const across = -ty[j] * bx + tx[j] * by; // panel normal · bisector
    a[bisectorRow + j] += v.ua * along + v.va * across;
    a[bisectorRow + j + 1] += v.ub * along + v.vb * across;
  }
  a[n * m] = 1;
  a[n * m + n - 1] = 1;

  let factors;
  try {
    factors = luFactorInPlace(a, m); // the matrix is not read again: factored where it lies
  } catch (e) {
    if (e instanceof SingularMatrixError)
      throw new EngineeringInputError(
        'airfoil.points',
        'the outline is degenerate: the flow about it cannot be solved',
      );
    throw e;
  }
  // ψ∞ = y cos α − x sin α moves to the right-hand side; the bisector row gets −V∞·b.
  const rhsCos = new Float64Array(m);
  const rhsSin = new Float64Array(m);
  for (let i = 0; i < n - 1; i++) {
    rhsCos[i] = -nodes[i][1];
    rhsSin[i] = nodes[i][0];
  }
  rhsCos[n - 1] = -bx;
  rhsSin[n - 1] = -by;
  const gCos = luSolve(factors, rhsCos);
  const gSin = luSolve(factors, rhsSin);

  let le = 0;
  for (let k = 0; k < n; k++) if (nodes[k][0] < nodes[le][0]) le = k;
  if (leadingEdgeIndex !== undefined) le = leadingEdgeIndex;
  const x0 = nodes[le][0];
  const y0 = nodes[le][1];
  const chord = Math.hypot(te[0] - x0, te[1] - y0);
  // Γ = ∮γ ds (trapezoidal on the linear panels); CL = 2Γ/(V∞ c).
  let clCos = 0;
  let clSin = 0;
  for (let j = 0; j < panels; j++) {
    clCos += (gCos[j] + gCos[j + 1]) * len[j];
    clSin += (gSin[j] + gSin[j + 1]) * len[j];
  }
  clCos /= chord;
  clSin /= chord;

  const pick = (indices: number[]): SurfaceSolution => ({
    node: indices,
    x: indices.map((i) => (nodes[i][0] - x0) / chord),
    y: indices.map((i) => (nodes[i][1] - y0) / chord),
    ga: indices.map((i) => gCos[i]),
    gb: indices.map((i) => gSin[i]),
  });
  const upper: number[] = [];
  for (let k = 0; k <= le; k++) upper.push(le - k);
  const lower: number[] = [];
  for (let k = 0; k < n - le; k++) lower.push(le + k);
  return { panels, chord, clCos, clSin, upper: pick(upper), lower: pick(lower) };
}

export function liftCoefficientAt(sol: PanelSolution, alphaRad: number): number {
  return sol.clCos * Math.cos(alphaRad) + sol.clSin * Math.sin(alphaRad);
}

/** Angle of attack (rad) giving the wanted CL: the root nearest zero of A cos α + B sin α = CL. */
export function alphaForLiftCoefficient(sol: PanelSolution, cl: number): number {
  const r = Math.hypot(sol.clCos, sol.clSin);
  if (!(Math.abs(cl) < 0.9 * r)) {
    throw new EngineeringInputError(
      'kit',
      `a lift coefficient of ${cl.toFixed(2)} is beyond what the section can give; check the weight, wing area and stall speed`,
    );
  }
  return Math.atan2(sol.clSin, sol.clCos) - Math.acos(cl / r);
}

function surfaceCp(surf: SurfaceSolution, ca: number, sa: number): CpSample[] {
  return surf.x.map((x, i) => {
    const v = ca * surf.ga[i] + sa * surf.gb[i];
    return { xc: x, cp: 1 - v * v };
  });
}

export function pressureDistribution(sol: PanelSolution, alphaRad: number): PressureDistribution {
  const ca = Math.cos(alphaRad);
  const sa = Math.sin(alphaRad);
  return {
    alphaRad,
    cl: liftCoefficientAt(sol, alphaRad),
    upper: surfaceCp(sol.upper, ca, sa),
    lower: surfaceCp(sol.lower, ca, sa),
  };
}

/** Cp at x/c on one surface, linear between samples ordered from the leading edge to the trailing edge. */
export function interpolateCp(samples: CpSample[], xc: number): number {
  if (xc <= samples[0].xc) return samples[0].cp;
  const last = samples[samples.length - 1];
  if (xc >= last.xc) return last.cp;
  let lo = 0;
  let hi = samples.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (samples[mid].xc <= xc) lo = mid;
    else hi = mid;
  }
  const p = samples[lo];
  const q = samples[hi];
  if (q.xc === p.xc) return Math.min(p.cp, q.cp);
  return p.cp + ((q.cp - p.cp) * (xc - p.xc)) / (q.xc - p.xc);
}

export function cpOnSurface(dist: Pick<PressureDistribution, 'upper' | 'lower'>, surface: Surface, xc: number): number {
  return interpolateCp(surface === 'upper' ? dist.upper : dist.lower, xc);
}
