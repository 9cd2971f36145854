import { useRouter } from 'expo-router';
import { useMemo, useState } from 'react';
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
import { useStudyCreateMutation, useStudyUpdateMutation } from '@/hooks/queries/studies';
import { useWide } from '@/hooks/use-wide';
import { studyHref, whenText } from './study-links';
import { WingForm } from './wing-form';
import { newWingValues, wingValues } from './wing-form-values';
import { WingResults } from './wing-results';

/** A whole-wing study: its inputs on the left, the computed revision on the right (one at a time on a phone). */
export function WingStudyBody({ d, kits }: { d: StudyDetail; kits: KitModel[] }) {
  const router = useRouter();
  const update = useStudyUpdateMutation(d.id);
  const latest = d.revisions.reduce((m, r) => Math.max(m, r.revision), d.revision);
  const older = d.revision !== latest;
  const wide = useWide();
  const [pane, setPane] = useState<'results' | 'inputs'>('results');
  const defaults = useMemo(() => wingValues(d), [d]);
  const revisions = [...d.revisions].sort((a, b) => b.revision - a.revision);
  const shownRev = revisions.find((r) => r.revision === d.revision);

  const form = (
    <WingForm
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
  const results = <WingResults detail={d} latestRevision={latest} />;

  return (
    <Screen
      title={d.name}
      subtitle={`Wing study · ${d.kitName} · revision ${d.revision}${older ? ` of ${latest}` : ' (latest)'}`}
      backTo="/studies"
      full
      testID="wing-study-screen"
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
            hint: wide ? `${whenText(r.createdAt)} · ${r.createdByName}` : undefined,
          }))}
        />
        {!wide && shownRev ? <Txt variant="small" tone="soft">Revision {shownRev.revision}: {whenText(shownRev.createdAt)} · {shownRev.createdByName}</Txt> : null}
      </Section>
      {wide ? (
        // The results' tables are wide: they get two thirds of the screen.
        <TwoPane leftWidth={0.3} left={form} right={results} />
      ) : (
        <>
          <Choice
            testIDPrefix="study-pane"
            value={pane}
            onChange={setPane}
            options={[{ value: 'results', label: 'Results' }, { value: 'inputs', label: 'Inputs' }]}
          />
          <View style={{ display: pane === 'inputs' ? 'flex' : 'none' }}>{form}</View>
          <View style={{ display: pane === 'results' ? 'flex' : 'none' }}>{results}</View>
        </>
      )}
    </Screen>
  );
}

/** A new whole-wing study: the inputs, and "Compute" makes revision 1. */
export function NewWingStudyScreen({ kitModelId }: { kitModelId?: string }) {
  const router = useRouter();
  const kits = useKitsQuery();
  const create = useStudyCreateMutation();
  const kit = kits.data?.find((k) => k.id === kitModelId) ?? (kits.data?.length === 1 ? kits.data[0] : undefined);
  const defaults = useMemo(() => newWingValues(kit), [kit]);

  return (
    <Screen
      title="New wing study"
      subtitle="Every rib root to tip and the skin panels between them, from weight, speeds, planform and airfoil"
      backTo="/studies"
      full
      testID="new-wing-study-screen"
      right={<UnitsSwitch />}
    >
      {kits.isPending ? <LoadingState what="Loading kit models" />
        : kits.isError ? <ErrorState error={kits.error} onRetry={() => void kits.refetch()} />
          : !kits.data.length ? (
            <EmptyState
              title="Make a kit model first."
              body="A wing study works from a kit model's weight, wing, speeds and airfoil."
              action={<Button label="New kit model" onPress={() => router.push('/catalogue/new-kit')} testID="study-new-kit" />}
            />
          ) : (
            <TwoPane
              leftWidth={0.55}
              left={(
                <WingForm
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
                      Fill in the inputs and press Compute. You get the loads at every rib (shear, bending, torque), each rib’s gauge, rivet
                      and pitch zones, every skin panel’s with its buckling margins, and the trade of one gauge and rivet for every rib against
                      each its own, stored as revision 1.
                    </Txt>
                  </Sheet>
                </View>
              )}
            />
          )}
    </Screen>
  );
}
