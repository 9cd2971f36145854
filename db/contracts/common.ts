import { z } from 'zod';

/** The one error shape every API error has. */
export type ApiErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };

export const idParam = z.object({ id: z.uuid({ message: 'must be an id' }) });

/** A positive length in inches, with the field's own words in the message. */
export const positiveInches = (what: string) =>
  z
    .number({ message: `${what} must be a number` })
    .positive(`${what} must be greater than zero`)
    .max(1000, `${what} is over 1000 in`);

/** The longest e-mail address that can be delivered (a path is at most 256 octets with its brackets): common practice. */
export const EMAIL_MAX = 254;

/** An e-mail address as typed: checked, bounded, and kept in lower case, as addresses are matched. */
export const emailAddress = (message = 'enter an e-mail address like name@example.com') =>
  z
    .email({ message })
    .max(EMAIL_MAX, `an e-mail address is at most ${EMAIL_MAX} characters`)
    .transform((s) => s.toLowerCase());

export const roles = ['supplier', 'builder', 'inspector', 'admin'] as const;
export type Role = (typeof roles)[number];

/** Control characters other than tab and line breaks: never part of what a person types. */
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/;

/**
 * Half of a UTF-16 surrogate pair standing alone. JSON can carry one (`"\ud800"`) though it is no
 * character: PostgreSQL refuses it in a JSON column (a 500), and a text column would keep U+FFFD instead.
 */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?:^|[^\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/**
 * Free text a person typed: trimmed, bounded, and refused with the field's own words when it carries
 * control characters or a broken character (a lone surrogate).
 */
export const plainText = (
  what: string,
  min: number,
  max: number,
  tooShort = `${what} needs at least ${min} characters`,
) =>
  z
    .string({ message: `${what} must be text` })
    .trim()
    .min(min, tooShort)
    .max(max, `keep ${what} under ${max} characters`)
    .refine((s) => !CONTROL.test(s), `${what} contains a control character: type plain text`)
    .refine((s) => !LONE_SURROGATE.test(s), `${what} contains a broken character: type it again`);

export const roleLabels: Record<Role, string> = {
  supplier: 'Supplier’s engineer',
  builder: 'Builder',
  inspector: 'Inspector',
  admin: 'Administrator',
};

/** One page of a list: `next` is the cursor of the page after it, null on the last page. */
export type Page<T> = { items: T[]; next: string | null };

export const PAGE_SIZE_DEFAULT = 50;
export const PAGE_SIZE_MAX = 100;

/** `?cursor=&limit=` on every list: the cursor is opaque (one the server gave), the size bounded. */
export const pageQuery = z.object({
  cursor: z
    .string()
    .max(400, 'cursor is too long: use the `next` value a page gave')
    .regex(/^[A-Za-z0-9_-]+$/, 'cursor is not one this server gave: use the `next` value a page gave')
    .optional(),
  limit: z.coerce
    .number({ message: 'limit must be a number' })
    .int('limit must be a whole number')
    .min(1, 'limit must be at least 1')
    .max(PAGE_SIZE_MAX, `limit is at most ${PAGE_SIZE_MAX}`)
    .default(PAGE_SIZE_DEFAULT),
});
export type PageQuery = z.infer<typeof pageQuery>;
