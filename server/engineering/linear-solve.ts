/**
 * Dense LU factorisation with partial pivoting (Doolittle, row-major, in place). The panel method's
 * influence matrix depends only on the geometry, so it is factored once per airfoil and every right-hand
 * side after that costs O(N²) instead of O(N³).
 */
export interface LuFactors {
  n: number;
  /** L (unit diagonal, below) and U (on and above the diagonal) packed row-major */
  lu: Float64Array;
  /** row interchanges: row i of the factored matrix is row perm[i] of the original */
  perm: Int32Array;
}

export class SingularMatrixError extends Error {
  constructor(column: number) {
    super(`matrix is singular to working precision (column ${column})`);
    this.name = 'SingularMatrixError';
  }
}

/** Factors a copy of the matrix (row-major Float64Array or rows), leaving the caller's matrix as it was. */
export function luFactor(matrix: Float64Array | number[][], size?: number): LuFactors {
  const n = size ?? (matrix as number[][]).length;
  const a =
    matrix instanceof Float64Array ? Float64Array.from(matrix) : Float64Array.from((matrix as number[][]).flat());
  return luFactorInPlace(a, n);
}

/**
 * `luFactor` of a row-major n × n matrix that the caller hands over, overwritten with the factors: the
 * panel method builds its matrix for this alone (a copy is some 200 kB per solution). The same steps,
 * in the same order, as `luFactor`, with its loops in functions of their own: called once per study, a
 * factorisation whose loops sit in the function itself is compiled by V8 from inside the running loop,
 * and the code after the loop, not yet run, threw that away again at nearly every call (most
 * factorisations then started over in the interpreter). Called once a column, these are compiled whole.
 */
export function luFactorInPlace(a: Float64Array, n: number): LuFactors {
  if (a.length !== n * n) throw new Error(`expected ${n}×${n} entries, got ${a.length}`);
  const perm = new Int32Array(n);
  for (let i = 0; i < n; i++) perm[i] = i;
  const tiny = largestMagnitude(a) * n * Number.EPSILON;
  for (let k = 0; k < n; k++) {
    const p = pivotRow(a, n, k);
    if (!(Math.abs(a[p * n + k]) > tiny)) throw new SingularMatrixError(k);
    if (p !== k) {
      swapRows(a, n, k, p);
      const t = perm[k];
      perm[k] = perm[p];
      perm[p] = t;
    }
    eliminateBelow(a, n, k);
  }
  return { n, lu: a, perm };
}

function largestMagnitude(a: Float64Array): number {
  let scale = 0;
  for (let i = 0; i < a.length; i++) scale = Math.max(scale, Math.abs(a[i]));
  return scale;
}

/** The row at or below k with the largest entry in column k (the first of equals). */
function pivotRow(a: Float64Array, n: number, k: number): number {
  let p = k;
  let best = Math.abs(a[k * n + k]);
  for (let i = k + 1; i < n; i++) {
    const v = Math.abs(a[i * n + k]);
    if (v > best) {
      best = v;
      p = i;
    }
  }
  return p;
}

function swapRows(a: Float64Array, n: number, k: number, p: number): void {
  for (let j = 0; j < n; j++) {
    const t = a[k * n + j];
    a[k * n + j] = a[p * n + j];
    a[p * n + j] = t;
  }
}

/** Column k's multipliers below the pivot, and the rows below it reduced by them. */
function eliminateBelow(a: Float64Array, n: number, k: number): void {
  const pivot = a[k * n + k];
  const krow = k * n;
  for (let i = k + 1; i < n; i++) {
    const row = i * n;
    const f = (a[row + k] /= pivot);
    if (f === 0) continue;
    // The O(N³) inner loop, unrolled by four: V8 does not vectorise, and this halves the time.
    let j = k + 1;
    for (const end = n - 3; j < end; j += 4) {
      a[row + j] -= f * a[krow + j];
      a[row + j + 1] -= f * a[krow + j + 1];
      a[row + j + 2] -= f * a[krow + j + 2];
      a[row + j + 3] -= f * a[krow + j + 3];
    }
    for (; j < n; j++) a[row + j] -= f * a[krow + j];
  }
}

export function luSolve(f: LuFactors, rhs: ArrayLike<number>): Float64Array {
  const { n, lu, perm } = f;
  const x = new Float64Array(n);
  // Row by row in functions of their own, as in luFactor: the second loop, compiled from inside the
  // first, was thrown away again at every solve.
  for (let i = 0; i < n; i++) forwardRow(lu, n, i, rhs[perm[i]], x);
  for (let i = n - 1; i >= 0; i--) backRow(lu, n, i, x);
  return x;
}

/** x[i] = b − Σ L[i][j]·x[j] over j < i (L has a unit diagonal). */
function forwardRow(lu: Float64Array, n: number, i: number, b: number, x: Float64Array): void {
  let s = b;
  const row = i * n;
  for (let j = 0; j < i; j++) s -= lu[row + j] * x[j];
  x[i] = s;
}

/** x[i] = (x[i] − Σ U[i][j]·x[j] over j > i) / U[i][i]. */
function backRow(lu: Float64Array, n: number, i: number, x: Float64Array): void {
  let s = x[i];
  const row = i * n;
  for (let j = i + 1; j < n; j++) s -= lu[row + j] * x[j];
  x[i] = s / lu[row + i];
}

export function solveLinear(matrix: number[][], rhs: number[]): number[] {
  return Array.from(luSolve(luFactor(matrix), rhs));
}
