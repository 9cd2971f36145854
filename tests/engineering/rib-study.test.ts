import {
  buildAirfoil,
  ENGINEERING_CAUTION,
  ribCandidate,
  ribStudy,
  suctionIntensityLbPerIn,
  cpOnSurface,
  type RibStudyInput,
} from '@/server/engineering';
import { coupon } from '../fixtures/coupons';
import { rib23015 } from '../fixtures/rib-study';
import { refusal } from './refusal';
import { DEMO_ENGINE_COUPONS, DEMO_STUDY_INPUTS } from '@/server/dev/demo-inputs';

// The 23015 rib with a skin gauge and three of the trade's coupons (common practice).
const input: RibStudyInput = {
  ...rib23015,
  rib: { ...rib23015.rib, skinGaugeIn: 0.025 },
  coupons: [
    coupon(0.016, 20, 'excessive_deformation'),
    coupon(0.02, 13.5, 'no_deformation'),
    coupon(0.02, 30, 'slight_deformation'),
  ],
};

describe('a rib study', () => {
  const study = ribStudy(input);

  it('goes through JSON and back unchanged, as the server stores it in jsonb', () => {
    const json = JSON.stringify(study);
    expect(JSON.parse(json)).toEqual(study);
    expect(json).not.toMatch(/NaN|Infinity/);
    expect(JSON.parse(JSON.stringify(input))).toEqual(study.inputs);
  });

  it('carries the caution, the rules it applied and its warnings', () => {
    expect(study.caution).toBe(ENGINEERING_CAUTION);
    expect(study.rules.join(' ')).toMatch(/\(Rt\)² \+ \(Rs\)² ≤ 1/);
    expect(study.warnings.join(' ')).toMatch(/inviscid suction peak near stall is conservative/);
  });

  it('finds for every condition the angle that gives its CL, with Cp on both surfaces for the plot', () => {
    // 23.333(b)–(d): the seven of design-conditions.ts and the negative maneuver at VD.
    expect(study.conditions.map((c) => c.id)).toContain('maneuver-down-vd');
    expect(study.conditions).toHaveLength(8);
    for (const c of study.conditions) {
      expect(c.cp.upper.length).toBe(41);
      expect(c.cp.lower.length).toBe(41);
      expect(Math.sign(c.alphaDeg + 1.2)).toBe(Math.sign(c.clNeeded)); // 230xx zero-lift angle about −1.2°
    }
    const va = study.conditions.find((c) => c.id === 'maneuver-up-va')!;
    expect(Math.min(...va.cp.upper.map((s) => s.cp))).toBeLessThan(-3);
  });

  it('draws the rib at its chord, in inches', () => {
    const xs = study.outline.points.map((p) => p[0]);
    // A cambered NACA nose reaches a hair ahead of its leading-edge point (0, 0).
    expect(study.outline.points[80]).toEqual([0, 0]);
    expect(Math.min(...xs)).toBeGreaterThan(-0.1);
    expect(Math.max(...xs)).toBeCloseTo(58, 1);
    expect(study.outline.points).toHaveLength(161);
  });

  it('envelopes the pull along each line over all conditions', () => {
    const upper = study.lines[0];
    expect(upper.holePrefix).toBe('U');
    expect(study.lines[1].holePrefix).toBe('L');
    // The stored Cp is thinned to 41 samples a surface for the picture: the pull worked back from it is
    // within 2 % of the envelope, which was computed on every sample.
    for (const p of upper.envelope.filter((_, i) => i % 6 === 0)) {
      const pulls = study.conditions.map((c) =>
        suctionIntensityLbPerIn(cpOnSurface(c.cp, 'upper', p.xc), 0, c.qPsi, 14.5),
      );
      expect(Math.abs(p.limitLbPerIn - Math.max(...pulls))).toBeLessThan(0.02 * p.limitLbPerIn + 0.01);
      expect(p.ultimateLbPerIn).toBeCloseTo(1.5 * p.limitLbPerIn, 3);
    }
    // The pull is strongest near the nose, under the suction peak.
    expect(upper.envelope[0].limitLbPerIn).toBeGreaterThan(upper.envelope[upper.envelope.length - 1].limitLbPerIn);
  });

  it('schedules every gauge × rivet candidate and ranks them in a trade table', () => {
    expect(study.candidates).toHaveLength(18);
    expect(study.trade).toHaveLength(18);
    const ranks = study.trade.filter((r) => r.feasible).map((r) => r.rank);
    expect([...ranks].sort((a, b) => (a as number) - (b as number))).toEqual(
      ranks.map((_, i) => i + 1).sort((a, b) => a - b),
    );
    expect(study.trade.filter((r) => !r.feasible).every((r) => r.rank === null)).toBe(true);
  });

  it('recommends the first-ranked feasible candidate, whose every rivet has a margin of zero or more', () => {
    const first = study.trade.find((r) => r.rank === 1)!;
    expect(study.recommended).toEqual({ gaugeIn: first.gaugeIn, rivet: first.rivet });
    const chosen = study.candidates.find((c) => c.gaugeIn === first.gaugeIn && c.rivet === first.rivet)!;
    expect(chosen.feasible).toBe(true);
    for (const l of chosen.lines)
      for (const h of l.holes) expect(Math.min(h.msLimit ?? 0, h.msUltimate ?? 0)).toBeGreaterThanOrEqual(0);
  });

  it('recommends 0.020 in with the tested pulled rivet, and finds 0.016 in with it unacceptable by its coupons', () => {
    expect(study.recommended).toEqual({ gaugeIn: 0.02, rivet: 'PULLED-4' });
    expect(study.candidates.find((c) => c.gaugeIn === 0.016 && c.rivet === 'PULLED-4')!.feasible).toBe(false);
  });

  it('gives the holes ids, stations and positions on the drawing', () => {
    const chosen = study.candidates.find((c) => c.gaugeIn === 0.02 && c.rivet === 'PULLED-4')!;
    const holes = chosen.lines[0].holes;
    expect(holes.slice(0, 2).map((h) => h.id)).toEqual(['U-01', 'U-02']);
    expect(holes[0].xIn).toBeCloseTo(holes[0].stationIn, 6);
    expect(holes[0].yIn).toBeGreaterThan(0);
    expect(chosen.lines[1].holes[0].id).toBe('L-01');
    expect(chosen.lines[1].holes[0].yIn).toBeLessThan(0);
    // Past 99 holes on a line the numbers grow a digit (a candidate not chosen: its holes recomputed).
    expect(ribCandidate(input, { gaugeIn: 0.016, rivet: 'PULLED-4' }).lines[0].holes[0].id).toBe('U-001');
  });

  it('reports in each zone its number of holes and its weakest rivet, the one with the lowest margin of safety', () => {
    const chosen = study.candidates.find((c) => c.holesStored)!;
    const lowest = (h: { msLimit: number | null; msUltimate: number | null }) =>
      Math.min(h.msLimit ?? Infinity, h.msUltimate ?? Infinity);
    for (const l of chosen.lines) {
      expect(l.zones.reduce((n, z) => n + z.count, 0)).toBe(l.holes.length);
      l.zones.forEach((z, i) => {
        const inZone = l.holes.filter((h) => h.zone === i);
        expect(z.count).toBe(inZone.length);
        const worst = inZone.find((h) => h.id === z.worstHoleId)!;
        expect(lowest(worst)).toBe(Math.min(...inZone.map(lowest)));
        expect(z.msLimit).toBe(worst.msLimit);
        expect(z.appliedLimitLb).toBe(worst.appliedLimitLb);
      });
    }
  });

  it('stores the holes of the recommended candidate only, and recomputes any other the same as a study of it alone', () => {
    const stored = study.candidates.filter((c) => c.holesStored);
    expect(stored.map((c) => [c.gaugeIn, c.rivet])).toEqual([[0.02, 'PULLED-4']]);
    for (const c of study.candidates.filter((k) => !k.holesStored))
      for (const l of c.lines) expect(l.holes).toEqual([]);
    const other = ribCandidate(input, { gaugeIn: 0.032, rivet: 'MS20470AD4' });
    const alone = ribStudy({ ...input, gaugeCandidates: [0.032], rivetCandidates: ['MS20470AD4'] });
    expect(other).toEqual(alone.candidates[0]);
    expect(other.lines[0].holes.length).toBeGreaterThan(10);
    expect(() => ribCandidate(input, { gaugeIn: 0.071, rivet: 'PULLED-4' })).toThrow(
      /gaugeIn: 0.071 in is not one of the study's gauges/,
    );
  });

  it("never stores a zone pitch under its rivet's 3D minimum (a 3/32 in rivet's 0.28125 in is not rounded to 0.281)", () => {
    const small = ribStudy({
      ...input,
      rib: { ...input.rib, spacingIn: 30 },
      rivetCandidates: ['MS20470AD3'],
      gaugeCandidates: [0.016],
    });
    const zones = small.candidates.flatMap((c) => c.lines.flatMap((l) => l.zones));
    expect(zones.some((z) => Math.abs(z.pitchIn - 0.28125) < 1e-4)).toBe(true);
    for (const c of small.candidates)
      for (const l of c.lines) for (const z of l.zones) expect(z.pitchIn).toBeGreaterThanOrEqual(3 * (3 / 32));
  });

  it('keeps the stored result of the demo rib under 100 KB', () => {
    const demo = ribStudy({ ...DEMO_STUDY_INPUTS, coupons: DEMO_ENGINE_COUPONS });
    expect(demo.recommended).not.toBeNull();
    expect(Buffer.byteLength(JSON.stringify(demo))).toBeLessThan(100 * 1024);
  });

  it('weighs a thicker gauge heavier', () => {
    const w = (g: number) => study.trade.find((r) => r.gaugeIn === g && r.rivet === 'MS20470AD4')!;
    expect(w(0.04).webWeightLb).toBeGreaterThan(w(0.025).webWeightLb);
    expect(w(0.04).flangeWeightLb).toBeGreaterThan(w(0.025).flangeWeightLb);
  });
});

describe('a rib study with other inputs', () => {
  const small: RibStudyInput = { ...input, gaugeCandidates: [0.025], rivetCandidates: ['MS20470AD4'], panels: 80 };

  it('takes uploaded coordinates as well as a NACA designation, to the same result', () => {
    // A symmetric section, whose nose point is also the point farthest from the tail: same chord line.
    const points = buildAirfoil({ kind: 'naca', designation: '0015' }, 120).points;
    const a = ribStudy({ ...small, airfoil: { kind: 'coordinates', points, name: 'kit section' } });
    const b = ribStudy({ ...small, airfoil: { kind: 'naca', designation: '0015' } });
    expect(a.airfoil.name).toBe('kit section');
    a.conditions.forEach((c, i) => expect(c.alphaDeg).toBeCloseTo(b.conditions[i].alphaDeg, 1));
    expect(a.trade[0].rivetCount).toBeCloseTo(b.trade[0].rivetCount, -1);
  });

  it("uses a supplier's Cp tables for conditions of their sign and the panel method for the rest", () => {
    const rows = [0, 0.05, 0.2, 0.5, 1].map((x): [number, number, number] => [x, -2 * (1 - x), 0.3 * (1 - x)]);
    const s = ribStudy({ ...small, cpTables: [{ cl: 1.0, rows }] });
    expect(s.conditions.find((c) => c.id === 'maneuver-up-va')!.pressureSource).toBe('Cp table');
    expect(s.conditions.find((c) => c.id === 'maneuver-down-vc')!.pressureSource).toBe('panel method');
    expect(s.warnings.join(' ')).toMatch(/no Cp table for a lift coefficient of this sign/);
  });

  it('adds skin shear from wing torque to every rivet', () => {
    const s = ribStudy({ ...small, wingTorqueInLb: 10000, cellAreaSqIn: 60 });
    expect(s.lines[0].shearFlowLbPerIn).toBeCloseTo(83.33, 2);
    expect(s.candidates[0].lines[0].holes[3].appliedLimitShearLb).toBeGreaterThan(0);
  });

  it('finds a rivet infeasible when the flange is too narrow for its edge distance', () => {
    const s = ribStudy({ ...small, rib: { ...small.rib, flangeWidthIn: 0.4 } });
    expect(s.candidates[0].feasible).toBe(false);
    expect(s.candidates[0].reasons.join(' ')).toMatch(/narrower than twice/);
  });

  it('refuses a torque without the cell area', () => {
    expect(refusal(() => ribStudy({ ...small, wingTorqueInLb: 10000 })).field).toBe('cellAreaSqIn');
  });

  it('refuses two lines of the same name', () => {
    expect(
      refusal(() => ribStudy({ ...small, lines: [input.lines[0], { ...input.lines[1], name: 'Upper' }] })).field,
    ).toBe('lines[1].name');
  });

  it('refuses a line that ends before it starts', () => {
    expect(
      refusal(() => ribStudy({ ...small, lines: [{ name: 'upper', surface: 'upper', startXc: 0.5, endXc: 0.2 }] }))
        .field,
    ).toBe('lines[0].endXc');
  });

  it('refuses an unknown rivet candidate, naming it', () => {
    expect(refusal(() => ribStudy({ ...small, rivetCandidates: ['MS20470AD4', 'HOTGLUE'] })).field).toBe(
      'rivetCandidates[1]',
    );
  });

  it('refuses a zero rib spacing', () => {
    expect(refusal(() => ribStudy({ ...small, rib: { ...small.rib, spacingIn: 0 } })).field).toBe('rib.spacingIn');
  });
});
