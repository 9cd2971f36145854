import type { Control } from 'react-hook-form';
import { FormChoiceField } from '@/components/forms/form-fields';
import { NumberRows, type NumberFieldSpec } from '@/components/forms/number-rows';
import { Txt } from '@/components/ui/text';
import type { StudyFormValues } from './study-form-values';

type Spec = NumberFieldSpec<StudyFormValues>;

const massAndSpeeds = (prefix: string): Spec[][] => [
  [
    { name: 'inputs.kit.weightLb', label: 'Gross weight', quantity: 'mass', testID: `${prefix}-weight` },
    { name: 'inputs.kit.wingAreaSqFt', label: 'Wing area', quantity: 'area', testID: `${prefix}-wing-area` },
    { name: 'inputs.kit.meanChordIn', label: 'Mean chord', quantity: 'length', testID: `${prefix}-mean-chord` },
  ],
  [
    { name: 'inputs.kit.stallSpeedKeas', label: 'Stall speed', unit: 'KEAS', testID: `${prefix}-stall` },
    {
      name: 'inputs.kit.cruiseSpeedKeas',
      label: 'Cruise speed',
      unit: 'KEAS',
      hint: 'Blank: the rule minimum',
      testID: `${prefix}-cruise`,
    },
    {
      name: 'inputs.kit.diveSpeedKeas',
      label: 'Dive speed',
      unit: 'KEAS',
      hint: 'Blank: the rule minimum',
      testID: `${prefix}-dive`,
    },
  ],
];

const gustCases = (prefix: string): Spec[][] => [
  [
    {
      name: 'inputs.kit.altitudeFt',
      label: 'Altitude of the gust cases',
      unit: 'ft',
      hint: 'Blank: sea level',
      testID: `${prefix}-altitude`,
    },
    {
      name: 'inputs.kit.liftSlopePerRad',
      label: 'Wing lift slope',
      unit: 'per rad',
      hint: 'Blank: estimated from the aspect ratio',
      testID: `${prefix}-lift-slope`,
    },
  ],
];

/**
 * The aircraft's numbers (`inputs.kit`), the same block in the rib and the wing study: the wing form
 * passes its own control, whose `inputs.kit` has this very shape. testIDs are `${prefix}-weight` etc.
 */
export function KitFields({ control, prefix }: { control: Control<StudyFormValues>; prefix: string }) {
  return (
    <>
      <NumberRows control={control} rows={massAndSpeeds(prefix)} />
      <FormChoiceField
        control={control}
        name="inputs.kit.category"
        label="Category"
        testID={`${prefix}-category`}
        options={[
          { value: 'normal', label: 'Normal' },
          { value: 'utility', label: 'Utility' },
          { value: 'acrobatic', label: 'Acrobatic' },
        ]}
      />
      <NumberRows control={control} rows={gustCases(prefix)} />
      <Txt variant="small" tone="faint">
        Speeds in knots equivalent airspeed and altitude in feet, as flight data are given in every unit system.
      </Txt>
    </>
  );
}
