import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import { Pool, type PoolClient } from 'pg';

/**
 * Drizzle without the relational-query schema: every query is a plain select/insert/update over the
 * tables in db/schema, and handing the schema over makes drizzle() rebuild its relations map each
 * time (≈ 0.8 ms per transaction, as each unit of work makes its own client).
 */
export type Db = NodePgDatabase;
export type Database = { pool: Pool; db: Db; close: () => Promise<void> };

/**
 * A pool-backed drizzle client. The pool logs (not crashes) when an idle connection drops. A request
 * waits at most `waitMs` for one of the `max` connections (isPoolBusy then tells the error handler).
 */
export function createDatabase(url: string, { max = 10, waitMs = 5000 } = {}): Database {
  const pool = new Pool({ connectionString: url, max, connectionTimeoutMillis: waitMs, idleTimeoutMillis: 30000 });
  pool.on('error', (err) => console.error('postgres pool error:', err.message));
  const db = drizzle(pool);
  return { pool, db, close: () => pool.end() };
}

/** pg-pool's words when no connection came free in time (it gives the error no code). */
const POOL_WAIT_TIMEOUT = 'timeout exceeded when trying to connect';

/**
 * Whether `err`, or an error it wraps (drizzle wraps a failed query), is the pool giving up on a free
 * connection: the server is busy, not broken, and the request may be tried again.
 */
export function isPoolBusy(err: unknown): boolean {
  let e: unknown = err;
  for (let depth = 0; e instanceof Error && depth < 4; depth++, e = e.cause) {
    if (e.message === POOL_WAIT_TIMEOUT) return true;
  }
  return false;
}

/** What a unit of work gets: a drizzle client on one connection, and raw SQL on the same connection
 * (so other libraries, like the job queue, can write inside the same transaction). */
export type Tx = { db: Db; executeSql: (text: string, values: unknown[]) => Promise<{ rows: any[] }> };

/**
 * One drizzle client per pooled connection, made the first time a unit of work takes it: statements
 * prepared on it (server/prepared.ts) then serve every later transaction on that connection.
 */
const connectionDbs = new WeakMap<PoolClient, Db>();
function clientDb(client: PoolClient): Db {
  let db = connectionDbs.get(client);
  if (!db) connectionDbs.set(client, (db = drizzle(client)));
  return db;
}

/**
 * The one way a unit of work opens: BEGIN on a connection of the pool, the work, COMMIT (ROLLBACK when
 * it throws). It takes the pool or the pool's drizzle client (the services that hold only the client),
 * never a unit of work's own client: work does not nest.
 */
export async function withTransaction<T>(on: Pool | Db, work: (tx: Tx) => Promise<T>): Promise<T> {
  const pool = poolOf(on);
  const client: PoolClient = await pool.connect();
  try {
    await client.query('BEGIN');
    const result = await work({
      db: clientDb(client),
      executeSql: (text, values) => client.query(text, values as any[]),
    });
    await client.query('COMMIT');
    return result;
  } catch (err) {
    await client.query('ROLLBACK').catch(() => undefined);
    throw err;
  } finally {
    client.release();
  }
}

function poolOf(on: Pool | Db): Pool {
  const pool = on instanceof Pool ? on : (on as Db & { $client?: unknown }).$client;
  if (pool instanceof Pool) return pool;
  throw new Error('withTransaction opens on the pool or its client: a unit of work does not open inside another');
}
