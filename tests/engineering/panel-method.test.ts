import {
  alphaForLiftCoefficient,
  buildAirfoil,
  cpOnSurface,
  degToRad,
  EngineeringInputError,
  flatPlatePressureJump,
  joukowskiSection,
  liftCoefficientAt,
  pressureDistribution,
  solvePanelMethod,
  THIN_AIRFOIL_LIFT_SLOPE,
} from '@/server/engineering';

/** Largest and root-mean-square Cp error against the exact Joukowski flow (the cusp node left out), and the CL error. */
function joukowskiErrors(centre: [number, number], panels: number, alphaDeg: number) {
  const j = joukowskiSection(centre);
  const alpha = degToRad(alphaDeg);
  const flow = solvePanelMethod(j.contour(panels));
  const p = pressureDistribution(flow, alpha);
  let max = 0;
  let sumSq = 0;
  let count = 0;
  for (const side of ['upper', 'lower'] as const) {
    p[side].forEach((s, i) => {
      const node = flow[side].node[i];
      if (node === 0 || node === panels) return;
      const e = Math.abs(s.cp - j.exactCpAtTheta(-j.beta + (2 * Math.PI * node) / panels, alpha));
      max = Math.max(max, e);
      sumSq += e * e;
      count++;
    });
  }
  return { max, rms: Math.sqrt(sumSq / count), cl: Math.abs(liftCoefficientAt(flow, alpha) - j.exactCl(alpha)) };
}

describe('the panel method converges to the exact Joukowski solution', () => {
  // Exact conformal-mapping solution (Joukowski) [derivation from memory, values computed]
  it.each([
    [[-0.1, 0], 5],
    [[-0.1, 0.1], 0],
    [[-0.1, 0.1], 5],
  ] as [[number, number], number][])(
    'as the panels double from 40 to 320: the CL and rms Cp errors at least halve, the largest Cp error falls (centre %p, %p°)',
    (centre, deg) => {
      const errors = [40, 80, 160, 320].map((n) => joukowskiErrors(centre, n, deg));
      for (let i = 1; i < errors.length; i++) {
        expect(errors[i].cl).toBeLessThan(errors[i - 1].cl / 2);
        expect(errors[i].rms).toBeLessThan(errors[i - 1].rms / 2);
        expect(errors[i].max).toBeLessThan(errors[i - 1].max);
      }
    },
  );
});

describe('the panel method on NACA sections', () => {
  const flowOf = (designation: string, panels = 160) =>
    solvePanelMethod(buildAirfoil({ kind: 'naca', designation }, panels).points);

  it('gives a symmetric section no lift at zero angle and equal pressures on both sides', () => {
    const flow = flowOf('0012');
    expect(Math.abs(liftCoefficientAt(flow, 0))).toBeLessThan(1e-9);
    const p = pressureDistribution(flow, 0);
    for (const x of [0.05, 0.3, 0.7]) expect(cpOnSurface(p, 'upper', x)).toBeCloseTo(cpOnSurface(p, 'lower', x), 9);
  });

  it('approaches thin-airfoil theory as the section gets thin: lift slope within 1 % and ΔCp within 3 % of the flat plate at 1 % thickness', () => {
    // thin-airfoil theory, any aerodynamics text [M] (from memory)
    const thin = flowOf('0001');
    const thick = flowOf('0012');
    expect(Math.abs(thin.clSin / THIN_AIRFOIL_LIFT_SLOPE - 1)).toBeLessThan(0.01);
    expect(Math.abs(thick.clSin / THIN_AIRFOIL_LIFT_SLOPE - 1)).toBeGreaterThan(
      Math.abs(thin.clSin / THIN_AIRFOIL_LIFT_SLOPE - 1),
    );
    const alpha = degToRad(5);
    const p = pressureDistribution(thin, alpha);
    for (const x of [0.1, 0.5]) {
      const jump = cpOnSurface(p, 'lower', x) - cpOnSurface(p, 'upper', x);
      expect(Math.abs(jump / flatPlatePressureJump(x, alpha) - 1)).toBeLessThan(0.03);
    }
  });

  it('puts the zero-lift angle of a 2412 near −2.1° and of a 23012 near −1.2°', () => {
    // Abbott & von Doenhoff, Theory of Wing Sections (from memory): α_L0 about −2.1° and −1.2°
    expect(alphaForLiftCoefficient(flowOf('2412'), 0) * (180 / Math.PI)).toBeCloseTo(-2.1, 0);
    expect(alphaForLiftCoefficient(flowOf('23012'), 0) * (180 / Math.PI)).toBeCloseTo(-1.2, 0);
  });

  it('finds the angle that gives the lift coefficient asked for, up and down', () => {
    const flow = flowOf('2412');
    for (const cl of [-0.8, 0, 0.5, 1.6])
      expect(liftCoefficientAt(flow, alphaForLiftCoefficient(flow, cl))).toBeCloseTo(cl, 10);
  });

  it('refuses a lift coefficient no section can give', () => {
    expect(() => alphaForLiftCoefficient(flowOf('2412'), 7)).toThrow(EngineeringInputError);
  });

  it('gives the same pressures from the once-factored matrix as from a fresh solve of a rotated section', () => {
    // Turning the free stream by α and turning the airfoil by −α are the same flow.
    const alpha = degToRad(6);
    const points = buildAirfoil({ kind: 'naca', designation: '4412' }, 120).points;
    const turned = points.map(([x, y]): [number, number] => [
      x * Math.cos(alpha) + y * Math.sin(alpha),
      -x * Math.sin(alpha) + y * Math.cos(alpha),
    ]);
    const byNode = (pts: [number, number][], a: number) => {
      const flow = solvePanelMethod(pts);
      const p = pressureDistribution(flow, a);
      const cp = new Map<number, number>();
      for (const side of ['upper', 'lower'] as const) p[side].forEach((s, i) => cp.set(flow[side].node[i], s.cp));
      return cp;
    };
    const a = byNode(points, alpha);
    const b = byNode(turned, 0);
    expect(a.size).toBe(points.length);
    a.forEach((cp, node) => expect(b.get(node)).toBeCloseTo(cp, 8));
  });

  it('has the strongest suction of a lifting section close behind the nose on the upper surface', () => {
    const flow = flowOf('2412');
    const p = pressureDistribution(flow, alphaForLiftCoefficient(flow, 1.2));
    const peak = p.upper.reduce((a, b) => (b.cp < a.cp ? b : a));
    expect(peak.xc).toBeLessThan(0.02);
  });

  it('refuses a contour whose trailing edge is not closed', () => {
    const open = buildAirfoil({ kind: 'naca', designation: '0012' }, 40).points.slice(0, -1);
    expect(() => solvePanelMethod(open)).toThrow(/trailing edge closed/);
  });
});
