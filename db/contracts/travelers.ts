import { z } from 'zod';
import type { FastenerLine, PartKind, StepKind } from './designs';
import type { FindingSummary } from './findings';
import { pageQuery, plainText } from './common';
import { deviceTime } from './build-log';
import type { PartWork } from './work-sessions';
import {
  buildPlaceLabels,
  NOTE_MIN_LENGTH,
  type BuildPlace,
  type PartAction,
  type PartFacts,
  type Readiness,
  type ReplacementReason,
  type StepFact,
} from './findings-rules';

export const holeStatuses = ['pending', 'installed', 'flagged', 'held', 'reworked', 'accepted'] as const;
export type HoleStatus = (typeof holeStatuses)[number];

/** Tick holes: one id, or a run given as several ids. Only pending holes become installed. */
export const tickHolesInput = deviceTime.extend({
  holeIds: z.array(z.string().min(1)).min(1, 'pick at least one hole').max(500, 'at most 500 holes at a time'),
  status: z.enum(['installed', 'pending'], { message: 'status is installed or pending' }),
});
export type TickHolesInput = z.infer<typeof tickHolesInput>;

/** Who did a step's work: the credit the fabrication-and-assembly table gives it. */
export const stepPerformers = ['builder', 'helper', 'commercial', 'kit_supplier'] as const;
export type StepPerformer = (typeof stepPerformers)[number];
export const stepPerformerLabels: Record<StepPerformer, string> = {
  builder: 'The builder',
  helper: 'A helper',
  commercial: 'Commercial help',
  kit_supplier: 'The kit supplier',
};

/** Whose work it was (the builder by default) and, for help, whose: a helper's or a shop's name. */
export const creditFields = {
  by: z.enum(stepPerformers, { message: `by is one of ${stepPerformers.join(', ')}` }).default('builder'),
  byName: plainText('the name of who did it', 0, 120).optional(),
};
/** Help is named: the log and the fabrication table say whose work it was. */
export const helpIsNamed = <T extends { by: StepPerformer; byName?: string }>(s: T) => s.by === 'builder' || !!s.byName;
export const helpUnnamed = { message: 'say who helped: a helper’s or a shop’s name', path: ['byName'] };

/**
 * A step done or undone. Done, it says who did the work (the signed-in builder by default) and, for
 * help, whose: a helper's or a shop's name goes into the log beside the builder who recorded it.
 */
export const stepInput = deviceTime
  .extend({ done: z.boolean({ message: 'done is true or false' }), ...creditFields })
  .refine((s) => !s.done || helpIsNamed(s), helpUnnamed);
/** What the app sends; the server works with the parsed `StepChange` (defaults filled in). */
export type StepInput = z.input<typeof stepInput>;
export type StepChange = z.output<typeof stepInput>;

/** Taking a sign-off back must say why, in the inspector's own words: it goes into the build log and the builder's mail. */
export const withdrawSignOffInput = z.object({
  reason: plainText('the reason', NOTE_MIN_LENGTH, 1000, 'say in a few words why the sign-off is withdrawn'),
});
export type WithdrawSignOffInput = z.input<typeof withdrawSignOffInput>;

// ---- Moving an unstarted part to the newest revision ----

/** POST /api/travelers/:id/revision: no body needed; the device's time of the move when it sends one. */
export const moveRevisionInput = deviceTime;
export type MoveRevisionInput = z.input<typeof moveRevisionInput>;

/** Everything recorded on a part, as the rule below reads it: holes and steps as they stand, and counts. */
export type PartRecord = Pick<PartFacts, 'holes' | 'signedOff' | 'replaced'> & {
  steps: readonly Pick<StepFact, 'done' | 'stamped'>[];
  /** Findings raised on the part, open or closed. */
  findings: number;
  workSessions: number;
  workPhotos: number;
};

const counted = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/**
 * What is recorded on the part, in words; none means work has not started on it. The one definition
 * of a started part: a hole other than pending, a step done or stamped, any finding, a work session or
 * photo, a sign-off, a replacement. Such a part is the record of work done to its revision.
 */
export function workRecorded(r: PartRecord): string[] {
  const holes = Object.entries(r.holes)
    .filter(([s]) => s !== 'pending')
    .reduce((n, [, c]) => n + (c ?? 0), 0);
  const steps = r.steps.filter((s) => s.done || s.stamped).length;
  return [
    holes ? `${counted(holes, 'hole')} worked` : '',
    steps ? `${counted(steps, 'step')} done` : '',
    r.findings ? counted(r.findings, 'finding') : '',
    r.workSessions ? counted(r.workSessions, 'work session') : '',
    r.workPhotos ? counted(r.workPhotos, 'work photo') : '',
    r.signedOff ? 'its sign-off' : '',
    r.replaced ? 'its replacement' : '',
  ].filter(Boolean);
}

/** Who moves a part to a newer revision: its builders, and the supplier who shipped it (design authority). */
const revisionMovers: readonly BuildPlace[] = ['builder', 'design_authority'];

/**
 * Whether the reader may move the part to its design's newest published revision now; null when they
 * may, else the server's words for 403/409. Only an unstarted part moves: its holes and steps are made
 * again from the new revision. A started part keeps its revision, and the supplier's notice says what to
 * do about the change.
 */
export function checkRevisionMove(
  place: BuildPlace,
  record: PartRecord,
  revisions: { letter: string; newerLetter: string | null },
): { code: 403 | 409; message: string } | null {
  if (!revisionMovers.includes(place))
    return {
      code: 403,
      message: `only ${buildPlaceLabels.builder} or ${buildPlaceLabels.design_authority} moves a part to a newer revision`,
    };
  if (!revisions.newerLetter)
    return { code: 409, message: `this part already follows the newest revision ${revisions.letter}` };
  const recorded = workRecorded(record);
  if (recorded.length)
    return {
      code: 409,
      message: `work is recorded on this part (${recorded.join(', ')}): it stays on revision ${revisions.letter}, and a started part follows the supplier's notice for revision ${revisions.newerLetter} instead`,
    };
  return null;
}

/** What the part's page says of a newer revision: whether the reader may move the part, and whether it has started. */
export type RevisionMove = { allowed: boolean; started: boolean };

export function revisionMoveOf(
  place: BuildPlace,
  record: PartRecord,
  revisions: { letter: string; newerLetter: string | null },
): RevisionMove | null {
  if (!revisions.newerLetter) return null;
  return {
    allowed: checkRevisionMove(place, record, revisions) === null,
    started: workRecorded(record).length > 0,
  };
}

export const lookupInput = z.object({
  code: z.string().trim().min(4, 'enter the code from the label').max(200),
});

export type Hole = { holeId: string; line: string; seq: number; stationIn: number; status: HoleStatus };

export type TravelerSummary = {
  id: string;
  serial: string;
  shortCode: string;
  buildId: string;
  kitSerial: string;
  partNumber: string;
  partName: string;
  kind: PartKind;
  letter: string;
  /** Done for good (installed, accepted); awaiting the inspector (flagged, reworked) counted apart. */
  holesTotal: number;
  holesDone: number;
  holesAwaitingInspector: number;
  openFindings: number;
  signedOff: boolean;
  newerRevision: string | null;
  /** Scrapped or returned: the part stays in the record, and `byId` carries on in its place. */
  replaced: { byId: string; reason: ReplacementReason } | null;
  replacesId: string | null;
};

/**
 * GET /api/travelers: one page (`Page<TravelerSummary>`) of the parts the reader may see, live parts
 * before replaced ones, then by serial (kit serial and part number) and id. `show` and `q` narrow it in
 * the database, so every page is full and the count of what is shown is what matches.
 */
export const travelerListQuery = pageQuery.extend({
  show: z.enum(['open', 'signed', 'all'], { message: 'show is open, signed or all' }).default('all'),
  // plainText: PostgreSQL refuses a NUL byte in text, so one in a search would otherwise end as a 500.
  q: plainText('the search', 0, 100).optional(),
});
export type TravelerListQuery = z.infer<typeof travelerListQuery>;
export type TravelerListShow = TravelerListQuery['show'];

/** A step on the part: its operation, who did it (and for whom the credit), and its inspector's stamp. */
export type TravelerStepDetail = {
  id: string;
  seq: number;
  text: string;
  kind: StepKind;
  inspectionPoint: boolean;
  doneAt: string | null;
  doneByName: string | null;
  by: StepPerformer | null;
  byName: string | null;
  stampedAt: string | null;
  stampedByName: string | null;
};

export type TravelerDetail = TravelerSummary & {
  material: string;
  gaugeIn: number;
  rivetSpec: string;
  drillSize: string;
  drillDiameterIn: number;
  edgeDistanceIn: number;
  chordIn: number;
  lines: FastenerLine[];
  /** The rivet from the engine's catalogue (null: a rivet outside it), for judging measured values. */
  rivetDiameterIn: number | null;
  countersunk: boolean;
  /** Part outline in inches (x aft, y up), for the drawing; closed polygon. */
  outline: [number, number][];
  holes: Hole[];
  steps: TravelerStepDetail[];
  findings: FindingSummary[];
  approvedByName: string | null;
  signedOffAt: string | null;
  signedOffByName: string | null;
  /** The reader's place on the build, what they may do on the part now, and why it cannot be signed off yet. */
  place: BuildPlace;
  allowedActions: PartAction[];
  readiness: Readiness;
  replacedBy: { id: string; serial: string } | null;
  replaces: { id: string; serial: string } | null;
  /**
   * Whether the reader may print this part's QR label again (mayPrintLabels, one part). Optional: a detail
   * kept on the device from before labels could be reprinted lacks it, and then no link shows.
   */
  labelAllowed?: boolean;
  /** Time worked on the part (optional: a detail kept on the device from before hours were kept lacks it). */
  work?: PartWork;
  /**
   * When a newer revision is out (`newerRevision`): whether the reader may move the part to it now, and
   * whether work is recorded on it (then it follows the supplier's notices). Null on the newest revision;
   * optional: a detail kept on the device from before parts could move lacks it, and then no button shows.
   */
  revisionMove?: RevisionMove | null;
};

// ---- QR labels ----

/**
 * Who prints labels: the kit's supplier (and an admin) a whole build's when shipping it; one part's
 * label also its builder, to replace one lost or worn at the bench.
 */
export function mayPrintLabels(place: BuildPlace, isAdmin: boolean, scope: 'build' | 'part'): boolean {
  if (isAdmin || place === 'design_authority') return true;
  return scope === 'part' && place === 'builder';
}

/** What a label says: enough to tell the part from any other on a shelf, without the app. */
export type PartLabel = {
  travelerId: string;
  serial: string;
  shortCode: string;
  partNumber: string;
  partName: string;
  letter: string;
  kitModelCode: string;
  kitModelName: string;
  supplierName: string;
  kitSerial: string;
  url: string;
  qrDataUrl: string;
};

/** The label stocks we lay out for; each prints one label per page except the sheet. */
export const labelSizes = ['sheet', '2x1in', '62mm'] as const;
export type LabelSize = (typeof labelSizes)[number];
export const labelSizeInfo: Record<
  LabelSize,
  { name: string; hint: string; pageCss: string; widthMm: number; heightMm: number | null }
> = {
  sheet: {
    name: 'Sheet',
    hint: 'Letter or A4 paper, as many labels a page as fit; cut them out',
    pageCss: 'size: auto; margin: 10mm;',
    widthMm: 85,
    heightMm: null,
  },
  // 2 × 1 in die-cut labels are 50.8 × 25.4 mm (common practice for small thermal label printers).
  '2x1in': {
    name: '2 × 1 in',
    hint: 'Die-cut 2 × 1 in labels, one per label',
    pageCss: 'size: 2in 1in; margin: 0;',
    widthMm: 50.8,
    heightMm: 25.4,
  },
  // A 62 mm continuous roll is cut to length after each label; 32 mm holds the QR and six lines.
  '62mm': {
    name: '62 mm roll',
    hint: '62 mm continuous roll, cut after each label',
    pageCss: 'size: 62mm 32mm; margin: 0;',
    widthMm: 62,
    heightMm: 32,
  },
};

/** GET /api/travelers/labels: a whole build's labels, or one part's. */
export const labelsQuery = z
  .object({
    buildId: z.uuid({ message: 'buildId must be the id of a build' }).optional(),
    travelerId: z.uuid({ message: 'travelerId must be the id of a part' }).optional(),
  })
  .refine((q) => (q.buildId ? 1 : 0) + (q.travelerId ? 1 : 0) === 1, {
    message: 'give either a buildId or a travelerId',
    path: ['buildId'],
  });
export type LabelsQuery = z.infer<typeof labelsQuery>;
