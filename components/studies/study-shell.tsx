import { useRouter } from 'expo-router';
import { Fragment, useMemo, useState, type ReactElement, type ReactNode } from 'react';
import { View } from 'react-native';
import type { KitModel, StudyDetail } from '@/db/contracts';
import { space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { Choice } from '@/components/ui/choice';
import { Screen } from '@/components/ui/screen';
import { Section, Sheet } from '@/components/ui/sheet';
import { EmptyState, ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { TwoPane } from '@/components/ui/two-pane';
import { UnitsSwitch } from '@/components/ui/units-switch';
import { useKitsQuery } from '@/hooks/queries/kits';
import { useStudyCreateMutation, useStudyUpdateMutation, type StudyBodyInput } from '@/hooks/queries/studies';
import { useWide } from '@/hooks/use-wide';
import { studyHref, whenText } from './study-links';

/** What the shell hands the study's form: both forms take these props the same way. */
export type ShellFormProps = {
  isNew: boolean;
  submitLabel: string;
  note?: ReactNode;
  onSubmit: (values: StudyBodyInput) => Promise<void>;
};

/**
 * A computed study, rib or wing: the revisions to pick from, then its inputs and results side by side
 * on a wide screen, or one at a time on a phone (results first; the other stays mounted so no typing is
 * lost). Computing makes the next revision and goes back to the latest.
 */
export function StudyDetailShell({
  d,
  testID,
  kindLabel,
  leftWidth,
  form,
  results,
}: {
  d: StudyDetail;
  testID: string;
  /** Said before the kit's name in the subtitle ("Wing study"). */
  kindLabel?: string;
  /** The form's share of a wide screen. */
  leftWidth: number;
  form: (p: ShellFormProps) => ReactElement;
  results: (latestRevision: number) => ReactElement;
}) {
  const router = useRouter();
  const update = useStudyUpdateMutation(d.id);
  const latest = d.revisions.reduce((m, r) => Math.max(m, r.revision), d.revision);
  const older = d.revision !== latest;
  const wide = useWide();
  const [pane, setPane] = useState<'results' | 'inputs'>('results');
  const revisions = [...d.revisions].sort((a, b) => b.revision - a.revision);
  const shownRev = revisions.find((r) => r.revision === d.revision);

  // Keyed by revision: another revision's inputs start a fresh form.
  const inputs = (
    <Fragment key={`${d.id}-${d.revision}`}>
      {form({
        isNew: false,
        submitLabel: `Compute as revision ${latest + 1}`,
        note: older ? (
          <Notice tone="caution" testID="study-older-note">
            {`These are the inputs of revision ${d.revision}. Computing makes them revision ${latest + 1}; revision ${d.revision} stays as it was.`}
          </Notice>
        ) : undefined,
        onSubmit: async (values) => {
          await update.mutateAsync(values);
          setPane('results');
          router.replace(studyHref(d.id));
        },
      })}
    </Fragment>
  );
  const shown = results(latest);

  return (
    <Screen
      title={d.name}
      subtitle={`${kindLabel ? `${kindLabel} · ` : ''}${d.kitName} · revision ${d.revision}${older ? ` of ${latest}` : ' (latest)'}`}
      backTo="/studies"
      full
      testID={testID}
      right={<UnitsSwitch />}
    >
      <Section title="Revisions" testID="study-revisions">
        <Choice
          testIDPrefix="study-revision"
          value={String(d.revision)}
          onChange={(v) => {
            const n = Number(v);
            router.replace(studyHref(d.id, n === latest ? undefined : n));
          }}
          options={revisions.map((r) => ({
            value: String(r.revision),
            label: wide
              ? `Revision ${r.revision}${r.revision === latest ? ' · latest' : ''}`
              : `${r.revision}${r.revision === latest ? ' · latest' : ''}`,
            // On a phone the chips stay small; the one on show says who computed it and when, below.
            hint: wide ? `${whenText(r.createdAt)} · ${r.createdByName}` : undefined,
          }))}
        />
        {!wide && shownRev ? (
          <Txt variant="small" tone="soft">
            Revision {shownRev.revision}: {whenText(shownRev.createdAt)} · {shownRev.createdByName}
          </Txt>
        ) : null}
      </Section>
      {wide ? (
        <TwoPane leftWidth={leftWidth} left={inputs} right={shown} />
      ) : (
        <>
          <Choice
            testIDPrefix="study-pane"
            value={pane}
            onChange={setPane}
            options={[
              { value: 'results', label: 'Results' },
              { value: 'inputs', label: 'Inputs' },
            ]}
          />
          <View style={{ display: pane === 'inputs' ? 'flex' : 'none' }}>{inputs}</View>
          <View style={{ display: pane === 'results' ? 'flex' : 'none' }}>{shown}</View>
        </>
      )}
    </Screen>
  );
}

/**
 * A new study, rib or wing: the kit models first (each study works from one), then the form beside
 * what the results will hold; "Compute" makes revision 1 and opens it.
 */
export function NewStudyShell<V>({
  kitModelId,
  title,
  subtitle,
  testID,
  needs,
  promise,
  valuesFor,
  form,
}: {
  kitModelId?: string;
  title: string;
  subtitle: string;
  testID: string;
  /** Why a kit model is needed first, said when there is none. */
  needs: string;
  /** What the results will show, said where they will be. */
  promise: string;
  valuesFor: (kit: KitModel | undefined) => V;
  form: (p: ShellFormProps & { kits: KitModel[]; defaultValues: V }) => ReactElement;
}) {
  const router = useRouter();
  const kits = useKitsQuery();
  const create = useStudyCreateMutation();
  // The kit asked for, or the only one there is.
  const kit = kits.data?.find((k) => k.id === kitModelId) ?? (kits.data?.length === 1 ? kits.data[0] : undefined);
  const defaults = useMemo(() => valuesFor(kit), [kit, valuesFor]);

  return (
    <Screen title={title} subtitle={subtitle} backTo="/studies" full testID={testID} right={<UnitsSwitch />}>
      {kits.isPending ? (
        <LoadingState what="Loading kit models" />
      ) : kits.isError ? (
        <ErrorState error={kits.error} onRetry={() => void kits.refetch()} />
      ) : !kits.data.length ? (
        <EmptyState
          title="Make a kit model first."
          body={needs}
          action={
            <Button label="New kit model" onPress={() => router.push('/catalogue/new-kit')} testID="study-new-kit" />
          }
        />
      ) : (
        <TwoPane
          leftWidth={0.55}
          left={
            // A kit chosen in the address starts the form afresh from its data.
            <Fragment key={kit?.id ?? 'none'}>
              {form({
                kits: kits.data,
                defaultValues: defaults,
                isNew: true,
                submitLabel: 'Compute',
                onSubmit: async (values) => {
                  const made = await create.mutateAsync(values);
                  router.replace(studyHref(made.id));
                },
              })}
            </Fragment>
          }
          right={
            <View style={{ gap: space.lg }}>
              <Caution />
              <Sheet>
                <Txt bold>Results show here once computed.</Txt>
                <Txt tone="soft">{promise}</Txt>
              </Sheet>
            </View>
          }
        />
      )}
    </Screen>
  );
}
