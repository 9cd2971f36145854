import { useState } from 'react';
import { View } from 'react-native';
import { withdrawSignOffInput } from '@/db/contracts';
import { space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Field, TextBox } from '@/components/ui/field';
import { Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { ApiError, errorMessage } from '@/lib/api-client';
import { useTravelerWithdrawSignOffMutation } from '@/hooks/queries/travelers';

/** The contract's own words for a reason it refuses (too short, too long, a control character). */
function reasonProblem(reason: string): string | null {
  const r = withdrawSignOffInput.safeParse({ reason });
  return r.success ? null : (r.error.issues[0]?.message ?? 'check the reason');
}

/**
 * Taking a sign-off back: shown only when the server lists `withdraw-sign-off` for the reader. A first
 * press opens the reason and says what will happen; a second, on the named button, sends it.
 */
export function WithdrawSignOff({ travelerId, onDone }: { travelerId: string; onDone?: () => void }) {
  const withdraw = useTravelerWithdrawSignOffMutation(travelerId);
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [touched, setTouched] = useState(false);
  const [serverError, setServerError] = useState<string | null>(null);
  const problem = reasonProblem(reason);

  if (!open) {
    return (
      <Button
        label="Withdraw sign-off…"
        variant="secondary"
        onPress={() => {
          setOpen(true);
          withdraw.reset();
        }}
        testID="withdraw-sign-off"
      />
    );
  }

  const send = () => {
    setTouched(true);
    setServerError(null);
    if (problem) return;
    withdraw.mutate(
      { reason: reason.trim() },
      {
        onSuccess: () => {
          setOpen(false);
          setReason('');
          setTouched(false);
          onDone?.();
        },
        onError: (e) => {
          const field = e instanceof ApiError ? e.fields?.reason : undefined;
          setServerError(field ?? errorMessage(e));
        },
      },
    );
  };

  return (
    <View style={{ gap: space.sm }} testID="withdraw-sign-off-form">
      <Txt bold>Withdraw the sign-off of this part?</Txt>
      <Txt>
        The part opens again for work and a new sign-off. The sign-off stays in the build log; the withdrawal and your
        reason are added after it, and the builders are told by e-mail.
      </Txt>
      <Field
        label="Reason"
        hint="Say what you found, in a few words: the builders read it."
        error={touched && problem ? problem : undefined}
        testID="withdraw-reason-field"
      >
        <TextBox
          value={reason}
          onChangeText={(v) => {
            setReason(v);
            setTouched(true);
          }}
          multiline
          maxLength={1000}
          invalid={touched && !!problem}
          accessibilityLabel="Reason for withdrawing the sign-off"
          testID="withdraw-reason"
        />
      </Field>
      {serverError ? (
        <Notice tone="error" testID="withdraw-error">
          {serverError}
        </Notice>
      ) : null}
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button
          label="Withdraw the sign-off"
          busyLabel="Withdrawing"
          variant="danger"
          busy={withdraw.isPending}
          onPress={send}
          testID="withdraw-confirm"
        />
        <Button
          label="Keep it signed off"
          variant="quiet"
          onPress={() => {
            setOpen(false);
            setServerError(null);
          }}
          testID="withdraw-cancel"
        />
      </View>
    </View>
  );
}
