import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useFieldArray, useForm, useFormState, useWatch, type Control, type FieldPath, type UseFormSetValue } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import { wingStudyBody, type KitModel } from '@/db/contracts';
import { parseNumber } from '@/constants/units';
import { colors, hairline, space } from '@/constants/theme';
import { FormChoiceField, FormNumberField, FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { applyServerErrors, errorAt } from '@/components/forms/server-errors';
import { Button } from '@/components/ui/button';
import { Choice, MultiChoice } from '@/components/ui/choice';
import { Field, TextBox } from '@/components/ui/field';
import { Section } from '@/components/ui/sheet';
import { Notice } from '@/components/ui/states';
import { Label, Mono, Txt } from '@/components/ui/text';
import { ApiError } from '@/hooks/api-client';
import { useUnits } from '@/hooks/use-units';
import { AirfoilFields } from './airfoil-fields';
import { Cell, KitFields, Row } from './kit-fields';
import { gaugeKey, gaugeLabel, RIVET_FAMILIES, STOCK_GAUGES_IN, STUDY_MATERIALS, toggleGauge, toggleRivet, type StudyFormValues } from './study-form-values';
import {
  evenlySpacedRibs, kitIntoWing, PRESSURE_RULE_OPTIONS, SKIN_GAUGES_MAX, SKIN_RIVETS_MAX, WING_RIBS, wingFieldFor, type WingFormValues,
} from './wing-form-values';

export type WingOutput = z.output<typeof wingStudyBody>;

const resolver = zodResolver(wingStudyBody, plainParse);

type Props = {
  kits: KitModel[];
  defaultValues: WingFormValues;
  isNew: boolean;
  submitLabel: string;
  /** Sends the study; throws the server's error, which the form puts on its fields. */
  onSubmit: (values: WingOutput) => Promise<void>;
  note?: React.ReactNode;
};

/**
 * The whole-wing study's inputs: kit data, airfoil, planform and tail, the ribs root to tip, what every
 * rib has, the spar box and its skin, the candidates and the layout settings.
 */
export function WingForm({ kits, defaultValues, isNew, submitLabel, onSubmit, note }: Props) {
  const units = useUnits();
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, setValue, getValues, reset, formState } = useForm<WingFormValues, unknown, WingOutput>({
    resolver,
    mode: 'onChange',
    defaultValues,
  });
  const lines = useFieldArray({ control, name: 'inputs.rib.lines' });
  const kitModelId = useWatch({ control, name: 'kitModelId' });
  const kit = kits.find((k) => k.id === kitModelId);
  const errors = formState.errors;
  // The kit and airfoil blocks are the rib form's own (same paths, same shapes): they take this form's control.
  const shared = control as unknown as Control<StudyFormValues>;

  const takeKit = (k: KitModel, planform = true) =>
    reset(kitIntoWing(getValues(), k, { planform }), { keepDefaultValues: true, keepDirty: false, keepErrors: false });

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await onSubmit(values);
    } catch (e) {
      const said = applyServerErrors(setError, e, wingFieldFor);
      if (e instanceof ApiError && e.fields && Object.keys(e.fields).length) {
        const unplaced = Object.entries(e.fields).filter(([p]) => !wingFieldFor(p)).map(([, m]) => m.trim().replace(/[.]$/, ''));
        setFormError(unplaced.length ? `Not computed: ${unplaced.join('; ')}.` : 'Not computed: some inputs were refused. See the marked fields.');
      } else {
        setFormError(said);
      }
    }
  }, () => setFormError('Some inputs need a look: see the messages in red.'));

  return (
    <View style={{ gap: space.xl }} testID="wing-form">
      <Section title="Study">
        <FormTextField control={control} name="name" label="Name of the study" hint="e.g. Left wing, flight envelope" testID="wing-name" />
        <Controller
          control={control}
          name="kitModelId"
          render={({ field, fieldState }) => (
            <Field label="Kit model" error={fieldState.error?.message} testID="wing-kit-field">
              <Choice
                testIDPrefix="wing-kit"
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
          <Button label={`Take ${kit.code}'s weight, wing, speeds and airfoil`} variant="quiet" compact onPress={() => takeKit(kit, false)} testID="wing-take-kit" style={{ alignSelf: 'flex-start', marginLeft: -space.md }} />
        ) : null}
      </Section>

      <Section title="Aircraft">
        <KitFields control={shared} prefix="wing" />
      </Section>

      <Section title="Airfoil">
        <AirfoilFields
          control={shared}
          setValue={setValue as unknown as UseFormSetValue<StudyFormValues>}
          errors={{ root: errorAt(errors, 'inputs.airfoil'), points: errorAt(errors, 'inputs.airfoil.points') }}
        />
      </Section>

      <Section title="Planform and tail">
        <PlanformFields control={control} setValue={setValue} />
        <Row>
          <Cell><FormNumberField control={control} name="inputs.tail.armIn" label="Tail arm" quantity="length" hint="Wing quarter chord to the tail's" testID="wing-tail-arm" /></Cell>
          <Cell>
            <FormNumberField
              control={control}
              name="inputs.tail.balancingLoadLb"
              label="Tail balancing load at VC"
              quantity="force"
              hint="Down is positive. Blank: estimated from the section's moment"
              testID="wing-tail-load"
            />
          </Cell>
        </Row>
      </Section>

      <RibsFields control={control} setValue={setValue} />

      <Section
        title="On every rib: fastener lines"
        aside={lines.fields.length < 6 ? (
          <Button
            label="Add a line"
            variant="quiet"
            compact
            testID="wing-line-add"
            onPress={() => lines.append({ name: `Line ${lines.fields.length + 1}`, surface: 'upper', startXc: 0.1, endXc: 0.8 })}
          />
        ) : undefined}
      >
        <Txt variant="small" tone="soft">Where each row of rivets runs on a rib, as fractions of its chord (x/c) from the leading edge.</Txt>
        {errorAt(errors, 'inputs.rib.lines') ? <Notice tone="error">{errorAt(errors, 'inputs.rib.lines')!}</Notice> : null}
        {lines.fields.map((f, i) => (
          <View key={f.id} style={{ gap: space.sm, paddingBottom: space.md, borderBottomWidth: hairline, borderColor: colors.rule }} testID={`wing-line-${i}`}>
            <Row>
              <Cell><FormTextField control={control} name={`inputs.rib.lines.${i}.name`} label={`Line ${i + 1} name`} testID={`wing-line-${i}-name`} /></Cell>
              <Cell>
                <FormChoiceField
                  control={control}
                  name={`inputs.rib.lines.${i}.surface`}
                  label="Surface"
                  testID={`wing-line-${i}-surface`}
                  options={[{ value: 'upper', label: 'Upper' }, { value: 'lower', label: 'Lower' }]}
                />
              </Cell>
            </Row>
            <Row>
              <Cell><FormNumberField control={control} name={`inputs.rib.lines.${i}.startXc`} label="Starts at" unit="x/c" testID={`wing-line-${i}-start`} /></Cell>
              <Cell><FormNumberField control={control} name={`inputs.rib.lines.${i}.endXc`} label="Ends at" unit="x/c" testID={`wing-line-${i}-end`} /></Cell>
            </Row>
            {lines.fields.length > 1 ? (
              <Button label={`Remove line ${i + 1}`} variant="quiet" compact onPress={() => lines.remove(i)} testID={`wing-line-${i}-remove`} style={{ alignSelf: 'flex-start' }} />
            ) : null}
          </View>
        ))}
        <Row>
          <Cell><FormNumberField control={control} name="inputs.rib.internalCp" label="Pressure inside the wing" unit="Cp" hint="Blank: 0 (no vents or leaks)" testID="wing-internal-cp" /></Cell>
          <Cell><FormNumberField control={control} name="inputs.rib.flangeWidthIn" label="Flange width" quantity="length" hint="Blank: 4 rivet diameters" testID="wing-flange-width" /></Cell>
          <Cell><FormNumberField control={control} name="inputs.rib.skinGaugeIn" label="Skin gauge for the grip" quantity="length" hint="Blank: twice the flange gauge" testID="wing-rib-skin-gauge" /></Cell>
        </Row>
      </Section>

      <Section title="Spars and skin">
        <Row>
          <Cell><FormNumberField control={control} name="inputs.spars.frontXc" label="Front spar at" unit="x/c" hint="0.05 to 0.5" testID="wing-front-spar" /></Cell>
          <Cell><FormNumberField control={control} name="inputs.spars.rearXc" label="Rear spar at" unit="x/c" hint="0.2 to 0.9" testID="wing-rear-spar" /></Cell>
          <Cell>
            <FormNumberField
              control={control}
              name="inputs.spars.capAreaSqIn"
              label="Spar-cap area, one surface"
              unit="in²"
              hint="Both caps. Blank: the skin alone carries the bending"
              testID="wing-cap-area"
            />
          </Cell>
        </Row>
        <GaugeChips control={control} name="inputs.skin.gaugeCandidates" label="Skin gauges to try" hint={`Up to ${SKIN_GAUGES_MAX}, each with each skin rivet.`} testIDPrefix="wing-skin-gauge" max={SKIN_GAUGES_MAX} />
        <RivetChips control={control} name="inputs.skin.rivetCandidates" label="Skin rivets to try" testIDPrefix="wing-skin-rivet" max={SKIN_RIVETS_MAX} />
      </Section>

      <Section title="Rib material and candidates">
        <Controller
          control={control}
          name="inputs.material"
          render={({ field, fieldState }) => (
            <Field label="Sheet material (ribs and skin)" error={fieldState.error?.message}>
              <Choice
                testIDPrefix="wing-material"
                value={field.value}
                onChange={field.onChange}
                invalid={!!fieldState.error}
                options={[...new Set([...STUDY_MATERIALS, ...(field.value ? [field.value] : [])])].map((m) => ({ value: m, label: m }))}
              />
            </Field>
          )}
        />
        <GaugeChips control={control} name="inputs.gaugeCandidates" label="Rib gauges to try" hint="Stock sheet; each gauge is tried with each rivet on every rib." testIDPrefix="wing-gauge" max={10} />
        <RivetChips control={control} name="inputs.rivetCandidates" label="Rib rivets to try" testIDPrefix="wing-rivet" max={8} />
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

      <Section title="Schedule settings">
        <Row>
          <Cell><FormNumberField control={control} name="inputs.maxPitchDiameters" label="Largest pitch" unit="D" hint="In rivet diameters, 4 to 16" testID="wing-max-pitch" /></Cell>
          <Cell><FormNumberField control={control} name="inputs.pitchIncrementIn" label="Pitch rounded to" quantity="length" hint="The pitch steps down in these" testID="wing-pitch-increment" /></Cell>
          <Cell><FormNumberField control={control} name="inputs.maxZones" label="Zones per line, at most" unit="zones" testID="wing-max-zones" /></Cell>
        </Row>
        <Row>
          <Cell><FormNumberField control={control} name="inputs.minutesPerHole" label="Minutes per hole" unit="min" hint="Blank: 1.5 solid, 1.0 pulled" testID="wing-minutes-per-hole" /></Cell>
          <Cell><FormNumberField control={control} name="inputs.panels" label="Panels on the airfoil" unit="panels" hint="Even, 40 to 400; blank: 160" testID="wing-panels" /></Cell>
        </Row>
        <FormChoiceField
          control={control}
          name="inputs.rankBy"
          label="Rank each rib's feasible candidates by"
          testID="wing-rank-by"
          options={[{ value: 'weight', label: 'Lightest first' }, { value: 'buildTime', label: 'Quickest to build first' }]}
        />
      </Section>

      {note}
      {formError ? <Notice tone="error" testID="wing-form-error">{formError}</Notice> : null}
      <Button label={submitLabel} busyLabel="Computing" busy={formState.isSubmitting} onPress={() => void submit()} testID="wing-compute" />
      <Txt variant="small" tone="faint">
        The server computes every rib and every skin panel with every candidate; a wing takes longer than one rib. Stored in inches and
        pounds whatever units you typed in ({units.label('length')}).
      </Txt>
    </View>
  );
}

type Ctl = Control<WingFormValues>;

/** Rectangle or straight taper; switching keeps the span and carries the chord across. */
function PlanformFields({ control, setValue }: { control: Ctl; setValue: UseFormSetValue<WingFormValues> }) {
  const planform = useWatch({ control, name: 'inputs.planform' });
  const kind = planform?.kind ?? 'rectangle';
  const switchTo = (k: 'rectangle' | 'tapered') => {
    if (k === kind || !planform) return;
    const opts = { shouldValidate: true, shouldDirty: true } as const;
    if (k === 'tapered') {
      const c = planform.kind === 'rectangle' ? planform.chordIn : undefined;
      setValue('inputs.planform', { kind: 'tapered', spanIn: planform.spanIn, rootChordIn: c, tipChordIn: c } as WingFormValues['inputs']['planform'], opts);
    } else {
      const c = planform.kind === 'tapered' ? planform.rootChordIn : undefined;
      setValue('inputs.planform', { kind: 'rectangle', spanIn: planform.spanIn, chordIn: c } as WingFormValues['inputs']['planform'], opts);
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
          options={[{ value: 'rectangle', label: 'Rectangle' }, { value: 'tapered', label: 'Tapered', hint: 'Straight taper, root to tip' }]}
        />
      </Field>
      <Row>
        <Cell><FormNumberField control={control} name="inputs.planform.spanIn" label="Span, tip to tip" quantity="length" testID="wing-span" /></Cell>
        {kind === 'rectangle' ? (
          <Cell><FormNumberField control={control} name={'inputs.planform.chordIn' as FieldPath<WingFormValues>} label="Chord" quantity="length" testID="wing-chord" /></Cell>
        ) : (
          <>
            <Cell><FormNumberField control={control} name={'inputs.planform.rootChordIn' as FieldPath<WingFormValues>} label="Root chord" quantity="length" testID="wing-root-chord" /></Cell>
            <Cell><FormNumberField control={control} name={'inputs.planform.tipChordIn' as FieldPath<WingFormValues>} label="Tip chord" quantity="length" hint="0.1 to 1 times the root chord" testID="wing-tip-chord" /></Cell>
          </>
        )}
      </Row>
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
  const fromLen = (v: number | undefined) => (v === undefined || !Number.isFinite(v) ? '' : units.system === 'metric' ? String(Math.round(v * 25.4)) : String(v));

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
    if (typeof made === 'string') { setHelperError(made); return; }
    setValue('inputs.ribs', made, { shouldValidate: true, shouldDirty: true });
    setHelper(null);
  };
  const lu = units.label('length');

  return (
    <Section
      title="Ribs, root to tip"
      testID="wing-ribs"
      aside={<Txt variant="small" tone="soft" testID="wing-rib-count"><Mono variant="small" bold>{ribs.fields.length}</Mono> ribs</Txt>}
    >
      <Txt variant="small" tone="soft">Each rib by its station: its distance outboard of the aeroplane’s centre line. Each is studied at its own chord and load.</Txt>
      {errorAt(errors, 'inputs.ribs') ? <Notice tone="error" testID="wing-ribs-error">{errorAt(errors, 'inputs.ribs')!}</Notice> : null}
      {helper ? (
        <View style={{ gap: space.sm, padding: space.md, borderWidth: hairline, borderColor: colors.rule, backgroundColor: colors.paperRaised }} testID="wing-even">
          <Row>
            <Cell><Field label="Ribs"><TextBox mono value={helper.count} onChangeText={(t) => setHelper({ ...helper, count: t })} inputMode="numeric" testID="wing-even-count" accessibilityLabel="Number of ribs" /></Field></Cell>
            <Cell><Field label="First rib name"><TextBox value={helper.name} onChangeText={(t) => setHelper({ ...helper, name: t })} testID="wing-even-name" accessibilityLabel="First rib name" /></Field></Cell>
          </Row>
          <Row>
            <Cell><Field label="First station" unit={lu}><TextBox mono value={helper.first} onChangeText={(t) => setHelper({ ...helper, first: t })} inputMode="decimal" testID="wing-even-first" accessibilityLabel={`First station (${lu})`} /></Field></Cell>
            <Cell><Field label="Last station" unit={lu}><TextBox mono value={helper.last} onChangeText={(t) => setHelper({ ...helper, last: t })} inputMode="decimal" testID="wing-even-last" accessibilityLabel={`Last station (${lu})`} /></Field></Cell>
          </Row>
          {helperError ? <Notice tone="error" testID="wing-even-error">{helperError}</Notice> : null}
          <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
            <Button label="Replace the ribs" compact onPress={spread} testID="wing-even-apply" />
            <Button label="Cancel" variant="quiet" compact onPress={() => setHelper(null)} testID="wing-even-cancel" />
          </View>
        </View>
      ) : (
        <Button label="Evenly spaced…" variant="secondary" compact onPress={openHelper} testID="wing-even-open" style={{ alignSelf: 'flex-start' }} />
      )}
      {ribs.fields.map((f, i) => (
        <View key={f.id} style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.md, alignItems: 'flex-end', paddingBottom: space.sm, borderBottomWidth: hairline, borderColor: colors.rule }} testID={`wing-rib-${i}`}>
          <View style={{ flexGrow: 1, flexBasis: 120, minWidth: 110 }}><FormTextField control={control} name={`inputs.ribs.${i}.name`} label={`Rib ${i + 1}`} testID={`wing-rib-${i}-name`} mono /></View>
          <View style={{ flexGrow: 1, flexBasis: 120, minWidth: 110 }}><FormNumberField control={control} name={`inputs.ribs.${i}.stationIn`} label="Station" quantity="length" testID={`wing-rib-${i}-station`} /></View>
          {ribs.fields.length > WING_RIBS.min ? (
            <Button label="Remove" variant="quiet" compact onPress={() => ribs.remove(i)} testID={`wing-rib-${i}-remove`} accessibilityLabel={`Remove rib ${i + 1}`} />
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
            const step = last && prev && Number.isFinite(last.stationIn - prev.stationIn) ? last.stationIn - prev.stationIn : 12;
            ribs.append({ name: `Rib ${current.length + 1}`, stationIn: last && Number.isFinite(last.stationIn) ? Math.round((last.stationIn + step) * 100) / 100 : 0 });
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
          onChange={(v) => setValue('inputs.flaps', v === 'on' ? ({ stallSpeedKeas: undefined } as unknown as WingFormValues['inputs']['flaps']) : undefined, opts)}
          options={[{ value: 'off', label: 'Not studied' }, { value: 'on', label: 'Studied', hint: '14 CFR 23.345 conditions' }]}
        />
      </Field>
      {on ? (
        <Row>
          <Cell><FormNumberField control={control} name="inputs.flaps.stallSpeedKeas" label="Stall speed, flaps extended" unit="KEAS" testID="wing-flaps-stall" /></Cell>
          <Cell><FormNumberField control={control} name="inputs.flaps.designSpeedKeas" label="Flap design speed" unit="KEAS" hint="Blank: the rule minimum" testID="wing-flaps-speed" /></Cell>
        </Row>
      ) : null}
    </View>
  );
}

type ListName = 'inputs.gaugeCandidates' | 'inputs.skin.gaugeCandidates';
type RivetListName = 'inputs.rivetCandidates' | 'inputs.skin.rivetCandidates';

function GaugeChips({ control, name, label, hint, testIDPrefix, max }: { control: Ctl; name: ListName; label: string; hint: string; testIDPrefix: string; max: number }) {
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
            <Txt variant="small" tone={values.length > max ? 'error' : 'soft'}><Mono variant="small" bold>{values.length}</Mono> of at most {max} chosen</Txt>
          </Field>
        );
      }}
    />
  );
}

function RivetChips({ control, name, label, testIDPrefix, max }: { control: Ctl; name: RivetListName; label: string; testIDPrefix: string; max: number }) {
  const { errors } = useFormState({ control, name });
  return (
    <Controller
      control={control}
      name={name}
      render={({ field }) => {
        const values = (field.value ?? []) as string[];
        const known = new Set(RIVET_FAMILIES.flatMap((f) => f.codes));
        const others = values.filter((v) => !known.has(v));
        return (
          <Field label={label} error={errorAt(errors, name)} testID={`${testIDPrefix}s-field`}>
            <View style={{ gap: space.sm }}>
              {RIVET_FAMILIES.map((fam) => (
                <View key={fam.family} style={{ gap: space.xs }}>
                  <Label>{fam.label}</Label>
                  <MultiChoice testIDPrefix={testIDPrefix} values={values} onToggle={(c) => field.onChange(toggleRivet(values, c))} options={fam.codes.map((c) => ({ value: c, label: c }))} />
                </View>
              ))}
              {others.length ? (
                <View style={{ gap: space.xs }}>
                  <Label>Others in this study</Label>
                  <MultiChoice testIDPrefix={testIDPrefix} values={values} onToggle={(c) => field.onChange(toggleRivet(values, c))} options={others.map((c) => ({ value: c, label: c }))} />
                </View>
              ) : null}
              <Txt variant="small" tone={values.length > max ? 'error' : 'soft'}><Mono variant="small" bold>{values.length}</Mono> of at most {max} chosen</Txt>
            </View>
          </Field>
        );
      }}
    />
  );
}
