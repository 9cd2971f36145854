import { View } from 'react-native';
import { space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/states';

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
