import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useMemo, useState } from 'react';
import { Controller, useForm, useWatch } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { z } from 'zod';
import {
  INVITATION_TTL_HOURS,
  inviteInput,
  roleLabels,
  roles,
  type OrganizationSummary,
  type SessionUser,
} from '@/db/contracts';
import { colors, radius, space, touch } from '@/constants/theme';
import { FormError } from '@/components/forms/form-error';
import { addressInputProps, FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Button } from '@/components/ui/button';
import { Choice } from '@/components/ui/choice';
import { Field } from '@/components/ui/field';
import { KeyValue, Section } from '@/components/ui/sheet';
import { Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { Toggle } from '@/components/ui/toggle';
import { usePeopleInviteMutation } from '@/hooks/queries/people';
import { organizationsFor } from './people-view';

type Values = z.input<typeof inviteInput>;

const NONE = 'none';

/**
 * Invites a person by mail: the admin chooses the role and the organisation; a supplier's lead engineer
 * invites engineers into their own organisation, so for them both are fixed and only said.
 */
export function InviteForm({
  me,
  organizations,
}: {
  me: SessionUser;
  organizations: readonly OrganizationSummary[] | undefined;
}) {
  const invite = usePeopleInviteMutation();
  const admin = me.role === 'admin';
  const [sent, setSent] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, setValue, reset, getValues, formState } = useForm<
    Values,
    unknown,
    z.output<typeof inviteInput>
  >({
    resolver: zodResolver(inviteInput, plainParse),
    mode: 'onChange',
    defaultValues: admin
      ? { email: '', name: '', role: undefined, organizationId: null, lead: false }
      : { email: '', name: '', role: 'supplier', organizationId: me.organizationId, lead: false },
  });
  // useWatch rather than watch(): a hook the React Compiler can see, re-rendering on these two fields only.
  const role = useWatch({ control, name: 'role' });
  const orgId = useWatch({ control, name: 'organizationId' });
  const orgChoices = useMemo(() => organizationsFor(role, organizations ?? []), [role, organizations]);

  // An organisation that cannot hold the newly chosen role is let go, and "lead" is for engineers only.
  useEffect(() => {
    if (!admin) return;
    if (orgId && !orgChoices.some((o) => o.id === orgId)) setValue('organizationId', null);
    if (role !== 'supplier' && getValues('lead')) setValue('lead', false);
  }, [admin, role, orgId, orgChoices, setValue, getValues]);

  const submit = handleSubmit(async (v) => {
    setFormError(null);
    setSent(null);
    try {
      await invite.mutateAsync(v);
      setSent(
        `Invitation sent to ${v.email}. The link in it works once, for ${Math.round(INVITATION_TTL_HOURS / 24)} days.`,
      );
      // The next invitation is often for a colleague of the same place: role and organisation stay.
      reset({ ...getValues(), email: '', name: '', lead: false });
    } catch (e) {
      setFormError(
        applyServerErrors(setError, e, (path) =>
          ['email', 'name', 'role', 'organizationId', 'lead'].includes(path) ? path : null,
        ),
      );
    }
  });

  return (
    <Section title={admin ? 'Invite someone' : 'Invite an engineer'} testID="invite-person">
      <FormTextField
        control={control}
        name="email"
        label="E-mail"
        testID="invite-person-email"
        {...addressInputProps}
      />
      <FormTextField
        control={control}
        name="name"
        label="Name"
        hint="Used in the invitation; they can correct it when they join."
        testID="invite-person-name"
        maxLength={120}
      />
      {admin ? (
        <>
          <Controller
            control={control}
            name="role"
            render={({ field, fieldState }) => (
              <Field label="Role" error={fieldState.error?.message} testID="invite-role-field">
                <Choice
                  options={roles.map((r) => ({ value: r, label: roleLabels[r] }))}
                  value={field.value}
                  onChange={(v) => {
                    field.onChange(v);
                    field.onBlur();
                  }}
                  testIDPrefix="invite-role"
                  invalid={!!fieldState.error}
                />
              </Field>
            )}
          />
          <Controller
            control={control}
            name="organizationId"
            render={({ field, fieldState }) => (
              <Field
                label="Organisation"
                hint={
                  role === 'admin'
                    ? 'An administrator belongs to no organisation.'
                    : role
                      ? 'Only organisations that hold this role are offered.'
                      : 'Choose the role first.'
                }
                error={fieldState.error?.message}
                testID="invite-org-field"
              >
                <Choice
                  columns={orgChoices.length > 3}
                  options={[
                    {
                      value: NONE,
                      label: 'No organisation',
                      hint:
                        role === 'builder' || role === 'inspector' ? 'An independent builder or inspector' : undefined,
                    },
                    ...orgChoices.map((o) => ({ value: o.id, key: o.id, label: o.name })),
                  ]}
                  value={field.value ?? NONE}
                  onChange={(v) => {
                    field.onChange(v === NONE ? null : v);
                    field.onBlur();
                  }}
                  testIDPrefix="invite-org"
                  invalid={!!fieldState.error}
                />
              </Field>
            )}
          />
        </>
      ) : (
        <>
          <KeyValue label="Role">{roleLabels.supplier}</KeyValue>
          <KeyValue label="Organisation">{me.organizationName ?? '–'}</KeyValue>
        </>
      )}
      {role === 'supplier' ? (
        <Controller
          control={control}
          name="lead"
          render={({ field, fieldState }) => (
            <Field label="Lead engineer" error={fieldState.error?.message}>
              <Toggle
                kind="checkbox"
                checked={!!field.value}
                testID="invite-lead"
                accessibilityLabel="Lead engineer: may invite and manage the engineers of their organisation"
                onPress={() => field.onChange(!field.value)}
                style={({ pressed }) => [styles.check, pressed && { opacity: 0.75 }]}
              >
                <View style={[styles.box, field.value && styles.boxOn]}>
                  {field.value ? (
                    <Txt tone="inverse" bold>
                      ✓
                    </Txt>
                  ) : null}
                </View>
                <Txt style={{ flex: 1 }}>May invite and manage the engineers of their organisation</Txt>
              </Toggle>
            </Field>
          )}
        />
      ) : null}
      <FormError message={formError} testID="invite-person-error" />
      {sent ? (
        <Notice tone="ok" testID="invite-sent">
          {sent}
        </Notice>
      ) : null}
      <Button
        label="Send the invitation"
        busyLabel="Sending"
        busy={formState.isSubmitting}
        onPress={() => void submit()}
        testID="invite-send"
      />
    </Section>
  );
}

const styles = StyleSheet.create({
  check: { flexDirection: 'row', alignItems: 'center', gap: space.md, minHeight: touch },
  box: {
    width: 28,
    height: 28,
    borderWidth: 2,
    borderColor: colors.ink,
    borderRadius: radius.sm,
    alignItems: 'center',
    justifyContent: 'center',
    backgroundColor: colors.paperRaised,
  },
  boxOn: { backgroundColor: colors.ink },
});
