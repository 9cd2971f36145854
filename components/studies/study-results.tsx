import { useState } from 'react';
import { View } from 'react-native';
import type { StudyDetail } from '@/db/contracts';
import { space } from '@/constants/theme';
import { Caution, cautionText } from '@/components/ui/caution';
import { Section, Sheet } from '@/components/ui/sheet';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { useStudyCandidateQuery } from '@/hooks/queries/studies';
import { useUnits } from '@/hooks/use-units';
import { ApplyPanel } from './apply-panel';
import { LoadPlot } from './load-plot';
import { PressurePicture } from './pressure-picture';
import { ResultNotes } from './result-notes';
import { CandidateTag, DesignFigures, RecommendedLine, UnreadableResult } from './result-parts';
import {
  findCandidate,
  initialCandidate,
  readStudyResult,
  sameCandidate,
  type CandidateKey,
  type StudyCandidate,
  type StudyResult,
} from './study-result';
import { TradeTable } from './trade-table';
import { ZoneTable } from './zone-table';
import { ZonesDrawing } from './zones-drawing';

function Headline({ result, shown }: { result: StudyResult; shown: CandidateKey | null }) {
  const u = useUnits();
  const rec = result.recommended;
  const feasible = result.trade.filter((r) => r.feasible).length;
  return (
    <Sheet testID="study-headline">
      <RecommendedLine
        rec={rec}
        lead="Recommended:"
        failure="No candidate carries the loads"
        testID="study-recommended"
      />
      <Txt variant="small" tone="soft">
        <Mono variant="small">{feasible}</Mono> of <Mono variant="small">{result.trade.length}</Mono> gauge and rivet
        pairs carry the loads
        <DesignFigures design={result.design} />
        {result.airfoil ? (
          <>
            {' '}
            · {result.airfoil.name}, <Mono variant="small">{result.airfoil.panels}</Mono> panels
          </>
        ) : null}
      </Txt>
      {shown && !sameCandidate(shown, rec) ? (
        <Txt variant="small" testID="study-shown">
          Pictures and zones show{' '}
          <Mono variant="small" bold>
            {u.length(shown.gaugeIn)} · {shown.rivet}
          </Mono>{' '}
          (chosen in the trade table).
        </Txt>
      ) : null}
    </Sheet>
  );
}

/** Everything a computed revision shows, pictures first; the caution heads it. */
export function StudyResults({ detail, latestRevision }: { detail: StudyDetail; latestRevision: number }) {
  const units = useUnits();
  const u = units.length;
  const result = readStudyResult(detail.result);
  const [chosen, setChosen] = useState<CandidateKey | null>(() => (result ? initialCandidate(result) : null));
  // Another revision has other candidates: start again from its recommendation (noticed while rendering).
  const [shownFor, setShownFor] = useState({ id: detail.id, revision: detail.revision, result: detail.result });
  if (shownFor.id !== detail.id || shownFor.revision !== detail.revision || shownFor.result !== detail.result) {
    setShownFor({ id: detail.id, revision: detail.revision, result: detail.result });
    setChosen(result ? initialCandidate(result) : null);
  }
  // The stored result keeps the holes of the recommended candidate only; another one's come from the server.
  const stored = result ? findCandidate(result, chosen) : null;
  const needsHoles = !!stored && stored.holesStored === false;
  const fetched = useStudyCandidateQuery(
    detail.id,
    detail.revision,
    needsHoles && stored ? { gaugeIn: stored.gaugeIn, rivet: stored.rivet } : null,
  );

  if (!result) {
    return <UnreadableResult />;
  }
  const candidate = stored;
  const withHoles: StudyCandidate | null = needsHoles ? (fetched.data ?? null) : candidate;
  // The pictures need every hole: while they are worked out, say so (the zone table below has the zones).
  const holesState = (what: string) =>
    fetched.isError ? (
      <ErrorState
        title={`The holes of this candidate did not load, so the ${what} cannot be drawn`}
        error={fetched.error}
        onRetry={() => void fetched.refetch()}
      />
    ) : (
      <LoadingState
        what={`Working out every hole of ${candidate ? `${u(candidate.gaugeIn)} · ${candidate.rivet}` : 'the candidate'} for the ${what}`}
      />
    );

  return (
    <View style={{ gap: space.xl }} testID="study-results">
      <Caution testID="study-caution" text={result.caution || cautionText} />
      <Headline result={result} shown={chosen} />

      <Section title="Pressure on the rib" testID="section-pressure">
        <PressurePicture result={result} internalCp={detail.inputs.rib.internalCp ?? 0} />
      </Section>

      <Section
        title="Load per rivet against the allowables"
        testID="section-loads"
        aside={candidate ? <CandidateTag c={candidate} /> : undefined}
      >
        {!candidate ? (
          <Txt tone="soft">Choose a candidate in the trade table.</Txt>
        ) : withHoles ? (
          <LoadPlot candidate={withHoles} chordIn={result.outline.chordIn} />
        ) : (
          holesState('load plot')
        )}
      </Section>

      <Section
        title="Pitch zones on the rib"
        testID="section-zones"
        aside={candidate ? <CandidateTag c={candidate} /> : undefined}
      >
        {!candidate ? null : withHoles ? (
          <ZonesDrawing
            outline={result.outline.points}
            chordIn={result.outline.chordIn}
            candidate={withHoles}
            lines={result.lines}
          />
        ) : (
          holesState('drawing')
        )}
      </Section>

      <Section title="Gauge and rivet trade" testID="section-trade">
        <TradeTable rows={result.trade} recommended={result.recommended} chosen={chosen} onChoose={setChosen} />
      </Section>

      <Section
        title="Zones, loads and margins"
        testID="section-zone-table"
        aside={candidate ? <CandidateTag c={candidate} /> : undefined}
      >
        {candidate ? (
          <ZoneTable candidate={candidate} />
        ) : (
          <Txt tone="soft">Choose a candidate in the trade table.</Txt>
        )}
      </Section>

      <Section title="Apply to part design" testID="section-apply">
        <ApplyPanel
          studyId={detail.id}
          kitModelId={detail.kitModelId}
          kitName={detail.kitName}
          candidate={candidate}
          viewingRevision={detail.revision}
          latestRevision={latestRevision}
        />
      </Section>

      <Section title="Warnings and rules" testID="section-notes">
        <ResultNotes warnings={result.warnings} candidateWarnings={candidate?.warnings ?? []} rules={result.rules} />
      </Section>
    </View>
  );
}
