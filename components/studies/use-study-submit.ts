import { useState } from 'react';
import type { FieldValues, UseFormHandleSubmit, UseFormSetError } from 'react-hook-form';
import { applyServerErrors } from '@/components/forms/server-errors';
import { ApiError } from '@/lib/api-client';

/**
 * How a study form sends and hears back, the rib's and the wing's alike: the server's refusals go onto
 * the fields `fieldFor` places, and the top of the form says the rest (or that the fields are marked).
 */
export function useStudySubmit<V extends FieldValues, O>({
  handleSubmit,
  setError,
  onSubmit,
  fieldFor,
}: {
  handleSubmit: UseFormHandleSubmit<V, O>;
  setError: UseFormSetError<V>;
  onSubmit: (values: O) => Promise<void>;
  fieldFor: (path: string) => string | null;
}) {
  const [formError, setFormError] = useState<string | null>(null);
  const submit = handleSubmit(
    async (values) => {
      setFormError(null);
      try {
        await onSubmit(values);
      } catch (e) {
        const said = applyServerErrors(setError, e, fieldFor);
        // The server's summary names fields by their paths; say it in words and leave the rest to the fields.
        if (e instanceof ApiError && e.fields && Object.keys(e.fields).length) {
          const unplaced = Object.entries(e.fields)
            .filter(([p]) => !fieldFor(p))
            .map(([, m]) => m.trim().replace(/[.]$/, ''));
          setFormError(
            unplaced.length
              ? `Not computed: ${unplaced.join('; ')}.`
              : 'Not computed: some inputs were refused. See the marked fields.',
          );
        } else {
          setFormError(said);
        }
      }
    },
    () => setFormError('Some inputs need a look: see the messages in red.'),
  );
  return { submit, formError };
}
