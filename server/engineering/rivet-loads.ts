import { EngineeringInputError } from './errors';
import { interpolateCp, type CpSample } from './panel-method';
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

/**
 * A flight condition's pressure along the surface: as a function of x/c, or as the samples it is linear
 * between (x/c from the leading edge to the trailing edge, as `interpolateCp` reads them), which the
 * envelope reads in step with the stations instead of searching them afresh for each.
 */
export type EnvelopeCondition = { id: string; qPsi: number } & ({ cpAt: (xc: number) => number } | { cpSamples: CpSample[] });

/**
 * `interpolateCp(samples, ·)` for queries that mostly follow on from the last: the bracketing samples
 * are walked to from the last ones. Samples in order of x/c have one bracket for every x/c, so this is
 * exactly the bisection's answer; samples out of order are left to the bisection itself.
 */
function steppedCp(samples: CpSample[]): (xc: number) => number {
  for (let k = 1; k < samples.length; k++) if (!(samples[k].xc >= samples[k - 1].xc)) return (xc) => interpolateCp(samples, xc);
  let lo = 0;
  return (xc) => {
    if (xc <= samples[0].xc) return samples[0].cp;
    const last = samples[samples.length - 1];
    if (xc >= last.xc) return last.cp;
    // samples[0].xc < xc < last.xc: both walks stop inside the list
    while (samples[lo].xc > xc) lo--;
    while (samples[lo + 1].xc <= xc) lo++;
    const p = samples[lo];
    const q = samples[lo + 1];
    if (q.xc === p.xc) return Math.min(p.cp, q.cp);
    return p.cp + ((q.cp - p.cp) * (xc - p.xc)) / (q.xc - p.xc);
  };
}

/** Largest pull over all conditions at each station. */
export function loadEnvelope(xcs: number[], conditions: EnvelopeCondition[], internalCp: number, tributaryWidthIn: number): EnvelopeStation[] {
  const n = xcs.length;
  const best = new Float64Array(n);
  const governing: (string | null)[] = new Array(n).fill(null);
  // One condition at a time along the line (rather than every condition at each station): each Cp
  // look-up then follows the last one along the same samples, which is what the caches are good at. The
  // conditions still come in their order at every station, so the first of equal pulls governs.
  for (const c of conditions) {
    const cpAt = 'cpSamples' in c ? steppedCp(c.cpSamples) : c.cpAt;
    for (let i = 0; i < n; i++) {
      const w = suctionIntensityLbPerIn(cpAt(xcs[i]), internalCp, c.qPsi, tributaryWidthIn);
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
