import { z } from 'zod';

/** The one error shape every API error has. */
export type ApiErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };

export const idParam = z.object({ id: z.uuid({ message: 'must be an id' }) });

/** A positive length in inches, with the field's own words in the message. */
export const positiveInches = (what: string) =>
  z.number({ message: `${what} must be a number` }).positive(`${what} must be greater than zero`).max(1000, `${what} is over 1000 in`);

export const roles = ['supplier', 'builder', 'inspector', 'admin'] as const;
export type Role = (typeof roles)[number];
