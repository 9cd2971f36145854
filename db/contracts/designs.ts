import { z } from 'zod';
import { plainText } from './common';
import { GAUGE_RANGE_IN, listOf, measured } from './engineering';
import { countText } from '../../lib/number-text';

export const partKinds = ['rib', 'nose_rib', 'skin_panel', 'spar_web'] as const;
export type PartKind = (typeof partKinds)[number];
export const partKindLabels: Record<PartKind, string> = {
  rib: 'Rib',
  nose_rib: 'Nose rib',
  skin_panel: 'Skin panel',
  spar_web: 'Spar web',
};

/*
 * Ranges of a part revision. Lengths are inches along the part; a skin panel may run longer than a rib's
 * chord, so 400 in bounds them all. Holes are rows a traveler is shipped with and a builder ticks: a
 * revision is held to MAX_REVISION_HOLES, counted from its zones before anything is placed.
 */
/** Longest part, line or zone station, in. */
export const MAX_PART_LENGTH_IN = 400;
/**
 * Smallest zone pitch, in: 3 diameters of the smallest drill this tool takes (0.040 in), rounded up to
 * 1/8 in. The layout check then holds every line to 3D of its own rivet.
 */
export const MIN_ZONE_PITCH_IN = 0.125;
/** Largest zone pitch, in: beyond a foot a row of rivets holds nothing together. */
export const MAX_ZONE_PITCH_IN = 12;
/** Holes one revision may have (the engine's MAX_REVISION_HOLES: server/engineering/bounds.ts). */
export const MAX_REVISION_HOLES = 5000;

const station = (what: string) => measured(what, 0, MAX_PART_LENGTH_IN, 'in');
const length = (what: string) => measured(what, 0.01, MAX_PART_LENGTH_IN, 'in');

/** A stretch of a fastener line with one pitch. Stations are inches from the line's start. */
export const pitchZone = z
  .object({
    /** in: 0 – 400 */
    fromIn: z
      .number({ message: 'zone start must be a number' })
      .min(0, 'zone start cannot be negative')
      .max(MAX_PART_LENGTH_IN, `zone start must be between 0 and ${MAX_PART_LENGTH_IN} in`),
    /** in: 0.01 – 400 */
    toIn: length('zone end'),
    /** in: 0.125 – 12 */
    pitchIn: measured('pitch', MIN_ZONE_PITCH_IN, MAX_ZONE_PITCH_IN, 'in'),
  })
  .refine((zn) => zn.toIn > zn.fromIn, { path: ['toIn'], message: 'zone end must be after its start' });

/**
 * The most holes each zone of a line can take: its length over its pitch, plus one where it begins.
 * With one more for the line's end this is the engine's estimateHoles over the whole line (which the
 * edge distances only shorten): never an underestimate of what is placed.
 */
export function zoneHoleCounts(zones: readonly { fromIn: number; toIn: number; pitchIn: number }[]): number[] {
  return zones.map((z) => Math.ceil(Math.max(0, z.toIn - z.fromIn) / z.pitchIn) + 1);
}

/** The most holes a revision's lines can place, as the contract counts them. */
export const revisionHoleBound = (
  lines: readonly { zones: readonly { fromIn: number; toIn: number; pitchIn: number }[] }[],
): number => lines.reduce((n, l) => n + 1 + zoneHoleCounts(l.zones).reduce((a, b) => a + b, 0), 0);

export const fastenerLine = z
  .object({
    code: z
      .string({ message: 'line code must be text' })
      .trim()
      .regex(/^[A-Z]{1,3}$/, 'line code is 1–3 capital letters, e.g. U'),
    name: plainText('the line name', 1, 60, 'name the line'),
    surface: z.enum(['upper', 'lower', 'flat']),
    /** Where the line starts, in inches aft of the part's leading edge (or left edge of a panel): 0 – 400. */
    startIn: station('line start'),
    /** in: 0.01 – 400 */
    lengthIn: length('line length'),
    /** 1 – 12 zones */
    zones: listOf(pitchZone, 'zones per line', 1, 12, 'a line needs at least one pitch zone'),
  })
  .superRefine((line, ctx) => {
    const zones = [...line.zones].sort((a, b) => a.fromIn - b.fromIn);
    if (zones[0].fromIn > 1e-6)
      ctx.addIssue({ code: 'custom', path: ['zones', 0, 'fromIn'], message: 'the first zone must start at 0' });
    for (let i = 1; i < zones.length; i++) {
      if (Math.abs(zones[i].fromIn - zones[i - 1].toIn) > 1e-6) {
        ctx.addIssue({
          code: 'custom',
          path: ['zones', i, 'fromIn'],
          message: 'zones must follow on without gaps or overlaps',
        });
      }
    }
    if (Math.abs(zones[zones.length - 1].toIn - line.lengthIn) > 1e-6) {
      ctx.addIssue({
        code: 'custom',
        path: ['zones', zones.length - 1, 'toIn'],
        message: 'the last zone must end at the line length',
      });
    }
  });
export type FastenerLine = z.infer<typeof fastenerLine>;

export const partDesignInput = z.object({
  kitModelId: z.uuid({ message: 'choose a kit model' }),
  partNumber: plainText('the part number', 1, 40, 'give the part a number'),
  name: plainText('the part name', 1, 120, 'give the part a name'),
  kind: z.enum(partKinds, { message: 'choose what kind of part it is' }),
});
export type PartDesignInput = z.input<typeof partDesignInput>;

/** The trade's operations on a riveted part, in shop order: what each traveler step is. */
export const stepKinds = [
  'lay_out',
  'drill',
  'deburr',
  'dimple_countersink',
  'prime',
  'rivet',
  'inspect',
  'other',
] as const;
export type StepKind = (typeof stepKinds)[number];
export const stepKindLabels: Record<StepKind, string> = {
  lay_out: 'Lay out',
  drill: 'Drill',
  deburr: 'Deburr',
  dimple_countersink: 'Dimple or countersink',
  prime: 'Prime',
  rivet: 'Rivet',
  inspect: 'Inspect',
  other: 'Other',
};

/**
 * One shop step of a revision: its words, its kind, and whether it is an inspection point (an inspector
 * stamps it before any later step is done). A bare string is a step of kind `other`, as revisions
 * written before steps had kinds.
 */
const stepObject = z.object({
  text: plainText('a step', 1, 300, 'a step needs some text'),
  kind: z.enum(stepKinds, { message: `a step's kind is one of ${stepKinds.join(', ')}` }).default('other'),
  inspectionPoint: z.boolean({ message: 'inspectionPoint is true or false' }).default(false),
});
// Read as one object schema (a bare string first made one), so an error names the field at fault; a
// union would only say "invalid input". The cast gives the input type the preprocess really accepts.
export const revisionStep = z.preprocess(
  (s) => (typeof s === 'string' ? { text: s } : s),
  stepObject,
) as unknown as z.ZodType<z.output<typeof stepObject>, string | z.input<typeof stepObject>>;
export type RevisionStep = z.output<typeof revisionStep>;

/** The editable body of a draft revision. */
export const revisionInput = z
  .object({
    material: plainText('the material', 1, 40, 'name the material'),
    /** in: 0.008 – 0.25 */
    gaugeIn: measured('gauge', GAUGE_RANGE_IN.min, GAUGE_RANGE_IN.max, 'in'),
    rivetSpec: plainText('the rivet callout', 3, 40, 'give the rivet callout, e.g. MS20470AD4'),
    drillSize: plainText('the drill size', 1, 20, 'give the drill size, e.g. #30'),
    /** in: 0.04 (#60) – 0.5 */
    drillDiameterIn: measured('drill diameter', 0.04, 0.5, 'in'),
    /** in: 0.05 – 2 */
    edgeDistanceIn: measured('edge distance', 0.05, 2, 'in'),
    /** in: 1 – 400 */
    chordIn: measured('chord', 1, MAX_PART_LENGTH_IN, 'in'),
    /** 1 – 8 lines */
    lines: listOf(fastenerLine, 'fastener lines', 1, 8, 'a part needs at least one fastener line'),
    /** 0 – 40 steps of 1 – 300 characters */
    steps: listOf(revisionStep, 'steps', 0, 40).default([]),
    changeNote: plainText('the change note', 0, 2000).default(''),
  })
  .superRefine((r, ctx) => {
    r.lines.forEach((line, i) => {
      if (line.lengthIn <= 2 * r.edgeDistanceIn) {
        ctx.addIssue({
          code: 'custom',
          path: ['lines', i, 'lengthIn'],
          message: 'the line is too short for an edge distance at each end',
        });
      }
      if (line.startIn + line.lengthIn > r.chordIn + 1e-6 && line.surface !== 'flat') {
        ctx.addIssue({
          code: 'custom',
          path: ['lines', i, 'lengthIn'],
          message: 'the line runs past the trailing edge',
        });
      }
    });
    const codes = r.lines.map((l) => l.code);
    if (new Set(codes).size !== codes.length)
      ctx.addIssue({ code: 'custom', path: ['lines'], message: 'each line needs its own code' });
    // Counted from the zones before any hole is placed; told on the pitch of the zone with the most holes.
    const counts = r.lines.map((l) => zoneHoleCounts(l.zones));
    const total = revisionHoleBound(r.lines);
    if (total > MAX_REVISION_HOLES) {
      let at: [number, number] = [0, 0];
      counts.forEach((c, i) =>
        c.forEach((n, j) => {
          if (n > counts[at[0]][at[1]]) at = [i, j];
        }),
      );
      ctx.addIssue({
        code: 'custom',
        path: ['lines', at[0], 'zones', at[1], 'pitchIn'],
        message: `the zones give up to ${countText(total)} holes; a revision has at most ${countText(MAX_REVISION_HOLES)}: widen this pitch (${countText(counts[at[0]][at[1]])} holes in this zone)`,
      });
    }
  });
export type RevisionInput = z.input<typeof revisionInput>;

/** Publishing is the approval: the supplier who publishes is named as approver on every traveler. */
export const publishInput = z.object({}).strict();

export const revisionStatuses = ['draft', 'published', 'superseded'] as const;
export type RevisionStatus = (typeof revisionStatuses)[number];

export const revisionActions = ['edit', 'publish', 'discard'] as const;
export type RevisionAction = (typeof revisionActions)[number];

/**
 * Why a revision cannot be changed, published or discarded, or null: only a draft moves. Publishing is
 * the approval and is final; a change after it is a new revision with a change note.
 */
export function revisionActionRefusal(r: { letter: string; status: RevisionStatus }): string | null {
  return r.status === 'draft'
    ? null
    : `revision ${r.letter} is ${r.status} and can no longer be changed: start a new revision with a change note`;
}

export const allowedRevisionActions = (r: { letter: string; status: RevisionStatus }): RevisionAction[] =>
  revisionActionRefusal(r) ? [] : [...revisionActions];

/** What the confirmation before publishing says: the approval cannot be taken back. */
export const publishWarning = (letter: string) =>
  `Publishing revision ${letter} is your approval, and it cannot be undone: the revision is frozen, every traveler made from it names you as approver, and a later change needs a new revision.`;

export type Revision = z.output<typeof revisionInput> & {
  id: string;
  partDesignId: string;
  letter: string;
  status: RevisionStatus;
  basis: Record<string, unknown> | null;
  studyId: string | null;
  createdAt: string;
  publishedAt: string | null;
  publishedByName: string | null;
  /** What the reader may do with this revision: the screen's buttons come from this list only. */
  allowedActions: RevisionAction[];
};

export type PartDesignSummary = {
  id: string;
  kitModelId: string;
  kitName: string;
  partNumber: string;
  name: string;
  kind: PartKind;
  latest: { id: string; letter: string; status: RevisionStatus } | null;
  publishedLetter: string | null;
};

export type PartDesignDetail = Omit<PartDesignSummary, 'latest'> & { revisions: Revision[] };

/** Where a design's findings cluster across every build: one row per hole id of a revision. */
export type FindingCluster = {
  letter: string;
  holeId: string;
  count: number;
  builds: number;
  open: number;
  kinds: Partial<Record<import('./findings').FindingKind, number>>;
  lastAt: string;
};
