import {
  Controller,
  useFieldArray,
  useFormState,
  useWatch,
  type ArrayPath,
  type Control,
  type FieldArray,
  type FieldValues,
  type Path,
  type UseFormSetValue,
} from 'react-hook-form';
import { View } from 'react-native';
import type { KitModel } from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { FormError } from '@/components/forms/form-error';
import { FormChoiceField, FormTextField } from '@/components/forms/form-fields';
import { Cell, NumberRows, Row, type NumberFieldSpec } from '@/components/forms/number-rows';
import { errorAt } from '@/components/forms/server-errors';
import { Button } from '@/components/ui/button';
import { Choice, MultiChoice } from '@/components/ui/choice';
import { Field } from '@/components/ui/field';
import { Section } from '@/components/ui/sheet';
import { Notice } from '@/components/ui/states';
import { Label, Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
import { AirfoilFields } from './airfoil-fields';
import { KitFields } from './kit-fields';
import {
  gaugeKey,
  gaugeLabel,
  RIVET_FAMILIES,
  STOCK_GAUGES_IN,
  STUDY_MATERIALS,
  toggleGauge,
  toggleRivet,
  type StudyFormValues,
} from './study-form-values';

/*
 * Blocks the rib and the wing form both have. Those at the same path in both take the rib form's
 * control type (the wing form passes its own, whose blocks have these very shapes, as for KitFields);
 * those at different paths take the path. testIDs start with the form's prefix ("study", "wing").
 */

/** What a study form takes, the rib's and the wing's: `V` the values it holds, `O` what it sends. */
export type StudyFormProps<V, O> = {
  kits: KitModel[];
  defaultValues: V;
  isNew: boolean;
  submitLabel: string;
  /** Sends the study; throws the server's error, which the form puts on its fields. */
  onSubmit: (values: O) => Promise<void>;
  /** Said above the button, e.g. that an earlier revision is on show. */
  note?: React.ReactNode;
};

/**
 * The head of a study's form: its name and kit model, then the aircraft's numbers and the airfoil
 * (`inputs.kit`, `inputs.airfoil`: the same blocks in a rib and a wing study).
 */
export function StudyBasics({
  control,
  setValue,
  kits,
  isNew,
  prefix,
  nameHint,
  onTake,
}: {
  control: Control<StudyFormValues>;
  setValue: UseFormSetValue<StudyFormValues>;
  kits: KitModel[];
  isNew: boolean;
  prefix: string;
  /** An example name, e.g. "e.g. Left wing, flight envelope". */
  nameHint: string;
  onTake: (kit: KitModel, when: 'chosen' | 'again') => void;
}) {
  const { errors } = useFormState({ control, name: 'inputs.airfoil' });
  return (
    <>
      <Section title="Study">
        <FormTextField
          control={control}
          name="name"
          label="Name of the study"
          hint={nameHint}
          testID={`${prefix}-name`}
        />
        <KitModelField control={control} kits={kits} isNew={isNew} prefix={prefix} onTake={onTake} />
      </Section>

      <Section title="Aircraft">
        <KitFields control={control} prefix={prefix} />
      </Section>

      <Section title="Airfoil">
        <AirfoilFields
          control={control}
          setValue={setValue}
          errors={{ root: errorAt(errors, 'inputs.airfoil'), points: errorAt(errors, 'inputs.airfoil.points') }}
        />
      </Section>
    </>
  );
}

/** The kit model; a new study starts from its design data, an existing one keeps its own unless asked. */
function KitModelField({
  control,
  kits,
  isNew,
  prefix,
  onTake,
}: {
  control: Control<StudyFormValues>;
  kits: KitModel[];
  isNew: boolean;
  prefix: string;
  /** Fills the form from the kit: on choosing it for a new study, or on the button for an existing one. */
  onTake: (kit: KitModel, when: 'chosen' | 'again') => void;
}) {
  const kitModelId = useWatch({ control, name: 'kitModelId' });
  const kit = kits.find((k) => k.id === kitModelId);
  return (
    <>
      <Controller
        control={control}
        name="kitModelId"
        render={({ field, fieldState }) => (
          <Field label="Kit model" error={fieldState.error?.message} testID={`${prefix}-kit-field`}>
            <Choice
              testIDPrefix={`${prefix}-kit`}
              value={field.value}
              invalid={!!fieldState.error}
              options={kits.map((k) => ({ value: k.id, key: k.code, label: `${k.code} · ${k.name}` }))}
              onChange={(id) => {
                const k = kits.find((x) => x.id === id);
                if (isNew && k) onTake(k, 'chosen');
                else field.onChange(id);
              }}
            />
          </Field>
        )}
      />
      {kit && !isNew ? (
        <Button
          label={`Take ${kit.code}'s weight, wing, speeds and airfoil`}
          variant="quiet"
          compact
          onPress={() => onTake(kit, 'again')}
          testID={`${prefix}-take-kit`}
          style={{ alignSelf: 'flex-start', marginLeft: -space.md }}
        />
      ) : null}
    </>
  );
}

/** A rib's fastener lines (at most six), each a name, a surface and where it starts and ends in x/c. */
export function FastenerLinesSection<T extends FieldValues>({
  control,
  name,
  prefix,
  title,
  intro,
  children,
}: {
  control: Control<T>;
  name: ArrayPath<T>;
  prefix: string;
  title: string;
  intro: string;
  children?: React.ReactNode;
}) {
  const lines = useFieldArray({ control, name });
  const { errors } = useFormState({ control, name: name as Path<T> });
  const at = (i: number, f: string) => `${name}.${i}.${f}` as Path<T>;
  const listError = errorAt(errors, name);
  return (
    <Section
      title={title}
      aside={
        lines.fields.length < 6 ? (
          <Button
            label="Add a line"
            variant="quiet"
            compact
            testID={`${prefix}-line-add`}
            onPress={() =>
              lines.append({
                name: `Line ${lines.fields.length + 1}`,
                surface: 'upper',
                startXc: 0.1,
                endXc: 0.8,
              } as FieldArray<T, ArrayPath<T>>)
            }
          />
        ) : undefined
      }
    >
      <Txt variant="small" tone="soft">
        {intro}
      </Txt>
      {listError ? <Notice tone="error">{listError}</Notice> : null}
      {lines.fields.map((f, i) => (
        <View
          key={f.id}
          style={{ gap: space.sm, paddingBottom: space.md, borderBottomWidth: hairline, borderColor: colors.rule }}
          testID={`${prefix}-line-${i}`}
        >
          <Row>
            <Cell>
              <FormTextField
                control={control}
                name={at(i, 'name')}
                label={`Line ${i + 1} name`}
                testID={`${prefix}-line-${i}-name`}
              />
            </Cell>
            <Cell>
              <FormChoiceField
                control={control}
                name={at(i, 'surface')}
                label="Surface"
                testID={`${prefix}-line-${i}-surface`}
                options={[
                  { value: 'upper', label: 'Upper' },
                  { value: 'lower', label: 'Lower' },
                ]}
              />
            </Cell>
          </Row>
          <NumberRows
            control={control}
            rows={[
              [
                { name: at(i, 'startXc'), label: 'Starts at', unit: 'x/c', testID: `${prefix}-line-${i}-start` },
                { name: at(i, 'endXc'), label: 'Ends at', unit: 'x/c', testID: `${prefix}-line-${i}-end` },
              ],
            ]}
          />
          {lines.fields.length > 1 ? (
            <Button
              label={`Remove line ${i + 1}`}
              variant="quiet"
              compact
              onPress={() => lines.remove(i)}
              testID={`${prefix}-line-${i}-remove`}
              style={{ alignSelf: 'flex-start' }}
            />
          ) : null}
        </View>
      ))}
      {children}
    </Section>
  );
}

/** The sheet material: the ones the engine knows, and the study's own if it is another. */
export function MaterialField({
  control,
  label,
  prefix,
}: {
  control: Control<StudyFormValues>;
  label: string;
  prefix: string;
}) {
  return (
    <Controller
      control={control}
      name="inputs.material"
      render={({ field, fieldState }) => (
        <Field label={label} error={fieldState.error?.message}>
          <Choice
            testIDPrefix={`${prefix}-material`}
            value={field.value}
            onChange={field.onChange}
            invalid={!!fieldState.error}
            options={[...new Set([...STUDY_MATERIALS, ...(field.value ? [field.value] : [])])].map((m) => ({
              value: m,
              label: m,
            }))}
          />
        </Field>
      )}
    />
  );
}

/** "3 chosen", or "3 of at most 4 chosen" in red once over a list's cap. */
function ChosenCount({ n, max }: { n: number; max?: number }) {
  return (
    <Txt variant="small" tone={max !== undefined && n > max ? 'error' : 'soft'}>
      <Mono variant="small" bold>
        {n}
      </Mono>{' '}
      {max !== undefined ? `of at most ${max} ` : ''}chosen
    </Txt>
  );
}

/**
 * Stock gauges as chips (and any other the study holds), kept in inches. With a cap, the count chosen
 * is said under them. The field's testID is `${testIDPrefix}s-field`.
 */
export function GaugeChips<T extends FieldValues>({
  control,
  name,
  label,
  hint,
  testIDPrefix,
  max,
}: {
  control: Control<T>;
  name: Path<T>;
  label: string;
  hint: string;
  testIDPrefix: string;
  max?: number;
}) {
  const units = useUnits();
  // A list's own error ("choose at least one") sits on the list or under its root: errorAt reads both.
  const { errors } = useFormState({ control, name });
  return (
    <Controller
      control={control}
      name={name}
      render={({ field }) => {
        const values = (field.value ?? []) as number[];
        const all = [...new Set([...STOCK_GAUGES_IN, ...values])].sort((a, b) => a - b);
        return (
          <Field label={label} hint={hint} error={errorAt(errors, name)} testID={`${testIDPrefix}s-field`}>
            <MultiChoice
              testIDPrefix={testIDPrefix}
              label={label}
              values={values.map(gaugeKey)}
              onToggle={(k) => field.onChange(toggleGauge(values, k))}
              options={all.map((g) => ({ value: gaugeKey(g), label: gaugeLabel(g, units.system) }))}
            />
            {max !== undefined ? <ChosenCount n={values.length} max={max} /> : null}
          </Field>
        );
      }}
    />
  );
}

/** Rivets as chips by family (and any other the study holds), in family and size order; the count under them. */
export function RivetChips<T extends FieldValues>({
  control,
  name,
  label,
  testIDPrefix,
  max,
}: {
  control: Control<T>;
  name: Path<T>;
  label: string;
  testIDPrefix: string;
  max?: number;
}) {
  const { errors } = useFormState({ control, name });
  return (
    <Controller
      control={control}
      name={name}
      render={({ field }) => {
        const values = (field.value ?? []) as string[];
        const known = new Set(RIVET_FAMILIES.flatMap((f) => f.codes));
        const others = values.filter((v) => !known.has(v));
        const group = (title: string, codes: string[], key: string) => (
          <View key={key} style={{ gap: space.xs }}>
            <Label>{title}</Label>
            <MultiChoice
              testIDPrefix={testIDPrefix}
              values={values}
              onToggle={(c) => field.onChange(toggleRivet(values, c))}
              options={codes.map((c) => ({ value: c, label: c }))}
            />
          </View>
        );
        return (
          <Field label={label} error={errorAt(errors, name)} testID={`${testIDPrefix}s-field`}>
            <View style={{ gap: space.sm }}>
              {RIVET_FAMILIES.map((fam) => group(fam.label, fam.codes, fam.family))}
              {others.length ? group('Others in this study', others, 'others') : null}
              <ChosenCount n={values.length} max={max} />
            </View>
          </Field>
        );
      }}
    />
  );
}

const scheduleRows = (prefix: string, minutesHint: string): NumberFieldSpec<StudyFormValues>[][] => [
  [
    {
      name: 'inputs.maxPitchDiameters',
      label: 'Largest pitch',
      unit: 'D',
      hint: 'In rivet diameters, 4 to 16',
      testID: `${prefix}-max-pitch`,
    },
    {
      name: 'inputs.pitchIncrementIn',
      label: 'Pitch rounded to',
      quantity: 'length',
      hint: 'The pitch steps down in these',
      testID: `${prefix}-pitch-increment`,
    },
    { name: 'inputs.maxZones', label: 'Zones per line, at most', unit: 'zones', testID: `${prefix}-max-zones` },
  ],
  [
    {
      name: 'inputs.minutesPerHole',
      label: 'Minutes per hole',
      unit: 'min',
      hint: minutesHint,
      testID: `${prefix}-minutes-per-hole`,
    },
    {
      name: 'inputs.panels',
      label: 'Panels on the airfoil',
      unit: 'panels',
      hint: 'Even, 40 to 400; blank: 160',
      testID: `${prefix}-panels`,
    },
  ],
];

/**
 * A rib's inside pressure and flange width, asked alike of the rib study and of every rib of a wing
 * (both forms hold them at `inputs.rib`).
 */
export function ribPressureAndFlange<T extends FieldValues>(prefix: string): NumberFieldSpec<T>[] {
  return [
    {
      name: 'inputs.rib.internalCp' as Path<T>,
      label: 'Pressure inside the wing',
      unit: 'Cp',
      hint: 'Blank: 0 (no vents or leaks)',
      testID: `${prefix}-internal-cp`,
    },
    {
      name: 'inputs.rib.flangeWidthIn' as Path<T>,
      label: 'Flange width',
      quantity: 'length',
      hint: 'Blank: 4 rivet diameters',
      testID: `${prefix}-flange-width`,
    },
  ];
}

/** How the pitch is laid out and the candidates ranked: the same settings for a rib and a wing. */
export function ScheduleFields({
  control,
  prefix,
  minutesHint,
  rankLabel,
}: {
  control: Control<StudyFormValues>;
  prefix: string;
  minutesHint: string;
  rankLabel: string;
}) {
  return (
    <Section title="Schedule settings">
      <NumberRows control={control} rows={scheduleRows(prefix, minutesHint)} />
      <FormChoiceField
        control={control}
        name="inputs.rankBy"
        label={rankLabel}
        testID={`${prefix}-rank-by`}
        options={[
          { value: 'weight', label: 'Lightest first' },
          { value: 'buildTime', label: 'Quickest to build first' },
        ]}
      />
    </Section>
  );
}

/**
 * The foot of a study form: the caller's note, the form's error, the compute button and what the server
 * will do (`children`). testIDs are `${prefix}-form-error` and `${prefix}-compute`.
 */
export function StudyFormFoot({
  prefix,
  note,
  formError,
  busy,
  submitLabel,
  onSubmit,
  children,
}: {
  prefix: string;
  note?: React.ReactNode;
  formError: string | null;
  busy: boolean;
  submitLabel: string;
  onSubmit: () => void;
  children: React.ReactNode;
}) {
  return (
    <>
      {note}
      <FormError message={formError} testID={`${prefix}-form-error`} />
      <Button label={submitLabel} busyLabel="Computing" busy={busy} onPress={onSubmit} testID={`${prefix}-compute`} />
      <Txt variant="small" tone="faint">
        {children}
      </Txt>
    </>
  );
}
