import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import { aircraftCategories, kitModelInput } from '@/db/contracts';
import { space } from '@/constants/theme';
import { FormChoiceField, FormNumberField, FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Button } from '@/components/ui/button';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/sheet';
import { Notice } from '@/components/ui/states';
import { useKitCreateMutation } from '@/hooks/queries/kits';

type Values = z.input<typeof kitModelInput>;

const categoryWords: Record<(typeof aircraftCategories)[number], string> = {
  normal: 'Normal',
  utility: 'Utility',
  acrobatic: 'Acrobatic',
};

/** A new kit model with the design data its load studies start from. */
export function KitFormScreen() {
  const router = useRouter();
  const create = useKitCreateMutation();
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, formState } = useForm<Values, unknown, z.output<typeof kitModelInput>>({
    resolver: zodResolver(kitModelInput, plainParse),
    mode: 'onChange',
    defaultValues: { code: '', name: '', category: 'normal', airfoil: 'NACA ' },
  });
  const submit = handleSubmit(
    async (v) => {
      setFormError(null);
      try {
        await create.mutateAsync(v);
        router.dismissTo('/catalogue');
      } catch (e) {
        setFormError(applyServerErrors(setError, e));
      }
    },
    () => setFormError('Some fields need a look: see the messages in red.'),
  );

  return (
    <Screen title="New kit model" backTo="/catalogue" testID="kit-form-screen">
      <Section title="The kit">
        <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap' }}>
          <View style={{ width: 160 }}>
            <FormTextField
              control={control}
              name="code"
              label="Code"
              testID="kit-code"
              autoCapitalize="characters"
              mono
            />
          </View>
          <View style={{ flex: 1, minWidth: 200 }}>
            <FormTextField control={control} name="name" label="Name" testID="kit-name" />
          </View>
        </View>
        <FormChoiceField
          control={control}
          name="category"
          label="Category"
          testID="kit-category"
          options={aircraftCategories.map((c) => ({ value: c, label: categoryWords[c] }))}
        />
        <FormTextField
          control={control}
          name="airfoil"
          label="Airfoil"
          hint='A NACA designation, e.g. "NACA 2412"'
          testID="kit-airfoil"
          autoCapitalize="characters"
          mono
        />
      </Section>
      <Section title="Design data">
        <FormNumberField control={control} name="weightLb" label="Gross weight" quantity="mass" testID="kit-weight" />
        <FormNumberField
          control={control}
          name="wingAreaSqFt"
          label="Wing area"
          quantity="area"
          testID="kit-wing-area"
        />
        <FormNumberField
          control={control}
          name="meanChordIn"
          label="Mean chord"
          quantity="length"
          testID="kit-mean-chord"
        />
        <FormNumberField control={control} name="stallSpeedKeas" label="Stall speed" unit="KEAS" testID="kit-stall" />
        <FormNumberField
          control={control}
          name="cruiseSpeedKeas"
          label="Cruise speed (optional)"
          unit="KEAS"
          testID="kit-cruise"
        />
      </Section>
      {formError ? (
        <Notice tone="error" testID="kit-error">
          {formError}
        </Notice>
      ) : null}
      <Button
        label="Save kit model"
        busyLabel="Saving"
        busy={formState.isSubmitting}
        onPress={() => void submit()}
        testID="submit-kit"
      />
    </Screen>
  );
}
