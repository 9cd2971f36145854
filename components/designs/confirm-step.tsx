import { useRouter, type Href } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/states';
import { errorMessage } from '@/lib/api-client';

/**
 * The second step of a change that cannot be taken back (publish, discard, delete): what will happen,
 * said in full, with the button that does it and one that leaves things as they are.
 */
export function ConfirmStep({
  message,
  confirmLabel,
  danger,
  busy,
  error,
  onConfirm,
  onCancel,
  testID,
}: {
  message: string;
  confirmLabel: string;
  danger?: boolean;
  busy?: boolean;
  error?: string | null;
  onConfirm: () => void;
  onCancel: () => void;
  testID: string;
}) {
  return (
    <View style={{ gap: space.sm }} testID={testID} accessibilityRole="alert">
      <Notice tone="caution" testID={`${testID}-message`}>
        {message}
      </Notice>
      {error ? (
        <Notice tone="error" testID={`${testID}-error`}>
          {error}
        </Notice>
      ) : null}
      <Button
        label={confirmLabel}
        variant={danger ? 'danger' : 'primary'}
        busy={busy}
        busyLabel="Saving"
        onPress={onConfirm}
        testID={`${testID}-confirm`}
      />
      <Button
        label="Leave it as it is"
        variant="quiet"
        disabled={busy}
        onPress={onCancel}
        testID={`${testID}-cancel`}
      />
    </View>
  );
}

/**
 * A record's delete, asked twice: a button, then the confirmation that says what goes with it. Once
 * the server has deleted it the screen closes back to `backTo`; a refusal shows in the confirmation.
 */
export function DeleteAndLeave({
  askLabel,
  askVariant,
  compact,
  message,
  confirmLabel,
  remove,
  backTo,
  testID,
}: {
  askLabel: string;
  askVariant: 'secondary' | 'quiet';
  compact?: boolean;
  message: string;
  confirmLabel: string;
  remove: { mutateAsync: () => Promise<unknown>; reset: () => void; isPending: boolean; error: unknown };
  backTo: Href;
  /** The button's; the confirmation's is `${testID}-ask`. */
  testID: string;
}) {
  const router = useRouter();
  const [asking, setAsking] = useState(false);
  const confirm = async () => {
    try {
      await remove.mutateAsync();
      router.dismissTo(backTo);
    } catch {
      // Shown in the confirmation, from the mutation's own state.
    }
  };
  if (!asking)
    return (
      <Button
        label={askLabel}
        variant={askVariant}
        compact={compact}
        onPress={() => {
          setAsking(true);
          remove.reset();
        }}
        testID={testID}
      />
    );
  return (
    <ConfirmStep
      testID={`${testID}-ask`}
      message={message}
      confirmLabel={confirmLabel}
      danger
      busy={remove.isPending}
      error={remove.error ? errorMessage(remove.error) : null}
      onConfirm={() => void confirm()}
      onCancel={() => setAsking(false)}
    />
  );
}
