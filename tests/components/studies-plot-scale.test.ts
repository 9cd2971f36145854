import {
  fitProjection,
  largestCp,
  linearScale,
  niceAxis,
  niceStep,
  pressureArrows,
  splitOutline,
  stackLabels,
  surfaceAt,
  surfaceBetween,
  tickLabel,
} from '@/components/studies/plot-scale';
import type { Pt } from '@/components/studies/study-result';

// A diamond "airfoil", 10 in chord, 1 in thick at mid-chord, listed from the trailing edge over the top.
const diamond: Pt[] = [
  [10, 0],
  [5, 0.5],
  [0, 0],
  [5, -0.5],
  [10, 0],
];

describe('plot scales', () => {
  it('maps the domain onto the range, and flips it when the range runs backwards', () => {
    const s = linearScale(0, 10, 100, 0);
    expect(s(0)).toBe(100);
    expect(s(10)).toBe(0);
    expect(s(2.5)).toBe(75);
  });

  it('puts a zero-width domain in the middle of the range instead of dividing by zero', () => {
    expect(linearScale(3, 3, 0, 100)(3)).toBe(50);
  });

  it('chooses round steps of 1, 2 or 5', () => {
    expect(niceStep(54, 6)).toBe(10);
    expect(niceStep(32.4, 5)).toBe(10);
    expect(niceStep(1.3716, 6)).toBe(0.5);
    expect(niceStep(0.9, 5)).toBe(0.2);
  });

  it('widens an axis to whole steps so every point and every allowable is on the plot', () => {
    const a = niceAxis(0, 32.4, 5);
    expect(a.lo).toBe(0);
    expect(a.hi).toBeGreaterThanOrEqual(32.4);
    expect(a.ticks[0]).toBe(0);
    expect(a.ticks[a.ticks.length - 1]).toBe(a.hi);
    expect(a.ticks.every((t, i) => i === 0 || Math.abs(t - a.ticks[i - 1] - a.step) < 1e-9)).toBe(true);
  });

  it('keeps tick labels free of floating-point noise', () => {
    const a = niceAxis(0, 0.7, 7);
    expect(a.ticks.map((t) => tickLabel(t, a.step))).toEqual(['0.0', '0.1', '0.2', '0.3', '0.4', '0.5', '0.6', '0.7']);
    expect(tickLabel(1200, 200)).toBe('1200');
  });

  it('draws a rib at true scale: its depth follows from the width, y up on paper', () => {
    const p = fitProjection({ minX: 0, maxX: 10, minY: -0.5, maxY: 0.5 }, 220, 10);
    expect(p.scale).toBe(20);
    expect(p.height).toBe(40);
    expect(p.x(0)).toBe(10);
    expect(p.y(0.5)).toBe(10);
    expect(p.y(-0.5)).toBe(30);
  });

  it('shrinks the scale when a deep picture would be taller than allowed', () => {
    const p = fitProjection({ minX: 0, maxX: 1, minY: 0, maxY: 10 }, 120, 10, 220);
    expect(p.height).toBeCloseTo(220);
    expect(p.scale).toBeCloseTo(20);
  });
});

describe('the rib outline and the pressure on it', () => {
  it('splits the outline at its leading edge into upper and lower surfaces, each running aft', () => {
    const { upper, lower } = splitOutline(diamond);
    expect(upper[0]).toEqual([0, 0]);
    expect(upper.map(([, y]) => y)).toEqual([0, 0.5, 0]);
    expect(lower.map(([, y]) => y)).toEqual([0, -0.5, 0]);
  });

  it('tells upper from lower by the shape, whichever way the points are listed', () => {
    const { upper } = splitOutline([...diamond].reverse());
    expect(Math.max(...upper.map(([, y]) => y))).toBe(0.5);
  });

  it('points the normal out of the section: up and forward on the upper surface, down on the lower', () => {
    const { upper, lower } = splitOutline(diamond);
    const u = surfaceAt(upper, 2.5, 'upper');
    expect(u.y).toBeCloseTo(0.25);
    expect(u.ny).toBeGreaterThan(0);
    expect(u.nx).toBeLessThan(0);
    expect(Math.hypot(u.nx, u.ny)).toBeCloseTo(1);
    const l = surfaceAt(lower, 7.5, 'lower');
    expect(l.y).toBeCloseTo(-0.25);
    expect(l.ny).toBeLessThan(0);
  });

  it('draws suction away from the skin and pressure onto it, |Cp| long', () => {
    const { upper } = splitOutline(diamond);
    const [suck, push] = pressureArrows(
      upper,
      [
        { xc: 0.75, cp: -2 },
        { xc: 0.75, cp: 0.5 },
      ],
      'upper',
      10,
      1,
    );
    expect(suck.suction).toBe(true);
    expect(push.suction).toBe(false);
    expect(Math.hypot(suck.x1 - suck.x0, suck.y1 - suck.y0)).toBeCloseTo(2);
    expect(Math.hypot(push.x1 - push.x0, push.y1 - push.y0)).toBeCloseTo(0.5);
    // Both are drawn outside the section: the head tells which way the pressure acts.
    expect(suck.y1).toBeGreaterThan(suck.y0);
    expect(push.y1).toBeGreaterThan(push.y0);
  });

  it('measures the pressure from the inside of the wing when it is vented', () => {
    const { upper } = splitOutline(diamond);
    const [a] = pressureArrows(upper, [{ xc: 0.5, cp: -0.5 }], 'upper', 10, 1, -0.5);
    expect(Math.hypot(a.x1 - a.x0, a.y1 - a.y0)).toBeCloseTo(0);
  });

  it('scales every condition alike from the largest |Cp| of them all', () => {
    const conditions = [
      { cp: { upper: [{ xc: 0, cp: -6.05 }], lower: [{ xc: 0, cp: 1 }] } },
      { cp: { upper: [{ xc: 0, cp: -1 }], lower: [{ xc: 0, cp: -2.6 }] } },
    ];
    expect(largestCp(conditions)).toBeCloseTo(6.05);
  });

  it('follows the surface between two stations for a zone bar', () => {
    const { upper } = splitOutline(diamond);
    const pts = surfaceBetween(upper, 2.5, 7.5, 'upper');
    expect(pts[0][0]).toBeCloseTo(2.5);
    expect(pts[pts.length - 1][0]).toBeCloseTo(7.5);
    expect(pts.some(([x, y]) => x === 5 && y === 0.5)).toBe(true);
  });
});

describe('pitch labels that do not overlap', () => {
  it('keeps labels that fit side by side on one row', () => {
    expect(
      stackLabels([
        { x0: 0, x1: 30 },
        { x0: 40, x1: 70 },
        { x0: 80, x1: 100 },
      ]),
    ).toEqual([0, 0, 0]);
  });

  it('moves a label that would overlap its neighbour up a row, and back down when there is room', () => {
    expect(
      stackLabels([
        { x0: 0, x1: 40 },
        { x0: 30, x1: 70 },
        { x0: 50, x1: 90 },
        { x0: 100, x1: 120 },
      ]),
    ).toEqual([0, 1, 0, 0]);
  });
});
