import { zodResolver } from '@hookform/resolvers/zod';
import { useCallback, useRef, useState } from 'react';
import { Controller, useForm, type Resolver } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import {
  dispositionHelp,
  dispositionLabels,
  dispositions,
  findingActionInput,
  findingActionLabels,
  NOTE_MIN_LENGTH,
  noteRequired,
  repairSchemeLabels,
  repairSchemes,
  type FindingAction,
  type FindingActionInput,
  type FindingDetail,
} from '@/db/contracts';
import { space } from '@/constants/theme';
import { FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { Choice } from '@/components/ui/choice';
import { Field } from '@/components/ui/field';
import { Notice } from '@/components/ui/states';
import { Label, Mono, Txt } from '@/components/ui/text';
import { ApiError, errorMessage } from '@/lib/api-client';
import { PhotoReadError, type DraftPhoto } from '@/lib/photo-form-data';
import { useFindingActionMutation, useRepairCheckQuery } from '@/hooks/queries/findings';
import { useUnits } from '@/hooks/use-units';
import { maxPhotos, photoRefusal, pickPhotos, PhotoPicker } from './photo-picker';
import { alternativeWords, oversizeChoices } from './repair-check-panel';
import { VerdictMark } from './verdict-mark';

type Values = z.input<typeof findingActionInput>;
type Parsed = z.output<typeof findingActionInput>;

/** Actions that carry a disposition (and, for a repair, how it is made). */
const shapesDisposition = (a: FindingAction) => a === 'disposition' || a === 'amend';

/** A note "in a few words": the same floor the server and the new-finding form hold to. */

type Need = { checkFailed: boolean; askOverride: boolean; rivetListed: boolean };

/**
 * What the pressed action needs from the form. The rules module says which moves need a note; the rest
 * is what a disposition is made of. Built per press, since one form carries every button on screen.
 */
function schemaFor(action: FindingAction, need: Need) {
  return findingActionInput.superRefine((v, ctx) => {
    if (noteRequired[action] && v.note.length < NOTE_MIN_LENGTH) {
      ctx.addIssue({
        code: 'custom',
        path: ['note'],
        message: `say why, in a few words, to ${findingActionLabels[action].toLowerCase()}`,
      });
    }
    if (!shapesDisposition(action)) return;
    if (!v.disposition) {
      ctx.addIssue({ code: 'custom', path: ['disposition'], message: 'choose a disposition' });
      return;
    }
    if (v.disposition !== 'repair') return;
    if (!v.repairScheme) {
      ctx.addIssue({ code: 'custom', path: ['repairScheme'], message: 'choose how the repair is made' });
      return;
    }
    if (v.repairScheme !== 'oversize_rivet') return;
    if (need.rivetListed && !v.repairRivetSpec)
      ctx.addIssue({ code: 'custom', path: ['repairRivetSpec'], message: 'choose the rivet' });
    if ((need.checkFailed || need.askOverride) && (v.overrideReason ?? '').length < NOTE_MIN_LENGTH) {
      ctx.addIssue({
        code: 'custom',
        path: ['overrideReason'],
        message: 'the check fails: say why you choose this repair anyway',
      });
    }
  });
}

/** Only what the action carries: a disposition's parts go with a disposition, nothing else does. */
function inputFor(action: FindingAction, v: Parsed, showOverride: boolean): FindingActionInput {
  if (!shapesDisposition(action)) return { note: v.note };
  if (v.disposition !== 'repair') return { note: v.note, disposition: v.disposition };
  const oversize = v.repairScheme === 'oversize_rivet';
  return {
    note: v.note,
    disposition: v.disposition,
    repairScheme: v.repairScheme,
    ...(oversize && v.repairRivetSpec ? { repairRivetSpec: v.repairRivetSpec } : {}),
    ...(oversize && showOverride && v.overrideReason ? { overrideReason: v.overrideReason } : {}),
  };
}

/** The note's words for who is reading: the first allowed action sets the tone. */
function noteWords(actions: readonly FindingAction[]): { label: string; hint: string } {
  const first = actions[0];
  const label =
    first === 'disposition' || first === 'amend' || first === 'not-a-defect'
      ? 'Note to the builder'
      : first === 'approve' || first === 'refuse'
        ? 'Your note to the inspector'
        : first === 'report-done'
          ? 'What you did'
          : 'What you checked';
  const needed = actions.filter((a) => noteRequired[a]).map((a) => findingActionLabels[a]);
  const optional = actions.filter((a) => !noteRequired[a]).map((a) => findingActionLabels[a]);
  const hint = [
    needed.length ? `Needed for: ${needed.join(', ')}.` : '',
    optional.length ? `Optional for: ${optional.join(', ')}.` : '',
  ]
    .filter(Boolean)
    .join(' ');
  return { label, hint };
}

/** Solid buttons move the finding on; outlined ones turn it back or end it another way. */
const forward: Record<FindingAction, boolean> = {
  disposition: true,
  amend: true,
  'not-a-defect': false,
  approve: true,
  refuse: false,
  'report-done': true,
  accept: true,
  'send-back': false,
};

/**
 * The decision on a finding: one form, whose buttons are exactly `f.allowedActions` (nothing else is
 * offered), each sending one request. The note (`action-note`) goes with whichever button is pressed;
 * the disposition's parts appear only when disposition or amend is allowed; photos only with report-done.
 */
export function FindingDecision({
  f,
  onDone,
}: {
  f: FindingDetail;
  onDone: (action: FindingAction, next: FindingDetail) => void;
}) {
  const actions = f.allowedActions;
  const mutation = useFindingActionMutation(f.id);
  const u = useUnits();
  const shaping = actions.find(shapesDisposition) ?? null;
  const takesPhotos = actions.includes('report-done');
  const [photos, setPhotos] = useState<DraftPhoto[]>([]);
  const [photoError, setPhotoError] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const [askOverride, setAskOverride] = useState(false);
  const [pressed, setPressed] = useState<FindingAction | null>(null);

  // The resolver reads the pressed action and the latest check through refs: one form, many buttons.
  const actionRef = useRef<FindingAction>(actions[0] ?? 'disposition');
  const needRef = useRef<Need>({ checkFailed: false, askOverride: false, rivetListed: false });
  const resolver = useCallback<Resolver<Values, unknown, Parsed>>(
    (values, context, options) =>
      zodResolver(schemaFor(actionRef.current, needRef.current), plainParse)(values, context, options),
    [],
  );
  const { control, handleSubmit, setError, watch, reset, formState } = useForm<Values, unknown, Parsed>({
    resolver,
    mode: 'onSubmit',
    reValidateMode: 'onChange',
    defaultValues: {
      note: '',
      disposition: undefined,
      repairScheme: undefined,
      repairRivetSpec: undefined,
      overrideReason: '',
    },
  });

  const chosen = watch('disposition');
  const scheme = watch('repairScheme');
  const rivet = watch('repairRivetSpec');
  const options = f.context.oversizeOptions;
  const oversize = chosen === 'repair' && scheme === 'oversize_rivet';
  // The check for the rivet chosen, shared with the repair check panel through the query cache.
  const check = useRepairCheckQuery(f.id, options ? (rivet ?? null) : null);
  const checked = oversize && (!options || !!rivet) ? check.data : undefined;
  const checkFailed = checked?.pass === false;
  const showOverride = oversize && (checkFailed || askOverride);
  needRef.current = { checkFailed, askOverride, rivetListed: !!options?.length };

  if (!actions.length) return null;
  const note = noteWords(actions);

  const submitAs = (action: FindingAction) => {
    actionRef.current = action;
    setPressed(action);
    setFormError(null);
    if (action === 'report-done' && !photos.length) setPhotoError('Add at least one photo of the finished work.');
    return handleSubmit(async (values) => {
      if (action === 'report-done' && !photos.length) return;
      try {
        const next = await mutation.mutateAsync({
          action,
          input: inputFor(action, values, showOverride),
          photos: action === 'report-done' ? photos : undefined,
        });
        reset();
        setPhotos([]);
        setAskOverride(false);
        onDone(action, next);
      } catch (e) {
        if (e instanceof PhotoReadError) {
          setPhotoError(e.message);
          return;
        }
        if (e instanceof ApiError && e.isNetwork) {
          setFormError(
            'No connection, so nothing was sent. What you wrote is still here: send it again when you have signal.',
          );
          return;
        }
        // A refused photo is said once, under the photos; the line by the buttons only points there.
        const refused = photoRefusal(e);
        if (refused) {
          setPhotoError(refused);
          setFormError('Not sent: a photo was refused (see the photos). What you wrote is still here.');
          return;
        }
        if (e instanceof ApiError && e.fields?.overrideReason) setAskOverride(true);
        setFormError(
          applyServerErrors(setError, e, (path) => {
            if (path === 'photos' || path.startsWith('photos.')) {
              setPhotoError(e instanceof ApiError ? (e.fields?.[path] ?? e.message) : errorMessage(e));
              return null;
            }
            return ['note', 'disposition', 'repairScheme', 'repairRivetSpec', 'overrideReason'].includes(path)
              ? path
              : null;
          }),
        );
      }
    })();
  };

  const addPhotos = async (from: 'library' | 'camera') => {
    setPhotoError(null);
    const r = await pickPhotos(from, maxPhotos - photos.length);
    setPhotoError(r.error);
    if (r.photos.length) setPhotos((p) => [...p, ...r.photos].slice(0, maxPhotos));
  };

  return (
    <View style={{ gap: space.lg }} testID="finding-decision">
      {shaping ? (
        <View style={{ gap: space.md }} testID={`finding-form-${shaping}`}>
          <Controller
            control={control}
            name="disposition"
            render={({ field, fieldState }) => (
              <Field
                label={shaping === 'amend' ? 'New disposition' : 'Disposition'}
                error={fieldState.error?.message}
                testID="disposition-field"
              >
                <Choice
                  columns
                  testIDPrefix="disposition"
                  label={shaping === 'amend' ? 'New disposition' : 'Disposition'}
                  value={field.value}
                  onChange={field.onChange}
                  invalid={!!fieldState.error}
                  options={dispositions.map((d) => ({
                    value: d,
                    label:
                      shaping === 'amend' && f.disposition === d
                        ? `${dispositionLabels[d]} (as now)`
                        : dispositionLabels[d],
                    hint: dispositionHelp[d],
                  }))}
                />
              </Field>
            )}
          />
          {chosen === 'repair' ? (
            <Controller
              control={control}
              name="repairScheme"
              render={({ field, fieldState }) => (
                <Field label="How the repair is made" error={fieldState.error?.message} testID="repair-scheme-field">
                  <Choice
                    testIDPrefix="repair-scheme"
                    label="How the repair is made"
                    value={field.value}
                    onChange={field.onChange}
                    invalid={!!fieldState.error}
                    options={repairSchemes.map((s) => ({ value: s, label: repairSchemeLabels[s] }))}
                  />
                </Field>
              )}
            />
          ) : null}
          {chosen === 'repair' && scheme && scheme !== 'oversize_rivet' ? (
            <Txt variant="small" tone="soft">
              Describe the scheme in the note: the design authority approves it from what you write.
            </Txt>
          ) : null}
          {oversize ? (
            <View style={{ gap: space.md }} testID="repair-rivet">
              {options?.length ? (
                <Controller
                  control={control}
                  name="repairRivetSpec"
                  render={({ field, fieldState }) => (
                    <Field label="Next-size rivet" error={fieldState.error?.message} testID="repair-rivet-field">
                      <Choice
                        testIDPrefix="repair-rivet"
                        label="Next-size rivet"
                        value={field.value}
                        onChange={field.onChange}
                        invalid={!!fieldState.error}
                        options={oversizeChoices(f, u)}
                      />
                    </Field>
                  )}
                />
              ) : options ? (
                <Notice tone="caution" testID="repair-no-larger">
                  {`${f.context.rivetSpec} is the largest size of its family: choose a doubler, or another disposition.`}
                </Notice>
              ) : (
                <Txt variant="small" tone="faint">
                  The server takes the next size up of {f.context.rivetSpec}.
                </Txt>
              )}
              {!options || rivet ? (
                <Button
                  label={checked ? 'Check again' : 'Check this rivet at every hole'}
                  busyLabel="Checking"
                  variant="secondary"
                  busy={check.isFetching}
                  onPress={() => void check.refetch()}
                  testID="repair-rivet-check"
                />
              ) : null}
              {check.isError && !check.isFetching && (!options || rivet) ? (
                <Notice
                  tone="error"
                  testID="repair-rivet-error"
                >{`The check could not be made: ${errorMessage(check.error)}`}</Notice>
              ) : null}
              {checked ? (
                <View style={{ gap: space.sm }} testID="repair-rivet-result">
                  <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center', flexWrap: 'wrap' }}>
                    <VerdictMark pass={checked.pass} size={24} />
                    <Txt bold tone={checked.pass ? 'ink' : 'error'}>
                      {checked.pass ? 'Passes' : 'Fails'} at{' '}
                      {checked.holes.length === 1
                        ? 'the hole'
                        : `${checked.holes.filter((h) => !h.pass).length} of ${checked.holes.length} holes`}
                    </Txt>
                    <Mono variant="small">
                      {checked.inputs.proposedSpec} · drill {checked.newDrill.name}
                    </Mono>
                  </View>
                  {checked.reasons.map((r, i) => (
                    <Txt key={i} variant="small" tone="error">
                      – {r}
                    </Txt>
                  ))}
                  {checked.alternative ? (
                    <Txt variant="small" tone="caution">
                      The check points to: {alternativeWords[checked.alternative].title.toLowerCase()}.
                    </Txt>
                  ) : null}
                  <Txt variant="small" tone="faint">
                    Hole by hole, with the numbers, under “Repair check”.
                  </Txt>
                  <Caution testID="repair-rivet-caution" text={checked.caution || undefined} />
                </View>
              ) : (!options || rivet) && !check.isFetching ? (
                <Txt variant="small" tone="faint" testID="repair-rivet-unchecked">
                  Not checked yet: the server checks it when you record it, and asks for a reason if it fails.
                </Txt>
              ) : null}
              {showOverride ? (
                <FormTextField
                  control={control}
                  name="overrideReason"
                  label="Why this repair although the check fails"
                  hint="Say what makes it acceptable here. The design authority reads this before approving."
                  testID="override-reason"
                  multiline
                  maxLength={2000}
                />
              ) : null}
            </View>
          ) : null}
        </View>
      ) : null}

      <FormTextField
        control={control}
        name="note"
        label={note.label}
        hint={note.hint}
        testID="action-note"
        multiline
        maxLength={2000}
      />

      {takesPhotos ? (
        <View style={{ gap: space.xs }}>
          <Label>Photos of the work done</Label>
          <PhotoPicker
            photos={photos}
            onAdd={(from) => void addPhotos(from)}
            onRemove={(i) => setPhotos((p) => p.filter((_, j) => j !== i))}
            error={photoError}
            empty="No photo yet. The inspector checks the work from these: a close, sharp photo of each hole."
          />
        </View>
      ) : null}

      {formError ? (
        <Notice tone="error" testID="action-error">
          {formError}
        </Notice>
      ) : null}

      <View style={{ gap: space.sm }}>
        {actions.map((a) => (
          <Button
            key={a}
            label={findingActionLabels[a]}
            busyLabel="Sending"
            variant={forward[a] ? 'primary' : 'secondary'}
            busy={formState.isSubmitting && pressed === a}
            disabled={formState.isSubmitting && pressed !== a}
            onPress={() => void submitAs(a)}
            testID={`finding-action-${a}`}
          />
        ))}
      </View>
    </View>
  );
}
