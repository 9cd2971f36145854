import { z } from 'zod';

export const couponOutcomes = ['no_deformation', 'slight_deformation', 'excessive_deformation', 'failure'] as const;
export type CouponOutcome = (typeof couponOutcomes)[number];
export const couponOutcomeLabels: Record<CouponOutcome, string> = {
  no_deformation: 'No permanent deformation', slight_deformation: 'Slight deformation',
  excessive_deformation: 'Excessive deformation', failure: 'Failure',
};

export const couponInput = z.object({
  material: z.string().trim().min(1, 'name the material, e.g. 6061-T6').max(40),
  gaugeIn: z.number({ message: 'gauge must be a number' }).positive('gauge must be greater than zero').max(0.25, 'gauge over 0.25 in is outside this tool'),
  couponWidthIn: z.number({ message: 'coupon width must be a number' }).positive('coupon width must be greater than zero').max(24),
  rivetSpec: z.string().trim().min(3, 'give the rivet callout, e.g. MS20470AD4').max(40),
  loadLb: z.number({ message: 'load must be a number' }).positive('load must be greater than zero').max(20000),
  outcome: z.enum(couponOutcomes, { message: 'choose what the coupon did' }),
  note: z.string().trim().max(2000).default(''),
  testedOn: z.iso.date({ message: 'test date is a date like 2026-11-30' }),
});
export type CouponInput = z.input<typeof couponInput>;

export type CouponTest = z.output<typeof couponInput> & { id: string; createdAt: string; createdByName: string };

/** A (material, gauge, rivet) with its tests and the pull-through allowables studies take from them. */
export type CouponAllowance = {
  material: string; gaugeIn: number; rivetSpec: string; tests: CouponTest[];
  limitLb: number; ultimateLb: number; warnings: string[];
};
