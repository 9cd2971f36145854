import { execFileSync } from 'node:child_process';
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
