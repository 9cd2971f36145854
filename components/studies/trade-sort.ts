import type { SortState } from '@/components/ui/table';
import type { TradeRow } from './study-result';

export type TradeSortKey = 'rank' | 'gauge' | 'rivet' | 'feasible' | 'count' | 'weight' | 'time';
export type TradeSort = SortState<TradeSortKey>;

const value: Record<TradeSortKey, (r: TradeRow) => number | string> = {
  // Not feasible has no rank: it goes after every ranked row, whichever way the column sorts.
  rank: (r) => r.rank ?? Number.POSITIVE_INFINITY,
  gauge: (r) => r.gaugeIn,
  rivet: (r) => r.rivet,
  feasible: (r) => (r.feasible ? 0 : 1),
  count: (r) => r.rivetCount,
  weight: (r) => r.totalWeightLb,
  time: (r) => r.buildMinutes,
};

/** Sorted by the column, then by rank, gauge and rivet so equal rows keep a steady order. */
export function sortTrade(rows: readonly TradeRow[], sort: TradeSort): TradeRow[] {
  const get = value[sort.key];
  const sign = sort.dir === 'asc' ? 1 : -1;
  const cmp = (a: number | string, b: number | string) =>
    typeof a === 'string' ? a.localeCompare(String(b)) : a === b ? 0 : a < (b as number) ? -1 : 1;
  return [...rows].sort((a, b) => {
    if (sort.key === 'rank' && (a.rank === null) !== (b.rank === null)) return a.rank === null ? 1 : -1;
    return (
      sign * cmp(get(a), get(b)) ||
      cmp(value.rank(a), value.rank(b)) ||
      a.gaugeIn - b.gaugeIn ||
      a.rivet.localeCompare(b.rivet)
    );
  });
}

/** The same column again turns the order round; a new column starts ascending. */
export function nextTradeSort(s: TradeSort, key: TradeSortKey): TradeSort {
  return s.key === key ? { key, dir: s.dir === 'asc' ? 'desc' : 'asc' } : { key, dir: 'asc' };
}
