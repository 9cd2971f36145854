import { useRouter } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { partKindLabels, type ApplyStudyInput, type PartDesignSummary, type Revision } from '@/db/contracts';
import { space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Choice } from '@/components/ui/choice';
import { Field } from '@/components/ui/field';
import { Sheet } from '@/components/ui/sheet';
import { EmptyState, ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { ApiError, errorMessage } from '@/lib/api-client';
import { useDesignsQuery } from '@/hooks/queries/designs';
import { useStudyApplyMutation } from '@/hooks/queries/studies';
import { useUnits } from '@/hooks/use-units';
import { pitchNumber } from './study-numbers';
import type { StudyCandidate } from './study-result';

/** A refusal from the server said as it is; a 409 is the server explaining why not, in its own words. */
export function applyErrorText(e: unknown): string {
  if (e instanceof ApiError && e.status === 409) return `Not applied: ${e.message}`;
  return errorMessage(e);
}

/** The server applies a study's latest revision only: on an older one, say so instead of offering it. */
export function LatestOnlyNotice({ latestRevision }: { latestRevision: number }) {
  return (
    <Notice tone="caution" testID="apply-latest-only">
      {`Applying uses the latest revision (${latestRevision}) of the study. Open it, or compute these inputs again as a new revision, to apply them.`}
    </Notice>
  );
}

/**
 * Sending an apply and keeping its answer: `send` writes into `target`, `done` is the draft revision it
 * made, `fresh` forgets both (another choice makes the last answer stale).
 */
export function useApplyToDesign(studyId: string) {
  const apply = useStudyApplyMutation(studyId);
  const [done, setDone] = useState<{ rev: Revision; partNumber: string } | null>(null);
  const send = (target: PartDesignSummary, body: Omit<ApplyStudyInput, 'partDesignId'>) => {
    setDone(null);
    apply.mutate(
      { ...body, partDesignId: target.id },
      { onSuccess: (rev) => setDone({ rev, partNumber: target.partNumber }) },
    );
  };
  const fresh = () => {
    setDone(null);
    apply.reset();
  };
  return { apply, done, send, fresh };
}

/** The kit's part designs to choose from, each with its kind and latest revision. */
export function DesignChoice({
  designs,
  value,
  onChange,
  hint,
}: {
  designs: PartDesignSummary[];
  value: string | null;
  onChange: (id: string) => void;
  hint?: string;
}) {
  return (
    <Field label="Part design to receive it" hint={hint}>
      <Choice
        testIDPrefix="apply-design"
        label="Part design to receive it"
        value={value}
        onChange={onChange}
        options={designs.map((d) => ({
          value: d.id,
          key: d.partNumber,
          label: `${d.partNumber} · ${d.name}`,
          hint: `${partKindLabels[d.kind]}${d.latest ? ` · latest ${d.latest.letter} ${d.latest.status}` : ''}`,
        }))}
      />
    </Field>
  );
}

/** No part design to apply to: the way to make one in the catalogue. */
export function NoDesigns({ kitModelId, title, body }: { kitModelId: string; title: string; body: string }) {
  const router = useRouter();
  return (
    <EmptyState
      title={title}
      body={body}
      action={
        <Button
          label="New part design"
          variant="secondary"
          onPress={() => router.push(`/catalogue/designs/new?kitModelId=${kitModelId}`)}
          testID="apply-new-design"
        />
      }
    />
  );
}

/** The end of the "Writes … " sentence over the button: what else goes, and where. */
export function WritesInto({ lines, partNumber }: { lines: number; partNumber?: string }) {
  return (
    <>
      , its drill, edge distance and the zones of {lines} line{lines === 1 ? '' : 's'} into{' '}
      {partNumber ? <Mono bold>{partNumber}</Mono> : 'the chosen part'}’s draft revision (a new draft when it has none).
      Published revisions stay as they are.
    </>
  );
}

/** The refusal, the button and, once applied, what the draft revision now holds. */
export function ApplyFooter({
  state,
  label,
  disabled,
  onApply,
}: {
  state: ReturnType<typeof useApplyToDesign>;
  label: string;
  disabled: boolean;
  onApply: () => void;
}) {
  const router = useRouter();
  const { apply, done } = state;
  return (
    <>
      {apply.isError ? (
        <Notice tone="error" testID="apply-error">
          {applyErrorText(apply.error)}
        </Notice>
      ) : null}
      <Button
        label={label}
        busyLabel="Applying"
        busy={apply.isPending}
        disabled={disabled}
        onPress={onApply}
        testID="apply-study"
      />
      {done ? (
        <AppliedRevision
          rev={done.rev}
          partNumber={done.partNumber}
          onOpen={() => router.push(`/catalogue/designs/${done.rev.partDesignId}`)}
        />
      ) : null}
    </>
  );
}

/**
 * "Apply to part design": the shown candidate's gauge, rivet, drill, edge distance and zones go into
 * the chosen part design's draft revision (a new draft when it has none), with this study as its basis.
 */
export function ApplyPanel({
  studyId,
  kitModelId,
  kitName,
  candidate,
  viewingRevision,
  latestRevision,
}: {
  studyId: string;
  kitModelId: string;
  kitName: string;
  candidate: StudyCandidate | null;
  viewingRevision: number;
  latestRevision: number;
}) {
  const u = useUnits();
  const designs = useDesignsQuery(kitModelId);
  const state = useApplyToDesign(studyId);
  const [designId, setDesignId] = useState<string | null>(null);

  if (viewingRevision !== latestRevision) return <LatestOnlyNotice latestRevision={latestRevision} />;
  if (designs.isPending) return <LoadingState what="Loading the kit's part designs" />;
  if (designs.isError) return <ErrorState error={designs.error} onRetry={() => void designs.refetch()} />;
  if (!designs.data.length) {
    return (
      <NoDesigns
        kitModelId={kitModelId}
        title={`No part designs in ${kitName} yet.`}
        body="Make the part design in the catalogue first; then apply the study to it."
      />
    );
  }
  const target = designs.data.find((d) => d.id === designId) ?? null;

  return (
    <View style={{ gap: space.md }} testID="apply-panel">
      <DesignChoice
        designs={designs.data}
        value={designId}
        onChange={(id) => {
          setDesignId(id);
          state.fresh();
        }}
      />
      {candidate ? (
        <Txt testID="apply-what">
          Writes <Mono bold>{u.length(candidate.gaugeIn)}</Mono> with <Mono bold>{candidate.rivet}</Mono>
          <WritesInto lines={candidate.lines.length} partNumber={target?.partNumber} />
        </Txt>
      ) : (
        <Txt tone="soft">Choose a candidate in the table first.</Txt>
      )}
      {candidate && !candidate.feasible ? (
        <Notice
          tone="error"
          testID="apply-not-feasible"
        >{`${u.length(candidate.gaugeIn)} with ${candidate.rivet} does not carry the loads, so it cannot be applied. Choose a row marked “yes”.`}</Notice>
      ) : null}
      <ApplyFooter
        state={state}
        label={target && candidate ? `Apply to ${target.partNumber}` : 'Apply to the part design'}
        disabled={!target || !candidate || !candidate.feasible}
        onApply={() => {
          if (candidate && target) state.send(target, { gaugeIn: candidate.gaugeIn, rivet: candidate.rivet });
        }}
      />
    </View>
  );
}

/** What the draft revision holds after applying, with the way to it. */
export function AppliedRevision({
  rev,
  partNumber,
  onOpen,
}: {
  rev: Revision;
  partNumber: string;
  onOpen: () => void;
}) {
  const u = useUnits();
  return (
    <Sheet testID="apply-result">
      <Txt bold>
        <Mono bold>{partNumber}</Mono> draft revision <Mono bold>{rev.letter}</Mono> now has:
      </Txt>
      <Txt variant="small">
        <Mono variant="small" bold>
          {u.length(rev.gaugeIn)}
        </Mono>{' '}
        {rev.material} ·{' '}
        <Mono variant="small" bold>
          {rev.rivetSpec}
        </Mono>{' '}
        · drill <Mono variant="small">{rev.drillSize}</Mono> · edge distance{' '}
        <Mono variant="small">{u.length(rev.edgeDistanceIn)}</Mono>
      </Txt>
      {rev.lines.map((l) => (
        <Txt key={l.code} variant="small">
          <Mono variant="small" bold>
            {l.code}
          </Mono>{' '}
          {l.name}:{' '}
          {l.zones.map((z, i) => (
            <Mono key={i} variant="small">
              {i ? ', ' : ''}
              {u.station(z.fromIn)}–{u.station(z.toIn)} @ {pitchNumber(z.pitchIn, u.system)}
            </Mono>
          ))}
        </Txt>
      ))}
      <Txt variant="small" tone="soft">
        A draft: nobody builds from it until you check it and publish it.
      </Txt>
      <Button
        label={`Open ${partNumber} revision ${rev.letter}`}
        variant="secondary"
        onPress={onOpen}
        testID="apply-open-design"
      />
    </Sheet>
  );
}
