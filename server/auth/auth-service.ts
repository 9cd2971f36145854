import { RESET_TTL_MINUTES, type SignInResult } from '../../db/contracts';
import { withTransaction } from '../../db';
import type { AppContext } from '../context';
import { badRequest, unauthorized } from '../http-error';
import { resetMail } from '../mail/account-mail';
import {
  bumpSessionVersion,
  findLiveReset,
  findPasswordHash,
  findSessionUser,
  findUserForSignIn,
  insertPasswordReset,
  takePasswordReset,
} from './auth-repository';
import { requireStrongPassword } from './password-strength';
import { hashPassword, verifyPassword } from './passwords';
import { signInResult } from './session';
import { hashOneTimeToken, newOneTimeToken } from './tokens';

// An unknown address costs the same scrypt work as a wrong password, so timing does not tell them apart.
let dummyHash: Promise<string> | null = null;
const dummy = () => (dummyHash ??= hashPassword('no account has this password'));

type Deps = Pick<AppContext, 'db' | 'pool' | 'config' | 'mailQueue'>;

/** Signing in, passwords and their reset links: the rules; the router speaks HTTP. */
export const authService = (ctx: Deps) => {
  const session = (userId: string): Promise<SignInResult> => signInResult(ctx, userId);

  return {
    async signIn(email: string, password: string) {
      const row = await findUserForSignIn(ctx.db, email);
      const ok = await verifyPassword(password, row?.passwordHash ?? (await dummy()));
      // Same answer for an unknown address, a wrong password and a deactivated account: no hint which.
      if (!row || !ok || !row.active) throw unauthorized('e-mail or password is wrong');
      return session(row.id);
    },

    /** A reset link by mail when the address has a live account; the same work and no answer otherwise. */
    async forgot(email: string) {
      const row = await findUserForSignIn(ctx.db, email);
      if (!row?.active) {
        await dummy();
        return;
      }
      const { token, hash } = newOneTimeToken();
      await withTransaction(ctx.pool, async (tx) => {
        await insertPasswordReset(tx.db, row.id, hash, new Date(Date.now() + RESET_TTL_MINUTES * 60_000));
        await ctx.mailQueue.enqueue(tx, {
          message: resetMail({
            to: row.email,
            name: row.name,
            link: `${ctx.config.publicUrl}/reset/${token}`,
            minutes: RESET_TTL_MINUTES,
          }),
        });
      });
    },

    async reset(token: string, password: string) {
      const gone = () =>
        badRequest('this link has expired or was already used: ask for a new one', {
          token: 'expired or already used',
        });
      const live = await findLiveReset(ctx.db, hashOneTimeToken(token));
      if (!live) throw gone();
      const u = (await findSessionUser(ctx.db, live.userId))!;
      // Judged before the link is used up, so a weak try leaves the link working for the next one.
      requireStrongPassword(password, [u.email, u.name]);
      const passwordHash = await hashPassword(password);
      // The link is used up and the password set in one unit of work: neither happens without the other.
      await withTransaction(ctx.pool, async (tx) => {
        if (!(await takePasswordReset(tx.db, hashOneTimeToken(token)))) throw gone();
        // A new password ends every sign-in the person had.
        await bumpSessionVersion(tx.db, u.id, { passwordHash });
      });
      return session(u.id);
    },

    async changePassword(user: Express.User, currentPassword: string, newPassword: string) {
      if (!(await verifyPassword(currentPassword, (await findPasswordHash(ctx.db, user.id))!))) {
        throw badRequest('the current password is not right', { currentPassword: 'not right' });
      }
      requireStrongPassword(newPassword, [user.email, user.name], 'newPassword');
      await bumpSessionVersion(ctx.db, user.id, { passwordHash: await hashPassword(newPassword) });
      // This device stays signed in with a fresh token; every other sign-in ends.
      return session(user.id);
    },

    signOutEverywhere: (userId: string) => bumpSessionVersion(ctx.db, userId),
  };
};
