import { z } from 'zod';
import { boundText } from '../../lib/number-text';

/*
 * Physical ranges for the contracts' numbers. Every measured input states its range beside its field
 * with these, so a form shows the same words the API answers with. The engine (server/engineering/
 * bounds.ts) holds its own table and refuses anything outside it; the contracts use the same numbers
 * or narrower ones (tests/engineering/bounds.test.ts checks that they never let through more).
 */

/**
 * A measured quantity: finite, and between min and max in its unit. A non-positive value of a quantity
 * that must be positive is told so first ("greater than zero"), then the range.
 */
export const measured = (what: string, min: number, max: number, unit: string) => {
  const range = `${what} must be between ${boundText(min)} and ${boundText(max)}${unit ? ` ${unit}` : ''}`;
  const n = z.number({ message: `${what} must be a number` });
  return (min > 0 ? n.positive(`${what} must be greater than zero`) : n).min(min, range).max(max, range);
};

/** A count: a whole number between min and max. */
export const whole = (what: string, min: number, max: number) =>
  z
    .number({ message: `${what} must be a number` })
    .int(`${what} must be a whole number`)
    .min(min, `${what} must be from ${boundText(min)} to ${boundText(max)}`)
    .max(max, `${what} must be from ${boundText(min)} to ${boundText(max)}`);

/** A list whose length is bounded, with the field's own words. */
export const listOf = <T extends z.ZodType>(item: T, what: string, min: number, max: number, tooFew?: string) =>
  z
    .array(item, { message: `${what} must be a list` })
    .min(min, tooFew ?? `give at least ${min} ${what}`)
    .max(max, `at most ${boundText(max)} ${what}`);

/** Sheet gauge, in: from foil-thin 0.008 in to 1/4 in plate (thicker is not sheet-metal riveting). */
export const GAUGE_RANGE_IN = { min: 0.008, max: 0.25 } as const;
/** Aspect ratio S/c² of a wing made from its area and mean chord. */
export const ASPECT_RATIO_RANGE = { min: 2, max: 40 } as const;
/** Wing loading W/S, psf. */
export const WING_LOADING_RANGE_PSF = { min: 2, max: 80 } as const;
/** Square inches per square foot, for the aspect ratio. */
const SQIN_PER_SQFT = 144;

/**
 * The wing made from a kit's numbers must be a wing: aspect ratio and wing loading in range, each told
 * against the field that makes it absurd (the same checks and words as the engine's).
 */
export function checkWing(
  k: { weightLb: number; wingAreaSqFt: number; meanChordIn: number },
  ctx: z.RefinementCtx,
): void {
  // Fields already refused on their own are told once, by their own message.
  if (![k.weightLb, k.wingAreaSqFt, k.meanChordIn].every((v) => typeof v === 'number' && v > 0)) return;
  const ar = (k.wingAreaSqFt * SQIN_PER_SQFT) / (k.meanChordIn * k.meanChordIn);
  if (ar < ASPECT_RATIO_RANGE.min || ar > ASPECT_RATIO_RANGE.max) {
    ctx.addIssue({
      code: 'custom',
      path: ['meanChordIn'],
      message: `a mean chord of ${k.meanChordIn} in on ${k.wingAreaSqFt} ft² gives an aspect ratio S/c² of ${ar.toPrecision(3)}: a wing has ${ASPECT_RATIO_RANGE.min} to ${ASPECT_RATIO_RANGE.max}`,
    });
  }
  const ws = k.weightLb / k.wingAreaSqFt;
  if (ws < WING_LOADING_RANGE_PSF.min || ws > WING_LOADING_RANGE_PSF.max) {
    ctx.addIssue({
      code: 'custom',
      path: ['weightLb'],
      message: `${k.weightLb} lb on ${k.wingAreaSqFt} ft² is a wing loading of ${ws.toPrecision(3)} psf: this tool takes ${WING_LOADING_RANGE_PSF.min} to ${WING_LOADING_RANGE_PSF.max} psf`,
    });
  }
}
