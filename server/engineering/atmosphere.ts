import { requireInRange, requireNonNegative } from './validate';
import { FT_PER_S_PER_KNOT, psfToPsi } from './units';

/**
 * International Standard Atmosphere, troposphere only (U.S. Standard Atmosphere 1976). This module
 * works in slug/ft³, ft and psf because that is how the published formula and the FAR gust formula are
 * written; `dynamicPressurePsi` converts to the core's psi at the boundary.
 */
export const SEA_LEVEL_DENSITY_SLUG_FT3 = 0.0023769;
export const GRAVITY_FT_S2 = 32.174;
/** Tropopause of the standard atmosphere; above it the temperature lapse no longer applies. */
export const TROPOPAUSE_FT = 36089;

/** Speed of sound at sea level, standard day (U.S. Standard Atmosphere 1976: 340.294 m/s). */
export const SEA_LEVEL_SPEED_OF_SOUND_FT_S = 1116.45;

/**
 * Temperature ratio θ = T/T0 = 1 − h/145442 (the troposphere's lapse of 6.5 K/km, h in ft); the density
 * ratio is θ^4.255876.
 */
export function temperatureRatio(altitudeFt: number): number {
  const h = requireInRange(altitudeFt, 'altitudeFt', -2000, TROPOPAUSE_FT, 'altitude (ft, troposphere)');
  return 1 - h / 145442;
}

export function densitySlugPerFt3(altitudeFt: number): number {
  return SEA_LEVEL_DENSITY_SLUG_FT3 * temperatureRatio(altitudeFt) ** 4.255876;
}

/** Speed of sound a = a0·√θ, ft/s (a ∝ √T). */
export function speedOfSoundFtPerS(altitudeFt: number): number {
  return SEA_LEVEL_SPEED_OF_SOUND_FT_S * Math.sqrt(temperatureRatio(altitudeFt));
}

/**
 * q = ½ρ₀V² from equivalent airspeed: EAS already folds in the density ratio, so sea-level density is
 * right at every altitude. Result in psf.
 */
export function dynamicPressurePsf(speedKeas: number): number {
  const v = requireNonNegative(speedKeas, 'speedKeas', 'speed') * FT_PER_S_PER_KNOT;
  return 0.5 * SEA_LEVEL_DENSITY_SLUG_FT3 * v * v;
}

export function dynamicPressurePsi(speedKeas: number): number {
  return psfToPsi(dynamicPressurePsf(speedKeas));
}
