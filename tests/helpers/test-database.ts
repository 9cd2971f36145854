import { randomBytes } from 'node:crypto';
import { Client } from 'pg';
import { runMigrations } from '@/db/migrate';

/** A fresh, migrated database on the test cluster (scripts/test.sh starts it), dropped by `drop()`. */
export async function createTestDatabase(): Promise<{ url: string; drop: () => Promise<void> }> {
  const admin = process.env.TEST_DATABASE_URL;
  if (!admin) throw new Error('TEST_DATABASE_URL is not set: run the tests with `npm test`, which starts the test cluster');
  const name = `pc_test_${randomBytes(6).toString('hex')}`;
  const client = new Client({ connectionString: admin });
  await client.connect();
  await client.query(`create database ${name}`);
  await client.end();
  const url = admin.replace(/\/[^/]*$/, `/${name}`);
  await runMigrations(url);
  return {
    url,
    async drop() {
      const c = new Client({ connectionString: admin });
      await c.connect();
      await c.query(`drop database if exists ${name} with (force)`);
      await c.end();
    },
  };
}
