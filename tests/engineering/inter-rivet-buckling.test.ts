import {
  endFixity,
  findRivet,
  interRivetBuckling,
  interRivetElasticStressPsi,
  interRivetPitchLimitIn,
  rivetHeadOf,
  END_FIXITY,
  type InterRivetInput,
} from '@/server/engineering';
import { refusal } from './refusal';

// Inter-rivet buckling σ_ir = 0.9·c·E·(t/p)²: Bruhn, Analysis and Design of Flight Vehicle Structures,
// ch. C7. The end-fixity values c by rivet head are from memory: verify against Bruhn C7. Values below by
// hand from the formula; E = 10.1e6 psi and F_cy = 35 ksi (6061-T6, MMPDS, from memory).

const skin: InterRivetInput = {
  head: 'universal',
  elasticModulusPsi: 10.1e6,
  compressiveYieldPsi: 35000,
  thicknessIn: 0.032,
  appliedStressPsi: 10000,
};

describe('end fixity by rivet head', () => {
  it('is 4.0 flat head, 3.5 spot weld, 3.0 brazier head, 1.0 countersunk (Bruhn C7, from memory, verify)', () => {
    expect(END_FIXITY.flat.c).toBe(4.0);
    expect(END_FIXITY.spotweld.c).toBe(3.5);
    expect(END_FIXITY.brazier.c).toBe(3.0);
    expect(END_FIXITY.countersunk.c).toBe(1.0);
    for (const h of ['flat', 'spotweld', 'brazier', 'countersunk'] as const)
      expect(END_FIXITY[h].source).toMatch(/from memory: verify/);
  });

  it('takes universal and pulled protruding heads as the brazier head, and says it is our assumption', () => {
    expect(rivetHeadOf(findRivet('MS20470AD4'))).toBe('universal');
    expect(rivetHeadOf(findRivet('PULLED-4'))).toBe('protruding-pulled');
    expect(rivetHeadOf(findRivet('MS20426AD4'))).toBe('countersunk');
    expect(endFixity('universal')).toEqual({ c: 3.0, source: 'taken as the brazier head (our assumption)' });
    expect(endFixity(undefined, 2.5)).toEqual({ c: 2.5, source: 'as given' });
  });
});

describe('the inter-rivet buckling stress', () => {
  it('is 0.9·3·10.1e6·(0.032/1)² = 27,924.48 psi elastic at 1 in pitch', () => {
    expect(interRivetElasticStressPsi(3, 10.1e6, 0.032, 1)).toBeCloseTo(27924.48, 6);
  });

  it("is reduced above half the compressive yield by Johnson's parabola: 24,032.96 psi", () => {
    // 27,924.48 > 35,000/2: 35000·(1 − 35000/(4·27924.48)) = 35000·(1 − 0.3133447) = 24,032.94
    const r = interRivetBuckling({ ...skin, pitchIn: 1 });
    expect(r.atPitch!.elasticPsi).toBeCloseTo(27924.48, 6);
    expect(r.atPitch!.plasticityReduced).toBe(true);
    expect(r.atPitch!.criticalPsi).toBeCloseTo(24032.94, 1);
    expect(r.atPitch!.marginOfSafety).toBeCloseTo(24032.94 / 10000 - 1, 4);
  });

  it("is a quarter of the flat head's with a countersunk head (c 1.0 against 4.0)", () => {
    expect(
      interRivetElasticStressPsi(1, 10.1e6, 0.032, 2) / interRivetElasticStressPsi(4, 10.1e6, 0.032, 2),
    ).toBeCloseTo(0.25, 12);
  });
});

describe('the pitch limit', () => {
  it('is t·√(0.9cE/f) in the elastic range: 1.67106 in at 10 ksi', () => {
    // 0.9·3·10.1e6 = 27.27e6; 27.27e6/10000 = 2727; √2727 = 52.22069; × 0.032 = 1.671062
    const r = interRivetBuckling(skin);
    expect(r.maxPitchIn).toBeCloseTo(1.671062, 5);
    expect(interRivetElasticStressPsi(3, 10.1e6, 0.032, r.maxPitchIn!)).toBeCloseTo(10000, 6);
  });

  it('goes through the parabola above half the yield: 1.16950 in at 20 ksi', () => {
    // σ_e needed = 35000²/(4·(35000 − 20000)) = 20,416.67 psi; 27.27e6/20416.67 = 1335.673; √ = 36.54686; × 0.032 = 1.169500
    const p = interRivetPitchLimitIn(3, 10.1e6, 35000, 0.032, 20000)!;
    expect(p).toBeCloseTo(1.1695, 4);
    const r = interRivetBuckling({ ...skin, appliedStressPsi: 20000, pitchIn: p });
    expect(r.atPitch!.criticalPsi).toBeCloseTo(20000, 6);
    expect(r.atPitch!.marginOfSafety).toBeCloseTo(0, 8);
  });

  it('is shorter for a countersunk head, by √(1/3) against the universal head', () => {
    const cs = interRivetBuckling({ ...skin, head: 'countersunk' }).maxPitchIn!;
    expect(cs / interRivetBuckling(skin).maxPitchIn!).toBeCloseTo(Math.sqrt(1 / 3), 10);
  });

  it('is none without compression, and no pitch will do at or above the yield', () => {
    const none = interRivetBuckling({ ...skin, appliedStressPsi: 0 });
    expect(none.maxPitchIn).toBeNull();
    expect(none.reason).toMatch(/no pitch limit/);
    const yielded = interRivetBuckling({ ...skin, appliedStressPsi: 36000 });
    expect(yielded.maxPitchIn).toBeNull();
    expect(yielded.warnings.join(' ')).toMatch(/thicker skin/);
  });

  it('warns at a pitch wider than the limit', () => {
    expect(interRivetBuckling({ ...skin, pitchIn: 2 }).warnings.join(' ')).toMatch(/buckles between rivets/);
  });

  it.each([
    ['pitch', { pitchIn: 0 }, 'rivetLine.pitchIn'],
    ['pitch', { pitchIn: 100 }, 'rivetLine.pitchIn'],
    ['head', { head: 'rounded' }, 'rivetLine.head'],
    ['end fixity', { head: undefined, endFixity: 9 }, 'rivetLine.endFixity'],
    ['gauge', { thicknessIn: 0.001 }, 'panel.thicknessIn'],
    ['modulus', { elasticModulusPsi: 1 }, 'panel.elasticModulusPsi'],
    ['applied stress', { appliedStressPsi: NaN }, 'panel.appliedStressPsi'],
  ] as const)('refuses a %s out of range, naming the field', (_what, change, field) => {
    expect(refusal(() => interRivetBuckling({ ...skin, ...(change as Partial<InterRivetInput>) })).field).toBe(field);
  });
});
