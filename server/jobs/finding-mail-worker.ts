import type { Db } from '../../db';
import { mailAudienceOf } from '../../db/contracts';
import {
  findEventForMail,
  listFindingPhotos,
  mailSent,
  recipientsOf,
  recordSentMail,
} from '../findings/findings-repository';
import { findingMail } from '../mail/finding-mail';
import type { Mailer } from '../mail/transport';
import type { PhotoStorage } from '../storage/photo-storage';
import { findTravelerParts } from '../travelers/travelers-repository';
import type { MailJob } from './mail-queue';
import { noticeMailWorker } from './notice-mail-worker';

/**
 * Sends the mail for one finding event to everyone who must act on it (the rules module says who).
 * The queue may run a job twice, so each (event, recipient) is recorded once sent and skipped on a second run.
 */
export function findingMailWorker(deps: { db: Db; mailer: Mailer; storage: PhotoStorage; publicUrl: string }) {
  const { db, mailer, storage, publicUrl } = deps;
  const notice = noticeMailWorker({ db, mailer, publicUrl });
  return async (job: MailJob) => {
    // An account mail goes to its one person as written; a notice's to each person it reached.
    if ('message' in job) return mailer.send(job.message);
    if ('noticeId' in job) return notice(job);
    const { eventId } = job;
    const row = await findEventForMail(db, eventId);
    if (!row) return; // the finding was deleted since: nothing left to tell anyone
    const audience = mailAudienceOf(
      row.event.action,
      row.event.disposition ?? row.finding.disposition,
      row.event.actorPlace,
    );
    if (!audience.length) return;
    const recipients = await recipientsOf(db, row.buildId, audience, row.event.actorId);
    if (!recipients.length) return;
    const parts = (await findTravelerParts(db, row.finding.travelerId))!;
    // The photo that speaks for the event: the work's own for a report of work done, else the hole as found.
    const photos = await listFindingPhotos(db, row.finding.id);
    const photo = photos.find((p) => p.eventId === row.event.id) ?? photos.find((p) => p.eventId === null);
    const thumbnail = photo ? await storage.get(photo.thumbKey).catch(() => null) : null;
    const message = findingMail({
      findingId: row.finding.id,
      action: row.event.action,
      toStatus: row.event.toStatus,
      disposition: row.event.disposition ?? row.finding.disposition,
      note: row.event.note,
      actorName: row.actorName,
      partNumber: parts.design.partNumber,
      partName: parts.design.name,
      letter: parts.revision.letter,
      serial: parts.traveler.serial,
      kitSerial: row.kitSerial,
      holeIds: row.finding.holeIds,
      kind: row.finding.kind,
      repair: row.finding.repair,
      link: `${publicUrl}/findings/${row.finding.id}`,
      thumbnail,
    });
    for (const email of recipients) {
      if (await mailSent(db, eventId, email)) continue;
      await mailer.send({ to: email, ...message });
      await recordSentMail(db, { eventId, recipient: email, subject: message.subject });
    }
  };
}
