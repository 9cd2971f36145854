import type { KitModel, StudyDetail, StudyInput } from '@/db/contracts';
import { lengthNumber, unitLabel, type UnitSystem } from '@/constants/units';
import { kitDesignValues } from '@/components/kits/kit-values';

/**
 * The study form holds a StudyInput in the engine's units (in, lb, sq ft, KEAS), exactly what is sent:
 * the number fields convert what the person types in mm, kg or N as they type (FormNumberField with a
 * quantity), so zodResolver(ribStudyForm) checks the very values the server gets.
 */
export type StudyFormValues = StudyInput;

/** Sheet gauges of the trade, in. */
export const STOCK_GAUGES_IN = [0.016, 0.02, 0.025, 0.032, 0.04, 0.05, 0.063] as const;

export const RIVET_FAMILIES: { family: string; label: string; codes: string[] }[] = [
  { family: 'MS20470AD', label: 'Solid, universal head', codes: [3, 4, 5, 6].map((d) => `MS20470AD${d}`) },
  { family: 'MS20426AD', label: 'Solid, 100° countersunk', codes: [3, 4, 5, 6].map((d) => `MS20426AD${d}`) },
  { family: 'PULLED', label: 'Pulled, protruding head', codes: [3, 4, 5, 6].map((d) => `PULLED-${d}`) },
  { family: 'PULLED-CSK', label: 'Pulled, countersunk', codes: [3, 4, 5, 6].map((d) => `PULLED-${d}-CSK`) },
];

/** Sheet materials the engine knows by name. */
export const STUDY_MATERIALS = ['6061-T6', '2024-T3'] as const;

/** A gauge chip: "0.020 in", or "0.51 mm" on the metric switch. */
export function gaugeLabel(gaugeIn: number, system: UnitSystem): string {
  return `${lengthNumber(gaugeIn, system)} ${unitLabel('length', system)}`;
}

/** Chips carry strings; gauges go back to the numbers they came from, in inches, in ascending order. */
export const gaugeKey = (g: number): string => String(g);

export function toggleGauge(current: readonly number[] | undefined, key: string): number[] {
  const g = Number(key);
  const list = [...(current ?? [])];
  const i = list.findIndex((x) => Math.abs(x - g) < 1e-9);
  if (i >= 0) list.splice(i, 1);
  else list.push(g);
  return list.sort((a, b) => a - b);
}

export function toggleRivet(current: readonly string[] | undefined, code: string): string[] {
  const list = [...(current ?? [])];
  const i = list.indexOf(code);
  if (i >= 0) list.splice(i, 1);
  else list.push(code);
  const order = RIVET_FAMILIES.flatMap((f) => f.codes);
  const rank = (c: string) => (order.includes(c) ? order.indexOf(c) : order.length);
  return list.sort((a, b) => rank(a) - rank(b) || a.localeCompare(b));
}

/** "NACA 2412" (the kit model's notation) → "2412". */
export function nacaDigits(airfoil: string | undefined | null): string {
  const m = /(\d{4,5})/.exec(airfoil ?? '');
  return m ? m[1] : '';
}

type KitAndAirfoil = Pick<StudyFormValues['inputs'], 'kit' | 'airfoil'>;

/**
 * What a kit model says of a study's aircraft, rib or wing alike: the kit block (over what the study
 * had) and the airfoil, when the kit's is a NACA section.
 */
export function kitDesignData(inputs: KitAndAirfoil, kit: KitModel): KitAndAirfoil {
  return {
    kit: {
      ...inputs.kit,
      ...kitDesignValues(kit),
    },
    airfoil: nacaDigits(kit.airfoil) ? { kind: 'naca', designation: nacaDigits(kit.airfoil) } : inputs.airfoil,
  };
}

/** The kit model's design data into the study's kit block (and the rib chord, when not set yet). */
export function kitIntoStudy(values: StudyFormValues, kit: KitModel): StudyFormValues {
  return {
    ...values,
    kitModelId: kit.id,
    inputs: {
      ...values.inputs,
      ...kitDesignData(values.inputs, kit),
      rib: { ...values.inputs.rib, chordIn: values.inputs.rib.chordIn ?? kit.meanChordIn },
    },
  };
}

/** A rib's two flange lines from 2 % to 85 % of the chord: a new rib's, and every rib's of a new wing. */
export function flangeLines(): StudyFormValues['inputs']['lines'] {
  return [
    { name: 'Upper flange', surface: 'upper', startXc: 0.02, endXc: 0.85 },
    { name: 'Lower flange', surface: 'lower', startXc: 0.02, endXc: 0.85 },
  ];
}

/**
 * What a new rib or wing study starts from besides its own blocks: a normal-category kit to fill in,
 * a NACA airfoil to name, common stock and rivets, 8D maximum pitch in eighths of an inch, four zones.
 */
export function newStudyInputs() {
  return {
    kit: { category: 'normal' },
    airfoil: { kind: 'naca', designation: '' },
    material: '6061-T6',
    gaugeCandidates: [0.016, 0.02, 0.025, 0.032, 0.04],
    rivetCandidates: ['PULLED-4', 'MS20470AD4'],
    maxPitchDiameters: 8,
    pitchIncrementIn: 0.125,
    maxZones: 4,
  };
}

/**
 * A new study: two flange lines from 2 % to 85 % of the chord, common stock and rivets, 8D maximum
 * pitch in eighths of an inch. What only the supplier knows (rib spacing, the study's name) is blank.
 */
export function newStudyValues(kit?: KitModel): StudyFormValues {
  const blank = {
    kitModelId: '',
    name: '',
    inputs: { ...newStudyInputs(), rib: {}, lines: flangeLines() },
  } as unknown as StudyFormValues;
  return kit ? kitIntoStudy(blank, kit) : blank;
}

/** A stored revision back into the form, to look at or to compute again as the next revision. */
export function studyValues(d: Pick<StudyDetail, 'kitModelId' | 'name' | 'inputs'>): StudyFormValues {
  return { kitModelId: d.kitModelId, name: d.name, inputs: copyInputs(d.inputs as StudyFormValues['inputs']) };
}

/** A deep copy of stored inputs (plain JSON), so that editing the form never touches the cached revision. */
export function copyInputs<T>(v: T): T {
  return JSON.parse(JSON.stringify(v)) as T;
}

/** Fields both study forms have at the same paths; each form's own are added to these. */
export const COMMON_PLACED = [
  'kitModelId',
  'name',
  'inputs.kit.weightLb',
  'inputs.kit.wingAreaSqFt',
  'inputs.kit.meanChordIn',
  'inputs.kit.stallSpeedKeas',
  'inputs.kit.cruiseSpeedKeas',
  'inputs.kit.diveSpeedKeas',
  'inputs.kit.category',
  'inputs.kit.altitudeFt',
  'inputs.kit.liftSlopePerRad',
  'inputs.airfoil',
  'inputs.airfoil.designation',
  'inputs.airfoil.points',
  'inputs.airfoil.name',
  'inputs.material',
  'inputs.gaugeCandidates',
  'inputs.rivetCandidates',
  'inputs.maxPitchDiameters',
  'inputs.pitchIncrementIn',
  'inputs.maxZones',
  'inputs.rankBy',
  'inputs.minutesPerHole',
  'inputs.panels',
] as const;

/** Form fields that can carry a message of their own; anything else is said at the top of the form. */
const PLACED = new Set<string>([
  ...COMMON_PLACED,
  'inputs.rib.chordIn',
  'inputs.rib.spacingIn',
  'inputs.rib.internalCp',
  'inputs.rib.flangeWidthIn',
  'inputs.lines',
]);
export const LINE_FIELDS = new Set(['name', 'surface', 'startXc', 'endXc']);

/**
 * A path into a list of rows (`${list}.3.endXc`): the row's own field when the form has one by that
 * name, else the row's `fallback` field (a message about the whole row); null when not in that list.
 */
export function rowFieldFor(path: string, list: string, fields: ReadonlySet<string>, fallback: string): string | null {
  if (!path.startsWith(`${list}.`)) return null;
  const m = /^(\d+)(?:\.(\w+))?$/.exec(path.slice(list.length + 1));
  if (!m) return null;
  return m[2] && fields.has(m[2]) ? `${list}.${m[1]}.${m[2]}` : `${list}.${m[1]}.${fallback}`;
}

/**
 * One spelling for a field, whoever named it: zod says "inputs.lines.0.endXc", the engine says
 * "lines[0].endXc" (no "inputs." and brackets for indices). Both become the form's "inputs.lines.0.endXc".
 */
export function normaliseFieldPath(path: string): string {
  const dotted = path
    .trim()
    .replace(/\[(\d+)\]/g, '.$1')
    .replace(/^\.+|\.+$/g, '');
  if (dotted === 'kitModelId' || dotted === 'name' || dotted === 'inputs' || dotted.startsWith('inputs.'))
    return dotted;
  return `inputs.${dotted}`;
}

/**
 * The form field that shows a server message for `path`, or null when the form has no place for it
 * (coupon data, settings the form does not show): those are said at the top of the form.
 */
export function studyFieldFor(path: string): string | null {
  const p = normaliseFieldPath(path);
  // A list chosen with chips is one field: "gaugeCandidates.2" is said on the gauge chips.
  const list = /^inputs\.(gaugeCandidates|rivetCandidates)\.\d+$/.exec(p);
  if (list) return `inputs.${list[1]}`;
  if (/^inputs\.airfoil\.points\.\d+(\.\d+)?$/.test(p)) return 'inputs.airfoil.points';
  return rowFieldFor(p, 'inputs.lines', LINE_FIELDS, 'name') ?? (PLACED.has(p) ? p : null);
}
