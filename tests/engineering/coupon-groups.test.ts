import { groupCouponAllowables } from '@/server/engineering';
import { coupon, tradeCoupons } from '../fixtures/coupons';

const basis = (tests: ReturnType<typeof coupon>[]) => groupCouponAllowables(tests)[0];

// The flange coupons of the trade (common practice): 6061-T6, pulled 1/8 in rivets.
const seed = tradeCoupons;

describe('allowables from coupon tests, grouped by material, gauge and rivet', () => {
  it('gives 0.020 in 13.5 lb at limit and 30 lb at ultimate from the seed coupons (common practice)', () => {
    const g = groupCouponAllowables(seed).find((x) => x.gaugeIn === 0.02)!;
    expect(g.tests).toHaveLength(3);
    expect(g.limitLb).toBe(13.5);
    expect(g.ultimateLb).toBe(30);
  });

  it('gives 0.016 in nothing at either basis when every coupon deformed excessively (common practice)', () => {
    const g = groupCouponAllowables(seed).find((x) => x.gaugeIn === 0.016)!;
    expect(g.limitLb).toBe(0);
    expect(g.ultimateLb).toBe(0);
  });

  it('does not credit a good result at a load where another coupon of the set already did worse', () => {
    expect(
      basis([
        coupon(0.025, 20, 'no_deformation'),
        coupon(0.025, 25, 'slight_deformation'),
        coupon(0.025, 30, 'no_deformation'),
      ]).limitLb,
    ).toBe(20);
    expect(
      basis([
        coupon(0.025, 40, 'failure'),
        coupon(0.025, 45, 'slight_deformation'),
        coupon(0.025, 35, 'slight_deformation'),
      ]).ultimateLb,
    ).toBe(35);
  });

  it('counts excessive deformation as a failure at ultimate, but slight deformation as carried', () => {
    const b = basis([coupon(0.032, 50, 'slight_deformation'), coupon(0.032, 60, 'excessive_deformation')]);
    expect(b.ultimateLb).toBe(50);
    expect(b.limitLb).toBe(0);
  });

  it('keeps each rivet and each material apart, and treats 0.050 and 0.051 in as one stock gauge', () => {
    const groups = groupCouponAllowables([
      coupon(0.05, 80, 'no_deformation'),
      coupon(0.051, 90, 'no_deformation'),
      coupon(0.05, 80, 'no_deformation', 'MS20470AD4'),
      coupon(0.05, 80, 'no_deformation', 'PULLED-4', '2024-T3'),
    ]);
    expect(groups).toHaveLength(3);
    const same = groups.find((g) => g.material === '6061-T6' && g.rivetSpec === 'PULLED-4')!;
    expect(same.tests).toHaveLength(2);
    expect(same.limitLb).toBe(90);
  });

  it('matches material and rivet whatever their case and spaces, whatever the supplier typed', () => {
    expect(
      groupCouponAllowables([
        coupon(0.02, 10, 'no_deformation', 'pulled-4 ', '6061-t6'),
        coupon(0.02, 12, 'no_deformation'),
      ]),
    ).toHaveLength(1);
  });

  it('lists the groups by material, then gauge, then rivet, and each group’s tests by load', () => {
    const groups = groupCouponAllowables([...seed].reverse());
    expect(groups.map((g) => g.gaugeIn)).toEqual([0.016, 0.02]);
    expect(groups[1].tests.map((x) => x.loadLb)).toEqual([13.5, 20, 30]);
  });
});
