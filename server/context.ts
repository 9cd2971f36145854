import type { Pool } from 'pg';
import type passport from 'passport';
import type { Db } from '../db';
import type { Config } from './config';
import type { MailQueue } from './jobs/mail-queue';
import type { PhotoStorage } from './storage/photo-storage';
import type { UrlSigner } from './photos/url-signer';
import type { TlsMaterial } from './network/tls';

/** Everything a router needs, built once in app.ts: no module-level singletons, so tests build their own. */
export type AppContext = {
  config: Config;
  db: Db;
  pool: Pool;
  passport: passport.PassportStatic;
  storage: PhotoStorage;
  mailQueue: MailQueue;
  signer: UrlSigner;
  /** The certificate served when Pitchcard speaks HTTPS itself (network mode), for the phone setup page. */
  tls: TlsMaterial | null;
};
