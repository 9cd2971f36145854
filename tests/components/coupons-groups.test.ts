import type { CouponOutcome } from '@/db/contracts';
import { ALL, couponBasis, filterCoupons, filterValues, groupCoupons, sortCoupons } from '@/components/coupons/coupon-groups';

const t = (gaugeIn: number, loadLb: number, outcome: CouponOutcome, rivetSpec = 'PULLED-4', material = '6061-T6', testedOn = '2026-10-14') =>
  ({ material, gaugeIn, rivetSpec, loadLb, outcome, testedOn });

// The flange coupons of the seed document (common practice): 6061-T6, pulled 1/8 in rivets.
const seed = [
  t(0.016, 20, 'excessive_deformation'), t(0.016, 30, 'excessive_deformation'),
  t(0.02, 13.5, 'no_deformation'), t(0.02, 20, 'slight_deformation'), t(0.02, 30, 'slight_deformation'),
];

describe('allowables from coupon tests, grouped by material, gauge and rivet', () => {
  it('gives 0.020 in 13.5 lb at limit and 30 lb at ultimate from the seed coupons (common practice)', () => {
    const g = groupCoupons(seed).find((x) => x.gaugeIn === 0.02)!;
    expect(g.tests).toHaveLength(3);
    expect(g.limitLb).toBe(13.5);
    expect(g.ultimateLb).toBe(30);
  });

  it('gives 0.016 in nothing at either basis when every coupon deformed excessively (common practice)', () => {
    const g = groupCoupons(seed).find((x) => x.gaugeIn === 0.016)!;
    expect(g.limitLb).toBe(0);
    expect(g.ultimateLb).toBe(0);
  });

  it('does not credit a good result at a load where another coupon of the set already did worse', () => {
    expect(couponBasis([t(0.025, 20, 'no_deformation'), t(0.025, 25, 'slight_deformation'), t(0.025, 30, 'no_deformation')]).limitLb).toBe(20);
    expect(couponBasis([t(0.025, 40, 'failure'), t(0.025, 45, 'slight_deformation'), t(0.025, 35, 'slight_deformation')]).ultimateLb).toBe(35);
  });

  it('counts excessive deformation as a failure at ultimate, but slight deformation as carried', () => {
    const b = couponBasis([t(0.032, 50, 'slight_deformation'), t(0.032, 60, 'excessive_deformation')]);
    expect(b.ultimateLb).toBe(50);
    expect(b.limitLb).toBe(0);
  });

  it('keeps each rivet and each material apart, and treats 0.050 and 0.051 in as one stock gauge', () => {
    const groups = groupCoupons([
      t(0.05, 80, 'no_deformation'), t(0.051, 90, 'no_deformation'),
      t(0.05, 80, 'no_deformation', 'MS20470AD4'), t(0.05, 80, 'no_deformation', 'PULLED-4', '2024-T3'),
    ]);
    expect(groups).toHaveLength(3);
    const same = groups.find((g) => g.material === '6061-T6' && g.rivetSpec === 'PULLED-4')!;
    expect(same.tests).toHaveLength(2);
    expect(same.limitLb).toBe(90);
  });

  it('matches material and rivet whatever their case and spaces, as the server does', () => {
    expect(groupCoupons([t(0.02, 10, 'no_deformation', 'pulled-4 ', '6061-t6'), t(0.02, 12, 'no_deformation')])).toHaveLength(1);
  });

  it('lists the groups by material, then gauge, then rivet, and each group’s tests by load', () => {
    const groups = groupCoupons([...seed].reverse());
    expect(groups.map((g) => g.gaugeIn)).toEqual([0.016, 0.02]);
    expect(groups[1].tests.map((x) => x.loadLb)).toEqual([13.5, 20, 30]);
  });
});

describe('the coupon table’s filters and order', () => {
  const tests = [...seed, t(0.02, 25, 'no_deformation', 'MS20470AD4', '6061-T6', '2026-11-02')];

  it('filters by gauge and by rivet', () => {
    expect(filterCoupons(tests, { material: ALL, gauge: '0.02', rivet: ALL })).toHaveLength(4);
    expect(filterCoupons(tests, { material: ALL, gauge: '0.02', rivet: 'MS20470AD4' })).toHaveLength(1);
    expect(filterCoupons(tests, { material: '2024-T3', gauge: ALL, rivet: ALL })).toHaveLength(0);
  });

  it('offers each distinct material, gauge and rivet once', () => {
    const v = filterValues(tests);
    expect(v.materials).toEqual(['6061-T6']);
    expect(v.gauges).toEqual([0.016, 0.02]);
    expect(v.rivets).toEqual(['MS20470AD4', 'PULLED-4']);
  });

  it('sorts newest test first, or by load, or by how badly the coupon did', () => {
    expect(sortCoupons(tests, { key: 'tested', dir: 'desc' })[0].rivetSpec).toBe('MS20470AD4');
    expect(sortCoupons(tests, { key: 'load', dir: 'asc' }).map((x) => x.loadLb)).toEqual([13.5, 20, 20, 25, 30, 30]);
    expect(sortCoupons(tests, { key: 'outcome', dir: 'desc' })[0].outcome).toBe('excessive_deformation');
  });
});
