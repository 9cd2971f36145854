import { Router } from 'express';
import {
  changePasswordInput,
  forgotPasswordInput,
  resetPasswordInput,
  RESET_TTL_MINUTES,
  signInInput,
} from '../../db/contracts';
import { withTransaction } from '../../db';
import type { AppContext } from '../context';
import { badRequest, unauthorized } from '../http-error';
import { resetMail } from '../mail/account-mail';
import { authenticate } from '../middleware/authenticate';
import { validateBody } from '../middleware/validate';
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

export function authRouter(
  ctx: AppContext,
  limits: { signIn?: import('express').RequestHandler[]; reset?: import('express').RequestHandler[] } = {},
): Router {
  const r = Router();
  const signedIn = authenticate(ctx);
  const session = (userId: string) => signInResult(ctx, userId);

  r.post('/sign-in', ...(limits.signIn ?? []), validateBody(signInInput), async (req, res) => {
    const { email, password } = req.body as { email: string; password: string };
    const row = await findUserForSignIn(ctx.db, email);
    const ok = await verifyPassword(password, row?.passwordHash ?? (await dummy()));
    // Same answer for an unknown address, a wrong password and a deactivated account: no hint which.
    if (!row || !ok || !row.active) throw unauthorized('e-mail or password is wrong');
    res.json(await session(row.id));
  });

  r.get('/me', signedIn, (req, res) => res.json(req.user));

  /** Always the same answer, whether or not the address has an account. */
  r.post('/forgot', ...(limits.reset ?? []), validateBody(forgotPasswordInput), async (req, res) => {
    const row = await findUserForSignIn(ctx.db, req.body.email);
    if (row?.active) {
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
    } else {
      await dummy();
    }
    res.status(202).json({
      message: 'If this address has an account, a link to set a new password is on its way. It works for one hour.',
    });
  });

  r.post('/reset', ...(limits.reset ?? []), validateBody(resetPasswordInput), async (req, res) => {
    const { token, password } = req.body as { token: string; password: string };
    const gone = () =>
      badRequest('this link has expired or was already used: ask for a new one', { token: 'expired or already used' });
    const live = await findLiveReset(ctx.db, hashOneTimeToken(token));
    if (!live) throw gone();
    const u = (await findSessionUser(ctx.db, live.userId))!;
    // Judged before the link is used up, so a weak try leaves the link working for the next one.
    requireStrongPassword(password, [u.email, u.name]);
    const found = await takePasswordReset(ctx.db, hashOneTimeToken(token));
    if (!found) throw gone();
    // A new password ends every sign-in the person had.
    await bumpSessionVersion(ctx.db, u.id, { passwordHash: await hashPassword(password) });
    res.json(await session(u.id));
  });

  r.post('/change-password', signedIn, validateBody(changePasswordInput), async (req, res) => {
    const user = req.user!;
    const { currentPassword, newPassword } = req.body as { currentPassword: string; newPassword: string };
    if (!(await verifyPassword(currentPassword, (await findPasswordHash(ctx.db, user.id))!))) {
      throw badRequest('the current password is not right', { currentPassword: 'not right' });
    }
    requireStrongPassword(newPassword, [user.email, user.name], 'newPassword');
    await bumpSessionVersion(ctx.db, user.id, { passwordHash: await hashPassword(newPassword) });
    // This device stays signed in with a fresh token; every other sign-in ends.
    res.json(await session(user.id));
  });

  r.post('/sign-out-everywhere', signedIn, async (req, res) => {
    await bumpSessionVersion(ctx.db, req.user!.id);
    res.status(204).end();
  });
  return r;
}
