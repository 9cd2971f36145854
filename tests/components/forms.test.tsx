import { zodResolver } from '@hookform/resolvers/zod';
import { act, useEffect } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import type { z } from 'zod';
import { kitModelInput } from '@/db/contracts';
import { ShortCodeEntry } from '@/components/bench/short-code-entry';
import { FormNumberField, FormTextField } from '@/components/forms/form-fields';
import { plainIssue, plainParse } from '@/components/forms/plain-errors';
import { applyServerErrors } from '@/components/forms/server-errors';
import { ApiError } from '@/lib/api-client';
import { UnitsProvider } from '@/hooks/use-units';
import { renderWeb } from './render-web';

type KitValues = z.input<typeof kitModelInput>;

let setServerError: ((e: unknown) => string) | null = null;
let lastValues: Partial<KitValues> = {};
let resetForm: ((v: Partial<KitValues>) => void) | null = null;

function KitBits() {
  const { control, setError, reset } = useForm<KitValues, unknown, z.output<typeof kitModelInput>>({
    resolver: zodResolver(kitModelInput, plainParse),
    mode: 'onChange',
    defaultValues: { code: '', name: '', airfoil: 'NACA ', category: 'normal' },
  });
  const values = useWatch({ control });
  // Handed to the test once rendered (an effect: a render itself changes nothing outside the component).
  useEffect(() => {
    setServerError = (e) => applyServerErrors(setError, e);
    resetForm = (v) => reset(v);
    lastValues = values;
  });
  return (
    <>
      <FormTextField control={control} name="airfoil" label="Airfoil" testID="kit-airfoil" />
      <FormNumberField control={control} name="weightLb" label="Gross weight" quantity="mass" testID="kit-weight" />
      <FormTextField control={control} name="code" label="Code" testID="kit-code" />
    </>
  );
}

describe('forms say what is wrong in plain words', () => {
  it('asks for the code from the label while the short code is too short', async () => {
    const r = renderWeb(<ShortCodeEntry onOpen={async () => {}} />);
    await r.type('short-code', 'K7');
    expect(r.byTestId('short-code-field-error').textContent).toBe('enter the code from the label');
    await r.type('short-code', 'K7P-4QX');
    expect(r.queryByTestId('short-code-field-error')).toBeNull();
  });

  it('says the weight must be a number when letters are typed, as they are typed', async () => {
    const r = renderWeb(<KitBits />);
    await r.type('kit-weight', 'heavy');
    expect(r.byTestId('kit-weight-field-error').textContent).toBe('weight must be a number');
  });

  it('explains the airfoil format in the words of the contract', async () => {
    const r = renderWeb(<KitBits />);
    await r.type('kit-airfoil', 'Clark Y');
    expect(r.byTestId('kit-airfoil-field-error').textContent).toContain('NACA designation');
  });

  it('stores a weight typed in kilograms as pounds', async () => {
    const r = renderWeb(
      <UnitsProvider initial="metric">
        <KitBits />
      </UnitsProvider>,
    );
    expect(r.byTestId('kit-weight-field').textContent).toContain('kg');
    await r.type('kit-weight', '600');
    expect(lastValues.weightLb).toBeCloseTo(600 / 0.45359237, 6);
  });

  it('keeps a half-typed number as typed, and shows a value put in from outside (a reset, a kit taken)', async () => {
    const r = renderWeb(<KitBits />);
    await r.type('kit-weight', '1.');
    expect((r.byTestId('kit-weight') as HTMLInputElement).value).toBe('1.');
    expect(lastValues.weightLb).toBe(1);
    await act(async () => resetForm!({ code: '', name: '', airfoil: 'NACA ', category: 'normal', weightLb: 1320 }));
    expect((r.byTestId('kit-weight') as HTMLInputElement).value).toBe('1320');
  });

  it('puts the server’s field messages under the fields they name', async () => {
    const r = renderWeb(<KitBits />);
    let summary = '';
    await act(async () => {
      summary = setServerError!(
        new ApiError(400, 'validation', 'Some fields are not right.', { code: 'that kit code is taken' }),
      );
    });
    await r.settle();
    expect(r.byTestId('kit-code-field-error').textContent).toBe('that kit code is taken');
    expect(summary).toContain('See the marked fields');
  });
});

describe('plain words for zod’s own messages', () => {
  it('turns a missing number into "enter a number"', () => {
    expect(plainIssue({ code: 'invalid_type', expected: 'number', input: undefined })).toBe('enter a number');
  });
  it('asks to fill in an empty required text', () => {
    expect(plainIssue({ code: 'too_small', origin: 'string', minimum: 1 })).toBe('fill this in');
  });
});
