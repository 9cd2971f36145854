/**
 * Thin-airfoil theory for a flat plate: the limit the panel method must approach as thickness and camber
 * vanish, and the 2π section lift slope behind the wing lift-slope estimate.
 */
export const THIN_AIRFOIL_LIFT_SLOPE = 2 * Math.PI;

export function thinAirfoilLiftCoefficient(alphaRad: number): number {
  return THIN_AIRFOIL_LIFT_SLOPE * alphaRad;
}

/** Pressure jump across a flat plate, ΔCp = Cp,lower − Cp,upper = 4α√((1 − x)/x), x in chords. */
export function flatPlatePressureJump(xc: number, alphaRad: number): number {
  return 4 * alphaRad * Math.sqrt((1 - xc) / xc);
}
