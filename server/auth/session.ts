import type { SignInResult } from '../../db/contracts';
import type { AppContext } from '../context';
import { findSessionUser } from './auth-repository';
import { issueToken } from './tokens';

/** A fresh sign-in for the person: their current session version in the token, their profile beside it. */
export async function signInResult(ctx: Pick<AppContext, 'db' | 'config'>, userId: string): Promise<SignInResult> {
  const u = (await findSessionUser(ctx.db, userId))!;
  const { active: _a, sessionVersion, ...user } = u;
  return { ...issueToken(ctx.config.jwtSecret, ctx.config.tokenTtlSeconds, user.id, sessionVersion), user };
}
