import { StyleSheet, View } from 'react-native';
import { colors, radius, space } from '@/constants/theme';
import { GridTable } from '@/components/ui/grid-table';
import { Sheet } from '@/components/ui/sheet';
import { Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
import { YesNoCell } from './table-cells';
import { partWeight } from './study-numbers';
import { sameCandidate } from './study-result';
import type { WingResult } from './wing-result';

const W = { pair: 178, ok: 72, bad: 170, count: 64, weight: 80, time: 72, rank: 118 };

const trim = (s: string) => s.replace(/ (lb|g)$/, '');

/**
 * The trade across the ribs: one gauge and rivet for every rib (one stock sheet, one rivet in the bin)
 * against each rib with its own recommendation (lightest), in weight, rivets and build time.
 */
export function WingTradeTable({ trade }: { trade: WingResult['trade'] }) {
  const u = useUnits();
  const wu = u.system === 'metric' ? 'g' : 'lb';
  const per = trade.perRib;
  const best = trade.uniform.find((r) => sameCandidate(r, trade.recommendedUniform)) ?? null;
  const pairs = new Set(per.choices.map((c) => `${c.gaugeIn} ${c.rivet}`)).size;
  return (
    <View style={{ gap: space.md }} testID="wing-trade">
      <Sheet testID="wing-trade-compare">
        <Txt bold>One for every rib, against each rib its own</Txt>
        <Txt variant="small" testID="wing-trade-uniform">
          {best ? (
            <>
              One for all:{' '}
              <Mono variant="small" bold>
                {u.length(best.gaugeIn)} · {best.rivet}
              </Mono>{' '}
              — <Mono variant="small">{partWeight(best.weightLb, u.system)}</Mono>,{' '}
              <Mono variant="small">{best.rivetCount}</Mono> rivets,{' '}
              <Mono variant="small">{Math.round(best.buildMinutes)}</Mono> min
            </>
          ) : (
            <Txt variant="small" tone="error">
              No one gauge and rivet carries the loads on every rib.
            </Txt>
          )}
        </Txt>
        <Txt variant="small" testID="wing-trade-per-rib">
          Each rib its own ({pairs} different pair{pairs === 1 ? '' : 's'}
          {per.feasible ? '' : ', some ribs with none'}):{' '}
          <Mono variant="small">{partWeight(per.weightLb, u.system)}</Mono>,{' '}
          <Mono variant="small">{per.rivetCount}</Mono> rivets,{' '}
          <Mono variant="small">{Math.round(per.buildMinutes)}</Mono> min
        </Txt>
        {best && per.feasible ? (
          <Txt variant="small" tone="soft" testID="wing-trade-difference">
            One for all weighs{' '}
            <Mono variant="small">{partWeight(Math.abs(best.weightLb - per.weightLb), u.system)}</Mono>{' '}
            {best.weightLb >= per.weightLb ? 'more' : 'less'} and takes{' '}
            <Mono variant="small">{Math.abs(Math.round(best.buildMinutes - per.buildMinutes))}</Mono> min{' '}
            {best.buildMinutes >= per.buildMinutes ? 'more' : 'less'} to build.
          </Txt>
        ) : null}
      </Sheet>
      <GridTable
        label="One gauge and rivet for every rib"
        columns={[
          { key: 'pair', title: 'Gauge · rivet', width: W.pair },
          { key: 'ok', title: 'Every rib', width: W.ok },
          { key: 'bad', title: 'Ribs it does not carry', width: W.bad },
          { key: 'count', title: 'Rivets', width: W.count, align: 'right' },
          { key: 'weight', title: `Weight, ${wu}`, width: W.weight, align: 'right' },
          { key: 'time', title: 'Build, min', width: W.time, align: 'right' },
          { key: 'rank', title: 'Rank', width: W.rank },
        ]}
        rows={trade.uniform.map((r) => {
          const rec = sameCandidate(r, trade.recommendedUniform);
          return {
            key: `${r.gaugeIn}-${r.rivet}`,
            testID: `wing-trade-row-${r.gaugeIn}-${r.rivet}`,
            cells: {
              pair: (
                <Mono variant="small" bold>
                  {u.length(r.gaugeIn)} · {r.rivet}
                </Mono>
              ),
              ok: <YesNoCell yes={r.feasible} />,
              bad: r.infeasibleRibs.length ? (
                <Mono variant="small" tone="error">
                  {r.infeasibleRibs.join(', ')}
                </Mono>
              ) : (
                <Txt variant="small" tone="faint">
                  –
                </Txt>
              ),
              count: <Mono variant="small">{r.rivetCount}</Mono>,
              weight: <Mono variant="small">{trim(partWeight(r.weightLb, u.system))}</Mono>,
              time: <Mono variant="small">{Math.round(r.buildMinutes)}</Mono>,
              rank: rec ? (
                <View style={styles.tag} testID={`wing-trade-row-${r.gaugeIn}-${r.rivet}-recommended`}>
                  <Mono variant="small" bold tone="inverse">
                    1
                  </Mono>
                  <Txt variant="small" bold tone="inverse">
                    for all
                  </Txt>
                </View>
              ) : (
                <Mono variant="small" tone={r.rank === null ? 'faint' : 'ink'}>
                  {r.rank ?? '–'}
                </Mono>
              ),
            },
          };
        })}
      />
      <Txt variant="small" tone="faint">
        Totals over every rib: flanges along the lines, unlightened webs and rivets. Feasible rows rank lightest first,
        fewer rivets between equals.
      </Txt>
    </View>
  );
}

const styles = StyleSheet.create({
  tag: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.xs,
    alignSelf: 'flex-start',
    backgroundColor: colors.accent,
    borderRadius: radius.md,
    paddingHorizontal: space.sm,
    paddingVertical: 2,
  },
});
