import { useState } from 'react';
import { View } from 'react-native';
import { partKindLabels, type PartKind } from '@/db/contracts';
import { space } from '@/constants/theme';
import { Choice } from '@/components/ui/choice';
import { Field } from '@/components/ui/field';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { useDesignsQuery } from '@/hooks/queries/designs';
import { useUnits } from '@/hooks/use-units';
import { ApplyFooter, DesignChoice, LatestOnlyNotice, NoDesigns, useApplyToDesign, WritesInto } from './apply-panel';
import { sameCandidate, type CandidateKey } from './study-result';
import { idPart, ribCandidate, ribChoices, skinCandidate, skinChoices, type WingResult } from './wing-result';

type TargetKind = 'rib' | 'skin';

/** The part kinds each target may be applied to (the server holds the same rule and says so when refused). */
export const TARGET_PART_KINDS: Record<TargetKind, readonly PartKind[]> = {
  rib: ['rib', 'nose_rib'],
  skin: ['skin_panel'],
};

const keyOf = (k: CandidateKey) => `${k.gaugeIn}-${k.rivet}`;

/**
 * "Apply to part design" for a wing: a rib or a skin panel of the wing, one of its candidates stored
 * with zones (a rib's recommendation or the one-for-all choice, a panel's recommendation), and a part
 * design of the kit of the right kind; its draft revision takes the gauge, rivet and zones.
 */
export function WingApplyPanel({
  studyId,
  kitModelId,
  kitName,
  result,
  viewingRevision,
  latestRevision,
  initial,
}: {
  studyId: string;
  kitModelId: string;
  kitName: string;
  result: WingResult;
  viewingRevision: number;
  latestRevision: number;
  /** What the tables above show: the panel opens on it. */
  initial: { kind: TargetKind; name: string } | null;
}) {
  const u = useUnits();
  const designs = useDesignsQuery(kitModelId);
  const state = useApplyToDesign(studyId);
  const [kind, setKind] = useState<TargetKind>(initial?.kind ?? 'skin');
  const [name, setName] = useState<string | null>(initial?.name ?? null);
  const [pick, setPick] = useState<string | null>(null);
  const [designId, setDesignId] = useState<string | null>(null);

  if (viewingRevision !== latestRevision) return <LatestOnlyNotice latestRevision={latestRevision} />;

  const { fresh } = state;
  const uniform = result.trade.recommendedUniform;
  const rib = kind === 'rib' ? (result.ribs.find((r) => r.name === name) ?? null) : null;
  const panel = kind === 'skin' ? (result.skins.find((p) => p.name === name) ?? null) : null;
  const options: { key: CandidateKey; label: string; hint: string }[] = rib
    ? ribChoices(rib, uniform).map(({ key, why }) => ({
        key,
        label: `${u.length(key.gaugeIn)} · ${key.rivet}`,
        hint:
          why === 'both'
            ? 'its own recommendation, and the one for every rib'
            : why === 'recommended'
              ? 'its own recommendation'
              : 'the one for every rib',
      }))
    : panel
      ? skinChoices(panel).map((key) => ({
          key,
          label: `${u.length(key.gaugeIn)} · ${key.rivet}`,
          hint: 'its recommendation',
        }))
      : [];
  // One option is chosen for you; of two, the person chooses.
  const chosenKey = options.find((o) => keyOf(o.key) === pick)?.key ?? (options.length === 1 ? options[0].key : null);
  const candidate = rib ? ribCandidate(rib, chosenKey) : panel ? skinCandidate(panel, chosenKey) : null;
  const fitting = (designs.data ?? []).filter((d) => TARGET_PART_KINDS[kind].includes(d.kind));
  const target = fitting.find((d) => d.id === designId) ?? null;
  const what = kind === 'rib' ? 'rib' : 'skin panel';

  return (
    <View style={{ gap: space.md }} testID="wing-apply-panel">
      <Field label="What to apply">
        <Choice
          testIDPrefix="wing-apply-kind"
          label="What to apply"
          value={kind}
          onChange={(k) => {
            setKind(k);
            setName(null);
            setPick(null);
            setDesignId(null);
            fresh();
          }}
          options={[
            { value: 'rib', label: 'A rib' },
            { value: 'skin', label: 'A skin panel' },
          ]}
        />
      </Field>
      <Field label={kind === 'rib' ? 'Rib' : 'Skin panel'}>
        <Choice
          testIDPrefix="wing-apply-target"
          label={kind === 'rib' ? 'Rib' : 'Skin panel'}
          value={name}
          onChange={(n) => {
            setName(n);
            setPick(null);
            fresh();
          }}
          options={(kind === 'rib' ? result.ribs.map((r) => r.name) : result.skins.map((p) => p.name)).map((n) => ({
            value: n,
            key: idPart(n),
            label: n,
          }))}
        />
      </Field>
      {name ? (
        options.length ? (
          <Field label="Candidate" hint="Only candidates stored with their zones can be applied.">
            <Choice
              testIDPrefix="wing-apply-candidate"
              label="Candidate"
              value={chosenKey ? keyOf(chosenKey) : null}
              onChange={(k) => {
                setPick(k);
                fresh();
              }}
              options={options.map((o) => ({ value: keyOf(o.key), key: keyOf(o.key), label: o.label, hint: o.hint }))}
            />
          </Field>
        ) : (
          <Notice
            tone="error"
            testID="wing-apply-nothing"
          >{`No candidate carries the loads of ${what} ${name}, so there is nothing to apply.`}</Notice>
        )
      ) : (
        <Txt tone="soft">Choose the {what} first.</Txt>
      )}

      {designs.isPending ? (
        <LoadingState what="Loading the kit's part designs" />
      ) : designs.isError ? (
        <ErrorState error={designs.error} onRetry={() => void designs.refetch()} />
      ) : !fitting.length ? (
        <NoDesigns
          kitModelId={kitModelId}
          title={`No ${TARGET_PART_KINDS[kind].map((k) => partKindLabels[k].toLowerCase()).join(' or ')} part designs in ${kitName} yet.`}
          body={`Make the ${what}'s part design in the catalogue first; then apply the study to it.`}
        />
      ) : (
        <DesignChoice
          designs={fitting}
          value={designId}
          onChange={(id) => {
            setDesignId(id);
            fresh();
          }}
          hint={`${TARGET_PART_KINDS[kind].map((k) => partKindLabels[k]).join(' and ')} part designs of ${kitName}`}
        />
      )}

      {candidate && name ? (
        <Txt testID="apply-what">
          Writes {what} <Mono bold>{name}</Mono>’s <Mono bold>{u.length(candidate.gaugeIn)}</Mono> with{' '}
          <Mono bold>{candidate.rivet}</Mono>
          <WritesInto lines={candidate.lines.length} partNumber={target?.partNumber} />
          {sameCandidate(candidate, uniform) && kind === 'rib'
            ? ' This is the gauge and rivet chosen for every rib.'
            : ''}
        </Txt>
      ) : null}
      {candidate && !candidate.feasible ? (
        <Notice
          tone="error"
          testID="apply-not-feasible"
        >{`${u.length(candidate.gaugeIn)} with ${candidate.rivet} does not carry the loads of ${name}, so it cannot be applied.`}</Notice>
      ) : null}
      <ApplyFooter
        state={state}
        label={target && candidate ? `Apply ${name} to ${target.partNumber}` : 'Apply to the part design'}
        disabled={!target || !candidate || !candidate.feasible}
        onApply={() => {
          if (candidate && target && name)
            state.send(target, { gaugeIn: candidate.gaugeIn, rivet: candidate.rivet, target: { kind, name } });
        }}
      />
    </View>
  );
}
