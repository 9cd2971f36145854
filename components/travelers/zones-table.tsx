import { View } from 'react-native';
import type { FastenerLine, Hole } from '@/db/contracts';
import { space } from '@/constants/theme';
import { GridTable, type GridColumn } from '@/components/ui/grid-table';
import { Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';

const surfaceWords = { upper: 'upper surface', lower: 'lower surface', flat: 'flat' } as const;

/** The pitch schedule of each line: from, to, pitch, and how many holes fall in each zone. */
export function ZonesTable({ lines, holes }: { lines: FastenerLine[]; holes?: Hole[] }) {
  const u = useUnits();
  const lu = u.label('length');
  const columns: GridColumn[] = [
    { key: 'from', title: `From, ${lu}`, width: 88, align: 'right' },
    { key: 'to', title: `To, ${lu}`, width: 88, align: 'right' },
    { key: 'pitch', title: `Pitch, ${lu}`, width: 88, align: 'right' },
    ...(holes ? [{ key: 'n', title: 'Holes', width: 64, align: 'right' as const }] : []),
  ];
  return (
    <View style={{ gap: space.lg }} testID="zones">
      {lines.map((line) => {
        const onLine = (holes ?? []).filter((h) => h.line === line.code);
        return (
          <View key={line.code} style={{ gap: space.xs }} testID={`zones-${line.code}`}>
            <Txt bold>
              <Mono bold>{line.code}</Mono> {line.name}
              <Txt variant="small" tone="soft">
                {' '}
                · {surfaceWords[line.surface]} · starts <Mono variant="small">{u.length(line.startIn)}</Mono> aft ·{' '}
                <Mono variant="small">{u.length(line.lengthIn)}</Mono> long
              </Txt>
            </Txt>
            <GridTable
              label={`Pitch schedule of line ${line.code}`}
              columns={columns}
              rows={[...line.zones]
                .sort((a, b) => a.fromIn - b.fromIn)
                .map((z, i) => {
                  const n = onLine.filter(
                    (h) =>
                      h.stationIn >= z.fromIn - 1e-9 &&
                      (h.stationIn < z.toIn - 1e-9 || (z.toIn >= line.lengthIn - 1e-9 && h.stationIn <= z.toIn + 1e-9)),
                  ).length;
                  return {
                    key: String(i),
                    cells: {
                      from: <Mono>{u.station(z.fromIn)}</Mono>,
                      to: <Mono>{u.station(z.toIn)}</Mono>,
                      pitch: <Mono bold>{u.lengthNumber(z.pitchIn)}</Mono>,
                      n: <Mono>{n}</Mono>,
                    },
                  };
                })}
            />
            <Txt variant="small" tone="soft">
              Stations in {lu} from the line’s start.
            </Txt>
          </View>
        );
      })}
    </View>
  );
}
