import { EngineeringInputError } from './errors';
import { requireFinite } from './validate';
import { boundText } from '../../lib/number-text';

/**
 * The physical range of every number a study takes, and the work a study may cost. The engine owns
 * these: it refuses anything outside them whoever calls it, so no caller (the API, a script, a test)
 * can hand it a chord of 1e6 in or a pitch increment of 1e-12 in and make it run for hours. The API's
 * contracts (db/contracts) state the same ranges beside each field, or a narrower one; a test checks
 * that the contracts never let through what the engine would refuse.
 *
 * Keys are paths into the study input; `[]` stands for every item of a list.
 */

export interface Bound {
  /** the value in words, for the refusal ("the rib chord") */
  what: string;
  min: number;
  max: number;
  unit: string;
  integer?: boolean;
  /** the maximum itself is refused (a limit that must be stayed below, such as Mach 0.7) */
  maxExclusive?: boolean;
}

export const STUDY_BOUNDS = {
  // The aircraft: light aircraft kits, 14 CFR 23 (pre-2017) normal, utility and acrobatic categories.
  'kit.weightLb': { what: 'the weight', min: 100, max: 20_000, unit: 'lb' },
  'kit.wingAreaSqFt': { what: 'the wing area', min: 10, max: 2_000, unit: 'ft²' },
  'kit.meanChordIn': { what: 'the mean chord', min: 10, max: 300, unit: 'in' },
  'kit.liftSlopePerRad': { what: 'the wing lift slope', min: 0.5, max: 2 * Math.PI, unit: 'per radian' },
  'kit.stallSpeedKeas': { what: 'the stall speed', min: 20, max: 200, unit: 'KEAS' },
  'kit.cruiseSpeedKeas': { what: 'the cruise speed', min: 30, max: 400, unit: 'KEAS' },
  'kit.diveSpeedKeas': { what: 'the dive speed', min: 40, max: 500, unit: 'KEAS' },
  // ISA troposphere: the density model stops at the tropopause.
  'kit.altitudeFt': { what: 'the altitude', min: 0, max: 36_089, unit: 'ft' },

  'airfoil.points': { what: 'the number of airfoil points', min: 10, max: 2_000, unit: 'points', integer: true },
  // Coordinates may come in any unit (unit chord, mm, in): wide, but finite and far from overflow.
  'airfoil.points[][]': { what: 'an airfoil coordinate', min: -10_000, max: 10_000, unit: '(file units)' },

  // The rib: from a trim-tab rib to the root of a large light aircraft; spacing from a nose-rib bay to a fabric wing's.
  'rib.chordIn': { what: 'the rib chord', min: 4, max: 300, unit: 'in' },
  'rib.spacingIn': { what: 'the rib spacing', min: 2, max: 60, unit: 'in' },
  'rib.internalCp': { what: 'the internal pressure coefficient', min: -3, max: 1, unit: '' },
  'rib.flangeWidthIn': { what: 'the flange width', min: 0.2, max: 4, unit: 'in' },
  'rib.skinGaugeIn': { what: 'the skin gauge', min: 0.008, max: 0.25, unit: 'in' },

  lines: { what: 'the number of fastener lines', min: 1, max: 6, unit: 'lines', integer: true },
  gaugeCandidates: { what: 'the number of gauges', min: 1, max: 10, unit: 'gauges', integer: true },
  'gaugeCandidates[]': { what: 'a gauge', min: 0.008, max: 0.25, unit: 'in' },
  rivetCandidates: { what: 'the number of rivets', min: 1, max: 8, unit: 'rivets', integer: true },
  // 3D is the layout minimum; beyond 24D a line no longer holds the skin to the rib.
  maxPitchDiameters: { what: 'the maximum pitch', min: 3, max: 24, unit: 'diameters' },
  // 0.01 in is finer than anyone lays out a pitch; the work budget may ask for a coarser one.
  pitchIncrementIn: { what: 'the pitch increment', min: 0.01, max: 1, unit: 'in' },
  maxZones: { what: 'the number of zones', min: 1, max: 8, unit: 'zones', integer: true },
  panels: { what: 'the number of panels', min: 40, max: 400, unit: 'panels', integer: true },
  minutesPerHole: { what: 'the minutes per hole', min: 0.1, max: 30, unit: 'min' },

  cpTables: { what: 'the number of Cp tables', min: 1, max: 12, unit: 'tables', integer: true },
  // Sections stall well inside |CL| = 3.
  'cpTables[].cl': { what: 'the lift coefficient of a Cp table', min: -3, max: 3, unit: '' },
  'cpTables[].rows': { what: 'the number of Cp rows', min: 5, max: 500, unit: 'rows', integer: true },

  wingTorqueInLb: { what: 'the wing torque', min: -1e7, max: 1e7, unit: 'in·lb' },
  cellAreaSqIn: { what: 'the cell area', min: 1, max: 100_000, unit: 'in²' },
  coupons: { what: 'the number of coupon tests', min: 0, max: 5_000, unit: 'tests', integer: true },
  'coupons[].gaugeIn': { what: 'the coupon gauge', min: 0.008, max: 0.25, unit: 'in' },
  'coupons[].loadLb': { what: 'the coupon test load', min: 0.1, max: 20_000, unit: 'lb' },
  'coupons[].couponWidthIn': { what: 'the coupon width', min: 0.25, max: 24, unit: 'in' },
} as const satisfies Record<string, Bound>;

export type StudyBoundKey = keyof typeof STUDY_BOUNDS;

/**
 * The physical range of every number the whole-wing pieces take (planform, compressibility, flaps, skin
 * panels, inter-rivet buckling). Keys are field names relative to each function's input, as its refusals
 * name them ("planform.spanIn", "mach", "panel.thicknessIn"); a caller that nests the input (the wing
 * study) places them with `fieldAt`. Kept apart from STUDY_BOUNDS, which is the rib study's input and
 * is checked key by key against its contract.
 */
export const WING_BOUNDS = {
  // Planform: from a small single-seater's wing to a large light twin's; chords as for the rib.
  'planform.spanIn': { what: 'the wing span', min: 60, max: 1_200, unit: 'in' },
  'planform.rootChordIn': { what: 'the root chord', min: 4, max: 300, unit: 'in' },
  'planform.tipChordIn': { what: 'the tip chord', min: 4, max: 300, unit: 'in' },
  'planform.chordIn': { what: 'the chord', min: 4, max: 300, unit: 'in' },
  /** tip chord / root chord: tapered, not pointed (Schrenk's chord ratio grows without bound at a pointed tip), not inverse */
  'planform.taperRatio': { what: 'the taper ratio (tip chord / root chord)', min: 0.1, max: 1, unit: '' },
  /** η = 2y/b, from the root (0) to the tip (1) */
  eta: { what: 'the span station η = 2y/b', min: 0, max: 1, unit: '' },
  /** a rib's distance from the centre line (within the half-span, checked with the planform) */
  'ribs[].stationIn': { what: 'the rib station', min: 0, max: 600, unit: 'in' },
  // The tail and the box of a wing study.
  'tail.armIn': { what: 'the tail arm', min: 24, max: 600, unit: 'in' },
  /** positive down; a tail that lifts at 1 g is a negative number */
  'tail.balancingLoadLb': { what: 'the tail balancing load', min: -5_000, max: 5_000, unit: 'lb' },
  'spars.frontXc': { what: 'the front spar position', min: 0.05, max: 0.5, unit: 'x/c' },
  'spars.rearXc': { what: 'the rear spar position', min: 0.2, max: 0.9, unit: 'x/c' },
  'spars.capAreaSqIn': { what: 'the spar-cap area on one surface', min: 0, max: 20, unit: 'in²' },

  // Compressibility: subsonic and below the transonic range, where neither rule holds.
  mach: { what: 'the Mach number', min: 0, max: 0.7, unit: '', maxExclusive: true },
  /** incompressible pressure coefficient: stagnation is 1; inviscid suction peaks near stall reach −15 or so */
  cp: { what: 'the incompressible pressure coefficient', min: -30, max: 1, unit: '' },
  speedKeas: { what: 'the speed', min: 0, max: 500, unit: 'KEAS' },
  altitudeFt: { what: 'the altitude', min: 0, max: 36_089, unit: 'ft' },

  // Flaps (14 CFR 23.345).
  'flaps.stallSpeedKeas': { what: 'the stall speed with flaps extended', min: 15, max: 200, unit: 'KEAS' },
  'flaps.designSpeedKeas': { what: 'the flap design speed', min: 20, max: 400, unit: 'KEAS' },

  // Skin panels and inter-rivet buckling: light-alloy to steel sheet.
  'panel.elasticModulusPsi': { what: 'the elastic modulus', min: 5e6, max: 3.2e7, unit: 'psi' },
  'panel.poissonRatio': { what: "Poisson's ratio", min: 0.2, max: 0.4, unit: '' },
  'panel.thicknessIn': { what: 'the skin thickness', min: 0.008, max: 0.25, unit: 'in' },
  /** the loaded panel's short side (rib or stringer spacing) */
  'panel.widthIn': { what: 'the panel width', min: 0.5, max: 300, unit: 'in' },
  'panel.appliedStressPsi': { what: 'the applied stress', min: 0, max: 200_000, unit: 'psi' },
  'panel.compressiveYieldPsi': { what: 'the compressive yield strength', min: 5_000, max: 250_000, unit: 'psi' },
  'panel.bucklingCoefficient': { what: 'the buckling coefficient', min: 0.4, max: 20, unit: '' },
  'rivetLine.pitchIn': { what: 'the rivet pitch', min: 0.1, max: 12, unit: 'in' },
  /** end fixity of the sheet between two rivets: 1 (countersunk) to 4 (flat head) */
  'rivetLine.endFixity': { what: 'the end-fixity coefficient', min: 0.25, max: 4, unit: '' },
} as const satisfies Record<string, Bound>;

export type WingBoundKey = keyof typeof WING_BOUNDS;

/** Wing aspect ratio S/c² from the kit's area and mean chord: a wing, not a strip or a plank. */
export const ASPECT_RATIO_RANGE = { min: 2, max: 40 } as const;
/** Wing loading W/S, psf: from a light ultralight-like kit to a heavy twin. */
export const WING_LOADING_RANGE_PSF = { min: 2, max: 80 } as const;

/**
 * The work one study may cost. A study at every range's top end fits; a study whose counts multiply
 * past these is refused before the flow is solved, naming the field that drives it. Measured here
 * (2 cores): the largest study the budget allows runs in a few seconds.
 */
export const STUDY_BUDGET = {
  /** pitches tried per rivet, from 3D up to the maximum pitch in steps of the increment */
  pitchGrid: 500,
  /** load stations over all fastener lines (one every 0.1 in along the surface) */
  stations: 20_000,
  /** stations × pitches: the largest-load windows the schedule looks up */
  gridCells: 2_000_000,
  /** stations × conditions × candidates: the load checks */
  stationChecks: 15_000_000,
  /** holes placed over every candidate (each is a row in the stored result) */
  holes: 50_000,
} as const;

/** Holes one part revision may have: shipping writes each as a row, and a builder ticks each one. */
export const MAX_REVISION_HOLES = 5_000;
/** Holes one fastener line may have, wherever its zones came from. */
export const MAX_LINE_HOLES = MAX_REVISION_HOLES;
/** Neighbouring stretches of a line with different pitch beyond which they are merged (tighter pitch kept) before zoning. */
export const MAX_ZONING_RUNS = 200;

/** Refuses a value outside its bound, naming `field` (the bound's key with list indices filled in). */
export function requireWithin(value: unknown, field: string, bound: Bound): number {
  const v = requireFinite(value, field);
  if (bound.integer && !Number.isInteger(v))
    throw new EngineeringInputError(field, `${bound.what} must be a whole number (got ${v})`);
  // (the unit's text is made only for a refusal: a study checks some hundred values)
  if (bound.maxExclusive) {
    if (v < bound.min || v >= bound.max)
      throw new EngineeringInputError(
        field,
        `${bound.what} must be at least ${boundText(bound.min)} and below ${boundText(bound.max)}${unitText(bound)} (got ${v})`,
      );
    return v;
  }
  if (v < bound.min || v > bound.max) {
    throw new EngineeringInputError(
      field,
      `${bound.what} must be between ${boundText(bound.min)} and ${boundText(bound.max)}${unitText(bound)} (got ${v})`,
    );
  }
  return v;
}

/** Refuses a list whose length is outside its bound. */
export function requireCount(list: unknown[], field: string, bound: Bound): void {
  if (list.length < bound.min || list.length > bound.max) {
    throw new EngineeringInputError(
      field,
      `${bound.what} must be from ${bound.min} to ${bound.max} (got ${list.length})`,
    );
  }
}

export function requireStudyBound(value: unknown, key: StudyBoundKey, field: string = key): number {
  return requireWithin(value, field, STUDY_BOUNDS[key]);
}

/** Refuses a value outside its whole-wing range (WING_BOUNDS), naming `field` (the key unless given). */
export function requireWingBound(value: unknown, key: WingBoundKey, field: string = key): number {
  return requireWithin(value, field, WING_BOUNDS[key]);
}

const unitText = (bound: Bound): string => (bound.unit ? ` ${bound.unit}` : '');
