import {
  compressibilityBeta,
  compressibleCp,
  correctCpDistribution,
  criticalPressureCoefficient,
  karmanTsienCp,
  machNumber,
  prandtlGlauertCp,
  speedOfSoundFtPerS,
  trueAirspeedKnots,
  FT_PER_S_PER_KNOT,
  vacuumPressureCoefficient,
} from '@/server/engineering';
import { refusal } from './refusal';

// Prandtl–Glauert Cp = Cp₀/β and Kármán–Tsien Cp = Cp₀/(β + M²/(1 + β)·Cp₀/2), β = √(1 − M²): any
// compressible-aerodynamics text [C]. Values below computed by hand from those formulas.

describe('Prandtl–Glauert', () => {
  it('divides by β: Cp₀ = −1 at M 0.6 (β = 0.8) is −1.25; at M 0 nothing changes', () => {
    expect(compressibilityBeta(0.6)).toBeCloseTo(0.8, 12);
    expect(prandtlGlauertCp(-1, 0.6)).toBeCloseTo(-1.25, 12);
    expect(prandtlGlauertCp(0.4, 0.6)).toBeCloseTo(0.5, 12);
    expect(prandtlGlauertCp(-2.3, 0)).toBe(-2.3);
  });

  it('at M 0.3: β = √0.91 = 0.95394, Cp₀ −1 → −1.04828', () => {
    expect(prandtlGlauertCp(-1, 0.3)).toBeCloseTo(-1.04828, 5);
  });
});

describe('Kármán–Tsien', () => {
  it('at M 0.6 (β 0.8, M²/(1+β) = 0.36/1.8 = 0.2): Cp₀ −1 → −1/(0.8 − 0.1) = −1.428571; Cp₀ 0.5 → 0.5/0.85 = 0.588235', () => {
    expect(karmanTsienCp(-1, 0.6)).toBeCloseTo(-1.428571, 6);
    expect(karmanTsienCp(0.5, 0.6)).toBeCloseTo(0.588235, 6);
  });

  it('at M 0.3 (β 0.9539392, M²/(1+β) = 0.09/1.9539392 = 0.0460608): Cp₀ −2 → −2/(0.9539392 − 0.0460608) = −2/0.9078784 = −2.202938', () => {
    expect(karmanTsienCp(-2, 0.3)).toBeCloseTo(-2.202938, 5);
  });

  it('corrects suction more and pressure less than Prandtl–Glauert', () => {
    expect(karmanTsienCp(-1, 0.5)).toBeLessThan(prandtlGlauertCp(-1, 0.5));
    expect(karmanTsienCp(0.5, 0.5)).toBeLessThan(prandtlGlauertCp(0.5, 0.5));
    expect(karmanTsienCp(0, 0.5)).toBe(0);
  });
});

describe('the critical and vacuum pressure coefficients', () => {
  it('Cp* at M 0.6 is −1.29434 (isentropic, γ = 1.4)', () => {
    // 2/(1.4·0.36) = 3.968254; ((2 + 0.4·0.36)/2.4)^3.5 = 0.8933333^3.5 = 0.6738253; (0.6738253 − 1)·3.968254 = −1.294344
    expect(criticalPressureCoefficient(0.6)).toBeCloseTo(-1.294344, 5);
    expect(criticalPressureCoefficient(0)).toBe(-Infinity);
  });

  it('a vacuum at M 0.5 is Cp = −2/(1.4·0.25) = −5.714286', () => {
    expect(vacuumPressureCoefficient(0.5)).toBeCloseTo(-5.714286, 6);
  });
});

describe('Mach number from knots EAS and altitude (ISA)', () => {
  it('is 100 kt / 661.478 kt = 0.151176 at sea level', () => {
    // a0 = 1116.45 ft/s (U.S. Standard Atmosphere 1976) = 661.478 kt; 168.78099 ft/s / 1116.45 ft/s = 0.1511765
    expect(speedOfSoundFtPerS(0)).toBe(1116.45);
    expect(machNumber(100, 0)).toBeCloseTo(0.1511765, 6);
  });

  it('is 0.273448 at 150 KEAS and 10,000 ft', () => {
    // θ = 1 − 10000/145442 = 0.9312441; σ = θ^4.255876 = 0.738478, √σ = 0.859348: TAS = 150/0.859348
    // = 174.551 kt; a = 1116.45·√θ = 1116.45·0.9650099 = 1077.385 ft/s = 638.333 kt; M = 174.551/638.333 = 0.273448
    expect(trueAirspeedKnots(150, 10000)).toBeCloseTo(174.551, 3);
    expect(speedOfSoundFtPerS(10000) / FT_PER_S_PER_KNOT).toBeCloseTo(638.333, 3);
    expect(machNumber(150, 10000)).toBeCloseTo(0.273448, 5);
  });
});

describe('a corrected distribution', () => {
  const cp = {
    upper: [
      { xc: 0.05, cp: -1.2 },
      { xc: 0.5, cp: -0.5 },
    ],
    lower: [
      { xc: 0.05, cp: 0.3 },
      { xc: 0.5, cp: 0.1 },
    ],
  };

  it('applies the rule to every sample and reports the peak', () => {
    const d = correctCpDistribution(cp, 0.3, 'karman-tsien');
    expect(d.upper[0].cp).toBeCloseTo(karmanTsienCp(-1.2, 0.3), 12);
    expect(d.lower[1].cp).toBeCloseTo(karmanTsienCp(0.1, 0.3), 12);
    expect(d.peakCp).toBe(d.upper[0].cp);
    expect(d.locallySupersonic).toBe(false);
    expect(correctCpDistribution(cp, 0, 'prandtl-glauert').upper).toEqual(cp.upper);
  });

  it('says when the corrected suction passes Cp*: locally supersonic, the correction does not hold', () => {
    const d = correctCpDistribution(cp, 0.65, 'prandtl-glauert');
    expect(d.locallySupersonic).toBe(true);
    expect(d.warnings.join(' ')).toMatch(/locally supersonic/);
  });
});

describe('bounds', () => {
  it.each([0.7, 0.75, 1.2, -0.1, NaN])('refuses M = %p, naming the Mach number (not for transonic flow)', (m) => {
    const e = refusal(() => karmanTsienCp(-1, m));
    expect(e.field).toBe('mach');
    expect(refusal(() => prandtlGlauertCp(-1, m)).field).toBe('mach');
    if (m === 0.7) expect(e.reason).toMatch(/below 0\.7/);
  });

  it('takes M 0.699', () => {
    expect(prandtlGlauertCp(-0.5, 0.699)).toBeLessThan(-0.5);
  });

  it.each([1.5, -31])('refuses an incompressible Cp of %p', (c) => {
    expect(refusal(() => prandtlGlauertCp(c, 0.3)).field).toBe('cp');
  });

  it('refuses a suction that would correct to beyond a vacuum', () => {
    // M 0.6: vacuum −3.97; Kármán–Tsien's denominator 0.8 + 0.2·(−8) = −0.8 has no answer at all.
    expect(refusal(() => karmanTsienCp(-8, 0.6)).field).toBe('cp');
    expect(refusal(() => prandtlGlauertCp(-4, 0.6)).field).toBe('cp');
  });

  it('refuses a distribution with a sample out of range or too many samples, naming the sample or the list', () => {
    const ok = [{ xc: 0.1, cp: -1 }];
    expect(
      refusal(() => correctCpDistribution({ upper: [...ok, { xc: 0.5, cp: 2 }], lower: ok }, 0.3, 'karman-tsien'))
        .field,
    ).toBe('cp.upper[1].cp');
    const many = Array.from({ length: 2001 }, (_, i) => ({ xc: i / 2001, cp: -0.5 }));
    expect(refusal(() => correctCpDistribution({ upper: ok, lower: many }, 0.3, 'karman-tsien')).field).toBe(
      'cp.lower',
    );
  });

  it('refuses an unknown rule, a speed or altitude out of range', () => {
    expect(refusal(() => compressibleCp(-1, 0.3, 'guess' as 'karman-tsien')).field).toBe('rule');
    expect(refusal(() => machNumber(600, 0)).field).toBe('speedKeas');
    expect(refusal(() => machNumber(100, 40000)).field).toBe('altitudeFt');
  });
});
