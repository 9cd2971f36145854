/**
 * Natural cubic spline through (t, v) with t strictly increasing: used to re-panel uploaded airfoil
 * coordinates along their arc length so the panel method sees a smooth, well-spaced contour whatever
 * the file's own spacing.
 */
export interface Spline {
  t: number[];
  v: number[];
  /** second derivatives at the knots */
  m: number[];
}

export function naturalSpline(t: number[], v: number[]): Spline {
  const n = t.length;
  const m = new Array<number>(n).fill(0);
  if (n < 3) return { t, v, m };
  // Tridiagonal system for the interior second derivatives (Thomas algorithm).
  const c = new Array<number>(n).fill(0);
  const d = new Array<number>(n).fill(0);
  for (let i = 1; i < n - 1; i++) {
    const h0 = t[i] - t[i - 1];
    const h1 = t[i + 1] - t[i];
    const a = h0 / 6;
    const b = (h0 + h1) / 3;
    const cc = h1 / 6;
    const r = (v[i + 1] - v[i]) / h1 - (v[i] - v[i - 1]) / h0;
    const denom = b - a * c[i - 1];
    c[i] = cc / denom;
    d[i] = (r - a * d[i - 1]) / denom;
  }
  for (let i = n - 2; i >= 1; i--) m[i] = d[i] - c[i] * m[i + 1];
  return { t, v, m };
}

export function evaluateSpline(s: Spline, x: number): number {
  const { t, v, m } = s;
  let lo = 0;
  let hi = t.length - 1;
  if (x <= t[0]) hi = 1;
  else if (x >= t[hi]) lo = hi - 1;
  else {
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (t[mid] <= x) lo = mid;
      else hi = mid;
    }
  }
  const h = t[hi] - t[lo];
  const a = (t[hi] - x) / h;
  const b = (x - t[lo]) / h;
  return a * v[lo] + b * v[hi] + (((a * a * a - a) * m[lo] + (b * b * b - b) * m[hi]) * h * h) / 6;
}
