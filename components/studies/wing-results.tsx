import { useState } from 'react';
import { View } from 'react-native';
import type { StudyDetail } from '@/db/contracts';
import { space } from '@/constants/theme';
import { Caution, cautionText } from '@/components/ui/caution';
import { Choice } from '@/components/ui/choice';
import { GridTable } from '@/components/ui/grid-table';
import { Section, Sheet } from '@/components/ui/sheet';
import { Notice } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
import { ResultNotes } from './result-notes';
import { CandidateTag, DesignFigures, RecommendedLine, UnreadableResult } from './result-parts';
import { SkinCandidates, SkinPanelTable } from './skin-panel-table';
import { forceNumber } from './study-numbers';
import { sameCandidate, type CandidateKey } from './study-result';
import { WingApplyPanel } from './wing-apply-panel';
import { WingRibTable } from './wing-rib-table';
import { WingTradeTable } from './wing-trade-table';
import { idPart, readWingResult, ribCandidate, ribChoices, skinCandidate, type WingResult } from './wing-result';
import { ZoneTable } from './zone-table';

function Headline({ result }: { result: WingResult }) {
  const u = useUnits();
  const rec = result.trade.recommendedUniform;
  const carried = result.ribs.filter((r) => r.study.recommended).length;
  const skins = result.skins.filter((s) => s.recommended).length;
  const p = result.planform;
  return (
    <Sheet testID="wing-headline">
      <RecommendedLine
        rec={rec}
        lead="Every rib:"
        failure="No one gauge and rivet carries every rib"
        testID="wing-recommended"
      />
      <Txt variant="small" testID="wing-carried">
        <Mono variant="small" bold>
          {carried}
        </Mono>{' '}
        of <Mono variant="small">{result.ribs.length}</Mono> ribs and{' '}
        <Mono variant="small" bold>
          {skins}
        </Mono>{' '}
        of <Mono variant="small">{result.skins.length}</Mono> skin panels have a candidate that carries their loads
      </Txt>
      <Txt variant="small" tone="soft">
        Span <Mono variant="small">{u.length(p.spanIn)}</Mono> · chord{' '}
        <Mono variant="small">{u.lengthNumber(p.rootChordIn)}</Mono>
        {p.tipChordIn !== p.rootChordIn ? (
          <>
            –<Mono variant="small">{u.lengthNumber(p.tipChordIn)}</Mono>
          </>
        ) : null}{' '}
        {u.label('length')} · AR <Mono variant="small">{p.aspectRatio.toFixed(2)}</Mono>
        <DesignFigures design={result.design} />
        {result.airfoil ? <> · {result.airfoil.name}</> : null}
      </Txt>
      <Txt variant="small" tone="soft" testID="wing-tail">
        Tail arm <Mono variant="small">{u.length(result.tail.armIn)}</Mono>, balancing load at 1 g{' '}
        <Mono variant="small">{u.force(result.tail.balancingLoadLb)}</Mono> down (
        {result.tail.estimated ? `estimated from the section's cm_ac ${result.tail.cmAc.toFixed(4)}` : 'as given'})
      </Txt>
    </Sheet>
  );
}

/** n, speed, Mach, the tail's load and the wing's CL in every condition of the envelope. */
function Conditions({ result }: { result: WingResult }) {
  const u = useUnits();
  const fu = u.label('force');
  return (
    <GridTable
      label="Flight conditions"
      testID="wing-conditions"
      columns={[
        { key: 'label', title: 'Condition', width: 200 },
        { key: 'n', title: 'n', width: 60, align: 'right' },
        { key: 'v', title: 'KEAS', width: 60, align: 'right' },
        { key: 'mach', title: 'Mach', width: 60, align: 'right' },
        { key: 'tail', title: `Tail load, ${fu}`, width: 84, align: 'right' },
        { key: 'lift', title: `Wing lift, ${fu}`, width: 84, align: 'right' },
        { key: 'cl', title: 'Wing CL', width: 68, align: 'right' },
      ]}
      rows={result.conditions.map((c) => ({
        key: c.id,
        testID: `wing-condition-${c.id}`,
        cells: {
          label: <Txt variant="small">{c.label}</Txt>,
          n: <Mono variant="small">{c.n.toFixed(2)}</Mono>,
          v: <Mono variant="small">{Math.round(c.speedKeas)}</Mono>,
          mach: <Mono variant="small">{c.mach.toFixed(3)}</Mono>,
          tail: <Mono variant="small">{forceNumber(c.tailLoadLb, u.system)}</Mono>,
          lift: <Mono variant="small">{forceNumber(c.wingLiftLb, u.system)}</Mono>,
          cl: <Mono variant="small">{c.wingCl.toFixed(3)}</Mono>,
        },
      }))}
    />
  );
}

/** Everything a computed wing revision shows; the caution heads it. */
export function WingResults({ detail, latestRevision }: { detail: StudyDetail; latestRevision: number }) {
  const u = useUnits();
  const result = readWingResult(detail.result);
  const [ribName, setRibName] = useState<string | null>(() => result?.ribs[0]?.name ?? null);
  const [skinName, setSkinName] = useState<string | null>(() => result?.skins[0]?.name ?? null);
  const [ribPick, setRibPick] = useState<CandidateKey | null>(null);
  // Another revision has other ribs and panels: start again from the root (noticed while rendering).
  const [shownFor, setShownFor] = useState({ id: detail.id, revision: detail.revision, result: detail.result });
  if (shownFor.id !== detail.id || shownFor.revision !== detail.revision || shownFor.result !== detail.result) {
    setShownFor({ id: detail.id, revision: detail.revision, result: detail.result });
    setRibName(result?.ribs[0]?.name ?? null);
    setSkinName(result?.skins[0]?.name ?? null);
    setRibPick(null);
  }

  if (!result) {
    return <UnreadableResult />;
  }
  const rib = result.ribs.find((r) => r.name === ribName) ?? null;
  const choices = rib ? ribChoices(rib, result.trade.recommendedUniform) : [];
  const ribKey = choices.find((c) => sameCandidate(c.key, ribPick))?.key ?? choices[0]?.key ?? null;
  const ribShown = rib ? ribCandidate(rib, ribKey) : null;
  const panel = result.skins.find((s) => s.name === skinName) ?? null;
  const skinShown = panel ? skinCandidate(panel, panel.recommended) : null;

  return (
    <View style={{ gap: space.xl }} testID="wing-results">
      <Caution testID="study-caution" text={result.caution || cautionText} />
      <Headline result={result} />

      <Section title="Flight conditions" testID="section-conditions">
        <Conditions result={result} />
      </Section>

      <Section title="Ribs root to tip" testID="section-ribs">
        <WingRibTable
          ribs={result.ribs}
          conditions={result.conditions}
          chosen={ribName}
          onChoose={(n) => {
            setRibName(n);
            setRibPick(null);
          }}
        />
      </Section>

      <Section
        title={rib ? `Zones of rib ${rib.name}` : 'Zones of the rib'}
        testID="section-rib-zones"
        aside={ribShown ? <CandidateTag c={ribShown} /> : undefined}
      >
        {!rib ? (
          <Txt tone="soft">Choose a rib in the table.</Txt>
        ) : !ribShown ? (
          <Notice
            tone="error"
            testID="rib-zones-none"
          >{`No candidate carries the loads of rib ${rib.name}: see why in the warnings, or try thicker gauges or larger rivets.`}</Notice>
        ) : (
          <>
            {choices.length > 1 ? (
              <Choice
                testIDPrefix="rib-zones-of"
                label="Zones of"
                value={ribKey ? `${ribKey.gaugeIn}-${ribKey.rivet}` : null}
                onChange={(v) => setRibPick(choices.find((c) => `${c.key.gaugeIn}-${c.key.rivet}` === v)?.key ?? null)}
                options={choices.map((c) => ({
                  value: `${c.key.gaugeIn}-${c.key.rivet}`,
                  key: c.why,
                  label: `${u.length(c.key.gaugeIn)} · ${c.key.rivet}`,
                  hint: c.why === 'uniform' ? 'the one for every rib' : 'its own recommendation',
                }))}
              />
            ) : null}
            <Txt variant="small" tone="soft">
              Chord <Mono variant="small">{u.length(rib.chordIn)}</Mono>, carrying a{' '}
              <Mono variant="small">{u.length(rib.spacingIn)}</Mono> strip of wing.
            </Txt>
            <ZoneTable candidate={ribShown} idPrefix="rib-zone" />
          </>
        )}
      </Section>

      <Section title="Skin panels" testID="section-skins">
        <SkinPanelTable panels={result.skins} chosen={skinName} onChoose={setSkinName} />
      </Section>

      <Section
        title={panel ? `Skin panel ${panel.name}` : 'Skin panel'}
        testID="section-skin-zones"
        aside={skinShown ? <CandidateTag c={skinShown} /> : undefined}
      >
        {!panel ? (
          <Txt tone="soft">Choose a skin panel in the table.</Txt>
        ) : (
          <View style={{ gap: space.lg }} testID={`skin-detail-${idPart(panel.name)}`}>
            <Txt variant="small" tone="soft">
              <Mono variant="small">{u.length(panel.widthIn)}</Mono> wide between {panel.innerRib} and {panel.outerRib};
              the box between the spars <Mono variant="small">{u.length(panel.boxWidthIn)}</Mono> by{' '}
              <Mono variant="small">{u.length(panel.boxDepthIn)}</Mono> deep.
            </Txt>
            <SkinCandidates panel={panel} />
            {skinShown ? (
              <ZoneTable
                candidate={skinShown}
                idPrefix="skin-zone"
                where="along each line: the spar lines from the inner rib, the rib lines aft of the leading edge"
              />
            ) : (
              <Notice
                tone="error"
                testID="skin-zones-none"
              >{`No candidate carries the loads of ${panel.name}: see each candidate's reasons above.`}</Notice>
            )}
          </View>
        )}
      </Section>

      <Section title="Trade across the ribs" testID="section-wing-trade">
        <WingTradeTable trade={result.trade} />
      </Section>

      <Section title="Apply to part design" testID="section-apply">
        <WingApplyPanel
          studyId={detail.id}
          kitModelId={detail.kitModelId}
          kitName={detail.kitName}
          result={result}
          viewingRevision={detail.revision}
          latestRevision={latestRevision}
          initial={skinName ? { kind: 'skin', name: skinName } : null}
        />
      </Section>

      <Section title="Warnings and rules" testID="section-notes">
        <ResultNotes
          warnings={result.warnings}
          candidateWarnings={[...(ribShown?.warnings ?? []), ...(skinShown?.warnings ?? [])]}
          rules={result.rules}
        />
      </Section>
    </View>
  );
}
