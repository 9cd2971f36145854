import { EngineeringInputError } from './errors';
import { requireFinite, requireNonNegative, requirePositive } from './validate';

/**
 * Loads on a rib's fastener line (step 5 of the chain). Where the outside surface sees suction the
 * skin pulls on the rib: per rivet T = max(0, Cp,int − Cp)·q·s·b, with s the pitch and b the tributary
 * width (half the bay each side of the rib; the rib spacing for an inner rib). Pressures in psi, lengths
 * in inches, loads in lb. Ultimate = 1.5 × limit (14 CFR 23.303).
 */
export const ULTIMATE_FACTOR = 1.5;

/** Pull on the flange per inch of pitch, lb/in: net outward pressure times the tributary width. */
export function suctionIntensityLbPerIn(cp: number, internalCp: number, qPsi: number, tributaryWidthIn: number): number {
  return Math.max(0, internalCp - cp) * qPsi * tributaryWidthIn;
}

export function rivetTensionLb(p: { cp: number; internalCp?: number; qPsi: number; pitchIn: number; tributaryWidthIn: number }): number {
  requireFinite(p.cp, 'cp');
  requireNonNegative(p.qPsi, 'qPsi', 'the dynamic pressure');
  requirePositive(p.pitchIn, 'pitchIn', 'the pitch');
  requirePositive(p.tributaryWidthIn, 'tributaryWidthIn', 'the tributary width');
  return suctionIntensityLbPerIn(p.cp, p.internalCp ?? 0, p.qPsi, p.tributaryWidthIn) * p.pitchIn;
}

/** The suction (psi) that puts a given limit load on a rivet at this pitch and tributary width. */
export function suctionForRivetLoadPsi(loadLb: number, pitchIn: number, tributaryWidthIn: number): number {
  requirePositive(pitchIn, 'pitchIn', 'the pitch');
  requirePositive(tributaryWidthIn, 'tributaryWidthIn', 'the tributary width');
  return loadLb / (pitchIn * tributaryWidthIn);
}

/** Bredt–Batho: shear flow of a closed single cell under torque, q = T/(2A), lb/in. */
export function shearFlowLbPerIn(torqueInLb: number, cellAreaSqIn: number): number {
  if (!(cellAreaSqIn > 0)) throw new EngineeringInputError('cellAreaSqIn', 'the enclosed cell area must be greater than zero');
  return torqueInLb / (2 * cellAreaSqIn);
}

export function rivetShearLb(shearFlowLbPerInch: number, pitchIn: number): number {
  return Math.abs(shearFlowLbPerInch) * pitchIn;
}

export interface EnvelopeStation {
  xc: number;
  limitLbPerIn: number;
  /** id of the condition that gives the largest pull here, null where no condition pulls */
  governing: string | null;
}

/** Largest pull over all conditions at each station. */
export function loadEnvelope(
  xcs: number[],
  conditions: { id: string; qPsi: number; cpAt: (xc: number) => number }[],
  internalCp: number,
  tributaryWidthIn: number,
): EnvelopeStation[] {
  const n = xcs.length;
  const best = new Float64Array(n);
  const governing: (string | null)[] = new Array(n).fill(null);
  // One condition at a time along the line (rather than every condition at each station): each Cp
  // look-up then follows the last one along the same samples, which is what the caches are good at. The
  // conditions still come in their order at every station, so the first of equal pulls governs.
  for (const c of conditions) {
    for (let i = 0; i < n; i++) {
      const w = suctionIntensityLbPerIn(c.cpAt(xcs[i]), internalCp, c.qPsi, tributaryWidthIn);
      if (w > best[i]) {
        best[i] = w;
        governing[i] = c.id;
      }
    }
  }
  const out: EnvelopeStation[] = new Array(n);
  for (let i = 0; i < n; i++) out[i] = { xc: xcs[i], limitLbPerIn: best[i], governing: governing[i] };
  return out;
}
