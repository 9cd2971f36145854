import type { Point, Surface } from '../../lib/engineering-results';

/**
 * The Joukowski airfoil and its exact potential flow, by conformal mapping z = ζ + b²/ζ of the flow about
 * a circle through ζ = b with the Kutta condition there. It is the exact solution the panel method is
 * verified against; x is re-scaled to unit chord (trailing edge at x = 1, the nose at x = 0) without
 * rotation, so α is measured from the x-axis.
 */
export interface JoukowskiSection {
  radius: number;
  /** angle of the trailing edge below the circle's centre line: the zero-lift angle is −β */
  beta: number;
  /** chord in the z-plane (trailing edge x = 2b minus the nose's x) */
  chord: number;
  thetaNose: number;
  /** contour point at circle angle θ, unit chord */
  pointAt(theta: number): Point;
  contour(panels: number): Point[];
  exactCl(alphaRad: number): number;
  exactCpAtTheta(theta: number, alphaRad: number): number;
  exactCp(surface: Surface, xc: number, alphaRad: number): number;
}

export function joukowskiSection(centre: [number, number], b = 1): JoukowskiSection {
  const [mx, my] = centre;
  const radius = Math.hypot(b - mx, my);
  const beta = Math.atan2(my, b - mx);
  const rawPoint = (theta: number): Point => {
    const zx = mx + radius * Math.cos(theta);
    const zy = my + radius * Math.sin(theta);
    const r2 = zx * zx + zy * zy;
    return [zx + (b * b * zx) / r2, zy - (b * b * zy) / r2];
  };
  // The nose: the contour's smallest x, found by golden-section search around θ = π.
  let lo = Math.PI / 2;
  let hi = (3 * Math.PI) / 2;
  const g = (Math.sqrt(5) - 1) / 2;
  for (let k = 0; k < 200; k++) {
    const a = hi - g * (hi - lo);
    const c = lo + g * (hi - lo);
    if (rawPoint(a)[0] < rawPoint(c)[0]) hi = c;
    else lo = a;
  }
  const thetaNose = (lo + hi) / 2;
  const xNose = rawPoint(thetaNose)[0];
  const chord = 2 * b - xNose;
  const pointAt = (theta: number): Point => {
    const [x, y] = rawPoint(theta);
    return [(x - xNose) / chord, y / chord];
  };
  const exactCpAtTheta = (theta: number, alphaRad: number): number => {
    // Circle speed 2V|sin(θ − α) + sin(α + β)|, divided by |dz/dζ| = |1 − b²/ζ²|.
    const circle = 2 * (Math.sin(theta - alphaRad) + Math.sin(alphaRad + beta));
    const zx = mx + radius * Math.cos(theta);
    const zy = my + radius * Math.sin(theta);
    const r2 = zx * zx + zy * zy;
    const ix = (zx * zx - zy * zy) / (r2 * r2); // Re(1/ζ²)
    const iy = (-2 * zx * zy) / (r2 * r2); // Im(1/ζ²)
    const jac = Math.hypot(1 - b * b * ix, -b * b * iy);
    const v = circle / jac;
    return 1 - v * v;
  };
  return {
    radius,
    beta,
    chord,
    thetaNose,
    pointAt,
    contour: (panels) => Array.from({ length: panels + 1 }, (_, k) => pointAt(-beta + (2 * Math.PI * k) / panels)),
    exactCl: (alphaRad) => (8 * Math.PI * radius * Math.sin(alphaRad + beta)) / chord,
    exactCpAtTheta,
    exactCp(surface, xc, alphaRad) {
      // x falls monotonically from the trailing edge to the nose along each surface: bisect on θ.
      let a = surface === 'upper' ? -beta : thetaNose;
      let c = surface === 'upper' ? thetaNose : 2 * Math.PI - beta;
      const xAt = (t: number) => pointAt(t)[0];
      const decreasing = xAt(a) > xAt(c);
      for (let k = 0; k < 100; k++) {
        const mid = (a + c) / 2;
        if (xAt(mid) > xc === decreasing) a = mid;
        else c = mid;
      }
      return exactCpAtTheta((a + c) / 2, alphaRad);
    },
  };
}
