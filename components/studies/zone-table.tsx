import { StyleSheet, View } from 'react-native';
import { colors, space } from '@/constants/theme';
import { GridTable } from '@/components/ui/grid-table';
import { Notice } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
import { forceNumber, marginText, pitchNumber } from './study-numbers';
import type { StudyCandidate } from './study-result';

const W = { span: 120, pitch: 64, n: 60, worst: 120, load: 72, ms: 72 };

function Ms({ value, testID }: { value: number | null; testID: string }) {
  const bad = value !== null && value < 0;
  return (
    <View style={[styles.ms, bad && styles.bad]} testID={testID}>
      <Mono variant="small" bold={bad} tone={bad ? 'error' : 'ink'}>
        {bad ? '✕' : ''}
        {marginText(value)}
      </Mono>
    </View>
  );
}

/** What the table reads of a candidate: a rib's, or a skin panel's (whose lines are schedules of the same shape). */
export type ZoneCandidate = Pick<StudyCandidate, 'gaugeIn' | 'rivet' | 'feasible' | 'reasons' | 'lines'>;

/**
 * For the shown candidate, each line's zones: where, what pitch, the worst rivet's loads and margins.
 * `idPrefix` keeps testIDs apart where two tables show at once (a wing's rib and its skin panel); `where`
 * says what the stations are measured from.
 */
export function ZoneTable({
  candidate,
  idPrefix = 'zone',
  where,
}: {
  candidate: ZoneCandidate;
  idPrefix?: string;
  where?: string;
}) {
  const u = useUnits();
  const lu = u.label('length');
  const fu = u.label('force');
  return (
    <View style={{ gap: space.xl }} testID={`${idPrefix}-table`}>
      {!candidate.feasible ? (
        <Notice tone="error" testID={idPrefix === 'zone' ? 'candidate-reasons' : `${idPrefix}-reasons`}>
          <Txt bold tone="error">
            {u.length(candidate.gaugeIn)} with {candidate.rivet} does not carry the loads:
          </Txt>
          {candidate.reasons.map((r, i) => (
            <Txt key={i} variant="small">
              • {r}
            </Txt>
          ))}
        </Notice>
      ) : null}
      {candidate.lines.map((l, li) => (
        <View key={l.line} style={{ gap: space.xs }} testID={`${idPrefix}-table-${li}`}>
          <Txt bold>{l.line}</Txt>
          <Txt variant="small" tone="soft">
            drill{' '}
            <Mono variant="small" bold>
              {l.drill.name}
            </Mono>{' '}
            (<Mono variant="small">{u.length(l.drill.diameterIn)}</Mono>) · edge distance{' '}
            <Mono variant="small">{u.length(l.layout.edgeDistanceIn)}</Mono> · pitch{' '}
            <Mono variant="small">{u.lengthNumber(l.layout.minPitchIn)}</Mono>–
            <Mono variant="small">{u.length(l.layout.maxPitchIn)}</Mono> · allowables{' '}
            <Mono variant="small">{u.force(l.allowables.tensionLimitLb)}</Mono> limit,{' '}
            <Mono variant="small">{u.force(l.allowables.tensionUltimateLb)}</Mono> ultimate (
            {l.allowables.tensionBasis === 'coupons' ? 'from coupons' : 'fallback'})
          </Txt>
          <GridTable
            label={`Zones of ${l.line}`}
            columns={[
              { key: 'span', title: `From – to, ${lu}`, width: W.span },
              { key: 'pitch', title: 'Pitch', width: W.pitch, align: 'right' },
              { key: 'n', title: 'Holes', width: W.n, align: 'right' },
              { key: 'worst', title: 'Worst rivet', width: W.worst },
              { key: 'limit', title: `Limit, ${fu}`, width: W.load, align: 'right' },
              { key: 'ult', title: `Ult., ${fu}`, width: W.load, align: 'right' },
              { key: 'allowLimit', title: 'Allow. limit', width: W.load, align: 'right' },
              { key: 'allowUlt', title: 'Allow. ult.', width: W.load, align: 'right' },
              { key: 'msLimit', title: 'MS limit', width: W.ms, align: 'right' },
              { key: 'msUlt', title: 'MS ult.', width: W.ms, align: 'right' },
            ]}
            rows={l.zones.map((z, k) => ({
              key: String(k),
              testID: `${idPrefix}-row-${li}-${k}`,
              cells: {
                span: (
                  <Mono variant="small">
                    {u.station(z.fromIn)}–{u.station(z.toIn)}
                  </Mono>
                ),
                pitch: (
                  <Mono variant="small" bold>
                    {pitchNumber(z.pitchIn, u.system)}
                  </Mono>
                ),
                n: <Mono variant="small">{z.count}</Mono>,
                worst: (
                  <Mono variant="small">
                    {z.worstHoleId ?? '–'} @ {u.station(z.worstStationIn)}
                  </Mono>
                ),
                limit: <Mono variant="small">{forceNumber(z.appliedLimitLb, u.system)}</Mono>,
                ult: <Mono variant="small">{forceNumber(z.appliedUltimateLb, u.system)}</Mono>,
                allowLimit: <Mono variant="small">{forceNumber(z.limitAllowableLb, u.system)}</Mono>,
                allowUlt: <Mono variant="small">{forceNumber(z.ultimateAllowableLb, u.system)}</Mono>,
                msLimit: <Ms value={z.msLimit} testID={`${idPrefix}-ms-limit-${li}-${k}`} />,
                msUlt: <Ms value={z.msUltimate} testID={`${idPrefix}-ms-ultimate-${li}-${k}`} />,
              },
            }))}
          />
          {l.insufficient?.length ? (
            <Txt variant="small" tone="error">
              Too loaded for the closest pitch (3D):{' '}
              {l.insufficient.map((r, i) => (
                <Mono key={i} variant="small" tone="error">
                  {i ? '; ' : ''}
                  {u.station(r.fromIn)}–{u.station(r.toIn)} needs {pitchNumber(r.neededPitchIn, u.system)}
                </Mono>
              ))}
            </Txt>
          ) : null}
        </View>
      ))}
      <Txt variant="small" tone="faint">
        Stations and pitch in {lu} {where ?? 'aft of the rib’s leading edge'}; loads and allowables per rivet in {fu}.
        MS = allowable ÷ applied − 1: a negative margin (marked ✕) does not hold.
      </Txt>
    </View>
  );
}

const styles = StyleSheet.create({
  ms: { paddingHorizontal: 2 },
  bad: { backgroundColor: colors.errorSoft },
});
