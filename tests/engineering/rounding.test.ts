import {
  ribStudy,
  roundSignificant,
  roundStored,
  tradeStudy,
  type RibStudyInput,
  type TradeCandidate,
} from '@/server/engineering';
import { coupon } from '../fixtures/coupons';
import { rib23015, upperLine } from '../fixtures/rib-study';

// Issue 9: stored numbers rounded to what they mean, no float noise in results.

describe('rounding to what a number means', () => {
  it('takes the float noise off: 0.6000000000000001 → 0.6, −1.7600000000000002 → −1.76', () => {
    expect(0.4 * 1.5).toBe(0.6000000000000001);
    expect(roundSignificant(0.4 * 1.5)).toBe(0.6);
    expect(-0.4 * 4.4).toBe(-1.7600000000000002);
    expect(roundSignificant(-0.4 * 4.4)).toBe(-1.76);
    expect(String(roundSignificant(0.1 + 0.2))).toBe('0.3');
  });

  it('keeps six significant figures whatever the size, and zeroes what is below 1e-9', () => {
    expect(roundSignificant(94.39279633531365)).toBe(94.3928);
    expect(roundSignificant(0.0012345678)).toBe(0.00123457);
    expect(roundSignificant(123456789)).toBe(123457000);
    expect(roundSignificant(-1.6616460838224803e-17)).toBe(0);
    expect(roundSignificant(Infinity)).toBe(Infinity);
  });

  it('rounds every number of a plain-data tree and nothing else', () => {
    expect(roundStored({ a: [0.1 + 0.2, 'x', null, true], b: { c: 1 / 3 } })).toEqual({
      a: [0.3, 'x', null, true],
      b: { c: 0.333333 },
    });
  });
});

describe('a stored rib study', () => {
  const input: RibStudyInput = {
    ...rib23015,
    rib: { ...rib23015.rib, flangeWidthIn: 0.75, skinGaugeIn: 0.025 },
    gaugeCandidates: [0.02, 0.025, 0.032],
    rivetCandidates: ['PULLED-4', 'MS20470AD4'],
    panels: 80,
  };
  const { inputs, ...result } = ribStudy(input);
  void inputs;

  it('holds no number with float noise (each prints in at most ten significant figures)', () => {
    // Six significant figures (roundStored) or 0.0001 in its unit (pressures, geometry, loads).
    const noisy: string[] = [];
    const walk = (v: unknown, path: string) => {
      if (typeof v === 'number') {
        if (v !== Number(v.toPrecision(10))) noisy.push(`${path} = ${v}`);
      } else if (Array.isArray(v)) v.forEach((x, i) => walk(x, `${path}[${i}]`));
      else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) walk(x, `${path}.${k}`);
    };
    walk(result, 'result');
    expect(noisy).toEqual([]);
    expect(JSON.stringify(result)).not.toMatch(/\d\.\d*(0{6,}|9{6,})\d/);
  });

  it('stores the utility negative factor as −1.76 and the speeds to six figures', () => {
    expect(result.design.loadFactors.negative).toBe(-1.76);
    expect(result.design.speeds.maneuveringKeas).toBe(roundSignificant(45 * Math.sqrt(4.4)));
  });
});

describe('the recommendation (issue 9)', () => {
  it('never puts a candidate backed only by the pull-through fallback over a feasible coupon-backed one', () => {
    let seed = 5;
    const rnd = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    for (let k = 0; k < 200; k++) {
      const rows: TradeCandidate[] = Array.from({ length: 2 + Math.floor(10 * rnd()) }, (_, i) => ({
        gaugeIn: 0.016 + i / 1000,
        rivet: 'R',
        feasible: rnd() < 0.7,
        rivetCount: 10 + Math.floor(100 * rnd()),
        flangeWeightLb: rnd(),
        webWeightLb: rnd(),
        rivetWeightLb: rnd() / 10,
        buildMinutes: 100 * rnd(),
        pullThroughBasis: rnd() < 0.5 ? 'coupons' : 'fallback',
      }));
      for (const rankBy of ['weight', 'buildTime'] as const) {
        const t = tradeStudy(rows, rankBy);
        const couponBacked = t.rows.filter((r) => r.feasible && r.pullThroughBasis === 'coupons');
        if (couponBacked.length === 0) continue;
        const best = t.rows.find((r) => r.rank === 1)!;
        expect(best.pullThroughBasis).toBe('coupons');
        const worstCoupon = Math.max(...couponBacked.map((r) => r.rank!));
        for (const r of t.rows.filter((x) => x.feasible && x.pullThroughBasis === 'fallback'))
          expect(r.rank!).toBeGreaterThan(worstCoupon);
      }
    }
  });

  it('recommends the coupon-backed candidate in a rib study even where a fallback one is lighter', () => {
    const study = ribStudy({
      ...rib23015,
      lines: [upperLine],
      gaugeCandidates: [0.025, 0.032, 0.04],
      rivetCandidates: ['MS20470AD4'],
      panels: 80,
      coupons: [coupon(0.04, 60, 'no_deformation', 'MS20470AD4'), coupon(0.04, 90, 'slight_deformation', 'MS20470AD4')],
    });
    const lighterFallback = study.trade.filter(
      (r) => r.feasible && r.pullThroughBasis === 'fallback' && r.gaugeIn < 0.04,
    );
    expect(lighterFallback.length).toBeGreaterThan(0);
    expect(study.recommended).toEqual({ gaugeIn: 0.04, rivet: 'MS20470AD4' });
  });
});
