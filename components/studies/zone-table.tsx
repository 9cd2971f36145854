import { ScrollView, StyleSheet, View } from 'react-native';
import { colors, hairline, space } from '@/constants/theme';
import { Notice } from '@/components/ui/states';
import { Label, Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
import { forceNumber, marginText, pitchNumber } from './study-numbers';
import type { StudyCandidate } from './study-result';

const W = { span: 110, pitch: 60, n: 60, worst: 100, load: 62, ms: 64 };

function Ms({ value, testID }: { value: number | null; testID: string }) {
  const bad = value !== null && value < 0;
  return (
    <View style={[styles.cell, { width: W.ms }, bad && styles.bad]} testID={testID}>
      <Mono variant="small" bold={bad} tone={bad ? 'error' : 'ink'}>{bad ? '✕' : ''}{marginText(value)}</Mono>
    </View>
  );
}

/** For the shown candidate, each line's zones: where, what pitch, the worst rivet's loads and margins. */
export function ZoneTable({ candidate }: { candidate: StudyCandidate }) {
  const u = useUnits();
  const lu = u.label('length');
  const fu = u.label('force');
  return (
    <View style={{ gap: space.xl }} testID="zone-table">
      {!candidate.feasible ? (
        <Notice tone="error" testID="candidate-reasons">
          <Txt bold tone="error">{u.length(candidate.gaugeIn)} with {candidate.rivet} does not carry the loads:</Txt>
          {candidate.reasons.map((r, i) => <Txt key={i} variant="small">• {r}</Txt>)}
        </Notice>
      ) : null}
      {candidate.lines.map((l, li) => (
        <View key={l.line} style={{ gap: space.xs }} testID={`zone-table-${li}`}>
          <Txt bold>{l.line}</Txt>
          <Txt variant="small" tone="soft">
            drill <Mono variant="small" bold>{l.drill.name}</Mono> (<Mono variant="small">{u.length(l.drill.diameterIn)}</Mono>) · edge distance{' '}
            <Mono variant="small">{u.length(l.layout.edgeDistanceIn)}</Mono> · pitch <Mono variant="small">{u.lengthNumber(l.layout.minPitchIn)}</Mono>–<Mono variant="small">{u.length(l.layout.maxPitchIn)}</Mono>
            {' '}· allowables <Mono variant="small">{u.force(l.allowables.tensionLimitLb)}</Mono> limit, <Mono variant="small">{u.force(l.allowables.tensionUltimateLb)}</Mono> ultimate ({l.allowables.tensionBasis === 'coupons' ? 'from coupons' : 'fallback'})
          </Txt>
          <ScrollView horizontal showsHorizontalScrollIndicator>
            <View style={styles.table}>
              <View style={[styles.row, styles.head]}>
                <Label style={[styles.cell, { width: W.span }]}>From – to, {lu}</Label>
                <Label style={[styles.cell, { width: W.pitch }]}>Pitch</Label>
                <Label style={[styles.cell, { width: W.n }]}>Holes</Label>
                <Label style={[styles.cell, { width: W.worst }]}>Worst rivet</Label>
                <Label style={[styles.cell, { width: W.load }]}>Limit, {fu}</Label>
                <Label style={[styles.cell, { width: W.load }]}>Ult., {fu}</Label>
                <Label style={[styles.cell, { width: W.load }]}>Allow. limit</Label>
                <Label style={[styles.cell, { width: W.load }]}>Allow. ult.</Label>
                <Label style={[styles.cell, { width: W.ms }]}>MS limit</Label>
                <Label style={[styles.cell, { width: W.ms }]}>MS ult.</Label>
              </View>
              {l.zones.map((z, k) => (
                <View key={k} style={styles.row} testID={`zone-row-${li}-${k}`}>
                  <Mono variant="small" style={[styles.cell, { width: W.span }]}>{u.station(z.fromIn)}–{u.station(z.toIn)}</Mono>
                  <Mono variant="small" bold style={[styles.cell, { width: W.pitch }]}>{pitchNumber(z.pitchIn, u.system)}</Mono>
                  <Mono variant="small" style={[styles.cell, { width: W.n }]}>{z.count}</Mono>
                  <Mono variant="small" style={[styles.cell, { width: W.worst }]}>{z.worstHoleId ?? '–'} @ {u.station(z.worstStationIn)}</Mono>
                  <Mono variant="small" style={[styles.cell, { width: W.load }]}>{forceNumber(z.appliedLimitLb, u.system)}</Mono>
                  <Mono variant="small" style={[styles.cell, { width: W.load }]}>{forceNumber(z.appliedUltimateLb, u.system)}</Mono>
                  <Mono variant="small" style={[styles.cell, { width: W.load }]}>{forceNumber(z.limitAllowableLb, u.system)}</Mono>
                  <Mono variant="small" style={[styles.cell, { width: W.load }]}>{forceNumber(z.ultimateAllowableLb, u.system)}</Mono>
                  <Ms value={z.msLimit} testID={`zone-ms-limit-${li}-${k}`} />
                  <Ms value={z.msUltimate} testID={`zone-ms-ultimate-${li}-${k}`} />
                </View>
              ))}
            </View>
          </ScrollView>
          {l.insufficient?.length ? (
            <Txt variant="small" tone="error">
              Too loaded for the closest pitch (3D):{' '}
              {l.insufficient.map((r, i) => (
                <Mono key={i} variant="small" tone="error">{i ? '; ' : ''}{u.station(r.fromIn)}–{u.station(r.toIn)} needs {pitchNumber(r.neededPitchIn, u.system)}</Mono>
              ))}
            </Txt>
          ) : null}
        </View>
      ))}
      <Txt variant="small" tone="faint">
        Stations and pitch in {lu} aft of the rib’s leading edge; loads and allowables per rivet in {fu}. MS = allowable ÷ applied − 1: a negative
        margin (marked ✕) does not hold.
      </Txt>
    </View>
  );
}

const styles = StyleSheet.create({
  table: { borderTopWidth: hairline, borderColor: colors.ink },
  row: { flexDirection: 'row', alignItems: 'center', borderBottomWidth: hairline, borderColor: colors.rule, minHeight: 40 },
  head: { borderColor: colors.ink },
  cell: { paddingHorizontal: space.xs, paddingVertical: space.xs },
  bad: { backgroundColor: colors.errorSoft },
});
