import path from 'node:path';
import { drizzle } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import { Pool } from 'pg';

export const migrationsFolder = path.join(__dirname, 'migrations');

/** Applies committed migrations. The programmatic migrator reports SQL errors (drizzle-kit's CLI may not). */
export async function runMigrations(url: string): Promise<void> {
  const pool = new Pool({ connectionString: url, max: 1 });
  try {
    await migrate(drizzle(pool), { migrationsFolder });
  } finally {
    await pool.end();
  }
}

if (require.main === module) {
  const url = process.env.DATABASE_URL;
  if (!url) {
    console.error('DATABASE_URL is not set');
    process.exit(2);
  }
  runMigrations(url).then(
    () => console.log('migrations applied'),
    (err) => {
      console.error('migration failed:', err.message);
      process.exit(1);
    },
  );
}
