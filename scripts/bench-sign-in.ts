/**
 * npm run bench:sign-in — how long a sign-in takes for an unknown e-mail address against a known
 * address with a wrong password. When the two differ, anyone can find out who has an account by timing
 * the answers; they should take the same work (the password hash of a dummy for an unknown address).
 *
 * A timing is a measurement, not a test: this prints medians and their ratio rather than failing.
 * It starts the test PostgreSQL cluster when TEST_DATABASE_URL is not set (and stops it again if it
 * started it), and the real app on 127.0.0.1 with a port the system picks; requests go there only.
 * BENCH_ROUNDS (40, at most 200) sign-ins of each kind, interleaved so drift affects both alike.
 */
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { DEMO_USERS } from '../server/dev/seed';
import { startTestApp } from '../tests/helpers/test-app';
import { median, testClusterForBench } from './bench-common';

const ROUNDS = Math.min(200, Math.max(5, Number(process.env.BENCH_ROUNDS ?? 40) || 40));
const WARM_UP = 3;
/** The whole run stops here even if the server crawls. */
const TIME_LIMIT_MS = 180_000;

async function main() {
  const stopCluster = testClusterForBench();

  // The limits are what would otherwise stop the run after ten tries: raised for it.
  const t = await startTestApp({ env: { SIGN_IN_LIMIT_PER_ADDRESS: '100000', SIGN_IN_LIMIT_PER_IP: '100000' } });
  const server = createServer(t.app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/auth/sign-in`;
  const deadline = Date.now() + TIME_LIMIT_MS;

  async function signIn(email: string): Promise<number> {
    if (Date.now() > deadline) throw new Error(`gave up after ${TIME_LIMIT_MS / 1000} s`);
    const start = performance.now();
    const res = await fetch(url, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email, password: 'not-the-password-1' }),
      signal: AbortSignal.timeout(30_000),
    });
    await res.arrayBuffer();
    const ms = performance.now() - start;
    if (res.status !== 401) throw new Error(`expected 401 for ${email}, got ${res.status}`);
    return ms;
  }

  try {
    const known = DEMO_USERS.builder.email;
    // Each unknown try a different address, as someone listing addresses would send them.
    const unknown = (i: number) => `nobody-${i}-${Date.now().toString(36)}@example.com`;
    for (let i = 0; i < WARM_UP; i++) {
      await signIn(unknown(-1 - i));
      await signIn(known);
    }
    const times = { unknown: [] as number[], known: [] as number[] };
    for (let i = 0; i < ROUNDS; i++) {
      // Alternate which goes first, so neither always follows the other.
      if (i % 2) {
        times.known.push(await signIn(known));
        times.unknown.push(await signIn(unknown(i)));
      } else {
        times.unknown.push(await signIn(unknown(i)));
        times.known.push(await signIn(known));
      }
    }
    const mu = median(times.unknown);
    const mk = median(times.known);
    const ratio = mk / mu;
    console.log(`sign-in timing, ${ROUNDS} tries each, over HTTP on 127.0.0.1 (after ${WARM_UP} warm-up tries)`);
    console.log(
      `  unknown e-mail:                 median ${mu.toFixed(1)} ms  (min ${Math.min(...times.unknown).toFixed(1)}, max ${Math.max(...times.unknown).toFixed(1)})`,
    );
    console.log(
      `  known e-mail, wrong password:   median ${mk.toFixed(1)} ms  (min ${Math.min(...times.known).toFixed(1)}, max ${Math.max(...times.known).toFixed(1)})`,
    );
    console.log(`  ratio known / unknown:          ${ratio.toFixed(2)}`);
    // Within a quarter either way the medians overlap the run-to-run noise here; a missing dummy hash shows as ×10 or more.
    console.log(
      ratio > 0.8 && ratio < 1.25
        ? '  → the same work for both: timing does not tell whether an address has an account'
        : '  → the two differ: timing tells whether an address has an account',
    );
  } finally {
    await new Promise((r) => server.close(r));
    await t.close();
    stopCluster?.();
  }
}

main().then(
  () => process.exit(0),
  (err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  },
);
