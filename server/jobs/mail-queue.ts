import PgBoss from 'pg-boss';
import type { Tx } from '../../db';

export const MAIL_QUEUE = 'finding-mail';
const DEAD_QUEUE = 'finding-mail-dead';

/** The mails of one finding event (recipients worked out when sent). */
export type FindingMailJob = { eventId: string };
/** An account mail to one person (an invitation, a password reset), written when it was asked for. */
export type MessageMailJob = { message: { to: string; subject: string; text: string; html: string } };
/** The mail of one notice to one person on the builds it reached (their builds worked out when sent). */
export type NoticeMailJob = { noticeId: string; userId: string };
export type MailJob = FindingMailJob | MessageMailJob | NoticeMailJob;

export type MailQueue = {
  /** Enqueue inside the caller's transaction: the job exists if and only if what it tells of does. */
  enqueue: (tx: Tx, job: MailJob) => Promise<void>;
  work: (handler: (job: MailJob) => Promise<void>) => Promise<void>;
  stop: () => Promise<void>;
};

/**
 * A job queue on PostgreSQL. A mail server that is down makes the job fail and retry with backoff;
 * after the retries it lands on a dead-letter queue, still in the database, never lost.
 */
export async function startMailQueue(
  databaseUrl: string,
  opts: { pollingIntervalSeconds?: number } = {},
): Promise<MailQueue> {
  const boss = new PgBoss({ connectionString: databaseUrl, max: 4, schedule: false });
  boss.on('error', (err) => console.error('mail queue error:', err.message));
  await boss.start();
  await boss.createQueue(DEAD_QUEUE);
  await boss.createQueue(MAIL_QUEUE, {
    name: MAIL_QUEUE,
    retryLimit: 12,
    retryDelay: 5,
    retryBackoff: true,
    deadLetter: DEAD_QUEUE,
  });
  return {
    async enqueue(tx, job) {
      await boss.send(MAIL_QUEUE, job, { db: tx });
    },
    async work(handler) {
      await boss.work<MailJob>(
        MAIL_QUEUE,
        { pollingIntervalSeconds: opts.pollingIntervalSeconds ?? 2, batchSize: 1 },
        async (jobs) => {
          for (const job of jobs) await handler(job.data);
        },
      );
    },
    stop: () => boss.stop({ graceful: true, wait: true, timeout: 5000 }),
  };
}
