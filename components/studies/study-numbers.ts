import { KG_PER_LB, MM_PER_IN, N_PER_LBF, toDisplay, type UnitSystem } from '@/constants/units';

/** Pascals in a pound per square inch (exact from the inch and the pound-force). */
const PA_PER_PSI = N_PER_LBF / (MM_PER_IN / 1000) ** 2;

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

/** A bending or twisting moment: whole in·lb, or N·m to one place on the metric switch. */
export function momentNumber(inLb: number, system: UnitSystem): string {
  if (!Number.isFinite(inLb)) return '–';
  return system === 'metric' ? (inLb * N_PER_LBF * (MM_PER_IN / 1000)).toFixed(1) : Math.round(inLb).toString();
}
export const momentUnit = (system: UnitSystem): string => (system === 'metric' ? 'N·m' : 'in·lb');

/** A shear flow: lb/in to one place, or N/mm to two. */
export function shearFlowNumber(lbPerIn: number, system: UnitSystem): string {
  if (!Number.isFinite(lbPerIn)) return '–';
  return system === 'metric' ? ((lbPerIn * N_PER_LBF) / MM_PER_IN).toFixed(2) : lbPerIn.toFixed(1);
}
export const shearFlowUnit = (system: UnitSystem): string => (system === 'metric' ? 'N/mm' : 'lb/in');

/** A stress: whole psi, or MPa to one place. */
export function stressNumber(psi: number, system: UnitSystem): string {
  if (!Number.isFinite(psi)) return '–';
  return system === 'metric' ? (psi * PA_PER_PSI * 1e-6).toFixed(1) : Math.round(psi).toString();
}
export const stressUnit = (system: UnitSystem): string => (system === 'metric' ? 'MPa' : 'psi');
