import { startJobs } from './jobs/run-jobs';
import { exitOnStartError, onStopSignal, openShared } from './start-up';

/**
 * `npm run worker`: the job queue's consumers (mail) and the photo sweep, without the HTTP server.
 * Run one or more beside API processes started with RUN_JOBS=0, with the same environment (same
 * database, same photo store: a mail carries the finding's photo). It never starts the SMTP fake.
 */
async function main() {
  const { config, logger, database, photos, mailQueue } = await openShared();
  const jobs = await startJobs({ config, db: database.db, storage: photos.storage, mailQueue, logger });
  console.log(
    `Pitchcard worker is up (mail through ${config.smtp.host}:${config.smtp.port}; photos in ${photos.where})`,
  );

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
