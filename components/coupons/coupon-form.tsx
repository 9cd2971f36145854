import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm, type Control } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import { couponInput, couponOutcomeLabels, couponOutcomes, type CouponInput } from '@/db/contracts';
import { space } from '@/constants/theme';
import { FormChoiceField, FormNumberField, FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/states';
import { useCouponCreateMutation } from '@/hooks/queries/coupons';
import { useUnits } from '@/hooks/use-units';

type Out = z.output<typeof couponInput>;

/** Today as the date field wants it (the person's own calendar day, not UTC's). */
export function todayIso(now = new Date()): string {
  const p = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${p(now.getMonth() + 1)}-${p(now.getDate())}`;
}

const blank = (): CouponInput =>
  ({
    material: '6061-T6',
    couponWidthIn: 1,
    rivetSpec: 'PULLED-4',
    testedOn: todayIso(),
    note: '',
  }) as CouponInput;

/**
 * Records one coupon test. After saving, the set-up (material, gauge, width, rivet, date) stays so a
 * series of loads on the same coupon set goes in quickly; load, outcome and note clear.
 */
export function CouponForm() {
  const units = useUnits();
  const create = useCouponCreateMutation();
  const [message, setMessage] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);
  const { control, handleSubmit, setError, reset, formState } = useForm<CouponInput, unknown, Out>({
    resolver: zodResolver(couponInput, plainParse),
    mode: 'onChange',
    defaultValues: blank(),
  });

  const submit = handleSubmit(
    async (v) => {
      setMessage(null);
      try {
        const made = await create.mutateAsync(v);
        reset({
          material: made.material,
          gaugeIn: made.gaugeIn,
          couponWidthIn: made.couponWidthIn,
          rivetSpec: made.rivetSpec,
          testedOn: made.testedOn,
          note: '',
        } as CouponInput);
        setMessage({
          tone: 'ok',
          text: `Recorded: ${units.length(made.gaugeIn)} ${made.material} with ${made.rivetSpec} at ${units.force(made.loadLb)}, ${couponOutcomeLabels[made.outcome].toLowerCase()}.`,
        });
      } catch (e) {
        setMessage({ tone: 'error', text: applyServerErrors(setError, e) });
      }
    },
    () => setMessage({ tone: 'error', text: 'Some fields need a look: see the messages in red.' }),
  );

  return (
    <View style={{ gap: space.md }} testID="coupon-form">
      <CouponFields control={control} testIDPrefix="coupon" withHints />
      {message ? (
        <Notice tone={message.tone} testID={message.tone === 'ok' ? 'coupon-saved' : 'coupon-error'}>
          {message.text}
        </Notice>
      ) : null}
      <Button
        label="Record the test"
        busyLabel="Recording"
        busy={formState.isSubmitting}
        onPress={() => void submit()}
        testID="coupon-submit"
      />
    </View>
  );
}

/**
 * A coupon test's own fields, the same when it is recorded and when it is corrected. testIDs are
 * `${testIDPrefix}-material` etc.; `withHints` adds the examples a first entry wants.
 */
export function CouponFields({
  control,
  testIDPrefix,
  withHints,
}: {
  control: Control<CouponInput>;
  testIDPrefix: string;
  withHints?: boolean;
}) {
  const hint = (text: string) => (withHints ? text : undefined);
  return (
    <>
      <FormTextField
        control={control}
        name="material"
        label="Material"
        hint={hint('e.g. 6061-T6')}
        testID={`${testIDPrefix}-material`}
        autoCapitalize="characters"
        mono
      />
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.md }}>
        <View style={{ flexGrow: 1, flexBasis: 150 }}>
          <FormNumberField
            control={control}
            name="gaugeIn"
            label="Gauge"
            quantity="length"
            testID={`${testIDPrefix}-gauge`}
          />
        </View>
        <View style={{ flexGrow: 1, flexBasis: 150 }}>
          <FormNumberField
            control={control}
            name="couponWidthIn"
            label="Coupon width"
            quantity="length"
            testID={`${testIDPrefix}-width`}
          />
        </View>
      </View>
      <FormTextField
        control={control}
        name="rivetSpec"
        label="Rivet"
        hint={hint('The callout, e.g. MS20470AD4 or PULLED-4')}
        testID={`${testIDPrefix}-rivet`}
        autoCapitalize="characters"
        mono
      />
      <FormNumberField
        control={control}
        name="loadLb"
        label="Applied load"
        quantity="force"
        testID={`${testIDPrefix}-load`}
      />
      <FormChoiceField
        control={control}
        name="outcome"
        label="What the coupon did"
        testID={`${testIDPrefix}-outcome`}
        options={couponOutcomes.map((o) => ({ value: o, label: couponOutcomeLabels[o] }))}
      />
      <FormTextField
        control={control}
        name="testedOn"
        label="Tested on"
        hint={hint('Year-month-day, e.g. 2026-10-14')}
        testID={`${testIDPrefix}-date`}
        mono
      />
      <FormTextField
        control={control}
        name="note"
        label="Note (optional)"
        hint={hint('What you saw: dimple, oval hole, head pulled in…')}
        testID={`${testIDPrefix}-note`}
        multiline
      />
    </>
  );
}
