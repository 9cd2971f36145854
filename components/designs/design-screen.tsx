import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { useForm, type Resolver } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import {
  findingKindLabels,
  partKindLabels,
  publishWarning,
  revisionInput,
  type FindingKind,
  type PartDesignDetail,
  type Revision,
  type RevisionStatus,
} from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { FormError } from '@/components/forms/form-error';
import { FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { applyServerErrors } from '@/components/forms/server-errors';
import { fieldsNeedALook, useFormSubmit } from '@/components/forms/use-form-submit';
import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { Screen } from '@/components/ui/screen';
import { Section, Sheet } from '@/components/ui/sheet';
import { EmptyState, ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { errorMessage } from '@/lib/api-client';
import { useSession } from '@/hooks/use-session';
import {
  useDesignFindingClustersQuery,
  useDesignQuery,
  useDesignRevisionCreateMutation,
  useDesignRevisionDiscardMutation,
  useDesignRevisionPublishMutation,
  useDesignRevisionUpdateMutation,
} from '@/hooks/queries/designs';
import { shortDate } from '@/components/findings/finding-row';
import { revisionToInput, RevisionFields } from './revision-fields';
import { ConfirmStep } from './confirm-step';
import { RevisionView } from './revision-view';

const statusWords: Record<RevisionStatus, string> = {
  draft: 'Draft',
  published: 'Published',
  superseded: 'Superseded',
};

type RevValues = z.input<typeof revisionInput>;
type RevOut = z.output<typeof revisionInput>;

const baseResolver = zodResolver(revisionInput, plainParse);

/** A new revision must say what changed: the contract allows an empty note, a new revision does not. */
const newRevisionResolver: Resolver<RevValues, unknown, RevOut> = async (values, ctx, opts) => {
  const r = await baseResolver(values, ctx, opts);
  if ((values.changeNote ?? '').trim().length < 3) {
    return {
      values: {},
      errors: { ...r.errors, changeNote: { type: 'custom', message: 'say what changed and why, in a few words' } },
    };
  }
  return r;
};

export function DesignScreen({ designId }: { designId: string }) {
  const q = useDesignQuery(designId);
  if (q.isPending)
    return (
      <Screen title="Part design" backTo="/catalogue">
        <LoadingState what="Loading the design" />
      </Screen>
    );
  if (q.isError)
    return (
      <Screen title="Part design" backTo="/catalogue">
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      </Screen>
    );
  return <DesignBody d={q.data} />;
}

function RevisionHead({ r }: { r: Revision }) {
  return (
    <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'baseline', flexWrap: 'wrap' }}>
      <Mono bold variant="title">
        {r.letter}
      </Mono>
      <Txt
        bold
        tone={r.status === 'published' ? 'accent' : r.status === 'draft' ? 'caution' : 'faint'}
        testID={`revision-${r.letter}-status`}
      >
        {statusWords[r.status]}
      </Txt>
      <Txt variant="small" tone="soft">
        made {shortDate(r.createdAt)}
      </Txt>
    </View>
  );
}

function DesignBody({ d }: { d: PartDesignDetail }) {
  const revisions = d.revisions;
  const draft = revisions.find((r) => r.status === 'draft');
  const published = revisions.find((r) => r.status === 'published');
  const [making, setMaking] = useState(false);
  const router = useRouter();
  return (
    <Screen
      title={`${d.partNumber} · ${d.name}`}
      subtitle={`${partKindLabels[d.kind]} · ${d.kitName}${d.publishedLetter ? ` · published revision ${d.publishedLetter}` : ' · nothing published yet'}`}
      backTo="/catalogue"
      testID="design-screen"
    >
      <Button
        label={`Kit model: ${d.kitName}`}
        variant="quiet"
        compact
        onPress={() => router.push(`/catalogue/kits/${d.kitModelId}`)}
        testID="open-kit"
      />
      {draft ? <DraftEditor designId={d.id} r={draft} /> : null}
      {!draft && !making ? (
        <Button
          label="Start a new revision"
          variant="secondary"
          onPress={() => setMaking(true)}
          testID="new-revision"
        />
      ) : null}
      {!draft && making ? (
        <NewRevisionForm designId={d.id} from={published ?? revisions[0]} onDone={() => setMaking(false)} />
      ) : null}
      {revisions
        .filter((r) => r.status !== 'draft')
        .map((r) => (
          <Sheet key={r.id} testID={`revision-${r.letter}`}>
            <RevisionHead r={r} />
            <Txt testID={`revision-${r.letter}-approved`}>
              {r.publishedAt ? `Published ${shortDate(r.publishedAt)}` : ''}
              {r.publishedByName ? ` · approved by ${r.publishedByName}` : ''}
            </Txt>
            {r.changeNote ? <Txt tone="soft">Change: “{r.changeNote}”</Txt> : null}
            <Txt variant="small" tone="faint">
              A published revision is frozen. Changes go into a new revision.
            </Txt>
            <RevisionView r={r} />
          </Sheet>
        ))}
      <FindingClusters designId={d.id} />
      <Caution />
    </Screen>
  );
}

/** Where findings cluster on this part across every build: what a revised part should look at first. */
function FindingClusters({ designId }: { designId: string }) {
  const q = useDesignFindingClustersQuery(designId);
  return (
    <Section title="Findings across builds" testID="finding-clusters">
      {q.isPending ? (
        <LoadingState what="Counting findings across builds" />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      ) : q.data.length === 0 ? (
        <EmptyState title="No findings on this part in any build yet." />
      ) : (
        q.data.map((c) => (
          <View
            key={`${c.letter}-${c.holeId}`}
            style={{ paddingVertical: space.sm, borderBottomWidth: hairline, borderColor: colors.rule }}
            testID={`cluster-${c.letter}-${c.holeId}`}
          >
            <Txt>
              <Mono bold>{c.holeId}</Mono> · rev <Mono>{c.letter}</Mono> · <Txt bold>{c.count}</Txt> finding
              {c.count === 1 ? '' : 's'} in {c.builds} build{c.builds === 1 ? '' : 's'}
              {c.open ? <Txt tone="caution"> · {c.open} open</Txt> : null}
            </Txt>
            <Txt variant="small" tone="soft">
              {Object.entries(c.kinds)
                .map(([k, n]) => `${findingKindLabels[k as FindingKind]} ×${n}`)
                .join(' · ')}{' '}
              · last {shortDate(c.lastAt)}
            </Txt>
          </View>
        ))
      )}
    </Section>
  );
}

function DraftEditor({ designId, r }: { designId: string; r: Revision }) {
  const update = useDesignRevisionUpdateMutation(designId);
  const publish = useDesignRevisionPublishMutation(designId);
  const discard = useDesignRevisionDiscardMutation(designId);
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  /** Which final step is being confirmed: both are asked before the request goes. */
  const [asking, setAsking] = useState<'publish' | 'discard' | null>(null);
  const may = (a: Revision['allowedActions'][number]) => r.allowedActions.includes(a);
  const { control, handleSubmit, setError, formState, reset } = useForm<RevValues, unknown, RevOut>({
    resolver: baseResolver,
    mode: 'onChange',
    defaultValues: revisionToInput(r),
  });
  const { user } = useSession();

  const save = async (values: RevOut): Promise<boolean> => {
    setFormError(null);
    try {
      const next = await update.mutateAsync({ revisionId: r.id, input: values });
      reset(revisionToInput(next));
      setSaved(true);
      return true;
    } catch (e) {
      setFormError(applyServerErrors(setError, e));
      return false;
    }
  };

  const onSave = handleSubmit(
    async (v) => {
      await save(v);
    },
    () => setFormError(fieldsNeedALook),
  );

  const onPublish = async () => {
    setFormError(null);
    const go = async () => {
      try {
        await publish.mutateAsync(r.id);
        setAsking(null);
      } catch (e) {
        setFormError(errorMessage(e));
      }
    };
    if (formState.isDirty) {
      // Publish what is on screen: save the edits first.
      await handleSubmit(
        async (v) => {
          if (await save(v)) await go();
        },
        () => setFormError('Fix the marked fields before publishing.'),
      )();
    } else {
      await go();
    }
  };

  const onDiscard = async () => {
    setFormError(null);
    try {
      await discard.mutateAsync(r.id);
    } catch (e) {
      setFormError(errorMessage(e));
    }
  };

  return (
    <View style={{ gap: space.xl }} testID={`revision-${r.letter}`}>
      <Sheet style={{ borderColor: colors.caution, borderWidth: 2 }}>
        <RevisionHead r={r} />
        <Txt>This draft can still change. Builders see nothing of it until it is published.</Txt>
        {may('discard') && asking !== 'discard' ? (
          <Button
            label="Discard this draft…"
            variant="secondary"
            compact
            onPress={() => {
              setAsking('discard');
              setFormError(null);
            }}
            testID="discard-draft"
          />
        ) : null}
        {asking === 'discard' ? (
          <ConfirmStep
            testID="discard-ask"
            message={`Discard draft revision ${r.letter}? Its edits are thrown away. ${r.letter === 'A' ? 'The part stays in the catalogue, with no revision until you start one.' : 'The published revisions of this part stay as they are.'}`}
            confirmLabel={`Discard revision ${r.letter}`}
            danger
            busy={discard.isPending}
            error={formError}
            onConfirm={() => void onDiscard()}
            onCancel={() => setAsking(null)}
          />
        ) : null}
      </Sheet>
      <RevisionFields control={control} />
      <FormTextField
        control={control}
        name="changeNote"
        label="Change note"
        hint="What changed from the last revision, and why."
        testID="rev-change-note"
        multiline
      />
      <FormError message={formError} testID="revision-error" />
      {saved && !formState.isDirty ? (
        <Notice tone="ok" testID="draft-saved">
          Draft saved.
        </Notice>
      ) : null}
      {may('edit') ? (
        <Button
          label="Save draft"
          variant="secondary"
          busy={update.isPending && !publish.isPending}
          onPress={() => void onSave()}
          testID="save-draft"
        />
      ) : null}
      {may('publish') ? (
        <Section title={`Publish revision ${r.letter}`}>
          <Txt>
            Publishing freezes this revision. New builds get travelers made from it; unfinished travelers of an older
            revision show a notice.
          </Txt>
          <Txt testID="approver">
            Publishing is your approval: every traveler made from revision {r.letter} names {user?.name ?? 'you'} as the
            approver.
          </Txt>
          <View style={{ borderTopWidth: hairline, borderColor: colors.rule }} />
          {asking === 'publish' ? (
            <ConfirmStep
              testID="publish-ask"
              message={publishWarning(r.letter)}
              confirmLabel={`Approve and publish ${r.letter}`}
              busy={publish.isPending || update.isPending}
              onConfirm={() => void onPublish()}
              onCancel={() => setAsking(null)}
            />
          ) : (
            <Button
              label={`Publish revision ${r.letter}…`}
              onPress={() => {
                setAsking('publish');
                setFormError(null);
              }}
              testID="publish"
            />
          )}
        </Section>
      ) : null}
    </View>
  );
}

function NewRevisionForm({ designId, from, onDone }: { designId: string; from?: Revision; onDone: () => void }) {
  const create = useDesignRevisionCreateMutation(designId);
  const { control, handleSubmit, setError, formState } = useForm<RevValues, unknown, RevOut>({
    resolver: newRevisionResolver,
    mode: 'onChange',
    defaultValues: from ? revisionToInput(from) : undefined,
  });
  const { submit, formError } = useFormSubmit({
    handleSubmit,
    setError,
    send: async (v) => {
      await create.mutateAsync(v);
      onDone();
    },
  });
  return (
    <View style={{ gap: space.xl }} testID="new-revision-form">
      <Notice>
        {from
          ? `The new revision starts as a copy of revision ${from.letter}.`
          : 'The part has no revision yet: fill in the new one.'}{' '}
        It stays a draft until you publish it.
      </Notice>
      <FormTextField
        control={control}
        name="changeNote"
        label="Change note"
        hint="What changes, and why (required)."
        testID="rev-change-note"
        multiline
      />
      <RevisionFields control={control} />
      <FormError message={formError} testID="revision-error" />
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button
          label="Make the draft"
          busy={formState.isSubmitting}
          onPress={() => void submit()}
          testID="submit-new-revision"
        />
        <Button label="Cancel" variant="quiet" onPress={onDone} testID="cancel-new-revision" />
      </View>
    </View>
  );
}
