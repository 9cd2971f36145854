import { z } from 'zod';

/** The one error shape every API error has. */
export type ApiErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };

export const idParam = z.object({ id: z.uuid({ message: 'must be an id' }) });

/** A positive length in inches, with the field's own words in the message. */
export const positiveInches = (what: string) =>
  z.number({ message: `${what} must be a number` }).positive(`${what} must be greater than zero`).max(1000, `${what} is over 1000 in`);

export const roles = ['supplier', 'builder', 'inspector', 'admin'] as const;
export type Role = (typeof roles)[number];

/** Control characters other than tab and line breaks: never part of what a person types. */
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/;

/** Free text a person typed: trimmed, bounded, and refused with the field's own words when it carries control characters. */
export const plainText = (what: string, min: number, max: number, tooShort = `${what} needs at least ${min} characters`) =>
  z.string({ message: `${what} must be text` }).trim()
    .min(min, tooShort)
    .max(max, `keep ${what} under ${max} characters`)
    .refine((s) => !CONTROL.test(s), `${what} contains a control character: type plain text`);

export const roleLabels: Record<Role, string> = {
  supplier: 'Supplier’s engineer', builder: 'Builder', inspector: 'Inspector', admin: 'Administrator',
};
