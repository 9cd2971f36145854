import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { partDesignInput, partKindLabels, partKinds, revisionInput } from '@/db/contracts';
import { FormError } from '@/components/forms/form-error';
import { FormChoiceField, FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { useFormSubmit } from '@/components/forms/use-form-submit';
import { Button } from '@/components/ui/button';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/sheet';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { useDesignCreateMutation } from '@/hooks/queries/designs';
import { useKitsQuery } from '@/hooks/queries/kits';
import { emptyRevision, RevisionFields } from './revision-fields';

/** The body of POST /api/designs, resolved by the contracts' own schemas. */
export const newDesignSchema = z.object({ design: partDesignInput, revision: revisionInput });
type Values = z.input<typeof newDesignSchema>;

export function DesignCreateScreen({ kitModelId }: { kitModelId?: string }) {
  const kits = useKitsQuery();
  return (
    <Screen
      title="New part design"
      subtitle="Revision A starts as a draft"
      backTo="/catalogue"
      testID="design-create-screen"
    >
      {kits.isPending ? (
        <LoadingState what="Loading kit models" />
      ) : kits.isError ? (
        <ErrorState error={kits.error} onRetry={() => void kits.refetch()} />
      ) : !kits.data.length ? (
        <EmptyState title="Make a kit model first." body="Every part design belongs to a kit model." />
      ) : (
        <DesignForm
          kits={kits.data}
          kitModelId={kitModelId ?? (kits.data.length === 1 ? kits.data[0].id : undefined)}
        />
      )}
    </Screen>
  );
}

function DesignForm({ kits, kitModelId }: { kits: { id: string; code: string; name: string }[]; kitModelId?: string }) {
  const router = useRouter();
  const create = useDesignCreateMutation();
  const { control, handleSubmit, setError, formState } = useForm<Values, unknown, z.output<typeof newDesignSchema>>({
    resolver: zodResolver(newDesignSchema, plainParse),
    mode: 'onChange',
    defaultValues: {
      design: { kitModelId: kitModelId ?? '', partNumber: '', name: '', kind: 'rib' },
      revision: emptyRevision(),
    },
  });

  const { submit, formError } = useFormSubmit({
    handleSubmit,
    setError,
    send: async (values) => {
      const d = await create.mutateAsync(values);
      router.replace(`/catalogue/designs/${d.id}`);
    },
    toField: (p) => (p.startsWith('design.') || p.startsWith('revision.') ? p : null),
  });

  return (
    <>
      <Section title="The part">
        <FormChoiceField
          control={control}
          name="design.kitModelId"
          label="Kit model"
          testID="design-kit"
          options={kits.map((k) => ({ value: k.id, key: k.code, label: `${k.code} · ${k.name}` }))}
        />
        <FormTextField
          control={control}
          name="design.partNumber"
          label="Part number"
          testID="design-part-number"
          autoCapitalize="characters"
          mono
        />
        <FormTextField
          control={control}
          name="design.name"
          label="Name"
          hint="e.g. Wing rib, station 42"
          testID="design-name"
        />
        <FormChoiceField
          control={control}
          name="design.kind"
          label="Kind"
          testID="design-kind"
          options={partKinds.map((k) => ({ value: k, label: partKindLabels[k] }))}
        />
      </Section>
      <RevisionFields control={control} prefix="revision." />
      <FormError message={formError} testID="design-error" />
      <Button
        label="Save as draft revision A"
        busyLabel="Saving"
        busy={formState.isSubmitting}
        onPress={() => void submit()}
        testID="submit-design"
      />
      <Txt variant="small" tone="faint">
        Nothing reaches builders until a revision is published.
      </Txt>
    </>
  );
}
