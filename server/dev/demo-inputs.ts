/**
 * The demo's study inputs and coupon tests, data only: the demo loader (seed.ts) stores them, the
 * engineering bench runs them and the tests study them, so all three read the one copy here.
 */
import type { CouponOutcome, RibStudyInputValues, WingStudyInputValues } from '../../db/contracts';
import type { CouponTest } from '../../lib/engineering-results';

/**
 * The demo ribs' sheet and rivets: 0.025 in 6061-T6, MS20470AD4 (1/8 in) rivets in #30 holes (0.1285 in,
 * the number-drill table) 0.25 in (2D) from the edge.
 */
export const DEMO_RIB_STOCK = {
  material: '6061-T6',
  gaugeIn: 0.025,
  rivetSpec: 'MS20470AD4',
  drillSize: '#30',
  drillDiameterIn: 0.1285,
  edgeDistanceIn: 0.25,
};

/** The demo's coupon tests as its supplier records them: gauge (in), load (lb), what the coupon showed, a note. */
export const DEMO_COUPONS: [number, number, CouponOutcome, string][] = [
  [0.016, 20, 'excessive_deformation', 'hole pulled oval, flange dished around the head'],
  [0.016, 30, 'excessive_deformation', 'rivet head pulled into the flange'],
  [0.02, 13.5, 'no_deformation', 'no set after unloading'],
  [0.02, 20, 'slight_deformation', 'faint dimple round the head'],
  [0.02, 30, 'slight_deformation', 'dimple, hole round, rivet tight'],
];

/** The demo's coupons as the engine reads them (6061-T6 flanges, pulled 1/8 in rivets): benches and tests study with them. */
export const DEMO_ENGINE_COUPONS: CouponTest[] = DEMO_COUPONS.map(([gaugeIn, loadLb, outcome]) => ({
  material: '6061-T6',
  gaugeIn,
  rivetSpec: 'PULLED-4',
  loadLb,
  outcome,
}));

/** The demo kit's figures: its kit record and its studies' kit are the same aircraft. */
export const DEMO_KIT = {
  weightLb: 1320,
  wingAreaSqFt: 120,
  meanChordIn: 54,
  stallSpeedKeas: 47,
  cruiseSpeedKeas: 118,
  category: 'utility' as const,
};

/**
 * The demo kit's rib study: its NACA 2412 rib, 54 in chord, ribs 14.5 in apart, a flange line along each
 * surface from 2 % to 85 % of the chord, six gauges and three rivets, pitch up to 8 diameters in 1/8 in
 * steps, at most four zones a line.
 */
export const DEMO_STUDY_INPUTS: RibStudyInputValues = {
  kit: DEMO_KIT,
  airfoil: { kind: 'naca', designation: '2412' },
  rib: { chordIn: 54, spacingIn: 14.5 },
  lines: [
    { name: 'Upper flange', surface: 'upper', startXc: 0.02, endXc: 0.85 },
    { name: 'Lower flange', surface: 'lower', startXc: 0.02, endXc: 0.85 },
  ],
  material: '6061-T6',
  gaugeCandidates: [0.016, 0.02, 0.025, 0.032, 0.04, 0.05],
  rivetCandidates: ['PULLED-4', 'MS20470AD3', 'MS20470AD4'],
  maxPitchDiameters: 8,
  pitchIncrementIn: 0.125,
  maxZones: 4,
};

/**
 * The demo kit's whole wing: a rectangle of its 120 ft² (320 in × 54 in), ten ribs from root to tip
 * (W-104 and W-105 are the demo's rib parts), the rib study's flange lines, spars at 15 % and 70 % of the
 * chord. Ribs 14.5 in apart: the rib study's spacing.
 */
export const DEMO_WING_INPUTS: WingStudyInputValues = {
  kit: DEMO_STUDY_INPUTS.kit,
  airfoil: DEMO_STUDY_INPUTS.airfoil,
  planform: { kind: 'rectangle', spanIn: 320, chordIn: 54 },
  tail: { armIn: 170 },
  ribs: Array.from({ length: 10 }, (_, i) => ({ name: `W-${101 + i}`, stationIn: 24 + i * 14.5 })),
  rib: { lines: DEMO_STUDY_INPUTS.lines },
  spars: { frontXc: 0.15, rearXc: 0.7, capAreaSqIn: 1 },
  skin: { gaugeCandidates: [0.016, 0.02, 0.025, 0.032], rivetCandidates: ['MS20426AD3', 'MS20426AD4'] },
  material: DEMO_STUDY_INPUTS.material,
  gaugeCandidates: DEMO_STUDY_INPUTS.gaugeCandidates,
  rivetCandidates: DEMO_STUDY_INPUTS.rivetCandidates,
  maxPitchDiameters: 8,
  pitchIncrementIn: 0.125,
  maxZones: 4,
};
