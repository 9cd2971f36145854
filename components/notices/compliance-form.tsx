import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm, useWatch, type Control, type Resolver } from 'react-hook-form';
import { View } from 'react-native';
import { z } from 'zod';
import { complianceInput, MAX_COMPLIANCE_PHOTOS, type ComplianceChange, type NoticeBuildAnswer } from '@/db/contracts';
import { space } from '@/constants/theme';
import { FormError } from '@/components/forms/form-error';
import { FormChoiceField, FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { useFormSubmit } from '@/components/forms/use-form-submit';
import { photoRefusal, pickPhotos, PhotoPicker } from '@/components/findings/photo-picker';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { ApiError, errorMessage } from '@/lib/api-client';
import { PhotoReadError, type DraftPhoto } from '@/lib/photo-form-data';
import { useNoticeAcknowledgeMutation, useNoticeComplianceMutation } from '@/hooks/queries/notices';

/** One form holds both outcomes' words; only the chosen outcome's words are checked and sent. */
type Values = { outcome: 'done' | 'not_applicable' | undefined; note: string; reason: string };

const chosenOnly = z.preprocess((f: Values) => {
  if (f.outcome === 'done') return { outcome: 'done', note: f.note };
  if (f.outcome === 'not_applicable') return { outcome: 'not_applicable', reason: f.reason };
  return { outcome: f.outcome };
}, complianceInput);
const resolver = zodResolver(chosenOnly, plainParse) as unknown as Resolver<Values, unknown, ComplianceChange>;

const fields = ['outcome', 'note', 'reason'];

/**
 * A build's answer to a notice, as its people act on it: exactly the actions of `answer.allowed` — read
 * it (acknowledge), and record what was done with photos, or why it does not apply.
 */
export function ComplianceActions({ noticeId, answer }: { noticeId: string; answer: NoticeBuildAnswer }) {
  const ack = useNoticeAcknowledgeMutation(noticeId);
  const canAck = answer.allowed.includes('acknowledge');
  const canRecord = answer.allowed.includes('record');
  if (!canAck && !canRecord) return null;
  return (
    <View style={{ gap: space.md }} testID="compliance-actions">
      {canAck ? (
        <View style={{ gap: space.sm }}>
          <Button
            label="I have read this notice"
            variant={canRecord ? 'secondary' : 'primary'}
            busy={ack.isPending}
            busyLabel="Saving"
            onPress={() => ack.mutate(answer.buildId)}
            testID="notice-acknowledge"
          />
          {ack.error ? (
            <Notice tone="error" testID="notice-acknowledge-error">
              {errorMessage(ack.error)}
            </Notice>
          ) : null}
        </View>
      ) : null}
      {canRecord ? <ComplianceForm noticeId={noticeId} answer={answer} /> : null}
    </View>
  );
}

export function ComplianceForm({ noticeId, answer }: { noticeId: string; answer: NoticeBuildAnswer }) {
  const record = useNoticeComplianceMutation(noticeId);
  const [photos, setPhotos] = useState<DraftPhoto[]>([]);
  const [photoError, setPhotoError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const again = answer.status === 'done' || answer.status === 'not_applicable';
  const { control, handleSubmit, setError, reset } = useForm<Values, unknown, ComplianceChange>({
    resolver,
    mode: 'onSubmit',
    reValidateMode: 'onChange',
    defaultValues: { outcome: undefined, note: '', reason: '' },
  });
  // The fields hold the form's values; only the resolver's answer has the contract's shape.
  const fieldControl = control as unknown as Control<Values>;
  const outcome = useWatch({ control: fieldControl, name: 'outcome' });
  const { submit, formError } = useFormSubmit({
    handleSubmit,
    setError,
    toField: (path) => {
      if (path === 'photos' || path.startsWith('photos.')) return null;
      return fields.includes(path) ? path : null;
    },
    refusal: (e, left) => {
      if (e instanceof PhotoReadError) {
        setPhotoError(e.message);
        return 'Not sent: a photo could not be read (see the photos). What you wrote is still here.';
      }
      if (e instanceof ApiError && e.isNetwork)
        return 'No connection, so nothing was sent. What you wrote is still here: send it again when you have signal.';
      const refused = photoRefusal(e);
      if (refused) {
        setPhotoError(refused);
        return 'Not sent: a photo was refused (see the photos). What you wrote is still here.';
      }
      return left;
    },
    send: async (input) => {
      setSaved(false);
      setPhotoError(null);
      await record.mutateAsync({
        buildId: answer.buildId,
        input,
        // Photos show the work done; a "does not apply" carries its reason only.
        photos: input.outcome === 'done' ? photos : [],
      });
      reset();
      setPhotos([]);
      setSaved(true);
    },
  });

  const add = async (from: 'library' | 'camera') => {
    setPhotoError(null);
    const room = MAX_COMPLIANCE_PHOTOS - photos.length;
    if (room <= 0) {
      setPhotoError(`At most ${MAX_COMPLIANCE_PHOTOS} photos with one answer.`);
      return;
    }
    const r = await pickPhotos(from, room);
    setPhotoError(r.error);
    if (r.photos.length) setPhotos((p) => [...p, ...r.photos].slice(0, MAX_COMPLIANCE_PHOTOS));
  };

  return (
    <View style={{ gap: space.md }} testID="compliance-form">
      <Txt bold>{again ? 'Record it again (the log keeps both)' : 'Record what was done'}</Txt>
      <FormChoiceField
        control={fieldControl}
        name="outcome"
        label="Outcome"
        testID="compliance-outcome"
        options={[
          { value: 'done', label: 'Done on this build' },
          { value: 'not_applicable', label: 'Does not apply to this build' },
        ]}
      />
      {outcome === 'done' ? (
        <>
          <FormTextField
            control={fieldControl}
            name="note"
            label="What was done"
            hint="e.g. doubler fitted per the notice, rivets MS20470AD4, inspected"
            testID="compliance-note"
            multiline
            maxLength={2000}
          />
          <PhotoPicker
            photos={photos}
            onAdd={(from) => void add(from)}
            onRemove={(i) => setPhotos((p) => p.filter((_, j) => j !== i))}
            error={photoError}
            idPrefix="notice-"
            max={MAX_COMPLIANCE_PHOTOS}
            empty={`No photo yet. A photo of the finished work goes into the build log (at most ${MAX_COMPLIANCE_PHOTOS}).`}
          />
        </>
      ) : outcome === 'not_applicable' ? (
        <FormTextField
          control={fieldControl}
          name="reason"
          label="Why it does not apply"
          hint="e.g. this part was already made to revision B"
          testID="compliance-reason"
          multiline
          maxLength={2000}
        />
      ) : null}
      <FormError message={formError} testID="compliance-error" />
      {saved ? (
        <Notice tone="ok" testID="compliance-saved" focusOnShow>
          Recorded; it is in the build log.
        </Notice>
      ) : null}
      <Button
        label="Record"
        busyLabel="Sending"
        busy={record.isPending}
        onPress={() => void submit()}
        testID="compliance-submit"
      />
    </View>
  );
}
