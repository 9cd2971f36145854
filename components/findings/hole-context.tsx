import { StyleSheet, View } from 'react-native';
import { holeStatuses, measureKeys, type FindingDetail, type HoleInContext, type HoleStatus } from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { Caution } from '@/components/ui/caution';
import { HoleMark, holeStatusLabels } from '@/components/ui/status-mark';
import { Label, Mono, Txt } from '@/components/ui/text';
import { formatDiameters } from '@/constants/units';
import { useUnits } from '@/hooks/use-units';
import { basisOfFinding } from './measure-basis';
import { MeasurementJudgement } from './measurement-line';

export type HoleNumbers = {
  pitchBefore: number | null;
  pitchAfter: number | null;
  pitchBeforeInDiameters: number | null;
  pitchAfterInDiameters: number | null;
};

/** Distances to a hole's neighbours along its line, and in drill diameters: what an inspector reads first. */
export function holeNumbers(
  h: Pick<HoleInContext, 'stationIn' | 'prevStationIn' | 'nextStationIn'>,
  drillDiameterIn: number,
): HoleNumbers {
  const d = drillDiameterIn;
  const pitchBefore = h.prevStationIn == null ? null : h.stationIn - h.prevStationIn;
  const pitchAfter = h.nextStationIn == null ? null : h.nextStationIn - h.stationIn;
  return {
    pitchBefore,
    pitchAfter,
    pitchBeforeInDiameters: pitchBefore == null || !(d > 0) ? null : pitchBefore / d,
    pitchAfterInDiameters: pitchAfter == null || !(d > 0) ? null : pitchAfter / d,
  };
}

function Row({ label, value, extra, testID }: { label: string; value: string; extra?: string; testID?: string }) {
  return (
    <View style={styles.row} testID={testID}>
      <Txt variant="small" tone="soft" style={{ flex: 1 }}>
        {label}
      </Txt>
      <Mono bold>{value}</Mono>
      <Mono variant="small" tone="soft" style={{ width: 64, textAlign: 'right' }}>
        {extra ?? ''}
      </Mono>
    </View>
  );
}

const isHoleStatus = (s: string): s is HoleStatus => (holeStatuses as readonly string[]).includes(s);

/** One hole of the finding where it sits: line, station, its neighbours and the pitch to them. */
function HoleLine({ h, drillDiameterIn }: { h: HoleInContext; drillDiameterIn: number }) {
  const u = useUnits();
  const n = holeNumbers(h, drillDiameterIn);
  return (
    <View style={styles.hole} testID={`context-hole-${h.holeId}`}>
      <View style={styles.holeHead}>
        {isHoleStatus(h.status) ? <HoleMark status={h.status} size={20} decorative /> : null}
        <Mono bold variant="heading">
          {h.holeId}
        </Mono>
        <Txt variant="small" tone="soft">
          line{' '}
          <Mono variant="small" bold>
            {h.line}
          </Mono>{' '}
          · station{' '}
          <Mono variant="small" bold>
            {u.station(h.stationIn)}
          </Mono>
          {isHoleStatus(h.status) ? ` · ${holeStatusLabels[h.status].toLowerCase()}` : ''}
        </Txt>
      </View>
      <Row
        label={h.prevStationIn == null ? 'Hole before: none (line start)' : 'Pitch to the hole before'}
        value={n.pitchBefore == null ? '–' : u.length(n.pitchBefore)}
        extra={n.pitchBeforeInDiameters == null ? '' : formatDiameters(n.pitchBeforeInDiameters)}
        testID={`context-hole-${h.holeId}-pitch-before`}
      />
      <Row
        label={h.nextStationIn == null ? 'Hole after: none (line end)' : 'Pitch to the hole after'}
        value={n.pitchAfter == null ? '–' : u.length(n.pitchAfter)}
        extra={n.pitchAfterInDiameters == null ? '' : formatDiameters(n.pitchAfterInDiameters)}
        testID={`context-hole-${h.holeId}-pitch-after`}
      />
    </View>
  );
}

/** Every hole of the finding where it sits, the layout numbers of the part, and what was measured against its rule. */
export function HoleContext({ f }: { f: FindingDetail }) {
  const u = useUnits();
  const c = f.context;
  const d = c.drillDiameterIn;
  const basis = basisOfFinding(c);
  const measured = measureKeys.filter((k) => typeof f.measurements[k] === 'number');
  return (
    <View style={{ gap: space.md }} testID="hole-context">
      <View style={{ gap: space.sm }}>
        {c.holes.map((h) => (
          <HoleLine key={h.holeId} h={h} drillDiameterIn={d} />
        ))}
      </View>
      <View style={styles.table}>
        <Row
          label="Edge distance (as laid out)"
          value={u.length(c.edgeDistanceIn)}
          extra={d > 0 ? formatDiameters(c.edgeDistanceIn / d) : ''}
          testID="context-edge-distance"
        />
        <Row label="Drill diameter" value={u.length(d)} />
        <Row
          label="Rivet"
          value={c.rivetSpec}
          extra={c.rivetDiameterIn == null ? '' : `⌀ ${u.lengthNumber(c.rivetDiameterIn)}`}
          testID="context-rivet"
        />
        {c.countersunk ? <Row label="Head" value="countersunk" /> : null}
        <Row label="Gauge · material" value={`${u.length(c.gaugeIn)} ${c.material}`} />
      </View>
      <Txt variant="small" tone="faint">
        D = drill diameter. Ratios are of the layout on the traveler, not of the hole as found.
      </Txt>
      {measured.length ? (
        <View style={{ gap: space.sm }} testID="finding-measurements">
          <Label>As measured</Label>
          {measured.map((k) => (
            <MeasurementJudgement key={k} measure={k} value={f.measurements[k]} basis={basis} showValue />
          ))}
        </View>
      ) : null}
      <Caution />
    </View>
  );
}

const styles = StyleSheet.create({
  table: { borderTopWidth: hairline, borderColor: colors.ink },
  hole: { gap: 2, paddingBottom: space.sm, borderBottomWidth: hairline, borderColor: colors.rule },
  holeHead: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  row: {
    flexDirection: 'row',
    alignItems: 'baseline',
    gap: space.sm,
    paddingVertical: space.xs,
    borderBottomWidth: hairline,
    borderColor: colors.rule,
    flexWrap: 'wrap',
  },
});
