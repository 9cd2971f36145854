import { requireWingBound } from './bounds';
import { EngineeringInputError } from './errors';
import { johnsonElasticFor, johnsonReduced } from './plate-buckling';
import { envelope, marginOfSafety } from './result';
import { requireOneOf } from './validate';
import type { EngineeringResult, RivetSpec } from '../../lib/engineering-results';

/**
 * Inter-rivet buckling of compression skin: the strip of sheet between two rivets of a line buckles
 * outward as a short column (Bruhn, Analysis and Design of Flight Vehicle Structures, ch. C7):
 *
 *   σ_ir = 0.9·c·E·(t/p)²
 *
 * with t the skin gauge, p the rivet pitch, E the compressive modulus and c the end fixity the rivet
 * heads give the strip. From memory, verify against Bruhn C7 (or the NACA reports on inter-rivet
 * buckling) before relying on them:
 *
 *   flat protruding head 4.0 · spot weld 3.5 · brazier head 3.0 · countersunk head 1.0
 *
 * Our assumption, not the source's: the universal head (MS20470) and a pulled rivet's protruding head
 * are taken as the brazier head (3.0), the nearest head in the list and not the stiffest.
 *
 * Plasticity: σ_ir above the proportional limit is reduced by Johnson's parabola, tangent to the
 * elastic curve at half the compressive yield: σ = F_cy·(1 − F_cy/(4·σ_elastic)) there, never above F_cy
 * (plate-buckling.ts uses the same). The pitch limit keeps σ_ir ≥ the applied compression; it is solved
 * in closed form through the parabola's inverse, no iteration.
 */

export const RIVET_HEADS = ['flat', 'spotweld', 'brazier', 'universal', 'protruding-pulled', 'countersunk'] as const;
export type RivetHead = (typeof RIVET_HEADS)[number];

export const END_FIXITY: Record<RivetHead, { c: number; source: string }> = {
  flat: { c: 4.0, source: 'Bruhn C7, from memory: verify' },
  spotweld: { c: 3.5, source: 'Bruhn C7, from memory: verify' },
  brazier: { c: 3.0, source: 'Bruhn C7, from memory: verify' },
  universal: { c: 3.0, source: 'taken as the brazier head (our assumption)' },
  'protruding-pulled': { c: 3.0, source: 'taken as the brazier head (our assumption)' },
  countersunk: { c: 1.0, source: 'Bruhn C7, from memory: verify' },
};

export const INTER_RIVET_RULE =
  'inter-rivet buckling σ_ir = 0.9·c·E·(t/p)², c the end fixity of the rivet head (Bruhn C7)';

/** The head a catalogue rivet's end fixity is read for. */
export function rivetHeadOf(spec: RivetSpec): RivetHead {
  if (spec.countersunk) return 'countersunk';
  return spec.kind === 'pulled' ? 'protruding-pulled' : 'universal';
}

/** c for a head, or the supplier's own value (bounded). */
export function endFixity(head: RivetHead | undefined, given?: number): { c: number; source: string } {
  if (given !== undefined) return { c: requireWingBound(given, 'rivetLine.endFixity'), source: 'as given' };
  const h = requireOneOf(head, 'rivetLine.head', RIVET_HEADS);
  return END_FIXITY[h];
}

/** Elastic σ_ir = 0.9·c·E·(t/p)², psi. */
export function interRivetElasticStressPsi(
  c: number,
  elasticModulusPsi: number,
  thicknessIn: number,
  pitchIn: number,
): number {
  requireWingBound(c, 'rivetLine.endFixity');
  const e = requireWingBound(elasticModulusPsi, 'panel.elasticModulusPsi');
  const t = requireWingBound(thicknessIn, 'panel.thicknessIn');
  const p = requireWingBound(pitchIn, 'rivetLine.pitchIn');
  return 0.9 * c * e * (t / p) ** 2;
}

export interface InterRivetInput {
  /** the rivet head (its end fixity from the table above), or `endFixity` directly */
  head?: RivetHead;
  endFixity?: number;
  elasticModulusPsi: number;
  compressiveYieldPsi: number;
  thicknessIn: number;
  /** applied limit compression in the skin, psi */
  appliedStressPsi: number;
  /** the pitch to check, in; the limit is given whether or not a pitch is */
  pitchIn?: number;
}

export interface InterRivetResult extends EngineeringResult<InterRivetInput> {
  endFixity: { c: number; source: string };
  /** at the given pitch (null without one) */
  atPitch: {
    pitchIn: number;
    elasticPsi: number;
    criticalPsi: number;
    plasticityReduced: boolean;
    marginOfSafety: number | null;
  } | null;
  /**
   * The largest pitch whose σ_ir is at least the applied compression; null when nothing is applied (no
   * limit) or when the compression reaches the yield (no pitch will do: `reason` says which).
   */
  maxPitchIn: number | null;
  reason: string | null;
}

/** The pitch limit p ≤ t·√(0.9·c·E/σ_e), σ_e the elastic stress Johnson's parabola needs to reach f. */
export function interRivetPitchLimitIn(
  c: number,
  elasticModulusPsi: number,
  compressiveYieldPsi: number,
  thicknessIn: number,
  appliedStressPsi: number,
): number | null {
  requireWingBound(c, 'rivetLine.endFixity');
  const e = requireWingBound(elasticModulusPsi, 'panel.elasticModulusPsi');
  const fcy = requireWingBound(compressiveYieldPsi, 'panel.compressiveYieldPsi');
  const t = requireWingBound(thicknessIn, 'panel.thicknessIn');
  const f = requireWingBound(appliedStressPsi, 'panel.appliedStressPsi');
  if (f === 0) return null;
  const needed = johnsonElasticFor(f, fcy);
  if (!Number.isFinite(needed)) return null;
  return t * Math.sqrt((0.9 * c * e) / needed);
}

export function interRivetBuckling(input: InterRivetInput): InterRivetResult {
  if (input === null || typeof input !== 'object')
    throw new EngineeringInputError('rivetLine', 'the rivet line data are missing');
  const fixity = endFixity(input.head, input.endFixity);
  const { c } = fixity;
  const fcy = requireWingBound(input.compressiveYieldPsi, 'panel.compressiveYieldPsi');
  const f = requireWingBound(input.appliedStressPsi, 'panel.appliedStressPsi');
  const rules = [
    INTER_RIVET_RULE,
    `end fixity c = ${c} (${fixity.source})`,
    "plasticity: Johnson's parabola above half the compressive yield, σ = F_cy(1 − F_cy/(4σ_elastic))",
  ];
  const warnings: string[] = [];
  let atPitch: InterRivetResult['atPitch'] = null;
  if (input.pitchIn !== undefined) {
    const elasticPsi = interRivetElasticStressPsi(c, input.elasticModulusPsi, input.thicknessIn, input.pitchIn);
    const criticalPsi = johnsonReduced(elasticPsi, fcy);
    atPitch = {
      pitchIn: input.pitchIn,
      elasticPsi,
      criticalPsi,
      plasticityReduced: criticalPsi < elasticPsi,
      marginOfSafety: marginOfSafety(criticalPsi, f),
    };
    if (f > criticalPsi)
      warnings.push(
        `at ${input.pitchIn} in pitch the skin buckles between rivets at ${criticalPsi.toFixed(0)} psi, below the applied ${f.toFixed(0)} psi`,
      );
  }
  const maxPitchIn = interRivetPitchLimitIn(c, input.elasticModulusPsi, fcy, input.thicknessIn, f);
  let reason: string | null = null;
  if (maxPitchIn === null) {
    reason =
      f === 0
        ? 'no compression applied: inter-rivet buckling sets no pitch limit'
        : `the applied ${f.toFixed(0)} psi reaches the compressive yield ${fcy.toFixed(0)} psi: no pitch keeps the skin from yielding; a thicker skin is needed`;
    if (f > 0) warnings.push(reason);
  }
  return { ...envelope(input, rules, warnings), endFixity: fixity, atPitch, maxPitchIn, reason };
}
