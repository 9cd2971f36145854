import { StyleSheet, View } from 'react-native';
import { colors, space } from '@/constants/theme';
import { GridTable } from '@/components/ui/grid-table';
import { Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
import {
  marginText,
  partWeight,
  pitchNumber,
  shearFlowNumber,
  shearFlowUnit,
  stressNumber,
  stressUnit,
} from './study-numbers';
import { GaugeOverRivet, RowPickButton, YesNoCell } from './table-cells';
import { idPart, skinCandidate, type SkinCandidate, type SkinPanelResult } from './wing-result';

// The longest values in the 15 px mono (9 px a character): "MS20426AD4" under its gauge, "111.00–125.50" under the ribs' names.
const W = { panel: 196, surface: 72, ribs: 128, rec: 108, flow: 76, stress: 84, pitch: 150, ms: 150 };

/** A buckling margin as the trade writes it; a negative one marked ✕ on its own tint. */
function BucklingMargin({ ms, testID, note }: { ms: number | null; testID: string; note?: string }) {
  const bad = ms !== null && ms < 0;
  return (
    <View style={[styles.ms, bad && styles.bad]} testID={testID}>
      <Mono variant="small" bold={bad} tone={bad ? 'error' : 'ink'}>
        {bad ? '✕' : ''}
        {marginText(ms)}
      </Mono>
      {note ? (
        <Txt variant="small" tone="caution">
          {note}
        </Txt>
      ) : null}
    </View>
  );
}

/** The figures of one skin candidate: shear flows, compression, the inter-rivet limit and the buckling margins. */
export function skinFigures(c: SkinCandidate, system: 'imperial' | 'metric', testID: string) {
  return {
    torsion: <Mono variant="small">{shearFlowNumber(c.torsionShearFlowLbPerIn, system)}</Mono>,
    bending: <Mono variant="small">{shearFlowNumber(c.bendingShearFlowLbPerIn, system)}</Mono>,
    compression: (
      <Mono variant="small">{c.compressionPsi > 0 ? stressNumber(c.compressionPsi, system) : '0 (tension side)'}</Mono>
    ),
    pitch:
      c.interRivet.pitchLimitIn === null ? (
        <Txt variant="small" tone="soft">
          none (not in compression)
        </Txt>
      ) : (
        <View>
          <Mono variant="small" bold>
            {pitchNumber(c.interRivet.pitchLimitIn, system)}
          </Mono>
          <Txt variant="small" tone="soft" testID={`${testID}-fixity`}>
            c = {c.interRivet.endFixity.toFixed(1)} ({c.interRivet.source})
          </Txt>
        </View>
      ),
    shearBuckling: (
      <BucklingMargin
        ms={c.shearBuckling.marginOfSafety}
        testID={`${testID}-shear-ms`}
        note={c.shearBuckling.diagonalTension ? 'relies on diagonal tension' : undefined}
      />
    ),
    compressionBuckling: (
      <BucklingMargin ms={c.compressionBuckling.marginOfSafety} testID={`${testID}-compression-ms`} />
    ),
  };
}

/**
 * The skin panels between every two neighbouring ribs, upper and lower: each with its recommended gauge
 * and rivet and that candidate's figures. The panel's name is the button that shows its zones below.
 */
export function SkinPanelTable({
  panels,
  chosen,
  onChoose,
}: {
  panels: SkinPanelResult[];
  chosen: string | null;
  onChoose: (name: string) => void;
}) {
  const u = useUnits();
  const lu = u.label('length');
  const qu = shearFlowUnit(u.system);
  const su = stressUnit(u.system);
  return (
    <View style={{ gap: space.sm }} testID="skin-panel-table">
      <GridTable
        label="Skin panels"
        fold={4}
        testID="skin-panel-grid"
        columns={[
          { key: 'panel', title: 'Panel', width: W.panel },
          { key: 'surface', title: 'Surface', width: W.surface },
          { key: 'ribs', title: `Between ribs, ${lu}`, width: W.ribs },
          { key: 'rec', title: 'Recommended', width: W.rec },
          { key: 'torsion', title: `Torsion q, ${qu}`, width: W.flow, align: 'right' },
          { key: 'bending', title: `Bending q, ${qu}`, width: W.flow, align: 'right' },
          { key: 'compression', title: `Compression, ${su}`, width: W.stress, align: 'right' },
          { key: 'pitch', title: `Inter-rivet pitch limit, ${lu}`, width: W.pitch },
          { key: 'shearBuckling', title: 'Shear buckling MS', width: W.ms },
          { key: 'compressionBuckling', title: 'Compression buckling MS', width: W.ms },
        ]}
        rows={panels.map((p) => {
          const on = p.name === chosen;
          const id = idPart(p.name);
          const rec = skinCandidate(p, p.recommended);
          const none = (
            <Txt variant="small" tone="faint">
              –
            </Txt>
          );
          const figures = rec ? skinFigures(rec, u.system, `skin-${id}`) : null;
          return {
            key: p.name,
            keep: on,
            testID: `skin-row-${id}`,
            cells: {
              panel: (
                <RowPickButton
                  name={p.name}
                  on={on}
                  onPick={onChoose}
                  testID={`skin-${id}`}
                  says={`Skin panel ${p.name}: show its candidates and zones`}
                />
              ),
              surface: <Txt variant="small">{p.surface}</Txt>,
              ribs: (
                <View>
                  <Mono variant="small">
                    {p.innerRib}–{p.outerRib}
                  </Mono>
                  <Mono variant="small" tone="soft">
                    {u.station(p.innerStationIn)}–{u.station(p.outerStationIn)}
                  </Mono>
                </View>
              ),
              rec: rec ? (
                <GaugeOverRivet c={rec} testID={`skin-rec-${id}`} />
              ) : (
                <Txt variant="small" bold tone="error" testID={`skin-rec-${id}`}>
                  ✕ none carries it
                </Txt>
              ),
              torsion: figures?.torsion ?? none,
              bending: figures?.bending ?? none,
              compression: figures?.compression ?? none,
              pitch: figures?.pitch ?? none,
              shearBuckling: figures?.shearBuckling ?? none,
              compressionBuckling: figures?.compressionBuckling ?? none,
            },
          };
        })}
      />
      <Txt variant="small" tone="faint">
        Figures of each panel’s recommended candidate, at limit load. Torsion q = T/2A over the box; bending q passes
        the skin’s share of the bending into the spar caps. The inter-rivet limit is the largest spanwise pitch before
        the skin buckles between two rivets, with the end fixity c of the rivet head and where it comes from. Buckling
        MS = critical ÷ applied − 1 of the whole panel; a panel that relies on diagonal tension carries its shear
        buckled, which this study does not credit.
      </Txt>
    </View>
  );
}

/** Every candidate of one panel as its verdict: the one with zones is the recommendation. */
export function SkinCandidates({ panel }: { panel: SkinPanelResult }) {
  const u = useUnits();
  const id = idPart(panel.name);
  const wu = u.system === 'metric' ? 'g' : 'lb';
  return (
    <GridTable
      label={`Candidates of ${panel.name}`}
      testID={`skin-candidates-${id}`}
      columns={[
        { key: 'pair', title: 'Gauge · rivet', width: 178 },
        { key: 'ok', title: 'Carries it', width: 72 },
        { key: 'count', title: 'Rivets', width: 64, align: 'right' },
        { key: 'weight', title: `Weight, ${wu}`, width: 80, align: 'right' },
        { key: 'why', title: 'Why not', width: 300 },
      ]}
      rows={panel.candidates.map((c) => ({
        key: `${c.gaugeIn}-${c.rivet}`,
        testID: `skin-candidate-${id}-${c.gaugeIn}-${c.rivet}`,
        cells: {
          pair: (
            <Mono
              variant="small"
              bold={
                !!panel.recommended && c.gaugeIn === panel.recommended.gaugeIn && c.rivet === panel.recommended.rivet
              }
            >
              {u.length(c.gaugeIn)} · {c.rivet}
            </Mono>
          ),
          ok: <YesNoCell yes={c.feasible} />,
          count: <Mono variant="small">{c.rivetCount}</Mono>,
          weight: <Mono variant="small">{partWeight(c.weightLb, u.system).replace(/ (lb|g)$/, '')}</Mono>,
          why: c.reasons.length ? (
            <Txt variant="small">{c.reasons.join('; ')}</Txt>
          ) : (
            <Txt variant="small" tone="faint">
              –
            </Txt>
          ),
        },
      }))}
    />
  );
}

const styles = StyleSheet.create({
  ms: { paddingHorizontal: 2, alignItems: 'flex-start' },
  bad: { backgroundColor: colors.errorSoft },
});
