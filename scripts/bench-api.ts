/**
 * npm run bench:api — how close the API comes to a bare floor on the requests a bench and a review
 * queue make most: a part's page (GET /api/travelers/:id), a tick (POST /api/travelers/:id/holes) and
 * the first page of the open findings (GET /api/findings?status=open&limit=50), at 500 and 5,000 findings.
 *
 * The floor is a plain Express 5 + pg server on 127.0.0.1 that runs the very SQL the product ran for the
 * same request (captured from the product's pool while it answered it once), with no auth beyond a
 * constant-time token check and no shaping beyond res.json of the rows. The ratio product / floor is then
 * what the product adds: token check and person lookup, routing, validation, the ORM, shaping.
 *
 * A timing is a measurement, not a test: this prints p50/p95 and ratios against the targets (≤ 1.3× for
 * the part's page and the tick, ≤ 1.5× for the queue page) rather than failing.
 * It runs a private PostgreSQL cluster (scripts/pg.sh, name bench-api, port BENCH_PGPORT or 54351),
 * stopped again at the end if it started it. The demo data is seeded through the product's services;
 * findings are then multiplied in SQL from the one the seed raised (each with its photo row), since
 * raising 5,000 through the API would re-encode 5,000 photos. Traffic goes to 127.0.0.1 only.
 * BENCH_REQUESTS (300, at most 2000) timed requests per case after BENCH_WARM_UP (50); a row stops early at BENCH_ROW_SECONDS
 * (45) with the requests it timed (the count is printed), and the whole run at 10 minutes.
 */
import { timingSafeEqual } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import { Pool, type PoolClient, type QueryConfig } from 'pg';
import { sql } from 'drizzle-orm';
import { DEMO_USERS } from '../server/dev/seed';
import { startTestApp } from '../tests/helpers/test-app';
import { pg } from './bench-common';

const REQUESTS = Math.min(2000, Math.max(20, Number(process.env.BENCH_REQUESTS ?? 300) || 300));
const WARM_UP = Math.min(500, Math.max(5, Number(process.env.BENCH_WARM_UP ?? 50) || 50));
const CONCURRENCY = 4;
const TIME_LIMIT_MS = 600_000;
/** Each row (one case at one concurrency) stops after this long, with what it measured so far. */
const ROW_LIMIT_MS = Math.min(120_000, Math.max(5_000, Number(process.env.BENCH_ROW_SECONDS ?? 45) * 1000 || 45_000));
const PG_NAME = 'bench-api';
const PG_PORT = process.env.BENCH_PGPORT ?? '54351';
const FLOOR_TOKEN = 'floor-token-0123456789abcdef0123456789abcdef';

const pct = (xs: number[], p: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil((p / 100) * s.length) - 1))];
};

/** A statement as the product ran it; `name` when it ran as a named prepared statement, which the floor then does too. */
type Captured = { text: string; values: unknown[]; rowMode?: 'array'; name?: string; viaClient: boolean };

/** Records every statement the product's pool runs (pool.query and transaction clients alike) while `on`. */
function captureOn(pool: Pool) {
  const log: Captured[] = [];
  let on = false;
  const record = (viaClient: boolean, a: unknown, b: unknown) => {
    if (!on) return;
    if (typeof a === 'string') log.push({ text: a, values: (b as unknown[]) ?? [], viaClient });
    else if (a && typeof a === 'object' && 'text' in a) {
      const c = a as QueryConfig & { rowMode?: 'array' };
      log.push({
        text: c.text,
        values: (b as unknown[]) ?? c.values ?? [],
        rowMode: c.rowMode,
        name: c.name,
        viaClient,
      });
    }
  };
  const wrapped = new WeakSet<PoolClient>();
  const wrap = (client: PoolClient) => {
    if (!wrapped.has(client)) {
      wrapped.add(client);
      const q = client.query.bind(client) as (...a: unknown[]) => unknown;
      (client as unknown as { query: unknown }).query = (a: unknown, b?: unknown, c?: unknown) => {
        record(true, a, b);
        return q(a, b, c);
      };
    }
    return client;
  };
  // Every statement goes through a client: pool.query takes one through connect(callback), a transaction through connect().
  const connect = pool.connect.bind(pool) as (
    cb?: (err: Error | undefined, c: PoolClient | undefined, done: () => void) => void,
  ) => Promise<PoolClient> | void;
  (pool as unknown as { connect: unknown }).connect = (
    cb?: (err: Error | undefined, c: PoolClient | undefined, done: () => void) => void,
  ) => {
    if (cb) return connect((err, client, done) => cb(err, client && wrap(client), done));
    return (connect() as Promise<PoolClient>).then(wrap);
  };
  return {
    async during(work: () => Promise<unknown>): Promise<Captured[]> {
      log.length = 0;
      on = true;
      try {
        await work();
      } finally {
        on = false;
      }
      return [...log];
    },
  };
}

/** The person's own row, which the floor skips: it has no sign-in beyond the constant-time token check. */
const isSessionLookup = (c: Captured) =>
  /"session_version"/.test(c.text) && /from "users"/.test(c.text) && !/update/i.test(c.text);

/** The floor: Express 5 + pg, the captured SQL of a request replayed as the product ran it (side by side, or as one transaction). */
function startFloor(
  url: string,
  scripts: Record<string, { mode: 'parallel' | 'sequential' | 'transaction'; variants: Captured[][] }>,
) {
  const pool = new Pool({ connectionString: url, max: 10 });
  const app = express();
  const want = Buffer.from(`Bearer ${FLOOR_TOKEN}`);
  const counters: Record<string, number> = {};
  app.use((req, res, next) => {
    const got = Buffer.from(req.headers.authorization ?? '');
    if (got.length !== want.length || !timingSafeEqual(got, want)) {
      res.status(401).json({ error: 'sign in first' });
      return;
    }
    next();
  });
  app.use(express.json());
  const run = (name: string) => async (_req: express.Request, res: express.Response) => {
    const script = scripts[name];
    const i = (counters[name] = ((counters[name] ?? -1) + 1) % script.variants.length);
    const statements = script.variants[i];
    const q = (c: Captured, on: Pool | PoolClient) =>
      on.query({ name: c.name, text: c.text, values: c.values, rowMode: c.rowMode } as QueryConfig);
    if (script.mode === 'parallel') {
      res.json((await Promise.all(statements.map((c) => q(c, pool)))).map((r) => r.rows));
    } else if (script.mode === 'sequential') {
      const out = [];
      for (const c of statements) out.push((await q(c, pool)).rows);
      res.json(out);
    } else {
      const client = await pool.connect();
      try {
        const out = [];
        for (const c of statements) out.push((await q(c, client)).rows);
        res.json(out);
      } finally {
        client.release();
      }
    }
  };
  app.get('/detail', run('detail'));
  app.post('/tick', run('tick'));
  app.get('/queue', run('queue'));
  const server = createServer(app);
  return {
    server,
    pool,
    listen: () =>
      new Promise<string>((resolve) =>
        server.listen(0, '127.0.0.1', () => resolve(`http://127.0.0.1:${(server.address() as AddressInfo).port}`)),
      ),
  };
}

async function main() {
  const deadline = Date.now() + TIME_LIMIT_MS;
  // The bench's own cluster: started here and stopped at the end, even when an interrupted run left it up.
  pg('start', PG_NAME, PG_PORT, 'test');
  const stopCluster = () => pg('stop', PG_NAME, PG_PORT);
  process.env.TEST_DATABASE_URL = pg('url', PG_NAME, PG_PORT);

  const t = await startTestApp();
  let product: Server | undefined;
  let floor: ReturnType<typeof startFloor> | undefined;
  try {
    product = createServer(t.app);
    await new Promise<void>((resolve) => product!.listen(0, '127.0.0.1', resolve));
    const base = `http://127.0.0.1:${(product.address() as AddressInfo).port}`;
    const builder = await t.signIn(DEMO_USERS.builder.email);
    const inspector = await t.signIn(DEMO_USERS.inspector.email);
    const call = async (url: string, token: string, init: { method?: string; body?: unknown } = {}) => {
      const res = await fetch(url, {
        method: init.method ?? 'GET',
        body: init.body === undefined ? undefined : JSON.stringify(init.body),
        // identity: the floor has no compression; gzip on the product would add work the floor does not do.
        headers: {
          authorization: `Bearer ${token}`,
          'content-type': 'application/json',
          'accept-encoding': 'identity',
        },
        signal: AbortSignal.timeout(30_000),
      });
      const text = await res.text();
      if (res.status !== 200)
        throw new Error(`${init.method ?? 'GET'} ${url} answered ${res.status}: ${text.slice(0, 200)}`);
      return text;
    };

    // The demo's part with its holes and the one finding the seed raised.
    const list = JSON.parse(await call(`${base}/api/travelers?q=W-104&limit=10`, builder)) as {
      items: { id: string; partNumber: string; holesTotal: number }[];
    };
    const part = list.items.find((p) => p.partNumber === 'W-104')!;
    const detail = JSON.parse(await call(`${base}/api/travelers/${part.id}`, builder)) as {
      holes: { holeId: string; status: string }[];
    };
    // Two holes the product ticks back and forth, two others the floor's captured statements tick: neither undoes the other's.
    const pending = detail.holes.filter((h) => h.status === 'pending').map((h) => h.holeId);
    const run = pending.slice(0, 2);
    const floorRun = pending.slice(2, 4);

    // Findings: the seed's one, multiplied in SQL to `n` with its photo row, one a minute back in time.
    const db = t.database.db;
    async function findingsUpTo(n: number) {
      const cols = (
        await db.execute(sql`select column_name from information_schema.columns
        where table_name = 'findings' and column_name not in ('id', 'created_at', 'updated_at') order by ordinal_position`)
      ).rows
        .map((r) => `"${(r as { column_name: string }).column_name}"`)
        .join(', ');
      const photoCols = (
        await db.execute(sql`select column_name from information_schema.columns
        where table_name = 'finding_photos' and column_name not in ('id', 'finding_id') order by ordinal_position`)
      ).rows
        .map((r) => `"${(r as { column_name: string }).column_name}"`)
        .join(', ');
      const have = Number(
        ((await db.execute(sql`select count(*)::int as n from findings`)).rows[0] as { n: number }).n,
      );
      if (n <= have) return;
      await db.execute(
        sql.raw(`with src as (select * from findings order by created_at limit 1),
        made as (insert into findings (${cols}, created_at, updated_at)
          select ${cols
            .split(', ')
            .map((c) => `src.${c}`)
            .join(', ')}, now() - (g * interval '1 minute'), now() - (g * interval '1 minute')
          from src, generate_series(${have}, ${n - 1}) g returning id)
        insert into finding_photos (finding_id, ${photoCols})
        select made.id, ${photoCols
          .split(', ')
          .map((c) => `p.${c}`)
          .join(', ')} from made,
          (select * from finding_photos where finding_id = (select id from src) order by created_at limit 1) p`),
      );
      await db.execute(sql`analyze`);
    }

    const capture = captureOn(t.database.pool);
    const detailUrl = `${base}/api/travelers/${part.id}`;
    const tickUrl = `${base}/api/travelers/${part.id}/holes`;
    const queueUrl = `${base}/api/findings?status=open&limit=50`;
    const tickBody = (i: number) => ({ holeIds: run, status: i % 2 ? 'pending' : 'installed' });

    console.error("  seeded; capturing the product's SQL");
    const stripAuth = (cs: Captured[]) => cs.filter((c) => !isSessionLookup(c));
    const detailSql = stripAuth(await capture.during(() => call(detailUrl, builder)));
    const tickSql = [
      stripAuth(
        await capture.during(() =>
          call(tickUrl, builder, { method: 'POST', body: { holeIds: floorRun, status: 'installed' } }),
        ),
      ),
      stripAuth(
        await capture.during(() =>
          call(tickUrl, builder, { method: 'POST', body: { holeIds: floorRun, status: 'pending' } }),
        ),
      ),
    ];

    const scripts: Parameters<typeof startFloor>[1] = {
      detail: { mode: 'parallel', variants: [detailSql] },
      tick: { mode: 'transaction', variants: tickSql },
      // The queue's statements are captured once its findings are there (below).
      queue: { mode: 'sequential', variants: [] },
    };
    floor = startFloor(t.config.databaseUrl, scripts);
    const floorBase = await floor.listen();

    type Case = { name: string; product: (i: number) => Promise<unknown>; floor: (i: number) => Promise<unknown> };
    async function measure(c: Case, concurrency: number) {
      const times = { product: [] as number[], floor: [] as number[] };
      for (let i = 0; i < WARM_UP; i++) {
        await c.product(i);
        await c.floor(i);
      }
      const rowEnd = Date.now() + ROW_LIMIT_MS;
      // Blocks of 10 alternating between the two, so drift (autovacuum, the JIT) falls on both alike.
      for (let done = 0; done < REQUESTS && Date.now() < rowEnd; done += 10) {
        for (const side of done % 20 ? (['floor', 'product'] as const) : (['product', 'floor'] as const)) {
          let next = done;
          const end = Math.min(REQUESTS, done + 10);
          await Promise.all(
            Array.from({ length: concurrency }, async () => {
              while (next < end) {
                if (Date.now() > deadline) throw new Error(`gave up after ${TIME_LIMIT_MS / 1000} s`);
                const i = next++;
                const start = performance.now();
                await c[side](i);
                times[side].push(performance.now() - start);
              }
            }),
          );
        }
      }
      return times;
    }

    const rows: {
      name: string;
      conc: number;
      n: number;
      p50: [number, number];
      p95: [number, number];
      target: number;
    }[] = [];
    async function report(c: Case, target: number) {
      for (const conc of [1, CONCURRENCY]) {
        const began = performance.now();
        const m = await measure(c, conc);
        console.error(
          `  measured ${c.name.trim()} at concurrency ${conc} in ${((performance.now() - began) / 1000).toFixed(1)} s`,
        );
        rows.push({
          name: c.name,
          conc,
          n: Math.min(m.product.length, m.floor.length),
          p50: [pct(m.product, 50), pct(m.floor, 50)],
          p95: [pct(m.product, 95), pct(m.floor, 95)],
          target,
        });
      }
    }
    const floorCall =
      (p: string, method = 'GET') =>
      () =>
        call(`${floorBase}${p}`, FLOOR_TOKEN, { method, body: method === 'POST' ? {} : undefined });

    await report(
      {
        name: 'part page  GET /api/travelers/:id',
        product: () => call(detailUrl, builder),
        floor: floorCall('/detail'),
      },
      1.3,
    );
    await report(
      {
        name: 'tick       POST /api/travelers/:id/holes',
        product: (i) => call(tickUrl, builder, { method: 'POST', body: tickBody(i) }),
        floor: floorCall('/tick', 'POST'),
      },
      1.3,
    );
    // The findings are multiplied only now: they all sit on the demo's part, whose page (measured above,
    // with the seed's one finding) would otherwise list 500 findings on a 55-hole part.
    await findingsUpTo(500);
    scripts.queue.variants = [stripAuth(await capture.during(() => call(queueUrl, inspector)))];
    await report(
      { name: 'queue p.1  500 findings', product: () => call(queueUrl, inspector), floor: floorCall('/queue') },
      1.5,
    );
    await findingsUpTo(5000);
    scripts.queue.variants = [stripAuth(await capture.during(() => call(queueUrl, inspector)))];
    await report(
      { name: 'queue p.1  5,000 findings', product: () => call(queueUrl, inspector), floor: floorCall('/queue') },
      1.5,
    );

    const f = (x: number) => x.toFixed(2).padStart(7);
    console.log(
      `API against a bare floor (Express 5 + pg, same SQL), 127.0.0.1, answers uncompressed; ${REQUESTS} timed requests per row (fewer when a row reaches ${ROW_LIMIT_MS / 1000} s) after ${WARM_UP} warm-up, concurrency 1 and ${CONCURRENCY}`,
    );
    console.log(
      `statements per request, auth lookup apart: part page ${detailSql.length}, tick ${tickSql[0].length} (BEGIN and COMMIT included), queue ${scripts.queue.variants[0].length}`,
    );
    console.log(`${'case'.padEnd(42)} conc     n   p50 prod  p50 floor  p95 prod  p95 floor   p50 ratio  target`);
    for (const r of rows) {
      const ratio = r.p50[0] / r.p50[1];
      console.log(
        `${r.name.padEnd(42)} ${String(r.conc).padStart(4)} ${String(r.n).padStart(5)} ${f(r.p50[0])} ms ${f(r.p50[1])} ms ${f(r.p95[0])} ms ${f(r.p95[1])} ms   ${ratio.toFixed(2).padStart(6)}×   ≤${r.target}× ${ratio <= r.target ? 'met' : 'NOT met'}`,
      );
    }
    const q = (n: string, conc: number) => rows.find((r) => r.name.includes(n) && r.conc === conc)!.p50[0];
    console.log(
      `queue first page, product p50: ${q('500 f', 1).toFixed(2)} ms at 500 findings, ${q('5,000', 1).toFixed(2)} ms at 5,000 (×${(q('5,000', 1) / q('500 f', 1)).toFixed(2)}; flat is ×1)`,
    );
  } finally {
    if (product) await new Promise((r) => product!.close(r));
    if (floor) {
      await new Promise((r) => floor!.server.close(r));
      await floor.pool.end();
    }
    await t.close();
    stopCluster?.();
  }
}

main().then(
  () => process.exit(0),
  (err) => {
    console.error(err instanceof Error ? (err.stack ?? err.message) : err);
    process.exit(1);
  },
);
