import {
  ENGINEERING_CAUTION,
  karmanTsienCp,
  ribStudy,
  wingStudy,
  type RibStudyInput,
  type WingStudyInput,
} from '@/server/engineering';
import { standardWing } from '../fixtures/wing-study';
import { refusal } from './refusal';
import { DEMO_ENGINE_COUPONS, DEMO_WING_INPUTS } from '@/server/dev/demo-inputs';

// The standard wing: rectangular, 320 in span, 54 in chord (120 ft²), ten ribs.
const wing: WingStudyInput = standardWing;

/** Schrenk's cl/CL on a rectangular wing: ½(1 + 4/π·√(1 − η²)) (O. Schrenk, NACA TM 948). */
const schrenkRectangle = (eta: number) => 0.5 * (1 + (4 / Math.PI) * Math.sqrt(1 - eta * eta));

describe('a whole-wing study', () => {
  const study = wingStudy(wing);

  it('goes through JSON unchanged, carries the caution, and names Schrenk and the compressibility rule', () => {
    expect(JSON.parse(JSON.stringify(study))).toEqual(study);
    expect(JSON.stringify(study)).not.toMatch(/NaN|Infinity/);
    expect(study.caution).toBe(ENGINEERING_CAUTION);
    expect(study.rules.join(' ')).toMatch(/Schrenk's approximation \(NACA TM 948\)/);
    expect(study.rules.join(' ')).toMatch(/Kármán–Tsien/);
    expect(study.ribs).toHaveLength(10);
    expect(study.skins).toHaveLength(18);
  });

  it("takes every rib at its own station: its section at the wing CL × Schrenk's ratio there", () => {
    for (const rib of study.ribs) {
      const eta = rib.stationIn / 160;
      expect(rib.clRatio).toBeCloseTo(schrenkRectangle(eta), 5); // stored to 6 significant digits
      for (const c of rib.study.conditions) {
        const w = study.conditions.find((k) => k.id === c.id)!;
        expect(c.sectionCl).toBeCloseTo(w.wingCl * schrenkRectangle(eta), 4);
      }
    }
    // The root rib works harder than the wing's CL, the outer ones less: 1.13 at η = 0.15, 0.67 at 0.97.
    expect(study.ribs[0].clRatio).toBeGreaterThan(1.12);
    expect(study.ribs[9].clRatio).toBeLessThan(0.7);
  });

  it('pulls harder on the root rib than a lone rib taken at the wing CL, by about its Schrenk ratio', () => {
    const root = study.ribs[0];
    const lone = ribStudy({
      ...(wing as unknown as RibStudyInput),
      rib: { chordIn: 54, spacingIn: root.spacingIn },
      lines: wing.rib.lines,
    });
    const peak = (env: { limitLbPerIn: number }[]) => Math.max(...env.map((p) => p.limitLbPerIn));
    const ratio = peak(root.study.lines[0].envelope) / peak(lone.lines[0].envelope);
    expect(ratio).toBeGreaterThan(1.08);
    expect(ratio).toBeLessThan(1.3);
  });

  it('gives the outermost rib the tip beyond it and every other rib half of each neighbouring bay', () => {
    expect(study.ribs[0].spacingIn).toBeCloseTo(7.25, 9);
    expect(study.ribs[4].spacingIn).toBeCloseTo(14.5, 9);
    expect(study.ribs[9].spacingIn).toBeCloseTo(7.25 + (160 - 154.5), 9);
  });

  it('has the wing lift n·W with no tail load, and the shear falls outboard', () => {
    for (const c of study.conditions) {
      expect(c.tailLoadLb).toBe(0);
      expect(c.wingLiftLb / (c.n * 1320)).toBeCloseTo(1, 5);
    }
    for (let i = 1; i < study.ribs.length; i++)
      expect(study.ribs[i].loads.shearLb).toBeLessThan(study.ribs[i - 1].loads.shearLb);
    // The positive limit maneuver governs shear and bending (4.4 g: 23.337, utility).
    expect(study.ribs[0].loads.governing.bending).toMatch(/^maneuver-up/);
  });

  it("corrects each condition's pressure to its Mach number by Kármán–Tsien", () => {
    const lone: RibStudyInput = {
      ...(wing as unknown as RibStudyInput),
      rib: { chordIn: 54, spacingIn: 14.5 },
      lines: wing.rib.lines,
    };
    const corrected = ribStudy(lone);
    const incompressible = ribStudy({ ...lone, compressibility: 'none' });
    const vd = corrected.conditions.findIndex((c) => c.id === 'maneuver-up-vd');
    const m = corrected.conditions[vd].mach;
    expect(m).toBeGreaterThan(0.2);
    // Any compressible-aerodynamics text: Cp = Cp₀/(β + M²/(1 + β)·Cp₀/2), β = √(1 − M²). Stored to 0.001.
    corrected.conditions[vd].cp.upper.forEach((s, i) => {
      expect(Math.abs(s.cp - karmanTsienCp(incompressible.conditions[vd].cp.upper[i].cp, m))).toBeLessThan(0.003);
    });
    expect(incompressible.rules.join(' ')).toMatch(/compressibility: none/);
  });

  it('studies the negative maneuver at VD and, given flaps, the flaps-extended conditions of 23.345', () => {
    expect(study.conditions.map((c) => c.id)).toContain('maneuver-down-vd');
    expect(study.conditions.find((c) => c.id === 'maneuver-down-vd')!.n).toBe(-1); // 23.333(b)(3), utility
    const flapped = wingStudy({ ...wing, ribs: wing.ribs.slice(8), flaps: { stallSpeedKeas: 41 } });
    const flap = flapped.conditions.filter((c) => c.id.startsWith('flaps-'));
    expect(flap.map((c) => c.id)).toEqual(['flaps-maneuver-up-vf', 'flaps-gust-up-vf', 'flaps-gust-down-vf']);
    expect(flap[0].n).toBe(2); // 23.345(a)(1)
    // VF ≥ max(1.4 VS, 1.8 VSF) = max(65.8, 73.8) kt (23.345(b), factors from memory)
    expect(flap[0].speedKeas).toBeCloseTo(73.8, 6);
  });

  it('ranks one gauge and rivet for every rib against each rib with its own choice, which is never heavier', () => {
    const feasible = study.trade.uniform.filter((u) => u.feasible);
    expect(feasible.length).toBeGreaterThan(0);
    for (const u of study.trade.uniform) {
      const onEvery = study.ribs.every(
        (r) => r.study.trade.find((t) => t.gaugeIn === u.gaugeIn && t.rivet === u.rivet)!.feasible,
      );
      expect(u.feasible).toBe(onEvery);
    }
    expect(study.trade.perRib.feasible).toBe(true);
    expect(study.trade.perRib.weightLb).toBeLessThanOrEqual(Math.min(...feasible.map((u) => u.weightLb)) + 1e-9);
    expect(study.trade.recommendedUniform).toEqual({ gaugeIn: feasible[0].gaugeIn, rivet: feasible[0].rivet });
  });

  it('stores zones for the choices and no holes, keeping a ten-rib wing under 500 KB', () => {
    for (const rib of study.ribs) {
      for (const c of rib.study.candidates) {
        for (const l of c.lines) expect(l.holes).toEqual([]);
        const kept = c.lines.length > 0;
        const chosen =
          (rib.study.recommended?.gaugeIn === c.gaugeIn && rib.study.recommended?.rivet === c.rivet) ||
          (study.trade.recommendedUniform?.gaugeIn === c.gaugeIn && study.trade.recommendedUniform?.rivet === c.rivet);
        expect(kept).toBe(chosen);
      }
    }
    expect(Buffer.byteLength(JSON.stringify(study))).toBeLessThan(500 * 1024);
  });
});

describe("the tail's balancing load", () => {
  const two = { ...wing, ribs: wing.ribs.slice(8) };

  it("adds a given download at VC to the wing's lift in every condition, scaled with the dynamic pressure", () => {
    const study = wingStudy({ ...two, tail: { armIn: 170, balancingLoadLb: 150 } });
    const vc = study.conditions.find((c) => c.id === 'gust-up-vc')!;
    for (const c of study.conditions) {
      // stored to 6 significant digits
      expect(c.tailLoadLb / ((150 * c.qPsi) / vc.qPsi)).toBeCloseTo(1, 5);
      expect(c.wingLiftLb / (c.n * 1320 + c.tailLoadLb)).toBeCloseTo(1, 5);
    }
  });

  it("estimates it from the section's zero-lift moment: a download for a cambered section", () => {
    const study = wingStudy({ ...two, tail: { armIn: 170 } });
    // NACA 2412: cm about the quarter chord about −0.05 (thin-airfoil theory −0.053; measured about −0.045
    // in Abbott & von Doenhoff's data, from memory).
    expect(study.tail.cmAc).toBeGreaterThan(-0.065);
    expect(study.tail.cmAc).toBeLessThan(-0.04);
    expect(study.tail.estimated).toBe(true);
    const c = study.conditions.find((k) => k.id === 'maneuver-up-vd')!;
    // P = −cm_ac·q·S·c̄/l_t
    expect(c.tailLoadLb).toBeCloseTo((-study.tail.cmAc * c.qPsi * 120 * 144 * 54) / 170, 1);
    expect(c.tailLoadLb).toBeGreaterThan(0);
  });
});

describe('the skin panels of the wing', () => {
  const study = wingStudy(wing);
  const rootUpper = study.skins.find((s) => s.innerRib === 'W-101' && s.surface === 'upper')!;
  const rootLower = study.skins.find((s) => s.innerRib === 'W-101' && s.surface === 'lower')!;
  const root = study.ribs[0];

  it('take the torsion shear flow q = T/(2A) of the box at their inner rib (Bredt–Batho)', () => {
    for (const c of rootUpper.candidates) expect(c.torsionShearFlowLbPerIn).toBeCloseTo(root.loads.shearFlowLbPerIn, 2);
  });

  it('put the upper skin in compression (positive lift bends the wing up) and hold its spar-line pitch to the inter-rivet limit', () => {
    const c = rootUpper.candidates.find(
      (k) => k.gaugeIn === rootUpper.recommended!.gaugeIn && k.rivet === rootUpper.recommended!.rivet,
    )!;
    const lower = rootLower.candidates.find((k) => k.gaugeIn === c.gaugeIn && k.rivet === c.rivet)!;
    expect(c.compressionPsi).toBeGreaterThan(lower.compressionPsi); // 4.4 g up against −1.76 g down
    // Skin and caps of one surface as a couple over the box depth h: σ = M/(h·(A_caps + b·t)), and the
    // spar-line shear q_b = V·(b·t/2)/(h·(A_caps + b·t)) (engineers' bending theory, any strength-of-materials
    // text), b the width of skin that carries it: past buckling the effective width b_e = 1.9·t·√(E/σ)
    // (von Kármán; Bruhn ch. C7, from memory), E = 10.1e6 psi.
    const be = c.compressionBuckling.effectiveWidthIn;
    expect(c.compressionBuckling.appliedPsi).toBeGreaterThan(c.compressionBuckling.criticalPsi); // a thin unstiffened skin buckles
    expect(be).toBeCloseTo(Math.min(rootUpper.boxWidthIn, 1.9 * c.gaugeIn * Math.sqrt(10.1e6 / c.compressionPsi)), 2);
    const carrying = 1 + be * c.gaugeIn;
    expect(c.compressionPsi / (root.loads.bendingInLb / (rootUpper.boxDepthIn * carrying))).toBeCloseTo(1, 2);
    expect(
      c.bendingShearFlowLbPerIn / ((root.loads.shearLb * be * c.gaugeIn) / (2 * rootUpper.boxDepthIn * carrying)),
    ).toBeCloseTo(1, 2);
    expect(c.interRivet.endFixity).toBe(1); // countersunk head: c = 1.0 (Bruhn C7, from memory)
    // σ_ir = 0.9·c·E·(t/p)² ≥ σ at the limit pitch, E = 10.1e6 psi (6061-T6, from memory), elastic here
    // past half the compressive yield (35 ksi) by Johnson's parabola: the elastic stress that reaches σ
    const fcy = 35000;
    const elastic = c.compressionPsi <= fcy / 2 ? c.compressionPsi : (fcy * fcy) / (4 * (fcy - c.compressionPsi));
    expect(c.interRivet.pitchLimitIn!).toBeCloseTo(c.gaugeIn * Math.sqrt((0.9 * 1 * 10.1e6) / elastic), 2);
    for (const line of c.lines.filter((l) => /spar/.test(l.line))) {
      for (const z of line.zones) expect(z.pitchIn).toBeLessThanOrEqual(c.interRivet.pitchLimitIn! + 1e-9);
    }
  });

  it('report shear buckling of the panel at k_s = 5.35, simply supported (Timoshenko & Gere), and the reliance on diagonal tension', () => {
    for (const c of rootUpper.candidates) {
      const b = Math.min(rootUpper.widthIn, rootUpper.boxWidthIn);
      const elastic = ((5.35 * Math.PI ** 2 * 10.1e6) / (12 * (1 - 0.33 ** 2))) * (c.gaugeIn / b) ** 2;
      expect(c.shearBuckling.criticalPsi).toBeCloseTo(elastic, 0);
      expect(c.shearBuckling.diagonalTension).toBe(c.shearBuckling.appliedPsi > c.shearBuckling.criticalPsi);
    }
  });

  it('recommend the lightest feasible candidate, with four rivet lines', () => {
    const feasible = rootUpper.candidates.filter((c) => c.feasible).sort((a, b) => a.weightLb - b.weightLb);
    expect(rootUpper.recommended).toEqual({ gaugeIn: feasible[0].gaugeIn, rivet: feasible[0].rivet });
    expect(feasible[0].lines.map((l) => l.line)).toEqual(['front spar', 'rear spar', 'rib W-101', 'rib W-102']);
  });
});

describe('refusals of a wing study name the field', () => {
  it.each([
    [
      'a rib beyond the half-span',
      {
        ribs: [
          { name: 'A', stationIn: 20 },
          { name: 'B', stationIn: 170 },
        ],
      },
      'ribs[1].stationIn',
    ],
    [
      'ribs out of order',
      {
        ribs: [
          { name: 'A', stationIn: 40 },
          { name: 'B', stationIn: 30 },
        ],
      },
      'ribs[1].stationIn',
    ],
    [
      'two ribs of one name',
      {
        ribs: [
          { name: 'A', stationIn: 20 },
          { name: 'a', stationIn: 30 },
        ],
      },
      'ribs[1].name',
    ],
    ['one rib', { ribs: [{ name: 'A', stationIn: 20 }] }, 'ribs'],
    ['the rear spar ahead of the front', { spars: { frontXc: 0.3, rearXc: 0.35 } }, 'spars.rearXc'],
    ['a tail arm of 1 in', { tail: { armIn: 1 } }, 'tail.armIn'],
    [
      'an unknown skin rivet',
      { skin: { gaugeCandidates: [0.02], rivetCandidates: ['NOPE-9'] } },
      'skin.rivetCandidates[0]',
    ],
    [
      'a pointed tip',
      { planform: { kind: 'tapered', spanIn: 320, rootChordIn: 60, tipChordIn: 3 } },
      'planform.tipChordIn',
    ],
    [
      'a rib strip wider than 60 in',
      {
        ribs: [
          { name: 'A', stationIn: 10 },
          { name: 'B', stationIn: 90 },
        ],
      },
      'ribs[1].stationIn',
    ],
    ['an unknown compressibility rule', { compressibility: 'guess' }, 'compressibility'],
  ] as [string, Partial<WingStudyInput>, string][])('%s', (_what, change, field) => {
    expect(refusal(() => wingStudy({ ...wing, ...change } as WingStudyInput)).field).toBe(field);
  });
});

describe('a wing study checks what every rib takes as a rib study does', () => {
  it.each([
    ['a gauge of 1 in', { gaugeCandidates: [1] }, 'gaugeCandidates[0]'],
    ['an unknown rivet', { rivetCandidates: ['NOPE-1'] }, 'rivetCandidates[0]'],
    ['an unknown material', { material: 'unobtainium' }, 'material'],
    [
      'a line that ends before it starts',
      { rib: { lines: [{ name: 'U', surface: 'upper', startXc: 0.5, endXc: 0.2 }] } },
      'rib.lines[0].endXc',
    ],
    ['a pitch increment of 1e-9 in', { pitchIncrementIn: 1e-9 }, 'pitchIncrementIn'],
  ] as [string, Partial<WingStudyInput>, string][])('%s', (_what, change, field) => {
    expect(refusal(() => wingStudy({ ...wing, ...change } as WingStudyInput)).field).toBe(field);
  });
});

describe('the one-for-all choice of a wing with coupon tests', () => {
  const study = wingStudy({ ...(DEMO_WING_INPUTS as WingStudyInput), coupons: DEMO_ENGINE_COUPONS });

  it('never puts a candidate resting on the pull-through fallback ahead of one backed by coupons on every rib, as a rib does', () => {
    const ranked = study.trade.uniform.filter((u) => u.rank !== null).sort((a, b) => a.rank! - b.rank!);
    const firstFallback = ranked.findIndex((u) => u.pullThroughBasis === 'fallback');
    const lastCoupons = ranked.map((u) => u.pullThroughBasis).lastIndexOf('coupons');
    expect(lastCoupons).toBeGreaterThanOrEqual(0);
    if (firstFallback >= 0) expect(lastCoupons).toBeLessThan(firstFallback);
    expect(study.trade.uniform.find((u) => u.rank === 1)!.pullThroughBasis).toBe('coupons');
    // and within each basis, lighter first
    for (let i = 1; i < ranked.length; i++) {
      if (ranked[i].pullThroughBasis === ranked[i - 1].pullThroughBasis)
        expect(ranked[i].weightLb).toBeGreaterThanOrEqual(ranked[i - 1].weightLb);
    }
  });

  it("takes each rib's own recommendation for the choice per rib", () => {
    expect(study.trade.perRib.choices).toEqual(study.ribs.map((r) => ({ rib: r.name, ...r.study.recommended! })));
  });
});

describe('a wing study holds its skin panels to a work budget', () => {
  it('refuses, before it solves anything, a wing whose skin panels would take too long to schedule, naming the skin candidates', () => {
    // 24 ribs of a large wing, 6 skin gauges × 4 rivets: millions of station schedules.
    const big: WingStudyInput = {
      ...wing,
      kit: { ...wing.kit, weightLb: 9000, wingAreaSqFt: 600, meanChordIn: 120 },
      planform: { kind: 'rectangle', spanIn: 720, chordIn: 120 },
      ribs: Array.from({ length: 24 }, (_, i) => ({ name: `R${i}`, stationIn: 10 + i * 15 })),
      skin: {
        gaugeCandidates: [0.016, 0.02, 0.025, 0.032, 0.04, 0.05],
        rivetCandidates: ['MS20426AD3', 'MS20426AD4', 'MS20470AD3', 'MS20470AD4'],
      },
      gaugeCandidates: [0.032],
      rivetCandidates: ['MS20470AD4'],
    };
    const e = refusal(() => wingStudy(big));
    expect(e.field).toBe('skin.gaugeCandidates');
    expect(e.reason).toMatch(/at most 1,000,000/);
  });
});
