import { useState } from 'react';
import { View } from 'react-native';
import { space } from '@/constants/theme';
import { DeleteAndLeave } from '@/components/designs/confirm-step';
import { Button } from '@/components/ui/button';
import { Field, TextBox } from '@/components/ui/field';
import { Section } from '@/components/ui/sheet';
import { Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { errorMessage } from '@/lib/api-client';
import { useBuildDeleteMutation, useBuildUpdateMutation, type BuildPage } from '@/hooks/queries/builds';

/**
 * The build as shipped, for the supplier who shipped it: the note at any time; the serial, and the
 * build itself, while no work is recorded on it. What is offered comes from the answer's list only.
 */
export function BuildRecordSection({ b }: { b: BuildPage }) {
  const allowed = b.allowedActions ?? [];
  const update = useBuildUpdateMutation(b.id);
  const remove = useBuildDeleteMutation(b.id);
  const [editing, setEditing] = useState(false);
  const [serial, setSerial] = useState(b.kitSerial);
  const [note, setNote] = useState(b.note ?? '');
  const [error, setError] = useState<string | null>(null);
  if (!allowed.length && !b.note) return null;

  const save = async () => {
    setError(null);
    try {
      await update.mutateAsync(allowed.includes('change-serial') ? { kitSerial: serial.trim(), note } : { note });
      setEditing(false);
    } catch (e) {
      setError(errorMessage(e));
    }
  };

  return (
    <Section title="As shipped" testID="build-record">
      {!editing ? <Txt testID="build-note">{b.note ? b.note : 'No shipping note.'}</Txt> : null}
      {editing ? (
        <View style={{ gap: space.md }}>
          {allowed.includes('change-serial') ? (
            <Field label="Kit serial" hint="Part serials follow it; reprint the labels afterwards.">
              <TextBox
                value={serial}
                onChangeText={setSerial}
                mono
                autoCapitalize="characters"
                testID="build-serial-edit"
              />
            </Field>
          ) : null}
          <Field label="Shipping note" hint="What went in the crate, what follows later.">
            <TextBox value={note} onChangeText={setNote} multiline testID="build-note-edit" />
          </Field>
          {error ? (
            <Notice tone="error" testID="build-edit-error">
              {error}
            </Notice>
          ) : null}
          <Button
            label="Save"
            busy={update.isPending}
            busyLabel="Saving"
            onPress={() => void save()}
            testID="build-edit-save"
          />
          <Button
            label="Leave it as it is"
            variant="quiet"
            disabled={update.isPending}
            onPress={() => {
              setEditing(false);
              setSerial(b.kitSerial);
              setNote(b.note ?? '');
            }}
            testID="build-edit-cancel"
          />
        </View>
      ) : allowed.includes('edit-note') ? (
        <Button
          label={allowed.includes('change-serial') ? 'Change serial or note…' : 'Change the note…'}
          variant="secondary"
          compact
          onPress={() => setEditing(true)}
          testID="build-edit"
        />
      ) : null}
      {allowed.length && b.fixedBecause ? (
        <Txt variant="small" tone="soft" testID="build-fixed">
          {b.fixedBecause}
        </Txt>
      ) : null}
      {allowed.includes('delete') ? (
        <DeleteAndLeave
          askLabel="Delete this build…"
          askVariant="quiet"
          compact
          message={`Delete build ${b.kitSerial}? Its ${b.travelerCount} parts, its people and their pending invitations go with it. Nothing has been recorded on it yet; this cannot be undone.`}
          confirmLabel={`Delete build ${b.kitSerial}`}
          remove={remove}
          backTo="/builds"
          testID="build-delete"
        />
      ) : null}
    </Section>
  );
}
