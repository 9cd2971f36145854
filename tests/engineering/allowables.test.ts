import {
  bearingStrengthPsi,
  combinedMargin,
  couponAllowables,
  DEFAULT_PULL_THROUGH_FRACTION,
  EngineeringInputError,
  findMaterial,
  jointAllowables,
  validateCoupons,
  type CouponTest,
} from '@/server/engineering';

const query = { material: '6061-T6', gaugeIn: 0.02, rivetSpec: 'PULLED-4' };
const test = (loadLb: number, outcome: CouponTest['outcome'], extra: Partial<CouponTest> = {}): CouponTest => ({
  ...query,
  loadLb,
  outcome,
  ...extra,
});

describe('allowables from coupon tests', () => {
  it('do not credit a clean result above a load that already deformed another coupon', () => {
    const c = couponAllowables(
      [test(10, 'no_deformation'), test(15, 'slight_deformation'), test(18, 'no_deformation')],
      query,
    );
    expect(c.limitLb).toBe(10);
  });

  it('count excessive deformation as failure at ultimate', () => {
    const c = couponAllowables(
      [
        test(10, 'no_deformation'),
        test(20, 'slight_deformation'),
        test(25, 'excessive_deformation'),
        test(30, 'slight_deformation'),
      ],
      query,
    );
    expect(c.ultimateLb).toBe(20);
  });

  it('only use tests of the same material, gauge and rivet', () => {
    const c = couponAllowables(
      [
        test(10, 'no_deformation'),
        test(99, 'no_deformation', { rivetSpec: 'PULLED-5' }),
        test(99, 'no_deformation', { gaugeIn: 0.025 }),
      ],
      query,
    );
    expect(c.matched).toHaveLength(1);
    expect(c.limitLb).toBe(10);
  });

  it('say when there are none at all', () => {
    const c = couponAllowables([], query);
    expect(c.limitLb).toBeNull();
    expect(c.warnings.join(' ')).toMatch(/no coupon tests/);
  });

  it('refuse a test with an unknown outcome or no load, naming the field', () => {
    const bad = [test(10, 'no_deformation'), { ...test(10, 'no_deformation'), outcome: 'bent' }];
    expect(() => validateCoupons(bad)).toThrow(EngineeringInputError);
    try {
      validateCoupons([test(0, 'failure')]);
    } catch (e) {
      expect((e as EngineeringInputError).field).toBe('coupons[0].loadLb');
    }
    expect.assertions(2);
  });
});

describe('joint allowables', () => {
  it("fall back without coupons to a stated fraction of the sheet's bearing strength at the hole, and warn", () => {
    const a = jointAllowables({ material: '6061-T6', gaugeIn: 0.025, rivetSpec: 'MS20470AD4' });
    expect(a.tension.basis).toBe('fallback');
    expect(a.tension.pullThroughUltimateLb).toBeCloseTo(DEFAULT_PULL_THROUGH_FRACTION * a.shear.bearingUltimateLb, 10);
    expect(a.tension.pullThroughUltimateLb).toBeCloseTo(0.08 * 88000 * 0.1285 * 0.025, 10);
    expect(a.tension.pullThroughLimitLb).toBeCloseTo(a.tension.pullThroughUltimateLb / 1.5, 10);
    expect(a.warnings.join(' ')).toMatch(
      /no coupon data for 0.025 in 6061-T6 with MS20470AD4: pull-through allowable is a conservative fraction \(8 %\)/,
    );
  });

  it("fall back below what the trade's coupons showed: under 13.5 lb limit in 0.020 in and under 20 lb ultimate in 0.016 in", () => {
    // common practice (the trade's coupon results): the fallback must not be bolder than the tests.
    expect(jointAllowables({ material: '6061-T6', gaugeIn: 0.02, rivetSpec: 'PULLED-4' }).tension.limitLb).toBeLessThan(
      13.5,
    );
    expect(
      jointAllowables({ material: '6061-T6', gaugeIn: 0.016, rivetSpec: 'PULLED-4' }).tension.ultimateLb,
    ).toBeLessThan(20);
    expect(
      jointAllowables({ material: '6061-T6', gaugeIn: 0.016, rivetSpec: 'MS20470AD4' }).tension.ultimateLb,
    ).toBeLessThan(20);
  });

  it('let thin sheet bear less than the rivet shears: bearing governs a 3/16 rivet in 0.020 in', () => {
    const a = jointAllowables({ material: '6061-T6', gaugeIn: 0.02, rivetSpec: 'MS20470AD6' });
    expect(a.shear.governing).toBe('sheet bearing');
    expect(a.shear.ultimateLb).toBeCloseTo(88000 * 0.191 * 0.02, 8);
    expect(a.shear.limitLb).toBeCloseTo(58000 * 0.191 * 0.02, 8);
  });

  it('give bearing by e/D, linear from 1.5 to 2.0 and no credit beyond', () => {
    const m = findMaterial('6061-T6');
    expect(bearingStrengthPsi(m.fbruPsi, 1.5)).toBe(67000);
    expect(bearingStrengthPsi(m.fbruPsi, 1.75)).toBe(77500);
    expect(bearingStrengthPsi(m.fbruPsi, 3)).toBe(88000);
  });

  it('refuse an unknown material or rivet', () => {
    expect(() => jointAllowables({ material: 'balsa', gaugeIn: 0.02, rivetSpec: 'MS20470AD4' })).toThrow(
      /unknown sheet material/,
    );
    expect(() => jointAllowables({ material: '6061-T6', gaugeIn: 0.02, rivetSpec: 'NAIL-4' })).toThrow(/unknown rivet/);
  });
});

describe('combined tension and shear', () => {
  it('is (Rt)² + (Rs)² ≤ 1 with MS = 1/√(Rt² + Rs²) − 1', () => {
    expect(combinedMargin(60, 80, 100, 100)).toBeCloseTo(0, 12);
    expect(combinedMargin(30, 40, 100, 100)).toBeCloseTo(1, 12);
    expect(combinedMargin(50, 0, 100, 100)).toBeCloseTo(1, 12);
  });

  it('has no margin to report when nothing is applied, and −1 against a zero allowable', () => {
    expect(combinedMargin(0, 0, 100, 100)).toBeNull();
    expect(combinedMargin(10, 0, 0, 100)).toBe(-1);
  });
});

describe('the pull-through fallback without coupons (issue 9)', () => {
  const fallback = (gaugeIn: number, rivetSpec = 'PULLED-4', coupons: CouponTest[] = []) =>
    jointAllowables({ material: '6061-T6', gaugeIn, rivetSpec, coupons }).tension;

  it('depends on the gauge and falls with thinner sheet, for pulled rivets too (whose own shear does not)', () => {
    // Rivet shear (120 lb) governed the joint's shear strength from 0.011 in up: the old fallback was
    // 9.6 lb whatever the gauge.
    const gauges = [0.016, 0.02, 0.025, 0.032, 0.04, 0.05, 0.063];
    for (const rivet of ['PULLED-4', 'PULLED-5', 'MS20470AD4', 'MS20426AD3']) {
      const values = gauges.map((g) => fallback(g, rivet));
      for (let i = 1; i < values.length; i++) {
        expect(values[i].pullThroughUltimateLb).toBeGreaterThan(values[i - 1].pullThroughUltimateLb);
        expect(values[i].pullThroughLimitLb).toBeGreaterThan(values[i - 1].pullThroughLimitLb);
      }
      expect(values[0].basis).toBe('fallback');
    }
  });

  it("never exceeds what the rivet's own coupons show in the same or a thicker gauge", () => {
    // The trade's coupons (common practice): PULLED-4 in 0.016 in deformed excessively at 20 lb.
    const zero: CouponTest[] = [
      { material: '6061-T6', gaugeIn: 0.016, rivetSpec: 'PULLED-4', loadLb: 20, outcome: 'excessive_deformation' },
    ];
    // The same rivet in 0.016 in 2024-T3, and nothing of 6061-T6 at that gauge: the 6061-T6 flange of
    // 0.016 in gets no more than those coupons gave.
    const other = zero.map((t) => ({ ...t, material: '2024-T3' }));
    const t = fallback(0.016, 'PULLED-4', other);
    expect(t.basis).toBe('fallback');
    expect(t.pullThroughLimitLb).toBe(0);
    expect(t.ultimateLb).toBe(0);
    // A thinner flange is held to them too; a thicker one and another rivet are not.
    expect(fallback(0.012, 'PULLED-4', other).ultimateLb).toBe(0);
    expect(fallback(0.025, 'PULLED-4', other).ultimateLb).toBeGreaterThan(0);
    expect(fallback(0.016, 'PULLED-5', other).ultimateLb).toBeGreaterThan(0);
  });

  it('holds to the coupons of thicker gauges: limit 13.5 lb from 0.020 in caps a thinner flange at 13.5 lb', () => {
    const coupons: CouponTest[] = [
      { material: '6061-T6', gaugeIn: 0.02, rivetSpec: 'MS20470AD4', loadLb: 5, outcome: 'no_deformation' },
      { material: '6061-T6', gaugeIn: 0.02, rivetSpec: 'MS20470AD4', loadLb: 6, outcome: 'slight_deformation' },
      { material: '6061-T6', gaugeIn: 0.02, rivetSpec: 'MS20470AD4', loadLb: 8, outcome: 'failure' },
    ];
    const t = jointAllowables({ material: '6061-T6', gaugeIn: 0.016, rivetSpec: 'MS20470AD4', coupons });
    expect(t.tension.pullThroughLimitLb).toBe(5);
    expect(t.tension.pullThroughUltimateLb).toBe(6);
    expect(t.warnings.join(' ')).toMatch(
      /held to what the coupons of the same rivet in 0\.02 in 6061-T6 or thicker show/,
    );
  });

  it('is never above any coupon allowable of the same rivet at the same or a thicker gauge (random coupon sets)', () => {
    let seed = 3;
    const rnd = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    const outcomes = ['no_deformation', 'slight_deformation', 'excessive_deformation', 'failure'] as const;
    const gauges = [0.016, 0.02, 0.025, 0.032, 0.04];
    for (let k = 0; k < 40; k++) {
      const coupons: CouponTest[] = Array.from({ length: 1 + Math.floor(8 * rnd()) }, () => ({
        material: rnd() < 0.7 ? '6061-T6' : '2024-T3',
        gaugeIn: gauges[Math.floor(gauges.length * rnd())],
        rivetSpec: rnd() < 0.8 ? 'PULLED-4' : 'PULLED-5',
        loadLb: 5 + 40 * rnd(),
        outcome: outcomes[Math.floor(4 * rnd())],
      }));
      for (const g of gauges) {
        const t = jointAllowables({ material: '6061-T6', gaugeIn: g, rivetSpec: 'PULLED-4', coupons }).tension;
        if (t.basis !== 'fallback') continue;
        for (const h of gauges.filter((x) => x >= g)) {
          for (const material of ['6061-T6', '2024-T3']) {
            const c = couponAllowables(coupons, { material, gaugeIn: h, rivetSpec: 'PULLED-4' });
            if (c.limitLb === null || c.ultimateLb === null) continue;
            expect(t.pullThroughLimitLb).toBeLessThanOrEqual(c.limitLb);
            expect(t.pullThroughUltimateLb).toBeLessThanOrEqual(c.ultimateLb);
          }
        }
      }
    }
  });
});
