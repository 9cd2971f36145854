import { chordAt } from './schrenk';
import type { PressureDistribution } from './panel-method';
import type { Planform } from '../../lib/engineering-results';

/**
 * Loads along the span of one wing (half the aeroplane) from Schrenk's lift grading: shear, bending
 * moment and torque at a station y from the centre line, each the integral of what lies outboard of it.
 *
 *   lift per unit span   l(y) = (L/b)·c_s(y)/c̄                  (L the whole wing's lift)
 *   torque per unit span t(y) = q·c(y)²·cm_ref(cl(y))            (about the box's reference axis, nose up +)
 *   V(y) = ∫_y^{b/2} l ds,   M(y) = ∫_y^{b/2} l(s)·(s − y) ds,   T(y) = ∫_y^{b/2} t ds
 *
 * The section's moment about the axis is linear in its lift coefficient, cm_ref = cm0 + k·cl, taken from
 * two pressure distributions (thin-section form: normal force only). The integrals run on a fixed grid
 * (SPAN_STEPS intervals) by the trapezoid rule: the elliptic term's square root at the tip costs
 * accuracy of order h^1.5, below 1e-4 of the root values here (checked in the tests against the closed
 * forms for a rectangular wing).
 */

export const SPAN_STEPS = 2_000;

/** cm about x/c = xRef (nose up +) of a distribution, from its normal force alone: −∫(Cp_l − Cp_u)(x − xRef) dx. */
export function momentCoefficientAbout(dist: Pick<PressureDistribution, 'upper' | 'lower'>, xRef: number): number {
  const part = (samples: { xc: number; cp: number }[], sign: number) => {
    let m = 0;
    for (let i = 1; i < samples.length; i++) {
      const a = samples[i - 1];
      const b = samples[i];
      const dx = b.xc - a.xc;
      // Upper-surface pressure pushes down (−), lower pushes up (+); moment arm x − xRef, nose-up positive.
      m += sign * dx * 0.5 * (a.cp * (a.xc - xRef) + b.cp * (b.xc - xRef));
    }
    return m;
  };
  return part(dist.upper, 1) + part(dist.lower, -1);
}

/** A section's moment about the axis as a function of its lift coefficient. */
export interface SectionMoment {
  /** cm at zero lift */
  cm0: number;
  /** d(cm)/d(cl) about the axis: (x_ac − x_ref) with the sign of a nose-up moment from lift ahead of the axis */
  perCl: number;
}

export interface SpanwiseCondition {
  /** lift of the whole wing (both halves), lb */
  wingLiftLb: number;
  /** the wing's lift coefficient */
  wingCl: number;
  qPsi: number;
}

export interface StationLoads {
  yIn: number;
  shearLb: number;
  bendingInLb: number;
  /** nose-up positive */
  torqueInLb: number;
}

/**
 * V, M and T at each station of `stationsIn` (distances from the centre line, within the half-span) for
 * one condition. `loadRatio(η)` and `clRatio(η)` are Schrenk's (schrenk.ts).
 */
export function spanwiseLoads(
  planform: Planform,
  grading: { loadRatio: (eta: number) => number; clRatio: (eta: number) => number },
  moment: SectionMoment,
  condition: SpanwiseCondition,
  stationsIn: number[],
): StationLoads[] {
  const half = planform.spanIn / 2;
  const h = half / SPAN_STEPS;
  const perSpan = condition.wingLiftLb / planform.spanIn;
  const lift = new Float64Array(SPAN_STEPS + 1);
  const torque = new Float64Array(SPAN_STEPS + 1);
  for (let i = 0; i <= SPAN_STEPS; i++) {
    const eta = i / SPAN_STEPS;
    const c = chordAt(planform, eta);
    lift[i] = perSpan * grading.loadRatio(eta);
    const cl = condition.wingCl * grading.clRatio(eta);
    torque[i] = condition.qPsi * c * c * (moment.cm0 + moment.perCl * cl);
  }
  // Cumulative integrals from the tip inward: A0 = ∫ l, A1 = ∫ l·s, TT = ∫ t.
  const a0 = new Float64Array(SPAN_STEPS + 1);
  const a1 = new Float64Array(SPAN_STEPS + 1);
  const tt = new Float64Array(SPAN_STEPS + 1);
  for (let i = SPAN_STEPS - 1; i >= 0; i--) {
    const s0 = i * h;
    const s1 = s0 + h;
    a0[i] = a0[i + 1] + 0.5 * h * (lift[i] + lift[i + 1]);
    a1[i] = a1[i + 1] + 0.5 * h * (lift[i] * s0 + lift[i + 1] * s1);
    tt[i] = tt[i + 1] + 0.5 * h * (torque[i] + torque[i + 1]);
  }
  const at = (arr: Float64Array, y: number) => {
    const u = Math.min(SPAN_STEPS, Math.max(0, y / h));
    const i = Math.min(SPAN_STEPS - 1, Math.floor(u));
    const f = u - i;
    return arr[i] + f * (arr[i + 1] - arr[i]);
  };
  return stationsIn.map((y) => {
    const shearLb = at(a0, y);
    return { yIn: y, shearLb, bendingInLb: at(a1, y) - y * shearLb, torqueInLb: at(tt, y) };
  });
}
