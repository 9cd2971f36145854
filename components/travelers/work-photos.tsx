import { useState } from 'react';
import { View } from 'react-native';
import { space } from '@/constants/theme';
import { maxPhotos, photoRefusal, pickPhotos, PhotoPicker } from '@/components/findings/photo-picker';
import { Button } from '@/components/ui/button';
import { Choice } from '@/components/ui/choice';
import { Field, TextBox } from '@/components/ui/field';
import { Section } from '@/components/ui/sheet';
import { Txt } from '@/components/ui/text';
import { errorMessage } from '@/lib/api-client';
import type { DraftPhoto } from '@/lib/photo-form-data';
import { useWorkPhotosMutation, type TravelerStep } from '@/hooks/queries/travelers';

/**
 * Photos of the work itself (a step's, or the part's), for the log that goes to the inspection: picked
 * or taken, a few words, sent together. They show in the build log with their entry.
 */
export function WorkPhotos({ travelerId, steps }: { travelerId: string; steps: TravelerStep[] }) {
  const send = useWorkPhotosMutation(travelerId);
  const [photos, setPhotos] = useState<DraftPhoto[]>([]);
  const [of, setOf] = useState<string>('part');
  const [note, setNote] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [sent, setSent] = useState<string | null>(null);

  const add = async (from: 'library' | 'camera') => {
    setError(null);
    setSent(null);
    const r = await pickPhotos(from, maxPhotos - photos.length);
    setError(r.error);
    if (r.photos.length) setPhotos((p) => [...p, ...r.photos].slice(0, maxPhotos));
  };

  return (
    <Section title="Photos of the work">
      <View style={{ gap: space.sm }} testID="work-photos-section">
        <PhotoPicker
          photos={photos}
          onAdd={(from) => void add(from)}
          onRemove={(i) => setPhotos((p) => p.filter((_, j) => j !== i))}
          error={error}
          idPrefix="work-"
          empty="No photo picked. A photo of a step's work (a clecoed fit, a row of shop heads) goes into the build log."
        />
        {photos.length ? (
          <>
            <Choice
              label="The photos show"
              testIDPrefix="work-photos-of"
              options={[
                { value: 'part', label: 'The part' },
                ...[...steps]
                  .sort((a, b) => a.seq - b.seq)
                  .map((s) => ({ value: s.id, label: `Step ${s.seq}`, key: `step-${s.seq}` })),
              ]}
              value={of}
              onChange={setOf}
            />
            <Field label="A few words (optional)">
              <TextBox value={note} onChangeText={setNote} maxLength={500} testID="work-photos-note" />
            </Field>
            <Button
              label={`Add ${photos.length === 1 ? 'the photo' : `the ${photos.length} photos`} to the log`}
              onPress={() =>
                send.mutate(
                  { input: { ...(of === 'part' ? {} : { stepId: of }), note: note.trim() }, photos },
                  {
                    onSuccess: () => {
                      setSent(
                        `${photos.length === 1 ? 'The photo is' : `${photos.length} photos are`} in the build log.`,
                      );
                      setPhotos([]);
                      setNote('');
                    },
                    onError: (e) => setError(photoRefusal(e) ?? `Not sent: ${errorMessage(e)}`),
                  },
                )
              }
              disabled={send.isPending}
              testID="work-photos-send"
            />
          </>
        ) : null}
        {sent ? (
          <Txt tone="soft" testID="work-photos-sent">
            {sent}
          </Txt>
        ) : null}
      </View>
    </Section>
  );
}
