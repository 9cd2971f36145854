import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import { dispositionInput, dispositionLabels, dispositions, findingStepInput, type Disposition, type FindingDetail } from '@/db/contracts';
import { space } from '@/constants/theme';
import { FormChoiceField, FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import {
  useFindingDispositionMutation, useFindingReviewMutation, useFindingReworkDoneMutation, useFindingVerifyMutation, type ReworkCheckResult,
} from '@/hooks/queries/findings';
import { alternativeWords } from './rework-check-panel';

export const dispositionHelp: Record<Disposition, string> = {
  use_as_is: 'The hole is acceptable as it is. Closes the finding and accepts the hole.',
  rework: 'Redo the hole as instructed in the note. The hole is held until you verify the rework.',
  repair: 'Fix it by an approved repair, described in the note. Held until verified.',
  scrap: 'The part is not to be used. Replace it.',
};

/**
 * The inspector's decision on a flagged hole. `reworkCheck` is the latest answer of the rework check on
 * this screen: choosing rework against a failed check warns, and does not stop them (they decide).
 */
export function DispositionForm({ f, reworkCheck }: { f: FindingDetail; reworkCheck?: ReworkCheckResult | null }) {
  const review = useFindingReviewMutation(f.id);
  const dispose = useFindingDispositionMutation(f.id);
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, watch, formState } = useForm<z.input<typeof dispositionInput>, unknown, z.output<typeof dispositionInput>>({
    resolver: zodResolver(dispositionInput, plainParse),
    mode: 'onChange',
    defaultValues: { disposition: undefined, note: '' },
  });
  const chosen = watch('disposition');

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      // A finding is taken into review before it is dispositioned, so the log shows both steps.
      if (f.status === 'flagged') await review.mutateAsync();
      await dispose.mutateAsync(values);
    } catch (e) {
      setFormError(applyServerErrors(setError, e, (p) => (p === 'disposition' || p === 'note' ? p : null)));
    }
  });

  return (
    <View style={{ gap: space.md }} testID="disposition-form">
      <FormChoiceField
        control={control}
        name="disposition"
        label="Disposition"
        testID="disposition"
        options={dispositions.map((d) => ({ value: d, label: dispositionLabels[d] }))}
      />
      {chosen ? <Txt variant="small" tone="soft">{dispositionHelp[chosen]}</Txt> : null}
      {chosen === 'rework' && reworkCheck && !reworkCheck.pass ? (
        <Notice tone="caution" testID="rework-check-failed">
          <Txt bold>The rework check failed for {reworkCheck.inputs.proposedSpec}.</Txt>
          {reworkCheck.reasons.map((r, i) => <Txt key={i} variant="small">– {r}</Txt>)}
          {reworkCheck.alternative ? <Txt variant="small">The check points to: {alternativeWords[reworkCheck.alternative].title.toLowerCase()}.</Txt> : null}
          <Txt variant="small">You can still record rework if you judge it right: the decision is yours. Say why in the note.</Txt>
        </Notice>
      ) : null}
      {chosen === 'rework' && !reworkCheck ? (
        <Txt variant="small" tone="faint" testID="rework-check-none">The rework check has not been run on this screen: see “Rework check”.</Txt>
      ) : null}
      <FormTextField
        control={control}
        name="note"
        label="Note to the builder"
        hint="Why, and what to do: e.g. drill to the next size and fit the next rivet."
        testID="disposition-note"
        multiline
        maxLength={2000}
      />
      {formError ? <Notice tone="error" testID="disposition-error">{formError}</Notice> : null}
      <Button
        label="Record the disposition"
        busyLabel="Recording"
        busy={formState.isSubmitting}
        onPress={() => void submit()}
        testID="submit-disposition"
      />
    </View>
  );
}

export function StartReviewButton({ f }: { f: FindingDetail }) {
  const review = useFindingReviewMutation(f.id);
  return (
    <View style={{ gap: space.sm }}>
      <Button label="Take into review" variant="secondary" busy={review.isPending} onPress={() => review.mutate()} testID="start-review" />
      {review.error ? <Notice tone="error">{(review.error as Error).message}</Notice> : null}
    </View>
  );
}

/** A note and a button: the builder's "rework done" and the inspector's "verified". */
function StepForm({ which, f }: { which: 'rework-done' | 'verify'; f: FindingDetail }) {
  const rework = useFindingReworkDoneMutation(f.id);
  const verify = useFindingVerifyMutation(f.id);
  const m = which === 'rework-done' ? rework : verify;
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, formState } = useForm<z.input<typeof findingStepInput>, unknown, z.output<typeof findingStepInput>>({
    resolver: zodResolver(findingStepInput, plainParse),
    mode: 'onChange',
    defaultValues: { note: '' },
  });
  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await m.mutateAsync(values);
    } catch (e) {
      setFormError(applyServerErrors(setError, e, (p) => (p === 'note' ? p : null)));
    }
  });
  const prefix = which === 'rework-done' ? 'rework' : 'verify';
  return (
    <View style={{ gap: space.md }} testID={`${prefix}-form`}>
      <FormTextField
        control={control}
        name="note"
        label={which === 'rework-done' ? 'What you did' : 'What you checked'}
        testID={`${prefix}-note`}
        multiline
        maxLength={2000}
      />
      {formError ? <Notice tone="error" testID={`${prefix}-error`}>{formError}</Notice> : null}
      <Button
        label={which === 'rework-done' ? 'Rework is done' : 'Rework verified, close'}
        busy={formState.isSubmitting}
        onPress={() => void submit()}
        testID={which === 'rework-done' ? 'submit-rework-done' : 'submit-verify'}
      />
    </View>
  );
}

export function ReworkDoneForm({ f }: { f: FindingDetail }) {
  return <StepForm which="rework-done" f={f} />;
}

export function VerifyForm({ f }: { f: FindingDetail }) {
  return <StepForm which="verify" f={f} />;
}
