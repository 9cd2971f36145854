import type { NextFunction, Request, Response } from 'express';
import type { AppContext } from '../context';
import { unauthorized } from '../http-error';

/** Bearer-token sign-in check; answers our own 401 shape rather than passport's plain text. */
export function authenticate(ctx: AppContext) {
  return (req: Request, res: Response, next: NextFunction) => {
    ctx.passport.authenticate(
      'jwt',
      { session: false },
      (err: unknown, user: Express.User | false, info?: { name?: string }) => {
        if (err) return next(err);
        if (!user)
          return next(
            unauthorized(
              info?.name === 'TokenExpiredError' ? 'your sign-in has expired: sign in again' : 'sign in first',
            ),
          );
        req.user = user;
        next();
      },
    )(req, res, next);
  };
}
