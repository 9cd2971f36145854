import { endFixity, interRivetPitchLimitIn, INTER_RIVET_RULE, rivetHeadOf } from './inter-rivet-buckling';
import { layoutRules, rivetWeightLb } from './layout';
import { findMaterial, findRivet } from './materials';
import { pitchSchedule, prepareStations } from './pitch-schedule';
import { panelBuckling, sheetBucklingProperties } from './plate-buckling';
import type {
  CandidateSettings,
  PitchScheduleResult,
  SkinCandidate,
  SkinLineSchedule,
  SkinPanelPlace,
  SkinPanelResult,
  StationLoad,
} from '../../lib/engineering-results';

/**
 * One skin panel of a wing box: the sheet on one surface between two ribs and the front and rear spars,
 * riveted along both spars (spanwise lines) and along both ribs (chordwise lines). What its rivets carry:
 *
 * - pull from the pressure (suction) on the panel: along a rib line over the rib's tributary width, as
 *   for the rib; along a spar line over half the panel's shorter side (a plate between its supports puts
 *   about that on each long edge);
 * - shear from the wing's torsion, q_t = T/(2A) (Bredt–Batho, single cell between the spars);
 * - shear from bending where the skin carries it: the skin and the spar caps of one surface carry the
 *   bending moment as a couple over the box depth h, so the skin's spanwise load grows inboard at
 *   dP/dy = V·(w·t/2)/(h·(A_caps + w·t)) per spar line, which its spar-line rivets pass into the cap;
 * - on the compression surface, the sheet between two rivets of a spanwise line buckles as a column:
 *   σ_ir = 0.9·c·E·(t/p)² sets the largest pitch (inter-rivet-buckling.ts);
 * - the panel itself buckles in shear at τ_cr = k_s·π²E/(12(1 − ν²))·(t/b)² and in compression at
 *   k = 4.0 (plate-buckling.ts): its margins are reported, and whether the design relies on post-buckled
 *   diagonal tension (not credited here).
 *
 * Tension and shear are taken together at every station (the largest of each over all conditions: on
 * the safe side), combined by (Rt)² + (Rs)² ≤ 1 in the pitch schedule.
 */

export interface SkinPanelSpec extends SkinPanelPlace {
  /** the area the box encloses at the inner rib, in² */
  cellAreaSqIn: number;
  /** spar-cap area on this surface (both spars), in² */
  capAreaSqIn: number;
  /** limit loads at the inner rib (larger than at the outer), magnitudes over every condition */
  torqueInLb: number;
  shearLb: number;
  /** the largest bending moment that puts this surface in compression, in·lb (0 if none does) */
  compressionMomentInLb: number;
  /** the largest pull per inch along each spar line from the surface pressure, lb/in (limit) */
  sparPullLbPerIn: { front: number; rear: number };
  /** tension per inch along each rib line between the spars (limit): stations as for a rib line */
  ribLines: { inner: StationLoad[]; outer: StationLoad[] };
}

/** A skin panel's candidates and layout: the wing's settings with the skin's own gauges and rivets. */
export type SkinSettings = CandidateSettings;

const STATION_STEP_IN = 0.1;
const MINUTES_PER_HOLE = { solid: 1.5, pulled: 1.0 };

export const SKIN_RULES = [
  "skin panel: pull from pressure along a rib line over the rib's tributary width; along a spar line over half the panel's shorter side",
  'skin shear from torsion q_t = T/(2A) over the box between the spars (Bredt–Batho, single cell)',
  'skin shear from bending at the spar lines q_b = V·(w·t/2)/(h·(A_caps + w·t)) (skin and caps as a couple over the box depth)',
  INTER_RIVET_RULE,
  'panel buckling, simply supported: in spanwise compression between the spars k = (b/a + a/b)² for a bay a shorter than the box width b, else 4.0; in shear k_s = 5.35 on the shorter side (Timoshenko & Gere); Johnson above half the yield',
  "compression skin past buckling: only the effective width b_e = 1.9·t·√(E/σ) beside the spars carries the bending, at the caps' stress (von Kármán; Bruhn ch. C7, from memory)",
];

/** Stations every 0.1 in along a straight spanwise line, with one pull and one shear all along. */
function spanwiseStations(lengthIn: number, tension: number, shear: number): StationLoad[] {
  const count = Math.max(2, Math.ceil(lengthIn / STATION_STEP_IN) + 1);
  return Array.from({ length: count }, (_, k) => {
    const along = (lengthIn * k) / (count - 1);
    return {
      stationIn: along,
      alongIn: along,
      limitTensionLbPerIn: tension,
      limitShearLbPerIn: shear,
      xIn: along,
      yIn: 0,
    };
  });
}

const strip = (s: PitchScheduleResult): SkinLineSchedule => {
  const { inputs, rules, caution, warnings, ...rest } = s;
  void inputs;
  void rules;
  void caution;
  void warnings;
  return rest;
};

/**
 * Buckling coefficient of the panel in spanwise compression: loaded on its rib edges (a = the bay), simply
 * supported on the spars (b = the box width). k = (b/a + a/b)² for a < b (one half-wave), 4.0 for a ≥ b
 * (the long plate's minimum: Timoshenko & Gere, Theory of Elastic Stability, ch. 9).
 */
export function compressionBucklingCoefficient(bayIn: number, boxWidthIn: number): number {
  if (bayIn >= boxWidthIn) return 4;
  const r = boxWidthIn / bayIn;
  return (r + 1 / r) ** 2;
}

/** Effective width of a buckled plate supported on both unloaded edges, b_e = 1.9·t·√(E/σ) (von Kármán). */
export function effectiveWidthIn(thicknessIn: number, elasticModulusPsi: number, edgeStressPsi: number): number {
  return 1.9 * thicknessIn * Math.sqrt(elasticModulusPsi / edgeStressPsi);
}

const EFFECTIVE_WIDTH_ITERATIONS = 60;

/**
 * The compression skin under the largest bending moment that compresses it: unbuckled, the whole width
 * between the spars works with the caps, σ = M/(h·(A_caps + w·t)); past its buckling stress only the
 * effective width beside the spars does, at the stress of the caps, found by fixed-point iteration
 * (σ grows as b_e shrinks; a bounded number of steps, each a contraction).
 */
function compressionSkin(spec: SkinPanelSpec, t: number, k: number, props: ReturnType<typeof sheetBucklingProperties>) {
  const w = spec.boxWidthIn;
  const grossPsi = spec.compressionMomentInLb / (spec.boxDepthIn * (spec.capAreaSqIn + w * t));
  if (grossPsi <= 0) return { compressionPsi: 0, grossPsi: 0, effectiveWidthIn: w, buckling: null };
  const buckling = panelBuckling({
    loading: 'compression',
    edges: 'simply-supported',
    ...props,
    thicknessIn: t,
    widthIn: w,
    bucklingCoefficient: k,
    appliedStressPsi: Math.min(grossPsi, 200_000),
  });
  if (!buckling.buckles) return { compressionPsi: grossPsi, grossPsi, effectiveWidthIn: w, buckling };
  let sigma = grossPsi;
  let be = w;
  for (let i = 0; i < EFFECTIVE_WIDTH_ITERATIONS; i++) {
    be = Math.min(w, effectiveWidthIn(t, props.elasticModulusPsi, sigma));
    const next = spec.compressionMomentInLb / (spec.boxDepthIn * (spec.capAreaSqIn + be * t));
    if (Math.abs(next - sigma) <= 1e-9 * sigma) {
      sigma = next;
      break;
    }
    sigma = next;
  }
  return { compressionPsi: sigma, grossPsi, effectiveWidthIn: be, buckling };
}

export function skinPanelStudy(spec: SkinPanelSpec, settings: SkinSettings): SkinPanelResult {
  const widthIn = spec.outerStationIn - spec.innerStationIn;
  const props = sheetBucklingProperties(settings.material, settings.materialData);
  const density = findMaterial(settings.material, settings.materialData).densityLbPerIn3;
  const qt = spec.torqueInLb / (2 * spec.cellAreaSqIn);
  const shortSide = Math.min(widthIn, spec.boxWidthIn);
  const candidates: SkinCandidate[] = [];
  const compressionK = compressionBucklingCoefficient(widthIn, spec.boxWidthIn);
  for (const gaugeIn of settings.gaugeCandidates) {
    const compressed = compressionSkin(spec, gaugeIn, compressionK, props);
    const { compressionPsi, effectiveWidthIn } = compressed;
    const carrying = spec.capAreaSqIn + effectiveWidthIn * gaugeIn;
    const qb = (spec.shearLb * effectiveWidthIn * gaugeIn) / (2 * spec.boxDepthIn * carrying);
    for (const code of settings.rivetCandidates) {
      const rivet = findRivet(code, settings.rivetData);
      const layout = layoutRules(rivet);
      const reasons: string[] = [];
      const warnings: string[] = [];
      const fix = endFixity(rivetHeadOf(rivet));
      const pitchLimitIn =
        compressionPsi > 0
          ? interRivetPitchLimitIn(
              fix.c,
              props.elasticModulusPsi,
              props.compressiveYieldPsi,
              gaugeIn,
              Math.min(compressionPsi, 200_000),
            )
          : null;
      let sparMaxDiameters = settings.maxPitchDiameters;
      if (compressionPsi >= props.compressiveYieldPsi) {
        reasons.push(
          `the skin's ${compressionPsi.toFixed(0)} psi compression reaches its yield: a thicker skin or larger spar caps are needed`,
        );
        sparMaxDiameters = 3;
      } else if (pitchLimitIn !== null) {
        const limitD = pitchLimitIn / layout.diameterIn;
        if (limitD < 3) {
          reasons.push(
            `the skin buckles between rivets even at the 3D minimum pitch (largest pitch ${pitchLimitIn.toFixed(3)} in at ${compressionPsi.toFixed(0)} psi)`,
          );
          sparMaxDiameters = 3;
        } else if (limitD < sparMaxDiameters) {
          sparMaxDiameters = limitD;
        }
      }
      const schedule = (line: string, prefix: string, stations: StationLoad[], maxD: number) =>
        pitchSchedule(
          {
            line,
            holePrefix: prefix,
            stations,
            material: settings.material,
            gaugeIn,
            rivetSpec: rivet.code,
            coupons: settings.coupons,
            maxPitchDiameters: maxD,
            pitchIncrementIn: Math.min(settings.pitchIncrementIn, maxD * layout.diameterIn),
            maxZones: settings.maxZones,
            pullThroughFallbackFraction: settings.pullThroughFallbackFraction,
            materialData: settings.materialData,
            rivetData: settings.rivetData,
          },
          prepareStations(stations),
        );
      const sparShear = qt + qb;
      const ribShear = qt;
      const lines = [
        schedule(
          'front spar',
          'FS',
          spanwiseStations(widthIn, spec.sparPullLbPerIn.front, sparShear),
          sparMaxDiameters,
        ),
        schedule('rear spar', 'RS', spanwiseStations(widthIn, spec.sparPullLbPerIn.rear, sparShear), sparMaxDiameters),
        schedule(
          `rib ${spec.innerRib}`,
          'IR',
          spec.ribLines.inner.map((s) => ({ ...s, limitShearLbPerIn: ribShear })),
          settings.maxPitchDiameters,
        ),
        schedule(
          `rib ${spec.outerRib}`,
          'OR',
          spec.ribLines.outer.map((s) => ({ ...s, limitShearLbPerIn: ribShear })),
          settings.maxPitchDiameters,
        ),
      ];
      for (const l of lines) reasons.push(...l.reasons.map((r) => `${l.line}: ${r}`));
      for (const l of lines) warnings.push(...l.warnings);
      const tau = sparShear / gaugeIn;
      const shear = panelBuckling({
        loading: 'shear',
        edges: 'simply-supported',
        ...props,
        thicknessIn: gaugeIn,
        widthIn: shortSide,
        appliedStressPsi: Math.min(tau, 200_000),
      });
      const compression = compressed.buckling;
      if (shear.diagonalTension.reliedOn) warnings.push(`panel ${spec.name}: ${shear.diagonalTension.note}`);
      if (compression && compression.buckles) {
        warnings.push(
          `panel ${spec.name}: the skin buckles in compression at ${compression.criticalPsi.toFixed(0)} psi; past that only ${effectiveWidthIn.toFixed(2)} in of it beside the spars carries the bending (effective width), at ${compressionPsi.toFixed(0)} psi`,
        );
      }
      const rivetCount = lines.reduce((n, l) => n + l.holes.length, 0);
      const grip = 2 * gaugeIn;
      candidates.push({
        gaugeIn,
        rivet: rivet.code,
        feasible: reasons.length === 0,
        reasons,
        warnings: [...new Set(warnings)],
        torsionShearFlowLbPerIn: qt,
        bendingShearFlowLbPerIn: qb,
        compressionPsi,
        interRivet: { endFixity: fix.c, source: fix.source, pitchLimitIn },
        shearBuckling: {
          criticalPsi: shear.criticalPsi,
          appliedPsi: tau,
          marginOfSafety: shear.marginOfSafety,
          diagonalTension: shear.diagonalTension.reliedOn,
        },
        compressionBuckling: {
          criticalPsi: compression?.criticalPsi ?? 0,
          appliedPsi: compressed.grossPsi,
          marginOfSafety: compression?.marginOfSafety ?? null,
          effectiveWidthIn,
        },
        rivetCount,
        weightLb: widthIn * spec.boxWidthIn * gaugeIn * density + rivetCount * rivetWeightLb(rivet, grip),
        buildMinutes: rivetCount * (settings.minutesPerHole ?? MINUTES_PER_HOLE[rivet.kind]),
        lines: lines.map(strip),
      });
    }
  }
  const feasible = candidates
    .filter((c) => c.feasible)
    .sort((a, b) => a.weightLb - b.weightLb || a.rivetCount - b.rivetCount);
  return {
    name: spec.name,
    surface: spec.surface,
    innerRib: spec.innerRib,
    outerRib: spec.outerRib,
    innerStationIn: spec.innerStationIn,
    outerStationIn: spec.outerStationIn,
    widthIn,
    boxWidthIn: spec.boxWidthIn,
    boxDepthIn: spec.boxDepthIn,
    candidates,
    recommended: feasible.length ? { gaugeIn: feasible[0].gaugeIn, rivet: feasible[0].rivet } : null,
  };
}
