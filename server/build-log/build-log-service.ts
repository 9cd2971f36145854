import {
  describeHoleRuns, dispositionLabels, memberPlaceLabels, memberPlaces, type MemberPlace, expandKindFilter, findingKindLabels, findingLogKindOfAction, groupOfKind, logEntryMatches,
  type BuildLog, type BuildLogEntry, type BuildLogGroup, type BuildLogKind, type BuildLogQuery,
} from '../../db/contracts';
import type { AppContext } from '../context';
import { listVisibleBuilds } from '../builds/builds-repository';
import { badRequest, notFound } from '../http-error';
import { renderLogCsv } from './build-log-csv';
import { renderLogPdf } from './build-log-pdf';
import { listBenchEvents, listBuildEvents, listFindingLogEvents, listLogParts, listLogPhotos, type FindingLogKind, type LogWindow } from './build-log-repository';
import { nextDay, startOfDay } from './zoned-time';

type Deps = Pick<AppContext, 'db' | 'signer' | 'storage'>;
type BenchRow = Awaited<ReturnType<typeof listBenchEvents>>[number];
type FindingRow = Awaited<ReturnType<typeof listFindingLogEvents>>[number];

const BENCH_KINDS = ['holes_installed', 'holes_pending', 'step_done', 'step_undone', 'signed_off', 'sign_off_withdrawn', 'part_replaced'] as const;

const natural = (a: string, b: string) => a.localeCompare(b, undefined, { numeric: true });
const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

function holesOf(detail: Record<string, unknown>): string[] {
  const ids = detail.holeIds;
  return Array.isArray(ids) ? ids.filter((x): x is string => typeof x === 'string').sort(natural) : [];
}

/** A bench event as a sentence. The detail is free JSON written by the travelers service. */
export function describeBench(kind: string, detail: Record<string, unknown>): { kind: BuildLogKind; text: string; holeIds?: string[]; note?: string; group?: BuildLogGroup } {
  switch (kind) {
    case 'holes_installed':
    case 'holes_pending': {
      const holeIds = holesOf(detail);
      const runs = describeHoleRuns(holeIds);
      const text = kind === 'holes_installed'
        ? holeIds.length === 1 ? `Installed hole ${runs}.` : `Installed ${plural(holeIds.length, 'hole')}: ${runs}.`
        : holeIds.length === 1 ? `Set hole ${runs} back to pending.` : `Set ${plural(holeIds.length, 'hole')} back to pending: ${runs}.`;
      return { kind, text, holeIds };
    }
    case 'step_done':
    case 'step_undone': {
      const seq = typeof detail.seq === 'number' ? detail.seq : null;
      const what = typeof detail.text === 'string' ? detail.text : '';
      const step = seq === null ? 'A step' : `Step ${seq}`;
      return { kind, text: kind === 'step_done' ? `${step} done: ${what}` : `${step} set back to not done: ${what}` };
    }
    case 'signed_off':
      return { kind, text: 'Signed the part off: every hole and step done, no finding open.' };
    case 'sign_off_withdrawn': {
      const by = typeof detail.signedOffByName === 'string' ? ` by ${detail.signedOffByName}` : '';
      const at = typeof detail.signedOffAt === 'string' ? ` of ${detail.signedOffAt.slice(0, 16).replace('T', ' ')} UTC` : '';
      return {
        kind,
        text: `Withdrew the sign-off${by}${at}: the part is open again. The sign-off stays in the log.`,
        ...(typeof detail.reason === 'string' && detail.reason ? { note: detail.reason } : {}),
      };
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
    case 'raise': return { kind, text: `Raised a finding on ${on}: ${findingKindLabels[r.findingKind].toLowerCase()}.` };
    case 'disposition': return { kind, text: `Dispositioned ${on}: ${disposition}${r.toStatus === 'closed' ? '; the part is replaced' : ''}.` };
    case 'amend': return { kind, text: `Amended the disposition of ${on} to ${disposition}.` };
    case 'not-a-defect': return { kind, text: `Closed the finding on ${on}: not a defect.` };
    case 'approve': return { kind, text: `Approved the disposition of ${on} as design authority.` };
    case 'refuse': return { kind, text: `Refused the disposition of ${on} as design authority: back to the inspector.` };
    case 'report-done': return { kind, text: `Reported the ordered work on ${on} as done.` };
    case 'accept': return { kind, text: `Accepted the work on ${on}; the finding is closed.` };
    case 'send-back': return { kind, text: `Sent the work on ${on} back to be done again.` };
    case 'part-replaced': return { kind, text: `Closed the finding on ${on}: the part was replaced.` };
  }
}

const PEOPLE_KINDS = ['member_added', 'member_invited', 'member_joined', 'member_removed', 'owner_changed'] as const;

/** A change of the build's people as a sentence. */
export function describeBuildEvent(kind: string, detail: Record<string, unknown>): { kind: BuildLogKind; text: string } {
  const name = typeof detail.name === 'string' ? detail.name : 'someone';
  const place = typeof detail.place === 'string' && (memberPlaces as readonly string[]).includes(detail.place)
    ? memberPlaceLabels[detail.place as MemberPlace].toLowerCase() : 'a member';
  switch (kind) {
    case 'member_added': return { kind, text: `Added ${name} to the build as ${place}.` };
    case 'member_invited': return { kind, text: `Invited ${name} by mail to join the build as ${place}.` };
    case 'member_joined': return { kind, text: `${name} joined the build as ${place}.` };
    case 'member_removed': return { kind, text: `Took ${name} (${place}) off the build.` };
    case 'serial_changed':
      return { kind: 'other', text: `Changed the kit serial${typeof detail.from === 'string' ? ` from ${detail.from}` : ''} to ${typeof detail.to === 'string' ? detail.to : 'a new one'} (before any work was recorded).` };
    case 'note_changed':
      return { kind: 'other', text: typeof detail.to === 'string' && detail.to ? `Changed the build's note to: ${detail.to}` : "Cleared the build's note." };
    case 'owner_changed': return { kind, text: `Handed the build${typeof detail.from === 'string' ? ` from ${detail.from}` : ''} to ${typeof detail.to === 'string' ? detail.to : 'a new owner'}, with its whole log.` };
    default: return { kind: 'other', text: `Recorded a change to the build (${kind.replace(/_/g, ' ')}).` };
  }
}

/** The person's filters as the repository's window; a day given as a date is a whole day in `tz`. */
function windowOf(buildId: string, q: BuildLogQuery): LogWindow {
  const tz = q.tz ?? 'UTC';
  const dateOnly = (s: string) => /^\d{4}-\d{2}-\d{2}$/.test(s);
  const from = q.from ? (dateOnly(q.from) ? startOfDay(q.from, tz) : new Date(q.from)) : undefined;
  const before = q.to ? (dateOnly(q.to) ? startOfDay(nextDay(q.to), tz) : new Date(new Date(q.to).getTime() + 1)) : undefined;
  if (from && before && from >= before) throw badRequest('the end of the date range (to) is before its start (from)', { to: 'is before from' });

  const kinds = q.kind?.length ? expandKindFilter(q.kind) : null;
  const knownBenchKinds: readonly string[] = BENCH_KINDS;
  return {
    buildId, travelerId: q.travelerId, from, before, knownBenchKinds,
    // A withdrawal goes with the sign-offs: a filtered log never shows a sign-off without its withdrawal.
    benchKinds: kinds ? [...new Set([...kinds.filter((k) => knownBenchKinds.includes(k)), ...(kinds.includes('signed_off') ? ['sign_off_withdrawn'] : [])])] : null,
    otherBench: kinds ? kinds.includes('other') : true,
    findingKinds: kinds ? kinds.filter((k): k is FindingLogKind => k.startsWith('finding_')) : null,
    buildKinds: kinds ? kinds.filter((k) => (PEOPLE_KINDS as readonly string[]).includes(k)) : null,
  };
}

export const buildLogService = ({ db, signer, storage }: Deps) => {
  /** The log and, for the PDF, where each listed photo's thumbnail lives. */
  async function collect(user: Express.User, buildId: string, q: BuildLogQuery) {
    const [build] = await listVisibleBuilds(db, user, buildId);
    if (!build) throw notFound('build');
    const w = windowOf(buildId, q);
    const [parts, bench, findingRows, buildRows] = await Promise.all([
      listLogParts(db, user, buildId), listBenchEvents(db, user, w), listFindingLogEvents(db, user, w), listBuildEvents(db, user, w),
    ]);
    if (q.travelerId && !parts.some((p) => p.travelerId === q.travelerId)) throw notFound('part of this build');

    const withPhotos = [...new Set(findingRows.filter((r) => r.action === 'raise' || r.action === 'report-done').map((r) => r.findingId))];
    const photos = await listLogPhotos(db, user, buildId, withPhotos);
    const thumbKeys = new Map(photos.map((p) => [p.id, p.thumbKey]));

    const keyed: { sortKey: string; entry: BuildLogEntry }[] = [];
    const common = (r: BenchRow | FindingRow) => ({
      at: r.createdAt.toISOString(), actorName: r.actorName, actorRole: r.actorRole,
      travelerId: r.travelerId, travelerSerial: r.serial, partNumber: r.partNumber, partName: r.partName,
    });
    for (const r of bench) {
      const d = describeBench(r.kind, r.detail ?? {});
      keyed.push({
        sortKey: `${r.sortKey}|t|${r.id}`,
        entry: {
          id: `t:${r.id}`, ...common(r), kind: d.kind, group: d.group ?? groupOfKind(d.kind), text: d.text,
          ...(d.holeIds ? { holeIds: d.holeIds } : {}), ...(d.note ? { note: d.note } : {}),
        },
      });
    }
    for (const r of buildRows) {
      const d = describeBuildEvent(r.kind, r.detail ?? {});
      keyed.push({
        sortKey: `${r.sortKey}|b|${r.id}`,
        entry: {
          id: `b:${r.id}`, at: r.createdAt.toISOString(), actorName: r.actorName, actorRole: r.actorRole,
          travelerId: null, travelerSerial: r.kitSerial, partNumber: 'Build', partName: 'the whole build',
          kind: d.kind, group: groupOfKind(d.kind), text: d.text,
        },
      });
    }
    for (const r of findingRows) {
      const d = describeFinding(r);
      // The photos of the hole as found go with the raise; those of the work with the event they came with.
      const own = photos.filter((p) => p.findingId === r.findingId && (r.action === 'raise' ? p.eventId === null : p.eventId === r.id));
      keyed.push({
        sortKey: `${r.sortKey}|f|${r.id}`,
        entry: {
          id: `f:${r.id}`, ...common(r), kind: d.kind, group: groupOfKind(d.kind), text: d.text,
          holeIds: [...r.holeIds].sort(natural), findingId: r.findingId,
          ...(r.note ? { note: r.note } : {}),
          ...(own.length ? { photos: own.map((p) => ({ id: p.id, thumbUrl: signer.sign(p.id, 'thumb', user.id), url: signer.sign(p.id, 'full', user.id) })) } : {}),
        },
      });
    }
    keyed.sort((a, b) => (a.sortKey < b.sortKey ? 1 : a.sortKey > b.sortKey ? -1 : 0));
    const entries = keyed.map((k) => k.entry).filter((e) => !q.q || logEntryMatches(e, q.q));
    const log: BuildLog = {
      build, parts, entries,
      range: { from: entries.at(-1)?.at ?? null, to: entries[0]?.at ?? null },
    };
    return { log, thumbKeys };
  }

  const fileStem = (kitSerial: string) => `build-log-${kitSerial.replace(/[^A-Za-z0-9._-]+/g, '_')}-${new Date().toISOString().slice(0, 10)}`;

  return {
    async log(user: Express.User, buildId: string, q: BuildLogQuery): Promise<BuildLog> {
      return (await collect(user, buildId, q)).log;
    },

    async csv(user: Express.User, buildId: string, q: BuildLogQuery) {
      const { log } = await collect(user, buildId, q);
      return { filename: `${fileStem(log.build.kitSerial)}.csv`, body: renderLogCsv(log, { tz: q.tz ?? 'UTC' }) };
    },

    /** Thumbnails come from storage; a photo that cannot be read shows as a gap, it does not fail the log. */
    async pdf(user: Express.User, buildId: string, q: BuildLogQuery) {
      const { log, thumbKeys } = await collect(user, buildId, q);
      const thumbs = new Map<string, Buffer>();
      await Promise.all([...thumbKeys].map(async ([id, key]) => {
        try { thumbs.set(id, await storage.get(key)); } catch { /* shown as "photo not available" */ }
      }));
      const body = await renderLogPdf(log, {
        tz: q.tz ?? 'UTC', thumbs, generatedAt: new Date(), generatedBy: user.name,
        filters: describeFilters(q, log),
      });
      return { filename: `${fileStem(log.build.kitSerial)}.pdf`, body };
    },
  };
};

/** The filters in words, for the PDF title block, so a filtered print is never mistaken for the whole log. */
export function describeFilters(q: BuildLogQuery, log: Pick<BuildLog, 'parts'>): string {
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

