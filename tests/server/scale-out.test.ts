import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { mkdtemp, readdir, rm } from 'node:fs/promises';
import { createServer } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { GetObjectCommand, ListObjectsV2Command, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import { createDatabase, type Database } from '@/db';
import { DEMO_PASSWORD, DEMO_USERS } from '@/server/dev/seed';
import { findingEvents, findingPhotos, sentMails } from '@/db/schema';
import { sweepOrphanPhotos } from '@/server/jobs/photo-sweep';
import { startSmtpFake, type SmtpFake } from '@/server/mail/smtp-fake';
import { openPhotoStorage } from '@/server/storage/open-photo-storage';
import { s3PhotoStorage } from '@/server/storage/s3-photo-storage';
import { createTestDatabase } from '../helpers/test-database';

/**
 * Scale-out on one database and one object store: two API processes of the compiled server (consumers
 * off, RUN_JOBS=0) and one `worker` process, each a plain `node` child, photos in an S3 fake (s3rver,
 * a process of its own too).
 * A photo uploaded through one API is served by the other from the bucket, and the finding's mail is
 * sent once, by the worker.
 */
jest.setTimeout(300_000);

const root = path.join(__dirname, '..', '..');
// Built here, not in build/: a running production copy there is left alone.
const buildDir = path.join(root, '.cache', 'scale-out-build');
const BUCKET = 'pitchcard-photos';
const PREFIX = 'photos/';
// s3rver accepts only this key pair (its README).
const S3_KEY = 'S3RVER';

type Proc = {
  name: string;
  child: ChildProcess;
  output: string[];
  exited: { code: number | null; signal: string | null } | null;
};

const freePort = () =>
  new Promise<number>((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const a = s.address();
      s.close(() => resolve(typeof a === 'object' && a ? a.port : 0));
    });
  });

/** A child process whose output is kept (the last lines) for the failure message. */
function spawnProc(name: string, args: string[], env: NodeJS.ProcessEnv): Proc {
  // A minimal environment: nothing of this machine's (AWS_PROFILE, NODE_OPTIONS…) leaks into the children.
  const child = spawn(process.execPath, args, {
    cwd: root,
    env: { PATH: process.env.PATH ?? '', HOME: os.tmpdir(), ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const p: Proc = { name, child, output: [], exited: null };
  const keep = (chunk: Buffer) => {
    p.output.push(chunk.toString());
    if (p.output.length > 400) p.output.shift();
  };
  child.stdout!.on('data', keep);
  child.stderr!.on('data', keep);
  child.on('exit', (code, signal) => {
    p.exited = { code, signal };
  });
  return p;
}

const start = (name: string, entry: 'index' | 'worker', env: NodeJS.ProcessEnv) =>
  spawnProc(name, [path.join(buildDir, 'server', `${entry}.js`)], env);

const logsOf = (procs: Proc[]) =>
  procs
    .map(
      (p) =>
        `--- ${p.name}${p.exited ? ` (exited ${p.exited.code ?? p.exited.signal})` : ''}:\n${p.output.join('').slice(-3000)}`,
    )
    .join('\n');

/** Polls `probe` until it returns a value, at most `ms`; a child that died meanwhile fails at once. */
async function waitFor<T>(what: string, probe: () => Promise<T | undefined>, procs: Proc[], ms = 60_000): Promise<T> {
  const end = Date.now() + ms;
  while (Date.now() < end) {
    const dead = procs.find((p) => p.exited);
    if (dead) throw new Error(`${dead.name} stopped while waiting for ${what}\n${logsOf(procs)}`);
    const v = await probe().catch(() => undefined);
    if (v !== undefined) return v;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`no ${what} within ${ms} ms\n${logsOf(procs)}`);
}

async function stop(p: Proc): Promise<void> {
  if (p.exited) return;
  const gone = new Promise<void>((resolve) => p.child.once('exit', () => resolve()));
  p.child.kill('SIGTERM');
  // Drained within 15 s, else killed: the suite never waits on a stuck child.
  const timer = setTimeout(() => p.child.kill('SIGKILL'), 15_000);
  await gone;
  clearTimeout(timer);
}

/**
 * s3rver on loopback in a process of its own, the bucket made. Its continuation tokens are DES-encrypted,
 * a cipher OpenSSL 3 keeps in its legacy provider: without that flag a listing of more than a page fails.
 */
async function startS3Fake(dir: string): Promise<{ proc: Proc; endpoint: string }> {
  const proc = spawnProc(
    's3rver',
    [
      '--openssl-legacy-provider',
      require.resolve('s3rver/bin/s3rver.js'),
      '-d',
      dir,
      '-a',
      '127.0.0.1',
      '-p',
      '0',
      '-s',
      '--configure-bucket',
      BUCKET,
    ],
    { NODE_ENV: 'test' },
  );
  const port = await waitFor(
    's3rver to listen',
    async () => proc.output.join('').match(/listening on 127\.0\.0\.1:(\d+)/)?.[1],
    [proc],
    30_000,
  );
  return { proc, endpoint: `http://127.0.0.1:${port}` };
}

describe('two API processes and one worker on one database and one object store', () => {
  let testDb: { url: string; drop: () => Promise<void> };
  let database: Database;
  let s3Dir: string;
  let s3Client: S3Client;
  let workerRelay: SmtpFake;
  let apiRelay: SmtpFake;
  let uploadsDir: string;
  const procs: Proc[] = [];
  const api: string[] = [];

  beforeAll(async () => {
    const built = spawnSync('bash', [path.join(root, 'scripts', 'build-server.sh'), buildDir], {
      cwd: root,
      encoding: 'utf8',
      timeout: 240_000,
    });
    if (built.status !== 0) throw new Error(`the server did not compile:\n${built.stdout}\n${built.stderr}`);

    testDb = await createTestDatabase();
    database = createDatabase(testDb.url);
    s3Dir = await mkdtemp(path.join(os.tmpdir(), 'pc-s3-'));
    const s3 = await startS3Fake(s3Dir);
    procs.push(s3.proc);
    const endpoint = s3.endpoint;
    s3Client = new S3Client({
      endpoint,
      region: 'us-east-1',
      forcePathStyle: true,
      credentials: { accessKeyId: S3_KEY, secretAccessKey: S3_KEY },
    });
    // The worker's relay is the only one that should ever get mail; the APIs get one of their own to
    // show that they send none.
    workerRelay = await startSmtpFake(0);
    apiRelay = await startSmtpFake(0);
    // Every process gets this folder as its local store: it must stay empty, the photos going to the bucket.
    uploadsDir = await mkdtemp(path.join(os.tmpdir(), 'pc-scale-uploads-'));

    const shared = {
      NODE_ENV: 'production' as const,
      DATABASE_URL: testDb.url,
      JWT_SECRET: randomBytes(32).toString('base64url'),
      LOG_LEVEL: 'warn',
      UPLOADS_DIR: uploadsDir,
      WEB_DIST: path.join(uploadsDir, 'no-web'),
      PHOTO_STORE: 's3',
      S3_ENDPOINT: endpoint,
      S3_BUCKET: BUCKET,
      S3_REGION: 'us-east-1',
      S3_PREFIX: PREFIX,
      S3_ACCESS_KEY_ID: S3_KEY,
      S3_SECRET_ACCESS_KEY: S3_KEY,
    };
    const ports = [await freePort(), await freePort()];
    for (const [i, port] of ports.entries()) {
      api.push(`http://127.0.0.1:${port}`);
      // The first API loads the demo (its mails are queued for the worker too); the second starts on it.
      procs.push(
        start(`api ${i + 1}`, 'index', {
          ...shared,
          PORT: String(port),
          HOST: '127.0.0.1',
          PUBLIC_URL: api[i],
          RUN_JOBS: '0',
          SMTP_PORT: String(apiRelay.port),
          ...(i === 0 ? { SEED_DEMO: '1' } : {}),
        }),
      );
      await waitFor(
        `health of api ${i + 1}`,
        async () => ((await fetch(`${api[i]}/api/health`)).ok ? true : undefined),
        procs,
        120_000,
      );
    }
    const worker = start('worker', 'worker', { ...shared, SMTP_PORT: String(workerRelay.port) });
    procs.push(worker);
    await waitFor(
      'the worker to start',
      async () => (worker.output.join('').includes('worker is up') ? true : undefined),
      procs,
    );
  });

  afterAll(async () => {
    await Promise.all(procs.map(stop));
    s3Client?.destroy();
    await workerRelay?.close();
    await apiRelay?.close();
    await database?.close();
    await testDb?.drop();
    for (const dir of [s3Dir, uploadsDir]) if (dir) await rm(dir, { recursive: true, force: true });
  });

  const json = async (url: string, init: RequestInit = {}) => {
    const res = await fetch(url, init);
    const body = await res.json();
    if (!res.ok) throw new Error(`${init.method ?? 'GET'} ${url}: ${res.status} ${JSON.stringify(body)}`);
    return body;
  };

  it('serves through API 2 the photo uploaded through API 1, and the worker alone sends its mail, once', async () => {
    const { token } = await json(`${api[0]}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: DEMO_USERS.builder.email, password: DEMO_PASSWORD }),
    });
    const auth = { Authorization: `Bearer ${token}` };
    const {
      items: [first],
    } = await json(`${api[0]}/api/travelers`, { headers: auth });
    const traveler = await json(`${api[0]}/api/travelers/${first.id}`, { headers: auth });
    const hole = traveler.holes.find((h: { status: string }) => h.status === 'pending');

    const photo = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#707478' } })
      .jpeg()
      .toBuffer();
    const form = new FormData();
    form.append('travelerId', traveler.id);
    form.append('holeIds', JSON.stringify([hole.holeId]));
    form.append('kind', 'hole_cracked');
    form.append('note', 'crack from the edge of the hole');
    form.append('photos', new Blob([new Uint8Array(photo)], { type: 'image/jpeg' }), 'crack.jpg');
    const created = await fetch(`${api[0]}/api/findings`, { method: 'POST', headers: auth, body: form });
    const finding = await created.json();
    expect(created.status).toBe(201);
    expect(finding.photos).toHaveLength(1);

    // The link API 1 signed, opened on API 2: same secret, same bucket.
    const served = await fetch(`${api[1]}${finding.photos[0].url}`);
    expect(served.status).toBe(200);
    expect(served.headers.get('content-type')).toBe('image/jpeg');
    const bytes = Buffer.from(await served.arrayBuffer());
    // A JPEG starts with the SOI marker FF D8 (ITU-T T.81, B.1.1.3).
    expect([...bytes.subarray(0, 2)]).toEqual([0xff, 0xd8]);
    const meta = await sharp(bytes).metadata();
    expect([meta.width, meta.height]).toEqual([finding.photos[0].width, finding.photos[0].height]);
    // The bytes are the object that API 1 put in the bucket under the row's key, and nothing went to a local folder.
    const [row] = await database.db.select().from(findingPhotos).where(eq(findingPhotos.findingId, finding.id));
    const object = await s3Client.send(new GetObjectCommand({ Bucket: BUCKET, Key: `${PREFIX}${row.fileKey}` }));
    expect(Buffer.from(await object.Body!.transformToByteArray()).equals(bytes)).toBe(true);
    expect(await readdir(uploadsDir)).toEqual([]);

    // The mail job of the raise, done on its first attempt.
    const [event] = await database.db.select().from(findingEvents).where(eq(findingEvents.findingId, finding.id));
    const job = await waitFor(
      'the mail job to complete',
      async () => {
        const r = await database.pool.query(
          `select state, retry_count from pgboss.job where name = 'finding-mail' and data->>'eventId' = $1`,
          [event.id],
        );
        return r.rows[0]?.state === 'completed' ? r.rows[0] : undefined;
      },
      procs,
    );
    expect(job.retry_count).toBe(0);
    const link = `/findings/${finding.id}`;
    const toInspector = workerRelay.messages.filter(
      (m) => m.to.includes(DEMO_USERS.inspector.email) && m.text.includes(link),
    );
    expect(toInspector).toHaveLength(1);
    // The worker read the thumbnail from the bucket: the mail carries it inline.
    const thumb = Buffer.from(await (await fetch(`${api[1]}${finding.photos[0].thumbUrl}`)).arrayBuffer());
    expect(toInspector[0].parts.map((p) => p.content.equals(thumb))).toEqual([true]);
    const sent = await database.db
      .select()
      .from(sentMails)
      .where(and(eq(sentMails.eventId, event.id), eq(sentMails.recipient, DEMO_USERS.inspector.email)));
    expect(sent).toHaveLength(1);
    // Every mail of this finding, to anyone, went out once: one relay message per recorded mail.
    const allOfIt = workerRelay.messages.filter((m) => m.text.includes(link));
    const recorded = await database.db.select().from(sentMails).where(eq(sentMails.eventId, event.id));
    expect(allOfIt.flatMap((m) => m.to).sort()).toEqual(recorded.map((r) => r.recipient).sort());

    // Once the queue is empty (the demo's mails too), the APIs have sent nothing themselves.
    await waitFor(
      'the mail queue to empty',
      async () => {
        const r = await database.pool.query(
          `select count(*)::int as n from pgboss.job where name = 'finding-mail' and state in ('created', 'retry', 'active')`,
        );
        return r.rows[0].n === 0 ? true : undefined;
      },
      procs,
    );
    expect(apiRelay.messages).toHaveLength(0);
    expect(workerRelay.messages.length).toBeGreaterThan(toInspector.length);
  });

  it('ends a sign-in on every API process: at once on the one that ended it, on the other once its second is up', async () => {
    const { token } = await json(`${api[0]}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: DEMO_USERS.inspector.email, password: DEMO_PASSWORD }),
    });
    const auth = { Authorization: `Bearer ${token}` };
    const me = (i: number) => fetch(`${api[i]}/api/auth/me`, { headers: auth }).then((r) => r.status);
    // Both processes have read the inspector (API 2 keeps the row for a second: server/auth/session-cache.ts).
    expect([await me(0), await me(1)]).toEqual([200, 200]);
    const out = await fetch(`${api[0]}/api/auth/sign-out-everywhere`, { method: 'POST', headers: auth });
    expect(out.status).toBeLessThan(300);
    expect(await me(0)).toBe(401);
    await new Promise((r) => setTimeout(r, 1200));
    expect(await me(1)).toBe(401);
  });
});

describe('the S3 photo store', () => {
  let s3: Proc;
  let s3Dir: string;
  let endpoint: string;
  let testDb: { url: string; drop: () => Promise<void> };
  let database: Database;
  const options = () => ({
    bucket: BUCKET,
    region: 'us-east-1',
    endpoint,
    forcePathStyle: true,
    prefix: PREFIX,
    credentials: { accessKeyId: S3_KEY, secretAccessKey: S3_KEY },
  });

  beforeAll(async () => {
    s3Dir = await mkdtemp(path.join(os.tmpdir(), 'pc-s3-'));
    ({ proc: s3, endpoint } = await startS3Fake(s3Dir));
    testDb = await createTestDatabase();
    database = createDatabase(testDb.url);
  });
  afterAll(async () => {
    if (s3) await stop(s3);
    await database?.close();
    await testDb?.drop();
    if (s3Dir) await rm(s3Dir, { recursive: true, force: true });
  });

  it('keeps, lists page by page, reads and removes its own keys, and leaves other objects in the bucket alone', async () => {
    const store = s3PhotoStorage(options());
    const other = new S3Client({
      endpoint,
      region: 'us-east-1',
      forcePathStyle: true,
      credentials: { accessKeyId: S3_KEY, secretAccessKey: S3_KEY },
    });
    try {
      // Objects that are not ours: outside the prefix, and under it with a name we never make.
      await other.send(new PutObjectCommand({ Bucket: BUCKET, Key: 'backups/db.dump', Body: Buffer.from('x') }));
      await other.send(new PutObjectCommand({ Bucket: BUCKET, Key: `${PREFIX}README.txt`, Body: Buffer.from('x') }));
      const keys: string[] = [];
      for (let i = 0; i < 5; i++) keys.push(await store.put(Buffer.from([0xff, 0xd8, i]), 'jpg'));
      // ListObjectsV2 pages at most MaxKeys objects and continues with a token (S3 API reference).
      const pages: string[][] = [];
      for await (const page of store.list(2)) pages.push(page.map((f) => f.key));
      expect(pages.flat().sort()).toEqual([...keys].sort());
      expect(pages.length).toBeGreaterThanOrEqual(3);
      expect(pages.every((p) => p.length <= 2)).toBe(true);
      expect([...(await store.get(keys[3]))]).toEqual([0xff, 0xd8, 3]);
      await expect(store.get('../backups/db.dump')).rejects.toThrow(/not a storage key/);

      // The sweep with no row pointing at any photo, run as if an hour and more had passed: ours go, the rest stay.
      const { removed } = await sweepOrphanPhotos({
        db: database.db,
        storage: store,
        graceSeconds: 60,
        now: new Date(Date.now() + 3600_000),
      });
      expect(removed.sort()).toEqual([...keys].sort());
      await expect(store.get(keys[0])).rejects.toMatchObject({ code: 'ENOENT' });
      const left = await other.send(new ListObjectsV2Command({ Bucket: BUCKET }));
      expect((left.Contents ?? []).map((o) => o.Key).sort()).toEqual(['backups/db.dump', `${PREFIX}README.txt`]);
    } finally {
      store.close();
      other.destroy();
    }
  });

  it('refuses to start on a bucket that does not exist, naming it', async () => {
    // HeadBucket answers 404 for a missing bucket (S3 API reference).
    await expect(
      openPhotoStorage({ uploadsDir: s3Dir, photoStore: { kind: 's3', ...options(), bucket: 'no-such-bucket' } }),
    ).rejects.toThrow(/bucket no-such-bucket at http:\/\/127\.0\.0\.1:\d+ does not exist/);
    const opened = await openPhotoStorage({ uploadsDir: s3Dir, photoStore: { kind: 's3', ...options() } });
    opened.close();
    expect(opened.where).toBe(`bucket ${BUCKET} at ${endpoint}`);
  });
});
