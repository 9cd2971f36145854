import { z } from 'zod';

export const findingKinds = ['elongated', 'oversize', 'cracked', 'edge_distance_short', 'deformed_flange', 'poor_shop_head', 'other'] as const;
export type FindingKind = (typeof findingKinds)[number];
export const findingKindLabels: Record<FindingKind, string> = {
  elongated: 'Elongated hole', oversize: 'Oversize hole', cracked: 'Crack at hole', edge_distance_short: 'Edge distance short',
  deformed_flange: 'Deformed flange', poor_shop_head: 'Poor shop head', other: 'Other',
};

export const findingStatuses = ['flagged', 'in_review', 'dispositioned', 'rework_done', 'verified', 'closed'] as const;
export type FindingStatus = (typeof findingStatuses)[number];
export const findingStatusLabels: Record<FindingStatus, string> = {
  flagged: 'Flagged', in_review: 'In review', dispositioned: 'Dispositioned', rework_done: 'Rework done', verified: 'Verified', closed: 'Closed',
};

export const dispositions = ['use_as_is', 'rework', 'repair', 'scrap'] as const;
export type Disposition = (typeof dispositions)[number];
export const dispositionLabels: Record<Disposition, string> = { use_as_is: 'Use as is', rework: 'Rework', repair: 'Repair', scrap: 'Scrap' };

/** Multipart text fields of a new finding; photos come as the `photos` files. */
export const findingInput = z.object({
  travelerId: z.uuid({ message: 'the finding must belong to a traveler' }),
  holeIds: z.array(z.string().min(1)).min(1, 'pick the suspect hole').max(50, 'at most 50 holes in one finding'),
  kind: z.enum(findingKinds, { message: 'choose what is wrong with the hole' }),
  note: z.string().trim().min(3, 'say in a few words what you see').max(2000, 'keep the note under 2000 characters'),
});
export type FindingInput = z.infer<typeof findingInput>;

export const dispositionInput = z.object({
  disposition: z.enum(dispositions, { message: 'choose use as is, rework, repair or scrap' }),
  note: z.string().trim().min(3, 'say why, in a few words').max(2000),
});
export type DispositionInput = z.infer<typeof dispositionInput>;

export const findingStepInput = z.object({ note: z.string().trim().max(2000).default('') });

export const findingListQuery = z.object({
  status: z.enum([...findingStatuses, 'open'] as const).optional(),
  buildId: z.uuid().optional(),
});

export type FindingPhoto = { id: string; width: number; height: number; url: string; thumbUrl: string };
export type FindingEvent = {
  id: string; actorName: string; fromStatus: FindingStatus | null; toStatus: FindingStatus;
  disposition: Disposition | null; note: string; createdAt: string;
};

export type FindingSummary = {
  id: string; travelerId: string; serial: string; partNumber: string; kitSerial: string; holeIds: string[];
  kind: FindingKind; status: FindingStatus; disposition: Disposition | null; flaggedByName: string;
  createdAt: string; updatedAt: string; photoCount: number; thumbUrl: string | null;
};

export type FindingDetail = FindingSummary & {
  note: string; dispositionNote: string | null; photos: FindingPhoto[]; events: FindingEvent[];
  /** The hole in context, for the inspector: neighbours along the line and the layout numbers. */
  context: {
    line: string; stationIn: number; prevStationIn: number | null; nextStationIn: number | null;
    edgeDistanceIn: number; drillDiameterIn: number; rivetSpec: string; gaugeIn: number; material: string;
    /** The next sizes up of the rivet's family for a rework (null: a rivet outside the catalogue). */
    oversizeOptions: { code: string; dash: number; step: 1 | 2 }[] | null;
  };
};
