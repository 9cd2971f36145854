import { z } from 'zod';

export const aircraftCategories = ['normal', 'utility', 'acrobatic'] as const;

export const kitModelInput = z.object({
  code: z.string().trim().min(1, 'give the kit a short code').max(20, 'keep the code to 20 characters'),
  name: z.string().trim().min(1, 'give the kit a name').max(120),
  weightLb: z.number({ message: 'weight must be a number' }).positive('weight must be greater than zero').max(20000, 'weight over 20,000 lb is outside this tool'),
  wingAreaSqFt: z.number({ message: 'wing area must be a number' }).positive('wing area must be greater than zero').max(2000),
  meanChordIn: z.number({ message: 'mean chord must be a number' }).positive('mean chord must be greater than zero').max(400),
  stallSpeedKeas: z.number({ message: 'stall speed must be a number' }).positive('stall speed must be greater than zero').max(200),
  cruiseSpeedKeas: z.number().positive('cruise speed must be greater than zero').max(400).nullable().optional(),
  category: z.enum(aircraftCategories, { message: 'category is normal, utility or acrobatic' }),
  airfoil: z.string().trim().regex(/^NACA \d{4,5}$/, 'airfoil is a NACA designation such as "NACA 2412"'),
}).refine((k) => k.cruiseSpeedKeas == null || k.cruiseSpeedKeas > k.stallSpeedKeas, {
  path: ['cruiseSpeedKeas'], message: 'cruise speed must be above the stall speed',
});
export type KitModelInput = z.input<typeof kitModelInput>;

export type KitModel = z.output<typeof kitModelInput> & { id: string; organizationId: string; createdAt: string };
