import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useEffect, useRef, useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { Pressable, StyleSheet, View } from 'react-native';
import type { z } from 'zod';
import { findingInput, findingKindLabels, findingKinds, type Hole, type TravelerDetail } from '@/db/contracts';
import { colors, hairline, radius, space, touch } from '@/constants/theme';
import { FormChoiceField, FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/sheet';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { HoleMark } from '@/components/ui/status-mark';
import { Mono, Txt } from '@/components/ui/text';
import { ApiError } from '@/hooks/api-client';
import { PhotoReadError, type DraftPhoto } from '@/hooks/photo-form-data';
import { useFindingCreateMutation } from '@/hooks/queries/findings';
import { useTravelerQuery } from '@/hooks/queries/travelers';
import { useFindingDraft } from '@/hooks/use-finding-draft';
import { setFlash } from '@/hooks/use-flash';
import { pickPhotos, PhotoPicker, maxPhotos } from './photo-picker';
import { shortDate } from './finding-row';

type Values = z.input<typeof findingInput>;

export function FlagScreen({ travelerId, initialHoleIds }: { travelerId: string; initialHoleIds: string[] }) {
  const q = useTravelerQuery(travelerId);
  const back = `/travelers/${travelerId}` as const;
  if (q.isPending) return <Screen title="Flag a hole" backTo={back}><LoadingState what="Loading the part" /></Screen>;
  if (q.isError) return <Screen title="Flag a hole" backTo={back}><ErrorState error={q.error} onRetry={() => void q.refetch()} /></Screen>;
  return <FlagForm t={q.data} initialHoleIds={initialHoleIds.filter((id) => q.data.holes.some((h) => h.holeId === id))} />;
}

function HolePicker({ holes, lines, value, onChange, invalid }: {
  holes: Hole[]; lines: TravelerDetail['lines']; value: string[]; onChange: (ids: string[]) => void; invalid: boolean;
}) {
  const toggle = (id: string) => onChange(value.includes(id) ? value.filter((v) => v !== id) : [...value, id]);
  return (
    <View style={{ gap: space.md }}>
      {lines.map((l) => (
        <View key={l.code} style={{ gap: space.xs }}>
          <Txt variant="small" bold><Mono variant="small" bold>{l.code}</Mono> {l.name}</Txt>
          <View style={styles.holes}>
            {holes.filter((h) => h.line === l.code).sort((a, b) => a.seq - b.seq).map((h) => {
              const on = value.includes(h.holeId);
              return (
                <Pressable
                  key={h.holeId}
                  testID={`pick-hole-${h.holeId}`}
                  accessibilityRole="checkbox"
                  aria-checked={on}
                  accessibilityLabel={`Hole ${h.holeId}`}
                  onPress={() => toggle(h.holeId)}
                  style={[styles.hole, on && styles.holeOn, invalid && !value.length && { borderColor: colors.error }]}
                >
                  <HoleMark status={h.status} size={16} />
                  <Mono bold={on} tone={on ? 'inverse' : 'ink'}>{h.holeId}</Mono>
                </Pressable>
              );
            })}
          </View>
        </View>
      ))}
    </View>
  );
}

function FlagForm({ t, initialHoleIds }: { t: TravelerDetail; initialHoleIds: string[] }) {
  const router = useRouter();
  const create = useFindingCreateMutation();
  const draft = useFindingDraft(t.id);
  const [photos, setPhotos] = useState<DraftPhoto[]>([]);
  const [photoError, setPhotoError] = useState<string | null>(null);
  const [formError, setFormError] = useState<{ text: string; kept: boolean } | null>(null);
  const [restoredAt, setRestoredAt] = useState<string | null>(null);
  const restoredOnce = useRef(false);
  const saveDraft = draft.save;

  const { control, handleSubmit, setError, reset, watch, getValues, formState } = useForm<Values, unknown, z.output<typeof findingInput>>({
    resolver: zodResolver(findingInput, plainParse),
    mode: 'onChange',
    defaultValues: { travelerId: t.id, holeIds: initialHoleIds, kind: undefined, note: '' },
  });

  // Bring back an unsent finding from before, once the stored draft has been read.
  useEffect(() => {
    if (!draft.loaded || restoredOnce.current) return;
    restoredOnce.current = true;
    const d = draft.restored;
    if (!d) return;
    const holeIds = Array.from(new Set([...d.values.holeIds, ...initialHoleIds])).filter((id) => t.holes.some((h) => h.holeId === id));
    reset({ travelerId: t.id, holeIds, kind: d.values.kind, note: d.values.note });
    setPhotos(d.photos);
    setRestoredAt(d.savedAt);
  }, [draft.loaded, draft.restored, initialHoleIds, reset, t.holes, t.id]);

  // Keep the draft as the person works.
  useEffect(() => {
    const sub = watch((v) => saveDraft({
      values: { holeIds: (v.holeIds ?? []).filter((x): x is string => !!x), kind: v.kind, note: v.note ?? '' },
      photos,
    }));
    return () => sub.unsubscribe();
  }, [watch, saveDraft, photos]);
  useEffect(() => {
    const v = getValues();
    saveDraft({ values: { holeIds: v.holeIds ?? [], kind: v.kind, note: v.note ?? '' }, photos });
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [photos]);

  const add = async (from: 'library' | 'camera') => {
    setPhotoError(null);
    const r = await pickPhotos(from, maxPhotos - photos.length);
    if ('error' in r) setPhotoError(r.error);
    else if (r.length) setPhotos((p) => [...p, ...r].slice(0, maxPhotos));
  };

  const startOver = async () => {
    await draft.clear();
    reset({ travelerId: t.id, holeIds: initialHoleIds, kind: undefined, note: '' });
    setPhotos([]);
    setRestoredAt(null);
    setFormError(null);
    setPhotoError(null);
  };

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    if (!photos.length) {
      setPhotoError('Add at least one photo of the hole.');
      return;
    }
    try {
      await draft.flush();
      const f = await create.mutateAsync({ input: values, photos });
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
        setFormError({ text: 'No connection, so the finding was not sent. It is kept on this device: send it again when you have signal.', kept: true });
        return;
      }
      const text = applyServerErrors(setError, e, (path) => {
        if (path.startsWith('photos')) {
          setPhotoError(e instanceof ApiError ? e.fields?.[path] ?? e.message : null);
          return null;
        }
        return ['holeIds', 'kind', 'note'].some((f) => path === f || path.startsWith(`${f}.`)) ? path.split('.')[0] : null;
      });
      if (e instanceof ApiError && (e.status === 413 || e.status === 415)) setPhotoError(e.message);
      setFormError({ text: `Not sent. ${text} Your finding is still here.`, kept: true });
    }
  }, () => {
    if (!photos.length) setPhotoError('Add at least one photo of the hole.');
  });

  return (
    <Screen
      title="Flag a hole"
      subtitle={`${t.partNumber} ${t.partName} · rev ${t.letter} · ${t.serial}`}
      backTo={`/travelers/${t.id}`}
      testID="flag-screen"
    >
      {restoredAt ? (
        <Notice tone="caution" testID="draft-restored">
          <Txt>Your unsent finding from {shortDate(restoredAt)} is back.</Txt>
          <Button label="Start over" variant="quiet" compact onPress={() => void startOver()} testID="discard-draft" />
        </Notice>
      ) : null}
      <Section title="Which hole">
        <Controller
          control={control}
          name="holeIds"
          render={({ field, fieldState }) => (
            <Field label="Suspect hole(s)" hint="Tap each hole that looks wrong." error={fieldState.error?.message} testID="finding-holes">
              <HolePicker holes={t.holes} lines={t.lines} value={field.value ?? []} onChange={field.onChange} invalid={!!fieldState.error} />
            </Field>
          )}
        />
      </Section>
      <Section title="What is wrong">
        <FormChoiceField
          control={control}
          name="kind"
          label="Kind"
          testID="finding-kind"
          options={findingKinds.map((k) => ({ value: k, label: findingKindLabels[k] }))}
        />
        <FormTextField
          control={control}
          name="note"
          label="Note"
          hint="What you see, where, and anything you already measured."
          testID="finding-note"
          multiline
          maxLength={2000}
        />
      </Section>
      <Section title="Photos">
        <PhotoPicker photos={photos} onAdd={(from) => void add(from)} onRemove={(i) => setPhotos((p) => p.filter((_, j) => j !== i))} error={photoError} />
      </Section>
      {formError ? <Notice tone="error" testID="finding-error">{formError.text}</Notice> : null}
      <Button
        label="Send to the inspector"
        busyLabel="Sending photos"
        busy={formState.isSubmitting || create.isPending}
        onPress={() => void submit()}
        testID="submit-finding"
      />
      <Txt variant="small" tone="faint">Until it is sent, this finding is kept on this device.</Txt>
    </Screen>
  );
}

const styles = StyleSheet.create({
  holes: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  hole: {
    flexDirection: 'row', alignItems: 'center', gap: space.xs, minHeight: touch, minWidth: 88, paddingHorizontal: space.sm,
    borderWidth: hairline, borderColor: colors.ruleStrong, borderRadius: radius.sm, backgroundColor: colors.paperRaised,
  },
  holeOn: { backgroundColor: colors.ink, borderColor: colors.ink },
});
