import { Router } from 'express';
import { changePasswordInput, forgotPasswordInput, resetPasswordInput, signInInput } from '../../db/contracts';
import type { AppContext } from '../context';
import { authenticate } from '../middleware/authenticate';
import { validateBody } from '../middleware/validate';
import { authService } from './auth-service';

export function authRouter(
  ctx: AppContext,
  limits: { signIn?: import('express').RequestHandler[]; reset?: import('express').RequestHandler[] } = {},
): Router {
  const r = Router();
  const signedIn = authenticate(ctx);
  const auth = authService(ctx);

  r.post('/sign-in', ...(limits.signIn ?? []), validateBody(signInInput), async (req, res) => {
    const { email, password } = req.body as { email: string; password: string };
    res.json(await auth.signIn(email, password));
  });

  r.get('/me', signedIn, (req, res) => res.json(req.user));

  /** Always the same answer, whether or not the address has an account. */
  r.post('/forgot', ...(limits.reset ?? []), validateBody(forgotPasswordInput), async (req, res) => {
    await auth.forgot(req.body.email);
    res.status(202).json({
      message: 'If this address has an account, a link to set a new password is on its way. It works for one hour.',
    });
  });

  r.post('/reset', ...(limits.reset ?? []), validateBody(resetPasswordInput), async (req, res) => {
    const { token, password } = req.body as { token: string; password: string };
    res.json(await auth.reset(token, password));
  });

  r.post('/change-password', signedIn, validateBody(changePasswordInput), async (req, res) => {
    const { currentPassword, newPassword } = req.body as { currentPassword: string; newPassword: string };
    res.json(await auth.changePassword(req.user!, currentPassword, newPassword));
  });

  r.post('/sign-out-everywhere', signedIn, async (req, res) => {
    await auth.signOutEverywhere(req.user!.id);
    res.status(204).end();
  });
  return r;
}
