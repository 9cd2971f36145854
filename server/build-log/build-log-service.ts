import type { Writable } from 'node:stream';
import {
  benchLogKinds,
  describeHoleRuns,
  dispositionLabels,
  memberPlaceLabels,
  memberPlaces,
  type MemberPlace,
  noticeLevels,
  noticeLevelLabels,
  type NoticeLevel,
  expandKindFilter,
  findingKindLabels,
  findingLogKindOfAction,
  groupOfKind,
  buildLogKinds,
  fabricationTable,
  logEntryMatches,
  helpWords,
  stepPerformers,
  type StepPerformer,
  type BuildLogEntry,
  type BuildLogGroup,
  type BuildLogKind,
  type BuildLogPage,
  type BuildLogPageQuery,
  type BuildLogPart,
  type BuildLogQuery,
} from '../../db/contracts';
import type { AppContext } from '../context';
import { listFabricationSteps, listVisibleBuilds } from '../builds/builds-repository';
import { badRequest, busy, notFound } from '../http-error';
import { encodeCursor } from '../pagination';
import { hoursText } from '../../lib/hours-text';
import { csvChainHead, csvHead, csvLines } from './build-log-csv';
import { chainHead } from './log-chain-repository';
import { listWorkPhotosOfEvents, readBuildHours } from '../travelers/work-repository';
import { listBuildAnswers, listNoticePhotosOfEvents } from '../notices/notices-repository';
import type { LogSummary, Thumbs } from './build-log-pdf';
import { MAX_PDF_THREADS, reservePdfThread, startPdfThread, type PdfThread } from './build-log-pdf-thread';
import {
  compareKeys,
  listBenchEvents,
  listBuildEvents,
  listFindingLogEvents,
  listLogParts,
  listLogPhotos,
  listSummaryFindings,
  listSummaryParts,
  tallyLog,
  type FindingLogKind,
  type LogKey,
  type LogOrder,
  type LogRead,
  type LogSource,
  type LogWindow,
} from './build-log-repository';
import { nextDay, startOfDay } from '../../lib/zoned-time';

type Deps = Pick<AppContext, 'db' | 'signer' | 'storage' | 'config'>;
type BenchRow = Awaited<ReturnType<typeof listBenchEvents>>[number];
type FindingRow = Awaited<ReturnType<typeof listFindingLogEvents>>[number];
type BuildRow = Awaited<ReturnType<typeof listBuildEvents>>[number];
/** A row of any source with its place in the log. */
type Raw =
  | { key: LogKey; src: 't'; row: BenchRow }
  | { key: LogKey; src: 'f'; row: FindingRow }
  | { key: LogKey; src: 'b'; row: BuildRow };

/** Rows an export reads and writes at a time: one keyset read per source, one write, then the event loop's turn. */
export const EXPORT_BATCH = 1000;
/**
 * A photo link in an exported file lasts 30 days: the file goes to an inspector, who opens it later than
 * a screen would. It still names the person who exported it, whose right to see the photo is checked on
 * every load.
 */
const FILE_LINK_TTL_S = 30 * 86_400;
/** Rows a page request looks through for search words before it answers with what it found and a cursor. */
const SEARCH_SCAN_MAX = 5000;

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;
const KEY_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{6}$/;

export const encodeLogCursor = (k: LogKey) => encodeCursor(k);

/** The key a cursor carries; anything this server did not give (or made for another list) is a 400, never a database error. */
export function decodeLogCursor(cursor: string): LogKey {
  let key: unknown;
  try {
    key = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8'));
  } catch {
    key = null;
  }
  const ok =
    Array.isArray(key) &&
    key.length === 3 &&
    typeof key[0] === 'string' &&
    KEY_TIME.test(key[0]) &&
    !Number.isNaN(Date.parse(`${key[0].slice(0, 23)}Z`)) &&
    (key[1] === 'b' || key[1] === 'f' || key[1] === 't') &&
    typeof key[2] === 'string' &&
    UUID.test(key[2]);
  if (!ok)
    throw badRequest('cursor is not one this log gave: start again from the first page', {
      cursor: 'not a cursor of this log',
    });
  return key as unknown as LogKey;
}

/** Yields to the event loop: other requests (the health check among them) run between two batches. */
const turn = () => new Promise<void>((resolve) => setImmediate(resolve));

/** Longest stretch an export works before it lets other requests run: the health check's budget is 100 ms at p99. */
const SLICE_MS = 8;

/**
 * Runs `fn` over `items` a few at a time, giving the event loop its turn whenever SLICE_MS has passed
 * (laying out a PDF entry costs about a millisecond, so a whole batch in one go would stall the server).
 */
async function inSlices<T>(
  items: readonly T[],
  fn: (slice: readonly T[]) => void | Promise<void>,
  size = 8,
): Promise<void> {
  let since = performance.now();
  for (let i = 0; i < items.length; i += size) {
    await fn(items.slice(i, i + size));
    if (performance.now() - since > SLICE_MS) {
      await turn();
      since = performance.now();
    }
  }
}

/** Resolves when `out` can take more, or when it is gone (a reader that left never drains). */
function drained(out: Writable): Promise<void> {
  if (!out.writableNeedDrain || out.destroyed) return Promise.resolve();
  return new Promise((resolve) => {
    const done = () => {
      out.off('drain', done);
      out.off('close', done);
      resolve();
    };
    out.on('drain', done);
    out.on('close', done);
  });
}

// One collator for every comparison: localeCompare with options builds a new one each call (slow over 50,000 entries).
/** An entry's times as the log shows them: done (its place in the log), received, and the device's clock offset. */
function timesOf(r: { doneAt: Date; createdAt: Date; clockOffsetMs: number | null; hash: string | null }) {
  return {
    at: r.doneAt.toISOString(),
    receivedAt: r.createdAt.toISOString(),
    clockOffsetMs: r.clockOffsetMs,
    hash: r.hash,
  };
}

const natural = new Intl.Collator(undefined, { numeric: true }).compare;
const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

function holesOf(detail: Record<string, unknown>): string[] {
  const ids = detail.holeIds;
  return Array.isArray(ids) ? ids.filter((x): x is string => typeof x === 'string').sort(natural) : [];
}

/** Who did a step's work when it was not the builder who recorded it: " by a helper, Sam Ortiz". */
function performedBy(detail: Record<string, unknown>): string {
  const by = detail.by;
  if (typeof by !== 'string' || !(stepPerformers as readonly string[]).includes(by)) return '';
  const help = helpWords(by as StepPerformer, typeof detail.byName === 'string' ? detail.byName : null);
  return help ? ` by ${help}` : '';
}

/** A bench event as a sentence. The detail is free JSON written by the travelers service. */
export function describeBench(
  kind: string,
  detail: Record<string, unknown>,
): { kind: BuildLogKind; text: string; holeIds?: string[]; note?: string; group?: BuildLogGroup } {
  switch (kind) {
    case 'holes_installed':
    case 'holes_pending': {
      const holeIds = holesOf(detail);
      const runs = describeHoleRuns(holeIds);
      const text =
        kind === 'holes_installed'
          ? holeIds.length === 1
            ? `Installed hole ${runs}.`
            : `Installed ${plural(holeIds.length, 'hole')}: ${runs}.`
          : holeIds.length === 1
            ? `Set hole ${runs} back to pending.`
            : `Set ${plural(holeIds.length, 'hole')} back to pending: ${runs}.`;
      return { kind, text, holeIds };
    }
    case 'step_done':
    case 'step_undone':
    case 'step_stamped': {
      const seq = typeof detail.seq === 'number' ? detail.seq : null;
      const what = typeof detail.text === 'string' ? detail.text : '';
      const step = seq === null ? 'A step' : `Step ${seq}`;
      if (kind === 'step_undone') return { kind, text: `${step} set back to not done: ${what}` };
      if (kind === 'step_stamped') return { kind, text: `Stamped inspection point ${step.toLowerCase()}: ${what}` };
      return { kind, text: `${step} done${performedBy(detail)}: ${what}` };
    }
    case 'signed_off':
      return { kind, text: 'Signed the part off: every hole and step done, no finding open.' };
    case 'sign_off_withdrawn': {
      const by = typeof detail.signedOffByName === 'string' ? ` by ${detail.signedOffByName}` : '';
      const at =
        typeof detail.signedOffAt === 'string' ? ` of ${detail.signedOffAt.slice(0, 16).replace('T', ' ')} UTC` : '';
      return {
        kind,
        text: `Withdrew the sign-off${by}${at}: the part is open again. The sign-off stays in the log.`,
        ...(typeof detail.reason === 'string' && detail.reason ? { note: detail.reason } : {}),
      };
    }
    case 'work_started':
      return { kind, text: `Started work on the part${performedBy(detail)}.` };
    case 'work_stopped':
    case 'hours_entered': {
      const h = typeof detail.hours === 'number' ? detail.hours : null;
      const span = h === null ? '' : ` (${hoursText(h)})`;
      return {
        kind,
        text:
          kind === 'work_stopped'
            ? `Stopped work on the part${performedBy(detail)}${span}.`
            : `Entered ${h === null ? 'hours' : hoursText(h)} worked on the part${performedBy(detail)}.`,
      };
    }
    case 'photos_added': {
      const n = typeof detail.count === 'number' ? detail.count : 0;
      const holeIds = holesOf(detail);
      const of = [
        typeof detail.seq === 'number' ? `step ${detail.seq}` : '',
        holeIds.length ? `hole${holeIds.length === 1 ? '' : 's'} ${describeHoleRuns(holeIds)}` : '',
      ].filter(Boolean);
      return {
        kind,
        text: `Added ${plural(n, 'photo')} of the work${of.length ? ` on ${of.join(', ')}` : ''}.`,
        ...(holeIds.length ? { holeIds } : {}),
        ...(typeof detail.note === 'string' && detail.note ? { note: detail.note } : {}),
      };
    }
    case 'revision_changed': {
      const from = typeof detail.fromLetter === 'string' ? ` from revision ${detail.fromLetter}` : '';
      const to = typeof detail.toLetter === 'string' ? `revision ${detail.toLetter}` : 'the newest revision';
      const holes = typeof detail.holes === 'number' ? ` (${plural(detail.holes, 'hole')} made again)` : '';
      return { kind, text: `Moved the part${from} to ${to} before any work on it${holes}.` };
    }
    case 'part_replaced': {
      const by = typeof detail.replacementSerial === 'string' ? detail.replacementSerial : 'a new part';
      const why = detail.reason === 'return_to_supplier' ? 'returned to the supplier' : 'scrapped';
      return { kind, text: `The part was ${why}; ${by} replaces it.` };
    }
    default:
      return { kind: 'other', text: `Recorded a bench event (${kind.replace(/_/g, ' ')}).` };
  }
}

/** A finding event as a sentence; the person's own words stay in `note`. */
export function describeFinding(
  r: Pick<FindingRow, 'action' | 'toStatus' | 'disposition' | 'holeIds' | 'findingKind' | 'closure'>,
): { kind: BuildLogKind; text: string } {
  const holes = describeHoleRuns([...r.holeIds].sort(natural));
  const on = r.holeIds.length === 1 ? `hole ${holes}` : `holes ${holes}`;
  const kind = findingLogKindOfAction[r.action];
  const disposition = r.disposition ? dispositionLabels[r.disposition].toLowerCase() : '';
  switch (r.action) {
    case 'raise':
      return { kind, text: `Raised a finding on ${on}: ${findingKindLabels[r.findingKind].toLowerCase()}.` };
    case 'disposition':
      return {
        kind,
        text: `Dispositioned ${on}: ${disposition}${r.toStatus === 'closed' ? '; the part is replaced' : ''}.`,
      };
    case 'amend':
      return { kind, text: `Amended the disposition of ${on} to ${disposition}.` };
    case 'not-a-defect':
      return { kind, text: `Closed the finding on ${on}: not a defect.` };
    case 'approve':
      return { kind, text: `Approved the disposition of ${on} as design authority.` };
    case 'refuse':
      return { kind, text: `Refused the disposition of ${on} as design authority: back to the inspector.` };
    case 'report-done':
      return { kind, text: `Reported the ordered work on ${on} as done.` };
    case 'accept':
      return { kind, text: `Accepted the work on ${on}; the finding is closed.` };
    case 'send-back':
      return { kind, text: `Sent the work on ${on} back to be done again.` };
    case 'part-replaced':
      return { kind, text: `Closed the finding on ${on}: the part was replaced.` };
  }
}

/** The build's own events a kind filter reads: its people, and the notices it got and answered. */
const BUILD_EVENT_KINDS: readonly string[] = buildLogKinds.filter((k) => {
  const group = groupOfKind(k);
  return group === 'people' || group === 'notices';
});

/** "notice 3, Check the nose rib flange" as the build's log names a notice. */
function noticeName(detail: Record<string, unknown>): string {
  const n = typeof detail.number === 'number' ? ` ${detail.number}` : '';
  const title = typeof detail.title === 'string' ? `, “${detail.title}”` : '';
  return `notice${n}${title}`;
}

/** A change of the build's people, or a notice it got or answered, as a sentence. */
export function describeBuildEvent(
  kind: string,
  detail: Record<string, unknown>,
): { kind: BuildLogKind; text: string; note?: string } {
  const name = typeof detail.name === 'string' ? detail.name : 'someone';
  const place =
    typeof detail.place === 'string' && (memberPlaces as readonly string[]).includes(detail.place)
      ? memberPlaceLabels[detail.place as MemberPlace].toLowerCase()
      : 'a member';
  switch (kind) {
    case 'member_added':
      return { kind, text: `Added ${name} to the build as ${place}.` };
    case 'member_invited':
      return { kind, text: `Invited ${name} by mail to join the build as ${place}.` };
    case 'member_joined':
      return { kind, text: `${name} joined the build as ${place}.` };
    case 'member_removed':
      return { kind, text: `Took ${name} (${place}) off the build.` };
    case 'serial_changed':
      return {
        kind: 'other',
        text: `Changed the kit serial${typeof detail.from === 'string' ? ` from ${detail.from}` : ''} to ${typeof detail.to === 'string' ? detail.to : 'a new one'} (before any work was recorded).`,
      };
    case 'note_changed':
      return {
        kind: 'other',
        text:
          typeof detail.to === 'string' && detail.to
            ? `Changed the build's note to: ${detail.to}`
            : "Cleared the build's note.",
      };
    case 'notice_received': {
      const level =
        typeof detail.level === 'string' && (noticeLevels as readonly string[]).includes(detail.level)
          ? noticeLevelLabels[detail.level as NoticeLevel].toLowerCase()
          : 'a';
      const parts =
        typeof detail.parts === 'number' && detail.parts > 0
          ? ` It reaches ${plural(detail.parts, 'part')} of this build.`
          : '';
      return { kind, text: `The supplier issued ${noticeName(detail)} (${level}).${parts}` };
    }
    case 'notice_acknowledged':
      return { kind, text: `Acknowledged ${noticeName(detail)}.` };
    case 'notice_answered': {
      const photos =
        typeof detail.photos === 'number' && detail.photos > 0 ? `, with ${plural(detail.photos, 'photo')}` : '';
      const words =
        typeof detail.note === 'string' ? detail.note : typeof detail.reason === 'string' ? detail.reason : '';
      return {
        kind,
        text:
          detail.outcome === 'not_applicable'
            ? `Recorded that ${noticeName(detail)} does not apply to this build.`
            : `Recorded ${noticeName(detail)} as done${photos}.`,
        ...(words ? { note: words } : {}),
      };
    }
    case 'owner_changed':
      return {
        kind,
        text: `Handed the build${typeof detail.from === 'string' ? ` from ${detail.from}` : ''} to ${typeof detail.to === 'string' ? detail.to : 'a new owner'}, with its whole log.`,
      };
    default:
      return { kind: 'other', text: `Recorded a change to the build (${kind.replace(/_/g, ' ')}).` };
  }
}

/** The person's filters as the repository's window; a day given as a date is a whole day in `tz`. */
function windowOf(buildId: string, q: BuildLogQuery): LogWindow {
  const tz = q.tz ?? 'UTC';
  const dateOnly = (s: string) => /^\d{4}-\d{2}-\d{2}$/.test(s);
  const from = q.from ? (dateOnly(q.from) ? startOfDay(q.from, tz) : new Date(q.from)) : undefined;
  const before = q.to
    ? dateOnly(q.to)
      ? startOfDay(nextDay(q.to), tz)
      : new Date(new Date(q.to).getTime() + 1)
    : undefined;
  if (from && before && from >= before)
    throw badRequest('the end of the date range (to) is before its start (from)', { to: 'is before from' });

  const kinds = q.kind?.length ? expandKindFilter(q.kind) : null;
  const knownBenchKinds: readonly string[] = benchLogKinds;
  return {
    buildId,
    travelerId: q.travelerId,
    from,
    before,
    knownBenchKinds,
    // A withdrawal goes with the sign-offs: a filtered log never shows a sign-off without its withdrawal.
    benchKinds: kinds
      ? [
          ...new Set([
            ...kinds.filter((k) => knownBenchKinds.includes(k)),
            ...(kinds.includes('signed_off') ? ['sign_off_withdrawn'] : []),
          ]),
        ]
      : null,
    otherBench: kinds ? kinds.includes('other') : true,
    findingKinds: kinds ? kinds.filter((k): k is FindingLogKind => k.startsWith('finding_')) : null,
    buildKinds: kinds ? kinds.filter((k) => BUILD_EVENT_KINDS.includes(k)) : null,
  };
}

export const buildLogService = ({ db, signer, storage, config }: Deps) => {
  /** The build, its parts and the window, or the 404/400 that answers before anything is read or sent. */
  async function open(user: Express.User, buildId: string, q: BuildLogQuery) {
    const [build] = await listVisibleBuilds(db, user, buildId);
    if (!build) throw notFound('build');
    const w = windowOf(buildId, q);
    const parts: BuildLogPart[] = await listLogParts(db, user, buildId);
    if (q.travelerId && !parts.some((p) => p.travelerId === q.travelerId)) throw notFound('part of this build');
    return { build, parts, w };
  }

  /** One keyset read of one source, its rows tagged with their keys. */
  async function readSource(user: Express.User, w: LogWindow, src: LogSource, r: LogRead): Promise<Raw[]> {
    switch (src) {
      case 't':
        return (await listBenchEvents(db, user, w, r)).map((row) => ({
          key: [row.sortKey, 't', row.id] as const,
          src,
          row,
        }));
      case 'f':
        return (await listFindingLogEvents(db, user, w, r)).map((row) => ({
          key: [row.sortKey, 'f', row.id] as const,
          src,
          row,
        }));
      case 'b':
        return (await listBuildEvents(db, user, w, r)).map((row) => ({
          key: [row.sortKey, 'b', row.id] as const,
          src,
          row,
        }));
    }
  }

  /**
   * The three sources merged in one order, in batches of at most `batch` rows: each source is read by
   * keyset `batch` rows at a time, and a batch ends early when a source must be read again before the
   * merge can go on. Memory is three reads, whatever the length of the log.
   */
  async function* merged(
    user: Express.User,
    w: LogWindow,
    start: LogKey | null,
    order: LogOrder,
    batch: number,
  ): AsyncGenerator<Raw[]> {
    const readers = (['b', 'f', 't'] as const).map((src) => ({
      src,
      buf: [] as Raw[],
      pos: 0,
      done: false,
      after: start,
    }));
    const fill = async (r: (typeof readers)[number]) => {
      if (r.done || r.pos < r.buf.length) return;
      r.buf = await readSource(user, w, r.src, { after: r.after, order, limit: batch });
      r.pos = 0;
      r.done = r.buf.length < batch;
      if (r.buf.length) r.after = r.buf[r.buf.length - 1].key;
    };
    // Each turn yields at least one row or ends, so the rows of the log bound it.
    for (;;) {
      await Promise.all(readers.map(fill));
      const out: Raw[] = [];
      while (out.length < batch) {
        let best: (typeof readers)[number] | null = null;
        for (const r of readers) {
          if (r.pos < r.buf.length && (!best || compareKeys(r.buf[r.pos].key, best.buf[best.pos].key, order) < 0))
            best = r;
        }
        if (!best) break;
        out.push(best.buf[best.pos++]);
        if (best.pos === best.buf.length && !best.done) break; // its next rows must be read before anything else is placed
      }
      if (!out.length) return;
      yield out;
    }
  }

  /** Rows as entries, with the photos of this batch only (signed links), in the rows' order. */
  async function entriesOf(user: Express.User, buildId: string, rows: Raw[], withPhotos: boolean, linkTtl?: number) {
    const photoFindings = withPhotos
      ? [
          ...new Set(
            rows.flatMap((r) =>
              r.src === 'f' && (r.row.action === 'raise' || r.row.action === 'report-done') ? [r.row.findingId] : [],
            ),
          ),
        ]
      : [];
    const workEvents = withPhotos
      ? rows.flatMap((r) => (r.src === 't' && r.row.kind === 'photos_added' ? [r.row.id] : []))
      : [];
    // The build's own events are of a build the reader sees (open() checked it): its answers' photos come with them.
    const answerEvents = withPhotos
      ? rows.flatMap((r) => (r.src === 'b' && r.row.kind === 'notice_answered' ? [r.row.id] : []))
      : [];
    const [photos, work, answers] = await Promise.all([
      listLogPhotos(db, user, buildId, photoFindings),
      listWorkPhotosOfEvents(db, user, workEvents),
      listNoticePhotosOfEvents(db, answerEvents),
    ]);
    const signed = (ps: readonly { id: string }[]) =>
      ps.map((p) => ({
        id: p.id,
        thumbUrl: signer.sign(p.id, 'thumb', user.id, linkTtl),
        url: signer.sign(p.id, 'full', user.id, linkTtl),
      }));
    const entryOf = (raw: Raw): BuildLogEntry => {
      if (raw.src === 'b') {
        const r = raw.row;
        const d = describeBuildEvent(r.kind, r.detail ?? {});
        const mine = answers.filter((p) => p.eventId === r.id);
        return {
          id: `b:${r.id}`,
          ...timesOf(r),
          actorName: r.actorName,
          actorRole: r.actorRole,
          travelerId: null,
          travelerSerial: r.kitSerial,
          partNumber: 'Build',
          partName: 'the whole build',
          kind: d.kind,
          group: groupOfKind(d.kind),
          text: d.text,
          ...(d.note ? { note: d.note } : {}),
          ...(mine.length ? { photos: signed(mine) } : {}),
        };
      }
      const r = raw.row;
      const common = {
        ...timesOf(r),
        actorName: r.actorName,
        actorRole: r.actorRole,
        travelerId: r.travelerId,
        travelerSerial: r.serial,
        partNumber: r.partNumber,
        partName: r.partName,
      };
      if (raw.src === 't') {
        const b = raw.row;
        const d = describeBench(b.kind, b.detail ?? {});
        const mine = work.filter((p) => p.eventId === b.id);
        return {
          id: `t:${b.id}`,
          ...common,
          kind: d.kind,
          group: d.group ?? groupOfKind(d.kind),
          text: d.text,
          ...(d.holeIds ? { holeIds: d.holeIds } : {}),
          ...(d.note ? { note: d.note } : {}),
          ...(mine.length ? { photos: signed(mine) } : {}),
        };
      }
      const f = raw.row;
      const d = describeFinding(f);
      // The photos of the hole as found go with the raise; those of the work with the event they came with.
      const own = photos.filter(
        (p) => p.findingId === f.findingId && (f.action === 'raise' ? p.eventId === null : p.eventId === f.id),
      );
      return {
        id: `f:${f.id}`,
        ...common,
        kind: d.kind,
        group: groupOfKind(d.kind),
        text: d.text,
        holeIds: [...f.holeIds].sort(natural),
        findingId: f.findingId,
        ...(f.note ? { note: f.note } : {}),
        ...(own.length ? { photos: signed(own) } : {}),
      };
    };
    // A thousand sentences (hole runs sorted, times placed) are a stretch of work of their own: in slices.
    const entries: BuildLogEntry[] = [];
    await inSlices(
      rows,
      (slice) => {
        for (const raw of slice) entries.push(entryOf(raw));
      },
      50,
    );
    return { entries, photos: [...photos, ...work, ...answers] };
  }

  /**
   * An export's batches, oldest first: entries with the search words applied, and the photos' storage
   * keys of the batch. Between two batches the event loop gets its turn.
   */
  async function* exportBatches(
    user: Express.User,
    buildId: string,
    w: LogWindow,
    q: BuildLogQuery,
    withPhotos: boolean,
    linkTtl?: number,
  ) {
    for await (const rows of merged(user, w, null, 'asc', EXPORT_BATCH)) {
      const { entries, photos } = await entriesOf(user, buildId, rows, withPhotos, linkTtl);
      const shown = q.q ? entries.filter((e) => logEntryMatches(e, q.q!)) : entries;
      const listed = new Set(shown.flatMap((e) => e.photos?.map((p) => p.id) ?? []));
      yield {
        entries: shown,
        thumbKeys: photos.filter((p) => listed.has(p.id)).map((p) => [p.id, p.thumbKey] as const),
      };
      await turn();
    }
  }

  const fileStem = (kitSerial: string) =>
    `build-log-${kitSerial.replace(/[^A-Za-z0-9._-]+/g, '_')}-${new Date().toISOString().slice(0, 10)}`;
  const isoOf = (key: string | null) => (key ? new Date(`${key.slice(0, 23)}Z`).toISOString() : null);

  return {
    /**
     * One page, newest first. Search words are matched on the sentences, which are made here, so a page
     * with words reads on in batches until it is full, or until SEARCH_SCAN_MAX rows were looked at: then
     * it answers with what it found and a cursor at the last row looked at.
     */
    async page(user: Express.User, buildId: string, q: BuildLogPageQuery): Promise<BuildLogPage> {
      const start = q.cursor ? decodeLogCursor(q.cursor) : null;
      const { build, parts, w } = await open(user, buildId, q);
      const found: { key: LogKey; entry: BuildLogEntry }[] = [];
      let scanned = 0;
      let lastSeen: LogKey | null = null;
      let exhausted = true;
      for await (const rows of merged(user, w, start, 'desc', q.limit + 1)) {
        const { entries } = await entriesOf(user, buildId, rows, true);
        entries.forEach((entry, i) => {
          if (!q.q || logEntryMatches(entry, q.q)) found.push({ key: rows[i].key, entry });
        });
        scanned += rows.length;
        lastSeen = rows[rows.length - 1].key;
        if (found.length > q.limit || (q.q && scanned >= SEARCH_SCAN_MAX)) {
          exhausted = false;
          break;
        }
      }
      const items = found.slice(0, q.limit);
      const next =
        found.length > q.limit
          ? encodeLogCursor(items[items.length - 1].key)
          : !exhausted && lastSeen
            ? encodeLogCursor(lastSeen)
            : null;
      return { items: items.map((f) => f.entry), next, ...(start ? {} : { build, parts }) };
    },

    /**
     * The CSV: checks first (a 404 or 400 is still a JSON answer), then `write` streams it into `out`
     * batch by batch, waiting whenever the reader is behind and stopping when the reader is gone.
     */
    async csv(user: Express.User, buildId: string, q: BuildLogQuery) {
      const { build, w } = await open(user, buildId, q);
      const tz = q.tz ?? 'UTC';
      // Read before the first row: the file's last line gives the chain as its export began.
      const { head } = await chainHead(db, user, buildId);
      return {
        filename: `${fileStem(build.kitSerial)}.csv`,
        async write(out: Writable) {
          const gone = () => out.destroyed || out.writableEnded;
          out.write(csvHead());
          for await (const { entries } of exportBatches(user, buildId, w, q, true, FILE_LINK_TTL_S)) {
            if (gone()) return;
            await inSlices(
              entries,
              async (slice) => {
                if (!gone() && !out.write(csvLines(slice, tz, config.publicUrl))) await drained(out);
              },
              64,
            );
          }
          if (!gone()) out.end(csvChainHead(head));
        },
      };
    },

    /**
     * The PDF: checks and the title block's count first, then `write` renders it into `out` batch by
     * batch, each batch's thumbnails read from storage and dropped with it. A photo that cannot be read
     * shows as a gap; it does not fail the log.
     */
    async pdf(user: Express.User, buildId: string, q: BuildLogQuery) {
      const release = reservePdfThread();
      if (!release)
        throw busy(
          `${MAX_PDF_THREADS} PDF logs are being made already: try again in a minute (the CSV is not limited)`,
          60,
        );
      try {
        return await pdfExport(user, buildId, q, release);
      } catch (err) {
        release();
        throw err;
      }
    },
  };

  /** The printed log's summary: hours by who, the fabrication table, parts signed off, findings and their closing, notices and their answers. */
  async function summaryOf(user: Express.User, buildId: string): Promise<LogSummary> {
    const [hours, steps, parts, found, answered] = await Promise.all([
      readBuildHours(db, user, buildId),
      listFabricationSteps(db, user, buildId),
      listSummaryParts(db, user, buildId),
      listSummaryFindings(db, user, buildId),
      listBuildAnswers(db, user, buildId),
    ]);
    return {
      hours,
      fabrication: fabricationTable(steps),
      parts: parts.map((p) => ({ ...p, signedOffAt: p.signedOffAt?.toISOString() ?? null })),
      findings: found.rows.map((f) => ({ ...f, raisedAt: f.raisedAt.toISOString() })),
      findingsTotal: found.total,
      notices: answered.rows.map((n) => ({
        ...n,
        issuedAt: n.issuedAt.toISOString(),
        answeredAt: n.answeredAt?.toISOString() ?? null,
      })),
      noticesTotal: answered.total,
    };
  }

  async function pdfExport(user: Express.User, buildId: string, q: BuildLogQuery, release: () => void) {
    const { build, parts, w } = await open(user, buildId, q);
    let tally: { n: number; first: string | null; last: string | null };
    if (!q.q) tally = await tallyLog(db, user, w);
    else {
      // Search words are matched on the sentences made here: a first pass counts them, batch by batch.
      tally = { n: 0, first: null, last: null };
      for await (const { entries } of exportBatches(user, buildId, w, q, false)) {
        if (!entries.length) continue;
        tally.n += entries.length;
        tally.first ??= entries[0].at;
        tally.last = entries[entries.length - 1].at;
      }
      tally = {
        n: tally.n,
        first: tally.first && tally.first.replace('Z', '000'),
        last: tally.last && tally.last.replace('Z', '000'),
      };
    }
    const generatedAt = new Date();
    const [{ head }, summary] = await Promise.all([chainHead(db, user, buildId), summaryOf(user, buildId)]);
    return {
      filename: `${fileStem(build.kitSerial)}.pdf`,
      async write(out: Writable) {
        const gone = () => out.destroyed || out.writableEnded;
        let pdf: PdfThread;
        try {
          pdf = startPdfThread(
            {
              build,
              count: tally.n,
              range: { from: isoOf(tally.first), to: isoOf(tally.last) },
              chain: head,
              summary,
            },
            {
              tz: q.tz ?? 'UTC',
              generatedAt,
              generatedBy: user.name,
              filters: describeFilters(q, { parts }),
            },
            (chunk) => {
              if (!gone()) out.write(chunk);
            },
          );
        } catch (err) {
          release();
          throw err;
        }
        try {
          // One batch laid out in the thread while the next is read here; the reader's pace is kept between batches.
          let laying: Promise<void> = Promise.resolve();
          for await (const { entries, thumbKeys } of exportBatches(user, buildId, w, q, true)) {
            const thumbs: Thumbs = new Map();
            await Promise.all(
              thumbKeys.map(async ([id, key]) => {
                try {
                  thumbs.set(id, await storage.get(key));
                } catch {
                  /* shown as "photo not available" */
                }
              }),
            );
            await laying;
            await drained(out);
            if (gone()) return;
            laying = pdf.add(entries, thumbs);
            laying.catch(() => undefined); // handled where it is awaited; meanwhile not an unhandled rejection
          }
          await laying;
          if (gone()) return;
          await pdf.end();
          await drained(out);
          if (!gone()) out.end();
        } finally {
          await pdf.stop();
          release();
        }
      },
    };
  }
};

/** The filters in words, for the PDF title block, so a filtered print is never mistaken for the whole log. */
export function describeFilters(q: BuildLogQuery, log: { parts: readonly BuildLogPart[] }): string {
  const out: string[] = [];
  if (q.kind?.length) out.push(`kinds: ${q.kind.map((k) => k.replace(/_/g, ' ')).join(', ')}`);
  if (q.travelerId) {
    const p = log.parts.find((x) => x.travelerId === q.travelerId);
    out.push(`part: ${p ? `${p.partNumber} (${p.serial})` : q.travelerId}`);
  }
  if (q.from) out.push(`from ${q.from}`);
  if (q.to) out.push(`to ${q.to}`);
  if (q.q) out.push(`search “${q.q}”`);
  return out.length ? out.join('; ') : 'none: the whole log';
}
