import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm, type Control } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import { kitChangeInput, kitFieldLabels, type KitModelDetail, type KitModelInput } from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { FormError } from '@/components/forms/form-error';
import { FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { useFormSubmit } from '@/components/forms/use-form-submit';
import { DeleteAndLeave } from '@/components/designs/confirm-step';
import { Button } from '@/components/ui/button';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/sheet';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { KitNoticesSection } from '@/components/notices/notices-section';
import { KitAirfoilField, KitCategoryField, KitCodeField, KitDesignDataFields } from './kit-form-screen';
import { kitDesignValues } from './kit-values';
import { useKitDeleteMutation, useKitQuery, useKitUpdateMutation } from '@/hooks/queries/kits';

type Values = z.input<typeof kitChangeInput>;
type Out = z.output<typeof kitChangeInput>;

const show = (v: unknown) => (v === null || v === undefined || v === '' ? '–' : String(v));

/** A kit model's own page: its data to correct, what relies on it, its history, and delete while nothing does. */
export function KitScreen({ kitId }: { kitId: string }) {
  const q = useKitQuery(kitId);
  if (q.isPending)
    return (
      <Screen title="Kit model" backTo="/catalogue">
        <LoadingState what="Loading the kit model" />
      </Screen>
    );
  if (q.isError)
    return (
      <Screen title="Kit model" backTo="/catalogue">
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      </Screen>
    );
  return <KitBody kit={q.data} />;
}

function KitBody({ kit }: { kit: KitModelDetail }) {
  const update = useKitUpdateMutation(kit.id);
  const remove = useKitDeleteMutation(kit.id);
  const [saved, setSaved] = useState(false);
  const relied = kit.reliance.studies + kit.reliance.publishedParts + kit.reliance.builds > 0;
  const { control, handleSubmit, setError, formState, reset } = useForm<Values, unknown, Out>({
    resolver: zodResolver(kitChangeInput, plainParse),
    mode: 'onChange',
    defaultValues: {
      code: kit.code,
      name: kit.name,
      ...kitDesignValues(kit),
      airfoil: kit.airfoil,
      reason: '',
    },
  });
  const { submit, formError } = useFormSubmit({
    handleSubmit,
    setError,
    send: async (v) => {
      const next = await update.mutateAsync(v);
      reset({ ...v, ...kitDesignValues(next), reason: '' });
      setSaved(true);
    },
  });
  // The kit's fields are the new kit's, with a reason beside them.
  const kitControl = control as unknown as Control<KitModelInput>;

  return (
    <Screen title={`${kit.code} · ${kit.name}`} subtitle="Kit model" backTo="/catalogue" testID="kit-screen">
      <Section title="What relies on it">
        <Txt testID="kit-reliance">
          <Mono bold>{kit.reliance.publishedParts}</Mono> published part{kit.reliance.publishedParts === 1 ? '' : 's'} ·{' '}
          <Mono bold>{kit.reliance.builds}</Mono> shipped build{kit.reliance.builds === 1 ? '' : 's'} ·{' '}
          <Mono bold>{kit.reliance.studies}</Mono> load stud{kit.reliance.studies === 1 ? 'y' : 'ies'}
        </Txt>
        {relied ? (
          <Txt variant="small" tone="soft">
            A change of its numbers is kept in its history with the old values and your reason; studies and published
            parts keep the numbers they were made from.
          </Txt>
        ) : null}
      </Section>
      {/* The kit's own supplier (who may change it) is the one who issues its notices. */}
      <KitNoticesSection kitId={kit.id} canIssue={kit.allowedActions.includes('edit')} />
      {kit.allowedActions.includes('edit') ? (
        <Section title="The kit">
          <KitCodeField control={kitControl} />
          <FormTextField control={control} name="name" label="Name" testID="kit-name" />
          <KitCategoryField control={kitControl} />
          <KitAirfoilField control={kitControl} />
          <KitDesignDataFields control={kitControl} />
          <FormTextField
            control={control}
            name="reason"
            label={relied ? 'Why it changes (needed for its numbers)' : 'Why it changes (optional)'}
            testID="kit-reason"
            multiline
          />
          <FormError message={formError} testID="kit-error" />
          {saved && !formState.isDirty ? (
            <Notice tone="ok" testID="kit-saved">
              Saved; the change is in the history below.
            </Notice>
          ) : null}
          <Button
            label="Save the changes"
            busyLabel="Saving"
            busy={formState.isSubmitting}
            onPress={() => void submit()}
            testID="kit-save"
          />
        </Section>
      ) : null}
      <Section title="History" testID="kit-history">
        {kit.changes.length ? (
          kit.changes.map((c) => (
            <View
              key={c.id}
              style={{
                paddingVertical: space.sm,
                borderBottomWidth: hairline,
                borderColor: colors.rule,
                gap: space.xs,
              }}
              testID={`kit-change-${c.id}`}
            >
              <Txt variant="small" tone="soft">
                {c.createdAt.slice(0, 10)} · {c.changedByName}
                {c.reason ? ` · “${c.reason}”` : ''}
              </Txt>
              {Object.keys(c.after).map((f) => (
                <Txt key={f} variant="small">
                  {kitFieldLabels[f as keyof typeof kitFieldLabels] ?? f}:{' '}
                  <Mono variant="small">{show(c.before[f])}</Mono> →{' '}
                  <Mono variant="small" bold>
                    {show(c.after[f])}
                  </Mono>
                </Txt>
              ))}
            </View>
          ))
        ) : (
          <Txt tone="soft">No changes since it was made.</Txt>
        )}
      </Section>
      <Section title="Delete">
        {kit.allowedActions.includes('delete') ? (
          <DeleteAndLeave
            askLabel="Delete this kit model…"
            askVariant="secondary"
            message={`Delete kit model ${kit.code}? Its draft part designs go with it. This cannot be undone.`}
            confirmLabel={`Delete ${kit.code}`}
            remove={remove}
            backTo="/catalogue"
            testID="kit-delete"
          />
        ) : (
          <Txt tone="soft" testID="kit-delete-refusal">
            {kit.deleteRefusal}
          </Txt>
        )}
      </Section>
    </Screen>
  );
}
