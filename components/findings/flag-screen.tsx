import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useEffect, useMemo, useRef, useState } from 'react';
import { Controller, useForm, type Resolver } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { z } from 'zod';
import {
  findingInput,
  findingKindGroups,
  findingKindLabels,
  findingKinds,
  measureKeys,
  measureLabels,
  measuresOfKind,
  type FindingKind,
  type Hole,
  type MeasureKey,
  type Measurements,
  type TravelerDetail,
} from '@/db/contracts';
import { colors, hairline, radius, space, touch } from '@/constants/theme';
import { FormNumberField, FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Button } from '@/components/ui/button';
import { Choice } from '@/components/ui/choice';
import { Field } from '@/components/ui/field';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/sheet';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { HoleMark, holeStatusLabels } from '@/components/ui/status-mark';
import { Toggle } from '@/components/ui/toggle';
import { Label, Mono, Txt } from '@/components/ui/text';
import { TwoPane } from '@/components/ui/two-pane';
import { ApiError } from '@/lib/api-client';
import { keepPhotos, outlivesPage } from '@/lib/kept-photos';
import { PhotoReadError, type DraftPhoto } from '@/lib/photo-form-data';
import { useQueueFinding } from '@/hooks/queries/bench-actions';
import { useFindingCreateMutation } from '@/hooks/queries/findings';
import { useTravelerQuery } from '@/hooks/queries/travelers';
import { useFindingDraft } from '@/hooks/use-finding-draft';
import { setFlash } from '@/hooks/use-flash';
import { useWide } from '@/hooks/use-wide';
import { basisOfTraveler } from './measure-basis';
import { MeasurementJudgement } from './measurement-line';
import { maxPhotos, photoRefusal, pickPhotos, PhotoPicker } from './photo-picker';
import { shortDate } from './finding-row';

type Values = z.input<typeof findingInput>;
type Parsed = z.output<typeof findingInput>;

export function FlagScreen({ travelerId, initialHoleIds }: { travelerId: string; initialHoleIds: string[] }) {
  const q = useTravelerQuery(travelerId);
  const back = `/travelers/${travelerId}` as const;
  if (q.isPending)
    return (
      <Screen title="Flag a hole" focusTitle backTo={back}>
        <LoadingState what="Loading the part" />
      </Screen>
    );
  if (q.isError)
    return (
      <Screen title="Flag a hole" focusTitle backTo={back}>
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      </Screen>
    );
  return (
    <FlagForm t={q.data} initialHoleIds={initialHoleIds.filter((id) => q.data.holes.some((h) => h.holeId === id))} />
  );
}

/** Only the measurements the kind allows, and only those typed: the server refuses any other. */
export function measurementsFor(kind: FindingKind | undefined, m: Measurements | undefined): Measurements {
  if (!kind || !m) return {};
  const out: Measurements = {};
  for (const k of measuresOfKind[kind]) {
    const v = m[k];
    if (typeof v === 'number' && !Number.isNaN(v)) out[k] = v;
  }
  return out;
}

const isKind = (k: unknown): k is FindingKind =>
  typeof k === 'string' && (findingKinds as readonly string[]).includes(k);

/**
 * The contract names a measurement by its key ("holeDiameterIn must be a number in inches"); at the
 * bench it is "Hole diameter". Other messages pass through as they are.
 */
const plainMeasureResolver =
  (base: Resolver<Values, unknown, Parsed>): Resolver<Values, unknown, Parsed> =>
  async (values, ctx, opts) => {
    const r = await base(values, ctx, opts);
    const m = (r.errors as { measurements?: Record<string, { message?: string }> }).measurements;
    if (m) {
      for (const k of measureKeys) {
        const e = m[k];
        if (e?.message) e.message = e.message.replace(k, measureLabels[k]).replace(/ in inches$/, '');
      }
    }
    return r;
  };

function HolePicker({
  holes,
  lines,
  value,
  onChange,
  invalid,
}: {
  holes: Hole[];
  lines: TravelerDetail['lines'];
  value: string[];
  onChange: (ids: string[]) => void;
  invalid: boolean;
}) {
  const toggle = (id: string) => onChange(value.includes(id) ? value.filter((v) => v !== id) : [...value, id]);
  return (
    <View style={{ gap: space.md }}>
      {lines.map((l) => (
        <View key={l.code} style={{ gap: space.xs }}>
          <Txt variant="small" bold>
            <Mono variant="small" bold>
              {l.code}
            </Mono>{' '}
            {l.name}
          </Txt>
          <View style={styles.holes}>
            {holes
              .filter((h) => h.line === l.code)
              .sort((a, b) => a.seq - b.seq)
              .map((h) => {
                const on = value.includes(h.holeId);
                return (
                  <Toggle
                    key={h.holeId}
                    kind="checkbox"
                    checked={on}
                    testID={`pick-hole-${h.holeId}`}
                    accessibilityLabel={`Hole ${h.holeId}, ${holeStatusLabels[h.status]}`}
                    onPress={() => toggle(h.holeId)}
                    style={[
                      styles.hole,
                      on && styles.holeOn,
                      invalid && !value.length && { borderColor: colors.error },
                    ]}
                  >
                    <HoleMark status={h.status} size={16} decorative onInk={on} />
                    <Mono bold={on} tone={on ? 'inverse' : 'ink'}>
                      {h.holeId}
                    </Mono>
                  </Toggle>
                );
              })}
          </View>
        </View>
      ))}
    </View>
  );
}

/** The holes chosen, in one short line: what the person came to flag, without the whole grid. */
function ChosenHoles({
  ids,
  open,
  onToggle,
  error,
}: {
  ids: string[];
  open: boolean;
  onToggle: () => void;
  error?: string;
}) {
  return (
    <View style={{ gap: space.sm }} testID="chosen-holes">
      {ids.length ? (
        <View style={styles.chosen}>
          {ids.map((id) => (
            <View key={id} style={styles.chip}>
              <Mono bold>{id}</Mono>
            </View>
          ))}
        </View>
      ) : (
        <Txt tone="soft">No hole chosen yet: pick it in the list of holes below.</Txt>
      )}
      {error ? (
        <Txt variant="small" tone="error" accessibilityRole="alert" testID="finding-holes-error">
          {error}
        </Txt>
      ) : null}
      {ids.length ? (
        <Button
          label={open ? 'Done changing holes' : 'Change holes'}
          variant="secondary"
          compact
          onPress={onToggle}
          testID="change-holes"
          aria-expanded={open}
          style={{ alignSelf: 'flex-start' }}
        />
      ) : null}
    </View>
  );
}

function FlagForm({ t, initialHoleIds }: { t: TravelerDetail; initialHoleIds: string[] }) {
  const router = useRouter();
  const wide = useWide();
  const create = useFindingCreateMutation();
  const queueFinding = useQueueFinding();
  const draft = useFindingDraft(t.id);
  const basis = useMemo(() => basisOfTraveler(t), [t]);
  const [photos, setPhotos] = useState<DraftPhoto[]>([]);
  const [photoError, setPhotoError] = useState<string | null>(null);
  const [formError, setFormError] = useState<{ text: string; kept: boolean } | null>(null);
  const [restoredAt, setRestoredAt] = useState<string | null>(null);
  // The full hole grid is long: on a phone it opens on demand, or by itself when nothing is chosen yet.
  const [pickerOpen, setPickerOpen] = useState(initialHoleIds.length === 0);
  const restoredOnce = useRef(false);
  const saveDraft = draft.save;

  const resolver = useMemo(() => plainMeasureResolver(zodResolver(findingInput, plainParse)), []);
  const { control, handleSubmit, setError, reset, watch, getValues, setValue, formState } = useForm<
    Values,
    unknown,
    Parsed
  >({
    resolver,
    mode: 'onChange',
    defaultValues: { travelerId: t.id, holeIds: initialHoleIds, kind: undefined, note: '', measurements: {} },
  });
  const kind = watch('kind');
  const measurements = watch('measurements');
  const holeIds = watch('holeIds') ?? [];

  // Bring back an unsent finding from before, once the stored draft has been read.
  useEffect(() => {
    if (!draft.loaded || restoredOnce.current) return;
    restoredOnce.current = true;
    const d = draft.restored;
    if (!d) return;
    const ids = Array.from(new Set([...d.values.holeIds, ...initialHoleIds])).filter((id) =>
      t.holes.some((h) => h.holeId === id),
    );
    // A draft kept by an older version may name a kind that no longer exists: the person chooses again.
    const k = isKind(d.values.kind) ? d.values.kind : undefined;
    reset({
      travelerId: t.id,
      holeIds: ids,
      kind: k,
      note: d.values.note,
      measurements: measurementsFor(k, d.values.measurements),
    });
    setPhotos(d.photos);
    setRestoredAt(d.savedAt);
    if (!ids.length) setPickerOpen(true);
  }, [draft.loaded, draft.restored, initialHoleIds, reset, t.holes, t.id]);

  // Keep the draft as the person works.
  useEffect(() => {
    const sub = watch((v) =>
      saveDraft({
        values: {
          holeIds: (v.holeIds ?? []).filter((x): x is string => !!x),
          kind: v.kind,
          note: v.note ?? '',
          measurements: measurementsFor(v.kind, v.measurements as Measurements | undefined),
        },
        photos,
      }),
    );
    return () => sub.unsubscribe();
  }, [watch, saveDraft, photos]);
  useEffect(() => {
    const v = getValues();
    saveDraft({
      values: {
        holeIds: v.holeIds ?? [],
        kind: v.kind,
        note: v.note ?? '',
        measurements: measurementsFor(v.kind, v.measurements),
      },
      photos,
    });
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [photos]);

  // A measurement another kind allowed would be refused: drop it when the kind changes.
  useEffect(() => {
    const m = getValues('measurements') ?? {};
    const kept = measurementsFor(kind, m);
    if (Object.keys(m).some((k) => !(k in kept) && m[k as MeasureKey] !== undefined))
      setValue('measurements', kept, { shouldValidate: true });
  }, [kind, getValues, setValue]);

  const add = async (from: 'library' | 'camera') => {
    setPhotoError(null);
    const r = await pickPhotos(from, maxPhotos - photos.length);
    setPhotoError(r.error);
    if (r.photos.length) setPhotos((p) => [...p, ...r.photos].slice(0, maxPhotos));
  };

  const startOver = async () => {
    await draft.clear();
    reset({ travelerId: t.id, holeIds: initialHoleIds, kind: undefined, note: '', measurements: {} });
    setPhotos([]);
    setRestoredAt(null);
    setFormError(null);
    setPhotoError(null);
    setPickerOpen(initialHoleIds.length === 0);
  };

  const submit = handleSubmit(
    async (values) => {
      setFormError(null);
      if (!photos.length) {
        setPhotoError('Add at least one photo of the hole.');
        return;
      }
      const input = { ...values, measurements: measurementsFor(values.kind, values.measurements) };
      try {
        await draft.flush();
        const f = await create.mutateAsync({ input, photos });
        await draft.clear();
        setFlash(`finding-sent:${t.id}`, f.id);
        // Back to the traveler the flag was raised from (or to it, after a reload of this form).
        router.dismissTo(`/travelers/${t.id}`);
      } catch (e) {
        if (e instanceof PhotoReadError) {
          setPhotoError(e.message);
          return;
        }
        if (e instanceof ApiError && e.isNetwork) {
          // No signal: the finding waits in the bench's queue, its photos kept on the device, and goes
          // by itself when the signal returns; the part shows it waiting meanwhile. Where the photos
          // cannot be kept (no IndexedDB), it stays here as a draft to send again.
          const kept = await keepPhotos(photos);
          if (kept.every(outlivesPage)) {
            queueFinding(input, kept);
            await draft.clear({ handedOver: true });
            router.dismissTo(`/travelers/${t.id}`);
            return;
          }
          setFormError({
            text: 'No connection, so the finding was not sent. It is kept on this device: send it again when you have signal.',
            kept: true,
          });
          return;
        }
        // A refused photo is said once, under the photos; the line by the button only points there.
        const refused = photoRefusal(e);
        if (refused) {
          setPhotoError(refused);
          setFormError({ text: 'Not sent: a photo was refused (see Photos). Your finding is still here.', kept: true });
          return;
        }
        const text = applyServerErrors(setError, e, (path) => {
          if (path.startsWith('photos')) {
            setPhotoError(e instanceof ApiError ? (e.fields?.[path] ?? e.message) : null);
            return null;
          }
          if (path.startsWith('measurements.')) return path;
          return ['holeIds', 'kind', 'note'].some((f) => path === f || path.startsWith(`${f}.`))
            ? path.split('.')[0]
            : null;
        });
        setFormError({ text: `Not sent. ${text} Your finding is still here.`, kept: true });
      }
    },
    (errors) => {
      if (!photos.length) setPhotoError('Add at least one photo of the hole.');
      if (errors.holeIds) setPickerOpen(true);
      // A field the person cannot see (the traveler's id) must not fail in silence.
      if (errors.travelerId)
        setFormError({
          text: `Not sent: ${errors.travelerId.message ?? 'the part is not known'}. Open the part again and flag from there.`,
          kept: true,
        });
    },
  );

  const measures = kind ? measuresOfKind[kind] : [];

  const picker = (
    <Section title="Holes on this part">
      <Controller
        control={control}
        name="holeIds"
        render={({ field, fieldState }) => (
          <Field
            label="Suspect hole(s)"
            hint="Tap each hole that looks wrong."
            error={fieldState.error?.message}
            testID="finding-holes"
          >
            <HolePicker
              holes={t.holes}
              lines={t.lines}
              value={field.value ?? []}
              onChange={field.onChange}
              invalid={!!fieldState.error}
            />
          </Field>
        )}
      />
      {!wide && holeIds.length ? (
        <Button
          label="Done changing holes"
          variant="secondary"
          compact
          onPress={() => setPickerOpen(false)}
          testID="close-holes"
          style={{ alignSelf: 'flex-start' }}
        />
      ) : null}
    </Section>
  );

  const form = (
    <>
      {restoredAt ? (
        <Notice tone="caution" testID="draft-restored">
          <Txt>Your unsent finding from {shortDate(restoredAt)} is back.</Txt>
          <Button label="Start over" variant="quiet" compact onPress={() => void startOver()} testID="discard-draft" />
        </Notice>
      ) : null}
      <Section title="Which holes">
        <ChosenHoles
          ids={holeIds}
          open={pickerOpen || wide}
          onToggle={() => setPickerOpen((o) => !o)}
          error={!pickerOpen && !wide ? formState.errors.holeIds?.message : undefined}
        />
      </Section>
      <Section title="What is wrong">
        <Controller
          control={control}
          name="kind"
          render={({ field, fieldState }) => (
            <Field label="Kind" error={fieldState.error?.message} testID="finding-kind-field">
              <View style={{ gap: space.md }}>
                {findingKindGroups.map((g) => (
                  <View key={g.group} style={{ gap: space.xs }} testID={`finding-kind-group-${g.group}`}>
                    <Label accessibilityRole="header">{g.label}</Label>
                    <Choice
                      testIDPrefix="finding-kind"
                      label={`Kind: ${g.label}`}
                      value={field.value ?? null}
                      onChange={(v) => {
                        field.onChange(v);
                        field.onBlur();
                      }}
                      invalid={!!fieldState.error}
                      options={g.kinds.map((k) => ({ value: k as FindingKind, label: findingKindLabels[k] }))}
                    />
                  </View>
                ))}
              </View>
            </Field>
          )}
        />
      </Section>
      {measures.length ? (
        <Section title="Measured (if you measured)" testID="finding-measures">
          <Txt variant="small" tone="soft">
            Optional. Each value is shown against the rule it is judged by.
          </Txt>
          {measures.map((k) => (
            <View key={k} style={{ gap: space.xs }}>
              <FormNumberField
                control={control}
                name={`measurements.${k}`}
                label={measureLabels[k]}
                testID={`measure-${k}`}
                quantity="length"
              />
              <MeasurementJudgement measure={k} value={measurements?.[k]} basis={basis} />
            </View>
          ))}
        </Section>
      ) : null}
      <Section title="Note">
        <FormTextField
          control={control}
          name="note"
          label="What you see"
          hint="Where on the hole, and anything that helps the inspector."
          testID="finding-note"
          multiline
          maxLength={2000}
        />
      </Section>
      <Section title="Photos">
        <PhotoPicker
          photos={photos}
          onAdd={(from) => void add(from)}
          onRemove={(i) => setPhotos((p) => p.filter((_, j) => j !== i))}
          error={photoError}
        />
      </Section>
      {!wide && pickerOpen ? picker : null}
      {formError ? (
        <Notice tone="error" testID="finding-error">
          {formError.text}
        </Notice>
      ) : null}
      <Button
        label="Send the finding"
        busyLabel="Sending photos"
        busy={formState.isSubmitting || create.isPending}
        onPress={() => void submit()}
        testID="submit-finding"
      />
      <Txt variant="small" tone="faint">
        Until it is sent, this finding is kept on this device.
      </Txt>
    </>
  );

  return (
    <Screen
      title="Flag a hole"
      focusTitle
      subtitle={`${t.partNumber} ${t.partName} · rev ${t.letter} · ${t.serial}`}
      backTo={`/travelers/${t.id}`}
      full={wide}
      testID="flag-screen"
    >
      {wide ? <TwoPane left={form} right={picker} /> : form}
    </Screen>
  );
}

const styles = StyleSheet.create({
  holes: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  hole: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.xs,
    minHeight: touch,
    minWidth: 88,
    paddingHorizontal: space.sm,
    borderWidth: hairline,
    borderColor: colors.ruleStrong,
    borderRadius: radius.sm,
    backgroundColor: colors.paperRaised,
  },
  holeOn: { backgroundColor: colors.ink, borderColor: colors.ink },
  chosen: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  chip: {
    paddingHorizontal: space.md,
    paddingVertical: space.xs,
    borderWidth: hairline,
    borderColor: colors.ink,
    borderRadius: radius.sm,
    backgroundColor: colors.paperRaised,
  },
});
