import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { buildInput } from '@/db/contracts';
import { FormChoiceField, FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Button } from '@/components/ui/button';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/sheet';
import { EmptyState, ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { useBuildCreateMutation } from '@/hooks/queries/builds';
import { useKitsQuery } from '@/hooks/queries/kits';

type Values = z.input<typeof buildInput>;

/** Shipping a kit: one traveler per published part, each with its own serial, QR token and short code. */
export function ShipBuildScreen() {
  const router = useRouter();
  const kits = useKitsQuery();
  const create = useBuildCreateMutation();
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, formState } = useForm<Values, unknown, z.output<typeof buildInput>>({
    resolver: zodResolver(buildInput, plainParse),
    mode: 'onChange',
    defaultValues: { kitModelId: '', kitSerial: '', builderEmail: '', inspectorEmail: '' },
  });
  const submit = handleSubmit(async (v) => {
    setFormError(null);
    try {
      const b = await create.mutateAsync(v);
      router.replace(`/builds/${b.id}`);
    } catch (e) {
      setFormError(applyServerErrors(setError, e));
    }
  });

  return (
    <Screen title="Ship a build" backTo="/builds" testID="ship-build-screen">
      {kits.isPending ? <LoadingState what="Loading kit models" />
        : kits.isError ? <ErrorState error={kits.error} onRetry={() => void kits.refetch()} />
          : !kits.data.length ? <EmptyState title="No kit models yet." body="Make a kit model and publish its parts in the catalogue first." />
            : (
              <>
                <Section title="The kit">
                  <FormChoiceField control={control} name="kitModelId" label="Kit model" testID="build-kit" options={kits.data.map((k) => ({ value: k.id, key: k.code, label: `${k.code} · ${k.name}` }))} />
                  <FormTextField control={control} name="kitSerial" label="Kit serial" testID="build-serial" autoCapitalize="characters" mono />
                </Section>
                <Section title="People">
                  <FormTextField control={control} name="builderEmail" label="Builder’s e-mail" hint="They must already have a builder sign-in." testID="build-builder-email" autoCapitalize="none" keyboardType="email-address" inputMode="email" />
                  <FormTextField control={control} name="inspectorEmail" label="Inspector’s e-mail" hint="Findings on this build go to them." testID="build-inspector-email" autoCapitalize="none" keyboardType="email-address" inputMode="email" />
                </Section>
                {formError ? <Notice tone="error" testID="build-error">{formError}</Notice> : null}
                <Button label="Ship it" busyLabel="Making travelers" busy={formState.isSubmitting} onPress={() => void submit()} testID="submit-build" />
                <Txt variant="small" tone="faint">Only parts with a published revision get a traveler.</Txt>
              </>
            )}
    </Screen>
  );
}
