import type { Db } from '../../db';
import { noticeMail } from '../mail/notice-mail';
import type { Mailer } from '../mail/transport';
import { noticeMailSent, readNoticeMail, recordNoticeMail } from '../notices/notices-repository';
import type { NoticeMailJob } from './mail-queue';

/**
 * Sends one person the mail of a notice, naming every build of theirs it reached. The queue may run a
 * job twice (a worker that dies after sending): the mail is recorded once sent and skipped on a second run.
 */
export function noticeMailWorker(deps: { db: Db; mailer: Mailer; publicUrl: string }) {
  const { db, mailer, publicUrl } = deps;
  return async ({ noticeId, userId }: NoticeMailJob) => {
    if (await noticeMailSent(db, noticeId, userId)) return;
    const facts = await readNoticeMail(db, noticeId, userId);
    if (!facts) return; // the person left the builds or the account was closed since: nobody to tell
    const message = noticeMail({
      to: facts.to,
      ...facts.notice,
      reached: facts.reached,
      // The people mailed are on the builds: the notice's page under their builds.
      link: `${publicUrl}/builds/notices/${noticeId}`,
    });
    await mailer.send(message);
    await recordNoticeMail(db, { noticeId, userId, recipient: facts.to, subject: message.subject });
  };
}
