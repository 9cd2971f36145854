import {
  johnsonElasticFor,
  johnsonReduced,
  panelBuckling,
  plateBucklingStressPsi,
  sheetBucklingProperties,
  PLATE_BUCKLING_COEFFICIENTS,
  type PanelBucklingInput,
} from '@/server/engineering';
import { refusal } from './refusal';

// Plate buckling F_cr = k·π²E/(12(1 − ν²))·(t/b)², k = 4.0 for a long simply supported plate in
// compression, k_s = 5.35 simply supported / 8.98 clamped in shear: Timoshenko & Gere, Theory of Elastic
// Stability [C]. Values below by hand from the formula.

describe('the buckling stress of a flat panel', () => {
  it('uses the long-plate coefficients 4.0, 5.35 and 8.98', () => {
    // Timoshenko & Gere [C]
    expect(PLATE_BUCKLING_COEFFICIENTS.compression['simply-supported']).toBe(4.0);
    expect(PLATE_BUCKLING_COEFFICIENTS.shear['simply-supported']).toBe(5.35);
    expect(PLATE_BUCKLING_COEFFICIENTS.shear.clamped).toBe(8.98);
  });

  it('is 1028.33 psi for 0.032 in on a 6 in panel in compression (E 10⁷ psi, ν 0.3)', () => {
    // π²·10⁷/(12·0.91) = 9.8696044e7/10.92 = 9.0380993e6 psi; (0.032/6)² = 2.8444444e-5; × 4.0 = 1028.335
    expect(
      plateBucklingStressPsi({
        bucklingCoefficient: 4,
        elasticModulusPsi: 1e7,
        poissonRatio: 0.3,
        thicknessIn: 0.032,
        widthIn: 6,
      }),
    ).toBeCloseTo(1028.335, 2);
  });

  it('is 472.21 psi simply supported and 792.60 psi clamped for 0.025 in on an 8 in panel in shear', () => {
    // 9.0380993e6 × (0.025/8)² = 9.0380993e6 × 9.765625e-6 = 88.2627; × 5.35 = 472.205; × 8.98 = 792.599
    const panel = { elasticModulusPsi: 1e7, poissonRatio: 0.3, thicknessIn: 0.025, widthIn: 8 };
    expect(plateBucklingStressPsi({ ...panel, bucklingCoefficient: 5.35 })).toBeCloseTo(472.205, 2);
    expect(plateBucklingStressPsi({ ...panel, bucklingCoefficient: 8.98 })).toBeCloseTo(792.599, 2);
  });

  it('grows with the square of the gauge and falls with the square of the width', () => {
    const f = (t: number, b: number) =>
      plateBucklingStressPsi({
        bucklingCoefficient: 4,
        elasticModulusPsi: 1e7,
        poissonRatio: 0.3,
        thicknessIn: t,
        widthIn: b,
      });
    expect(f(0.04, 6) / f(0.02, 6)).toBeCloseTo(4, 12);
    expect(f(0.03, 12) / f(0.03, 6)).toBeCloseTo(0.25, 12);
  });
});

describe('a skin panel against its applied stress', () => {
  const base: PanelBucklingInput = {
    loading: 'shear',
    edges: 'simply-supported',
    elasticModulusPsi: 1e7,
    poissonRatio: 0.3,
    thicknessIn: 0.025,
    widthIn: 8,
    compressiveYieldPsi: 35000,
    appliedStressPsi: 300,
  };

  it('reports the margin F_cr/f − 1 and no reliance on diagonal tension below the buckling stress', () => {
    const r = panelBuckling(base);
    expect(r.criticalPsi).toBeCloseTo(472.205, 2);
    expect(r.marginOfSafety).toBeCloseTo(472.205 / 300 - 1, 5);
    expect(r.buckles).toBe(false);
    expect(r.diagonalTension.reliedOn).toBe(false);
  });

  it('says the design relies on post-buckled diagonal tension when the shear exceeds F_cr', () => {
    const r = panelBuckling({ ...base, appliedStressPsi: 1000 });
    expect(r.buckles).toBe(true);
    expect(r.marginOfSafety).toBeLessThan(0);
    expect(r.diagonalTension.reliedOn).toBe(true);
    expect(r.warnings.join(' ')).toMatch(/relies on post-buckled diagonal tension/);
  });

  it("takes clamped edges in shear at 8.98 and refuses clamped compression without a k of the supplier's", () => {
    expect(panelBuckling({ ...base, edges: 'clamped' }).bucklingCoefficient).toBe(8.98);
    expect(refusal(() => panelBuckling({ ...base, loading: 'compression', edges: 'clamped' })).field).toBe(
      'panel.bucklingCoefficient',
    );
    expect(
      panelBuckling({ ...base, loading: 'compression', edges: 'clamped', bucklingCoefficient: 6.9 })
        .bucklingCoefficient,
    ).toBe(6.9);
  });

  it('never reports compression skin as carrying diagonal tension', () => {
    const r = panelBuckling({ ...base, loading: 'compression', appliedStressPsi: 5000 });
    expect(r.buckles).toBe(true);
    expect(r.diagonalTension.reliedOn).toBe(false);
    expect(r.warnings.join(' ')).toMatch(/effective width/);
  });

  it("reduces a buckling stress past half the yield by Johnson's parabola, never above the yield", () => {
    // 0.25 in on 2 in: elastic 9.0380993e6 × 0.015625 × 4 = 564,881 psi; F_cy 35 ksi:
    // 35000·(1 − 35000/(4·564881)) = 34457.9 psi
    const r = panelBuckling({
      ...base,
      loading: 'compression',
      thicknessIn: 0.25,
      widthIn: 2,
      appliedStressPsi: 30000,
    });
    expect(r.elasticCriticalPsi).toBeCloseTo(564881, -1);
    expect(r.plasticityReduced).toBe(true);
    expect(r.criticalPsi).toBeCloseTo(34457.9, 0);
    expect(r.warnings.join(' ')).toMatch(/outside thin-plate theory/);
    expect(johnsonReduced(1e12, 35000)).toBeLessThan(35000);
    expect(johnsonReduced(17500, 35000)).toBe(17500);
    expect(johnsonReduced(johnsonElasticFor(25000, 35000), 35000)).toBeCloseTo(25000, 8);
  });

  it('reads E, ν and F_cy from the catalogue (from memory: verify)', () => {
    expect(sheetBucklingProperties('6061-T6')).toMatchObject({
      elasticModulusPsi: 10.1e6,
      poissonRatio: 0.33,
      compressiveYieldPsi: 35000,
    });
  });

  it.each([
    ['thickness', { thicknessIn: 0.5 }, 'panel.thicknessIn'],
    ['width', { widthIn: 0.1 }, 'panel.widthIn'],
    ['modulus', { elasticModulusPsi: 1e9 }, 'panel.elasticModulusPsi'],
    ['Poisson ratio', { poissonRatio: 0.5 }, 'panel.poissonRatio'],
    ['applied stress', { appliedStressPsi: -1 }, 'panel.appliedStressPsi'],
    ['yield', { compressiveYieldPsi: 1e7 }, 'panel.compressiveYieldPsi'],
    ['k', { bucklingCoefficient: 50 }, 'panel.bucklingCoefficient'],
    ['loading', { loading: 'torsion' }, 'panel.loading'],
  ] as const)('refuses a %s out of range, naming the field', (_what, change, field) => {
    expect(refusal(() => panelBuckling({ ...base, ...(change as Partial<PanelBucklingInput>) })).field).toBe(field);
  });
});
