import { KG_PER_LB, toDisplay, type UnitSystem } from '@/constants/units';

/**
 * Numbers of the study's tables without their unit (the unit heads the column), so columns stay
 * narrow and line up.
 */

/** A pitch: thousandths of an inch (0.875, 1.000), or tenths of a millimetre. */
export function pitchNumber(inches: number, system: UnitSystem): string {
  if (!Number.isFinite(inches)) return '–';
  return system === 'metric' ? toDisplay('length', inches, system).toFixed(1) : inches.toFixed(3);
}

/** A load per rivet: one decimal below 100, whole above (lb or N). */
export function forceNumber(lbf: number, system: UnitSystem): string {
  if (!Number.isFinite(lbf)) return '–';
  const v = toDisplay('force', lbf, system);
  return v.toFixed(Math.abs(v) >= 100 ? 0 : 1);
}

/** A margin of safety as the trade writes it: +0.11, −0.05; none when nothing is applied. */
export function marginText(ms: number | null | undefined): string {
  if (ms === null || ms === undefined || !Number.isFinite(ms)) return '–';
  const r = Math.round(ms * 100) / 100;
  return r < 0 ? `−${Math.abs(r).toFixed(2)}` : `+${r.toFixed(2)}`;
}

/** Rib weights are fractions of a pound: three places in pounds, whole grams on the metric switch. */
export function partWeight(lb: number, system: UnitSystem): string {
  if (!Number.isFinite(lb)) return '–';
  return system === 'metric' ? `${Math.round(lb * KG_PER_LB * 1000)} g` : `${lb.toFixed(3)} lb`;
}
