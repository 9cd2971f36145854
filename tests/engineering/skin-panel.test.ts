import { compressionBucklingCoefficient, effectiveWidthIn } from '@/server/engineering';

describe('the compression skin of a wing box', () => {
  // Simply supported plate in compression, loaded edges a apart, width b: k = (m·b/a + a/(m·b))², least
  // over the half-waves m; one half-wave for a < b, and 4.0 the long plate's minimum (Timoshenko & Gere,
  // Theory of Elastic Stability, ch. 9).
  it.each([
    [7.25, 14.5, 6.25], // a/b = 0.5: (2 + 0.5)²
    [14.5, 29, 6.25],
    [10, 30, (3 + 1 / 3) ** 2],
    [14.5, 14.5, 4],
    [30, 10, 4],
  ])('buckles with k = %p in bay %p in × width %p', (a, b, k) => {
    expect(compressionBucklingCoefficient(a, b)).toBeCloseTo(k, 12);
  });

  // von Kármán's effective width of a buckled plate on two supported edges, b_e = 1.9·t·√(E/σ)
  // (Bruhn, Analysis and Design of Flight Vehicle Structures, ch. C7, from memory): 0.025 in 6061-T6
  // (E = 10.1e6 psi) at 20,000 psi → 1.9·0.025·√505 = 1.0674 in.
  it('keeps 1.067 in of a 0.025 in skin at 20 ksi beside its spars', () => {
    expect(effectiveWidthIn(0.025, 10.1e6, 20000)).toBeCloseTo(1.9 * 0.025 * Math.sqrt(505), 12);
    expect(effectiveWidthIn(0.025, 10.1e6, 20000)).toBeCloseTo(1.0674, 4);
  });
});
