import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useCallback, useState } from 'react';
import { useForm, type Control, type Resolver } from 'react-hook-form';
import type { z } from 'zod';
import { buildInput } from '@/db/contracts';
import { addressInputProps, FormChoiceField, FormTextField } from '@/components/forms/form-fields';
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
type Parsed = z.output<typeof buildInput>;

/** An empty name box means "no name given" (the invitation then greets the address), not a name too short. */
const blankToUndefined = (s: string | undefined) => (s?.trim() ? s : undefined);

/**
 * The builder's or the inspector's address and, for an invitation, their name: the same two boxes for
 * each, named by the role.
 */
function PersonFields({
  control,
  role,
  title,
  hint,
}: {
  control: Control<Values, unknown, Parsed>;
  role: 'builder' | 'inspector';
  title: string;
  hint: string;
}) {
  return (
    <>
      <FormTextField
        control={control}
        name={`${role}Email`}
        label={`${title}’s e-mail`}
        hint={hint}
        testID={`build-${role}-email`}
        {...addressInputProps}
      />
      <FormTextField
        control={control}
        name={`${role}Name`}
        label={`${title}’s name (if they have no account yet)`}
        testID={`build-${role}-name`}
        autoComplete="off"
        maxLength={120}
      />
    </>
  );
}

/** Shipping a kit: one traveler per published part, each with its own serial, QR token and short code. */
export function ShipBuildScreen() {
  const router = useRouter();
  const kits = useKitsQuery();
  const create = useBuildCreateMutation();
  const [formError, setFormError] = useState<string | null>(null);
  const resolver = useCallback<Resolver<Values, unknown, Parsed>>(
    (values, context, options) =>
      zodResolver(buildInput, plainParse)(
        {
          ...values,
          builderName: blankToUndefined(values.builderName),
          inspectorName: blankToUndefined(values.inspectorName),
        },
        context,
        options,
      ),
    [],
  );
  const { control, handleSubmit, setError, formState } = useForm<Values, unknown, Parsed>({
    resolver,
    mode: 'onChange',
    defaultValues: {
      kitModelId: '',
      kitSerial: '',
      builderEmail: '',
      builderName: '',
      inspectorEmail: '',
      inspectorName: '',
    },
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
      {kits.isPending ? (
        <LoadingState what="Loading kit models" />
      ) : kits.isError ? (
        <ErrorState error={kits.error} onRetry={() => void kits.refetch()} />
      ) : !kits.data.length ? (
        <EmptyState title="No kit models yet." body="Make a kit model and publish its parts in the catalogue first." />
      ) : (
        <>
          <Section title="The kit">
            <FormChoiceField
              control={control}
              name="kitModelId"
              label="Kit model"
              testID="build-kit"
              options={kits.data.map((k) => ({ value: k.id, key: k.code, label: `${k.code} · ${k.name}` }))}
            />
            <FormTextField
              control={control}
              name="kitSerial"
              label="Kit serial"
              testID="build-serial"
              autoCapitalize="characters"
              mono
            />
          </Section>
          <Section title="People">
            <Txt variant="small" tone="soft" testID="build-invite-note">
              An address without a Pitchcard account gets an invitation by mail: the person sets a password from its
              link and joins the build. Until then the build shows them as not joined yet. Give their names for the
              invitation.
            </Txt>
            <PersonFields
              control={control}
              role="builder"
              title="Builder"
              hint="The build’s owner: they build it and keep its log."
            />
            <PersonFields
              control={control}
              role="inspector"
              title="Inspector"
              hint="The final inspector: findings on this build go to them."
            />
            <Txt variant="small" tone="faint">
              Helpers and a technical adviser are added on the build’s page once it is shipped.
            </Txt>
          </Section>
          {formError ? (
            <Notice tone="error" testID="build-error">
              {formError}
            </Notice>
          ) : null}
          <Button
            label="Ship it"
            busyLabel="Making travelers"
            busy={formState.isSubmitting}
            onPress={() => void submit()}
            testID="submit-build"
          />
          <Txt variant="small" tone="faint">
            Only parts with a published revision get a traveler.
          </Txt>
        </>
      )}
    </Screen>
  );
}
