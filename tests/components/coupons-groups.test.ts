import { ALL, filterCoupons, filterValues, sortCoupons } from '@/components/coupons/coupon-groups';
import { coupon, tradeCoupons } from '../fixtures/coupons';

// Flange coupons of the trade (common practice), as the table lists them: each with the day it was tested.
const seed = tradeCoupons.map((c) => ({ ...c, testedOn: '2026-10-14' }));

describe('the coupon table’s filters and order', () => {
  const tests = [...seed, { ...coupon(0.02, 25, 'no_deformation', 'MS20470AD4'), testedOn: '2026-11-02' }];

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
