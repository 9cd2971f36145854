import type { Logger } from 'pino';
import type { Db } from '../../db';
import type { Config } from '../config';
import { createMailer } from '../mail/transport';
import type { PhotoStorage } from '../storage/photo-storage';
import { findingMailWorker } from './finding-mail-worker';
import type { MailQueue } from './mail-queue';
import { schedulePhotoSweep } from './photo-sweep';

export type RunningJobs = {
  /** Ends the sweep's schedule and waits for a sweep in progress. */
  stopSchedules: () => Promise<void>;
  /** Closes the mail transport: call after the queue has stopped (its jobs in hand are done). */
  close: () => void;
};

/**
 * The background work: the mail queue's consumer and the orphan-photo sweep. Run by the API process
 * (RUN_JOBS=1, the default) or by `npm run worker` on its own. Several consumers on one database are
 * safe: the queue hands each job to one of them, and each mail is recorded once sent (finding-mail-worker).
 */
export async function startJobs(deps: {
  config: Config;
  db: Db;
  storage: PhotoStorage;
  mailQueue: MailQueue;
  logger: Logger;
}): Promise<RunningJobs> {
  const { config, db, storage, mailQueue, logger } = deps;
  const mailer = createMailer(config.smtp);
  await mailQueue.work(findingMailWorker({ db, mailer, storage, publicUrl: config.publicUrl }));
  const sweep = schedulePhotoSweep({ db, storage, logger, ...config.photoSweep });
  return { stopSchedules: () => sweep.stop(), close: () => mailer.close() };
}
