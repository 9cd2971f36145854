import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError, errorMessage } from '@/lib/api-client';

/**
 * Puts the server's `fields` messages (dotted paths) onto the form's fields and returns what is left
 * to say at the top of the form. `toField` maps a server path to a form path, or null when the form
 * has no such field.
 */
export function applyServerErrors<T extends FieldValues>(
  setError: UseFormSetError<T>,
  error: unknown,
  toField: (path: string) => string | null = (p) => p,
): string {
  if (!(error instanceof ApiError)) return errorMessage(error);
  const unplaced: string[] = [];
  let placed = 0;
  for (const [path, message] of Object.entries(error.fields ?? {})) {
    const name = toField(path);
    if (name) {
      setError(name as Path<T>, { type: 'server', message }, { shouldFocus: placed === 0 });
      placed++;
    } else {
      unplaced.push(message);
    }
  }
  const sentence = (m: string) => (/[.!?]$/.test(m.trim()) ? m.trim() : `${m.trim()}.`);
  if (placed && !unplaced.length) return `${sentence(error.message)} See the marked fields.`;
  return [error.message, ...unplaced].map(sentence).join(' ');
}

/** Reads a nested error message from RHF's error tree by dotted path. */
export function errorAt(errors: unknown, path: string): string | undefined {
  let node: unknown = errors;
  for (const part of path.split('.')) {
    if (!node || typeof node !== 'object') return undefined;
    node = (node as Record<string, unknown>)[part];
  }
  const msg = (node as { message?: unknown } | undefined)?.message;
  if (typeof msg === 'string') return msg;
  // Array-level errors (e.g. "add at least one line") sit under `root`.
  const root = (node as { root?: { message?: unknown } } | undefined)?.root?.message;
  return typeof root === 'string' ? root : undefined;
}
