import { z } from 'zod';
import { emailAddress, roles } from './common';

export const signInInput = z.object({
  email: emailAddress(),
  password: z.string().min(1, 'enter your password'),
});
export type SignInInput = z.input<typeof signInInput>;

export const sessionUser = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: z.enum(roles),
  /** A supplier's lead engineer, who manages their own organisation's engineers. */
  lead: z.boolean(),
  organizationId: z.string().nullable(),
  organizationName: z.string().nullable(),
});
export type SessionUser = z.infer<typeof sessionUser>;

export type SignInResult = { token: string; expiresAt: string; user: SessionUser };
