import type { EngineeringResult } from '../../lib/engineering-results';

/**
 * What every engineering result carries, so that a stored result can always be read back with the
 * numbers it came from, the rules it applied, what to be wary of, and the product's safety caution.
 */
export const ENGINEERING_CAUTION =
  "An aid only: the kit supplier's approved data and the applicable airworthiness rules and local " +
  'authority govern. Margins come from the inputs given and are only as good as they are. Nothing ' +
  'here is certification or approval of a design or repair.';

export function envelope<I>(inputs: I, rules: string[], warnings: string[]): EngineeringResult<I> {
  return { inputs, rules, warnings, caution: ENGINEERING_CAUTION };
}

/**
 * Rounds every number in a plain-data tree to a fixed number of decimals (4: 0.0001 in, 0.0001 lb,
 * 0.0001 in Cp and margins), so stored results (jsonb) stay a fraction of the size. Only for data in
 * those units, and only after every check has been made on the full-precision numbers.
 */
export function compactNumbers<T>(value: T, decimals = 4): T {
  return compact(value, 10 ** decimals) as T;
}

function compact(value: unknown, scale: number): unknown {
  if (typeof value === 'number') return Number.isFinite(value) ? Math.round(value * scale) / scale : value;
  if (Array.isArray(value)) {
    const out = new Array(value.length);
    for (let i = 0; i < value.length; i++) out[i] = compact(value[i], scale);
    return out;
  }
  if (value !== null && typeof value === 'object') {
    const out: Record<string, unknown> = {};
    for (const key of Object.keys(value)) out[key] = compact((value as Record<string, unknown>)[key], scale);
    return out;
  }
  return value;
}

/** Margin of safety allowable / applied − 1; null when nothing is applied (JSON has no Infinity). */
export function marginOfSafety(allowable: number, applied: number): number | null {
  if (applied <= 0) return null;
  return allowable / applied - 1;
}
