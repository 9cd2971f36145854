import { createHash } from 'node:crypto';
import { isIPv6 } from 'node:net';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { Pool } from 'pg';
import { RateLimiterMemory, RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import type { RateLimitConfig } from '../config';
import { HttpError } from '../http-error';

/**
 * Rate limits kept in PostgreSQL (rate-limiter-flexible), so that every server process counts the
 * same attempts: a limit per process would let an attacker multiply it by the number of processes.
 *
 *   r.post('/forgot', ...limitByIpAndAddress(ctx, 'password-reset', ctx.config.rateLimits.passwordReset), handler)
 *   r.post('/invitations', rateLimit(ctx, { name: 'invite', points: 20, durationSeconds: 3600, key: (req) => req.user?.id }), …)
 *
 * Over the limit: 429 with Retry-After (seconds) and our error shape, code `rate_limited`.
 */
export type RateLimitOptions = {
  /** Distinguishes this limit's counters from others' in the shared table: lower-case letters, digits, dashes. */
  name: string;
  /** Requests allowed per window. */
  points: number;
  durationSeconds: number;
  /** What is counted (an IP, an e-mail address, a user id); undefined or '' lets the request through uncounted. */
  key: (req: Request) => string | undefined;
  /** Said to the person who hit the limit, before "try again in …". */
  message?: string;
};

/** Its own table, made here rather than by a migration: it belongs to the library, not to our schema. */
export const RATE_LIMIT_TABLE = 'rate_limits';
// An arbitrary constant: serialises the table's creation between processes starting together.
const CREATE_LOCK = 7_300_201;

const tableReady = new WeakMap<Pool, Promise<void>>();

/** Creates the table once per pool. CREATE TABLE IF NOT EXISTS alone races between two processes (a unique violation in pg_type). */
function ensureTable(pool: Pool): Promise<void> {
  let ready = tableReady.get(pool);
  if (!ready) {
    ready = (async () => {
      const client = await pool.connect();
      try {
        await client.query('begin');
        await client.query('select pg_advisory_xact_lock($1)', [CREATE_LOCK]);
        // The columns rate-limiter-flexible's PostgreSQL store reads and writes; expire is epoch milliseconds.
        await client.query(
          `create table if not exists ${RATE_LIMIT_TABLE} (key varchar(255) primary key, points integer not null default 0, expire bigint)`,
        );
        await client.query(`create index if not exists ${RATE_LIMIT_TABLE}_expire on ${RATE_LIMIT_TABLE} (expire)`);
        await client.query('commit');
      } catch (err) {
        await client.query('rollback').catch(() => undefined);
        throw err;
      } finally {
        client.release();
      }
    })();
    // A failure (database briefly away) is retried by the next request rather than remembered.
    ready.catch(() => tableReady.delete(pool));
    tableReady.set(pool, ready);
  }
  return ready;
}

function waitWords(seconds: number): string {
  if (seconds < 90) return `${seconds} seconds`;
  return `${Math.ceil(seconds / 60)} minutes`;
}

export function rateLimit(ctx: { pool: Pool }, opts: RateLimitOptions): RequestHandler {
  if (!/^[a-z0-9-]{1,40}$/.test(opts.name))
    throw new Error(`rate limit name "${opts.name}": use lower-case letters, digits and dashes`);
  if (!Number.isInteger(opts.points) || opts.points < 1)
    throw new Error(`rate limit ${opts.name}: points must be a whole number ≥ 1`);
  if (!Number.isInteger(opts.durationSeconds) || opts.durationSeconds < 1)
    throw new Error(`rate limit ${opts.name}: durationSeconds must be a whole number ≥ 1`);
  const base = { keyPrefix: opts.name, points: opts.points, duration: opts.durationSeconds };
  const limiter = new RateLimiterPostgres({
    ...base,
    storeClient: ctx.pool,
    storeType: 'pool',
    tableName: RATE_LIMIT_TABLE,
    tableCreated: true,
    // If PostgreSQL cannot answer, each process goes on counting on its own rather than letting every attempt through.
    insuranceLimiter: new RateLimiterMemory(base),
  });

  return async (req: Request, res: Response, next: NextFunction) => {
    const raw = opts.key(req);
    if (raw === undefined || raw === '') return next();
    // Hashed: a fixed-length key whatever the request sent, and no e-mail addresses sitting in the table.
    const key = createHash('sha256').update(raw).digest('base64url');
    try {
      await ensureTable(ctx.pool).catch((err: Error) =>
        req.log?.warn({ err, reqId: req.id }, 'rate limit table not ready; counting in memory'),
      );
      await limiter.consume(key);
      next();
    } catch (err) {
      if (!(err instanceof RateLimiterRes)) return next(err);
      const seconds = Math.max(1, Math.ceil(err.msBeforeNext / 1000));
      res.setHeader('Retry-After', String(seconds));
      next(
        new HttpError(
          429,
          'rate_limited',
          `${opts.message ?? 'too many attempts'}: try again in ${waitWords(seconds)}`,
        ),
      );
    }
  };
}

/** The client's address; an IPv6 client counts by its /64, the block one machine or home gets. */
export function byIp(req: Request): string {
  const ip = req.ip ?? req.socket.remoteAddress ?? '';
  if (ip.startsWith('::ffff:')) return ip.slice(7);
  if (!isIPv6(ip)) return ip;
  const [head, tail = ''] = ip.split('::');
  const left = head ? head.split(':') : [];
  const right = tail ? tail.split(':') : [];
  const full = ip.includes('::') ? [...left, ...Array(8 - left.length - right.length).fill('0'), ...right] : left;
  return `${full
    .slice(0, 4)
    .map((g) => g.toLowerCase().replace(/^0+(?=.)/, ''))
    .join(':')}::/64`;
}

/** The e-mail address the body names, as sign-in compares it (trimmed, lower-case). */
export function byEmail(req: Request): string | undefined {
  const email = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? email.trim().toLowerCase() : undefined;
}

/** The usual pair for a form that names an address: per client address and per e-mail address. */
export function limitByIpAndAddress(
  ctx: { pool: Pool },
  name: string,
  limits: RateLimitConfig,
  message?: string,
): RequestHandler[] {
  return [
    rateLimit(ctx, {
      name: `${name}-ip`,
      points: limits.perIp,
      durationSeconds: limits.windowSeconds,
      key: byIp,
      message,
    }),
    rateLimit(ctx, {
      name: `${name}-address`,
      points: limits.perAddress,
      durationSeconds: limits.windowSeconds,
      key: byEmail,
      message,
    }),
  ];
}
