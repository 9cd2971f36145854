import { execFileSync, spawnSync } from 'node:child_process';
import path from 'node:path';

/** What every benchmark shares: its private PostgreSQL through scripts/pg.sh, and the median of its samples. */
export const root = path.join(__dirname, '..');

export const pg = (...args: string[]) =>
  execFileSync('bash', [path.join(root, 'scripts', 'pg.sh'), ...args], { encoding: 'utf8' }).trim();

export const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};

/**
 * The test cluster for a benchmark that runs the app: when TEST_DATABASE_URL is not set, starts the
 * `test` cluster (port TEST_PGPORT or 54330) and points TEST_DATABASE_URL at it. Returns how to stop it
 * again, only when this run started it.
 */
export function testClusterForBench(): (() => void) | undefined {
  if (process.env.TEST_DATABASE_URL) return undefined;
  const port = process.env.TEST_PGPORT ?? '54330';
  const wasRunning = spawnSync('bash', [path.join(root, 'scripts', 'pg.sh'), 'status', 'test']).status === 0;
  pg('start', 'test', port, 'test');
  process.env.TEST_DATABASE_URL = pg('url', 'test', port);
  return wasRunning ? undefined : () => pg('stop', 'test', port);
}
