import { z } from 'zod';
import type { FastenerLine, PartKind } from './designs';
import type { FindingSummary } from './findings';
import type { BuildPlace, PartAction, Readiness, ReplacementReason } from './findings-rules';

export const holeStatuses = ['pending', 'installed', 'flagged', 'held', 'reworked', 'accepted'] as const;
export type HoleStatus = (typeof holeStatuses)[number];

/** Tick holes: one id, or a run given as several ids. Only pending holes become installed. */
export const tickHolesInput = z.object({
  holeIds: z.array(z.string().min(1)).min(1, 'pick at least one hole').max(500, 'at most 500 holes at a time'),
  status: z.enum(['installed', 'pending'], { message: 'status is installed or pending' }),
});
export type TickHolesInput = z.infer<typeof tickHolesInput>;

export const stepInput = z.object({ done: z.boolean() });

export const lookupInput = z.object({
  code: z.string().trim().min(4, 'enter the code from the label').max(200),
});

export type Hole = { holeId: string; line: string; seq: number; stationIn: number; status: HoleStatus };

export type TravelerSummary = {
  id: string; serial: string; shortCode: string; buildId: string; kitSerial: string;
  partNumber: string; partName: string; kind: PartKind; letter: string;
  /** Done for good (installed, accepted); awaiting the inspector (flagged, reworked) counted apart. */
  holesTotal: number; holesDone: number; holesAwaitingInspector: number; openFindings: number; signedOff: boolean;
  newerRevision: string | null;
  /** Scrapped or returned: the part stays in the record, and `byId` carries on in its place. */
  replaced: { byId: string; reason: ReplacementReason } | null;
  replacesId: string | null;
};

export type TravelerDetail = TravelerSummary & {
  material: string; gaugeIn: number; rivetSpec: string; drillSize: string; drillDiameterIn: number;
  edgeDistanceIn: number; chordIn: number; lines: FastenerLine[];
  /** The rivet from the engine's catalogue (null: a rivet outside it), for judging measured values. */
  rivetDiameterIn: number | null; countersunk: boolean;
  /** Part outline in inches (x aft, y up), for the drawing; closed polygon. */
  outline: [number, number][];
  holes: Hole[];
  steps: { id: string; seq: number; text: string; doneAt: string | null; doneByName: string | null }[];
  findings: FindingSummary[];
  approvedByName: string | null;
  signedOffAt: string | null; signedOffByName: string | null;
  /** The reader's place on the build, what they may do on the part now, and why it cannot be signed off yet. */
  place: BuildPlace;
  allowedActions: PartAction[];
  readiness: Readiness;
  replacedBy: { id: string; serial: string } | null;
  replaces: { id: string; serial: string } | null;
};
