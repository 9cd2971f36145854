import { loadSeries } from '@/components/studies/load-plot';
import type { TradeRow } from '@/components/studies/study-result';
import { forceNumber, marginText, partWeight, pitchNumber } from '@/components/studies/study-numbers';
import { nextTradeSort, sortTrade } from '@/components/studies/trade-sort';

const row = (
  gaugeIn: number,
  rivet: string,
  rank: number | null,
  totalWeightLb: number,
  buildMinutes: number,
): TradeRow => ({
  gaugeIn,
  rivet,
  feasible: rank !== null,
  rivetCount: Math.round(buildMinutes),
  flangeWeightLb: 0,
  webWeightLb: 0,
  rivetWeightLb: 0,
  totalWeightLb,
  buildMinutes,
  rank,
  pullThroughBasis: 'coupons',
});
const rows = [
  row(0.016, 'PULLED-4', null, 0.58, 239),
  row(0.02, 'PULLED-4', 1, 0.61, 92),
  row(0.016, 'MS20470AD3', 2, 0.45, 187),
  row(0.025, 'MS20470AD4', 3, 0.74, 138),
];

describe('the trade table’s order', () => {
  it('puts the recommended row first and the ones that do not carry the loads last', () => {
    expect(sortTrade(rows, { key: 'rank', dir: 'asc' }).map((r) => r.rank)).toEqual([1, 2, 3, null]);
  });

  it('keeps the rows that do not carry the loads last when the rank is turned round', () => {
    expect(sortTrade(rows, { key: 'rank', dir: 'desc' }).map((r) => r.rank)).toEqual([3, 2, 1, null]);
  });

  it('sorts by weight, by build time and by gauge', () => {
    expect(sortTrade(rows, { key: 'weight', dir: 'asc' })[0].totalWeightLb).toBe(0.45);
    expect(sortTrade(rows, { key: 'time', dir: 'asc' })[0].rivet).toBe('PULLED-4');
    expect(sortTrade(rows, { key: 'gauge', dir: 'desc' })[0].gaugeIn).toBe(0.025);
  });

  it('orders equal gauges by rank, so the table does not jump about', () => {
    expect(
      sortTrade(rows, { key: 'gauge', dir: 'asc' })
        .slice(0, 2)
        .map((r) => r.rivet),
    ).toEqual(['MS20470AD3', 'PULLED-4']);
  });

  it('turns the order round on the same column and starts a new column ascending', () => {
    expect(nextTradeSort({ key: 'weight', dir: 'asc' }, 'weight')).toEqual({ key: 'weight', dir: 'desc' });
    expect(nextTradeSort({ key: 'weight', dir: 'desc' }, 'gauge')).toEqual({ key: 'gauge', dir: 'asc' });
  });
});

describe('numbers in the results', () => {
  it('writes margins of safety with their sign, a true minus for the negative ones', () => {
    expect(marginText(0.1064)).toBe('+0.11');
    expect(marginText(-0.046)).toBe('−0.05');
    expect(marginText(null)).toBe('–');
  });

  it('writes every pitch to the same places, so 0.875 and 1.000 line up', () => {
    expect(pitchNumber(1, 'imperial')).toBe('1.000');
    expect(pitchNumber(0.875, 'imperial')).toBe('0.875');
    expect(pitchNumber(1, 'metric')).toBe('25.4');
  });

  it('writes loads per rivet in pounds or newtons, without the unit the column names', () => {
    expect(forceNumber(12.2013, 'imperial')).toBe('12.2');
    expect(forceNumber(30, 'metric')).toBe('133');
  });

  it('weighs a rib in thousandths of a pound, or in grams', () => {
    expect(partWeight(0.6088, 'imperial')).toBe('0.609 lb');
    expect(partWeight(0.6088, 'metric')).toBe('276 g');
  });
});

describe('the load plot’s data', () => {
  const holes = [
    { stationIn: 1.294, appliedLimitLb: 12.2, appliedUltimateLb: 18.3 },
    { stationIn: 20, appliedLimitLb: 6, appliedUltimateLb: 9 },
  ];

  it('keeps both allowables and every rivet inside the axes', () => {
    const s = loadSeries(holes, { tensionLimitLb: 13.5, tensionUltimateLb: 30 }, 54, 'imperial');
    expect(s.y.lo).toBe(0);
    expect(s.y.hi).toBeGreaterThanOrEqual(30);
    expect(s.x.hi).toBeGreaterThanOrEqual(54);
    expect(s.limit).toEqual([12.2, 6]);
  });

  it('draws millimetres and newtons on round ticks on the metric switch', () => {
    const s = loadSeries(holes, { tensionLimitLb: 13.5, tensionUltimateLb: 30 }, 54, 'metric');
    expect(s.xs[1]).toBeCloseTo(508);
    expect(s.ultimateAllowable).toBeCloseTo(133.45, 1);
    expect(
      s.x.ticks.every(
        (t) => Number.isInteger(t / s.x.step + 1e-9) || Math.abs(Math.round(t / s.x.step) - t / s.x.step) < 1e-9,
      ),
    ).toBe(true);
    expect(s.y.hi).toBeGreaterThanOrEqual(133.45);
  });
});
