/**
 * Rounding of stored results to what their numbers mean. Arithmetic in binary floating point leaves
 * noise in the last digits (0.4 × 1.5 = 0.6000000000000001, −0.4 × 4.4 = −1.7600000000000002): harmless
 * inside the chain, but a stored result is read by people, compared by tests and diffed between
 * revisions. Results are rounded once, where they are built, after every check has been made on the
 * full-precision numbers.
 *
 * Six significant figures: finer than any input of the chain is known (a weight to the pound, a chord
 * to the hundredth of an inch, an allowable to the tenth of a pound), so the rounding never changes
 * what a number says, whatever its unit and size. Anything smaller than 1e-9 in the engine's units
 * (in, lb, psi, rad) is zero.
 */

export const STORED_SIGNIFICANT_DIGITS = 6;
/** below this magnitude a stored number is zero (1e-9 in, lb, psi or rad means nothing) */
export const STORED_ZERO = 1e-9;

/** `x` to `digits` significant figures, as the shortest decimal that prints so (no float noise). */
export function roundSignificant(x: number, digits: number = STORED_SIGNIFICANT_DIGITS): number {
  if (!Number.isFinite(x)) return x;
  if (Math.abs(x) < STORED_ZERO) return 0;
  // A whole number of up to six digits prints as itself (rivet counts, ranks): no string made and read back.
  if (Number.isInteger(x) && Math.abs(x) < 1e6 && digits >= 6) return x;
  // toPrecision gives the decimal; parsing it back gives the double nearest to that decimal, which
  // prints as the decimal itself.
  return Number(x.toPrecision(digits));
}

/** Every number in a plain-data tree rounded with `roundSignificant`; strings, booleans and nulls kept. */
export function roundStored<T>(value: T, digits: number = STORED_SIGNIFICANT_DIGITS): T {
  return round(value, digits) as T;
}

function round(value: unknown, digits: number): unknown {
  if (typeof value === 'number') return roundSignificant(value, digits);
  if (Array.isArray(value)) {
    const out = new Array(value.length);
    for (let i = 0; i < value.length; i++) out[i] = round(value[i], digits);
    return out;
  }
  if (value !== null && typeof value === 'object') {
    const out: Record<string, unknown> = {};
    for (const key of Object.keys(value)) out[key] = round((value as Record<string, unknown>)[key], digits);
    return out;
  }
  return value;
}
