import { z } from 'zod';
import { positiveInches } from './common';

export const partKinds = ['rib', 'nose_rib', 'skin_panel', 'spar_web'] as const;
export type PartKind = (typeof partKinds)[number];
export const partKindLabels: Record<PartKind, string> = {
  rib: 'Rib', nose_rib: 'Nose rib', skin_panel: 'Skin panel', spar_web: 'Spar web',
};

/** A stretch of a fastener line with one pitch. Stations are inches from the line's start. */
export const pitchZone = z.object({
  fromIn: z.number({ message: 'zone start must be a number' }).min(0, 'zone start cannot be negative'),
  toIn: positiveInches('zone end'),
  pitchIn: positiveInches('pitch'),
}).refine((zn) => zn.toIn > zn.fromIn, { path: ['toIn'], message: 'zone end must be after its start' });
export type PitchZone = z.infer<typeof pitchZone>;

export const fastenerLine = z.object({
  code: z.string().trim().regex(/^[A-Z]{1,3}$/, 'line code is 1–3 capital letters, e.g. U'),
  name: z.string().trim().min(1, 'name the line').max(60),
  surface: z.enum(['upper', 'lower', 'flat']),
  /** Where the line starts, in inches aft of the part's leading edge (or left edge of a panel). */
  startIn: z.number().min(0, 'line start cannot be negative'),
  lengthIn: positiveInches('line length'),
  zones: z.array(pitchZone).min(1, 'a line needs at least one pitch zone').max(12, 'at most 12 zones per line'),
}).superRefine((line, ctx) => {
  const zones = [...line.zones].sort((a, b) => a.fromIn - b.fromIn);
  if (zones[0].fromIn > 1e-6) ctx.addIssue({ code: 'custom', path: ['zones', 0, 'fromIn'], message: 'the first zone must start at 0' });
  for (let i = 1; i < zones.length; i++) {
    if (Math.abs(zones[i].fromIn - zones[i - 1].toIn) > 1e-6) {
      ctx.addIssue({ code: 'custom', path: ['zones', i, 'fromIn'], message: 'zones must follow on without gaps or overlaps' });
    }
  }
  if (Math.abs(zones[zones.length - 1].toIn - line.lengthIn) > 1e-6) {
    ctx.addIssue({ code: 'custom', path: ['zones', zones.length - 1, 'toIn'], message: 'the last zone must end at the line length' });
  }
});
export type FastenerLine = z.infer<typeof fastenerLine>;

export const partDesignInput = z.object({
  kitModelId: z.uuid({ message: 'choose a kit model' }),
  partNumber: z.string().trim().min(1, 'give the part a number').max(40),
  name: z.string().trim().min(1, 'give the part a name').max(120),
  kind: z.enum(partKinds, { message: 'choose what kind of part it is' }),
});
export type PartDesignInput = z.input<typeof partDesignInput>;

/** The editable body of a draft revision. */
export const revisionInput = z.object({
  material: z.string().trim().min(1, 'name the material').max(40),
  gaugeIn: z.number({ message: 'gauge must be a number' }).positive('gauge must be greater than zero').max(0.25, 'gauge over 0.25 in is outside this tool'),
  rivetSpec: z.string().trim().min(3, 'give the rivet callout, e.g. MS20470AD4').max(40),
  drillSize: z.string().trim().min(1, 'give the drill size, e.g. #30').max(20),
  drillDiameterIn: z.number().positive('drill diameter must be greater than zero').max(0.5),
  edgeDistanceIn: positiveInches('edge distance'),
  chordIn: positiveInches('chord'),
  lines: z.array(fastenerLine).min(1, 'a part needs at least one fastener line').max(8),
  steps: z.array(z.string().trim().min(1).max(300)).max(40).default([]),
  changeNote: z.string().trim().max(2000).default(''),
}).superRefine((r, ctx) => {
  r.lines.forEach((line, i) => {
    if (line.lengthIn <= 2 * r.edgeDistanceIn) {
      ctx.addIssue({ code: 'custom', path: ['lines', i, 'lengthIn'], message: 'the line is too short for an edge distance at each end' });
    }
    if (line.startIn + line.lengthIn > r.chordIn + 1e-6 && line.surface !== 'flat') {
      ctx.addIssue({ code: 'custom', path: ['lines', i, 'lengthIn'], message: 'the line runs past the trailing edge' });
    }
  });
  const codes = r.lines.map((l) => l.code);
  if (new Set(codes).size !== codes.length) ctx.addIssue({ code: 'custom', path: ['lines'], message: 'each line needs its own code' });
});
export type RevisionInput = z.input<typeof revisionInput>;

/** Publishing is the approval: the supplier who publishes is named as approver on every traveler. */
export const publishInput = z.object({}).strict();

export type RevisionStatus = 'draft' | 'published' | 'superseded';

export type Revision = z.output<typeof revisionInput> & {
  id: string; partDesignId: string; letter: string; status: RevisionStatus; basis: Record<string, unknown> | null;
  studyId: string | null; createdAt: string; publishedAt: string | null; publishedByName: string | null;
};

export type PartDesignSummary = {
  id: string; kitModelId: string; kitName: string; partNumber: string; name: string; kind: PartKind;
  latest: { id: string; letter: string; status: RevisionStatus } | null;
  publishedLetter: string | null;
};

export type PartDesignDetail = Omit<PartDesignSummary, 'latest'> & { revisions: Revision[] };

/** Where a design's findings cluster across every build: one row per hole id of a revision. */
export type FindingCluster = {
  letter: string; holeId: string; count: number; builds: number; open: number;
  kinds: Partial<Record<import('./findings').FindingKind, number>>; lastAt: string;
};
