import { packed } from './arrays';
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
 * One condition's pull at every station into the envelope: `suctionIntensityLbPerIn` of the Cp that
 * `steppedCp` gives, written out in one loop (the same arithmetic), as this runs for every station of
 * every line in every condition. Samples out of order of x/c are only so near the nose (a cambered
 * section's nose reaches a hair ahead of its leading-edge point, where the upper surface starts): past
 * the last of them (`from`) they ascend, and every x/c beyond all the samples up to there (`beyond`) has
 * its bracket there, the one `interpolateCp`'s bisection finds, found instead by walking on. An x/c not
 * beyond them is left to the bisection itself.
 */
function envelopeOfSamples(
  xcs: number[],
  samples: CpSample[],
  id: string,
  qPsi: number,
  internalCp: number,
  tributaryWidthIn: number,
  best: number[],
  governing: (string | null)[],
): void {
  const first = samples[0];
  const last = samples[samples.length - 1];
  let from = 0;
  for (let k = 1; k < samples.length; k++) if (!(samples[k].xc >= samples[k - 1].xc)) from = k;
  let beyond = -Infinity;
  if (from > 0) for (let k = 0; k <= from; k++) beyond = Math.max(beyond, samples[k].xc);
  let lo = from;
  for (let i = 0; i < xcs.length; i++) {
    const xc = xcs[i];
    let cp: number;
    if (xc <= first.xc) cp = first.cp;
    else if (xc >= last.xc) cp = last.cp;
    else if (!(xc > beyond)) cp = interpolateCp(samples, xc);
    else {
      // first.xc < xc < last.xc and xc beyond the samples before `from`: both walks stop inside the list
      while (samples[lo].xc > xc) lo--;
      while (samples[lo + 1].xc <= xc) lo++;
      const p = samples[lo];
      const q = samples[lo + 1];
      cp = q.xc === p.xc ? Math.min(p.cp, q.cp) : p.cp + ((q.cp - p.cp) * (xc - p.xc)) / (q.xc - p.xc);
    }
    const w = Math.max(0, internalCp - cp) * qPsi * tributaryWidthIn;
    if (w > best[i]) {
      best[i] = w;
      governing[i] = id;
    }
  }
}

/** Largest pull over all conditions at each station. */
export function loadEnvelope(xcs: number[], conditions: EnvelopeCondition[], internalCp: number, tributaryWidthIn: number): EnvelopeStation[] {
  const { limitLbPerIn, governing } = envelopeColumns(xcs, conditions, internalCp, tributaryWidthIn);
  const out: EnvelopeStation[] = new Array(xcs.length);
  for (let i = 0; i < xcs.length; i++) out[i] = { xc: xcs[i], limitLbPerIn: limitLbPerIn[i], governing: governing[i] };
  return out;
}

/** `loadEnvelope` as columns, one entry per station (the rib study's loads are made from them). */
export function envelopeColumns(xcs: number[], conditions: EnvelopeCondition[], internalCp: number, tributaryWidthIn: number): { limitLbPerIn: number[]; governing: (string | null)[] } {
  const n = xcs.length;
  const best = packed(n, 0);
  const governing: (string | null)[] = Array.from({ length: n }, () => null);
  // One condition at a time along the line (rather than every condition at each station): each Cp
  // look-up then follows the last one along the same samples, which is what the caches are good at. The
  // conditions still come in their order at every station, so the first of equal pulls governs.
  for (const c of conditions) {
    if ('cpSamples' in c) {
      envelopeOfSamples(xcs, c.cpSamples, c.id, c.qPsi, internalCp, tributaryWidthIn, best, governing);
      continue;
    }
    const cpAt = c.cpAt;
    for (let i = 0; i < n; i++) {
      const w = suctionIntensityLbPerIn(cpAt(xcs[i]), internalCp, c.qPsi, tributaryWidthIn);
      if (w > best[i]) {
        best[i] = w;
        governing[i] = c.id;
      }
    }
  }
  return { limitLbPerIn: best, governing };
}
