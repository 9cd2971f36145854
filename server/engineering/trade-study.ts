import { ENGINEERING_CAUTION } from './result';
import type { EngineeringResult, RankBy, TradeCandidate, TradeRow } from '../../lib/engineering-results';

/**
 * Gauge and rivet trade study (step 8 of the chain): every candidate with its feasibility, rivet count,
 * weights and a build-time proxy; feasible ones ranked (lightest first, or quickest to build), and the
 * best recommended.
 */

export interface TradeStudyResult extends EngineeringResult<{ candidates: TradeCandidate[]; rankBy: RankBy }> {
  rows: TradeRow[];
  recommended: { gaugeIn: number; rivet: string } | null;
}

export function tradeStudy(candidates: TradeCandidate[], rankBy: RankBy = 'weight'): TradeStudyResult {
  // Spelled out rather than `{ ...c, more }`, which V8 builds some hundred times slower.
  const rows: TradeRow[] = candidates.map((c) => ({
    gaugeIn: c.gaugeIn,
    rivet: c.rivet,
    feasible: c.feasible,
    rivetCount: c.rivetCount,
    flangeWeightLb: c.flangeWeightLb,
    webWeightLb: c.webWeightLb,
    rivetWeightLb: c.rivetWeightLb,
    buildMinutes: c.buildMinutes,
    pullThroughBasis: c.pullThroughBasis,
    totalWeightLb: c.flangeWeightLb + c.webWeightLb + c.rivetWeightLb,
    rank: null,
  }));
  // Allowables backed by the supplier's own coupons rank ahead of the conservative fallback: they are
  // the ones the supplier can stand behind.
  const tested = (r: TradeRow) => (r.pullThroughBasis === 'coupons' ? 0 : 1);
  const byWeight = (a: TradeRow, b: TradeRow) => a.totalWeightLb - b.totalWeightLb || a.buildMinutes - b.buildMinutes;
  const byTime = (a: TradeRow, b: TradeRow) => a.buildMinutes - b.buildMinutes || a.totalWeightLb - b.totalWeightLb;
  const order = rankBy === 'weight' ? byWeight : byTime;
  const ranked = rows.filter((r) => r.feasible).sort((a, b) => tested(a) - tested(b) || order(a, b));
  ranked.forEach((r, i) => {
    r.rank = i + 1;
  });
  const rules = [
    `feasible candidates ranked: pull-through backed by coupons first, then by ${rankBy === 'weight' ? 'total weight (flange + web + rivets), then build time' : 'build time, then total weight'}`,
    'build-time proxy: holes × minutes per hole',
  ];
  const warnings: string[] = [];
  const best = ranked[0];
  if (!best)
    warnings.push(
      'no gauge and rivet combination carries the loads: thicker stock, larger rivets or a closer minimum pitch are needed',
    );
  else {
    const better = ranked.filter((r) => r.pullThroughBasis === 'fallback' && order(r, best) < 0);
    if (best.pullThroughBasis === 'coupons' && better.length > 0) {
      const first = better.sort(order)[0];
      warnings.push(
        `${first.gaugeIn} in with ${first.rivet} would be ${rankBy === 'weight' ? 'lighter' : 'quicker to build'} but rests on the pull-through fallback: coupon tests of it may be worth making`,
      );
    }
    if (best.pullThroughBasis === 'fallback')
      warnings.push(
        'the recommendation rests on the conservative pull-through fallback: no feasible candidate is backed by coupon tests',
      );
  }
  // Spelled out rather than `...envelope(…)` followed by more fields: V8 builds such a literal far slower.
  return {
    inputs: { candidates, rankBy },
    rules,
    warnings,
    caution: ENGINEERING_CAUTION,
    rows,
    recommended: best ? { gaugeIn: best.gaugeIn, rivet: best.rivet } : null,
  };
}
