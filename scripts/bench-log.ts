/**
 * npm run bench:log — the build log's exports at a supplier's scale: a build with 50,000 log entries
 * (BENCH_LOG_ENTRIES, 1,000..200,000), its PDF and CSV downloaded while /api/health is asked every 50 ms.
 * Prints each export's time and bytes, the server's peak memory (its own process, read from
 * /proc/<pid>/status), and the health latency during each export, beside the targets of issue 12
 * (health p99 < 100 ms, process < 400 MB). Figures, not assertions.
 *
 * It runs its own PostgreSQL cluster (scripts/pg.sh, name bench-log, port BENCH_PGPORT or 54352; stopped
 * at the end if it started it) and measures the server as it runs in production: compiled by
 * scripts/build-server.sh into a folder of its own under .cache/ and started with plain `node`
 * (NODE_ENV=production, as scripts/start-prod.sh does), a child process on 127.0.0.1, so the memory
 * measured is the server's alone and carries no tsx. The demo is loaded first by the sources' server in
 * development mode (the only mode that seeds), which is stopped before the compiled one starts.
 * Traffic goes to 127.0.0.1 only; every loop is bounded and the run stops after TIME_LIMIT_MS whatever happens.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { Pool } from 'pg';
import { DEMO_PASSWORD, DEMO_USERS } from '../server/dev/seed';
import { startSmtpFake, type SmtpFake } from '../server/mail/smtp-fake';
import { pg } from './bench-common';

const root = path.join(__dirname, '..');
const ENTRIES = Math.min(200_000, Math.max(1_000, Number(process.env.BENCH_LOG_ENTRIES ?? 50_000) || 50_000));
const PG_PORT = process.env.BENCH_PGPORT ?? '54352';
const CLUSTER = 'bench-log';
const TIME_LIMIT_MS = 15 * 60_000;
const HEALTH_EVERY_MS = 50;
const TARGET = { healthP99Ms: 100, rssMb: 400 };
/** Node flags for the measured server only, e.g. BENCH_SERVER_FLAGS='--cpu-prof --cpu-prof-dir=/tmp/prof' (written when it exits). */
const SERVER_FLAGS = (process.env.BENCH_SERVER_FLAGS ?? '').split(/\s+/).filter(Boolean);

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const deadline = Date.now() + TIME_LIMIT_MS;
const left = () => Math.max(1_000, deadline - Date.now());

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });
}

/** VmRSS and VmHWM (the kernel's own peak) of a process, in MB. */
function memoryOf(pid: number): { rss: number; hwm: number } | null {
  try {
    const status = readFileSync(`/proc/${pid}/status`, 'utf8');
    const kb = (k: string) => Number(new RegExp(`^${k}:\\s+(\\d+) kB`, 'm').exec(status)?.[1] ?? NaN);
    return { rss: kb('VmRSS') / 1024, hwm: kb('VmHWM') / 1024 };
  } catch {
    return null;
  }
}

/**
 * CPU seconds used so far (user + system, from /proc) by the whole process and by its main thread alone,
 * the thread that answers requests: on a busy machine latencies wander, these do not.
 */
function cpuOf(pid: number): { process: number; main: number } | null {
  const seconds = (stat: string) => {
    const f = stat.slice(stat.lastIndexOf(')') + 2).split(' '); // after "pid (comm) ": field 3 is f[0]
    return (Number(f[11]) + Number(f[12])) / 100; // utime, stime in clock ticks (USER_HZ, 100 on Linux)
  };
  try {
    return {
      process: seconds(readFileSync(`/proc/${pid}/stat`, 'utf8')),
      main: seconds(readFileSync(`/proc/${pid}/task/${pid}/stat`, 'utf8')),
    };
  } catch {
    return null;
  }
}

const pct = (xs: number[], p: number) => {
  if (!xs.length) return NaN;
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.ceil((p / 100) * s.length) - 1)];
};

/** Waits until `base` answers /api/health; throws with the process's output if it stops or never answers. */
async function waitHealthy(child: ChildProcess, base: string, output: () => string): Promise<void> {
  for (let i = 0; i < 600; i++) {
    if (child.exitCode !== null) throw new Error(`the server stopped at start-up:\n${output()}`);
    try {
      if ((await fetch(`${base}/api/health`, { signal: AbortSignal.timeout(1_000) })).ok) return;
    } catch {
      /* not up yet */
    }
    await sleep(100);
  }
  child.kill('SIGTERM');
  throw new Error(`the server did not answer within 60 s:\n${output()}`);
}

/** SIGTERM, then (after 10 s) SIGKILL: the server drains and exits on its own. */
async function stop(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  child.kill('SIGTERM');
  await Promise.race([exited, sleep(10_000)]);
  if (child.exitCode === null && child.signalCode === null) {
    child.kill('SIGKILL');
    await exited;
  }
}

function spawnLogged(args: string[], env: NodeJS.ProcessEnv) {
  const child = spawn(process.execPath, args, { cwd: root, stdio: ['ignore', 'pipe', 'pipe'], env });
  let output = '';
  child.stdout!.on('data', (d) => {
    output += d;
  });
  child.stderr!.on('data', (d) => {
    output += d;
  });
  return { child, output: () => output };
}

/**
 * The demo scenario, loaded the only way the product loads it: the server from its sources in
 * development mode with SEED_DEMO=1 (a production server never seeds, and refuses the SMTP fake).
 * It migrates, seeds, answers once, and is stopped again; the measured server is the compiled one.
 */
async function seedThroughSources(env: NodeJS.ProcessEnv): Promise<void> {
  const port = await freePort();
  const smtpPort = await freePort();
  const { child, output } = spawnLogged(['--import', 'tsx', 'server/index.ts'], {
    ...env,
    NODE_ENV: 'development',
    PORT: String(port),
    PUBLIC_URL: `http://127.0.0.1:${port}`,
    SMTP_FAKE: '1',
    SMTP_PORT: String(smtpPort),
    SEED_DEMO: '1',
  });
  try {
    await waitHealthy(child, `http://127.0.0.1:${port}`, output);
  } finally {
    await stop(child);
  }
}

/** `npm run build:server` into a folder of its own inside the project (node_modules resolves from there, as in build/). */
function compileServer(): string {
  mkdirSync(path.join(root, '.cache'), { recursive: true });
  const dir = mkdtempSync(path.join(root, '.cache', 'bench-log-build-'));
  const made = spawnSync('bash', [path.join(root, 'scripts', 'build-server.sh'), dir], { cwd: root, encoding: 'utf8' });
  if (made.status !== 0) throw new Error(`scripts/build-server.sh failed:\n${made.stdout}${made.stderr}`);
  return dir;
}

/**
 * The measured process: the compiled server as scripts/start-prod.sh runs it (`node <build>/server/index.js`,
 * NODE_ENV=production), no tsx, no demo seeding, its mail going over SMTP to a relay on loopback (the
 * bench's own SMTP fake), so that the queue's consumers run as they would in production.
 */
async function startServer(
  build: string,
  env: NodeJS.ProcessEnv,
): Promise<{ child: ChildProcess; base: string; output: () => string }> {
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const { child, output } = spawnLogged([...SERVER_FLAGS, path.join(build, 'server', 'index.js')], {
    ...env,
    NODE_ENV: 'production',
    PORT: String(port),
    PUBLIC_URL: base,
    SMTP_FAKE: '0',
    SEED_DEMO: '0',
  });
  await waitHealthy(child, base, output);
  return { child, base, output };
}

/**
 * The log of the demo build grown to ENTRIES bench events, written the way the travelers service writes
 * them (holes_installed / holes_pending with their hole ids, step_done / step_undone with seq and text),
 * one second apart and now and then several in one second, in one statement.
 */
async function seedLog(pool: Pool): Promise<string> {
  const {
    rows: [b],
  } = await pool.query<{ id: string }>(`select id from builds where kit_serial = 'NK2-0147'`);
  const {
    rows: [u],
  } = await pool.query<{ id: string }>(`select id from users where email = $1`, [DEMO_USERS.builder.email]);
  const { rows: parts } = await pool.query<{ id: string }>(
    `select id from travelers where build_id = $1 order by serial`,
    [b.id],
  );
  await pool.query(
    `
    insert into traveler_events (traveler_id, actor_id, created_at, kind, detail)
    select ($1::uuid[])[1 + i % array_length($1::uuid[], 1)], $2::uuid,
      timestamptz '2026-06-01 07:00:00+00' + (i - i % 4 / 3) * interval '1 second',
      case when i % 10 < 6 then 'holes_installed' when i % 10 = 6 then 'holes_pending' when i % 10 < 9 then 'step_done' else 'step_undone' end,
      case when i % 10 < 7
        then jsonb_build_object('holeIds', (select jsonb_agg(format('%s-%s', case when (i + k) % 2 = 0 then 'U' else 'L' end, lpad(((i * 7 + k) % 60 + 1)::text, 2, '0'))) from generate_series(1, 1 + i % 8) k))
        else jsonb_build_object('seq', 1 + i % 12, 'text', 'Deburr all holes, "both sides", and check edge distance')
      end
    from generate_series(1, $3::int) i`,
    [parts.map((p) => p.id), u.id, ENTRIES],
  );
  await pool.query('analyze traveler_events');
  return b.id;
}

type Run = {
  label: string;
  ms: number;
  bytes: number;
  status: number;
  health: number[];
  healthFailed: number;
  peakRss: number;
  cpu: { process: number; main: number } | null;
};

/** Downloads one export while asking for /api/health every 50 ms and sampling the server's memory. */
async function download(base: string, token: string, pid: number, label: string, suffix: string): Promise<Run> {
  const health: number[] = [];
  let healthFailed = 0;
  let peakRss = 0;
  let running = true;
  const sampler = (async () => {
    for (let i = 0; running && i < 100_000 && Date.now() < deadline; i++) {
      const m = memoryOf(pid);
      if (m) peakRss = Math.max(peakRss, m.rss);
      const start = performance.now();
      try {
        const res = await fetch(`${base}/api/health`, { signal: AbortSignal.timeout(10_000) });
        await res.arrayBuffer();
        if (res.ok) health.push(performance.now() - start);
        else healthFailed++;
      } catch {
        healthFailed++;
      }
      const wait = HEALTH_EVERY_MS - (performance.now() - start);
      if (wait > 0) await sleep(wait);
    }
  })();
  const cpuBefore = cpuOf(pid);
  const start = performance.now();
  let bytes = 0;
  let status = 0;
  try {
    const res = await fetch(`${base}/api/builds/${suffix}`, {
      headers: { Authorization: `Bearer ${token}` },
      signal: AbortSignal.timeout(left()),
    });
    status = res.status;
    // Counted as it arrives, not kept: the bench's own memory is not the point.
    const reader = res.body!.getReader();
    for (let i = 0; i < 10_000_000; i++) {
      const { done, value } = await reader.read();
      if (done) break;
      bytes += value.byteLength;
    }
  } finally {
    running = false;
  }
  const ms = performance.now() - start;
  const cpuAfter = cpuOf(pid);
  await sampler;
  const cpu =
    cpuBefore && cpuAfter
      ? { process: cpuAfter.process - cpuBefore.process, main: cpuAfter.main - cpuBefore.main }
      : null;
  return { label, ms, bytes, status, health, healthFailed, peakRss, cpu };
}

async function main() {
  const wasRunning = spawnSync('bash', [path.join(root, 'scripts', 'pg.sh'), 'status', CLUSTER]).status === 0;
  pg('start', CLUSTER, PG_PORT, 'test');
  const dbName = `bench_log_${Date.now().toString(36)}`;
  pg('ensure-db', CLUSTER, PG_PORT, dbName);
  const databaseUrl = pg('url', CLUSTER, PG_PORT, dbName);
  const uploads = mkdtempSync(path.join(os.tmpdir(), 'pc-bench-log-'));
  let server: ChildProcess | undefined;
  const pool = new Pool({ connectionString: databaseUrl, max: 2 });
  let build: string | undefined;
  let relay: SmtpFake | undefined;
  try {
    let t = performance.now();
    build = compileServer();
    console.log(`compiled the server (scripts/build-server.sh) in ${((performance.now() - t) / 1000).toFixed(1)} s`);
    relay = await startSmtpFake(await freePort());
    // One environment for both processes; each sets its own mode, port and mail below.
    const env: NodeJS.ProcessEnv = {
      ...process.env,
      DATABASE_URL: databaseUrl,
      HOST: '127.0.0.1',
      JWT_SECRET: 'bench-log-secret-that-is-long-enough-for-hs256-in-production',
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(relay.port),
      UPLOADS_DIR: uploads,
      WEB_DIST: path.join(uploads, 'no-web'),
      LOG_LEVEL: 'warn',
    };
    t = performance.now();
    await seedThroughSources(env);
    console.log(
      `seeded the demo through the sources (tsx, development) in ${((performance.now() - t) / 1000).toFixed(1)} s`,
    );
    const started = await startServer(build, env);
    server = started.child;
    const { base } = started;
    const t0 = performance.now();
    const buildId = await seedLog(pool);
    console.log(
      `seeded ${ENTRIES.toLocaleString('en-US')} bench events in ${((performance.now() - t0) / 1000).toFixed(1)} s`,
    );
    const signIn = await fetch(`${base}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: DEMO_USERS.builder.email, password: DEMO_PASSWORD }),
    });
    const { token } = (await signIn.json()) as { token: string };
    if (!token) throw new Error(`sign-in failed (${signIn.status})`);
    const pid = server.pid!;

    // The machine's own load: on a shared machine the latencies below wander with it.
    console.log(
      `load average ${os
        .loadavg()
        .map((x) => x.toFixed(1))
        .join(' ')} on ${os.availableParallelism()} cores`,
    );
    const idle: number[] = [];
    for (let i = 0; i < 40; i++) {
      const s = performance.now();
      await (await fetch(`${base}/api/health`)).arrayBuffer();
      idle.push(performance.now() - s);
      await sleep(HEALTH_EVERY_MS);
    }
    const page = performance.now();
    const first = await fetch(`${base}/api/builds/${buildId}/log`, { headers: { Authorization: `Bearer ${token}` } });
    const firstBytes = (await first.arrayBuffer()).byteLength;
    const pageMs = performance.now() - page;
    const before = memoryOf(pid);

    const runs = [
      await download(base, token, pid, 'PDF', `${buildId}/log.pdf?tz=Europe/Berlin`),
      await download(base, token, pid, 'CSV', `${buildId}/log.csv?tz=Europe/Berlin`),
    ];
    const after = memoryOf(pid);

    const mb = (n: number) => `${n.toFixed(0)} MB`;
    const ok = (good: boolean) => (good ? 'meets target' : 'MISSES target');
    console.log(
      `\nbuild log of ${(ENTRIES + 5).toLocaleString('en-US')} entries, compiled server (node ${path.relative(root, build)}/server/index.js, NODE_ENV=production, Node ${process.version}) on 127.0.0.1 (pid ${pid}), health asked every ${HEALTH_EVERY_MS} ms`,
    );
    console.log(`  idle health:         p50 ${pct(idle, 50).toFixed(1)} ms, p99 ${pct(idle, 99).toFixed(1)} ms`);
    console.log(
      `  JSON log, first page: ${pageMs.toFixed(0)} ms, ${(firstBytes / 1024).toFixed(1)} kB (status ${first.status})`,
    );
    console.log(`  server memory before exports: ${before ? mb(before.rss) : '?'} RSS`);
    for (const r of runs) {
      const p99 = pct(r.health, 99);
      console.log(
        `  ${r.label}: status ${r.status}, ${(r.ms / 1000).toFixed(1)} s, ${(r.bytes / 1e6).toFixed(1)} MB` +
          (r.cpu
            ? `; server CPU ${r.cpu.process.toFixed(1)} s, of it the request (main) thread ${r.cpu.main.toFixed(1)} s`
            : ''),
      );
      console.log(
        `    health during it: ${r.health.length} answers, p50 ${pct(r.health, 50).toFixed(1)} ms, p99 ${p99.toFixed(1)} ms, max ${Math.max(...r.health).toFixed(1)} ms` +
          `${r.healthFailed ? `, ${r.healthFailed} failed` : ''}  [target p99 < ${TARGET.healthP99Ms} ms: ${ok(p99 < TARGET.healthP99Ms)}]`,
      );
    }
    const peak = Math.max(...runs.map((r) => r.peakRss), after?.hwm ?? 0);
    console.log(
      `  server peak memory: ${mb(peak)} (VmHWM ${after ? mb(after.hwm) : '?'}; RSS after both ${after ? mb(after.rss) : '?'})  [target < ${TARGET.rssMb} MB: ${ok(peak < TARGET.rssMb)}]`,
    );
  } finally {
    await pool.end().catch(() => undefined);
    if (server) await stop(server);
    await relay?.close();
    rmSync(uploads, { recursive: true, force: true });
    if (build) rmSync(build, { recursive: true, force: true });
    try {
      const admin = pg('url', CLUSTER, PG_PORT);
      const p = new Pool({ connectionString: admin, max: 1 });
      await p.query(`drop database if exists ${dbName} with (force)`).finally(() => p.end());
    } catch {
      /* the cluster is stopped below anyway, or kept for the next run */
    }
    if (!wasRunning) pg('stop', CLUSTER, PG_PORT);
  }
}

main().then(
  () => process.exit(0),
  (err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  },
);
