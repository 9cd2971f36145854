import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { createDatabase } from '@/db';
import { DEMO_PASSWORD, DEMO_USERS, seedDemo } from '@/server/dev/seed';
import { organizations, users } from '@/db/schema';
import { createApp } from '@/server/app';
import { closeStudyPool } from '@/server/studies/study-pool';
import { hashPassword } from '@/server/auth/passwords';
import { loadConfig } from '@/server/config';
import { findingMailWorker } from '@/server/jobs/finding-mail-worker';
import { startMailQueue } from '@/server/jobs/mail-queue';
import { startSmtpFake, type ReceivedMail } from '@/server/mail/smtp-fake';
import { createMailer } from '@/server/mail/transport';
import { localPhotoStorage } from '@/server/storage/photo-storage';
import { createTestDatabase } from './test-database';

export type TestApp = Awaited<ReturnType<typeof startTestApp>>;

/**
 * The real thing, wired as server/index.ts wires it: own database, own SMTP fake on a free port, the
 * PostgreSQL job queue and its mail worker, photos in a temporary folder, and the demo scenario.
 */
export async function startTestApp(
  opts: {
    seed?: boolean;
    port?: number;
    webDist?: string;
    /** Share this database (made by another test app, which drops it) instead of making one: two server processes. */
    databaseUrl?: string;
    /** More configuration, e.g. a lower rate limit. */
    env?: Record<string, string>;
  } = {},
) {
  const testDb = opts.databaseUrl ? { url: opts.databaseUrl, drop: async () => undefined } : await createTestDatabase();
  const uploadsDir = await mkdtemp(path.join(os.tmpdir(), 'pc-uploads-'));
  const smtp = await startSmtpFake(0);
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: testDb.url,
    JWT_SECRET: 'test-secret-that-is-long-enough',
    SMTP_PORT: String(smtp.port),
    UPLOADS_DIR: uploadsDir,
    PORT: String(opts.port ?? 8080),
    WEB_DIST: opts.webDist ?? path.join(uploadsDir, 'no-web'),
    // A name of the reserved .test domain: not a loopback address, so labels print (browser tests map it to 127.0.0.1).
    PUBLIC_URL: `http://pitchcard.test:${opts.port ?? 8080}`,
    // Tests sign the same people in again and again from one address: the real limits are tested on their own.
    SIGN_IN_LIMIT_PER_ADDRESS: '100000',
    SIGN_IN_LIMIT_PER_IP: '100000',
    PASSWORD_RESET_LIMIT_PER_ADDRESS: '100000',
    PASSWORD_RESET_LIMIT_PER_IP: '100000',
    INVITATION_LIMIT_PER_ADDRESS: '100000',
    INVITATION_LIMIT_PER_IP: '100000',
    ...opts.env,
  });
  const database = createDatabase(config.databaseUrl);
  const storage = localPhotoStorage(uploadsDir);
  const mailer = createMailer(config.smtp);
  const mailQueue = await startMailQueue(config.databaseUrl, { pollingIntervalSeconds: 0.5 });
  await mailQueue.work(findingMailWorker({ db: database.db, mailer, storage, publicUrl: config.publicUrl }));
  if (opts.seed !== false) await seedDemo(database, storage, mailQueue, config.jwtSecret);
  const { app, ctx } = createApp({ config, database, mailQueue, storage, smtpFake: smtp });

  async function signIn(email: string, password = DEMO_PASSWORD): Promise<string> {
    const res = await request(app).post('/api/auth/sign-in').send({ email, password });
    if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body.token;
  }

  /** Another person outside the demo; a supplier gets an organisation of its own. */
  async function addUser(role: 'supplier' | 'builder' | 'inspector', email: string): Promise<string> {
    const organizationId =
      role === 'supplier'
        ? (
            await database.db
              .insert(organizations)
              .values({ name: `${email} kits`, kind: 'supplier' })
              .returning()
          )[0].id
        : null;
    await database.db.insert(users).values({
      email,
      name: email.split('@')[0],
      role,
      organizationId,
      passwordHash: await hashPassword(DEMO_PASSWORD),
    });
    return signIn(email);
  }

  return {
    app,
    ctx,
    config,
    database,
    smtp,
    uploadsDir,
    mailQueue,
    signIn,
    /** Bearer tokens of the demo people. */
    tokens: async () => ({
      supplier: await signIn(DEMO_USERS.supplier.email),
      builder: await signIn(DEMO_USERS.builder.email),
      inspector: await signIn(DEMO_USERS.inspector.email),
      admin: await signIn(DEMO_USERS.admin.email),
    }),
    addUser,
    /** People outside the demo build: another builder, inspector and supplier, for the access checks. */
    async outsiders() {
      return {
        builder: await addUser('builder', 'other.builder@elsewhere.example'),
        inspector: await addUser('inspector', 'other.inspector@elsewhere.example'),
        supplier: await addUser('supplier', 'other.supplier@elsewhere.example'),
      };
    },
    /** Waits until the SMTP fake has a message that matches, or fails after `ms`. */
    async waitForMail(match: (m: ReceivedMail) => boolean, ms = 15000): Promise<ReceivedMail> {
      return waitUntil(
        () => smtp.messages.find(match),
        ms,
        () =>
          `no matching mail within ${ms} ms; received: ${smtp.messages.map((m) => m.subject).join(' | ') || 'none'}`,
      );
    },
    waitUntil,
    async close() {
      await closeStudyPool();
      await mailQueue.stop();
      mailer.close();
      await smtp.close();
      await database.close();
      await testDb.drop();
      await rm(uploadsDir, { recursive: true, force: true });
    },
  };
}

export type Tokens = Awaited<ReturnType<TestApp['tokens']>>;

/** The header that carries a bearer token. */
export const auth = (token: string) => ({ Authorization: `Bearer ${token}` });

export type Outsiders = Awaited<ReturnType<TestApp['outsiders']>>;

/**
 * For a test file (or a describe block) on the demo: the app started before its tests and closed after
 * them (its study threads too); `take` receives it and the demo people's tokens, and with `outsiders`
 * people outside the demo build as well. Any other option goes to startTestApp (e.g. `env`). Registered
 * before the file's own beforeAll, it runs first.
 */
export function demoApp<O extends boolean = false>(
  take: (s: { t: TestApp; tok: Tokens } & (O extends true ? { outsiders: Outsiders } : unknown)) => void,
  { outsiders, ...start }: { outsiders?: O } & Parameters<typeof startTestApp>[0] = {},
) {
  let t: TestApp | undefined;
  beforeAll(async () => {
    t = await startTestApp(start);
    const tok = await t.tokens();
    take({ t, tok, ...(outsiders ? { outsiders: await t.outsiders() } : {}) } as Parameters<typeof take>[0]);
  });
  afterAll(async () => {
    await t?.close();
  });
}

/** As demoApp, and the id of the supplier's first kit model too. */
export function demoAppWithKit(take: (s: { t: TestApp; tok: Tokens; kitModelId: string }) => void) {
  let s: { t: TestApp; tok: Tokens };
  demoApp((x) => (s = x));
  beforeAll(async () => {
    const kitModelId = (await request(s.t.app).get('/api/kits').set(auth(s.tok.supplier))).body.items[0].id as string;
    take({ ...s, kitModelId });
  });
}

/** The demo build's ribs as its builder sees them: the inboard W-104 and the outboard W-105, and the build. */
export async function demoRibs(t: TestApp, token: string) {
  const parts = (await request(t.app).get('/api/travelers').set(auth(token))).body.items as {
    id: string;
    partNumber: string;
    buildId: string;
  }[];
  const rib = (n: string) => parts.find((p) => p.partNumber === n)!;
  return { innerId: rib('W-104').id, outerId: rib('W-105').id, buildId: rib('W-104').buildId };
}

/**
 * Polls `check` every 100 ms until it gives a value, or fails after `ms` with `why()`. For what a job
 * does after the moment a test can see (a worker records a mail only once the relay has taken it).
 */
async function waitUntil<T>(
  check: () => T | undefined | Promise<T | undefined>,
  ms = 15000,
  why: () => string = () => `nothing within ${ms} ms`,
): Promise<T> {
  const end = Date.now() + ms;
  while (Date.now() < end) {
    const value = await check();
    if (value !== undefined) return value;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(why());
}
