import { StyleSheet, View } from 'react-native';
import type { FastenerLine, Hole } from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { Label, Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';

const surfaceWords = { upper: 'upper surface', lower: 'lower surface', flat: 'flat' } as const;

/** The pitch schedule of each line: from, to, pitch, and how many holes fall in each zone. */
export function ZonesTable({ lines, holes }: { lines: FastenerLine[]; holes?: Hole[] }) {
  const u = useUnits();
  return (
    <View style={{ gap: space.lg }} testID="zones">
      {lines.map((line) => {
        const onLine = (holes ?? []).filter((h) => h.line === line.code);
        return (
          <View key={line.code} style={{ gap: space.xs }} testID={`zones-${line.code}`}>
            <Txt bold>
              <Mono bold>{line.code}</Mono> {line.name}
              <Txt variant="small" tone="soft"> · {surfaceWords[line.surface]} · starts {u.length(line.startIn)} aft · {u.length(line.lengthIn)} long</Txt>
            </Txt>
            <View style={styles.table}>
              <View style={[styles.row, styles.head]}>
                <Label style={styles.c}>From</Label>
                <Label style={styles.c}>To</Label>
                <Label style={styles.c}>Pitch</Label>
                {holes ? <Label style={styles.n}>Holes</Label> : null}
              </View>
              {[...line.zones].sort((a, b) => a.fromIn - b.fromIn).map((z, i) => {
                const n = onLine.filter((h) => h.stationIn >= z.fromIn - 1e-9 && (h.stationIn < z.toIn - 1e-9 || (z.toIn >= line.lengthIn - 1e-9 && h.stationIn <= z.toIn + 1e-9))).length;
                return (
                  <View key={i} style={styles.row}>
                    <Mono style={styles.c}>{u.station(z.fromIn)}</Mono>
                    <Mono style={styles.c}>{u.station(z.toIn)}</Mono>
                    <Mono bold style={styles.c}>{u.lengthNumber(z.pitchIn)}</Mono>
                    {holes ? <Mono style={styles.n}>{n}</Mono> : null}
                  </View>
                );
              })}
            </View>
            <Txt variant="small" tone="faint">Stations in {u.label('length')} from the line’s start.</Txt>
          </View>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  table: { borderTopWidth: hairline, borderColor: colors.ink },
  row: { flexDirection: 'row', borderBottomWidth: hairline, borderColor: colors.rule, paddingVertical: space.xs },
  head: { borderColor: colors.ink },
  c: { flex: 1 },
  n: { width: 64, textAlign: 'right' },
});
