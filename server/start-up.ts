import { Client } from 'pg';
import { createDatabase } from '../db';
import { runMigrations } from '../db/migrate';
import { ConfigError, loadConfig } from './config';
import { startMailQueue } from './jobs/mail-queue';
import { createLogger } from './middleware/request-log';
import { openPhotoStorage } from './storage/open-photo-storage';

/** Tells scripts/supervise.sh (and any process manager) that restarting cannot help (sysexits' EX_CONFIG). */
export const EXIT_CONFIG = 78;

/** Any fixed number: the key of the advisory lock that lets one process at a time migrate. */
const MIGRATION_LOCK = 7_341_002_517;

/**
 * Applies pending migrations, one process at a time: several API and worker processes started together
 * on a new release would otherwise race to apply the same migration. The others wait (at most two
 * minutes), then find nothing left to do.
 */
export async function migrateUnderLock(databaseUrl: string): Promise<void> {
  const lock = new Client({ connectionString: databaseUrl, connectionTimeoutMillis: 5000 });
  await lock.connect();
  try {
    await lock.query(`set lock_timeout = '120s'`);
    await lock.query('select pg_advisory_lock($1)', [MIGRATION_LOCK]);
    await runMigrations(databaseUrl);
  } finally {
    // Ending the session releases its advisory lock.
    await lock.end().catch(() => undefined);
  }
}

/** SIGINT and SIGTERM run `stop` once (a second signal while draining changes nothing). */
export function onStopSignal(stop: (signal: string) => Promise<void>): void {
  let stopping = false;
  const handle = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`${signal}: draining`);
    stop(signal).then(
      () => process.exit(0),
      (err) => {
        console.error('stopping failed:', err instanceof Error ? err.message : err);
        process.exit(1);
      },
    );
  };
  process.on('SIGINT', () => handle('SIGINT'));
  process.on('SIGTERM', () => handle('SIGTERM'));
}

/** The end of a start-up that failed: a configuration error is not retried by the supervisor. */
export function exitOnStartError(err: unknown): never {
  console.error(err instanceof Error ? err.message : err);
  process.exit(err instanceof ConfigError ? EXIT_CONFIG : 1);
}

/**
 * What an API process and a worker both open, in this order: configuration, log, the schema brought up
 * to date (under the lock), the database, the photo store and the job queue.
 */
export async function openShared() {
  const config = loadConfig();
  const logger = createLogger(config);
  await migrateUnderLock(config.databaseUrl);
  const database = createDatabase(config.databaseUrl);
  const photos = await openPhotoStorage(config);
  const mailQueue = await startMailQueue(config.databaseUrl);
  return { config, logger, database, photos, mailQueue };
}
