import { zodResolver } from '@hookform/resolvers/zod';
import { View } from 'react-native';
import type { z } from 'zod';
import { ribStudyForm, type KitModel } from '@/db/contracts';
import { space } from '@/constants/theme';
import { NumberRows } from '@/components/forms/number-rows';
import { plainParse } from '@/components/forms/plain-errors';
import { Section } from '@/components/ui/sheet';
import {
  FastenerLinesSection,
  GaugeChips,
  MaterialField,
  ribPressureAndFlange,
  RivetChips,
  ScheduleFields,
  StudyBasics,
  StudyFormFoot,
  type StudyFormProps,
} from './study-form-parts';
import { kitIntoStudy, studyFieldFor, type StudyFormValues } from './study-form-values';
import { useStudyForm } from './use-study-form';

export type StudyOutput = z.output<typeof ribStudyForm>;

const resolver = zodResolver(ribStudyForm, plainParse);

type Props = StudyFormProps<StudyFormValues, StudyOutput>;

/** The load study's inputs: kit data, airfoil, rib, fastener lines, material and candidates, settings. */
export function StudyForm({ kits, defaultValues, isNew, submitLabel, onSubmit, note }: Props) {
  const {
    form: { control, setValue, getValues, formState },
    submit,
    formError,
    take,
  } = useStudyForm<StudyFormValues, StudyOutput>({ resolver, defaultValues, onSubmit, fieldFor: studyFieldFor });

  const takeKit = (k: KitModel) => take(kitIntoStudy(getValues(), k));

  return (
    <View style={{ gap: space.xl }} testID="study-form">
      <StudyBasics
        control={control}
        setValue={setValue}
        kits={kits}
        isNew={isNew}
        prefix="study"
        nameHint="e.g. Inboard rib W-104, flight envelope"
        onTake={takeKit}
      />

      <Section title="Rib">
        <NumberRows
          control={control}
          rows={[
            [
              { name: 'inputs.rib.chordIn', label: 'Rib chord', quantity: 'length', testID: 'study-rib-chord' },
              {
                name: 'inputs.rib.spacingIn',
                label: 'Rib spacing',
                quantity: 'length',
                hint: 'The width of skin each rib carries',
                testID: 'study-rib-spacing',
              },
            ],
            ribPressureAndFlange<StudyFormValues>('study'),
          ]}
        />
      </Section>

      <FastenerLinesSection
        control={control}
        name="inputs.lines"
        prefix="study"
        title="Fastener lines"
        intro="Where each row of rivets runs, as fractions of the chord (x/c) from the leading edge."
      />

      <Section title="Material and candidates">
        <MaterialField control={control} label="Sheet material" prefix="study" />
        <GaugeChips
          control={control}
          name="inputs.gaugeCandidates"
          label="Gauges to try"
          hint="Stock sheet; each gauge is tried with each rivet."
          testIDPrefix="study-gauge"
        />
        <RivetChips control={control} name="inputs.rivetCandidates" label="Rivets to try" testIDPrefix="study-rivet" />
      </Section>

      <ScheduleFields
        control={control}
        prefix="study"
        minutesHint="For the build-time column; blank: 1.5 solid, 1.0 pulled"
        rankLabel="Rank the feasible candidates by"
      />

      <StudyFormFoot
        prefix="study"
        note={note}
        formError={formError}
        busy={formState.isSubmitting}
        submitLabel={submitLabel}
        onSubmit={() => void submit()}
      >
        The server computes every gauge with every rivet. Stored in inches and pounds whatever units you typed in.
      </StudyFormFoot>
    </View>
  );
}
