import { densitySlugPerFt3, SEA_LEVEL_DENSITY_SLUG_FT3, speedOfSoundFtPerS } from './atmosphere';
import { requireCount, requireWingBound, WING_BOUNDS } from './bounds';
import { EngineeringInputError } from './errors';
import type { PanelSolution, SurfaceSolution } from './panel-method';
import { FT_PER_S_PER_KNOT } from './units';
import { requireArray, requireFinite } from './validate';
import { COMPRESSIBILITY_RULES, type CompressibilityRule, type CpSample } from '../../lib/engineering-results';

/**
 * Compressibility corrections of an incompressible pressure coefficient Cp₀ (from the panel method or a
 * low-speed table) to the flight Mach number M, β = √(1 − M²) (any compressible-aerodynamics text):
 *
 *   Prandtl–Glauert   Cp = Cp₀ / β
 *   Kármán–Tsien      Cp = Cp₀ / (β + M²/(1 + β) · Cp₀/2)
 *
 * Both are for subsonic flow that stays subsonic everywhere. Above M ≈ 0.7 a light aircraft section is
 * transonic (shocks, drag rise) and neither holds: the engine refuses M ≥ 0.7 rather than give a number.
 * Where a corrected suction passes the critical pressure coefficient Cp* the flow there is locally
 * supersonic and the correction is no longer valid either: the result says so.
 *
 * Mach from the engine's speeds: they are equivalent airspeeds, so the true airspeed is V_EAS/√σ with
 * σ = ρ/ρ₀ of the ISA troposphere, and M = V_TAS/a with a = a₀√θ (atmosphere.ts).
 */

export const COMPRESSIBILITY_RULE_TEXT: Record<CompressibilityRule, string> = {
  'prandtl-glauert':
    "compressibility: Prandtl–Glauert, Cp = Cp₀/β, β = √(1 − M²), at each condition's Mach number (subsonic, below M 0.7)",
  'karman-tsien':
    "compressibility: Kármán–Tsien, Cp = Cp₀/(β + M²/(1 + β)·Cp₀/2), β = √(1 − M²), at each condition's Mach number (subsonic, below M 0.7)",
};

/** Ratio of specific heats of air. */
export const GAMMA_AIR = 1.4;

export function requireMach(mach: unknown, field = 'mach'): number {
  return requireWingBound(mach, 'mach', field);
}

/** β = √(1 − M²). */
export function compressibilityBeta(mach: number, field = 'mach'): number {
  const m = requireMach(mach, field);
  return Math.sqrt(1 - m * m);
}

/** True airspeed from equivalent airspeed at an ISA altitude: V_EAS / √(ρ/ρ₀), in knots. */
export function trueAirspeedKnots(speedKeas: number, altitudeFt: number): number {
  const v = requireWingBound(speedKeas, 'speedKeas');
  const h = requireWingBound(altitudeFt, 'altitudeFt');
  return v / Math.sqrt(densitySlugPerFt3(h) / SEA_LEVEL_DENSITY_SLUG_FT3);
}

/**
 * Flight Mach number of a speed in knots EAS at an ISA altitude. Not bounded here (a number is a number);
 * the corrections below refuse M ≥ 0.7.
 */
export function machNumber(speedKeas: number, altitudeFt: number): number {
  const tas = trueAirspeedKnots(speedKeas, altitudeFt) * FT_PER_S_PER_KNOT;
  return tas / speedOfSoundFtPerS(altitudeFt);
}

/**
 * The lowest pressure coefficient there is at Mach M: a vacuum, Cp = −2/(γM²). A corrected suction
 * beyond it is no answer at all: refused, naming the pressure coefficient.
 */
export function vacuumPressureCoefficient(mach: number): number {
  const m = requireMach(mach);
  return m === 0 ? -Infinity : -2 / (GAMMA_AIR * m * m);
}

function requirePhysical(cp: number, cp0: number, mach: number, rule: string): number {
  if (!(cp >= vacuumPressureCoefficient(mach))) {
    throw new EngineeringInputError(
      'cp',
      `a pressure coefficient of ${cp0} at Mach ${mach} has no ${rule} correction: it would be beyond a vacuum (the flow there is far supersonic)`,
    );
  }
  return cp;
}

/** Prandtl–Glauert: Cp₀/β. */
export function prandtlGlauertCp(cp0: number, mach: number): number {
  const c = requireWingBound(cp0, 'cp');
  return requirePhysical(c / compressibilityBeta(mach), c, mach, 'Prandtl–Glauert');
}

/** Kármán–Tsien: Cp₀/(β + M²/(1+β)·Cp₀/2). */
export function karmanTsienCp(cp0: number, mach: number): number {
  const c = requireWingBound(cp0, 'cp');
  const beta = compressibilityBeta(mach);
  const denominator = beta + ((mach * mach) / (1 + beta)) * (c / 2);
  // A suction strong enough to drive the denominator to zero has no answer either.
  return requirePhysical(denominator > 0 ? c / denominator : -Infinity, c, mach, 'Kármán–Tsien');
}

/**
 * Critical pressure coefficient: the Cp at which the local flow reaches Mach 1 in isentropic flow,
 * Cp* = 2/(γM²)·[((2 + (γ−1)M²)/(γ+1))^(γ/(γ−1)) − 1]. −∞ at M = 0 (incompressible flow never goes sonic).
 */
export function criticalPressureCoefficient(mach: number): number {
  const m = requireMach(mach);
  if (m === 0) return -Infinity;
  const g = GAMMA_AIR;
  return (2 / (g * m * m)) * (((2 + (g - 1) * m * m) / (g + 1)) ** (g / (g - 1)) - 1);
}

export function compressibleCp(cp0: number, mach: number, rule: CompressibilityRule): number {
  if (rule === 'prandtl-glauert') return prandtlGlauertCp(cp0, mach);
  if (rule === 'karman-tsien') return karmanTsienCp(cp0, mach);
  throw new EngineeringInputError('rule', `must be one of ${COMPRESSIBILITY_RULES.join(', ')} (got ${String(rule)})`);
}

/** Most Cp samples on one surface (an outline has at most 2,000 points). */
export const MAX_CP_SAMPLES = 2_000;

export interface CorrectedDistribution {
  mach: number;
  rule: CompressibilityRule;
  upper: CpSample[];
  lower: CpSample[];
  /** most negative corrected Cp, and whether it passes Cp* (locally supersonic) */
  peakCp: number;
  criticalCp: number;
  locallySupersonic: boolean;
  warnings: string[];
}

const CP_BOUND = WING_BOUNDS.cp;

/**
 * `compressibleCp` of every sample, the same arithmetic with β and the vacuum limit worked out once (a
 * study corrects some 160 samples for each of its conditions); null when any sample is not a finite Cp
 * within its bound, has no correction, or is not a plain object, which the sample-by-sample path then
 * refuses with the sample's name.
 */
function correctedQuickly(samples: CpSample[], m: number, rule: CompressibilityRule): CpSample[] | null {
  if (rule !== 'prandtl-glauert' && rule !== 'karman-tsien') return null;
  const beta = Math.sqrt(1 - m * m);
  const k = (m * m) / (1 + beta);
  const vacuum = m === 0 ? -Infinity : -2 / (GAMMA_AIR * m * m);
  const out: CpSample[] = new Array(samples.length);
  for (let i = 0; i < samples.length; i++) {
    const s = samples[i];
    if (s === null || typeof s !== 'object') return null;
    const c = s.cp;
    if (typeof c !== 'number' || !(c >= CP_BOUND.min && c <= CP_BOUND.max)) return null;
    let v: number;
    if (rule === 'prandtl-glauert') v = c / beta;
    else {
      const denominator = beta + k * (c / 2);
      v = denominator > 0 ? c / denominator : -Infinity;
    }
    if (!(v >= vacuum)) return null;
    out[i] = { xc: s.xc, cp: v };
  }
  return out;
}

/**
 * `correctCpDistribution(pressureDistribution(flow, alphaRad), mach, rule)` without the uncorrected
 * samples (every condition of every study makes them, to throw them away): the same arithmetic, Cp₀ taken
 * from the surface speeds as `pressureDistribution` takes it. Null where `correctCpDistribution` would
 * refuse anything, which the caller then leaves to it to refuse by name.
 */
export function correctFlowPressures(
  flow: PanelSolution,
  alphaRad: number,
  mach: number,
  rule: CompressibilityRule,
): CorrectedDistribution | null {
  if (!(typeof mach === 'number' && mach >= WING_BOUNDS.mach.min && mach < WING_BOUNDS.mach.max)) return null;
  const ca = Math.cos(alphaRad);
  const sa = Math.sin(alphaRad);
  const upper = correctedSurface(flow.upper, ca, sa, mach, rule);
  const lower = upper && correctedSurface(flow.lower, ca, sa, mach, rule);
  return upper && lower ? corrected(mach, rule, upper, lower) : null;
}

/** `correctedQuickly` of one surface's Cp₀ = 1 − v², v = cos α·ga + sin α·gb (as surfaceCp makes them). */
function correctedSurface(
  surf: SurfaceSolution,
  ca: number,
  sa: number,
  m: number,
  rule: CompressibilityRule,
): CpSample[] | null {
  const n = surf.x.length;
  if (n < 1 || n > MAX_CP_SAMPLES) return null;
  const beta = Math.sqrt(1 - m * m);
  const k = (m * m) / (1 + beta);
  const vacuum = m === 0 ? -Infinity : -2 / (GAMMA_AIR * m * m);
  const out: CpSample[] = new Array(n);
  for (let i = 0; i < n; i++) {
    const speed = ca * surf.ga[i] + sa * surf.gb[i];
    const c = 1 - speed * speed;
    if (!(c >= CP_BOUND.min && c <= CP_BOUND.max)) return null;
    let v: number;
    if (rule === 'prandtl-glauert') v = c / beta;
    else if (rule === 'karman-tsien') {
      const denominator = beta + k * (c / 2);
      v = denominator > 0 ? c / denominator : -Infinity;
    } else return null;
    if (!(v >= vacuum)) return null;
    out[i] = { xc: surf.x[i], cp: v };
  }
  return out;
}

/**
 * A section's Cp on both surfaces corrected to Mach `mach` by `rule` (the wing study applies this to
 * each condition at its own Mach number). At M = 0 the samples come back unchanged.
 */
export function correctCpDistribution(
  cp: { upper: CpSample[]; lower: CpSample[] },
  mach: number,
  rule: CompressibilityRule,
): CorrectedDistribution {
  const m = requireMach(mach);
  const fix = (samples: CpSample[], field: string) => {
    requireArray<CpSample>(samples, field, 1, 'list of Cp samples');
    requireCount(samples, field, {
      what: 'the number of Cp samples',
      min: 1,
      max: MAX_CP_SAMPLES,
      unit: 'samples',
      integer: true,
    });
    const quick = correctedQuickly(samples, m, rule);
    if (quick) return quick;
    // A sample the quick pass does not take: sample by sample, to refuse the first bad one by name.
    return samples.map((s, i) => {
      const at = `${field}[${i}].cp`;
      try {
        return { xc: s.xc, cp: compressibleCp(requireFinite(s.cp, at), m, rule) };
      } catch (e) {
        // The single-value rules name "cp": here it is one sample of a list.
        if (e instanceof EngineeringInputError && e.field === 'cp') throw new EngineeringInputError(at, e.reason);
        throw e;
      }
    });
  };
  return corrected(m, rule, fix(cp.upper, 'cp.upper'), fix(cp.lower, 'cp.lower'));
}

/** The corrected samples with their peak, Cp* and the warning when the peak passes it. */
function corrected(m: number, rule: CompressibilityRule, upper: CpSample[], lower: CpSample[]): CorrectedDistribution {
  let peakCp = Infinity;
  for (const s of upper) peakCp = Math.min(peakCp, s.cp);
  for (const s of lower) peakCp = Math.min(peakCp, s.cp);
  const criticalCp = criticalPressureCoefficient(m);
  const locallySupersonic = peakCp < criticalCp;
  const warnings: string[] = [];
  if (locallySupersonic) {
    warnings.push(
      `at Mach ${m.toFixed(3)} the corrected suction peak (Cp ${peakCp.toFixed(2)}) passes the critical Cp* = ${criticalCp.toFixed(2)}: the flow is locally supersonic there and the correction does not hold`,
    );
  }
  return { mach: m, rule, upper, lower, peakCp, criticalCp, locallySupersonic, warnings };
}
