import { spawn } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { mkdtemp, readdir, rm, utimes, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { Client } from 'pg';
import request from 'supertest';
import { DEMO_PASSWORD, DEMO_USERS } from '@/server/dev/seed';
import { createDatabase } from '@/db';
import { findingPhotos } from '@/db/schema';
import { createApp } from '@/server/app';
import { loadConfig } from '@/server/config';
import { sweepOrphanPhotos } from '@/server/jobs/photo-sweep';
import { createLogger } from '@/server/middleware/request-log';
import { auth, startTestApp, type TestApp } from '../helpers/test-app';

/**
 * The server's own defences, each tested so that removing it fails a test: security headers, request
 * ids in logs and error bodies, a sign-in limit shared by server processes, a cluster that wants its
 * password, a production secret long enough, orphan photo files swept, a supervisor that restarts a
 * dead server within bounds.
 */
jest.setTimeout(60_000);

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t?.close();
});

const { builder, supplier, inspector, admin } = DEMO_USERS;

describe('security headers (helmet)', () => {
  it('sends a content security policy that allows our own scripts only, and forbids framing', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.status).toBe(200);
    const csp = String(res.headers['content-security-policy']);
    const directive = (name: string) =>
      csp
        .split(';')
        .map((d) => d.trim())
        .find((d) => d.startsWith(`${name} `));
    expect(directive('default-src')).toBe("default-src 'self'");
    expect(directive('script-src')).toBe("script-src 'self' 'wasm-unsafe-eval'");
    expect(directive('frame-ancestors')).toBe("frame-ancestors 'none'");
    expect(directive('object-src')).toBe("object-src 'none'");
    expect(res.headers['x-frame-options']).toBe('DENY');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['referrer-policy']).toBe('no-referrer');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('sends them on error answers too', async () => {
    const res = await request(t.app).get('/api/no-such-route');
    expect(res.status).toBe(404);
    expect(res.headers['content-security-policy']).toContain("frame-ancestors 'none'");
    expect(res.headers['x-frame-options']).toBe('DENY');
  });
});

describe('request ids', () => {
  it('gives every answer an id, and an error body repeats it', async () => {
    const res = await request(t.app).get('/api/no-such-route');
    const id = res.headers['x-request-id'];
    expect(id).toMatch(/^[0-9a-f-]{36}$/);
    expect(res.body.error).toEqual({ code: 'not_found', message: 'API route not found', requestId: id });
  });

  it('repeats the id in a validation error and a 401', async () => {
    const bad = await request(t.app).post('/api/auth/sign-in').send({ email: 'not an address', password: '' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.requestId).toBe(bad.headers['x-request-id']);
    const unsigned = await request(t.app).get('/api/travelers');
    expect(unsigned.status).toBe(401);
    expect(unsigned.body.error.requestId).toBe(unsigned.headers['x-request-id']);
  });

  it('keeps an incoming X-Request-Id that is a short plain token, and replaces any other', async () => {
    const kept = await request(t.app).get('/api/no-such-route').set('X-Request-Id', 'edge-proxy.42_a');
    expect(kept.headers['x-request-id']).toBe('edge-proxy.42_a');
    expect(kept.body.error.requestId).toBe('edge-proxy.42_a');
    for (const unsafe of ['two words', 'x'.repeat(65), '{"level":60}', 'ab\u00e9']) {
      const res = await request(t.app).get('/api/no-such-route').set('X-Request-Id', unsafe);
      expect(res.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
      expect(res.body.error.requestId).toBe(res.headers['x-request-id']);
    }
  });

  it('logs one JSON line per API request with its id and status, without the bearer token or query values', async () => {
    const lines: string[] = [];
    const logger = createLogger(
      { logLevel: 'info' },
      {
        write: (line: string) => {
          lines.push(line);
        },
      },
    );
    const { app } = createApp({
      config: t.config,
      database: t.database,
      mailQueue: t.mailQueue,
      storage: t.ctx.storage,
      logger,
    });
    const token = await t.signIn(builder.email);
    const res = await request(app)
      .get('/api/travelers?exp=123&sig=secret-signature')
      .set(auth(token))
      .set('X-Request-Id', 'trace-me-1');
    expect(res.status).toBe(200);
    await new Promise((r) => setImmediate(r));
    const entries = lines.map((l) => JSON.parse(l)).filter((e) => e.req?.id === 'trace-me-1');
    expect(entries).toHaveLength(1);
    expect(entries[0]).toMatchObject({
      level: 30,
      req: { method: 'GET', url: '/api/travelers?exp=[redacted]&sig=[redacted]' },
      res: { statusCode: 200 },
    });
    expect(typeof entries[0].responseTime).toBe('number');
    const all = lines.join('\n');
    expect(all).not.toContain(token);
    expect(all).not.toContain('secret-signature');
    // The exported web app's paths are not logged (a one-time link's token may be in one).
    lines.length = 0;
    await request(app).get('/reset/some-one-time-token');
    await new Promise((r) => setImmediate(r));
    expect(lines.join('')).not.toContain('some-one-time-token');
  });

  it('is silent in tests unless asked', () => {
    const base = { DATABASE_URL: 'postgres://x@127.0.0.1/x', JWT_SECRET: 'a'.repeat(32) };
    expect(loadConfig({ ...base, NODE_ENV: 'test' }).logLevel).toBe('silent');
    expect(loadConfig({ ...base, NODE_ENV: 'production' }).logLevel).toBe('info');
    expect(loadConfig({ ...base, NODE_ENV: 'test', LOG_LEVEL: 'debug' }).logLevel).toBe('debug');
  });
});

describe('requests Express itself cannot read', () => {
  // Each answered 500 "something went wrong" before, and outside the API Express's own page with the stack.
  let token: string;
  beforeAll(async () => {
    token = await t.signIn(supplier.email);
  });
  const kitCount = async () => (await request(t.app).get('/api/kits').set(auth(token))).body.items.length;
  const postKit = (headers: Record<string, string>, body: string) =>
    request(t.app).post('/api/kits').set(auth(token)).set(headers).send(body);

  it('refuses an API path with a malformed %-escape as such', async () => {
    const res = await request(t.app).get('/api/builds/%E0%A4%A').set(auth(token));
    expect([res.status, res.body.error.code]).toEqual([400, 'invalid_address']);
    expect(res.body.error.message).toBe('the address has a malformed %-escape');
  });

  it('refuses a body in an encoding or charset it does not read (415), naming it, and saves nothing', async () => {
    const before = await kitCount();
    const encoded = await postKit({ 'Content-Type': 'application/json', 'Content-Encoding': 'foo' }, '{}');
    expect([encoded.status, encoded.body.error.code]).toEqual([415, 'unsupported_encoding']);
    expect(encoded.body.error.message).toContain('"foo"');
    const latin = await postKit({ 'Content-Type': 'application/json; charset=latin1' }, '{}');
    expect([latin.status, latin.body.error.code]).toEqual([415, 'unsupported_charset']);
    expect(latin.body.error.message).toContain('send UTF-8');
    expect(await kitCount()).toBe(before);
  });

  it('refuses a body marked gzip that does not inflate (400)', async () => {
    const res = await postKit({ 'Content-Type': 'application/json', 'Content-Encoding': 'gzip' }, 'not gzip at all');
    expect([res.status, res.body.error.code]).toEqual([400, 'unreadable_body']);
    expect(res.body.error.message).toMatch(/^the request body could not be read/);
  });

  it("answers a page path with a malformed %-escape 400 in plain words, without the server's stack", async () => {
    const webDist = await mkdtemp(path.join(os.tmpdir(), 'pc-web-'));
    try {
      await writeFile(path.join(webDist, 'index.html'), '<!doctype html><title>app</title>');
      const { app } = createApp({
        config: { ...t.config, webDist },
        database: t.database,
        mailQueue: t.mailQueue,
        storage: t.ctx.storage,
      });
      expect((await request(app).get('/builds')).text).toContain('<title>app</title>');
      const res = await request(app).get('/builds/%ZZ');
      expect([res.status, res.type]).toEqual([400, 'text/plain']);
      expect(res.text).toBe('Not served: the address has a malformed %-escape.');
    } finally {
      await rm(webDist, { recursive: true, force: true });
    }
  });
});

describe('a server whose database connections are all taken', () => {
  it('answers 503 busy with Retry-After, not a 500, and serves again once one is free', async () => {
    // One connection, a short wait: the test holds the connection as a flood of slow requests would.
    const database = createDatabase(t.config.databaseUrl, { max: 1, waitMs: 300 });
    const { app } = createApp({ config: t.config, database, mailQueue: t.mailQueue, storage: t.ctx.storage });
    const token = await t.signIn(builder.email);
    const held = await database.pool.connect();
    try {
      const busy = await request(app).get('/api/travelers').set(auth(token));
      expect([busy.status, busy.body.error.code, busy.headers['retry-after']]).toEqual([503, 'busy', '5']);
      expect(busy.body.error.message).toBe('the server is busy: try again in a few seconds');
    } finally {
      held.release();
    }
    expect((await request(app).get('/api/travelers').set(auth(token))).status).toBe(200);
    await database.close();
  });
});

describe('sign-in limit, counted in PostgreSQL across server processes', () => {
  // Two apps on one database, as two server processes would be: only the database is shared.
  let a: TestApp;
  let b: TestApp;
  const limits = { SIGN_IN_LIMIT_PER_ADDRESS: '3', SIGN_IN_LIMIT_PER_IP: '6', SIGN_IN_LIMIT_WINDOW_SECONDS: '600' };
  beforeAll(async () => {
    a = await startTestApp({ env: limits });
    b = await startTestApp({ seed: false, databaseUrl: a.config.databaseUrl, env: limits });
  });
  afterAll(async () => {
    await b?.close();
    await a?.close();
  });

  // Each test its own client address (trusted only from loopback, as a local proxy would send it).
  const signIn = (app: TestApp, ip: string, email: string, password = 'wrong-password-1') =>
    request(app.app).post('/api/auth/sign-in').set('X-Forwarded-For', ip).send({ email, password });

  it('answers 429 with Retry-After to the fourth try at one address, whichever process gets it', async () => {
    const ip = '198.51.100.10';
    expect((await signIn(a, ip, builder.email)).status).toBe(401);
    expect((await signIn(b, ip, builder.email)).status).toBe(401);
    expect((await signIn(a, ip, builder.email)).status).toBe(401);
    const limited = await signIn(b, ip, builder.email);
    expect(limited.status).toBe(429);
    const retryAfter = Number(limited.headers['retry-after']);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(600);
    expect(limited.body.error).toMatchObject({ code: 'rate_limited', requestId: limited.headers['x-request-id'] });
    expect(limited.body.error.message).toMatch(/too many sign-in attempts: try again in \d+ minutes/);
    // The right password does not get past it either, nor the address written in capitals, from either process.
    expect((await signIn(a, ip, builder.email, DEMO_PASSWORD)).status).toBe(429);
    expect((await signIn(b, '198.51.100.11', builder.email.toUpperCase(), DEMO_PASSWORD)).status).toBe(429);
    // Another address is not held back by this one's limit.
    expect((await signIn(a, ip, supplier.email, DEMO_PASSWORD)).status).toBe(200);
  });

  it('answers 429 after the limit per client address, whatever addresses it tries', async () => {
    const ip = '203.0.113.7';
    const tries = [
      supplier.email,
      inspector.email,
      admin.email,
      'nobody-1@example.com',
      'nobody-2@example.com',
      'nobody-3@example.com',
    ];
    for (const [i, email] of tries.entries()) expect((await signIn(i % 2 ? b : a, ip, email)).status).toBe(401);
    const limited = await signIn(b, ip, 'nobody-4@example.com');
    expect(limited.status).toBe(429);
    expect(Number(limited.headers['retry-after'])).toBeGreaterThan(0);
    // Another client is still served.
    expect((await signIn(a, '203.0.113.8', inspector.email, DEMO_PASSWORD)).status).toBe(200);
  });

  it('keeps no e-mail address in its table, only hashes of them', async () => {
    const { rows } = await a.database.pool.query<{ key: string }>('select key from rate_limits');
    expect(rows.length).toBeGreaterThan(0);
    for (const { key } of rows) expect(key).toMatch(/^sign-in-(ip|address):[A-Za-z0-9_-]{43}$/);
  });
});

describe('the private PostgreSQL cluster', () => {
  const url = new URL(process.env.TEST_DATABASE_URL!);
  const target = {
    host: '127.0.0.1',
    port: Number(url.port || 5432),
    user: decodeURIComponent(url.username || 'postgres'),
    database: 'postgres',
  };

  it('refuses a connection without the password', async () => {
    const saved = process.env.PGPASSWORD;
    delete process.env.PGPASSWORD; // node-postgres would fall back to it
    try {
      const client = new Client({ ...target, connectionTimeoutMillis: 5000 });
      client.on('error', () => undefined);
      await expect(client.connect()).rejects.toThrow(/password/i);
      await client.end().catch(() => undefined);
    } finally {
      if (saved !== undefined) process.env.PGPASSWORD = saved;
    }
  });

  it('refuses a wrong password, and accepts the one scripts/pg.sh keeps', async () => {
    const wrong = new Client({ ...target, password: 'not-the-password', connectionTimeoutMillis: 5000 });
    wrong.on('error', () => undefined);
    await expect(wrong.connect()).rejects.toMatchObject({ code: '28P01' });
    await wrong.end().catch(() => undefined);
    expect(url.password).not.toBe('');
    const right = new Client({ ...target, password: decodeURIComponent(url.password), connectionTimeoutMillis: 5000 });
    await right.connect();
    expect((await right.query('select 1 as one')).rows[0].one).toBe(1);
    await right.end();
  });
});

describe('configuration', () => {
  const base = { DATABASE_URL: 'postgres://x@127.0.0.1/x' };
  it('refuses a JWT secret shorter than 32 characters in production, naming the variable', () => {
    expect(() => loadConfig({ ...base, NODE_ENV: 'production', JWT_SECRET: 'x'.repeat(31) })).toThrow(
      /JWT_SECRET: .*32 characters in production/,
    );
    expect(loadConfig({ ...base, NODE_ENV: 'production', JWT_SECRET: 'x'.repeat(32) }).jwtSecret).toHaveLength(32);
    expect(loadConfig({ ...base, NODE_ENV: 'development', JWT_SECRET: 'x'.repeat(20) }).jwtSecret).toHaveLength(20);
  });

  it('has sign-in limits that hold by default', () => {
    const c = loadConfig({ ...base, NODE_ENV: 'development', JWT_SECRET: 'x'.repeat(32) });
    expect(c.rateLimits.signIn).toEqual({ perAddress: 10, perIp: 50, windowSeconds: 900 });
  });
});

describe('photo files that no row points to', () => {
  const hoursAgo = (h: number) => new Date(Date.now() - h * 3600_000);

  it('are removed after the grace period; recent ones, recorded ones and other files stay', async () => {
    const recorded = await t.database.db
      .select({ fileKey: findingPhotos.fileKey, thumbKey: findingPhotos.thumbKey })
      .from(findingPhotos);
    expect(recorded.length).toBeGreaterThan(0); // the demo's flagged hole has a photo
    const recordedKeys = recorded.flatMap((r) => [r.fileKey, r.thumbKey]);
    // Everything old, so that only the missing row decides.
    for (const key of recordedKeys) await utimes(path.join(t.uploadsDir, key), hoursAgo(3), hoursAgo(3));

    const orphanOld = `${randomUUID()}.jpg`;
    const orphanNew = `${randomUUID()}.jpg`;
    const notOurs = 'notes.txt';
    for (const name of [orphanOld, orphanNew, notOurs])
      await writeFile(path.join(t.uploadsDir, name), 'left behind by a crash');
    await utimes(path.join(t.uploadsDir, orphanOld), hoursAgo(2), hoursAgo(2));
    await utimes(path.join(t.uploadsDir, notOurs), hoursAgo(2), hoursAgo(2));
    await utimes(path.join(t.uploadsDir, orphanNew), hoursAgo(0.5), hoursAgo(0.5));

    const result = await sweepOrphanPhotos({ db: t.database.db, storage: t.ctx.storage, graceSeconds: 3600 });
    expect(result.removed).toEqual([orphanOld]);
    const left = await readdir(t.uploadsDir);
    expect(left).not.toContain(orphanOld);
    expect(left).toEqual(expect.arrayContaining([...recordedKeys, orphanNew, notOurs]));

    // The recorded photo is still served.
    const tok = await t.signIn(inspector.email);
    const findings = await request(t.app).get('/api/findings').set(auth(tok));
    expect(findings.status).toBe(200);
  });
});

describe('scripts/supervise.sh', () => {
  const script = path.join(__dirname, '..', '..', 'scripts', 'supervise.sh');
  /** Runs the supervisor on a small node program; bounded by `ms`. */
  function supervise(
    program: string,
    env: Record<string, string>,
    ms = 20_000,
    onStart?: (p: ReturnType<typeof spawn>) => void,
  ) {
    return new Promise<{ code: number | null; out: string }>((resolve, reject) => {
      const p = spawn('bash', [script, process.execPath, '-e', program], {
        env: { ...process.env, SUPERVISE_BACKOFF_SECONDS: '0', ...env },
      });
      let out = '';
      p.stdout.on('data', (d) => {
        out += d;
        onStart?.(p);
      });
      p.stderr.on('data', (d) => {
        out += d;
      });
      const timer = setTimeout(() => {
        p.kill('SIGKILL');
        reject(new Error(`supervisor still running after ${ms} ms:\n${out}`));
      }, ms);
      p.on('close', (code) => {
        clearTimeout(timer);
        resolve({ code, out });
      });
    });
  }

  it('starts a server that died again, and gives up after a few quick crashes in a row, saying so', async () => {
    const { code, out } = await supervise('console.log("started"); process.exit(3)', { SUPERVISE_MAX_CRASHES: '3' });
    expect(out.match(/started/g)).toHaveLength(3);
    expect(out).toMatch(/exited with code 3 3 times in a row.*giving up/);
    expect(code).toBe(3);
  });

  it('does not restart a server whose configuration is wrong (exit 78)', async () => {
    const { code, out } = await supervise('console.log("started"); process.exit(78)', {});
    expect(out.match(/started/g)).toHaveLength(1);
    expect(code).toBe(78);
  });

  it('passes SIGTERM on to the server, lets it drain, and stops', async () => {
    const program =
      'process.on("SIGTERM", () => { console.log("drained"); process.exit(0); }); console.log("up"); setInterval(() => {}, 1000);';
    let sent = false;
    const { code, out } = await supervise(program, {}, 20_000, (p) => {
      if (!sent) {
        sent = true;
        p.kill('SIGTERM');
      }
    });
    expect(out).toContain('drained');
    expect(out.match(/up/g)).toHaveLength(1);
    expect(code).toBe(0);
  });
});
