import { z } from 'zod';
import { plainText } from './common';
import type { MemberPlace } from './people';

/**
 * Notices: a supplier's message to the kits it has shipped, with the effectivity that picks the builds
 * and parts it applies to, and each build's answer. The one home of these rules: the server enforces
 * them, the screens read `allowed` lists from the answers.
 */

export const noticeLevels = ['mandatory', 'recommended', 'information'] as const;
export type NoticeLevel = (typeof noticeLevels)[number];
export const noticeLevelLabels: Record<NoticeLevel, string> = {
  mandatory: 'Mandatory',
  recommended: 'Recommended',
  information: 'For information',
};

/** Which parts of the picked designs it reaches: by whether work is recorded on them when it is issued. */
export const noticeReaches = ['all', 'started', 'not_started'] as const;
export type NoticeReach = (typeof noticeReaches)[number];
export const noticeReachLabels: Record<NoticeReach, string> = {
  all: 'Every part, built or not',
  started: 'Parts already built or being built',
  not_started: 'Parts not yet started',
};

/** The most designs one notice may name, and revision letters per design. */
export const MAX_NOTICE_PARTS = 50;
/** Files one notice carries (photos or PDFs), and photos one answer carries. */
export const MAX_NOTICE_FILES = 4;
export const MAX_COMPLIANCE_PHOTOS = 4;
/** A PDF attached to a notice: the largest accepted (a few drawings, common practice for e-mail). */
export const MAX_NOTICE_PDF_BYTES = 10 * 1024 * 1024;

const letter = z
  .string({ message: 'a revision letter must be text' })
  .trim()
  .toUpperCase()
  .regex(/^[A-Z]{1,2}$/, 'a revision letter is one or two capital letters, e.g. B');

const serial = (what: string) => plainText(what, 1, 40, `give ${what}`);

/**
 * A kit serial split into what comes before its number and the number: "KS-0012" → ["KS-", 12]. A range
 * compares the numbers of serials with the same stem, so KS-9 and KS-0009 are the same place in it.
 */
export function serialParts(s: string): { stem: string; n: number } | null {
  const m = /^(.*?)(\d{1,9})$/.exec(s.trim());
  return m ? { stem: m[1].toUpperCase(), n: Number(m[2]) } : null;
}

/** Whether a kit serial is inside an inclusive range (no range: every serial). */
export function inSerialRange(kitSerial: string, from: string | null, to: string | null): boolean {
  if (from === null || to === null) return true;
  const [s, a, b] = [serialParts(kitSerial), serialParts(from), serialParts(to)];
  if (!s || !a || !b || s.stem !== a.stem) return false;
  return s.n >= a.n && s.n <= b.n;
}

const noticePart = z.object({
  partDesignId: z.uuid({ message: 'choose a part design' }),
  /** The revisions whose parts it reaches; empty: every revision. */
  letters: z.array(letter).max(26, 'name at most 26 revisions').default([]),
});

/** POST /api/notices (multipart: the fields, files under `files`). */
export const noticeInput = z
  .object({
    kitModelId: z.uuid({ message: 'choose the kit model' }),
    level: z.enum(noticeLevels, { message: 'choose mandatory, recommended or for information' }),
    title: plainText('the title', 3, 140, 'give the notice a title'),
    body: plainText('the text', 10, 8000, 'write what the notice asks (at least 10 characters)'),
    serialFrom: serial('the first kit serial').nullish(),
    serialTo: serial('the last kit serial').nullish(),
    /** The part designs it is about; empty: the kit as a whole. */
    parts: z.array(noticePart).max(MAX_NOTICE_PARTS, `name at most ${MAX_NOTICE_PARTS} parts`).default([]),
    reaches: z.enum(noticeReaches, { message: 'choose which parts it reaches' }).default('all'),
  })
  .superRefine((n, ctx) => {
    const from = n.serialFrom ?? null;
    const to = n.serialTo ?? null;
    if ((from === null) !== (to === null)) {
      ctx.addIssue({
        code: 'custom',
        path: [from === null ? 'serialFrom' : 'serialTo'],
        message: 'give both ends of the serial range, or neither for every serial',
      });
      return;
    }
    if (from === null || to === null) return;
    const [a, b] = [serialParts(from), serialParts(to)];
    if (!a)
      ctx.addIssue({
        code: 'custom',
        path: ['serialFrom'],
        message: 'a range needs serials ending in a number, e.g. KS-0010',
      });
    if (!b)
      ctx.addIssue({
        code: 'custom',
        path: ['serialTo'],
        message: 'a range needs serials ending in a number, e.g. KS-0019',
      });
    if (!a || !b) return;
    if (a.stem !== b.stem)
      ctx.addIssue({
        code: 'custom',
        path: ['serialTo'],
        message: `both ends of the range start with the same letters (${a.stem || 'none'})`,
      });
    else if (b.n < a.n)
      ctx.addIssue({ code: 'custom', path: ['serialTo'], message: 'the last serial comes before the first' });
    const ids = n.parts.map((p) => p.partDesignId);
    if (new Set(ids).size !== ids.length)
      ctx.addIssue({ code: 'custom', path: ['parts'], message: 'each part design is named once' });
  });
export type NoticeInput = z.input<typeof noticeInput>;
export type NoticeChange = z.output<typeof noticeInput>;

/** What a notice applies to, as stored and shown. */
export type NoticeEffectivity = {
  serialFrom: string | null;
  serialTo: string | null;
  parts: { partDesignId: string; letters: string[] }[];
  reaches: NoticeReach;
};

/** One live part of a build as effectivity sees it when the notice is issued. */
export type PartForNotice = { partDesignId: string; letter: string; started: boolean };

/** Whether the notice reaches this part of a build whose kit serial is in range. */
export function partInEffect(e: NoticeEffectivity, p: PartForNotice): boolean {
  if (e.reaches === 'started' && !p.started) return false;
  if (e.reaches === 'not_started' && p.started) return false;
  if (e.parts.length === 0) return true;
  const named = e.parts.find((x) => x.partDesignId === p.partDesignId);
  return !!named && (named.letters.length === 0 || named.letters.includes(p.letter));
}

/**
 * The parts of one build a notice reaches, or null when it does not reach the build at all. A notice on
 * the kit as a whole (no parts named, every part) reaches every build in the range, parts or not;
 * otherwise a build is reached through its parts.
 */
export function buildInEffect<P extends PartForNotice>(
  e: NoticeEffectivity,
  kitSerial: string,
  parts: P[],
): P[] | null {
  if (!inSerialRange(kitSerial, e.serialFrom, e.serialTo)) return null;
  const reached = parts.filter((p) => partInEffect(e, p));
  if (reached.length) return reached;
  return e.parts.length === 0 && e.reaches === 'all' ? [] : null;
}

/** A build's answer to a notice. */
export const complianceStatuses = ['open', 'acknowledged', 'done', 'not_applicable'] as const;
export type ComplianceStatus = (typeof complianceStatuses)[number];
export const complianceStatusLabels: Record<ComplianceStatus, string> = {
  open: 'Not yet read',
  acknowledged: 'Read, not yet done',
  done: 'Done',
  not_applicable: 'Does not apply',
};

/** POST /api/notices/:id/builds/:buildId/compliance (multipart: the fields, photos under `photos`). */
export const complianceInput = z.discriminatedUnion(
  'outcome',
  [
    z.object({
      outcome: z.literal('done'),
      note: plainText('the note', 3, 2000, 'say what was done (at least 3 characters)'),
    }),
    z.object({
      outcome: z.literal('not_applicable'),
      reason: plainText('the reason', 3, 2000, 'say why it does not apply (at least 3 characters)'),
    }),
  ],
  { message: 'choose done or does not apply' },
);
export type ComplianceInput = z.input<typeof complianceInput>;
export type ComplianceChange = z.output<typeof complianceInput>;

export const complianceActions = ['acknowledge', 'record'] as const;
export type ComplianceAction = (typeof complianceActions)[number];

/**
 * Why the reader may not do `action` on a build's answer to a notice, or null. Everyone on the build
 * acknowledges it; the builders (owner and helpers) record what was done, and may record again (a new
 * entry: the log keeps both).
 */
export function checkComplianceAction(
  place: MemberPlace | null,
  status: ComplianceStatus,
  action: ComplianceAction,
): { code: 403 | 409; message: string } | null {
  if (!place) return { code: 403, message: 'only the people on this build answer its notices' };
  if (action === 'acknowledge')
    return status === 'open' ? null : { code: 409, message: 'this notice is already acknowledged on this build' };
  if (place !== 'owner' && place !== 'helper')
    return { code: 403, message: 'the builders on this build record what was done about a notice' };
  return null;
}

export const allowedComplianceActions = (place: MemberPlace | null, status: ComplianceStatus): ComplianceAction[] =>
  complianceActions.filter((a) => checkComplianceAction(place, status, a) === null);

/** GET /api/notices: the supplier's by kit model, or one build's, or one part's. */
export const noticeListQuery = z.object({
  kitModelId: z.uuid({ message: 'kitModelId must be an id' }).optional(),
  buildId: z.uuid({ message: 'buildId must be an id' }).optional(),
  travelerId: z.uuid({ message: 'travelerId must be an id' }).optional(),
});
export type NoticeListQuery = z.infer<typeof noticeListQuery>;

export type ComplianceCounts = Record<ComplianceStatus, number> & { builds: number };

/** A stored file of a notice or of an answer, behind signed links. */
export type NoticeFile = { id: string; kind: 'photo' | 'pdf'; name: string; url: string; thumbUrl: string | null };

/** One row of a notice list. `build` is the reader's build's answer when the list is of one build or part. */
export type NoticeSummary = {
  id: string;
  number: number;
  title: string;
  level: NoticeLevel;
  kitModelId: string;
  kitName: string;
  issuedAt: string;
  issuedByName: string;
  counts: ComplianceCounts;
  build: { buildId: string; kitSerial: string; status: ComplianceStatus } | null;
};

/** One build's answer, as the supplier's table and the build's own page show it. */
export type NoticeBuildAnswer = {
  buildId: string;
  kitSerial: string;
  status: ComplianceStatus;
  acknowledgedAt: string | null;
  acknowledgedByName: string | null;
  answeredAt: string | null;
  answeredByName: string | null;
  note: string | null;
  reason: string | null;
  photos: NoticeFile[];
  /** The parts of the build it reached when issued. */
  parts: { travelerId: string; serial: string; partNumber: string; letter: string }[];
  /** What the reader may do on this build's answer. */
  allowed: ComplianceAction[];
};

/** GET /api/notices/:id: the notice, its files, and the answers of the builds the reader may see. */
export type NoticeDetail = Omit<NoticeSummary, 'build'> & {
  body: string;
  effectivity: Omit<NoticeEffectivity, 'parts'> & {
    parts: { partDesignId: string; partNumber: string; name: string; letters: string[] }[];
  };
  files: NoticeFile[];
  builds: NoticeBuildAnswer[];
};
