/**
 * The facts of the trade used as check values. They come with no published source: each is
 * marked "common practice".
 */
import {
  designConditions,
  dynamicPressurePsi,
  findRivet,
  jointAllowables,
  maneuveringSpeedKeas,
  pitchSchedule,
  ribStudy,
  rivetTensionLb,
  suctionForRivetLoadPsi,
  ULTIMATE_FACTOR,
  type CouponTest,
  type RibStudyInput,
  type StationLoad,
} from '@/server/engineering';
import { tradeCoupons } from '../fixtures/coupons';
import { kit58, rib23015, upperLine } from '../fixtures/rib-study';
import { refusal } from './refusal';

// common practice: the trade's coupon results for 6061-T6 flanges with a 1/8 in pulled rivet.
const coupons: CouponTest[] = [{ ...tradeCoupons[0], note: 'hole elongated' }, ...tradeCoupons.slice(1)];

const ribSpacingIn = 14.5;
// The suction at the foremost rivet that puts 20 lb on it at 3 in pitch.
const suctionPsi = suctionForRivetLoadPsi(20, 3, ribSpacingIn);

describe('the per-rivet suction load p × pitch × rib spacing', () => {
  // common practice
  const vaKeas = maneuveringSpeedKeas(50, 3.8);
  const qPsi = dynamicPressurePsi(vaKeas);
  const cp = -suctionPsi / qPsi;

  it('puts 20 lb limit on the foremost rivet at 3 in pitch, 14.5 in rib spacing, at about 0.46 psi suction', () => {
    expect(suctionPsi).toBeCloseTo(0.46, 2);
    expect(rivetTensionLb({ cp, qPsi, pitchIn: 3, tributaryWidthIn: ribSpacingIn })).toBeCloseTo(20, 10);
  });

  it('makes that 30 lb ultimate with the factor 1.5', () => {
    expect(ULTIMATE_FACTOR * rivetTensionLb({ cp, qPsi, pitchIn: 3, tributaryWidthIn: ribSpacingIn })).toBeCloseTo(
      30,
      10,
    );
  });

  it('gives 13.3 lb limit and 20 lb ultimate at 2 in pitch at the same station', () => {
    const limit = rivetTensionLb({ cp, qPsi, pitchIn: 2, tributaryWidthIn: ribSpacingIn });
    expect(limit).toBeCloseTo(13.33, 2);
    expect(ULTIMATE_FACTOR * limit).toBeCloseTo(20, 10);
  });

  it('pulls nothing where the surface presses on the skin instead of sucking', () => {
    expect(rivetTensionLb({ cp: 0.4, qPsi, pitchIn: 2, tributaryWidthIn: ribSpacingIn })).toBe(0);
  });
});

describe('coupon outcomes for 6061-T6 flanges', () => {
  // common practice (the trade's coupon results)
  const at = (gaugeIn: number) => jointAllowables({ material: '6061-T6', gaugeIn, rivetSpec: 'PULLED-4', coupons });

  it('give 0.016 in no allowable at all: 20–30 lb deformed the hole excessively', () => {
    expect(at(0.016).tension.limitLb).toBe(0);
    expect(at(0.016).tension.ultimateLb).toBe(0);
  });

  it('give 0.020 in 13.5 lb limit (no deformation) and 30 lb ultimate (slight deformation only)', () => {
    expect(at(0.02).tension.limitLb).toBe(13.5);
    expect(at(0.02).tension.ultimateLb).toBe(30);
    expect(at(0.02).tension.basis).toBe('coupons');
  });

  // A short nose line at the suction that gives 20 lb at 3 in pitch, for a rivet allowed up to 2 in.
  const noseLine: StationLoad[] = Array.from({ length: 101 }, (_, i) => ({
    stationIn: 0.5 + i * 0.1,
    alongIn: i * 0.1,
    limitTensionLbPerIn: suctionPsi * ribSpacingIn,
  }));
  const schedule = (gaugeIn: number) =>
    pitchSchedule({
      line: 'upper',
      stations: noseLine,
      material: '6061-T6',
      gaugeIn,
      rivetSpec: 'PULLED-4',
      coupons,
      maxPitchDiameters: 16,
      pitchIncrementIn: 0.25,
      maxZones: 3,
    });

  it('make 0.020 in at 2 in pitch at the nose acceptable at limit and at ultimate', () => {
    const s = schedule(0.02);
    expect(s.feasible).toBe(true);
    expect(s.zones.map((z) => z.pitchIn)).toEqual([2]);
    expect(s.zones[0].appliedLimitLb).toBeCloseTo(13.33, 2);
    expect(s.zones[0].msLimit).toBeGreaterThanOrEqual(0);
    expect(s.zones[0].msUltimate).toBeGreaterThanOrEqual(0);
  });

  it('make 0.016 in unacceptable at any pitch', () => {
    const s = schedule(0.016);
    expect(s.feasible).toBe(false);
    expect(s.reasons.join(' ')).toMatch(/zero by its coupons/);
  });

  it('make 0.020 in unacceptable at 3 in pitch, where the 20 lb limit load exceeds the 13.5 lb no-deformation load', () => {
    const s = pitchSchedule({
      line: 'upper',
      stations: noseLine,
      material: '6061-T6',
      gaugeIn: 0.02,
      rivetSpec: 'PULLED-4',
      coupons,
      maxPitchDiameters: 24,
      pitchIncrementIn: 0.5,
      maxZones: 1,
    });
    expect(s.zones[0].pitchIn).toBeLessThan(3);
  });
});

describe('zones along a conventional positive-lift distribution', () => {
  // common practice: the closest pitch at the nose, opening aft as the suction falls off
  const input: RibStudyInput = {
    ...rib23015,
    airfoil: { kind: 'naca', designation: '2412' },
    lines: [upperLine],
    gaugeCandidates: [0.02, 0.025, 0.032],
    rivetCandidates: ['PULLED-4', 'MS20470AD4'],
    coupons,
  };
  const study = ribStudy(input);
  const zoneSets = study.candidates.flatMap((c) => c.lines.map((l) => l.zones));

  it('open up monotonically from the nose aft on every candidate', () => {
    for (const zones of zoneSets) {
      for (let i = 1; i < zones.length; i++) expect(zones[i].pitchIn).toBeGreaterThanOrEqual(zones[i - 1].pitchIn);
    }
  });

  it('start at the nose with the closest pitch and do open up somewhere', () => {
    expect(zoneSets.some((z) => z.length >= 3)).toBe(true);
    for (const zones of zoneSets) expect(zones[0].pitchIn).toBe(Math.min(...zones.map((z) => z.pitchIn)));
  });
});

describe('pulled rivets of the kind used in light kits', () => {
  // common practice: about 150 lb in tension
  it('hold on the order of 150 lb in tension', () => {
    expect(findRivet('PULLED-4').tensionLb).toBe(150);
  });

  it('are rarely what fails first in a thin flange: the flange pull-through governs', () => {
    for (const gaugeIn of [0.016, 0.02, 0.025, 0.032, 0.04]) {
      const a = jointAllowables({ material: '6061-T6', gaugeIn, rivetSpec: 'PULLED-4', coupons });
      expect(a.tension.governing).toBe('flange pull-through');
      expect(a.tension.pullThroughUltimateLb).toBeLessThan(a.tension.rivetLb);
    }
  });
});

describe('the engine refuses nonsense and names the field', () => {
  const kit = kit58;
  const study: RibStudyInput = {
    ...rib23015,
    airfoil: { kind: 'naca', designation: '2412' },
    lines: [upperLine],
    gaugeCandidates: [0.025],
    rivetCandidates: ['PULLED-4'],
    maxPitchDiameters: 8,
    maxZones: 3,
    panels: 60,
  };

  it.each([0, -1320])('refuses a weight of %p lb', (weightLb) => {
    const e = refusal(() => designConditions({ ...kit, weightLb }));
    expect(e.field).toBe('kit.weightLb');
    expect(e.reason).toMatch(/greater than zero/);
  });

  it('refuses a rib chord of zero', () => {
    expect(refusal(() => ribStudy({ ...study, rib: { ...study.rib, chordIn: 0 } })).field).toBe('rib.chordIn');
  });

  it('refuses a mean wing chord of zero', () => {
    expect(refusal(() => ribStudy({ ...study, kit: { ...kit, meanChordIn: 0 } })).field).toBe('kit.meanChordIn');
  });

  it('refuses an airfoil of fewer than ten points', () => {
    const points: [number, number][] = [
      [1, 0],
      [0.7, 0.05],
      [0.4, 0.07],
      [0.1, 0.04],
      [0, 0],
      [0.1, -0.03],
      [0.4, -0.04],
      [0.7, -0.03],
      [1, 0],
    ];
    const e = refusal(() => ribStudy({ ...study, airfoil: { kind: 'coordinates', points } }));
    expect(e.field).toBe('airfoil.points');
    expect(e.reason).toMatch(/at least 10/);
  });

  it('refuses an airfoil outline that crosses itself', () => {
    // The "lower" surface climbs above the upper one half-way along: a figure of eight.
    const points: [number, number][] = [
      [1, 0],
      [0.8, 0.03],
      [0.6, 0.05],
      [0.4, 0.06],
      [0.2, 0.05],
      [0.05, 0.03],
      [0, 0],
      [0.05, -0.03],
      [0.2, -0.04],
      [0.4, 0.09],
      [0.6, -0.03],
      [0.8, -0.02],
      [1, 0],
    ];
    const e = refusal(() => ribStudy({ ...study, airfoil: { kind: 'coordinates', points } }));
    expect(e.field).toBe('airfoil.points');
    expect(e.reason).toMatch(/crosses itself/);
  });

  it('refuses a pitch increment larger than the maximum pitch', () => {
    // 6D of a 1/8 in rivet is 0.75 in; 0.9 in is inside the increment's own range (0.01 to 1 in).
    const e = refusal(() => ribStudy({ ...study, maxPitchDiameters: 6, pitchIncrementIn: 0.9 }));
    expect(e.field).toBe('pitchIncrementIn');
    expect(e.reason).toMatch(/larger than the maximum pitch/);
  });

  it('refuses a stall speed above the cruise speed', () => {
    expect(refusal(() => designConditions({ ...kit, stallSpeedKeas: 120 })).field).toBe('kit.stallSpeedKeas');
  });
});
