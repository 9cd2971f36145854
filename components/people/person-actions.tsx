import { useState } from 'react';
import { View } from 'react-native';
import { roleLabels, type PersonAction, type PersonSummary, type Role } from '@/db/contracts';
import { space } from '@/constants/theme';
import { FormError } from '@/components/forms/form-error';
import { Button } from '@/components/ui/button';
import { Choice } from '@/components/ui/choice';
import { Field } from '@/components/ui/field';
import { Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { errorMessage } from '@/lib/api-client';
import { usePeopleUpdateMutation } from '@/hooks/queries/people';

/** The two changes that end or restore someone's access are said out loud and confirmed first. */
const confirmed: Partial<Record<PersonAction, true>> = { deactivate: true, reactivate: true };

const actionLabels: Record<PersonAction, string> = {
  'change-role': 'Change role',
  deactivate: 'Deactivate…',
  reactivate: 'Reactivate…',
  'make-lead': 'Make lead engineer',
};

function question(action: PersonAction, p: PersonSummary): { text: string; yes: string } {
  if (action === 'deactivate') {
    return {
      text: `Deactivate ${p.name}? They are signed out on every device at once and cannot sign in until reactivated. What they did stays on record: sign-offs, findings and build logs.`,
      yes: `Deactivate ${p.name}`,
    };
  }
  return {
    text: `Reactivate ${p.name}? They can sign in again with the password they had.`,
    yes: `Reactivate ${p.name}`,
  };
}

/**
 * The changes the reader may make to one person: exactly `p.allowed`, one request per press. `roleOptions`
 * are the roles this person's organisation can hold.
 */
export function PersonActions({
  p,
  roleOptions,
  onDone,
}: {
  p: PersonSummary;
  roleOptions: readonly Role[];
  onDone: (said: string) => void;
}) {
  const update = usePeopleUpdateMutation();
  const [role, setRole] = useState<Role>(p.role);
  const [asking, setAsking] = useState<PersonAction | null>(null);
  const [error, setError] = useState<string | null>(null);
  const allowed = p.allowed;

  if (!allowed.length) {
    return (
      <Txt variant="small" tone="soft" testID="person-nothing">
        Nothing here is yours to change.
      </Txt>
    );
  }

  const send = async (action: PersonAction) => {
    setError(null);
    const change =
      action === 'change-role'
        ? { role }
        : action === 'make-lead'
          ? { lead: true }
          : { active: action === 'reactivate' };
    try {
      const next = await update.mutateAsync({ id: p.id, change });
      setAsking(null);
      onDone(
        action === 'change-role'
          ? `${next.name} is now ${roleLabels[next.role].toLowerCase()}.`
          : action === 'make-lead'
            ? `${next.name} is now a lead engineer.`
            : action === 'deactivate'
              ? `${next.name} is deactivated: every sign-in of theirs has ended.`
              : `${next.name} can sign in again.`,
      );
    } catch (e) {
      setError(errorMessage(e));
    }
  };

  const busy = (a: PersonAction) =>
    update.isPending &&
    update.variables?.id === p.id &&
    (a === 'change-role'
      ? 'role' in update.variables.change
      : a === 'make-lead'
        ? 'lead' in update.variables.change
        : 'active' in update.variables.change);

  return (
    <View style={{ gap: space.md }} testID="person-actions">
      {allowed.includes('change-role') ? (
        <Field label="Role" hint={role === p.role ? 'Choose another role, then change it.' : undefined}>
          <Choice
            options={roleOptions.map((r) => ({
              value: r,
              label: r === p.role ? `${roleLabels[r]} (now)` : roleLabels[r],
            }))}
            value={role}
            onChange={setRole}
            testIDPrefix="person-role"
          />
        </Field>
      ) : null}
      {asking ? (
        <View style={{ gap: space.sm }} testID="person-ask">
          <Notice tone="caution">{question(asking, p).text}</Notice>
          <Button
            label={question(asking, p).yes}
            variant={asking === 'deactivate' ? 'danger' : 'primary'}
            busy={update.isPending}
            busyLabel="Saving"
            onPress={() => void send(asking)}
            testID="person-confirm"
          />
          <Button
            label="Leave it as it is"
            variant="quiet"
            disabled={update.isPending}
            onPress={() => setAsking(null)}
            testID="person-confirm-cancel"
          />
        </View>
      ) : (
        <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
          {allowed.map((a) => (
            <Button
              key={a}
              label={
                a === 'change-role' && role !== p.role
                  ? `Change role to ${roleLabels[role].toLowerCase()}`
                  : actionLabels[a]
              }
              variant={a === 'deactivate' ? 'secondary' : a === 'change-role' ? 'primary' : 'secondary'}
              disabled={(a === 'change-role' && role === p.role) || (update.isPending && !busy(a))}
              busy={busy(a)}
              busyLabel="Saving"
              onPress={() => (confirmed[a] ? setAsking(a) : void send(a))}
              testID={`person-action-${a}`}
            />
          ))}
        </View>
      )}
      {allowed.includes('make-lead') && !asking ? (
        <Txt variant="small" tone="faint">
          A lead engineer invites and manages the engineers of their own organisation.
        </Txt>
      ) : null}
      <FormError message={error} testID="person-error" />
    </View>
  );
}
