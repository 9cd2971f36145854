import type { KitModel, StudyDetail, WingStudyInput } from '@/db/contracts';
import {
  COMMON_PLACED,
  copyInputs,
  flangeLines,
  kitDesignData,
  LINE_FIELDS,
  newStudyInputs,
  normaliseFieldPath,
  rowFieldFor,
} from './study-form-values';

/**
 * The wing study form holds the POST body itself (kind 'wing') in the engine's units (in, lb, sq ft,
 * KEAS), as the rib form does: the number fields convert what is typed in mm, kg or N, so
 * zodResolver(wingStudyBody) checks the very values the server gets.
 */
export type WingFormValues = WingStudyInput;
export type WingRibRow = WingFormValues['inputs']['ribs'][number];

/** The contract's bounds on the rib list (db/contracts/studies.ts). */
export const WING_RIBS = { min: 2, max: 24 } as const;
export const SKIN_GAUGES_MAX = 6;
export const SKIN_RIVETS_MAX = 4;

export const PRESSURE_RULE_OPTIONS = [
  { value: 'karman-tsien', label: 'Kármán–Tsien', hint: 'The default' },
  { value: 'prandtl-glauert', label: 'Prandtl–Glauert' },
  { value: 'none', label: 'None', hint: 'Incompressible Cp' },
] as const;

const SQIN_PER_SQFT = 144;

/** A rectangular wing of the kit's area and mean chord: span = S / c̄. */
export function kitPlanform(kit: Pick<KitModel, 'wingAreaSqFt' | 'meanChordIn'>): WingFormValues['inputs']['planform'] {
  return {
    kind: 'rectangle',
    spanIn: Math.round(((kit.wingAreaSqFt * SQIN_PER_SQFT) / kit.meanChordIn) * 10) / 10,
    chordIn: kit.meanChordIn,
  };
}

/**
 * The next name after `first` for the k-th rib: the trailing number counts up ("W-101" → "W-103" for
 * k = 2), or a number is added ("Rib" → "Rib 3").
 */
export function ribName(first: string, k: number): string {
  const base = first.trim() || 'Rib';
  const m = /^(.*?)(\d+)$/.exec(base);
  if (!m) return `${base} ${k + 1}`;
  const n = String(Number(m[2]) + k);
  return `${m[1]}${n.padStart(m[2].length, '0')}`;
}

/**
 * `count` ribs evenly from `firstIn` to `lastIn` (stations to a hundredth of an inch), named up from
 * `firstName`; or, when the numbers cannot make such a list, why not (the helper says it).
 */
export function evenlySpacedRibs(
  count: number,
  firstIn: number,
  lastIn: number,
  firstName: string,
): WingRibRow[] | string {
  if (!Number.isInteger(count) || count < WING_RIBS.min || count > WING_RIBS.max)
    return `a wing study takes ${WING_RIBS.min} to ${WING_RIBS.max} ribs`;
  if (!Number.isFinite(firstIn) || !Number.isFinite(lastIn) || firstIn < 0)
    return 'give the first and last rib stations';
  const step = (lastIn - firstIn) / (count - 1);
  if (step < 0.5) return 'the last rib must be outboard of the first, at least 0.5 in per bay';
  return Array.from({ length: count }, (_, k) => ({
    name: ribName(firstName, k),
    stationIn: Math.round((firstIn + k * step) * 100) / 100,
  }));
}

/** The kit model's design data into the wing study: the kit block, the airfoil and a planform to start from. */
export function kitIntoWing(values: WingFormValues, kit: KitModel, opts: { planform?: boolean } = {}): WingFormValues {
  return {
    ...values,
    kitModelId: kit.id,
    inputs: {
      ...values.inputs,
      ...kitDesignData(values.inputs, kit),
      planform: opts.planform === false ? values.inputs.planform : kitPlanform(kit),
    },
  };
}

/**
 * A new wing study: ten ribs a 14.5 in bay apart from 24 in outboard, the rib flanges of a lone rib, spars
 * at 15 % and 70 %, flush rivets on the skin, common stock. What only the supplier knows (the tail arm,
 * the study's name) is blank.
 */
export function newWingValues(kit?: KitModel): WingFormValues {
  const blank = {
    kind: 'wing',
    kitModelId: '',
    name: '',
    inputs: {
      ...newStudyInputs(),
      planform: { kind: 'rectangle' },
      tail: {},
      ribs: evenlySpacedRibs(10, 24, 154.5, 'W-101') as WingRibRow[],
      rib: { lines: flangeLines() },
      spars: { frontXc: 0.15, rearXc: 0.7, capAreaSqIn: 1 },
      skin: { gaugeCandidates: [0.016, 0.02, 0.025, 0.032], rivetCandidates: ['MS20426AD3', 'MS20426AD4'] },
      compressibility: 'karman-tsien',
    },
  } as unknown as WingFormValues;
  return kit ? kitIntoWing(blank, kit) : blank;
}

/** A stored wing revision back into the form (a copy: editing never touches the cached revision). */
export function wingValues(d: Pick<StudyDetail, 'kitModelId' | 'name' | 'inputs'>): WingFormValues {
  return {
    kind: 'wing',
    kitModelId: d.kitModelId,
    name: d.name,
    inputs: copyInputs(d.inputs as WingFormValues['inputs']),
  };
}

/** Form fields that carry a message of their own; anything else is said at the top of the form. */
const PLACED = new Set<string>([
  ...COMMON_PLACED,
  'inputs.planform',
  'inputs.planform.kind',
  'inputs.planform.spanIn',
  'inputs.planform.chordIn',
  'inputs.planform.rootChordIn',
  'inputs.planform.tipChordIn',
  'inputs.tail.armIn',
  'inputs.tail.balancingLoadLb',
  'inputs.ribs',
  'inputs.rib.lines',
  'inputs.rib.internalCp',
  'inputs.rib.flangeWidthIn',
  'inputs.rib.skinGaugeIn',
  'inputs.spars.frontXc',
  'inputs.spars.rearXc',
  'inputs.spars.capAreaSqIn',
  'inputs.skin.gaugeCandidates',
  'inputs.skin.rivetCandidates',
  'inputs.flaps.stallSpeedKeas',
  'inputs.flaps.designSpeedKeas',
  'inputs.compressibility',
]);
const RIB_FIELDS = new Set(['name', 'stationIn']);

/**
 * The wing form's field for a server path, whoever named it (zod: "inputs.ribs.3.stationIn", the engine:
 * "ribs[3].stationIn"), or null when the form has no place for it (said at the top of the form).
 */
export function wingFieldFor(path: string): string | null {
  const p = normaliseFieldPath(path);
  // Chosen with chips: one field for the whole list.
  const list = /^inputs\.((?:skin\.)?(?:gaugeCandidates|rivetCandidates))\.\d+$/.exec(p);
  if (list) return `inputs.${list[1]}`;
  if (/^inputs\.airfoil\.points\.\d+(\.\d+)?$/.test(p)) return 'inputs.airfoil.points';
  return (
    rowFieldFor(p, 'inputs.ribs', RIB_FIELDS, 'stationIn') ??
    rowFieldFor(p, 'inputs.rib.lines', LINE_FIELDS, 'name') ??
    (PLACED.has(p) ? p : null)
  );
}
