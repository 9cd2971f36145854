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

export function luFactor(matrix: Float64Array | number[][], size?: number): LuFactors {
  const n = size ?? (matrix as number[][]).length;
  const a = matrix instanceof Float64Array ? Float64Array.from(matrix) : Float64Array.from((matrix as number[][]).flat());
  if (a.length !== n * n) throw new Error(`expected ${n}×${n} entries, got ${a.length}`);
  const perm = new Int32Array(n);
  for (let i = 0; i < n; i++) perm[i] = i;
  let scale = 0;
  for (let i = 0; i < a.length; i++) scale = Math.max(scale, Math.abs(a[i]));
  const tiny = scale * n * Number.EPSILON;

  for (let k = 0; k < n; k++) {
    let p = k;
    let best = Math.abs(a[k * n + k]);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(a[i * n + k]);
      if (v > best) {
        best = v;
        p = i;
      }
    }
    if (!(best > tiny)) throw new SingularMatrixError(k);
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = a[k * n + j];
        a[k * n + j] = a[p * n + j];
        a[p * n + j] = t;
      }
      const t = perm[k];
      perm[k] = perm[p];
      perm[p] = t;
    }
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
  return { n, lu: a, perm };
}

export function luSolve(f: LuFactors, rhs: ArrayLike<number>): Float64Array {
  const { n, lu, perm } = f;
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = rhs[perm[i]];
    const row = i * n;
    for (let j = 0; j < i; j++) s -= lu[row + j] * x[j];
    x[i] = s;
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = x[i];
    const row = i * n;
    for (let j = i + 1; j < n; j++) s -= lu[row + j] * x[j];
    x[i] = s / lu[row + i];
  }
  return x;
}

export function solveLinear(matrix: number[][], rhs: number[]): number[] {
  return Array.from(luSolve(luFactor(matrix), rhs));
}
