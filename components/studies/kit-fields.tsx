import type { Control } from 'react-hook-form';
import { View } from 'react-native';
import { space } from '@/constants/theme';
import { FormChoiceField, FormNumberField } from '@/components/forms/form-fields';
import { Txt } from '@/components/ui/text';
import type { StudyFormValues } from './study-form-values';

/** Two or three fields side by side where there is room; one under the other on a phone. */
export function Row({ children }: { children: React.ReactNode }) {
  return <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.md }}>{children}</View>;
}
export function Cell({ children }: { children: React.ReactNode }) {
  return <View style={{ flexGrow: 1, flexBasis: 180, minWidth: 160 }}>{children}</View>;
}

/**
 * The aircraft's numbers (`inputs.kit`), the same block in the rib and the wing study: the wing form
 * passes its own control, whose `inputs.kit` has this very shape. testIDs are `${prefix}-weight` etc.
 */
export function KitFields({ control, prefix }: { control: Control<StudyFormValues>; prefix: string }) {
  return (
    <>
      <Row>
        <Cell>
          <FormNumberField
            control={control}
            name="inputs.kit.weightLb"
            label="Gross weight"
            quantity="mass"
            testID={`${prefix}-weight`}
          />
        </Cell>
        <Cell>
          <FormNumberField
            control={control}
            name="inputs.kit.wingAreaSqFt"
            label="Wing area"
            quantity="area"
            testID={`${prefix}-wing-area`}
          />
        </Cell>
        <Cell>
          <FormNumberField
            control={control}
            name="inputs.kit.meanChordIn"
            label="Mean chord"
            quantity="length"
            testID={`${prefix}-mean-chord`}
          />
        </Cell>
      </Row>
      <Row>
        <Cell>
          <FormNumberField
            control={control}
            name="inputs.kit.stallSpeedKeas"
            label="Stall speed"
            unit="KEAS"
            testID={`${prefix}-stall`}
          />
        </Cell>
        <Cell>
          <FormNumberField
            control={control}
            name="inputs.kit.cruiseSpeedKeas"
            label="Cruise speed"
            unit="KEAS"
            hint="Blank: the rule minimum"
            testID={`${prefix}-cruise`}
          />
        </Cell>
        <Cell>
          <FormNumberField
            control={control}
            name="inputs.kit.diveSpeedKeas"
            label="Dive speed"
            unit="KEAS"
            hint="Blank: the rule minimum"
            testID={`${prefix}-dive`}
          />
        </Cell>
      </Row>
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
      <Row>
        <Cell>
          <FormNumberField
            control={control}
            name="inputs.kit.altitudeFt"
            label="Altitude of the gust cases"
            unit="ft"
            hint="Blank: sea level"
            testID={`${prefix}-altitude`}
          />
        </Cell>
        <Cell>
          <FormNumberField
            control={control}
            name="inputs.kit.liftSlopePerRad"
            label="Wing lift slope"
            unit="per rad"
            hint="Blank: estimated from the aspect ratio"
            testID={`${prefix}-lift-slope`}
          />
        </Cell>
      </Row>
      <Txt variant="small" tone="faint">
        Speeds in knots equivalent airspeed and altitude in feet, as flight data are given in every unit system.
      </Txt>
    </>
  );
}
