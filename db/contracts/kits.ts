import { z } from 'zod';
import { plainText } from './common';
import { CATEGORIES } from '../../lib/engineering-results';
import { checkWing, measured } from './engineering';

/** The engine's categories (14 CFR 23): one list for the engine, the kit_models table and the API. */
export const aircraftCategories = CATEGORIES;

/**
 * A kit model as the supplier describes it. Ranges are those of light aircraft kits under 14 CFR 23
 * (the engine's bounds, server/engineering/bounds.ts): a study made from the kit starts inside them.
 */
export const kitModelInput = z
  .object({
    code: plainText('the code', 1, 20, 'give the kit a short code'),
    name: plainText('the name', 1, 120, 'give the kit a name'),
    /** gross weight, lb: 100 – 20,000 */
    weightLb: measured('weight', 100, 20_000, 'lb'),
    /** wing area, ft²: 10 – 2,000 */
    wingAreaSqFt: measured('wing area', 10, 2_000, 'ft²'),
    /** mean geometric chord, in: 10 – 300 */
    meanChordIn: measured('mean chord', 10, 300, 'in'),
    /** stall speed, KEAS: 20 – 200 */
    stallSpeedKeas: measured('stall speed', 20, 200, 'KEAS'),
    /** design cruise speed VC, KEAS: 30 – 400 */
    cruiseSpeedKeas: measured('cruise speed', 30, 400, 'KEAS').nullable().optional(),
    category: z.enum(aircraftCategories, { message: 'category is normal, utility or acrobatic' }),
    airfoil: z
      .string({ message: 'airfoil must be text' })
      .trim()
      .regex(/^NACA \d{4,5}$/, 'airfoil is a NACA designation such as "NACA 2412"'),
  })
  .refine((k) => k.cruiseSpeedKeas == null || k.cruiseSpeedKeas > k.stallSpeedKeas, {
    path: ['cruiseSpeedKeas'],
    message: 'cruise speed must be above the stall speed',
  })
  .superRefine(checkWing);
export type KitModelInput = z.input<typeof kitModelInput>;

export type KitModel = z.output<typeof kitModelInput> & { id: string; organizationId: string; createdAt: string };

// ---- Changing and removing a kit model ----

/** A kit's data as it is edited: the kit's fields, and why (required once studies or parts rely on the kit). */
export const kitChangeInput = kitModelInput.safeExtend({
  reason: plainText('the reason', 0, 500).default(''),
});
export type KitChangeInput = z.input<typeof kitChangeInput>;

/** The fields studies and parts are computed from: a change to one of these is history once the kit is relied on. */
export const kitDesignFields = [
  'weightLb',
  'wingAreaSqFt',
  'meanChordIn',
  'stallSpeedKeas',
  'cruiseSpeedKeas',
  'category',
  'airfoil',
] as const;
export type KitDesignField = (typeof kitDesignFields)[number];
export const kitFieldLabels: Record<'code' | 'name' | KitDesignField, string> = {
  code: 'code',
  name: 'name',
  weightLb: 'gross weight',
  wingAreaSqFt: 'wing area',
  meanChordIn: 'mean chord',
  stallSpeedKeas: 'stall speed',
  cruiseSpeedKeas: 'cruise speed',
  category: 'category',
  airfoil: 'airfoil',
};

/** What relies on a kit model: counted on the server, read by the rules below. */
export type KitReliance = { studies: number; publishedParts: number; builds: number };

export const kitActions = ['edit', 'delete'] as const;
export type KitAction = (typeof kitActions)[number];

const count = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** Whether anything was made from the kit's numbers: a study, a published part or a shipped build. */
export const kitReliedOn = (r: KitReliance) => r.studies + r.publishedParts + r.builds > 0;

/** Why the kit cannot be deleted, or null: studies, published parts and shipped builds were made from it. */
export function kitDeleteRefusal(r: KitReliance): string | null {
  if (!kitReliedOn(r)) return null;
  const what = [
    r.publishedParts
      ? count(r.publishedParts, 'part design with a published revision', 'part designs with published revisions')
      : '',
    r.builds ? count(r.builds, 'shipped build') : '',
    r.studies ? count(r.studies, 'load study', 'load studies') : '',
  ]
    .filter(Boolean)
    .join(', ');
  return `this kit model has ${what}: it stays in the catalogue (its data can still be changed, with the change kept in its history)`;
}

/** Why this change needs a reason, or null: changing the numbers of a relied-on kit is recorded with why. */
export function kitChangeReasonRefusal(r: KitReliance, changed: readonly string[], reason: string): string | null {
  if (
    !kitReliedOn(r) ||
    !changed.some((f) => (kitDesignFields as readonly string[]).includes(f)) ||
    reason.trim().length >= 3
  )
    return null;
  return 'studies or published parts were made from the old numbers: say why they change';
}

/** What the supplier may do with their kit: edit always, delete while nothing relies on it. */
export const allowedKitActions = (r: KitReliance): KitAction[] => (kitDeleteRefusal(r) ? ['edit'] : ['edit', 'delete']);

/** One change of a kit's data, the changed fields' old and new values. */
export type KitModelChange = {
  id: string;
  changedByName: string;
  reason: string;
  createdAt: string;
  before: Record<string, unknown>;
  after: Record<string, unknown>;
};

/** A kit model as its own page shows it: what relies on it, what may be done, and its history. */
export type KitModelDetail = KitModel & {
  reliance: KitReliance;
  allowedActions: KitAction[];
  deleteRefusal: string | null;
  changes: KitModelChange[];
};
