import { Controller, useFieldArray, useFormState, useWatch, type Control } from 'react-hook-form';
import { StyleSheet, View, type ViewStyle } from 'react-native';
import { stepKindLabels, stepKinds, type RevisionInput, type StepKind } from '@/db/contracts';
import { colors, hairline, space, touch } from '@/constants/theme';
import { FormChoiceField, FormNumberField, FormTextField } from '@/components/forms/form-fields';
import { errorAt } from '@/components/forms/server-errors';
import { Button } from '@/components/ui/button';
import { Choice } from '@/components/ui/choice';
import { Field, TextBox } from '@/components/ui/field';
import { Section } from '@/components/ui/sheet';
import { Mono, Txt } from '@/components/ui/text';
import { CheckBox, Toggle } from '@/components/ui/toggle';

/**
 * The body of a revision, shared by "new design" (fields under `revision.`) and "edit draft" (fields
 * at the top). The control is loosely typed here because the two forms nest the same fields at
 * different paths; each form resolves with the contract's own schema.
 */
type Props = { control: unknown; prefix?: '' | 'revision.' };

export const emptyLine = (
  code: string,
  name: string,
  surface: 'upper' | 'lower' | 'flat',
): RevisionInput['lines'][number] => ({
  code,
  name,
  surface,
  startIn: 0,
  lengthIn: undefined as unknown as number,
  zones: [{ fromIn: 0, toIn: undefined as unknown as number, pitchIn: undefined as unknown as number }],
});

export const emptyRevision = (): RevisionInput => ({
  material: '2024-T3',
  gaugeIn: undefined as unknown as number,
  rivetSpec: '',
  drillSize: '',
  drillDiameterIn: undefined as unknown as number,
  edgeDistanceIn: undefined as unknown as number,
  chordIn: undefined as unknown as number,
  lines: [emptyLine('U', 'Upper flange', 'upper'), emptyLine('L', 'Lower flange', 'lower')],
  steps: [],
  changeNote: '',
});

/** A published revision's body as the start of the next one. */
export function revisionToInput(r: RevisionInput): RevisionInput {
  return {
    material: r.material,
    gaugeIn: r.gaugeIn,
    rivetSpec: r.rivetSpec,
    drillSize: r.drillSize,
    drillDiameterIn: r.drillDiameterIn,
    edgeDistanceIn: r.edgeDistanceIn,
    chordIn: r.chordIn,
    lines: r.lines.map((l) => ({ ...l, zones: l.zones.map((z) => ({ ...z })) })),
    steps: (r.steps ?? []).map(asStep),
    changeNote: '',
  };
}

/** Lengths side by side, each in its own cell of a wrapping row. */
function LengthCells({
  control,
  fields,
  cellStyle = styles.cell,
}: {
  control: Control<any>;
  fields: { name: string; label: string; testID: string }[];
  cellStyle?: ViewStyle;
}) {
  return (
    <>
      {fields.map((f) => (
        <View key={f.testID} style={cellStyle}>
          <FormNumberField control={control} name={f.name} label={f.label} quantity="length" testID={f.testID} />
        </View>
      ))}
    </>
  );
}

const zoneFields = [
  { key: 'fromIn', label: 'From', id: 'from' },
  { key: 'toIn', label: 'To', id: 'to' },
  { key: 'pitchIn', label: 'Pitch', id: 'pitch' },
] as const;

function ZonesEditor({ control, base, lineIndex }: { control: Control<any>; base: string; lineIndex: number }) {
  const name = `${base}lines.${lineIndex}.zones`;
  const zones = useFieldArray({ control, name });
  const lengthIn = useWatch({ control, name: `${base}lines.${lineIndex}.lengthIn` }) as number | undefined;
  const current = useWatch({ control, name }) as { toIn?: number }[] | undefined;
  const formState = useFormState({ control, name });
  return (
    <View style={{ gap: space.sm }}>
      <Txt variant="small" bold>
        Pitch zones (stations from the line’s start)
      </Txt>
      {zones.fields.map((z, j) => (
        <View key={z.id} style={styles.zone} testID={`line-${lineIndex}-zone-${j}`}>
          <LengthCells
            control={control}
            cellStyle={styles.zoneCell}
            fields={zoneFields.map((f) => ({
              name: `${name}.${j}.${f.key}`,
              label: f.label,
              testID: `line-${lineIndex}-zone-${j}-${f.id}`,
            }))}
          />
          {zones.fields.length > 1 ? (
            <Button
              label="Remove"
              variant="quiet"
              compact
              onPress={() => zones.remove(j)}
              testID={`line-${lineIndex}-zone-${j}-remove`}
            />
          ) : null}
        </View>
      ))}
      {errorAt(formState.errors, name) ? (
        <Txt variant="small" tone="error">
          {errorAt(formState.errors, name)}
        </Txt>
      ) : null}
      <Button
        label="Add a zone"
        variant="secondary"
        compact
        disabled={zones.fields.length >= 12}
        onPress={() => {
          const lastTo = current?.[current.length - 1]?.toIn;
          zones.append({ fromIn: typeof lastTo === 'number' ? lastTo : undefined, toIn: lengthIn, pitchIn: undefined });
        }}
        testID={`line-${lineIndex}-add-zone`}
        style={{ alignSelf: 'flex-start' }}
      />
    </View>
  );
}

type StepDraft = { text: string; kind: StepKind; inspectionPoint: boolean };
/** A step as the editor holds it: a bare string (a revision written before steps had kinds) becomes one of kind "other". */
const asStep = (s: RevisionInput['steps'] extends (infer T)[] | undefined ? T : never): StepDraft =>
  typeof s === 'string'
    ? { text: s, kind: 'other', inspectionPoint: false }
    : { text: s.text, kind: s.kind ?? 'other', inspectionPoint: s.inspectionPoint ?? false };

function StepsEditor({ control, name }: { control: Control<any>; name: string }) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) => {
        const steps: StepDraft[] = (field.value ?? []).map(asStep);
        const change = (i: number, over: Partial<StepDraft>) =>
          field.onChange(steps.map((x, j) => (j === i ? { ...x, ...over } : x)));
        const errs = fieldState.error as unknown as
          (Record<number, { message?: string; text?: { message?: string } }> & { message?: string }) | undefined;
        return (
          <View style={{ gap: space.md }} testID="steps-editor">
            {steps.map((s, i) => (
              <View key={i} style={{ gap: space.sm }}>
                <Field
                  label={`Step ${i + 1}`}
                  error={errs?.[i]?.text?.message ?? errs?.[i]?.message}
                  testID={`step-text-${i}-field`}
                >
                  <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center' }}>
                    <TextBox
                      style={{ flex: 1 }}
                      value={s.text}
                      testID={`step-text-${i}`}
                      accessibilityLabel={`Step ${i + 1}`}
                      onChangeText={(text) => change(i, { text })}
                      invalid={!!errs?.[i]}
                    />
                    <Button
                      label="Remove"
                      variant="quiet"
                      compact
                      onPress={() => field.onChange(steps.filter((_, j) => j !== i))}
                      testID={`step-text-${i}-remove`}
                    />
                  </View>
                </Field>
                <Choice
                  label={`Step ${i + 1}: operation`}
                  testIDPrefix={`step-kind-${i}`}
                  options={stepKinds.map((k) => ({ value: k, label: stepKindLabels[k] }))}
                  value={s.kind}
                  onChange={(kind) => change(i, { kind })}
                />
                <Toggle
                  kind="checkbox"
                  checked={s.inspectionPoint}
                  onPress={() => change(i, { inspectionPoint: !s.inspectionPoint })}
                  testID={`step-inspection-${i}`}
                  accessibilityLabel={`Step ${i + 1} is an inspection point: an inspector stamps it before later steps`}
                  style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center', minHeight: touch }}
                >
                  <CheckBox on={s.inspectionPoint} />
                  <Txt style={{ flex: 1 }}>Inspection point: an inspector stamps it before later steps</Txt>
                </Toggle>
              </View>
            ))}
            {errs?.message ? (
              <Txt variant="small" tone="error">
                {errs.message}
              </Txt>
            ) : null}
            <Button
              label="Add a step"
              variant="secondary"
              compact
              onPress={() => field.onChange([...steps, { text: '', kind: 'other', inspectionPoint: false }])}
              testID="add-step"
              style={{ alignSelf: 'flex-start' }}
            />
          </View>
        );
      }}
    />
  );
}

function LinesError({ control, name }: { control: Control<any>; name: string }) {
  const { errors } = useFormState({ control, name });
  const msg = errorAt(errors, name);
  return msg ? (
    <Txt variant="small" tone="error" testID="lines-error">
      {msg}
    </Txt>
  ) : null;
}

export function RevisionFields({ control: anyControl, prefix = '' }: Props) {
  const control = anyControl as Control<any>;
  const p = prefix;
  const lines = useFieldArray({ control, name: `${p}lines` });
  return (
    <>
      <Section title="Sheet and fastener">
        <FormTextField
          control={control}
          name={`${p}material`}
          label="Material"
          hint="e.g. 2024-T3 or 6061-T6"
          testID="rev-material"
        />
        <View style={styles.pair}>
          <LengthCells
            control={control}
            fields={[
              { name: `${p}gaugeIn`, label: 'Gauge', testID: 'rev-gauge' },
              { name: `${p}chordIn`, label: 'Chord', testID: 'rev-chord' },
            ]}
          />
        </View>
        <FormTextField
          control={control}
          name={`${p}rivetSpec`}
          label="Rivet callout"
          hint="e.g. MS20470AD4-4"
          testID="rev-rivet"
          autoCapitalize="characters"
          mono
        />
        <View style={styles.pair}>
          <View style={styles.cell}>
            <FormTextField
              control={control}
              name={`${p}drillSize`}
              label="Drill size"
              hint="e.g. #30"
              testID="rev-drill-size"
              mono
            />
          </View>
          <LengthCells
            control={control}
            fields={[{ name: `${p}drillDiameterIn`, label: 'Drill diameter', testID: 'rev-drill-diameter' }]}
          />
        </View>
        <FormNumberField
          control={control}
          name={`${p}edgeDistanceIn`}
          label="Edge distance"
          quantity="length"
          testID="rev-edge-distance"
        />
      </Section>
      <Section title="Fastener lines">
        {lines.fields.map((l, i) => (
          <View key={l.id} style={styles.line} testID={`line-${i}`}>
            <View style={styles.lineHead}>
              <Mono bold>Line {i + 1}</Mono>
              {lines.fields.length > 1 ? (
                <Button
                  label="Remove line"
                  variant="quiet"
                  compact
                  onPress={() => lines.remove(i)}
                  testID={`line-${i}-remove`}
                />
              ) : null}
            </View>
            <View style={styles.pair}>
              <View style={{ width: 110 }}>
                <FormTextField
                  control={control}
                  name={`${p}lines.${i}.code`}
                  label="Code"
                  testID={`line-${i}-code`}
                  autoCapitalize="characters"
                  mono
                  maxLength={3}
                />
              </View>
              <View style={styles.cell}>
                <FormTextField control={control} name={`${p}lines.${i}.name`} label="Name" testID={`line-${i}-name`} />
              </View>
            </View>
            <FormChoiceField
              control={control}
              name={`${p}lines.${i}.surface`}
              label="Runs along"
              testID={`line-${i}-surface`}
              options={[
                { value: 'upper', label: 'Upper surface' },
                { value: 'lower', label: 'Lower surface' },
                { value: 'flat', label: 'Flat' },
              ]}
            />
            <View style={styles.pair}>
              <LengthCells
                control={control}
                fields={[
                  { name: `${p}lines.${i}.startIn`, label: 'Starts aft of leading edge', testID: `line-${i}-start` },
                  { name: `${p}lines.${i}.lengthIn`, label: 'Length', testID: `line-${i}-length` },
                ]}
              />
            </View>
            <ZonesEditor control={control} base={p} lineIndex={i} />
          </View>
        ))}
        <LinesError control={control} name={`${p}lines`} />
        <Button
          label="Add a line"
          variant="secondary"
          disabled={lines.fields.length >= 8}
          onPress={() => lines.append(emptyLine('', '', 'flat'))}
          testID="add-line"
          style={{ alignSelf: 'flex-start' }}
        />
      </Section>
      <Section title="Shop steps">
        <StepsEditor control={control} name={`${p}steps`} />
      </Section>
    </>
  );
}

const styles = StyleSheet.create({
  pair: { flexDirection: 'row', gap: space.md, flexWrap: 'wrap' },
  cell: { flex: 1, minWidth: 150 },
  line: {
    gap: space.md,
    borderWidth: hairline,
    borderColor: colors.ruleStrong,
    padding: space.md,
    backgroundColor: colors.paperRaised,
  },
  lineHead: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between' },
  zone: { flexDirection: 'row', gap: space.sm, alignItems: 'flex-start', flexWrap: 'wrap' },
  zoneCell: { flex: 1, minWidth: 90 },
});
