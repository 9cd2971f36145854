import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { Controller, useForm, useWatch, type Control, type Resolver } from 'react-hook-form';
import { View } from 'react-native';
import { z } from 'zod';
import {
  MAX_NOTICE_FILES,
  noticeInput,
  noticeLevelLabels,
  noticeLevels,
  noticeReachLabels,
  noticeReaches,
  type NoticeChange,
  type NoticeLevel,
  type NoticeReach,
  type PartDesignSummary,
} from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { FormError } from '@/components/forms/form-error';
import { FormChoiceField, FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { errorAt } from '@/components/forms/server-errors';
import { useFormSubmit } from '@/components/forms/use-form-submit';
import { photoRefusal, pickPhotos } from '@/components/findings/photo-picker';
import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { MultiChoice } from '@/components/ui/choice';
import { Field } from '@/components/ui/field';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/sheet';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { TwoPane } from '@/components/ui/two-pane';
import { ApiError } from '@/lib/api-client';
import { PhotoReadError } from '@/lib/photo-form-data';
import { useDesignQuery, useDesignsQuery } from '@/hooks/queries/designs';
import { useKitQuery } from '@/hooks/queries/kits';
import { useNoticeIssueMutation, type DraftFile } from '@/hooks/queries/notices';
import { useSession } from '@/hooks/use-session';
import { NoticeFilesPicker, pickPdf } from './notice-files';
import { noticeCaution, noticeHref } from './notice-marks';

type Values = {
  kitModelId: string;
  level: NoticeLevel | undefined;
  title: string;
  body: string;
  serialFrom: string;
  serialTo: string;
  reaches: NoticeReach;
  parts: { partDesignId: string; letters: string[] }[];
};

/** An empty serial box is "no range" (every serial), not a serial of no characters. */
const blankToNone = (s: unknown) => (typeof s === 'string' && s.trim() === '' ? undefined : s);
const formSchema = z.preprocess((f: Values) => {
  return { ...f, serialFrom: blankToNone(f.serialFrom), serialTo: blankToNone(f.serialTo) };
}, noticeInput);
const resolver = zodResolver(formSchema, plainParse) as unknown as Resolver<Values, unknown, NoticeChange>;

/** The server's paths onto the form's fields: a part's letters are said under the parts chooser. */
function toField(path: string): string | null {
  if (path.startsWith('parts')) return 'parts';
  return ['kitModelId', 'level', 'title', 'body', 'serialFrom', 'serialTo', 'reaches'].includes(path) ? path : null;
}

export function NoticeFormScreen({ kitId }: { kitId: string }) {
  const kit = useKitQuery(kitId);
  const back = `/catalogue/kits/${kitId}` as const;
  if (kit.isPending)
    return (
      <Screen title="Issue a notice" backTo={back}>
        <LoadingState what="Loading the kit model" />
      </Screen>
    );
  if (kit.isError)
    return (
      <Screen title="Issue a notice" backTo={back}>
        <ErrorState error={kit.error} onRetry={() => void kit.refetch()} />
      </Screen>
    );
  return (
    <Screen
      title="Issue a notice"
      subtitle={`${kit.data.code} · ${kit.data.name}`}
      backTo={back}
      full
      testID="notice-form-screen"
      focusTitle
    >
      <View style={{ width: '100%', maxWidth: 1200, alignSelf: 'center' }}>
        <NoticeForm kitId={kitId} kitCode={kit.data.code} />
      </View>
    </Screen>
  );
}

function NoticeForm({ kitId, kitCode }: { kitId: string; kitCode: string }) {
  const router = useRouter();
  const { user } = useSession();
  const issue = useNoticeIssueMutation();
  const [files, setFiles] = useState<DraftFile[]>([]);
  const [fileError, setFileError] = useState<string | null>(null);
  const { control, handleSubmit, setError, formState } = useForm<Values, unknown, NoticeChange>({
    resolver,
    mode: 'onTouched',
    defaultValues: {
      kitModelId: kitId,
      level: undefined,
      title: '',
      body: '',
      serialFrom: '',
      serialTo: '',
      reaches: 'all',
      parts: [],
    },
  });
  // The fields hold the form's values; only the resolver's answer has the contract's shape.
  const fieldControl = control as unknown as Control<Values>;
  const { submit, formError } = useFormSubmit({
    handleSubmit,
    setError,
    toField: (path) => {
      if (path === 'files' || path.startsWith('files.')) return null;
      return toField(path);
    },
    refusal: (e, left) => {
      if (e instanceof PhotoReadError) {
        setFileError(e.message);
        return 'Not sent: a file could not be read (see the files). What you wrote is still here.';
      }
      if (e instanceof ApiError && e.isNetwork)
        return 'No connection, so nothing was sent. What you wrote is still here: send it again when you have signal.';
      if (e instanceof ApiError && Object.keys(e.fields ?? {}).some((k) => k.startsWith('files'))) {
        setFileError(e.fields?.files ?? e.message);
        return 'Not sent: a file was refused (see the files). What you wrote is still here.';
      }
      const refused = photoRefusal(e);
      if (refused) {
        setFileError(refused);
        return 'Not sent: a file was refused (see the files). What you wrote is still here.';
      }
      return left;
    },
    send: async (input) => {
      setFileError(null);
      const n = await issue.mutateAsync({ input, files });
      router.replace(noticeHref(n.id, user?.role));
    },
  });

  const room = MAX_NOTICE_FILES - files.length;
  const addPhoto = async () => {
    setFileError(null);
    const r = await pickPhotos('library', room);
    setFileError(r.error);
    if (r.photos.length) setFiles((f) => [...f, ...r.photos].slice(0, MAX_NOTICE_FILES));
  };
  const addPdf = async () => {
    setFileError(null);
    const r = await pickPdf();
    setFileError(r.error);
    if (r.file) setFiles((f) => [...f, r.file!].slice(0, MAX_NOTICE_FILES));
  };

  const what = (
    <Section title="The notice">
      <FormChoiceField
        control={fieldControl}
        name="level"
        label="Level"
        testID="notice-level"
        options={noticeLevels.map((l) => ({ value: l, label: noticeLevelLabels[l] }))}
      />
      <FormTextField control={fieldControl} name="title" label="Title" testID="notice-title" maxLength={140} />
      <FormTextField
        control={fieldControl}
        name="body"
        label="What it asks"
        hint="What to check or do, on which parts, and how to tell it is done."
        testID="notice-text"
        multiline
        maxLength={8000}
      />
      <Field label="Files (optional)">
        <NoticeFilesPicker
          files={files}
          onAddPhoto={() => void addPhoto()}
          onAddPdf={() => void addPdf()}
          onRemove={(i) => setFiles((f) => f.filter((_, j) => j !== i))}
          error={fileError}
        />
      </Field>
    </Section>
  );

  const reach = (
    <>
      <Section title="Which kits">
        <Txt variant="small" tone="soft">
          Leave both empty for every {kitCode} shipped. A range counts the number at the end of the serial.
        </Txt>
        <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap' }}>
          <View style={{ flex: 1, minWidth: 160 }}>
            <FormTextField
              control={fieldControl}
              name="serialFrom"
              label="First kit serial"
              testID="notice-serial-from"
              autoCapitalize="characters"
              maxLength={40}
              mono
            />
          </View>
          <View style={{ flex: 1, minWidth: 160 }}>
            <FormTextField
              control={fieldControl}
              name="serialTo"
              label="Last kit serial"
              testID="notice-serial-to"
              autoCapitalize="characters"
              maxLength={40}
              mono
            />
          </View>
        </View>
      </Section>
      <Section title="Which parts">
        <PartsChooser control={fieldControl} kitId={kitId} error={errorAt(formState.errors, 'parts')} />
        <FormChoiceField
          control={fieldControl}
          name="reaches"
          label="Of those parts"
          testID="notice-reaches"
          options={noticeReaches.map((r) => ({ value: r, label: noticeReachLabels[r] }))}
        />
      </Section>
      <Caution text={noticeCaution} testID="notice-caution" />
      <FormError message={formError} testID="notice-error" />
      <Button
        label="Issue the notice"
        busyLabel="Issuing"
        busy={formState.isSubmitting}
        onPress={() => void submit()}
        testID="notice-submit"
      />
      <Txt variant="small" tone="faint">
        Every reached build sees it on its page and on the parts it names; it goes into each build’s log.
      </Txt>
    </>
  );

  return <TwoPane left={what} right={reach} />;
}

/**
 * The kit's part designs that have been published (only those are in shipped builds), each chosen or
 * not; a chosen design offers its published revisions, none chosen meaning every revision.
 */
function PartsChooser({ control, kitId, error }: { control: Control<Values>; kitId: string; error?: string }) {
  const designs = useDesignsQuery(kitId);
  const parts = useWatch({ control, name: 'parts' });
  if (designs.isPending) return <LoadingState what="Loading the kit’s parts" />;
  if (designs.isError) return <ErrorState error={designs.error} onRetry={() => void designs.refetch()} />;
  const shipped = designs.data.filter((d) => d.publishedLetter !== null);
  return (
    <Controller
      control={control}
      name="parts"
      render={({ field }) => {
        const value = field.value ?? [];
        const toggle = (id: string) =>
          field.onChange(
            value.some((p) => p.partDesignId === id)
              ? value.filter((p) => p.partDesignId !== id)
              : [...value, { partDesignId: id, letters: [] }],
          );
        const setLetters = (id: string, letters: string[]) =>
          field.onChange(value.map((p) => (p.partDesignId === id ? { ...p, letters } : p)));
        return (
          <Field label="Part designs" hint="None chosen: the kit as a whole." error={error} testID="notice-parts-field">
            {shipped.length ? (
              <MultiChoice
                label="Part designs"
                testIDPrefix="notice-part"
                options={shipped.map((d) => ({ value: d.id, label: `${d.partNumber} ${d.name}`, key: d.partNumber }))}
                values={value.map((p) => p.partDesignId)}
                onToggle={toggle}
              />
            ) : (
              <Txt tone="soft">No part of this kit is published yet: the notice can be about the kit as a whole.</Txt>
            )}
            {(parts ?? []).map((p) => {
              const d = shipped.find((x) => x.id === p.partDesignId);
              return d ? (
                <Letters key={p.partDesignId} design={d} letters={p.letters} onChange={(l) => setLetters(d.id, l)} />
              ) : null;
            })}
          </Field>
        );
      }}
    />
  );
}

/** One chosen design's revisions that reached builds (published or since superseded). */
function Letters({
  design,
  letters,
  onChange,
}: {
  design: PartDesignSummary;
  letters: string[];
  onChange: (letters: string[]) => void;
}) {
  const q = useDesignQuery(design.id);
  const shipped = (q.data?.revisions ?? []).filter((r) => r.status !== 'draft').map((r) => r.letter);
  return (
    <View style={{ gap: space.xs, paddingLeft: space.md, borderLeftWidth: hairline, borderColor: colors.rule }}>
      <Txt variant="small">
        <Mono variant="small" bold>
          {design.partNumber}
        </Mono>{' '}
        revisions (none chosen: every revision)
      </Txt>
      {q.isPending ? (
        <Txt variant="small" tone="soft">
          Loading its revisions…
        </Txt>
      ) : (
        <MultiChoice
          label={`Revisions of ${design.partNumber}`}
          testIDPrefix={`notice-letter-${design.partNumber}`}
          options={shipped.map((l) => ({ value: l, label: `Rev ${l}` }))}
          values={letters}
          onToggle={(l) => onChange(letters.includes(l) ? letters.filter((x) => x !== l) : [...letters, l])}
        />
      )}
    </View>
  );
}
