import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import { Pool, type PoolClient } from 'pg';
import * as schema from './schema';

export type Db = NodePgDatabase<typeof schema>;
export type Database = { pool: Pool; db: Db; close: () => Promise<void> };

/** A pool-backed drizzle client. The pool logs (not crashes) when an idle connection drops. */
export function createDatabase(url: string): Database {
  const pool = new Pool({ connectionString: url, max: 10, connectionTimeoutMillis: 5000, idleTimeoutMillis: 30000 });
  pool.on('error', (err) => console.error('postgres pool error:', err.message));
  const db = drizzle(pool, { schema });
  return { pool, db, close: () => pool.end() };
}

/** What a unit of work gets: a drizzle client on one connection, and raw SQL on the same connection
 * (so other libraries, like the job queue, can write inside the same transaction). */
export type Tx = { db: Db; executeSql: (text: string, values: unknown[]) => Promise<{ rows: any[] }> };

export async function withTransaction<T>(pool: Pool, work: (tx: Tx) => Promise<T>): Promise<T> {
  const client: PoolClient = await pool.connect();
  try {
    await client.query('BEGIN');
    const result = await work({
      db: drizzle(client, { schema }),
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
