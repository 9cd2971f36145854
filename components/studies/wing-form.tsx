import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import {
  useFieldArray,
  useFormState,
  useWatch,
  type Control,
  type FieldPath,
  type UseFormSetValue,
} from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import { wingStudyBody, type KitModel } from '@/db/contracts';
import { parseNumber } from '@/constants/units';
import { colors, hairline, space } from '@/constants/theme';
import { FormError } from '@/components/forms/form-error';
import { FormChoiceField, FormNumberField, FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { Cell, NumberRows, Row, type NumberFieldSpec } from '@/components/forms/number-rows';
import { errorAt } from '@/components/forms/server-errors';
import { Button } from '@/components/ui/button';
import { Choice } from '@/components/ui/choice';
import { Field, TextBox } from '@/components/ui/field';
import { Section } from '@/components/ui/sheet';
import { Notice } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
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
import type { StudyFormValues } from './study-form-values';
import { useStudyForm } from './use-study-form';
import {
  evenlySpacedRibs,
  kitIntoWing,
  PRESSURE_RULE_OPTIONS,
  SKIN_GAUGES_MAX,
  SKIN_RIVETS_MAX,
  WING_RIBS,
  wingFieldFor,
  type WingFormValues,
} from './wing-form-values';

export type WingOutput = z.output<typeof wingStudyBody>;

const resolver = zodResolver(wingStudyBody, plainParse);

type Props = StudyFormProps<WingFormValues, WingOutput>;

/**
 * The whole-wing study's inputs: kit data, airfoil, planform and tail, the ribs root to tip, what every
 * rib has, the spar box and its skin, the candidates and the layout settings.
 */
export function WingForm({ kits, defaultValues, isNew, submitLabel, onSubmit, note }: Props) {
  const units = useUnits();
  const {
    form: { control, setValue, getValues, formState },
    submit,
    formError,
    take,
  } = useStudyForm<WingFormValues, WingOutput>({ resolver, defaultValues, onSubmit, fieldFor: wingFieldFor });
  // The blocks at the same paths as the rib form's (kit, airfoil, material, settings) take this form's control.
  const shared = control as unknown as Control<StudyFormValues>;

  // Taken again, the kit keeps the planform: the person may have drawn their own.
  const takeKit = (k: KitModel, when: 'chosen' | 'again') =>
    take(kitIntoWing(getValues(), k, { planform: when === 'chosen' }));

  return (
    <View style={{ gap: space.xl }} testID="wing-form">
      <StudyBasics
        control={shared}
        setValue={setValue as unknown as UseFormSetValue<StudyFormValues>}
        kits={kits}
        isNew={isNew}
        prefix="wing"
        nameHint="e.g. Left wing, flight envelope"
        onTake={takeKit}
      />

      <Section title="Planform and tail">
        <PlanformFields control={control} setValue={setValue} />
        <NumberRows
          control={control}
          rows={[
            [
              {
                name: 'inputs.tail.armIn',
                label: 'Tail arm',
                quantity: 'length',
                hint: "Wing quarter chord to the tail's",
                testID: 'wing-tail-arm',
              },
              {
                name: 'inputs.tail.balancingLoadLb',
                label: 'Tail balancing load at VC',
                quantity: 'force',
                hint: "Down is positive. Blank: estimated from the section's moment",
                testID: 'wing-tail-load',
              },
            ],
          ]}
        />
      </Section>

      <RibsFields control={control} setValue={setValue} />

      <FastenerLinesSection
        control={control}
        name="inputs.rib.lines"
        prefix="wing"
        title="On every rib: fastener lines"
        intro="Where each row of rivets runs on a rib, as fractions of its chord (x/c) from the leading edge."
      >
        <NumberRows
          control={control}
          rows={[
            [
              ...ribPressureAndFlange<WingFormValues>('wing'),
              {
                name: 'inputs.rib.skinGaugeIn',
                label: 'Skin gauge for the grip',
                quantity: 'length',
                hint: 'Blank: twice the flange gauge',
                testID: 'wing-rib-skin-gauge',
              },
            ],
          ]}
        />
      </FastenerLinesSection>

      <Section title="Spars and skin">
        <NumberRows
          control={control}
          rows={[
            [
              {
                name: 'inputs.spars.frontXc',
                label: 'Front spar at',
                unit: 'x/c',
                hint: '0.05 to 0.5',
                testID: 'wing-front-spar',
              },
              {
                name: 'inputs.spars.rearXc',
                label: 'Rear spar at',
                unit: 'x/c',
                hint: '0.2 to 0.9',
                testID: 'wing-rear-spar',
              },
              {
                name: 'inputs.spars.capAreaSqIn',
                label: 'Spar-cap area, one surface',
                unit: 'in²',
                hint: 'Both caps. Blank: the skin alone carries the bending',
                testID: 'wing-cap-area',
              },
            ],
          ]}
        />
        <GaugeChips
          control={control}
          name="inputs.skin.gaugeCandidates"
          label="Skin gauges to try"
          hint={`Up to ${SKIN_GAUGES_MAX}, each with each skin rivet.`}
          testIDPrefix="wing-skin-gauge"
          max={SKIN_GAUGES_MAX}
        />
        <RivetChips
          control={control}
          name="inputs.skin.rivetCandidates"
          label="Skin rivets to try"
          testIDPrefix="wing-skin-rivet"
          max={SKIN_RIVETS_MAX}
        />
      </Section>

      <Section title="Rib material and candidates">
        <MaterialField control={shared} label="Sheet material (ribs and skin)" prefix="wing" />
        <GaugeChips
          control={control}
          name="inputs.gaugeCandidates"
          label="Rib gauges to try"
          hint="Stock sheet; each gauge is tried with each rivet on every rib."
          testIDPrefix="wing-gauge"
          max={10}
        />
        <RivetChips
          control={control}
          name="inputs.rivetCandidates"
          label="Rib rivets to try"
          testIDPrefix="wing-rivet"
          max={8}
        />
      </Section>

      <Section title="Flight conditions">
        <FlapsFields control={control} setValue={setValue} />
        <FormChoiceField
          control={control}
          name="inputs.compressibility"
          label="Cp corrected to each condition's Mach number by"
          testID="wing-compressibility"
          options={PRESSURE_RULE_OPTIONS}
        />
      </Section>

      <ScheduleFields
        control={shared}
        prefix="wing"
        minutesHint="Blank: 1.5 solid, 1.0 pulled"
        rankLabel="Rank each rib's feasible candidates by"
      />

      <StudyFormFoot
        prefix="wing"
        note={note}
        formError={formError}
        busy={formState.isSubmitting}
        submitLabel={submitLabel}
        onSubmit={() => void submit()}
      >
        The server computes every rib and every skin panel with every candidate; a wing takes longer than one rib.
        Stored in inches and pounds whatever units you typed in ({units.label('length')}).
      </StudyFormFoot>
    </View>
  );
}

type Ctl = Control<WingFormValues>;

// The chords' paths hold only for one kind of planform: typed as paths of the form, as the field is shown.
const chordPath = (p: string) => p as FieldPath<WingFormValues>;

/** The span, then the chord of a rectangle or the root and tip chords of a taper. */
const planformRow = (kind: 'rectangle' | 'tapered'): NumberFieldSpec<WingFormValues>[] => [
  { name: 'inputs.planform.spanIn', label: 'Span, tip to tip', quantity: 'length', testID: 'wing-span' },
  ...(kind === 'rectangle'
    ? [
        {
          name: chordPath('inputs.planform.chordIn'),
          label: 'Chord',
          quantity: 'length',
          testID: 'wing-chord',
        } as const,
      ]
    : ([
        {
          name: chordPath('inputs.planform.rootChordIn'),
          label: 'Root chord',
          quantity: 'length',
          testID: 'wing-root-chord',
        },
        {
          name: chordPath('inputs.planform.tipChordIn'),
          label: 'Tip chord',
          quantity: 'length',
          hint: '0.1 to 1 times the root chord',
          testID: 'wing-tip-chord',
        },
      ] as const)),
];

/** Rectangle or straight taper; switching keeps the span and carries the chord across. */
function PlanformFields({ control, setValue }: { control: Ctl; setValue: UseFormSetValue<WingFormValues> }) {
  const planform = useWatch({ control, name: 'inputs.planform' });
  const kind = planform?.kind ?? 'rectangle';
  const switchTo = (k: 'rectangle' | 'tapered') => {
    if (k === kind || !planform) return;
    const opts = { shouldValidate: true, shouldDirty: true } as const;
    if (k === 'tapered') {
      const c = planform.kind === 'rectangle' ? planform.chordIn : undefined;
      setValue(
        'inputs.planform',
        {
          kind: 'tapered',
          spanIn: planform.spanIn,
          rootChordIn: c,
          tipChordIn: c,
        } as WingFormValues['inputs']['planform'],
        opts,
      );
    } else {
      const c = planform.kind === 'tapered' ? planform.rootChordIn : undefined;
      setValue(
        'inputs.planform',
        { kind: 'rectangle', spanIn: planform.spanIn, chordIn: c } as WingFormValues['inputs']['planform'],
        opts,
      );
    }
  };
  return (
    <View style={{ gap: space.md }}>
      <Field label="Planform">
        <Choice
          testIDPrefix="wing-planform"
          label="Planform"
          value={kind}
          onChange={switchTo}
          options={[
            { value: 'rectangle', label: 'Rectangle' },
            { value: 'tapered', label: 'Tapered', hint: 'Straight taper, root to tip' },
          ]}
        />
      </Field>
      <NumberRows control={control} rows={[planformRow(kind)]} />
    </View>
  );
}

/** The ribs root to tip, each a name and a station; "evenly spaced" fills the list in one go. */
function RibsFields({ control, setValue }: { control: Ctl; setValue: UseFormSetValue<WingFormValues> }) {
  const units = useUnits();
  const ribs = useFieldArray({ control, name: 'inputs.ribs' });
  const { errors } = useFormState({ control, name: 'inputs.ribs' });
  const current = useWatch({ control, name: 'inputs.ribs' }) ?? [];
  const [helper, setHelper] = useState<{ count: string; first: string; last: string; name: string } | null>(null);
  const [helperError, setHelperError] = useState<string | null>(null);
  const toLen = (t: string) => {
    const n = parseNumber(t);
    return n === undefined ? Number.NaN : units.system === 'metric' ? n / 25.4 : n;
  };
  const fromLen = (v: number | undefined) =>
    v === undefined || !Number.isFinite(v) ? '' : units.system === 'metric' ? String(Math.round(v * 25.4)) : String(v);

  const openHelper = () => {
    setHelperError(null);
    setHelper({
      count: String(current.length || 10),
      first: fromLen(current[0]?.stationIn),
      last: fromLen(current[current.length - 1]?.stationIn),
      name: current[0]?.name || 'W-101',
    });
  };
  const spread = () => {
    if (!helper) return;
    const made = evenlySpacedRibs(Number(helper.count), toLen(helper.first), toLen(helper.last), helper.name);
    if (typeof made === 'string') {
      setHelperError(made);
      return;
    }
    setValue('inputs.ribs', made, { shouldValidate: true, shouldDirty: true });
    setHelper(null);
  };
  const lu = units.label('length');

  return (
    <Section
      title="Ribs, root to tip"
      testID="wing-ribs"
      aside={
        <Txt variant="small" tone="soft" testID="wing-rib-count">
          <Mono variant="small" bold>
            {ribs.fields.length}
          </Mono>{' '}
          ribs
        </Txt>
      }
    >
      <Txt variant="small" tone="soft">
        Each rib by its station: its distance outboard of the aeroplane’s centre line. Each is studied at its own chord
        and load.
      </Txt>
      {errorAt(errors, 'inputs.ribs') ? (
        <Notice tone="error" testID="wing-ribs-error">
          {errorAt(errors, 'inputs.ribs')!}
        </Notice>
      ) : null}
      {helper ? (
        <View
          style={{
            gap: space.sm,
            padding: space.md,
            borderWidth: hairline,
            borderColor: colors.rule,
            backgroundColor: colors.paperRaised,
          }}
          testID="wing-even"
        >
          <Row>
            <Cell>
              <Field label="Ribs">
                <TextBox
                  mono
                  value={helper.count}
                  onChangeText={(t) => setHelper({ ...helper, count: t })}
                  inputMode="numeric"
                  testID="wing-even-count"
                  accessibilityLabel="Number of ribs"
                />
              </Field>
            </Cell>
            <Cell>
              <Field label="First rib name">
                <TextBox
                  value={helper.name}
                  onChangeText={(t) => setHelper({ ...helper, name: t })}
                  testID="wing-even-name"
                  accessibilityLabel="First rib name"
                />
              </Field>
            </Cell>
          </Row>
          <Row>
            <Cell>
              <Field label="First station" unit={lu}>
                <TextBox
                  mono
                  value={helper.first}
                  onChangeText={(t) => setHelper({ ...helper, first: t })}
                  inputMode="decimal"
                  testID="wing-even-first"
                  accessibilityLabel={`First station (${lu})`}
                />
              </Field>
            </Cell>
            <Cell>
              <Field label="Last station" unit={lu}>
                <TextBox
                  mono
                  value={helper.last}
                  onChangeText={(t) => setHelper({ ...helper, last: t })}
                  inputMode="decimal"
                  testID="wing-even-last"
                  accessibilityLabel={`Last station (${lu})`}
                />
              </Field>
            </Cell>
          </Row>
          <FormError message={helperError} testID="wing-even-error" />
          <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
            <Button label="Replace the ribs" compact onPress={spread} testID="wing-even-apply" />
            <Button label="Cancel" variant="quiet" compact onPress={() => setHelper(null)} testID="wing-even-cancel" />
          </View>
        </View>
      ) : (
        <Button
          label="Evenly spaced…"
          variant="secondary"
          compact
          onPress={openHelper}
          testID="wing-even-open"
          style={{ alignSelf: 'flex-start' }}
        />
      )}
      {ribs.fields.map((f, i) => (
        <View
          key={f.id}
          style={{
            flexDirection: 'row',
            flexWrap: 'wrap',
            gap: space.md,
            alignItems: 'flex-end',
            paddingBottom: space.sm,
            borderBottomWidth: hairline,
            borderColor: colors.rule,
          }}
          testID={`wing-rib-${i}`}
        >
          <View style={{ flexGrow: 1, flexBasis: 120, minWidth: 110 }}>
            <FormTextField
              control={control}
              name={`inputs.ribs.${i}.name`}
              label={`Rib ${i + 1}`}
              testID={`wing-rib-${i}-name`}
              mono
            />
          </View>
          <View style={{ flexGrow: 1, flexBasis: 120, minWidth: 110 }}>
            <FormNumberField
              control={control}
              name={`inputs.ribs.${i}.stationIn`}
              label="Station"
              quantity="length"
              testID={`wing-rib-${i}-station`}
            />
          </View>
          {ribs.fields.length > WING_RIBS.min ? (
            <Button
              label="Remove"
              variant="quiet"
              compact
              onPress={() => ribs.remove(i)}
              testID={`wing-rib-${i}-remove`}
              accessibilityLabel={`Remove rib ${i + 1}`}
            />
          ) : null}
        </View>
      ))}
      {ribs.fields.length < WING_RIBS.max ? (
        <Button
          label="Add a rib outboard"
          variant="quiet"
          compact
          testID="wing-rib-add"
          style={{ alignSelf: 'flex-start', marginLeft: -space.md }}
          onPress={() => {
            const last = current[current.length - 1];
            const prev = current[current.length - 2];
            const step =
              last && prev && Number.isFinite(last.stationIn - prev.stationIn) ? last.stationIn - prev.stationIn : 12;
            ribs.append({
              name: `Rib ${current.length + 1}`,
              stationIn: last && Number.isFinite(last.stationIn) ? Math.round((last.stationIn + step) * 100) / 100 : 0,
            });
          }}
        />
      ) : null}
    </Section>
  );
}

/** Flaps studied or not: on, the flaps-extended stall speed (and VF when above the rule minimum). */
function FlapsFields({ control, setValue }: { control: Ctl; setValue: UseFormSetValue<WingFormValues> }) {
  const flaps = useWatch({ control, name: 'inputs.flaps' });
  const on = !!flaps;
  const opts = { shouldValidate: true, shouldDirty: true } as const;
  return (
    <View style={{ gap: space.md }}>
      <Field label="Flaps extended">
        <Choice
          testIDPrefix="wing-flaps"
          label="Flaps extended"
          value={on ? 'on' : 'off'}
          onChange={(v) =>
            setValue(
              'inputs.flaps',
              v === 'on' ? ({ stallSpeedKeas: undefined } as unknown as WingFormValues['inputs']['flaps']) : undefined,
              opts,
            )
          }
          options={[
            { value: 'off', label: 'Not studied' },
            { value: 'on', label: 'Studied', hint: '14 CFR 23.345 conditions' },
          ]}
        />
      </Field>
      {on ? (
        <NumberRows
          control={control}
          rows={[
            [
              {
                name: 'inputs.flaps.stallSpeedKeas',
                label: 'Stall speed, flaps extended',
                unit: 'KEAS',
                testID: 'wing-flaps-stall',
              },
              {
                name: 'inputs.flaps.designSpeedKeas',
                label: 'Flap design speed',
                unit: 'KEAS',
                hint: 'Blank: the rule minimum',
                testID: 'wing-flaps-speed',
              },
            ],
          ]}
        />
      ) : null}
    </View>
  );
}
