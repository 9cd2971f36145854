import { withTransaction, type Tx } from '../../db';
import {
  allowedComplianceActions,
  buildInEffect,
  checkComplianceAction,
  MAX_NOTICE_PDF_BYTES,
  type ComplianceAction,
  type ComplianceChange,
  type ComplianceStatus,
  type NoticeBuildAnswer,
  type NoticeChange,
  type NoticeDetail,
  type NoticeFile,
  type NoticeListQuery,
  type NoticeSummary,
  type Page,
  type PageQuery,
} from '../../db/contracts';
import type { AppContext } from '../context';
import { badRequest, HttpError, notFound } from '../http-error';
import { startsAsPdf, withStoredPhotos, type UploadedPhoto } from '../photos/uploads';
import { processPhoto } from '../photos/image-processing';
import type { PhotoStorage } from '../storage/photo-storage';
import type { BenchTime } from '../travelers/device-time';
import {
  findDesignNames,
  findOwnKitModel,
  findVisibleNotice,
  insertNotice,
  insertNoticeBuilds,
  insertNoticeEvent,
  insertNoticeFiles,
  insertNoticePhotos,
  listAnswerPhotos,
  listAnswers,
  listBuildsForNotice,
  listKitDesigns,
  listMembersOfBuilds,
  listNoticeFiles,
  lockAnswer,
  nextNoticeNumber,
  pageNotices,
  setAnswer,
} from './notices-repository';

type Deps = Pick<AppContext, 'db' | 'pool' | 'mailQueue' | 'storage' | 'signer'>;

/** A file's name as shown: no folders, no control characters, bounded. */
const cleanName = (name: string) =>
  (name.split(/[\\/]/).pop() ?? '')
    .replace(/[\u0000-\u001F\u007F]/g, '')
    .trim()
    .slice(0, 120) || 'file';

/** A whole PDF: its header, and the end-of-file mark a truncated upload lacks. */
const isPdf = (bytes: Buffer) => startsAsPdf(bytes) && bytes.subarray(-1024).toString('latin1').includes('%%EOF');

type StoredNoticeFile = {
  kind: 'photo' | 'pdf';
  name: string;
  fileKey: string;
  thumbKey: string | null;
  width: number | null;
  height: number | null;
};

/**
 * A notice's attachments checked (a PDF by its bytes, anything else must be a photo and is re-encoded)
 * and stored before the notice is written; on any failure their files are removed again.
 */
async function withStoredFiles<T>(
  storage: PhotoStorage,
  files: UploadedPhoto[],
  work: (stored: StoredNoticeFile[]) => Promise<T>,
): Promise<T> {
  const checked = [];
  for (const f of files) {
    const name = cleanName(f.originalname);
    if (isPdf(f.buffer)) {
      if (f.buffer.length > MAX_NOTICE_PDF_BYTES) {
        const said = `"${name}" is over ${MAX_NOTICE_PDF_BYTES / 1024 / 1024} MB`;
        throw new HttpError(413, 'too_large', said, { files: said });
      }
      checked.push({ name, pdf: f.buffer, photo: null });
    } else {
      try {
        checked.push({ name, pdf: null, photo: await processPhoto(f.buffer, f.originalname) });
      } catch (err) {
        const said = `"${name}" is neither a photo nor a PDF: send a JPEG, PNG, WebP or HEIC image, or a PDF`;
        if (err instanceof HttpError) throw new HttpError(415, 'unsupported_file', said, { files: said });
        throw err;
      }
    }
  }
  const written: string[] = [];
  try {
    const stored: StoredNoticeFile[] = [];
    for (const c of checked) {
      if (c.pdf) {
        const fileKey = await storage.put(c.pdf, 'pdf');
        written.push(fileKey);
        stored.push({ kind: 'pdf', name: c.name, fileKey, thumbKey: null, width: null, height: null });
      } else if (c.photo) {
        const fileKey = await storage.put(c.photo.full, 'jpg');
        written.push(fileKey);
        const thumbKey = await storage.put(c.photo.thumb, 'jpg');
        written.push(thumbKey);
        stored.push({ kind: 'photo', name: c.name, fileKey, thumbKey, width: c.photo.width, height: c.photo.height });
      }
    }
    return await work(stored);
  } catch (err) {
    await Promise.all(written.map((k) => storage.remove(k)));
    throw err;
  }
}

export const noticesService = (ctx: Deps) => {
  const { db, pool, mailQueue, storage, signer } = ctx;

  const fileLinks = (user: Express.User, f: { id: string; kind: 'photo' | 'pdf'; name: string }): NoticeFile => ({
    id: f.id,
    kind: f.kind,
    name: f.name,
    url: signer.sign(f.id, 'full', user.id),
    thumbUrl: f.kind === 'photo' ? signer.sign(f.id, 'thumb', user.id) : null,
  });

  /** The summary columns as the API says them: a list's rows and a notice's own page alike. */
  const summaryOf = (
    r: Omit<NoticeSummary, 'build' | 'issuedAt'> & { issuedAt: string },
  ): Omit<NoticeSummary, 'build'> => ({
    id: r.id,
    number: r.number,
    title: r.title,
    level: r.level,
    kitModelId: r.kitModelId,
    kitName: r.kitName,
    issuedAt: new Date(r.issuedAt).toISOString(),
    issuedByName: r.issuedByName,
    counts: r.counts,
  });

  const summary = (r: Awaited<ReturnType<typeof pageNotices>>['items'][number]): NoticeSummary => ({
    ...summaryOf(r),
    build:
      r.buildId && r.kitSerial && r.status ? { buildId: r.buildId, kitSerial: r.kitSerial, status: r.status } : null,
  });

  async function answers(user: Express.User, noticeId: string, buildId?: string): Promise<NoticeBuildAnswer[]> {
    const rows = await listAnswers(db, user, noticeId, buildId);
    const photos = await listAnswerPhotos(
      db,
      noticeId,
      rows.map((r) => r.buildId),
    );
    return rows.map(({ place, ...r }) => ({
      ...r,
      acknowledgedAt: r.acknowledgedAt?.toISOString() ?? null,
      answeredAt: r.answeredAt?.toISOString() ?? null,
      photos: photos
        .filter((p) => p.buildId === r.buildId)
        .map((p) => fileLinks(user, { id: p.id, kind: 'photo', name: 'photo.jpg' })),
      allowed: allowedComplianceActions(place, r.status),
    }));
  }

  async function detail(user: Express.User, id: string): Promise<NoticeDetail> {
    const n = await findVisibleNotice(db, user, id);
    if (!n) throw notFound('notice');
    const [files, designs, builds] = await Promise.all([
      listNoticeFiles(db, id),
      findDesignNames(
        db,
        n.parts.map((p) => p.partDesignId),
      ),
      answers(user, id),
    ]);
    const named = new Map(designs.map((d) => [d.id, d]));
    return {
      ...summaryOf(n),
      body: n.body,
      effectivity: {
        serialFrom: n.serialFrom,
        serialTo: n.serialTo,
        reaches: n.reaches,
        parts: n.parts.map((p) => ({
          partDesignId: p.partDesignId,
          partNumber: named.get(p.partDesignId)?.partNumber ?? '?',
          name: named.get(p.partDesignId)?.name ?? '',
          letters: p.letters,
        })),
      },
      files: files.map((f) => fileLinks(user, f)),
      builds,
    };
  }

  /** A build's answer locked, the reader's right checked on it (404 before 403: what they may not see is not there). */
  async function answerUnderLock(
    user: Express.User,
    noticeId: string,
    buildId: string,
    action: ComplianceAction,
    work: (tx: Tx, n: { number: number; title: string; status: ComplianceStatus }) => Promise<void>,
  ) {
    const n = await findVisibleNotice(db, user, noticeId);
    if (!n) throw notFound('notice');
    const [mine] = await listAnswers(db, user, noticeId, buildId);
    if (!mine) throw notFound('build this notice reached');
    await withTransaction(pool, async (tx) => {
      const locked = await lockAnswer(tx.db, noticeId, buildId);
      if (!locked) throw notFound('build this notice reached');
      const refusal = checkComplianceAction(mine.place, locked.status, action);
      if (refusal) throw new HttpError(refusal.code, refusal.code === 403 ? 'forbidden' : 'conflict', refusal.message);
      await work(tx, { number: n.number, title: n.title, status: locked.status });
    });
  }

  return {
    async list(user: Express.User, by: NoticeListQuery, q: PageQuery): Promise<Page<NoticeSummary>> {
      const page = await pageNotices(db, user, by, q);
      return { items: page.items.map(summary), next: page.next };
    },

    detail,

    /**
     * Issues a notice: its files stored, its effectivity resolved against every build of the kit model
     * as they stand now, each build reached given a log entry, and one mail job per person on those
     * builds, all in one unit of work (the mails go if and only if the notice exists).
     */
    async issue(user: Express.User, input: NoticeChange, files: UploadedPhoto[]): Promise<NoticeDetail> {
      const organizationId = user.organizationId;
      if (!organizationId) throw notFound('kit model');
      const kit = await findOwnKitModel(db, organizationId, input.kitModelId);
      if (!kit) throw notFound('kit model');
      const designs = new Map((await listKitDesigns(db, kit.id)).map((d) => [d.id, d]));
      for (const [i, p] of input.parts.entries()) {
        const d = designs.get(p.partDesignId);
        if (!d)
          throw badRequest(`part ${i + 1} is not a design of kit ${kit.code}`, {
            [`parts.${i}`]: 'not a design of this kit',
          });
        const unknown = p.letters.filter((l) => !d.letters.includes(l));
        if (unknown.length)
          throw badRequest(`${d.partNumber} has no published revision ${unknown.join(', ')}`, {
            [`parts.${i}.letters`]: `no published revision ${unknown.join(', ')} (it has ${d.letters.join(', ') || 'none'})`,
          });
      }
      const effectivity = {
        serialFrom: input.serialFrom ?? null,
        serialTo: input.serialTo ?? null,
        parts: input.parts.map((p) => ({ partDesignId: p.partDesignId, letters: [...new Set(p.letters)] })),
        reaches: input.reaches,
      };
      const id = await withStoredFiles(storage, files, (stored) =>
        withTransaction(pool, async (tx) => {
          const number = await nextNoticeNumber(tx.db, organizationId);
          const notice = await insertNotice(tx.db, {
            organizationId,
            kitModelId: kit.id,
            number,
            level: input.level,
            title: input.title,
            body: input.body,
            ...effectivity,
            issuedBy: user.id,
          });
          await insertNoticeFiles(
            tx.db,
            stored.map((s, position) => ({ ...s, position, noticeId: notice.id })),
          );
          const reached = (await listBuildsForNotice(tx.db, organizationId, kit.id)).flatMap((b) => {
            const parts = buildInEffect(effectivity, b.kitSerial, b.parts);
            return parts ? [{ ...b, parts }] : [];
          });
          await insertNoticeBuilds(
            tx.db,
            reached.map((b) => ({
              noticeId: notice.id,
              buildId: b.buildId,
              travelerIds: b.parts.map((p) => p.travelerId),
            })),
          );
          for (const b of reached) {
            await insertNoticeEvent(tx.db, {
              buildId: b.buildId,
              actorId: user.id,
              kind: 'notice_received',
              detail: { noticeId: notice.id, number, title: input.title, level: input.level, parts: b.parts.length },
              doneAt: notice.issuedAt,
              createdAt: notice.issuedAt,
            });
          }
          // One job per person, however many of their builds it reached: a retry after one mail server
          // refusal does not send the others again, and the worker records each mail once sent.
          const people = new Set(
            (
              await listMembersOfBuilds(
                tx.db,
                reached.map((b) => b.buildId),
              )
            ).map((m) => m.userId),
          );
          for (const userId of people) await mailQueue.enqueue(tx, { noticeId: notice.id, userId });
          return notice.id;
        }),
      );
      return detail(user, id);
    },

    /** Someone on the build has read the notice: a log entry of the build. */
    async acknowledge(user: Express.User, noticeId: string, buildId: string, at: BenchTime) {
      await answerUnderLock(user, noticeId, buildId, 'acknowledge', async (tx, n) => {
        await setAnswer(tx.db, noticeId, buildId, {
          status: 'acknowledged',
          acknowledgedBy: user.id,
          acknowledgedAt: at.doneAt ?? new Date(),
        });
        await insertNoticeEvent(tx.db, {
          buildId,
          actorId: user.id,
          kind: 'notice_acknowledged',
          detail: { noticeId, number: n.number, title: n.title },
          doneAt: at.doneAt ?? undefined,
          clockOffsetMs: at.clockOffsetMs,
        });
      });
      return (await answers(user, noticeId, buildId))[0];
    },

    /**
     * What the build did about it (done, with a note and photos), or why it does not apply. Recording
     * again is a new log entry: the answer shows the latest, the log keeps both.
     */
    async recordCompliance(
      user: Express.User,
      noticeId: string,
      buildId: string,
      input: ComplianceChange,
      files: UploadedPhoto[],
      at: BenchTime,
    ) {
      if (input.outcome === 'not_applicable' && files.length)
        throw badRequest('photos go with work done: a notice that does not apply needs only the reason', {
          photos: 'leave photos out when it does not apply',
        });
      await withStoredPhotos(storage, files, (keys) =>
        answerUnderLock(user, noticeId, buildId, 'record', async (tx, n) => {
          const note = input.outcome === 'done' ? input.note : null;
          const reason = input.outcome === 'not_applicable' ? input.reason : null;
          await setAnswer(tx.db, noticeId, buildId, {
            status: input.outcome,
            answeredBy: user.id,
            answeredAt: at.doneAt ?? new Date(),
            note,
            reason,
            // Recording what was done says it was read, too.
            ...(n.status === 'open' ? { acknowledgedBy: user.id, acknowledgedAt: at.doneAt ?? new Date() } : {}),
          });
          const eventId = await insertNoticeEvent(tx.db, {
            buildId,
            actorId: user.id,
            kind: 'notice_answered',
            detail: {
              noticeId,
              number: n.number,
              title: n.title,
              outcome: input.outcome,
              ...(note ? { note } : { reason }),
              ...(keys.length ? { photos: keys.length } : {}),
            },
            doneAt: at.doneAt ?? undefined,
            clockOffsetMs: at.clockOffsetMs,
          });
          await insertNoticePhotos(
            tx.db,
            keys.map((k) => ({ ...k, noticeId, buildId, eventId, uploadedBy: user.id })),
          );
        }),
      );
      return (await answers(user, noticeId, buildId))[0];
    },
  };
};
