import { StyleSheet, View } from 'react-native';
import type { FindingDetail } from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { Caution } from '@/components/ui/caution';
import { Label, Mono, Txt } from '@/components/ui/text';
import { formatDiameters } from '@/constants/units';
import { useUnits } from '@/hooks/use-units';

export type HoleNumbers = {
  pitchBefore: number | null;
  pitchAfter: number | null;
  edgeInDiameters: number;
  pitchBeforeInDiameters: number | null;
  pitchAfterInDiameters: number | null;
};

/** Distances to the neighbouring holes, and the layout ratios an inspector reads first. */
export function holeNumbers(c: FindingDetail['context']): HoleNumbers {
  const d = c.drillDiameterIn;
  const pitchBefore = c.prevStationIn == null ? null : c.stationIn - c.prevStationIn;
  const pitchAfter = c.nextStationIn == null ? null : c.nextStationIn - c.stationIn;
  return {
    pitchBefore,
    pitchAfter,
    edgeInDiameters: d > 0 ? c.edgeDistanceIn / d : Number.NaN,
    pitchBeforeInDiameters: pitchBefore == null || !(d > 0) ? null : pitchBefore / d,
    pitchAfterInDiameters: pitchAfter == null || !(d > 0) ? null : pitchAfter / d,
  };
}

function Row({ label, value, extra, testID }: { label: string; value: string; extra?: string; testID?: string }) {
  return (
    <View style={styles.row} testID={testID}>
      <Txt variant="small" tone="soft" style={{ flex: 1 }}>{label}</Txt>
      <Mono bold>{value}</Mono>
      <Mono variant="small" tone="soft" style={{ width: 64, textAlign: 'right' }}>{extra ?? ''}</Mono>
    </View>
  );
}

/** The suspect hole where it sits: its line and station, its neighbours, and the layout numbers. */
export function HoleContext({ f }: { f: FindingDetail }) {
  const u = useUnits();
  const c = f.context;
  const n = holeNumbers(c);
  return (
    <View style={{ gap: space.sm }} testID="hole-context">
      <View style={styles.head}>
        <View style={{ flex: 1 }}>
          <Label>Hole</Label>
          <Mono bold variant="title">{f.holeIds.join(' ')}</Mono>
        </View>
        <View style={{ flex: 1 }}>
          <Label>Line · station</Label>
          <Mono bold>{c.line} · {u.length(c.stationIn)}</Mono>
        </View>
      </View>
      <View style={styles.table}>
        <Row label="Station of the hole before" value={c.prevStationIn == null ? 'none (line start)' : u.length(c.prevStationIn)} />
        <Row label="Pitch to the hole before" value={n.pitchBefore == null ? '–' : u.length(n.pitchBefore)} extra={n.pitchBeforeInDiameters == null ? '' : formatDiameters(n.pitchBeforeInDiameters)} testID="pitch-before" />
        <Row label="Station of the hole after" value={c.nextStationIn == null ? 'none (line end)' : u.length(c.nextStationIn)} />
        <Row label="Pitch to the hole after" value={n.pitchAfter == null ? '–' : u.length(n.pitchAfter)} extra={n.pitchAfterInDiameters == null ? '' : formatDiameters(n.pitchAfterInDiameters)} testID="pitch-after" />
        <Row label="Edge distance (as laid out)" value={u.length(c.edgeDistanceIn)} extra={formatDiameters(n.edgeInDiameters)} testID="context-edge-distance" />
        <Row label="Drill diameter" value={u.length(c.drillDiameterIn)} />
        <Row label="Rivet" value={c.rivetSpec} />
        <Row label="Gauge · material" value={`${u.length(c.gaugeIn)} ${c.material}`} />
      </View>
      <Txt variant="small" tone="faint">D = drill diameter. Ratios are of the layout on the traveler, not of the hole as found.</Txt>
      <Caution />
    </View>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', gap: space.md },
  table: { borderTopWidth: hairline, borderColor: colors.ink },
  row: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm, paddingVertical: space.xs, borderBottomWidth: hairline, borderColor: colors.rule, flexWrap: 'wrap' },
});
