import { z } from 'zod';
import { pageQuery, plainText } from './common';
import { COUPON_OUTCOMES } from '../../lib/engineering-results';
import { GAUGE_RANGE_IN, measured } from './engineering';

/** The engine's outcomes of a coupon test: one list for the engine, the coupon_tests table and the API. */
export const couponOutcomes = COUPON_OUTCOMES;
export type CouponOutcome = (typeof couponOutcomes)[number];
export const couponOutcomeLabels: Record<CouponOutcome, string> = {
  no_deformation: 'No permanent deformation',
  slight_deformation: 'Slight deformation',
  excessive_deformation: 'Excessive deformation',
  failure: 'Failure',
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
  testedOn: z.iso
    .date({ message: 'test date is a date like 2026-11-30' })
    .refine((d) => d >= EARLIEST_COUPON_DATE, `test date cannot be before ${EARLIEST_COUPON_DATE}`)
    .refine(
      (d) => d <= new Date(Date.now() + 86_400_000).toISOString().slice(0, 10),
      'test date cannot be in the future',
    ),
});
export type CouponInput = z.input<typeof couponInput>;

/** A correction of a recorded test: the whole test as it should have been, and why. */
export const couponCorrectionInput = couponInput.safeExtend({
  reason: plainText('the reason', 3, 500, 'say why the record is corrected'),
});
export type CouponCorrectionInput = z.input<typeof couponCorrectionInput>;

/** `GET /api/coupons`: a page of the record, of one material or rivet when asked. */
export const couponListQuery = pageQuery.extend({
  material: plainText('the material', 1, 60).optional(),
  rivetSpec: plainText('the rivet', 1, 40).optional(),
});
export type CouponListQuery = z.input<typeof couponListQuery>;

export const couponActions = ['correct', 'delete'] as const;
export type CouponAction = (typeof couponActions)[number];

export type CouponTest = z.output<typeof couponInput> & {
  id: string;
  createdAt: string;
  createdByName: string;
  /** Why this entry corrects an earlier one ('' for a first record). */
  correctionReason: string;
  /** The entry that corrected this one: this one is kept as it was recorded and no longer counts. */
  correctedBy: { id: string; byName: string; at: string; reason: string } | null;
  /** Published part revisions a study may have drawn from this test (or the entries it corrected). */
  backs: string[];
  /** What the reader may do with it: the screen's buttons come from this list only. */
  allowedActions: CouponAction[];
};

/** The engine's own tolerance for one stock gauge (GAUGE_MATCH_TOLERANCE_IN): 0.050 and 0.051 in are one gauge. */
export const COUPON_GAUGE_TOLERANCE_IN = 0.0011;

/** A published (or since superseded) part revision, as the coupon rules read it. */
export type CouponBackedRevision = {
  rivetSpec: string;
  gaugeIn: number;
  publishedAt: Date | string;
  fromStudy: boolean;
};

/**
 * Whether a test may stand behind a published revision. Tests reach a schedule only through a load
 * study, which reads them for the same rivet at the same gauge (its coupon allowables) or a thicker one
 * (the cap on its fallback), whatever the material: any test of that rivet and gauge or thicker, on
 * record before the revision was published, may have been read.
 */
export function couponBacks(
  test: { rivetSpec: string; gaugeIn: number; createdAt: Date | string },
  rev: CouponBackedRevision,
): boolean {
  return (
    rev.fromStudy &&
    test.rivetSpec.trim().toUpperCase() === rev.rivetSpec.trim().toUpperCase() &&
    test.gaugeIn >= rev.gaugeIn - COUPON_GAUGE_TOLERANCE_IN &&
    new Date(test.createdAt).getTime() <= new Date(rev.publishedAt).getTime()
  );
}

/** Why a test cannot be deleted, or null. A corrected entry goes with its correction, never alone. */
export function couponDeleteRefusal(t: { superseded: boolean; backs: readonly string[] }): string | null {
  if (t.superseded)
    return 'this entry was corrected: it stays in the record as it was (delete the current entry to remove the test)';
  if (t.backs.length)
    return `this test may back the published ${t.backs.join(', ')}: it stays in the record (correct it instead; published revisions keep the numbers they were approved with)`;
  return null;
}

/** Why a test cannot be corrected, or null: only the current entry is corrected. */
export const couponCorrectRefusal = (t: { superseded: boolean }): string | null =>
  t.superseded ? 'this entry was already corrected: correct the current entry' : null;

export const allowedCouponActions = (t: { superseded: boolean; backs: readonly string[] }): CouponAction[] =>
  couponActions.filter((a) => (a === 'correct' ? couponCorrectRefusal(t) : couponDeleteRefusal(t)) === null);

/** A (material, gauge, rivet) with its tests and the pull-through allowables studies take from them. */
export type CouponAllowance = {
  material: string;
  gaugeIn: number;
  rivetSpec: string;
  tests: CouponTest[];
  limitLb: number;
  ultimateLb: number;
  warnings: string[];
};
