import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, type Control } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import {
  couponCorrectionInput,
  couponOutcomeLabels,
  type CouponCorrectionInput,
  type CouponInput,
  type CouponTest,
} from '@/db/contracts';
import { space } from '@/constants/theme';
import { FormError } from '@/components/forms/form-error';
import { FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { useFormSubmit } from '@/components/forms/use-form-submit';
import { Button } from '@/components/ui/button';
import { Txt } from '@/components/ui/text';
import { useCouponCorrectMutation } from '@/hooks/queries/coupons';
import { useUnits } from '@/hooks/use-units';
import { CouponFields } from './coupon-form';

type Out = z.output<typeof couponCorrectionInput>;

/**
 * Corrects a recorded test. Nothing is overwritten: the server keeps the entry as it was, marked as
 * corrected by the new one with the reason given here, and the allowables read the new one only.
 */
export function CouponCorrectionForm({ test, onDone }: { test: CouponTest; onDone: (message: string) => void }) {
  const units = useUnits();
  const correct = useCouponCorrectMutation();
  const { control, handleSubmit, setError, formState } = useForm<CouponCorrectionInput, unknown, Out>({
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
  const { submit, formError } = useFormSubmit({
    handleSubmit,
    setError,
    send: async (v) => {
      const made = await correct.mutateAsync({ id: test.id, input: v });
      onDone(
        `Corrected: the entry of ${units.force(test.loadLb)} is kept as recorded and marked corrected; studies now use ${units.force(made.loadLb)}, ${couponOutcomeLabels[made.outcome].toLowerCase()}.`,
      );
    },
  });

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
      {/* The test's own fields are a new record's; the reason is beside them. */}
      <CouponFields control={control as unknown as Control<CouponInput>} testIDPrefix="coupon-correction" />
      <FormError message={formError} testID="coupon-correction-error" />
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
