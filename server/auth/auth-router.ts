import { Router } from 'express';
import { signInInput, type SignInResult } from '../../db/contracts';
import type { AppContext } from '../context';
import { unauthorized } from '../http-error';
import { authenticate } from '../middleware/authenticate';
import { validateBody } from '../middleware/validate';
import { findUserForSignIn } from './auth-repository';
import { verifyPassword } from './passwords';
import { issueToken } from './tokens';

export function authRouter(ctx: AppContext): Router {
  const r = Router();
  r.post('/sign-in', validateBody(signInInput), async (req, res) => {
    const { email, password } = req.body as { email: string; password: string };
    const row = await findUserForSignIn(ctx.db, email);
    // Same answer for an unknown address and a wrong password: no hint which one it was.
    if (!row || !(await verifyPassword(password, row.passwordHash))) throw unauthorized('e-mail or password is wrong');
    const { passwordHash: _, ...user } = row;
    const result: SignInResult = { ...issueToken(ctx.config.jwtSecret, ctx.config.tokenTtlSeconds, user.id), user };
    res.json(result);
  });
  r.get('/me', authenticate(ctx), (req, res) => res.json(req.user));
  return r;
}
