import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { colors, radius, space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Table, type Column } from '@/components/ui/table';
import { Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
import { useWide } from '@/hooks/use-wide';
import { partWeight } from './study-numbers';
import { sameCandidate, tradeRowTestId, type CandidateKey, type TradeRow } from './study-result';
import { nextTradeSort, sortTrade, type TradeSort, type TradeSortKey } from './trade-sort';

/**
 * Every gauge × rivet candidate: whether it carries the loads, how many rivets, what it weighs and how
 * long it takes to build. Tapping a row shows that candidate (▶) in the pictures and zone tables.
 */
export function TradeTable({
  rows,
  recommended,
  chosen,
  onChoose,
}: {
  rows: TradeRow[];
  recommended: CandidateKey | null;
  chosen: CandidateKey | null;
  onChoose: (k: CandidateKey) => void;
}) {
  const units = useUnits();
  const [sort, setSort] = useState<TradeSort>({ key: 'rank', dir: 'asc' });
  const sorted = useMemo(() => sortTrade(rows, sort), [rows, sort]);
  // On a phone each candidate stacks into a tall block: the first few (and the one shown) come first,
  // the rest on request, so the zones and the apply button are not eighteen blocks down.
  const wide = useWide();
  const [all, setAll] = useState(false);
  const listed = useMemo(() => (wide || all ? sorted : firstFew(sorted, chosen)), [wide, all, sorted, chosen]);

  const wu = units.system === 'metric' ? 'g' : 'lb';
  const columns: Column<TradeRow, TradeSortKey>[] = [
    {
      key: 'gauge',
      title: `Gauge, ${units.label('length')}`,
      sortKey: 'gauge',
      minWidth: 76,
      flex: 0.9,
      render: (r) => (
        <View style={styles.gauge}>
          {sameCandidate(r, chosen) ? (
            <Txt
              variant="small"
              bold
              tone="accent"
              testID={`${tradeRowTestId(r)}-chosen`}
              role="img"
              aria-label="shown"
            >
              ▶
            </Txt>
          ) : null}
          <Mono variant="small" bold tone={sameCandidate(r, chosen) ? 'accent' : 'ink'}>
            {units.lengthNumber(r.gaugeIn)}
          </Mono>
        </View>
      ),
    },
    {
      key: 'rivet',
      title: 'Rivet',
      sortKey: 'rivet',
      minWidth: 112,
      flex: 1.5,
      render: (r) => <Mono variant="small">{r.rivet}</Mono>,
    },
    {
      key: 'feasible',
      title: 'Carries it',
      sortKey: 'feasible',
      minWidth: 76,
      flex: 1,
      render: (r) => (
        <View>
          <Txt bold tone={r.feasible ? 'ink' : 'error'}>
            {r.feasible ? '✓ yes' : '✕ no'}
          </Txt>
          {r.pullThroughBasis ? (
            <Txt variant="small" tone="faint">
              {r.pullThroughBasis === 'coupons' ? 'coupons' : 'fallback'}
            </Txt>
          ) : null}
        </View>
      ),
    },
    {
      key: 'count',
      title: 'Rivets',
      sortKey: 'count',
      minWidth: 72,
      flex: 0.7,
      render: (r) => <Mono>{r.rivetCount}</Mono>,
    },
    {
      key: 'weight',
      title: `Weight, ${wu}`,
      sortKey: 'weight',
      minWidth: 84,
      flex: 0.8,
      render: (r) => <Mono>{partWeight(r.totalWeightLb, units.system).replace(/ (lb|g)$/, '')}</Mono>,
    },
    {
      key: 'time',
      title: 'Build, min',
      sortKey: 'time',
      minWidth: 76,
      flex: 0.8,
      render: (r) => <Mono>{Math.round(r.buildMinutes)}</Mono>,
    },
    {
      key: 'rank',
      title: 'Rank',
      sortKey: 'rank',
      minWidth: 112,
      flex: 1.4,
      render: (r) =>
        sameCandidate(r, recommended) ? (
          // The rank in the badge, the word under it: a badge holding the word was wider than its column.
          <View testID={`${tradeRowTestId(r)}-recommended`} style={styles.rec}>
            <View style={styles.tag}>
              <Mono variant="small" bold tone="inverse">
                1
              </Mono>
            </View>
            <Txt variant="small" bold tone="accent">
              recommended
            </Txt>
          </View>
        ) : (
          <Mono tone={r.rank === null ? 'faint' : 'ink'}>{r.rank ?? '–'}</Mono>
        ),
    },
  ];

  return (
    <View testID="trade-table">
      <Table
        rows={listed}
        columns={columns}
        rowKey={(r) => `${r.gaugeIn}-${r.rivet}`}
        sort={sort}
        onSort={(k) => setSort((s) => nextTradeSort(s, k))}
        onRowPress={(r) => onChoose({ gaugeIn: r.gaugeIn, rivet: r.rivet })}
        rowTestID={tradeRowTestId}
        rowLabel={(r) =>
          `${units.length(r.gaugeIn)} with ${r.rivet}: ${r.feasible ? 'carries the loads' : 'does not carry the loads'}, ${r.rivetCount} rivets, ${partWeight(r.totalWeightLb, units.system)}, ${Math.round(r.buildMinutes)} minutes${sameCandidate(r, recommended) ? ', recommended' : ''}${sameCandidate(r, chosen) ? ', shown' : ''}`
        }
        empty={<Txt tone="soft">No candidates in this result.</Txt>}
      />
      {listed.length < sorted.length || (all && !wide) ? (
        <Button
          label={all ? `Show the first ${PHONE_ROWS}` : `Show all ${sorted.length} candidates`}
          variant="secondary"
          compact
          onPress={() => setAll((a) => !a)}
          testID="trade-show-all"
          style={{ alignSelf: 'flex-start', marginTop: space.sm }}
        />
      ) : null}
      <Txt variant="small" tone="faint" style={{ paddingTop: space.sm }}>
        Weight: flange along the lines, unlightened web and rivets. Build: holes × minutes per hole. Feasible rows rank
        by pull-through backed by coupons first, then by the chosen order.
      </Txt>
    </View>
  );
}

const PHONE_ROWS = 4;

/** The first rows in the order shown, and the candidate on show wherever it sorts. */
export function firstFew<T extends CandidateKey>(sorted: T[], chosen: CandidateKey | null, n = PHONE_ROWS): T[] {
  const head = sorted.slice(0, n);
  const shown = sorted.find((r) => sameCandidate(r, chosen));
  return shown && !head.includes(shown) ? [...head, shown] : head;
}

const styles = StyleSheet.create({
  gauge: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  rec: { alignItems: 'flex-start', gap: 2 },
  tag: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.xs,
    alignSelf: 'flex-start',
    flexWrap: 'wrap',
    backgroundColor: colors.accent,
    borderRadius: radius.md,
    paddingHorizontal: space.sm,
    paddingVertical: 2,
  },
});
