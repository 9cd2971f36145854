import { z } from 'zod';
import { plainText } from './common';
import { GAUGE_RANGE_IN, measured } from './engineering';

export const couponOutcomes = ['no_deformation', 'slight_deformation', 'excessive_deformation', 'failure'] as const;
export type CouponOutcome = (typeof couponOutcomes)[number];
export const couponOutcomeLabels: Record<CouponOutcome, string> = {
  no_deformation: 'No permanent deformation', slight_deformation: 'Slight deformation',
  excessive_deformation: 'Excessive deformation', failure: 'Failure',
};

/** The earliest test date taken: older records are typed from paper, not tested for this kit. */
export const EARLIEST_COUPON_DATE = '1950-01-01';

export const couponInput = z.object({
  material: plainText('the material', 1, 40, 'name the material, e.g. 6061-T6'),
  /** in: 0.008 – 0.25 */
  gaugeIn: measured('gauge', GAUGE_RANGE_IN.min, GAUGE_RANGE_IN.max, 'in'),
  /** in: 0.25 – 24 */
  couponWidthIn: measured('coupon width', 0.25, 24, 'in'),
  rivetSpec: plainText('the rivet callout', 3, 40, 'give the rivet callout, e.g. MS20470AD4'),
  /** lb: 0.1 – 20,000 */
  loadLb: measured('load', 0.1, 20_000, 'lb'),
  outcome: z.enum(couponOutcomes, { message: 'choose what the coupon did' }),
  note: plainText('the note', 0, 2000).default(''),
  /** from 1950-01-01 to tomorrow (a test dated ahead of every time zone has not happened yet) */
  testedOn: z.iso.date({ message: 'test date is a date like 2026-11-30' })
    .refine((d) => d >= EARLIEST_COUPON_DATE, `test date cannot be before ${EARLIEST_COUPON_DATE}`)
    .refine((d) => d <= new Date(Date.now() + 86_400_000).toISOString().slice(0, 10), 'test date cannot be in the future'),
});
export type CouponInput = z.input<typeof couponInput>;

export type CouponTest = z.output<typeof couponInput> & { id: string; createdAt: string; createdByName: string };

/** A (material, gauge, rivet) with its tests and the pull-through allowables studies take from them. */
export type CouponAllowance = {
  material: string; gaugeIn: number; rivetSpec: string; tests: CouponTest[];
  limitLb: number; ultimateLb: number; warnings: string[];
};
