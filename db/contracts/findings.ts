import { z } from 'zod';
import { findingKinds, measureKeys, MEASURE_RANGE_IN, type FindingKind, type Measurements } from './finding-kinds';
import {
  dispositions,
  findingStatuses,
  repairSchemes,
  type BuildPlace,
  type Disposition,
  type FindingAction,
  type FindingClosure,
  type FindingEventAction,
  type FindingStatus,
  type RepairScheme,
} from './findings-rules';
import { pageQuery, plainText } from './common';

export * from './finding-kinds';
export * from './findings-rules';

const measurements = z
  .object(
    Object.fromEntries(
      measureKeys.map((k) => [
        k,
        z
          .number({ message: `${k} must be a number in inches` })
          .min(MEASURE_RANGE_IN.min, `${k} cannot be negative`)
          .max(MEASURE_RANGE_IN.max, `${k} is over ${MEASURE_RANGE_IN.max} in: measure again`)
          .optional(),
      ]),
    ) as Record<(typeof measureKeys)[number], z.ZodOptional<z.ZodNumber>>,
  )
  .strict();

/** Multipart text fields of a new finding; photos come as the `photos` files. */
export const findingInput = z.object({
  travelerId: z.uuid({ message: 'the finding must belong to a traveler' }),
  holeIds: z
    .array(z.string().trim().min(1).max(20, 'a hole id is at most 20 characters'))
    .min(1, 'pick the suspect hole')
    .max(50, 'at most 50 holes in one finding'),
  kind: z.enum(findingKinds, { message: 'choose what is wrong' }),
  note: plainText('the note', 3, 2000, 'say in a few words what you see'),
  measurements: measurements.default({}),
});
export type FindingInput = z.input<typeof findingInput>;

/**
 * One request per decision. `disposition` and `amend` carry the disposition; a repair says how
 * (`repairScheme`, and the next-size rivet for `oversize_rivet`); a repair whose check fails needs `overrideReason`.
 */
export const findingActionInput = z.object({
  note: plainText('the note', 0, 2000).default(''),
  disposition: z
    .enum(dispositions, { message: 'choose rework, repair, use as is, scrap or return to supplier' })
    .optional(),
  repairScheme: z.enum(repairSchemes, { message: 'choose how the repair is made' }).optional(),
  repairRivetSpec: plainText('the repair rivet', 1, 40).optional(),
  overrideReason: plainText('the reason', 0, 2000).optional(),
});
export type FindingActionInput = z.input<typeof findingActionInput>;

/**
 * GET /api/findings: one page (`Page<FindingSummary>`) of the findings the reader may see, newest
 * first by default; `order=oldest` puts the longest wait first (the design authority's approvals).
 * Ties on the time fall back to the id, so a page never repeats or skips a row.
 */
export const findingListQuery = pageQuery.extend({
  status: z
    .enum([...findingStatuses, 'open'] as const, { message: `status is open or one of ${findingStatuses.join(', ')}` })
    .optional(),
  buildId: z.uuid({ message: 'buildId must be an id' }).optional(),
  travelerId: z.uuid({ message: 'travelerId must be an id' }).optional(),
  order: z.enum(['newest', 'oldest'], { message: 'order is newest or oldest' }).default('newest'),
});
export type FindingListQuery = z.infer<typeof findingListQuery>;

export type FindingPhoto = {
  id: string;
  width: number;
  height: number;
  url: string;
  thumbUrl: string;
  stage: 'found' | 'work';
  eventId: string | null;
};

export type FindingEvent = {
  id: string;
  action: FindingEventAction;
  actorName: string;
  actorPlace: BuildPlace;
  fromStatus: FindingStatus | null;
  toStatus: FindingStatus;
  disposition: Disposition | null;
  note: string;
  createdAt: string;
};

export type FindingSummary = {
  id: string;
  travelerId: string;
  serial: string;
  partNumber: string;
  kitSerial: string;
  buildId: string;
  holeIds: string[];
  kind: FindingKind;
  status: FindingStatus;
  disposition: Disposition | null;
  closure: FindingClosure | null;
  raisedByName: string;
  createdAt: string;
  updatedAt: string;
  photoCount: number;
  thumbUrl: string | null;
};

/** What the inspector chose to fix it with, the check behind it, and why when the check failed. */
export type RepairRecord = {
  scheme: RepairScheme;
  rivetSpec: string | null;
  /** The engine's repair check over every hole of the finding (see server/engineering/repair-check). */
  check: {
    pass: boolean;
    reasons: string[];
    alternative: string | null;
    newDrill: { name: string; diameterIn: number } | null;
  } | null;
  overrideReason: string | null;
};

export type HoleInContext = {
  holeId: string;
  line: string;
  stationIn: number;
  prevStationIn: number | null;
  nextStationIn: number | null;
  status: string;
};

export type FindingDetail = FindingSummary & {
  note: string;
  dispositionNote: string | null;
  measurements: Measurements;
  repair: RepairRecord | null;
  photos: FindingPhoto[];
  events: FindingEvent[];
  /** What the person reading it may do now: the screen's buttons come from this list only. */
  allowedActions: FindingAction[];
  place: BuildPlace;
  /** The traveler that replaced this part, when the finding ended in scrap or return to supplier. */
  replacement: { travelerId: string; serial: string } | null;
  /** Every hole of the finding in its layout, for the inspector. */
  context: {
    holes: HoleInContext[];
    edgeDistanceIn: number;
    drillDiameterIn: number;
    rivetSpec: string;
    rivetDiameterIn: number | null;
    countersunk: boolean;
    gaugeIn: number;
    material: string;
    /** The next sizes up of the rivet's family for a repair (null: a rivet outside the catalogue). */
    oversizeOptions: { code: string; dash: number; step: 1 | 2 }[] | null;
  };
};
