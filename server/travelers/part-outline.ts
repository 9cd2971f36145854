import type { PartKind } from '../../db/contracts';

// TEMPORARY: replaced by the engineering core's NACA geometry once it lands (same formula, Report 824).
function naca4(designation: string, n: number): [number, number][] {
  const m = Number(designation[0]) / 100, p = Number(designation[1]) / 10, t = Number(designation.slice(2, 4)) / 100;
  const pts = (x: number, sign: 1 | -1): [number, number] => {
    const yt = 5 * t * (0.2969 * Math.sqrt(x) - 0.126 * x - 0.3516 * x ** 2 + 0.2843 * x ** 3 - 0.1015 * x ** 4);
    const yc = p === 0 ? 0 : x < p ? (m / p ** 2) * (2 * p * x - x * x) : (m / (1 - p) ** 2) * (1 - 2 * p + 2 * p * x - x * x);
    return [x, yc + sign * yt];
  };
  const xs = Array.from({ length: n + 1 }, (_, i) => 0.5 * (1 - Math.cos((Math.PI * i) / n)));
  return [...xs.slice().reverse().map((x) => pts(x, 1)), ...xs.slice(1).map((x) => pts(x, -1))];
}

/** The part's outline in inches for the traveler drawing: the airfoil at the rib's chord, or a panel rectangle. */
export function partOutline(kind: PartKind, airfoil: string, chordIn: number): [number, number][] {
  const digits = airfoil.replace(/^NACA\s*/i, '');
  if ((kind === 'rib' || kind === 'nose_rib') && /^\d{4}$/.test(digits)) {
    return naca4(digits, 60).map(([x, y]) => [x * chordIn, y * chordIn]);
  }
  const h = Math.max(chordIn * 0.25, 2);
  return [[0, 0], [chordIn, 0], [chordIn, h], [0, h]];
}
