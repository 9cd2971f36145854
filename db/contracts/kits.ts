import { z } from 'zod';
import { plainText } from './common';
import { checkWing, measured } from './engineering';

export const aircraftCategories = ['normal', 'utility', 'acrobatic'] as const;

/**
 * A kit model as the supplier describes it. Ranges are those of light aircraft kits under 14 CFR 23
 * (the engine's bounds, server/engineering/bounds.ts): a study made from the kit starts inside them.
 */
export const kitModelInput = z.object({
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
  airfoil: z.string({ message: 'airfoil must be text' }).trim().regex(/^NACA \d{4,5}$/, 'airfoil is a NACA designation such as "NACA 2412"'),
}).refine((k) => k.cruiseSpeedKeas == null || k.cruiseSpeedKeas > k.stallSpeedKeas, {
  path: ['cruiseSpeedKeas'], message: 'cruise speed must be above the stall speed',
}).superRefine(checkWing);
export type KitModelInput = z.input<typeof kitModelInput>;

export type KitModel = z.output<typeof kitModelInput> & { id: string; organizationId: string; createdAt: string };
