import passport from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import type { Db } from '../../db';
import { JWT_ALGORITHM, signingKey } from './tokens';
import { findSessionUser } from './auth-repository';
import { cachedSessionUser } from './session-cache';

type Payload = { sub?: string; exp?: number; ver?: number };

/** A passport instance of our own (not the global one) so several apps can live in one test process. */
export function createPassport(db: Db, secret: string): passport.PassportStatic {
  const instance = new passport.Passport() as unknown as passport.PassportStatic;
  instance.use(
    new JwtStrategy(
      {
        jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
        secretOrKey: signingKey(secret) as unknown as string,
        algorithms: [JWT_ALGORITHM],
      },
      (payload: Payload, done: (err: unknown, user?: Express.User | false) => void) => {
        // A token without an expiry would never end: refused, as is one from before the last "sign out everywhere".
        if (!payload.sub || typeof payload.exp !== 'number' || typeof payload.ver !== 'number')
          return done(null, false);
        cachedSessionUser(payload.sub, payload.ver, (id) => findSessionUser(db, id)).then(
          (u) => {
            if (!u || !u.active || u.sessionVersion !== payload.ver) return done(null, false);
            const { active: _a, sessionVersion: _v, ...user } = u;
            done(null, user);
          },
          (err) => done(err),
        );
      },
    ),
  );
  return instance;
}
