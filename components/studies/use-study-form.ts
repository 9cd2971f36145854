import { useForm, type DefaultValues, type FieldValues, type Resolver } from 'react-hook-form';
import { useFormSubmit } from '@/components/forms/use-form-submit';
import { ApiError } from '@/lib/api-client';

/**
 * A study form, the rib's and the wing's alike: checked as typed; the server's refusals go onto the
 * fields `fieldFor` places and the top of the form says the rest (or that the fields are marked);
 * `take` puts a kit's numbers in as if typed.
 */
export function useStudyForm<V extends FieldValues, O>({
  resolver,
  defaultValues,
  onSubmit,
  fieldFor,
}: {
  resolver: Resolver<V, unknown, O>;
  defaultValues: DefaultValues<V>;
  onSubmit: (values: O) => Promise<void>;
  fieldFor: (path: string) => string | null;
}) {
  const form = useForm<V, unknown, O>({ resolver, mode: 'onChange', defaultValues });
  const { submit, formError } = useFormSubmit({
    handleSubmit: form.handleSubmit,
    setError: form.setError,
    send: onSubmit,
    toField: fieldFor,
    refusal: (e, left) => {
      // The server's summary names fields by their paths; say it in words and leave the rest to the fields.
      if (!(e instanceof ApiError && e.fields && Object.keys(e.fields).length)) return left;
      const unplaced = Object.entries(e.fields)
        .filter(([p]) => !fieldFor(p))
        .map(([, m]) => m.trim().replace(/[.]$/, ''));
      return unplaced.length
        ? `Not computed: ${unplaced.join('; ')}.`
        : 'Not computed: some inputs were refused. See the marked fields.';
    },
    invalidMessage: 'Some inputs need a look: see the messages in red.',
  });
  // The kit's values stand as typed: "unchanged" still means as the study was opened, and old errors go.
  const take = (next: V) => form.reset(next, { keepDefaultValues: true, keepDirty: false, keepErrors: false });
  return { form, submit, formError, take };
}
