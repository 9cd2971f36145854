import { ASPECT_RATIO_RANGE, requireCount, requireWingBound, WING_BOUNDS } from './bounds';
import { EngineeringInputError } from './errors';
import { envelope } from './result';
import { requireArray } from './validate';
import type { EngineeringResult, Planform, PlanformInput } from '../../lib/engineering-results';

/**
 * Spanwise lift by Schrenk's approximation (O. Schrenk, "A simple approximation method for obtaining the
 * spanwise lift distribution", NACA TM 948, 1940): the lift per unit span of an untwisted wing is taken
 * proportional to the mean of its own chord and the chord of an elliptic wing of the same span and area,
 *
 *   c_s(η) = ½·(c(η) + c_e(η)),   c_e(η) = (4S/(π·b))·√(1 − η²),   η = 2y/b,
 *
 * so the section works at local cl / CL = c_s / c = ½·(c/c̄ + (4/π)·√(1 − η²)) / (c/c̄), with c̄ = S/b
 * the mean geometric chord. A rectangular wing gives ½·(1 + (4/π)·√(1 − η²)): 1.13662 at the root.
 *
 * Assumptions, carried in every result: a straight (unswept), untwisted wing with no flaps deflected;
 * η is measured from the aircraft's centre line (the fuselage carries its share of the lift as if it
 * were wing); the approximation is for the wing's additional (angle-dependent) lift, which is the lift
 * of a wing without twist.
 */

export interface SchrenkStation {
  eta: number;
  /** distance from the centre line, in */
  yIn: number;
  chordIn: number;
  /** chord of the elliptic wing of the same span and area */
  ellipticChordIn: number;
  /** ½(c + c_e): the lift per unit span is CL·q·c_s */
  schrenkChordIn: number;
  /** local section cl / wing CL = c_s / c */
  clRatio: number;
  /** lift per unit span / mean lift per unit span (L/b) = c_s / c̄ */
  loadRatio: number;
}

export interface SchrenkResult extends EngineeringResult<{ planform: PlanformInput; etas: number[] }> {
  planform: Planform;
  stations: SchrenkStation[];
}

export const SCHRENK_RULE =
  "spanwise lift by Schrenk's approximation (NACA TM 948): lift per unit span ∝ ½(c + c_elliptic), c_elliptic = 4S/(πb)·√(1 − η²); section cl/CL = ½(c/c̄ + 4/π·√(1 − η²))/(c/c̄)";
export const SCHRENK_ASSUMPTIONS =
  'Schrenk: straight, untwisted wing, flaps retracted; η = 2y/b from the centre line, the fuselage counted as wing';

/** Most span stations one distribution may ask for (a wing has far fewer ribs). */
export const MAX_SCHRENK_STATIONS = 200;

/** Checks a planform and gives its derived quantities; refusals name `planform.…`. */
export function planformGeometry(input: PlanformInput): Planform {
  if (input === null || typeof input !== 'object')
    throw new EngineeringInputError('planform', 'the planform is missing');
  const spanIn = requireWingBound(input.spanIn, 'planform.spanIn');
  let rootChordIn: number;
  let tipChordIn: number;
  if (input.kind === 'rectangle') {
    rootChordIn = tipChordIn = requireWingBound(input.chordIn, 'planform.chordIn');
  } else if (input.kind === 'tapered') {
    rootChordIn = requireWingBound(input.rootChordIn, 'planform.rootChordIn');
    tipChordIn = requireWingBound(input.tipChordIn, 'planform.tipChordIn');
    const taper = tipChordIn / rootChordIn;
    const b = WING_BOUNDS['planform.taperRatio'];
    if (taper < b.min || taper > b.max) {
      throw new EngineeringInputError(
        'planform.tipChordIn',
        `a ${tipChordIn} in tip on a ${rootChordIn} in root is a taper ratio of ${taper.toPrecision(3)}: this tool takes ${b.min} to ${b.max} (no pointed tips, no inverse taper)`,
      );
    }
  } else {
    throw new EngineeringInputError('planform.kind', 'must be "rectangle" or "tapered"');
  }
  const meanChordIn = (rootChordIn + tipChordIn) / 2;
  const areaSqIn = spanIn * meanChordIn;
  const aspectRatio = spanIn / meanChordIn;
  if (aspectRatio < ASPECT_RATIO_RANGE.min || aspectRatio > ASPECT_RATIO_RANGE.max) {
    throw new EngineeringInputError(
      'planform.spanIn',
      `a span of ${spanIn} in on a ${meanChordIn} in mean chord is an aspect ratio of ${aspectRatio.toPrecision(3)}: a wing has ${ASPECT_RATIO_RANGE.min} to ${ASPECT_RATIO_RANGE.max}`,
    );
  }
  return { spanIn, rootChordIn, tipChordIn, meanChordIn, areaSqIn, aspectRatio, taperRatio: tipChordIn / rootChordIn };
}

/** η = 2y/b of a station y inches from the centre line; refused (naming `field`) off the half-span. */
export function stationEta(planform: Planform, yIn: number, field = 'yIn'): number {
  const eta = (2 * yIn) / planform.spanIn;
  if (!Number.isFinite(eta) || eta < 0 || eta > 1) {
    throw new EngineeringInputError(
      field,
      `a station ${yIn} in from the centre line is off the ${planform.spanIn / 2} in half-span`,
    );
  }
  return eta;
}

/** Chord at η of a straight-tapered (or rectangular) planform, in. */
export function chordAt(planform: Planform, eta: number): number {
  return planform.rootChordIn + (planform.tipChordIn - planform.rootChordIn) * eta;
}

/** Schrenk's station of a checked planform (no checks: the wing study's integration calls it thousands of times). */
export function schrenkStationOf(p: Planform, eta: number): SchrenkStation {
  const chordIn = chordAt(p, eta);
  const ellipticChordIn = ((4 * p.meanChordIn) / Math.PI) * Math.sqrt(Math.max(0, 1 - eta * eta));
  const schrenkChordIn = (chordIn + ellipticChordIn) / 2;
  return {
    eta,
    yIn: (eta * p.spanIn) / 2,
    chordIn,
    ellipticChordIn,
    schrenkChordIn,
    clRatio: schrenkChordIn / chordIn,
    loadRatio: schrenkChordIn / p.meanChordIn,
  };
}

/** Schrenk's section cl / wing CL at span station η (0 root, 1 tip). */
export function schrenkLiftRatio(planform: PlanformInput, eta: number, field = 'eta'): number {
  const p = planformGeometry(planform);
  return schrenkStationOf(p, requireWingBound(eta, 'eta', field)).clRatio;
}

/** The whole station (chords, cl/CL, load grading) at η. */
export function schrenkStation(planform: PlanformInput, eta: number, field = 'eta'): SchrenkStation {
  const p = planformGeometry(planform);
  return schrenkStationOf(p, requireWingBound(eta, 'eta', field));
}

/** Schrenk's distribution at a list of span stations (a wing's ribs), with the rule and its assumptions. */
export function schrenkDistribution(planform: PlanformInput, etas: number[]): SchrenkResult {
  const p = planformGeometry(planform);
  const list = requireArray<number>(etas, 'etas', 1, 'list of span stations');
  requireCount(list, 'etas', {
    what: 'the number of span stations',
    min: 1,
    max: MAX_SCHRENK_STATIONS,
    unit: 'stations',
    integer: true,
  });
  const stations = list.map((eta, i) => schrenkStationOf(p, requireWingBound(eta, 'eta', `etas[${i}]`)));
  const warnings: string[] = [];
  if (stations.some((s) => s.eta > 0.95))
    warnings.push(
      'Schrenk overstates the lift close to the tip, where the real lift falls to zero: stations beyond η = 0.95 are approximate',
    );
  return { ...envelope({ planform, etas }, [SCHRENK_RULE, SCHRENK_ASSUMPTIONS], warnings), planform: p, stations };
}
