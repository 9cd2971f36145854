import { createDatabase } from '../db';
import { loadConfig } from './config';
import { startMailQueue } from './jobs/mail-queue';
import { startJobs } from './jobs/run-jobs';
import { createLogger } from './middleware/request-log';
import { exitOnStartError, migrateUnderLock, onStopSignal } from './start-up';
import { openPhotoStorage } from './storage/open-photo-storage';

/**
 * `npm run worker`: the job queue's consumers (mail) and the photo sweep, without the HTTP server.
 * Run one or more beside API processes started with RUN_JOBS=0, with the same environment (same
 * database, same photo store: a mail carries the finding's photo). It never starts the SMTP fake.
 */
async function main() {
  const config = loadConfig();
  const logger = createLogger(config);
  await migrateUnderLock(config.databaseUrl);
  const database = createDatabase(config.databaseUrl);
  const photos = await openPhotoStorage(config);
  const mailQueue = await startMailQueue(config.databaseUrl);
  const jobs = await startJobs({ config, db: database.db, storage: photos.storage, mailQueue, logger });
  console.log(`Pitchcard worker is up (mail through ${config.smtp.host}:${config.smtp.port}; photos in ${photos.where})`);

  onStopSignal(async () => {
    await jobs.stopSchedules();
    // Graceful: the job in hand is finished (at most 5 s) before the transport closes.
    await mailQueue.stop();
    jobs.close();
    photos.close();
    await database.close();
  });
}

main().catch(exitOnStartError);
