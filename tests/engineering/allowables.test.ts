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
const test = (loadLb: number, outcome: CouponTest['outcome'], extra: Partial<CouponTest> = {}): CouponTest => ({ ...query, loadLb, outcome, ...extra });

describe('allowables from coupon tests', () => {
  it('do not credit a clean result above a load that already deformed another coupon', () => {
    const c = couponAllowables([test(10, 'no_deformation'), test(15, 'slight_deformation'), test(18, 'no_deformation')], query);
    expect(c.limitLb).toBe(10);
  });

  it('count excessive deformation as failure at ultimate', () => {
    const c = couponAllowables([test(10, 'no_deformation'), test(20, 'slight_deformation'), test(25, 'excessive_deformation'), test(30, 'slight_deformation')], query);
    expect(c.ultimateLb).toBe(20);
  });

  it('only use tests of the same material, gauge and rivet', () => {
    const c = couponAllowables([test(10, 'no_deformation'), test(99, 'no_deformation', { rivetSpec: 'PULLED-5' }), test(99, 'no_deformation', { gaugeIn: 0.025 })], query);
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
  it('fall back without coupons to a stated fraction of the joint shear strength, and warn', () => {
    const a = jointAllowables({ material: '6061-T6', gaugeIn: 0.025, rivetSpec: 'MS20470AD4' });
    expect(a.tension.basis).toBe('fallback');
    expect(a.tension.pullThroughUltimateLb).toBeCloseTo(DEFAULT_PULL_THROUGH_FRACTION * a.shear.ultimateLb, 10);
    expect(a.tension.pullThroughLimitLb).toBeCloseTo(a.tension.pullThroughUltimateLb / 1.5, 10);
    expect(a.warnings.join(' ')).toMatch(/no coupon data for 0.025 in 6061-T6 with MS20470AD4: pull-through allowable is a conservative fraction \(8 %\)/);
  });

  it('fall back below what the trade\'s coupons showed: under 13.5 lb limit in 0.020 in and under 20 lb ultimate in 0.016 in', () => {
    // common practice (the trade's coupon results): the fallback must not be bolder than the tests.
    expect(jointAllowables({ material: '6061-T6', gaugeIn: 0.02, rivetSpec: 'PULLED-4' }).tension.limitLb).toBeLessThan(13.5);
    expect(jointAllowables({ material: '6061-T6', gaugeIn: 0.016, rivetSpec: 'PULLED-4' }).tension.ultimateLb).toBeLessThan(20);
    expect(jointAllowables({ material: '6061-T6', gaugeIn: 0.016, rivetSpec: 'MS20470AD4' }).tension.ultimateLb).toBeLessThan(20);
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
    expect(() => jointAllowables({ material: 'balsa', gaugeIn: 0.02, rivetSpec: 'MS20470AD4' })).toThrow(/unknown sheet material/);
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
