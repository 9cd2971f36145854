import type { RivetSpec } from '../../lib/engineering-results';

/**
 * Rivet layout rules of FAA AC 43.13-1B chapter 4 and the AMT Handbook (FAA-H-8083-31): in terms of the
 * rivet's nominal shank diameter D.
 */
export const MIN_EDGE_DIAMETERS = 2;
export const MIN_EDGE_DIAMETERS_COUNTERSUNK = 2.5;
export const MIN_PITCH_DIAMETERS = 3;
export const TRANSVERSE_PITCH_FRACTION = 0.75;
export const LENGTH_ALLOWANCE_DIAMETERS = 1.5;

export interface LayoutRules {
  diameterIn: number;
  minEdgeIn: number;
  minPitchIn: number;
  shopHead: { diameterIn: number; heightIn: number };
}

export function layoutRules(spec: Pick<RivetSpec, 'nominalDiameterIn' | 'countersunk'>): LayoutRules {
  const d = spec.nominalDiameterIn;
  return {
    diameterIn: d,
    minEdgeIn: (spec.countersunk ? MIN_EDGE_DIAMETERS_COUNTERSUNK : MIN_EDGE_DIAMETERS) * d,
    minPitchIn: MIN_PITCH_DIAMETERS * d,
    shopHead: { diameterIn: 1.5 * d, heightIn: 0.5 * d },
  };
}

/** Spacing between staggered rows: 75 % of the pitch. */
export function transversePitchIn(pitchIn: number): number {
  return TRANSVERSE_PITCH_FRACTION * pitchIn;
}

/** Rivet length = grip + 1.5 D (the allowance forms the shop head). */
export function rivetLengthIn(gripIn: number, diameterIn: number): number {
  return gripIn + LENGTH_ALLOWANCE_DIAMETERS * diameterIn;
}

/** Length dash number in sixteenths, rounded up to the next stocked length. */
export function rivetLengthDash(gripIn: number, diameterIn: number): number {
  return Math.ceil(rivetLengthIn(gripIn, diameterIn) * 16 - 1e-9);
}

export const layoutRuleText = (countersunk: boolean): string =>
  `layout: edge distance ≥ ${countersunk ? MIN_EDGE_DIAMETERS_COUNTERSUNK : MIN_EDGE_DIAMETERS}D${countersunk ? ' (countersunk head)' : ''}, pitch ≥ ${MIN_PITCH_DIAMETERS}D (FAA AC 43.13-1B ch. 4)`;

/**
 * Estimated weight of one installed rivet: shank of grip + 1.5D and a dome head of 2D × 0.4D (two thirds
 * of its cylinder). A proxy for the trade study, not a catalogue weight.
 */
export function rivetWeightLb(spec: Pick<RivetSpec, 'nominalDiameterIn' | 'densityLbPerIn3'>, gripIn: number): number {
  const d = spec.nominalDiameterIn;
  const shank = (Math.PI / 4) * d * d * rivetLengthIn(gripIn, d);
  const head = (Math.PI / 4) * (2 * d) ** 2 * 0.4 * d * (2 / 3);
  return (shank + head) * spec.densityLbPerIn3;
}
