import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useForm, type Control } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import { aircraftCategories, kitModelInput, type KitModelInput } from '@/db/contracts';
import { space } from '@/constants/theme';
import { FormError } from '@/components/forms/form-error';
import { FormChoiceField, FormNumberField, FormTextField } from '@/components/forms/form-fields';
import type { NumberFieldSpec } from '@/components/forms/number-rows';
import { plainParse } from '@/components/forms/plain-errors';
import { useFormSubmit } from '@/components/forms/use-form-submit';
import { Button } from '@/components/ui/button';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/sheet';
import { useKitCreateMutation } from '@/hooks/queries/kits';

type Values = z.input<typeof kitModelInput>;

const categoryWords: Record<(typeof aircraftCategories)[number], string> = {
  normal: 'Normal',
  utility: 'Utility',
  acrobatic: 'Acrobatic',
};

/** The kit's short code, typed in capitals. */
export function KitCodeField({ control }: { control: Control<KitModelInput> }) {
  return (
    <FormTextField control={control} name="code" label="Code" testID="kit-code" autoCapitalize="characters" mono />
  );
}

/** The kit's airfoil by its designation. */
export function KitAirfoilField({ control, hint }: { control: Control<KitModelInput>; hint?: string }) {
  return (
    <FormTextField
      control={control}
      name="airfoil"
      label="Airfoil"
      hint={hint}
      testID="kit-airfoil"
      autoCapitalize="characters"
      mono
    />
  );
}

/** The kit's category, the same choice on the new kit and on the kit's own page. */
export function KitCategoryField({ control }: { control: Control<KitModelInput> }) {
  return (
    <FormChoiceField
      control={control}
      name="category"
      label="Category"
      testID="kit-category"
      options={aircraftCategories.map((c) => ({ value: c, label: categoryWords[c] }))}
    />
  );
}

const designData: NumberFieldSpec<KitModelInput>[] = [
  { name: 'weightLb', label: 'Gross weight', quantity: 'mass', testID: 'kit-weight' },
  { name: 'wingAreaSqFt', label: 'Wing area', quantity: 'area', testID: 'kit-wing-area' },
  { name: 'meanChordIn', label: 'Mean chord', quantity: 'length', testID: 'kit-mean-chord' },
  { name: 'stallSpeedKeas', label: 'Stall speed', unit: 'KEAS', testID: 'kit-stall' },
  { name: 'cruiseSpeedKeas', label: 'Cruise speed (optional)', unit: 'KEAS', testID: 'kit-cruise' },
];

/** The numbers a kit's load studies start from, one under the other. */
export function KitDesignDataFields({ control }: { control: Control<KitModelInput> }) {
  return (
    <>
      {designData.map((f) => (
        <FormNumberField key={f.testID} control={control} {...f} />
      ))}
    </>
  );
}

/** A new kit model with the design data its load studies start from. */
export function KitFormScreen() {
  const router = useRouter();
  const create = useKitCreateMutation();
  const { control, handleSubmit, setError, formState } = useForm<Values, unknown, z.output<typeof kitModelInput>>({
    resolver: zodResolver(kitModelInput, plainParse),
    mode: 'onChange',
    defaultValues: { code: '', name: '', category: 'normal', airfoil: 'NACA ' },
  });
  const { submit, formError } = useFormSubmit({
    handleSubmit,
    setError,
    send: async (v) => {
      await create.mutateAsync(v);
      router.dismissTo('/catalogue');
    },
  });

  return (
    <Screen title="New kit model" backTo="/catalogue" testID="kit-form-screen">
      <Section title="The kit">
        <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap' }}>
          <View style={{ width: 160 }}>
            <KitCodeField control={control} />
          </View>
          <View style={{ flex: 1, minWidth: 200 }}>
            <FormTextField control={control} name="name" label="Name" testID="kit-name" />
          </View>
        </View>
        <KitCategoryField control={control} />
        <KitAirfoilField control={control} hint='A NACA designation, e.g. "NACA 2412"' />
      </Section>
      <Section title="Design data">
        <KitDesignDataFields control={control} />
      </Section>
      <FormError message={formError} testID="kit-error" />
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
