import { existsSync } from 'node:fs';
import path from 'node:path';
import compression from 'compression';
import express, { type Express } from 'express';
import type { Logger } from 'pino';
import type { Database } from '../db';
import { authRouter } from './auth/auth-router';
import { createPassport } from './auth/passport';
import { buildLogRouter } from './build-log/build-log-router';
import { buildsRouter } from './builds/builds-router';
import { couponsRouter } from './coupons/coupons-router';
import type { Config } from './config';
import type { AppContext } from './context';
import { designsRouter, revisionsRouter } from './designs/designs-router';
import { devRouter } from './dev/dev-router';
import { findingsRouter } from './findings/findings-router';
import { notFound } from './http-error';
import type { MailQueue } from './jobs/mail-queue';
import { kitsRouter } from './kits/kits-router';
import type { SmtpFake } from './mail/smtp-fake';
import { authenticate } from './middleware/authenticate';
import { errorHandler, pageErrorHandler } from './middleware/error-handler';
import { limitByIpAndAddress } from './middleware/rate-limit';
import { createLogger, requestLog } from './middleware/request-log';
import { securityHeaders } from './middleware/security-headers';
import { networkRouter } from './network/network-router';
import { noticesRouter } from './notices/notices-router';
import type { TlsMaterial } from './network/tls';
import { invitationsRouter, peopleRouter } from './people/people-router';
import { photosRouter } from './photos/photos-router';
import { createUrlSigner } from './photos/url-signer';
import { localPhotoStorage, type PhotoStorage } from './storage/photo-storage';
import { studiesRouter } from './studies/studies-router';
import { travelersRouter } from './travelers/travelers-router';

/**
 * The service worker, the page it serves offline and the manifest are asked for again at each load
 * (hashed bundles keep their hour): a phone then picks up a new build on its next load instead of up to
 * an hour later.
 */
function revalidateAppShell(res: express.Response, file: string): void {
  if (/(^|[\\/])(sw\.js|index\.html|manifest\.webmanifest)$/.test(file)) res.setHeader('Cache-Control', 'no-cache');
}

export type AppDeps = {
  config: Config;
  database: Database;
  mailQueue: MailQueue;
  storage?: PhotoStorage;
  smtpFake?: SmtpFake;
  logger?: Logger;
  tls?: TlsMaterial | null;
};

/** Builds the Express app: the API under /api and the exported web app on the same origin. */
export function createApp({ config, database, mailQueue, storage, smtpFake, logger, tls }: AppDeps): {
  app: Express;
  ctx: AppContext;
} {
  const ctx: AppContext = {
    config,
    db: database.db,
    pool: database.pool,
    mailQueue,
    passport: createPassport(database.db, config.jwtSecret),
    storage: storage ?? localPhotoStorage(config.uploadsDir),
    signer: createUrlSigner(config.jwtSecret),
    tls: tls ?? null,
  };
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  // First, so that every answer (errors and static files included) has its request id and headers.
  app.use(requestLog(logger ?? createLogger(config)));
  app.use(securityHeaders(config));
  // A stored study result is some hundreds of kB of JSON and the web bundle 2 MB: both shrink ~10× gzipped.
  app.use(compression());
  // No passport.initialize(): sign-in is stateless (a bearer token checked per route by `authenticate`),
  // and initialize only decorates every request, static files included, for session log-ins we do not use.

  const api = express.Router();
  api.use(express.json({ limit: '1mb' }));
  api.get('/health', (_req, res) => {
    res.json({ ok: true });
  });
  // Counted in PostgreSQL, so the limits hold across server processes (server/middleware/rate-limit.ts).
  api.use(
    '/auth',
    authRouter(ctx, {
      signIn: limitByIpAndAddress(ctx, 'sign-in', config.rateLimits.signIn, 'too many sign-in attempts'),
      reset: limitByIpAndAddress(
        ctx,
        'password-reset',
        config.rateLimits.passwordReset,
        'too many password reset requests',
      ),
    }),
  );
  const inviteLimits = limitByIpAndAddress(
    ctx,
    'invitations',
    config.rateLimits.invitations,
    'too many invitation requests',
  );
  api.use('/invitations', invitationsRouter(ctx, inviteLimits));
  api.use('/photos', photosRouter(ctx));
  if (smtpFake && config.env !== 'production') api.use('/dev', devRouter(smtpFake));
  const signedIn = authenticate(ctx);
  api.use('/people', signedIn, peopleRouter(ctx, inviteLimits));
  api.use('/network', networkRouter(ctx, signedIn));
  api.use('/kits', signedIn, kitsRouter(ctx));
  api.use('/designs', signedIn, designsRouter(ctx));
  api.use('/revisions', signedIn, revisionsRouter(ctx));
  api.use('/builds', buildLogRouter(ctx, signedIn));
  api.use('/builds', signedIn, buildsRouter(ctx));
  api.use('/coupons', signedIn, couponsRouter(ctx));
  api.use('/studies', signedIn, studiesRouter(ctx));
  api.use('/travelers', signedIn, travelersRouter(ctx));
  api.use('/findings', signedIn, findingsRouter(ctx));
  api.use('/notices', signedIn, noticesRouter(ctx));
  api.use((_req, _res, next) => next(notFound('API route')));
  api.use(errorHandler);
  app.use('/api', api);

  // The exported single-page app: files as they are, every other path gets index.html for the router.
  const index = path.join(config.webDist, 'index.html');
  if (existsSync(index)) {
    app.use(express.static(config.webDist, { index: false, maxAge: '1h', setHeaders: revalidateAppShell }));
    app.get('/{*splat}', (_req, res) => res.sendFile(index));
  }
  app.use(pageErrorHandler);
  return { app, ctx };
}
