import { useRouter } from 'expo-router';
import { useMemo, useState } from 'react';
import { View } from 'react-native';
import type { KitModel, StudyDetail } from '@/db/contracts';
import { space } from '@/constants/theme';
import { Caution } from '@/components/ui/caution';
import { Choice } from '@/components/ui/choice';
import { Screen } from '@/components/ui/screen';
import { Section, Sheet } from '@/components/ui/sheet';
import { EmptyState, ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { TwoPane } from '@/components/ui/two-pane';
import { UnitsSwitch } from '@/components/ui/units-switch';
import { Button } from '@/components/ui/button';
import { ApiError } from '@/hooks/api-client';
import { useKitsQuery } from '@/hooks/queries/kits';
import { useStudyCreateMutation, useStudyQuery, useStudyUpdateMutation } from '@/hooks/queries/studies';
import { useWide } from '@/hooks/use-wide';
import { StudyForm } from './study-form';
import { newStudyValues, studyValues } from './study-form-values';
import { studyHref, whenText } from './study-links';
import { StudyResults } from './study-results';
import { WingStudyBody } from './wing-screen';

export { whenText };

/**
 * One load study: its inputs on the left, the computed revision's pictures and tables on the right; a
 * rib's or a whole wing's by the study's kind.
 */
export function StudyScreen({ studyId, revision }: { studyId: string; revision?: number }) {
  const q = useStudyQuery(studyId, revision);
  const kits = useKitsQuery();
  if (q.isPending || kits.isPending) {
    return <Screen title="Load study" backTo="/studies"><LoadingState what={revision ? `Loading revision ${revision}` : 'Loading the study'} /></Screen>;
  }
  if (q.isError || kits.isError) {
    const error = q.error ?? kits.error;
    return (
      <Screen title="Load study" backTo="/studies">
        <ErrorState
          error={error}
          title={revision ? `Revision ${revision} did not load` : undefined}
          // Not found or not yours does not change by trying again.
          onRetry={error instanceof ApiError && (error.status === 404 || error.status === 403) ? undefined : () => { void q.refetch(); void kits.refetch(); }}
        />
      </Screen>
    );
  }
  return q.data.kind === 'wing' ? <WingStudyBody d={q.data} kits={kits.data} /> : <StudyBody d={q.data} kits={kits.data} />;
}

function StudyBody({ d, kits }: { d: StudyDetail; kits: KitModel[] }) {
  const router = useRouter();
  const update = useStudyUpdateMutation(d.id);
  const latest = d.revisions.reduce((m, r) => Math.max(m, r.revision), d.revision);
  const older = d.revision !== latest;
  const wide = useWide();
  // On a phone one pane at a time, results first; the other stays mounted so no typing is lost.
  const [pane, setPane] = useState<'results' | 'inputs'>('results');
  const defaults = useMemo(() => studyValues(d), [d]);
  const revisions = [...d.revisions].sort((a, b) => b.revision - a.revision);
  const shownRev = revisions.find((r) => r.revision === d.revision);

  const form = (
    <StudyForm
      key={`${d.id}-${d.revision}`}
      kits={kits}
      defaultValues={defaults}
      isNew={false}
      submitLabel={`Compute as revision ${latest + 1}`}
      note={older ? (
        <Notice tone="caution" testID="study-older-note">
          {`These are the inputs of revision ${d.revision}. Computing makes them revision ${latest + 1}; revision ${d.revision} stays as it was.`}
        </Notice>
      ) : undefined}
      onSubmit={async (values) => {
        await update.mutateAsync(values);
        setPane('results');
        router.replace(studyHref(d.id));
      }}
    />
  );

  return (
    <Screen
      title={d.name}
      subtitle={`${d.kitName} · revision ${d.revision}${older ? ` of ${latest}` : ' (latest)'}`}
      backTo="/studies"
      full
      testID="study-screen"
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
            label: wide ? `Revision ${r.revision}${r.revision === latest ? ' · latest' : ''}` : `${r.revision}${r.revision === latest ? ' · latest' : ''}`,
            // On a phone the chips stay small; the one on show says who computed it and when, below.
            hint: wide ? `${whenText(r.createdAt)} · ${r.createdByName}` : undefined,
          }))}
        />
        {!wide && shownRev ? <Txt variant="small" tone="soft">Revision {shownRev.revision}: {whenText(shownRev.createdAt)} · {shownRev.createdByName}</Txt> : null}
      </Section>
      {wide ? (
        <TwoPane leftWidth={0.4} left={form} right={<StudyResults detail={d} latestRevision={latest} />} />
      ) : (
        <>
          <Choice
            testIDPrefix="study-pane"
            value={pane}
            onChange={setPane}
            options={[{ value: 'results', label: 'Results' }, { value: 'inputs', label: 'Inputs' }]}
          />
          <View style={{ display: pane === 'inputs' ? 'flex' : 'none' }}>{form}</View>
          <View style={{ display: pane === 'results' ? 'flex' : 'none' }}><StudyResults detail={d} latestRevision={latest} /></View>
        </>
      )}
    </Screen>
  );
}

/** A new load study: the inputs, and "Compute" makes revision 1. */
export function NewStudyScreen({ kitModelId }: { kitModelId?: string }) {
  const router = useRouter();
  const kits = useKitsQuery();
  const create = useStudyCreateMutation();
  const kit = kits.data?.find((k) => k.id === kitModelId) ?? (kits.data?.length === 1 ? kits.data[0] : undefined);
  const defaults = useMemo(() => newStudyValues(kit), [kit]);

  return (
    <Screen title="New load study" subtitle="From weight, speeds and airfoil to rivet loads and a pitch schedule" backTo="/studies" full testID="new-study-screen" right={<UnitsSwitch />}>
      {kits.isPending ? <LoadingState what="Loading kit models" />
        : kits.isError ? <ErrorState error={kits.error} onRetry={() => void kits.refetch()} />
          : !kits.data.length ? (
            <EmptyState
              title="Make a kit model first."
              body="A load study works from a kit model's weight, wing, speeds and airfoil."
              action={<Button label="New kit model" onPress={() => router.push('/catalogue/new-kit')} testID="study-new-kit" />}
            />
          ) : (
            <TwoPane
              leftWidth={0.55}
              left={(
                <StudyForm
                  key={kit?.id ?? 'none'}
                  kits={kits.data}
                  defaultValues={defaults}
                  isNew
                  submitLabel="Compute"
                  onSubmit={async (values) => {
                    const made = await create.mutateAsync(values);
                    router.replace(studyHref(made.id));
                  }}
                />
              )}
              right={(
                <View style={{ gap: space.lg }}>
                  <Caution />
                  <Sheet>
                    <Txt bold>Results show here once computed.</Txt>
                    <Txt tone="soft">
                      Fill in the inputs and press Compute. You get the pressure on the rib for every flight condition, the load on
                      each rivet against its allowables, the gauge and rivet trade table and the pitch zones, stored as revision 1.
                    </Txt>
                  </Sheet>
                </View>
              )}
            />
          )}
    </Screen>
  );
}
