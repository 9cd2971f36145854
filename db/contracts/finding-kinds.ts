/**
 * What a finding says is wrong, grouped by what the inspector looked at, and the measurements each kind
 * can carry with the rule each is judged against. Pure data and arithmetic: the server validates with it,
 * the screens draw the kind picker and the "measured against" lines from it.
 */

export const findingKindGroups = [
  {
    group: 'hole',
    label: 'The hole',
    kinds: ['hole_elongated', 'hole_oversize', 'hole_burrs', 'hole_cracked', 'hole_edge_short', 'hole_mislocated'],
  },
  {
    group: 'shop_head',
    label: 'Shop head (solid rivet)',
    kinds: ['shop_head_small', 'shop_head_flat_or_tall', 'shop_head_clinched', 'shop_head_cracked'],
  },
  { group: 'manufactured_head', label: 'Manufactured head', kinds: ['head_not_seated', 'head_proud'] },
  { group: 'countersink', label: 'Countersink or dimple', kinds: ['countersink_too_deep', 'dimple_cracked'] },
  { group: 'blind_rivet', label: 'Blind rivet', kinds: ['blind_stem', 'blind_head_gap', 'blind_wrong_grip'] },
  { group: 'sheet', label: 'The sheet', kinds: ['sheet_deformed_flange', 'sheet_gap'] },
  { group: 'fastener', label: 'Fastener', kinds: ['fastener_wrong_or_missing'] },
] as const;

export type FindingKindGroup = (typeof findingKindGroups)[number]['group'];
export type FindingKind = (typeof findingKindGroups)[number]['kinds'][number];

/** Every kind, in picker order: the one list the table's enum and the contract both use. */
export const findingKinds = findingKindGroups.flatMap((g) => g.kinds) as unknown as readonly [
  FindingKind,
  ...FindingKind[],
];

export const findingKindLabels: Record<FindingKind, string> = {
  hole_elongated: 'Elongated hole',
  hole_oversize: 'Oversize hole',
  hole_burrs: 'Burrs or chips left',
  hole_cracked: 'Crack at the hole',
  hole_edge_short: 'Edge distance short',
  hole_mislocated: 'Mis-located or double-drilled',
  shop_head_small: 'Shop head too small',
  shop_head_flat_or_tall: 'Shop head too flat or too tall',
  shop_head_clinched: 'Shop head clinched or tipped',
  shop_head_cracked: 'Shop head cracked',
  head_not_seated: 'Head not seated',
  head_proud: 'Head proud of the surface',
  countersink_too_deep: 'Countersink too deep',
  dimple_cracked: 'Cracked dimple',
  blind_stem: 'Stem not flush or broken',
  blind_head_gap: 'Gap under the head',
  blind_wrong_grip: 'Wrong grip length',
  sheet_deformed_flange: 'Deformed flange',
  sheet_gap: 'Gap between the sheets',
  fastener_wrong_or_missing: 'Wrong or missing fastener',
};

export function groupOfFindingKind(kind: FindingKind): (typeof findingKindGroups)[number] {
  return findingKindGroups.find((g) => (g.kinds as readonly string[]).includes(kind))!;
}

/** Measurements a finding can carry, in inches. */
export const measureKeys = [
  'holeDiameterIn',
  'edgeDistanceIn',
  'shopHeadDiameterIn',
  'shopHeadHeightIn',
  'headGapIn',
] as const;
export type MeasureKey = (typeof measureKeys)[number];
export type Measurements = Partial<Record<MeasureKey, number>>;

export const measureLabels: Record<MeasureKey, string> = {
  holeDiameterIn: 'Hole diameter',
  edgeDistanceIn: 'Edge distance',
  shopHeadDiameterIn: 'Shop head diameter',
  shopHeadHeightIn: 'Shop head height',
  headGapIn: 'Gap under the head',
};

/** Which measurements make sense for which kind (none for a burr or a missing rivet). */
export const measuresOfKind: Record<FindingKind, readonly MeasureKey[]> = {
  hole_elongated: ['holeDiameterIn'],
  hole_oversize: ['holeDiameterIn'],
  hole_burrs: [],
  hole_cracked: ['holeDiameterIn'],
  hole_edge_short: ['edgeDistanceIn'],
  hole_mislocated: ['edgeDistanceIn', 'holeDiameterIn'],
  shop_head_small: ['shopHeadDiameterIn', 'shopHeadHeightIn'],
  shop_head_flat_or_tall: ['shopHeadDiameterIn', 'shopHeadHeightIn'],
  shop_head_clinched: ['shopHeadDiameterIn', 'shopHeadHeightIn'],
  shop_head_cracked: ['shopHeadDiameterIn'],
  head_not_seated: ['headGapIn'],
  head_proud: ['headGapIn'],
  countersink_too_deep: [],
  dimple_cracked: [],
  blind_stem: [],
  blind_head_gap: ['headGapIn'],
  blind_wrong_grip: [],
  sheet_deformed_flange: [],
  sheet_gap: ['headGapIn'],
  fastener_wrong_or_missing: [],
};

/** The physical range of a measured value, in inches: what a hand tool reads on a kit part. */
export const MEASURE_RANGE_IN = { min: 0, max: 2 } as const;

/** The rivet and hole a measurement is judged against. */
export type MeasureBasis = { rivetDiameterIn: number; drillDiameterIn: number; countersunk: boolean };

/**
 * A hole drilled for a rivet may be a few thousandths over the drill before it counts as oversize.
 * Common practice: 0.003 in over the drill (from memory, shop acceptance of a #40/#30 hole).
 */
export const HOLE_CLEARANCE_IN = 0.003;
/** Shop head of a solid rivet, FAA AC 43.13-1B ch. 4 and FAA-H-8083-31 ch. 4: 1.5D across, 0.5D high;
 * accepted from 1.4D across and 0.3D to 0.6D high (the acceptance band is from memory). */
export const SHOP_HEAD = {
  nominalDiameter: 1.5,
  minDiameter: 1.4,
  nominalHeight: 0.5,
  minHeight: 0.3,
  maxHeight: 0.6,
} as const;
/** A head must sit down on the sheet; a 0.002 in feeler must not enter under it (common practice, from memory). */
export const MAX_HEAD_GAP_IN = 0.002;

export type MeasureJudgement = { rule: string; source: string; pass: boolean; limit: string };

const f3 = (x: number) => x.toFixed(3);

/** A measured value beside the rule it is judged against. */
export function judgeMeasurement(key: MeasureKey, value: number, b: MeasureBasis): MeasureJudgement {
  const d = b.rivetDiameterIn;
  switch (key) {
    case 'holeDiameterIn': {
      const max = b.drillDiameterIn + HOLE_CLEARANCE_IN;
      return {
        rule: `no more than the drill (${f3(b.drillDiameterIn)} in) + ${f3(HOLE_CLEARANCE_IN)} in`,
        source: 'FAA-H-8083-31 ch. 4, drill sizes for rivets (clearance from memory)',
        pass: value <= max + 1e-6,
        limit: `≤ ${f3(max)} in`,
      };
    }
    case 'edgeDistanceIn': {
      const k = b.countersunk ? 2.5 : 2;
      const min = k * d;
      return {
        rule: `at least ${k}D = ${f3(min)} in${b.countersunk ? ' (countersunk head)' : ''}`,
        source: 'FAA AC 43.13-1B ch. 4, rivet edge distance',
        pass: value >= min - 0.0005,
        limit: `≥ ${f3(min)} in`,
      };
    }
    case 'shopHeadDiameterIn': {
      const min = SHOP_HEAD.minDiameter * d;
      return {
        rule: `${SHOP_HEAD.nominalDiameter}D = ${f3(SHOP_HEAD.nominalDiameter * d)} in nominal, at least ${SHOP_HEAD.minDiameter}D = ${f3(min)} in`,
        source: 'FAA AC 43.13-1B ch. 4; FAA-H-8083-31 ch. 4 (minimum from memory)',
        pass: value >= min - 0.0005,
        limit: `≥ ${f3(min)} in`,
      };
    }
    case 'shopHeadHeightIn': {
      const min = SHOP_HEAD.minHeight * d;
      const max = SHOP_HEAD.maxHeight * d;
      return {
        rule: `${SHOP_HEAD.nominalHeight}D = ${f3(SHOP_HEAD.nominalHeight * d)} in nominal, ${SHOP_HEAD.minHeight}D to ${SHOP_HEAD.maxHeight}D`,
        source: 'FAA AC 43.13-1B ch. 4; FAA-H-8083-31 ch. 4 (band from memory)',
        pass: value >= min - 0.0005 && value <= max + 0.0005,
        limit: `${f3(min)} to ${f3(max)} in`,
      };
    }
    case 'headGapIn':
      return {
        rule: `no gap a ${f3(MAX_HEAD_GAP_IN)} in feeler enters`,
        source: 'common practice (from memory); the fastener maker’s limit governs for blind rivets',
        pass: value <= MAX_HEAD_GAP_IN + 1e-6,
        limit: `≤ ${f3(MAX_HEAD_GAP_IN)} in`,
      };
  }
}
