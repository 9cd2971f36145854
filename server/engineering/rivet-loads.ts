import { packed, room } from './arrays';
import { EngineeringInputError } from './errors';
import { interpolateCp } from './panel-method';
import { requireFinite, requireNonNegative, requirePositive } from './validate';
import type { CpSample } from '../../lib/engineering-results';

/**
 * Loads on a rib's fastener line (step 5 of the chain). Where the outside surface sees suction the
 * skin pulls on the rib: per rivet T = max(0, Cp,int − Cp)·q·s·b, with s the pitch and b the tributary
 * width (half the bay each side of the rib; the rib spacing for an inner rib). Pressures in psi, lengths
 * in inches, loads in lb. Ultimate = 1.5 × limit (14 CFR 23.303).
 */
export const ULTIMATE_FACTOR = 1.5;

/** Pull on the flange per inch of pitch, lb/in: net outward pressure times the tributary width. */
export function suctionIntensityLbPerIn(
  cp: number,
  internalCp: number,
  qPsi: number,
  tributaryWidthIn: number,
): number {
  return Math.max(0, internalCp - cp) * qPsi * tributaryWidthIn;
}

export function rivetTensionLb(p: {
  cp: number;
  internalCp?: number;
  qPsi: number;
  pitchIn: number;
  tributaryWidthIn: number;
}): number {
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
  if (!(cellAreaSqIn > 0))
    throw new EngineeringInputError('cellAreaSqIn', 'the enclosed cell area must be greater than zero');
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
export type EnvelopeCondition = { id: string; qPsi: number } & (
  { cpAt: (xc: number) => number } | { cpSamples: CpSample[] }
);

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
  index: number,
  qPsi: number,
  internalCp: number,
  tributaryWidthIn: number,
  best: number[],
  governing: number[],
): void {
  const first = samples[0];
  const last = samples[samples.length - 1];
  // The samples' x/c and Cp as arrays of numbers: the walk reads them some 600 times a line.
  const m = samples.length;
  const sx = room(m);
  const sc = room(m);
  for (let k = 0; k < m; k++) {
    sx[k] = samples[k].xc;
    sc[k] = samples[k].cp;
  }
  let from = 0;
  for (let k = 1; k < m; k++) if (!(sx[k] >= sx[k - 1])) from = k;
  let beyond = -Infinity;
  if (from > 0) for (let k = 0; k <= from; k++) beyond = Math.max(beyond, sx[k]);
  let lo = from;
  for (let i = 0; i < xcs.length; i++) {
    const xc = xcs[i];
    let cp: number;
    if (xc <= first.xc) cp = first.cp;
    else if (xc >= last.xc) cp = last.cp;
    else if (!(xc > beyond)) cp = interpolateCp(samples, xc);
    else {
      // first.xc < xc < last.xc and xc beyond the samples before `from`: both walks stop inside the list
      while (sx[lo] > xc) lo--;
      while (sx[lo + 1] <= xc) lo++;
      const px = sx[lo];
      const qx = sx[lo + 1];
      const pc = sc[lo];
      const qc = sc[lo + 1];
      cp = qx === px ? Math.min(pc, qc) : pc + ((qc - pc) * (xc - px)) / (qx - px);
    }
    const w = Math.max(0, internalCp - cp) * qPsi * tributaryWidthIn;
    if (w > best[i]) {
      best[i] = w;
      governing[i] = index;
    }
  }
}

/** Largest pull over all conditions at each station. */
export function loadEnvelope(
  xcs: number[],
  conditions: EnvelopeCondition[],
  internalCp: number,
  tributaryWidthIn: number,
): EnvelopeStation[] {
  const env = envelopeColumns(xcs, conditions, internalCp, tributaryWidthIn);
  const out: EnvelopeStation[] = new Array(xcs.length);
  for (let i = 0; i < xcs.length; i++)
    out[i] = { xc: xcs[i], limitLbPerIn: env.limitLbPerIn[i], governing: env.governingAt(i) };
  return out;
}

/** `loadEnvelope` as columns: the largest pull at each station, and which condition gives it (by index). */
export class EnvelopeColumns {
  constructor(
    readonly limitLbPerIn: number[],
    /** index of the governing condition, −1 where no condition pulls */
    private readonly governing: number[],
    private readonly ids: string[],
  ) {}

  /** id of the condition that gives the largest pull at station i, null where no condition pulls */
  governingAt(i: number): string | null {
    const k = this.governing[i];
    return k < 0 ? null : this.ids[k];
  }
}

/** `loadEnvelope` as columns, one entry per station (the rib study's loads are made from them). */
export function envelopeColumns(
  xcs: number[],
  conditions: EnvelopeCondition[],
  internalCp: number,
  tributaryWidthIn: number,
): EnvelopeColumns {
  const n = xcs.length;
  const best = packed(n, 0);
  // the governing condition by index (−1 for none): numbers, made and filled far faster than ids
  const governing = packed(n, -1);
  // One condition at a time along the line (rather than every condition at each station): each Cp
  // look-up then follows the last one along the same samples, which is what the caches are good at. The
  // conditions still come in their order at every station, so the first of equal pulls governs.
  for (let index = 0; index < conditions.length; index++) {
    const c = conditions[index];
    if ('cpSamples' in c) {
      envelopeOfSamples(xcs, c.cpSamples, index, c.qPsi, internalCp, tributaryWidthIn, best, governing);
      continue;
    }
    const cpAt = c.cpAt;
    for (let i = 0; i < n; i++) {
      const w = suctionIntensityLbPerIn(cpAt(xcs[i]), internalCp, c.qPsi, tributaryWidthIn);
      if (w > best[i]) {
        best[i] = w;
        governing[i] = index;
      }
    }
  }
  return new EnvelopeColumns(
    best,
    governing,
    conditions.map((c) => c.id),
  );
}
