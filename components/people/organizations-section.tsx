import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { z } from 'zod';
import { organizationInput, organizationKindLabels, organizationKinds } from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { FormError } from '@/components/forms/form-error';
import { FormChoiceField, FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { useFormSubmit } from '@/components/forms/use-form-submit';
import { Button } from '@/components/ui/button';
import { LoadMore, nextPage } from '@/components/ui/load-more';
import { Section } from '@/components/ui/sheet';
import { EmptyState, ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { pagedItems } from '@/hooks/queries/paged';
import { usePeopleOrganizationCreateMutation, usePeopleOrganizationsQuery } from '@/hooks/queries/people';
import { organizationWords } from './people-view';

type Values = z.input<typeof organizationInput>;

/** The admin's organisations: kit suppliers, build shops and inspection bodies, and a form for a new one. */
export function OrganizationsSection() {
  const q = usePeopleOrganizationsQuery();
  const rows = pagedItems(q.data);
  const [adding, setAdding] = useState(false);
  return (
    <Section
      title="Organisations"
      testID="organizations"
      aside={
        !adding ? (
          <Button label="New organisation" variant="quiet" compact onPress={() => setAdding(true)} testID="org-new" />
        ) : undefined
      }
    >
      {adding ? <NewOrganization onClose={() => setAdding(false)} /> : null}
      {q.isPending ? (
        <LoadingState what="Loading organisations" />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      ) : !rows.length ? (
        <EmptyState
          title="No organisations yet."
          body="Add the kit suppliers, build shops and inspection bodies whose people use Pitchcard."
        />
      ) : (
        <View>
          {/* The server's order (by name, then id): pages append without rows moving. */}
          {rows.map((o) => (
            <View key={o.id} style={styles.row} testID={`org-${o.id}`}>
              <Txt bold>{o.name}</Txt>
              <Txt variant="small" tone="soft">
                {organizationWords(o)}
              </Txt>
            </View>
          ))}
          <LoadMore {...nextPage(q)} shown={rows.length} what="organisations" testID="organizations-more" />
        </View>
      )}
    </Section>
  );
}

function NewOrganization({ onClose }: { onClose: () => void }) {
  const create = usePeopleOrganizationCreateMutation();
  const [made, setMade] = useState<string | null>(null);
  const { control, handleSubmit, setError, reset, formState } = useForm<
    Values,
    unknown,
    z.output<typeof organizationInput>
  >({
    resolver: zodResolver(organizationInput, plainParse),
    mode: 'onChange',
    defaultValues: { name: '', kind: undefined },
  });
  const { submit, formError } = useFormSubmit({
    handleSubmit,
    setError,
    send: async (v) => {
      const o = await create.mutateAsync(v);
      setMade(`${o.name} is added. Invite its people below.`);
      reset({ name: '', kind: undefined });
    },
    toField: (path) => (path === 'name' || path === 'kind' ? path : null),
    // The form's own checks show at the fields alone.
    invalidMessage: null,
  });
  return (
    <View style={styles.form} testID="org-form">
      <FormTextField control={control} name="name" label="Name" testID="org-name" maxLength={120} />
      <FormChoiceField
        control={control}
        name="kind"
        label="Kind"
        testID="org-kind"
        options={organizationKinds.map((k) => ({ value: k, label: organizationKindLabels[k] }))}
      />
      <FormError message={formError} testID="org-error" />
      {made ? (
        <Notice tone="ok" testID="org-created">
          {made}
        </Notice>
      ) : null}
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button
          label="Add the organisation"
          busyLabel="Adding"
          busy={formState.isSubmitting}
          onPress={() => void submit()}
          testID="org-create"
        />
        <Button label="Close" variant="quiet" onPress={onClose} testID="org-close" />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { gap: 2, paddingVertical: space.md, borderBottomWidth: hairline, borderColor: colors.rule },
  form: { gap: space.md, paddingBottom: space.lg, borderBottomWidth: hairline, borderColor: colors.ruleStrong },
});
