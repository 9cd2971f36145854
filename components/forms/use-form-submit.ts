import { useState } from 'react';
import type { FieldValues, UseFormHandleSubmit, UseFormSetError } from 'react-hook-form';
import { applyServerErrors } from './server-errors';

/** What a form says when its own checks stop the send. */
export const fieldsNeedALook = 'Some fields need a look: see the messages in red.';

/**
 * How a form sends its checked values and hears back: a refusal's field messages go onto the fields
 * (`toField` maps the server's paths), the rest is the one message at the top of the form, and a send
 * stopped by the form's own checks says so there too (`invalidMessage: null` keeps quiet instead).
 */
export function useFormSubmit<V extends FieldValues, O>({
  handleSubmit,
  setError,
  send,
  toField,
  invalidMessage = fieldsNeedALook,
}: {
  handleSubmit: UseFormHandleSubmit<V, O>;
  setError: UseFormSetError<V>;
  send: (values: O) => Promise<void>;
  toField?: (path: string) => string | null;
  invalidMessage?: string | null;
}) {
  const [formError, setFormError] = useState<string | null>(null);
  const submit = handleSubmit(
    async (values) => {
      setFormError(null);
      try {
        await send(values);
      } catch (e) {
        setFormError(applyServerErrors(setError, e, toField));
      }
    },
    () => {
      if (invalidMessage !== null) setFormError(invalidMessage);
    },
  );
  return { submit, formError };
}
