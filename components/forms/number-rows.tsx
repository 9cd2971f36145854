import type { Control, FieldValues, Path } from 'react-hook-form';
import { View } from 'react-native';
import { space } from '@/constants/theme';
import type { Quantity } from '@/constants/units';
import { FormNumberField } from './form-fields';

/** Two or three fields side by side where there is room; one under the other on a phone. */
export function Row({ children }: { children: React.ReactNode }) {
  return <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.md }}>{children}</View>;
}
export function Cell({ children }: { children: React.ReactNode }) {
  return <View style={{ flexGrow: 1, flexBasis: 180, minWidth: 160 }}>{children}</View>;
}

/** One number field of a form: a measured quantity (shown in the person's units) or a plain unit. */
export type NumberFieldSpec<T extends FieldValues> = {
  name: Path<T>;
  label: string;
  testID: string;
  hint?: string;
} & ({ quantity: Quantity; unit?: never } | { unit: string; quantity?: never });

/**
 * A form's number fields as rows of cells, written as a list: the long forms (a study's kit and
 * settings, a wing, a revision) differ only in their fields, not in how a field is laid out.
 */
export function NumberRows<T extends FieldValues>({
  control,
  rows,
}: {
  control: Control<T>;
  rows: readonly (readonly NumberFieldSpec<T>[])[];
}) {
  return (
    <>
      {rows.map((row) => (
        <Row key={row[0]?.testID}>
          {row.map((f) => (
            <Cell key={f.testID}>
              <FormNumberField control={control} {...f} />
            </Cell>
          ))}
        </Row>
      ))}
    </>
  );
}
