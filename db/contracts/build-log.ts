import { z } from 'zod';
import type { BuildSummary } from './builds';
import { pageQuery, type Page, type Role } from './common';

/**
 * The build log: every bench event (holes ticked, steps, sign-off) and every finding event of one build,
 * as plain sentences. The screen, the CSV and the PDF all read the same entries.
 */
/** The kinds of bench event this version knows (written by the traveler's bench). */
export const benchLogKinds = [
  'holes_installed',
  'holes_pending',
  'step_done',
  'step_undone',
  'step_stamped',
  'signed_off',
  'sign_off_withdrawn',
  'part_replaced',
  'work_started',
  'work_stopped',
  'hours_entered',
  'photos_added',
  'revision_changed',
] as const;

export const buildLogKinds = [
  ...benchLogKinds,
  'finding_raised',
  'finding_dispositioned',
  'finding_approval',
  'finding_work_done',
  'finding_sent_back',
  'finding_closed',
  'member_added',
  'member_invited',
  'member_joined',
  'member_removed',
  'owner_changed',
  'notice_received',
  'notice_acknowledged',
  'notice_answered',
  /** A bench event of a kind this version does not know yet: still listed, never dropped. */
  'other',
] as const;
export type BuildLogKind = (typeof buildLogKinds)[number];

/** The families the screen's chips filter by. */
export const buildLogGroups = ['bench', 'findings', 'sign_off', 'people', 'notices'] as const;
export type BuildLogGroup = (typeof buildLogGroups)[number];

export const buildLogGroupLabels: Record<BuildLogGroup, string> = {
  bench: 'Bench',
  findings: 'Findings',
  sign_off: 'Sign-off',
  people: 'People',
  notices: 'Notices',
};

export const buildLogKindLabels: Record<BuildLogKind, string> = {
  holes_installed: 'Holes installed',
  holes_pending: 'Holes back to pending',
  step_done: 'Step done',
  step_undone: 'Step undone',
  step_stamped: 'Inspection point stamped',
  signed_off: 'Signed off',
  sign_off_withdrawn: 'Sign-off withdrawn',
  part_replaced: 'Part replaced',
  work_started: 'Work started',
  work_stopped: 'Work stopped',
  hours_entered: 'Hours entered',
  photos_added: 'Work photos',
  revision_changed: 'Moved to a new revision',
  finding_raised: 'Finding raised',
  finding_dispositioned: 'Dispositioned',
  finding_approval: 'Design authority',
  finding_work_done: 'Work done',
  finding_sent_back: 'Work sent back',
  finding_closed: 'Finding closed',
  member_added: 'Person added',
  member_invited: 'Person invited',
  member_joined: 'Person joined',
  member_removed: 'Person removed',
  owner_changed: 'Build handed over',
  notice_received: 'Notice received',
  notice_acknowledged: 'Notice acknowledged',
  notice_answered: 'Notice answered',
  other: 'Bench event',
};

export function groupOfKind(kind: BuildLogKind): BuildLogGroup {
  if (kind === 'signed_off' || kind === 'sign_off_withdrawn' || kind === 'step_stamped') return 'sign_off';
  if (kind.startsWith('member_') || kind === 'owner_changed') return 'people';
  if (kind.startsWith('notice_')) return 'notices';
  return kind.startsWith('finding_') ? 'findings' : 'bench';
}

/** A group stands for its kinds; a kind stands for itself. */
export function expandKindFilter(filter: readonly (BuildLogKind | BuildLogGroup)[]): BuildLogKind[] {
  const out = new Set<BuildLogKind>();
  for (const f of filter) {
    if ((buildLogGroups as readonly string[]).includes(f)) {
      for (const k of buildLogKinds) if (groupOfKind(k) === f) out.add(k);
    } else out.add(f as BuildLogKind);
  }
  return [...out];
}

/** The caution every exported log carries (the product's safety caution). */
export const buildLogCaution =
  'This log is a record kept with an aid. It is not certification and does not show that the aircraft is airworthy. ' +
  'The supplier’s approved data, the applicable airworthiness rules and your local authority govern; ' +
  'every margin behind a traveler comes from the inputs given.';

const DATE_ONLY = /^\d{4}-\d{2}-\d{2}$/;
const DATE_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,6})?)?(Z|[+-]\d{2}:\d{2})$/;

/** The years a build log can speak of: nothing was riveted with this tool before 2000 or after 2199. */
const LOG_YEARS = { min: 2000, max: 2199 } as const;

/** A real calendar day (2026-02-31 is not), or an ISO date and time that carries its offset, within LOG_YEARS. */
export function isLogDate(s: string): boolean {
  if (DATE_ONLY.test(s)) {
    const [y, m, d] = s.split('-').map(Number);
    const t = new Date(Date.UTC(y, m - 1, d));
    return (
      y >= LOG_YEARS.min &&
      y <= LOG_YEARS.max &&
      t.getUTCFullYear() === y &&
      t.getUTCMonth() === m - 1 &&
      t.getUTCDate() === d
    );
  }
  const year = Number(s.slice(0, 4));
  return DATE_TIME.test(s) && !Number.isNaN(Date.parse(s)) && year >= LOG_YEARS.min && year <= LOG_YEARS.max;
}

export function isTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}

/**
 * When a bench action was done, by the device's clock, and when the device sent it (a tick made without
 * signal is sent later). The server keeps both beside the moment the action arrived; the log is dated
 * by the first.
 */
const deviceInstant = (what: string) =>
  z
    .string({ message: `${what} must be a date and time` })
    .refine(
      (s) => DATE_TIME.test(s) && isLogDate(s),
      `${what} must be a date and time with its offset between 2000 and 2199, such as 2026-11-03T14:00:00.000Z`,
    );
export const deviceTime = z.object({
  doneAt: deviceInstant('doneAt').optional(),
  sentAt: deviceInstant('sentAt').optional(),
});
export type DeviceTime = z.infer<typeof deviceTime>;

/**
 * A device clock this far from the server's when it sent an action is flagged beside the entry: its
 * times may be off by as much. Five minutes is well beyond network delay and ordinary clock drift
 * (common practice for phones that set their clocks from the network).
 */
export const CLOCK_FLAG_MS = 5 * 60_000;
export const clockIsOff = (offsetMs: number | null | undefined) => Math.abs(offsetMs ?? 0) > CLOCK_FLAG_MS;

const dateParam = (what: string) =>
  z
    .string({ message: `${what} must be a single date` })
    .trim()
    .refine(
      isLogDate,
      `${what} must be a date between 2000 and 2199 such as 2026-11-03, or a date and time with its offset such as 2026-11-03T14:00:00Z`,
    );

/** `kind=bench,finding_flagged` or `kind=bench&kind=findings`. */
const kindList = z.preprocess(
  (v) => (typeof v === 'string' ? v.split(',') : v),
  z
    .array(z.string().trim())
    .transform((a) => a.filter(Boolean))
    .pipe(
      z.array(
        z.enum([...buildLogKinds, ...buildLogGroups] as const, {
          message: `kind is one of ${[...buildLogGroups, ...buildLogKinds].join(', ')}`,
        }),
      ),
    ),
);

/** Query of GET /api/builds/:id/log (and .csv, .pdf). A day given as a date is read in `tz`. */
export const buildLogQuery = z.object({
  kind: kindList.optional(),
  travelerId: z.uuid({ message: 'travelerId must be the id of a part of this build' }).optional(),
  from: dateParam('from').optional(),
  to: dateParam('to').optional(),
  q: z
    .string({ message: 'q must be a single search' })
    .trim()
    .max(200, 'keep the search under 200 characters')
    .optional(),
  tz: z
    .string({ message: 'tz must be a single time zone' })
    .trim()
    .refine(isTimeZone, 'tz must be a time zone such as Europe/Berlin or America/Denver')
    .optional(),
});
export type BuildLogQuery = z.infer<typeof buildLogQuery>;

/** GET /api/builds/:id/log: the same filters, one page at a time (`cursor`, `limit`). */
export const buildLogPageQuery = buildLogQuery.extend(pageQuery.shape);
export type BuildLogPageQuery = z.infer<typeof buildLogPageQuery>;

export type BuildLogPhoto = { id: string; thumbUrl: string; url: string };

export type BuildLogEntry = {
  /** `t:<traveler event id>` or `f:<finding event id>`: unique across the log. */
  id: string;
  /** When it was done: by the device's clock for what the bench sends, otherwise when the server wrote it. */
  at: string;
  /** When the server received it. */
  receivedAt: string;
  /** How far the device's clock was behind the server's when it sent this (null: the server's own time). */
  clockOffsetMs: number | null;
  /** The entry's link in the build's hash chain (lower-case hex SHA-256); null before it was chained. */
  hash: string | null;
  actorName: string;
  actorRole: Role;
  kind: BuildLogKind;
  group: BuildLogGroup;
  /** null for what happened to the build itself (its people): then the part fields name the build. */
  travelerId: string | null;
  travelerSerial: string;
  partNumber: string;
  partName: string;
  holeIds?: string[];
  /** What happened, as a plain sentence without the actor (shown beside it). */
  text: string;
  /** The person's own words (finding note, disposition reason), when there are any. */
  note?: string;
  findingId?: string;
  photos?: BuildLogPhoto[];
};

export type BuildLogPart = { travelerId: string; serial: string; partNumber: string; partName: string };

/**
 * One page of the log, newest first (time, then source and id: a stable place for every entry). The first
 * page (no cursor) also carries the build and its parts, for the screen's title and part picker; later
 * pages carry only entries.
 */
export type BuildLogPage = Page<BuildLogEntry> & { build?: BuildSummary; parts?: BuildLogPart[] };

/** Whether an entry matches every word of a search (part, serial, hole, person, kind, words said). */
export function logEntryMatches(e: BuildLogEntry, text: string): boolean {
  const words = text.trim().toLowerCase().split(/\s+/).filter(Boolean);
  if (!words.length) return true;
  const hay = [
    e.partNumber,
    e.partName,
    e.travelerSerial,
    e.actorName,
    buildLogKindLabels[e.kind],
    e.text,
    e.note ?? '',
    ...(e.holeIds ?? []),
  ]
    .join(' ')
    .toLowerCase();
  return words.every((w) => hay.includes(w));
}

/**
 * Hole ids as short runs: U-01, U-02, U-03, U-07 → "U-01 to U-03, U-07". Ids keep their own spelling;
 * a run needs the same prefix and number width, one apart.
 */
export function describeHoleRuns(ids: readonly string[]): string {
  const parsed = ids.map((id) => {
    const m = /^(.*?)(\d+)$/.exec(id);
    return m ? { id, prefix: m[1], n: Number(m[2]), width: m[2].length } : { id, prefix: id, n: NaN, width: 0 };
  });
  const runs: string[] = [];
  let i = 0;
  while (i < parsed.length) {
    let j = i;
    while (
      j + 1 < parsed.length &&
      !Number.isNaN(parsed[j].n) &&
      parsed[j + 1].prefix === parsed[j].prefix &&
      parsed[j + 1].width === parsed[j].width &&
      parsed[j + 1].n === parsed[j].n + 1
    )
      j++;
    runs.push(
      j - i >= 2
        ? `${parsed[i].id} to ${parsed[j].id}`
        : parsed
            .slice(i, j + 1)
            .map((p) => p.id)
            .join(', '),
    );
    i = j + 1;
  }
  return runs.join(', ');
}
