import passport from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import type { Db } from '../../db';
import { JWT_ALGORITHM } from './tokens';
import { findSessionUser } from './auth-repository';

/** A passport instance of our own (not the global one) so several apps can live in one test process. */
export function createPassport(db: Db, secret: string): passport.PassportStatic {
  const instance = new passport.Passport() as unknown as passport.PassportStatic;
  instance.use(new JwtStrategy(
    { jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(), secretOrKey: secret, algorithms: [JWT_ALGORITHM] },
    (payload: { sub?: string }, done: (err: unknown, user?: Express.User | false) => void) => {
      if (!payload.sub) return done(null, false);
      findSessionUser(db, payload.sub).then((u) => done(null, u ?? false), (err) => done(err));
    },
  ));
  return instance;
}
