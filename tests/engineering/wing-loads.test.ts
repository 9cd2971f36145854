import { momentCoefficientAbout, planformGeometry, spanwiseLoads } from '@/server/engineering';

// Spanwise shear, bending and torque of a rectangular wing graded by Schrenk's approximation (O. Schrenk,
// NACA TM 948): lift per unit span (L/b)·½(1 + 4/π·√(1 − η²)). The closed forms below are worked by hand
// from that definition with ∫√(1 − t²)dt = ½(t√(1 − t²) + asin t) and ∫t√(1 − t²)dt = −⅓(1 − t²)^{3/2}.

const L = 5808; // lb, both wings
const planform = planformGeometry({ kind: 'rectangle', spanIn: 320, chordIn: 54 });
const B = planform.spanIn / 2;
const ratio = (eta: number) => 0.5 * (1 + (4 / Math.PI) * Math.sqrt(Math.max(0, 1 - eta * eta)));
const grading = { loadRatio: ratio, clRatio: ratio };

describe('loads along the span of a rectangular wing (Schrenk grading)', () => {
  const stations = [0, 0.3 * B, 0.6 * B, 0.9 * B, B];
  const loads = spanwiseLoads(
    planform,
    grading,
    { cm0: 0, perCl: 0 },
    { wingLiftLb: L, wingCl: 1, qPsi: 0.2 },
    stations,
  );

  it('carries half the lift as shear at the root, and nothing at the tip', () => {
    expect(loads[0].shearLb / (L / 2) - 1).toBeCloseTo(0, 4);
    expect(loads[4].shearLb).toBeCloseTo(0, 6);
  });

  it('has the closed-form shear V(η) = (L/4)·[(1 − η) + (2/π)(acos η − η√(1 − η²))] at every station', () => {
    for (const l of loads.slice(0, 4)) {
      const eta = l.yIn / B;
      const exact = (L / 4) * (1 - eta + (2 / Math.PI) * (Math.acos(eta) - eta * Math.sqrt(1 - eta * eta)));
      expect(Math.abs(l.shearLb - exact)).toBeLessThan(1e-4 * (L / 2));
    }
  });

  it('has the root bending moment (L·b/8)·(½ + 4/(3π)): the uniform and the elliptic centroids averaged', () => {
    const exact = ((L * planform.spanIn) / 8) * (0.5 + 4 / (3 * Math.PI));
    expect(Math.abs(loads[0].bendingInLb / exact - 1)).toBeLessThan(1e-4);
    // and it falls outboard, to zero at the tip
    for (let i = 1; i < loads.length; i++) expect(loads[i].bendingInLb).toBeLessThan(loads[i - 1].bendingInLb);
    expect(loads[4].bendingInLb).toBeCloseTo(0, 6);
  });

  it("integrates the sections' moment to the torque q·c²·B·(cm0 + k·CL) at the root of a rectangular wing", () => {
    const q = 0.25;
    const [root] = spanwiseLoads(
      planform,
      grading,
      { cm0: -0.05, perCl: 0.1 },
      { wingLiftLb: L, wingCl: 0.8, qPsi: q },
      [0],
    );
    const exact = q * 54 * 54 * B * (-0.05 + 0.1 * 0.8);
    expect(Math.abs(root.torqueInLb / exact - 1)).toBeLessThan(1e-4);
  });
});

describe('the moment coefficient of a pressure distribution', () => {
  // A flat plate's thin-airfoil load ΔCp = 4α·√((1 − x)/x) acts at the quarter chord: cm about x/c = 0.25
  // is zero and about the leading edge −CL/4 (thin-airfoil theory, e.g. Abbott & von Doenhoff ch. 4).
  const alpha = 0.1;
  const n = 4000;
  const xs = Array.from({ length: n + 1 }, (_, i) => 0.5 * (1 - Math.cos((Math.PI * i) / n)));
  const dcp = (x: number) => (x <= 0 ? 0 : 4 * alpha * Math.sqrt((1 - x) / x));
  const dist = {
    upper: xs.map((x) => ({ xc: x, cp: -dcp(x) / 2 })),
    lower: xs.map((x) => ({ xc: x, cp: dcp(x) / 2 })),
  };
  const cl = 2 * Math.PI * alpha;

  it('is zero about the quarter chord and −CL/4 about the leading edge for a flat plate', () => {
    expect(momentCoefficientAbout(dist, 0.25)).toBeCloseTo(0, 3);
    expect(momentCoefficientAbout(dist, 0) / (-cl / 4)).toBeCloseTo(1, 2);
  });
});
