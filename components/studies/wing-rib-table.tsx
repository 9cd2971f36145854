import { View } from 'react-native';
import { space } from '@/constants/theme';
import { GridTable } from '@/components/ui/grid-table';
import { Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
import { forceNumber, momentNumber, momentUnit, shearFlowNumber, shearFlowUnit } from './study-numbers';
import { GaugeOverRivet, RowPickButton, YesNoCell } from './table-cells';
import { idPart, type WingCondition, type WingRib } from './wing-result';

// Wide enough for the longest value of each column in the 15 px mono (9 px a character: a 6-digit moment,
// "MS20470AD4" under its gauge), no wider: the table fits beside the form on a wide screen.
const W = { rib: 100, station: 72, chord: 64, ratio: 56, force: 64, moment: 76, flow: 64, rec: 108, ok: 64 };

/**
 * Every rib root to tip: where it is, the loads there (limit, the largest of any condition) and its own
 * recommendation. The rib's name is the button that shows its zones below.
 */
export function WingRibTable({
  ribs,
  conditions,
  chosen,
  onChoose,
}: {
  ribs: WingRib[];
  conditions: WingCondition[];
  chosen: string | null;
  onChoose: (name: string) => void;
}) {
  const u = useUnits();
  const lu = u.label('length');
  const fu = u.label('force');
  const mu = momentUnit(u.system);
  const qu = shearFlowUnit(u.system);
  const label = (id: string) => conditions.find((c) => c.id === id)?.label ?? id;
  return (
    <View style={{ gap: space.sm }} testID="wing-rib-table">
      <GridTable
        label="Ribs root to tip"
        fold={4}
        testID="wing-rib-grid"
        columns={[
          { key: 'rib', title: 'Rib', width: W.rib },
          { key: 'station', title: `Station, ${lu}`, width: W.station, align: 'right' },
          { key: 'chord', title: `Chord, ${lu}`, width: W.chord, align: 'right' },
          { key: 'ratio', title: 'cl/CL', width: W.ratio, align: 'right' },
          { key: 'shear', title: `Shear, ${fu}`, width: W.force, align: 'right' },
          { key: 'bending', title: `Bending, ${mu}`, width: W.moment, align: 'right' },
          { key: 'torque', title: `Torque, ${mu}`, width: W.moment, align: 'right' },
          { key: 'flow', title: `Shear flow, ${qu}`, width: W.flow, align: 'right' },
          { key: 'rec', title: 'Recommended', width: W.rec },
          { key: 'ok', title: 'Carries it', width: W.ok },
        ]}
        rows={ribs.map((r) => {
          const on = r.name === chosen;
          const id = idPart(r.name);
          const rec = r.study.recommended;
          return {
            key: r.name,
            keep: on,
            testID: `wing-rib-row-${id}`,
            cells: {
              rib: (
                <RowPickButton
                  name={r.name}
                  on={on}
                  onPick={onChoose}
                  testID={`wing-rib-${id}`}
                  says={`Rib ${r.name}: show its zones`}
                />
              ),
              station: <Mono variant="small">{u.station(r.stationIn)}</Mono>,
              chord: <Mono variant="small">{u.lengthNumber(r.chordIn)}</Mono>,
              ratio: <Mono variant="small">{r.clRatio.toFixed(3)}</Mono>,
              shear: (
                <Mono
                  variant="small"
                  accessibilityLabel={`${forceNumber(r.loads.shearLb, u.system)} ${fu}, ${label(r.loads.governing.shear)}`}
                >
                  {forceNumber(r.loads.shearLb, u.system)}
                </Mono>
              ),
              bending: <Mono variant="small">{momentNumber(r.loads.bendingInLb, u.system)}</Mono>,
              torque: <Mono variant="small">{momentNumber(r.loads.torqueInLb, u.system)}</Mono>,
              flow: <Mono variant="small">{shearFlowNumber(r.loads.shearFlowLbPerIn, u.system)}</Mono>,
              rec: rec ? (
                <GaugeOverRivet c={rec} testID={`wing-rib-rec-${id}`} />
              ) : (
                <Txt variant="small" tone="error" testID={`wing-rib-rec-${id}`}>
                  none
                </Txt>
              ),
              ok: <YesNoCell yes={!!rec} />,
            },
          };
        })}
      />
      <Txt variant="small" tone="faint">
        Station: outboard of the centre line. cl/CL: the section’s share of the wing’s lift coefficient (Schrenk). Loads
        at limit, the largest of every condition ({governingSummary(ribs, label)}). Shear flow: the torque’s in the box
        between the spars, q = T/2A.
      </Txt>
    </View>
  );
}

/** Which conditions govern, said once under the table rather than in every row. */
function governingSummary(ribs: WingRib[], label: (id: string) => string): string {
  const said = (pick: (r: WingRib) => string) => [...new Set(ribs.map(pick))].map(label).join(', ');
  return `shear: ${said((r) => r.loads.governing.shear)}; bending: ${said((r) => r.loads.governing.bending)}; torque: ${said((r) => r.loads.governing.torque)}`;
}
