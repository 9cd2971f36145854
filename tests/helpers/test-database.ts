import { randomBytes } from 'node:crypto';
import { Client } from 'pg';
import { runMigrations } from '@/db/migrate';

const HOW =
  'run the tests with `npm test`, which starts the test cluster; by hand: `bash scripts/pg.sh start test 54330 test` ' +
  'then TEST_DATABASE_URL=$(bash scripts/pg.sh url test 54330)';

/** The test cluster's URL with another database name; the password and the rest stay as they are. */
export function withDatabase(url: string, name: string): string {
  const u = new URL(url);
  u.pathname = `/${name}`;
  return u.toString();
}

async function adminClient(admin: string): Promise<Client> {
  const client = new Client({ connectionString: admin });
  try {
    await client.connect();
  } catch (err) {
    // 28P01 wrong password, 28000 no such role/method; a URL without password fails in the client.
    const e = err as { code?: string; message?: string };
    if (e.code === '28P01' || e.code === '28000' || /password/i.test(e.message ?? '')) {
      throw new Error(
        `the test cluster refused TEST_DATABASE_URL (${e.message}): it wants the password that scripts/pg.sh keeps; ${HOW}`,
      );
    }
    throw err;
  }
  return client;
}

/** A fresh, migrated database on the test cluster (scripts/test.sh starts it), dropped by `drop()`. */
export async function createTestDatabase(): Promise<{ url: string; drop: () => Promise<void> }> {
  const admin = process.env.TEST_DATABASE_URL;
  if (!admin) throw new Error(`TEST_DATABASE_URL is not set: ${HOW}`);
  const name = `pc_test_${randomBytes(6).toString('hex')}`;
  const client = await adminClient(admin);
  await client.query(`create database ${name}`);
  await client.end();
  const url = withDatabase(admin, name);
  await runMigrations(url);
  return {
    url,
    async drop() {
      const c = await adminClient(admin);
      await c.query(`drop database if exists ${name} with (force)`);
      await c.end();
    },
  };
}
