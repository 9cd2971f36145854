import { requireWingBound } from './bounds';
import { EngineeringInputError } from './errors';
import { findMaterial } from './materials';
import { envelope, marginOfSafety } from './result';
import { requireOneOf } from './validate';
import type { EngineeringResult, SheetMaterial } from '../../lib/engineering-results';

/**
 * Buckling of a flat skin panel between its supports (ribs, spars, stringers), after Timoshenko & Gere,
 * Theory of Elastic Stability:
 *
 *   F_cr = k·π²·E / (12·(1 − ν²)) · (t/b)²
 *
 * with b the loaded panel's short side and k the buckling coefficient of a long plate (length ≫ b):
 * k = 4.0 in compression with simply supported edges; k_s = 5.35 (simply supported) and 8.98 (clamped)
 * in shear. A shorter panel has a higher k, so the long-plate values are on the safe side.
 *
 * Plasticity: the elastic formula overstates the buckling stress once it is past the proportional limit.
 * The stated reduction (the same as for inter-rivet buckling) is Johnson's parabola, tangent to the
 * elastic curve at half the yield: above F_y/2 the stress is F_y·(1 − F_y/(4·F_e)), never above F_y,
 * with F_y the compressive yield F_cy in compression and F_cy/√3 (von Mises) in shear.
 *
 * A skin in shear above its buckling stress still carries load, as a diagonal tension field (Wagner,
 * Kuhn), but then it pulls the ribs and spar caps together and loads its rivets in tension as well:
 * the result says when the design relies on that, and that those loads are not checked here.
 */

export const PANEL_LOADINGS = ['compression', 'shear'] as const;
export type PanelLoading = (typeof PANEL_LOADINGS)[number];
export const PANEL_EDGES = ['simply-supported', 'clamped'] as const;
export type PanelEdges = (typeof PANEL_EDGES)[number];

/** Long-plate buckling coefficients (Timoshenko & Gere); clamped edges in compression need a k of the supplier's. */
export const PLATE_BUCKLING_COEFFICIENTS = {
  compression: { 'simply-supported': 4.0 },
  shear: { 'simply-supported': 5.35, clamped: 8.98 },
} as const;

export const PLATE_BUCKLING_RULE =
  'panel buckling F_cr = k·π²E/(12(1 − ν²))·(t/b)², long plate: k = 4.0 compression (simply supported), k_s = 5.35 simply supported / 8.98 clamped in shear (Timoshenko & Gere)';
export const JOHNSON_RULE =
  "plasticity: Johnson's parabola above half the yield, F = F_y(1 − F_y/(4F_elastic)), F_y = F_cy in compression, F_cy/√3 in shear";

/** The elastic buckling stress, psi: k·π²E/(12(1 − ν²))·(t/b)². */
export function plateBucklingStressPsi(p: {
  bucklingCoefficient: number;
  elasticModulusPsi: number;
  poissonRatio: number;
  thicknessIn: number;
  widthIn: number;
}): number {
  const k = requireWingBound(p.bucklingCoefficient, 'panel.bucklingCoefficient');
  const e = requireWingBound(p.elasticModulusPsi, 'panel.elasticModulusPsi');
  const nu = requireWingBound(p.poissonRatio, 'panel.poissonRatio');
  const t = requireWingBound(p.thicknessIn, 'panel.thicknessIn');
  const b = requireWingBound(p.widthIn, 'panel.widthIn');
  return ((k * Math.PI * Math.PI * e) / (12 * (1 - nu * nu))) * (t / b) ** 2;
}

/**
 * Johnson's parabola: the elastic stress `elasticPsi` reduced for plasticity against the yield
 * `yieldPsi`: unchanged up to half the yield, F_y(1 − F_y/(4F_e)) above it (tangent there, F_y at F_e → ∞).
 */
export function johnsonReduced(elasticPsi: number, yieldPsi: number): number {
  if (elasticPsi <= yieldPsi / 2) return elasticPsi;
  return yieldPsi * (1 - yieldPsi / (4 * elasticPsi));
}

/** The elastic stress Johnson's parabola needs to reach `stressPsi` (its inverse); Infinity at or above the yield. */
export function johnsonElasticFor(stressPsi: number, yieldPsi: number): number {
  if (stressPsi <= yieldPsi / 2) return stressPsi;
  if (stressPsi >= yieldPsi) return Infinity;
  return (yieldPsi * yieldPsi) / (4 * (yieldPsi - stressPsi));
}

export interface PanelBucklingInput {
  loading: PanelLoading;
  edges: PanelEdges;
  elasticModulusPsi: number;
  poissonRatio: number;
  thicknessIn: number;
  /** the loaded panel's short side (rib or stringer spacing), in */
  widthIn: number;
  /** compressive yield strength F_cy, psi (the plasticity cap) */
  compressiveYieldPsi: number;
  /** applied limit stress (compression or shear), psi */
  appliedStressPsi: number;
  /** the supplier's own k instead of the long-plate value */
  bucklingCoefficient?: number;
}

export interface PanelBucklingResult extends EngineeringResult<PanelBucklingInput> {
  loading: PanelLoading;
  bucklingCoefficient: number;
  elasticCriticalPsi: number;
  /** after the plasticity reduction */
  criticalPsi: number;
  plasticityReduced: boolean;
  appliedStressPsi: number;
  /** F_cr / f − 1; null when nothing is applied */
  marginOfSafety: number | null;
  buckles: boolean;
  /** in shear: whether the panel carries the applied shear only as a post-buckled diagonal tension field */
  diagonalTension: { reliedOn: boolean; note: string };
}

export function panelBuckling(input: PanelBucklingInput): PanelBucklingResult {
  if (input === null || typeof input !== 'object')
    throw new EngineeringInputError('panel', 'the panel data are missing');
  const loading = requireOneOf(input.loading, 'panel.loading', PANEL_LOADINGS);
  const edges = requireOneOf(input.edges, 'panel.edges', PANEL_EDGES);
  const table = PLATE_BUCKLING_COEFFICIENTS[loading] as Partial<Record<PanelEdges, number>>;
  const k = input.bucklingCoefficient ?? table[edges];
  if (k === undefined) {
    throw new EngineeringInputError(
      'panel.bucklingCoefficient',
      `no long-plate coefficient is held for ${edges} edges in ${loading}: give the buckling coefficient k`,
    );
  }
  const fcy = requireWingBound(input.compressiveYieldPsi, 'panel.compressiveYieldPsi');
  const applied = requireWingBound(input.appliedStressPsi, 'panel.appliedStressPsi');
  const elasticCriticalPsi = plateBucklingStressPsi({ ...input, bucklingCoefficient: k });
  const yieldPsi = loading === 'compression' ? fcy : fcy / Math.sqrt(3);
  const criticalPsi = johnsonReduced(elasticCriticalPsi, yieldPsi);
  const plasticityReduced = criticalPsi < elasticCriticalPsi;
  const buckles = applied > criticalPsi;
  const rules = [PLATE_BUCKLING_RULE, JOHNSON_RULE, 'margin of safety MS = F_cr / f − 1 at the applied stress'];
  const warnings: string[] = [];
  if (input.bucklingCoefficient !== undefined) rules.push(`buckling coefficient k = ${k} as given`);
  if (input.widthIn / input.thicknessIn < 20)
    warnings.push(
      `a panel only ${(input.widthIn / input.thicknessIn).toFixed(1)} thicknesses wide is outside thin-plate theory: its buckling stress is approximate`,
    );
  if (plasticityReduced)
    warnings.push(
      `the elastic buckling stress ${elasticCriticalPsi.toFixed(0)} psi is past half the yield: reduced to ${criticalPsi.toFixed(0)} psi (Johnson)`,
    );
  let note: string;
  if (loading === 'shear') {
    note = buckles
      ? `the panel buckles at ${criticalPsi.toFixed(0)} psi, below the applied ${applied.toFixed(0)} psi shear: the design relies on post-buckled diagonal tension, whose loads on the rivets (tension), ribs and spar caps are not checked here`
      : 'the panel carries the applied shear unbuckled: no reliance on diagonal tension';
    if (buckles) warnings.push(note);
  } else {
    note = 'compression: no diagonal tension';
    if (buckles)
      warnings.push(
        `the panel buckles at ${criticalPsi.toFixed(0)} psi, below the applied ${applied.toFixed(0)} psi compression; post-buckled strength (effective width) is not credited here`,
      );
  }
  return {
    ...envelope(input, rules, warnings),
    loading,
    bucklingCoefficient: k,
    elasticCriticalPsi,
    criticalPsi,
    plasticityReduced,
    appliedStressPsi: applied,
    marginOfSafety: marginOfSafety(criticalPsi, applied),
    buckles,
    diagonalTension: { reliedOn: loading === 'shear' && buckles, note },
  };
}

/** E (compression), ν and F_cy of a catalogue (or supplier's) sheet material, refused if it lacks them. */
export function sheetBucklingProperties(
  material: string,
  materialData?: SheetMaterial[],
): { elasticModulusPsi: number; poissonRatio: number; compressiveYieldPsi: number; source: string } {
  const m = findMaterial(material, materialData);
  if (m.compressiveModulusPsi === undefined || m.poissonRatio === undefined || m.fcyPsi === undefined) {
    throw new EngineeringInputError(
      'material',
      `${m.key} has no compressive modulus, Poisson's ratio and compressive yield: give them in the material data`,
    );
  }
  return {
    elasticModulusPsi: m.compressiveModulusPsi,
    poissonRatio: m.poissonRatio,
    compressiveYieldPsi: m.fcyPsi,
    source: m.source,
  };
}
