import { useState } from 'react';
import type { FieldValues, UseFormHandleSubmit, UseFormSetError } from 'react-hook-form';
import { applyServerErrors } from './server-errors';

/** What a form says when its own checks stop the send. */
export const fieldsNeedALook = 'Some fields need a look: see the messages in red.';

/**
 * How a form sends its checked values and hears back: a refusal's field messages go onto the fields
 * (`toField` maps the server's paths), the rest is the one message at the top of the form (`refusal`
 * may word it otherwise), and a send stopped by the form's own checks says so there too
 * (`invalidMessage: null` keeps quiet instead).
 */
export function useFormSubmit<V extends FieldValues, O>({
  handleSubmit,
  setError,
  send,
  toField,
  refusal,
  invalidMessage = fieldsNeedALook,
}: {
  handleSubmit: UseFormHandleSubmit<V, O>;
  setError: UseFormSetError<V>;
  send: (values: O) => Promise<void>;
  toField?: (path: string) => string | null;
  /** The top message for a refusal, given the error and what is left after the fields took theirs. */
  refusal?: (error: unknown, left: string) => string;
  invalidMessage?: string | null;
}) {
  const [formError, setFormError] = useState<string | null>(null);
  const submit = handleSubmit(
    async (values) => {
      setFormError(null);
      try {
        await send(values);
      } catch (e) {
        const left = applyServerErrors(setError, e, toField);
        setFormError(refusal ? refusal(e, left) : left);
      }
    },
    () => {
      if (invalidMessage !== null) setFormError(invalidMessage);
    },
  );
  return { submit, formError };
}
