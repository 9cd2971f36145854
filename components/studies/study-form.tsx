import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import { ribStudyForm, type KitModel } from '@/db/contracts';
import { space } from '@/constants/theme';
import { FormNumberField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { Button } from '@/components/ui/button';
import { Section } from '@/components/ui/sheet';
import { Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { Cell, Row } from './kit-fields';
import {
  FastenerLinesSection,
  GaugeChips,
  MaterialField,
  RivetChips,
  ScheduleFields,
  StudyBasics,
  type StudyFormProps,
} from './study-form-parts';
import { kitIntoStudy, studyFieldFor, type StudyFormValues } from './study-form-values';
import { useStudySubmit } from './use-study-submit';

export type StudyOutput = z.output<typeof ribStudyForm>;

const resolver = zodResolver(ribStudyForm, plainParse);

type Props = StudyFormProps<StudyFormValues, StudyOutput>;

/** The load study's inputs: kit data, airfoil, rib, fastener lines, material and candidates, settings. */
export function StudyForm({ kits, defaultValues, isNew, submitLabel, onSubmit, note }: Props) {
  const { control, handleSubmit, setError, setValue, getValues, reset, formState } = useForm<
    StudyFormValues,
    unknown,
    StudyOutput
  >({
    resolver,
    mode: 'onChange',
    defaultValues,
  });
  const { submit, formError } = useStudySubmit({ handleSubmit, setError, onSubmit, fieldFor: studyFieldFor });

  const takeKit = (k: KitModel) =>
    reset(kitIntoStudy(getValues(), k), { keepDefaultValues: true, keepDirty: false, keepErrors: false });

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
        <Row>
          <Cell>
            <FormNumberField
              control={control}
              name="inputs.rib.chordIn"
              label="Rib chord"
              quantity="length"
              testID="study-rib-chord"
            />
          </Cell>
          <Cell>
            <FormNumberField
              control={control}
              name="inputs.rib.spacingIn"
              label="Rib spacing"
              quantity="length"
              hint="The width of skin each rib carries"
              testID="study-rib-spacing"
            />
          </Cell>
        </Row>
        <Row>
          <Cell>
            <FormNumberField
              control={control}
              name="inputs.rib.internalCp"
              label="Pressure inside the wing"
              unit="Cp"
              hint="Blank: 0 (no vents or leaks)"
              testID="study-internal-cp"
            />
          </Cell>
          <Cell>
            <FormNumberField
              control={control}
              name="inputs.rib.flangeWidthIn"
              label="Flange width"
              quantity="length"
              hint="Blank: 4 rivet diameters"
              testID="study-flange-width"
            />
          </Cell>
        </Row>
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

      {note}
      {formError ? (
        <Notice tone="error" testID="study-form-error">
          {formError}
        </Notice>
      ) : null}
      <Button
        label={submitLabel}
        busyLabel="Computing"
        busy={formState.isSubmitting}
        onPress={() => void submit()}
        testID="study-compute"
      />
      <Txt variant="small" tone="faint">
        The server computes every gauge with every rivet. Stored in inches and pounds whatever units you typed in.
      </Txt>
    </View>
  );
}
