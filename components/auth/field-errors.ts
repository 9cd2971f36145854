import type { FieldValues, UseFormSetError } from 'react-hook-form';
import { applyServerErrors } from '@/components/forms/server-errors';
import { ApiError } from '@/lib/api-client';

/**
 * The server's field messages onto the form, and what is left to say above the button, or null. For the
 * password forms: the strength advice is long, and said once under its box reads better than twice.
 */
export function leftAfterFields<T extends FieldValues>(
  setError: UseFormSetError<T>,
  e: unknown,
  fields: readonly string[],
): string | null {
  const toField = (path: string) => (fields.includes(path) ? path : null);
  const placedAll =
    e instanceof ApiError &&
    !!e.fields &&
    Object.keys(e.fields).length > 0 &&
    Object.keys(e.fields).every((p) => toField(p) !== null);
  const said = applyServerErrors(setError, e, toField);
  return placedAll ? null : said;
}

/** A server message as a sentence: capital first, full stop last. */
export function asSentence(message: string): string {
  const m = message.trim();
  if (!m) return m;
  const capital = m[0].toUpperCase() + m.slice(1);
  return /[.!?]$/.test(capital) ? capital : `${capital}.`;
}
