import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import {
  couponCorrectionInput,
  couponOutcomeLabels,
  couponOutcomes,
  type CouponCorrectionInput,
  type CouponTest,
} from '@/db/contracts';
import { space } from '@/constants/theme';
import { FormChoiceField, FormNumberField, FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { useCouponCorrectMutation } from '@/hooks/queries/coupons';
import { useUnits } from '@/hooks/use-units';

type Out = z.output<typeof couponCorrectionInput>;

/**
 * Corrects a recorded test. Nothing is overwritten: the server keeps the entry as it was, marked as
 * corrected by the new one with the reason given here, and the allowables read the new one only.
 */
export function CouponCorrectionForm({ test, onDone }: { test: CouponTest; onDone: (message: string) => void }) {
  const units = useUnits();
  const correct = useCouponCorrectMutation();
  const [error, setError] = useState<string | null>(null);
  const {
    control,
    handleSubmit,
    setError: setFieldError,
    formState,
  } = useForm<CouponCorrectionInput, unknown, Out>({
    resolver: zodResolver(couponCorrectionInput, plainParse),
    mode: 'onChange',
    defaultValues: {
      material: test.material,
      gaugeIn: test.gaugeIn,
      couponWidthIn: test.couponWidthIn,
      rivetSpec: test.rivetSpec,
      loadLb: test.loadLb,
      outcome: test.outcome,
      note: test.note,
      testedOn: test.testedOn,
      reason: '',
    },
  });
  const submit = handleSubmit(
    async (v) => {
      setError(null);
      try {
        const made = await correct.mutateAsync({ id: test.id, input: v });
        onDone(
          `Corrected: the entry of ${units.force(test.loadLb)} is kept as recorded and marked corrected; studies now use ${units.force(made.loadLb)}, ${couponOutcomeLabels[made.outcome].toLowerCase()}.`,
        );
      } catch (e) {
        setError(applyServerErrors(setFieldError, e));
      }
    },
    () => setError('Some fields need a look: see the messages in red.'),
  );

  return (
    <View style={{ gap: space.md }} testID="coupon-correction">
      <Txt variant="small" tone="soft">
        The entry as recorded stays in the record, marked as corrected, with your name, the time and the reason. Studies
        computed from now on use the corrected values; published revisions keep the numbers they were approved with.
      </Txt>
      <FormTextField
        control={control}
        name="reason"
        label="Why it is corrected"
        hint="e.g. load cell read with the tare left on"
        testID="coupon-correction-reason"
        multiline
      />
      <FormTextField
        control={control}
        name="material"
        label="Material"
        testID="coupon-correction-material"
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
            testID="coupon-correction-gauge"
          />
        </View>
        <View style={{ flexGrow: 1, flexBasis: 150 }}>
          <FormNumberField
            control={control}
            name="couponWidthIn"
            label="Coupon width"
            quantity="length"
            testID="coupon-correction-width"
          />
        </View>
      </View>
      <FormTextField
        control={control}
        name="rivetSpec"
        label="Rivet"
        testID="coupon-correction-rivet"
        autoCapitalize="characters"
        mono
      />
      <FormNumberField
        control={control}
        name="loadLb"
        label="Applied load"
        quantity="force"
        testID="coupon-correction-load"
      />
      <FormChoiceField
        control={control}
        name="outcome"
        label="What the coupon did"
        testID="coupon-correction-outcome"
        options={couponOutcomes.map((o) => ({ value: o, label: couponOutcomeLabels[o] }))}
      />
      <FormTextField control={control} name="testedOn" label="Tested on" testID="coupon-correction-date" mono />
      <FormTextField control={control} name="note" label="Note (optional)" testID="coupon-correction-note" multiline />
      {error ? (
        <Notice tone="error" testID="coupon-correction-error">
          {error}
        </Notice>
      ) : null}
      <Button
        label="Record the correction"
        busyLabel="Recording"
        busy={formState.isSubmitting}
        onPress={() => void submit()}
        testID="coupon-correction-submit"
      />
      <Button
        label="Leave it as it is"
        variant="quiet"
        disabled={formState.isSubmitting}
        onPress={() => onDone('')}
        testID="coupon-correction-cancel"
      />
    </View>
  );
}
