import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useFieldArray, useForm, useWatch, type Control } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import { ribStudyForm, type KitModel } from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { FormChoiceField, FormNumberField, FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { applyServerErrors, errorAt } from '@/components/forms/server-errors';
import { Button } from '@/components/ui/button';
import { Choice, MultiChoice } from '@/components/ui/choice';
import { Field } from '@/components/ui/field';
import { Section } from '@/components/ui/sheet';
import { Notice } from '@/components/ui/states';
import { Label, Mono, Txt } from '@/components/ui/text';
import { ApiError } from '@/hooks/api-client';
import { useUnits } from '@/hooks/use-units';
import { AirfoilFields } from './airfoil-fields';
import { Cell, KitFields, Row } from './kit-fields';
import {
  gaugeKey, gaugeLabel, kitIntoStudy, RIVET_FAMILIES, STOCK_GAUGES_IN, STUDY_MATERIALS, studyFieldFor, toggleGauge, toggleRivet,
  type StudyFormValues,
} from './study-form-values';

export type StudyOutput = z.output<typeof ribStudyForm>;

const resolver = zodResolver(ribStudyForm, plainParse);

type Props = {
  kits: KitModel[];
  defaultValues: StudyFormValues;
  isNew: boolean;
  submitLabel: string;
  /** Sends the study; throws the server's error, which the form puts on its fields. */
  onSubmit: (values: StudyOutput) => Promise<void>;
  /** Said above the button, e.g. that an earlier revision is on show. */
  note?: React.ReactNode;
};

/** The load study's inputs: kit data, airfoil, rib, fastener lines, material and candidates, settings. */
export function StudyForm({ kits, defaultValues, isNew, submitLabel, onSubmit, note }: Props) {
  const units = useUnits();
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, setValue, getValues, reset, formState } = useForm<StudyFormValues, unknown, StudyOutput>({
    resolver,
    mode: 'onChange',
    defaultValues,
  });
  const lines = useFieldArray({ control, name: 'inputs.lines' });
  const kitModelId = useWatch({ control, name: 'kitModelId' });
  const kit = kits.find((k) => k.id === kitModelId);
  const errors = formState.errors;

  const takeKit = (k: KitModel) => reset(kitIntoStudy(getValues(), k), { keepDefaultValues: true, keepDirty: false, keepErrors: false });

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await onSubmit(values);
    } catch (e) {
      const said = applyServerErrors(setError, e, studyFieldFor);
      // The server's summary names fields by their paths; say it in words and leave the rest to the fields.
      if (e instanceof ApiError && e.fields && Object.keys(e.fields).length) {
        const unplaced = Object.entries(e.fields).filter(([p]) => !studyFieldFor(p)).map(([, m]) => m.trim().replace(/[.]$/, ''));
        setFormError(unplaced.length ? `Not computed: ${unplaced.join('; ')}.` : 'Not computed: some inputs were refused. See the marked fields.');
      } else {
        setFormError(said);
      }
    }
  }, () => setFormError('Some inputs need a look: see the messages in red.'));

  return (
    <View style={{ gap: space.xl }} testID="study-form">
      <Section title="Study">
        <FormTextField control={control} name="name" label="Name of the study" hint="e.g. Inboard rib W-104, flight envelope" testID="study-name" />
        <Controller
          control={control}
          name="kitModelId"
          render={({ field, fieldState }) => (
            <Field label="Kit model" error={fieldState.error?.message} testID="study-kit-field">
              <Choice
                testIDPrefix="study-kit"
                value={field.value}
                invalid={!!fieldState.error}
                options={kits.map((k) => ({ value: k.id, key: k.code, label: `${k.code} · ${k.name}` }))}
                onChange={(id) => {
                  const k = kits.find((x) => x.id === id);
                  // A new study starts from the kit model's design data; an existing one keeps its own.
                  if (isNew && k) takeKit(k);
                  else field.onChange(id);
                }}
              />
            </Field>
          )}
        />
        {kit && !isNew ? (
          <Button label={`Take ${kit.code}'s weight, wing, speeds and airfoil`} variant="quiet" compact onPress={() => takeKit(kit)} testID="study-take-kit" style={{ alignSelf: 'flex-start', marginLeft: -space.md }} />
        ) : null}
      </Section>

      <Section title="Aircraft">
        <KitFields control={control} prefix="study" />
      </Section>

      <Section title="Airfoil">
        <AirfoilFields
          control={control}
          setValue={setValue}
          errors={{ root: errorAt(errors, 'inputs.airfoil'), points: errorAt(errors, 'inputs.airfoil.points') }}
        />
      </Section>

      <Section title="Rib">
        <Row>
          <Cell><FormNumberField control={control} name="inputs.rib.chordIn" label="Rib chord" quantity="length" testID="study-rib-chord" /></Cell>
          <Cell><FormNumberField control={control} name="inputs.rib.spacingIn" label="Rib spacing" quantity="length" hint="The width of skin each rib carries" testID="study-rib-spacing" /></Cell>
        </Row>
        <Row>
          <Cell><FormNumberField control={control} name="inputs.rib.internalCp" label="Pressure inside the wing" unit="Cp" hint="Blank: 0 (no vents or leaks)" testID="study-internal-cp" /></Cell>
          <Cell><FormNumberField control={control} name="inputs.rib.flangeWidthIn" label="Flange width" quantity="length" hint="Blank: 4 rivet diameters" testID="study-flange-width" /></Cell>
        </Row>
      </Section>

      <Section
        title="Fastener lines"
        aside={lines.fields.length < 6 ? (
          <Button
            label="Add a line"
            variant="quiet"
            compact
            testID="study-line-add"
            onPress={() => lines.append({ name: `Line ${lines.fields.length + 1}`, surface: 'upper', startXc: 0.1, endXc: 0.8 })}
          />
        ) : undefined}
      >
        <Txt variant="small" tone="soft">Where each row of rivets runs, as fractions of the chord (x/c) from the leading edge.</Txt>
        {errorAt(errors, 'inputs.lines') ? <Notice tone="error">{errorAt(errors, 'inputs.lines')!}</Notice> : null}
        {lines.fields.map((f, i) => (
          <View key={f.id} style={{ gap: space.sm, paddingBottom: space.md, borderBottomWidth: hairline, borderColor: colors.rule }} testID={`study-line-${i}`}>
            <Row>
              <Cell><FormTextField control={control} name={`inputs.lines.${i}.name`} label={`Line ${i + 1} name`} testID={`study-line-${i}-name`} /></Cell>
              <Cell>
                <FormChoiceField
                  control={control}
                  name={`inputs.lines.${i}.surface`}
                  label="Surface"
                  testID={`study-line-${i}-surface`}
                  options={[{ value: 'upper', label: 'Upper' }, { value: 'lower', label: 'Lower' }]}
                />
              </Cell>
            </Row>
            <Row>
              <Cell><FormNumberField control={control} name={`inputs.lines.${i}.startXc`} label="Starts at" unit="x/c" testID={`study-line-${i}-start`} /></Cell>
              <Cell><FormNumberField control={control} name={`inputs.lines.${i}.endXc`} label="Ends at" unit="x/c" testID={`study-line-${i}-end`} /></Cell>
            </Row>
            {lines.fields.length > 1 ? (
              <Button label={`Remove line ${i + 1}`} variant="quiet" compact onPress={() => lines.remove(i)} testID={`study-line-${i}-remove`} style={{ alignSelf: 'flex-start' }} />
            ) : null}
          </View>
        ))}
      </Section>

      <Section title="Material and candidates">
        <Controller
          control={control}
          name="inputs.material"
          render={({ field, fieldState }) => (
            <Field label="Sheet material" error={fieldState.error?.message}>
              <Choice
                testIDPrefix="study-material"
                value={field.value}
                onChange={field.onChange}
                invalid={!!fieldState.error}
                options={[...new Set([...STUDY_MATERIALS, ...(field.value ? [field.value] : [])])].map((m) => ({ value: m, label: m }))}
              />
            </Field>
          )}
        />
        <Controller
          control={control}
          name="inputs.gaugeCandidates"
          render={({ field }) => {
            const values = (field.value ?? []) as number[];
            const all = [...new Set([...STOCK_GAUGES_IN, ...values])].sort((a, b) => a - b);
            return (
              <Field label="Gauges to try" hint="Stock sheet; each gauge is tried with each rivet." error={errorAt(errors, 'inputs.gaugeCandidates')} testID="study-gauges-field">
                <MultiChoice
                  testIDPrefix="study-gauge"
                  values={values.map(gaugeKey)}
                  onToggle={(k) => field.onChange(toggleGauge(values, k))}
                  options={all.map((g) => ({ value: gaugeKey(g), label: gaugeLabel(g, units.system) }))}
                />
              </Field>
            );
          }}
        />
        <RivetChips control={control} error={errorAt(errors, 'inputs.rivetCandidates')} />
      </Section>

      <Section title="Schedule settings">
        <Row>
          <Cell><FormNumberField control={control} name="inputs.maxPitchDiameters" label="Largest pitch" unit="D" hint="In rivet diameters, 4 to 16" testID="study-max-pitch" /></Cell>
          <Cell><FormNumberField control={control} name="inputs.pitchIncrementIn" label="Pitch rounded to" quantity="length" hint="The pitch steps down in these" testID="study-pitch-increment" /></Cell>
          <Cell><FormNumberField control={control} name="inputs.maxZones" label="Zones per line, at most" unit="zones" testID="study-max-zones" /></Cell>
        </Row>
        <Row>
          <Cell><FormNumberField control={control} name="inputs.minutesPerHole" label="Minutes per hole" unit="min" hint="For the build-time column; blank: 1.5 solid, 1.0 pulled" testID="study-minutes-per-hole" /></Cell>
          <Cell><FormNumberField control={control} name="inputs.panels" label="Panels on the airfoil" unit="panels" hint="Even, 40 to 400; blank: 160" testID="study-panels" /></Cell>
        </Row>
        <FormChoiceField
          control={control}
          name="inputs.rankBy"
          label="Rank the feasible candidates by"
          testID="study-rank-by"
          options={[{ value: 'weight', label: 'Lightest first' }, { value: 'buildTime', label: 'Quickest to build first' }]}
        />
      </Section>

      {note}
      {formError ? <Notice tone="error" testID="study-form-error">{formError}</Notice> : null}
      <Button
        label={submitLabel}
        busyLabel="Computing"
        busy={formState.isSubmitting}
        onPress={() => void submit()}
        testID="study-compute"
      />
      <Txt variant="small" tone="faint">The server computes every gauge with every rivet. Stored in inches and pounds whatever units you typed in.</Txt>
    </View>
  );
}

function RivetChips({ control, error }: { control: Control<StudyFormValues>; error?: string }) {
  return (
    <Controller
      control={control}
      name="inputs.rivetCandidates"
      render={({ field }) => {
        const values = (field.value ?? []) as string[];
        const known = new Set(RIVET_FAMILIES.flatMap((f) => f.codes));
        const others = values.filter((v) => !known.has(v));
        return (
          <Field label="Rivets to try" error={error} testID="study-rivets-field">
            <View style={{ gap: space.sm }}>
              {RIVET_FAMILIES.map((fam) => (
                <View key={fam.family} style={{ gap: space.xs }}>
                  <Label>{fam.label}</Label>
                  <MultiChoice
                    testIDPrefix="study-rivet"
                    values={values}
                    onToggle={(c) => field.onChange(toggleRivet(values, c))}
                    options={fam.codes.map((c) => ({ value: c, label: c }))}
                  />
                </View>
              ))}
              {others.length ? (
                <View style={{ gap: space.xs }}>
                  <Label>Others in this study</Label>
                  <MultiChoice testIDPrefix="study-rivet" values={values} onToggle={(c) => field.onChange(toggleRivet(values, c))} options={others.map((c) => ({ value: c, label: c }))} />
                </View>
              ) : null}
              <Txt variant="small" tone="soft"><Mono variant="small" bold>{values.length}</Mono> chosen</Txt>
            </View>
          </Field>
        );
      }}
    />
  );
}
