import {
  pitchSchedule,
  type PitchScheduleInput,
  type PitchScheduleResult,
  type StationLoad,
} from '@/server/engineering';
import { refusal } from './refusal';

/** Stations every 0.05 in along a straight line of the given length, with the pull w(x) in lb/in. */
function line(lengthIn: number, pull: (x: number) => number, shear = 0): StationLoad[] {
  const n = Math.round(lengthIn / 0.05);
  return Array.from({ length: n + 1 }, (_, i) => {
    const x = (lengthIn * i) / n;
    return { stationIn: 2 + x, alongIn: x, limitTensionLbPerIn: pull(x), limitShearLbPerIn: shear };
  });
}

const base: Omit<PitchScheduleInput, 'stations'> = {
  line: 'upper',
  material: '6061-T6',
  gaugeIn: 0.032,
  rivetSpec: 'MS20470AD4',
  maxPitchDiameters: 10,
  pitchIncrementIn: 0.125,
  maxZones: 4,
};

// A suction that falls off from the nose aft, as on a lifting upper surface.
const fallingOff = (x: number) => 40 * Math.exp(-x / 6) + 4;

/** The largest pull anywhere between two neighbouring holes, from the stations themselves. */
function largestPullBetween(stations: StationLoad[], a: number, b: number): number {
  return Math.max(
    ...stations.filter((s) => s.alongIn >= a - 0.05 && s.alongIn <= b + 0.05).map((s) => s.limitTensionLbPerIn),
  );
}

function expectEveryGapCarriesItsLoad(s: PitchScheduleResult, stations: StationLoad[]) {
  for (let i = 1; i < s.holes.length; i++) {
    const gap = s.holes[i].alongIn - s.holes[i - 1].alongIn;
    const pull = largestPullBetween(stations, s.holes[i - 1].alongIn, s.holes[i].alongIn);
    expect(pull * gap).toBeLessThanOrEqual(s.allowables.tensionLimitLb + 1e-9);
    expect(1.5 * pull * gap).toBeLessThanOrEqual(s.allowables.tensionUltimateLb + 1e-9);
  }
}

describe('a pitch schedule', () => {
  const stations = line(30, fallingOff);
  const s = pitchSchedule({ ...base, stations });

  it('never spaces two rivets wider than the load between them allows, at limit or at ultimate', () => {
    expect(s.feasible).toBe(true);
    expectEveryGapCarriesItsLoad(s, stations);
  });

  it('gives every rivet a margin of safety of zero or more', () => {
    for (const h of s.holes) {
      expect(h.msLimit).toBeGreaterThanOrEqual(0);
      expect(h.msUltimate).toBeGreaterThanOrEqual(0);
    }
  });

  it('keeps every pitch between 3D and the maximum pitch', () => {
    for (let i = 1; i < s.holes.length; i++) {
      const gap = s.holes[i].alongIn - s.holes[i - 1].alongIn;
      expect(gap).toBeGreaterThanOrEqual(0.375 - 1e-9);
      expect(gap).toBeLessThanOrEqual(1.25 + 1e-9);
    }
  });

  it('places the first and last hole at the edge distance from the line ends', () => {
    expect(s.holes[0].alongIn).toBeCloseTo(0.25, 10);
    expect(s.holes[s.holes.length - 1].alongIn).toBeCloseTo(30 - 0.25, 10);
    expect(s.holes[0].stationIn).toBeCloseTo(2.25, 10);
  });

  it('uses at most the zones allowed, closest at the nose and opening aft, each on the increment or at 3D', () => {
    expect(s.zones.length).toBeGreaterThan(1);
    expect(s.zones.length).toBeLessThanOrEqual(4);
    for (let i = 1; i < s.zones.length; i++) {
      expect(s.zones[i].pitchIn).toBeGreaterThan(s.zones[i - 1].pitchIn);
      expect(s.zones[i].fromAlongIn).toBeCloseTo(s.zones[i - 1].toAlongIn, 12);
    }
    for (const z of s.zones)
      expect(z.pitchIn === 0.375 || Math.abs(z.pitchIn / 0.125 - Math.round(z.pitchIn / 0.125)) < 1e-9).toBe(true);
  });

  it("counts every hole in exactly one zone and reports each zone's worst rivet", () => {
    expect(s.zones.reduce((n, z) => n + z.count, 0)).toBe(s.holes.length);
    const lowest = (ms: (number | null)[]) => Math.min(...ms.map((m) => m ?? Infinity));
    s.zones.forEach((z, i) => {
      const holes = s.holes.filter((h) => h.zone === i);
      expect(holes).toHaveLength(z.count);
      expect(lowest([z.msLimit, z.msUltimate])).toBeCloseTo(
        Math.min(...holes.map((h) => lowest([h.msLimit, h.msUltimate]))),
        12,
      );
    });
  });

  it('names the holes from the line: U-01, U-02 …', () => {
    expect(s.holes.slice(0, 3).map((h) => h.id)).toEqual(['U-01', 'U-02', 'U-03']);
    expect(pitchSchedule({ ...base, line: 'spar cap', stations }).holes[0].id).toBe('SC-01');
  });

  it('carries its inputs, rules, warnings and the caution', () => {
    expect(s.inputs.stations).toBe(stations);
    expect(s.rules.join(' ')).toMatch(/1\.5 × limit load ≤ ultimate allowable/);
    expect(s.warnings.join(' ')).toMatch(/no coupon data/);
    expect(s.caution).toMatch(/nothing here is certification/i);
  });
});

describe('grouping into zones', () => {
  it('makes one zone of a uniform load', () => {
    const s = pitchSchedule({ ...base, stations: line(12, () => 20) });
    expect(s.zones).toHaveLength(1);
  });

  it('spaces an unloaded line at the maximum pitch', () => {
    const s = pitchSchedule({ ...base, stations: line(12, () => 0) });
    expect(s.zones).toHaveLength(1);
    expect(s.zones[0].pitchIn).toBeCloseTo(1.25, 12);
    expect(s.zones[0].msLimit).toBeNull();
  });

  it('takes the closest pitch any station needs when only one zone is allowed', () => {
    const one = pitchSchedule({ ...base, stations: line(30, fallingOff), maxZones: 1 });
    const four = pitchSchedule({ ...base, stations: line(30, fallingOff), maxZones: 4 });
    expect(one.zones).toHaveLength(1);
    expect(one.zones[0].pitchIn).toBe(four.zones[0].pitchIn);
    expect(one.holes.length).toBeGreaterThan(four.holes.length);
  });

  it('rounds the pitch down to the increment', () => {
    // 20 lb/in on AD4 in 0.032 in (fallback allowables): the exact need is not a multiple of 0.25 in.
    const s = pitchSchedule({ ...base, stations: line(12, () => 20), pitchIncrementIn: 0.25 });
    const need = Math.min(s.allowables.tensionLimitLb / 20, s.allowables.tensionUltimateLb / 30);
    expect(need % 0.25).toBeGreaterThan(0.01);
    expect(s.zones[0].pitchIn).toBeLessThanOrEqual(need);
    expect(need - s.zones[0].pitchIn).toBeLessThan(0.25);
    expect(s.zones[0].pitchIn % 0.25).toBeCloseTo(0, 12);
  });

  it('follows the closest-pitch station into the middle of the line when the load peaks there', () => {
    const stations = line(30, (x) => 4 + 40 * Math.exp(-(((x - 15) / 3) ** 2)));
    const s = pitchSchedule({ ...base, stations });
    const tightest = s.zones.reduce((a, z) => (z.pitchIn < a.pitchIn ? z : a));
    expect(tightest.fromAlongIn).toBeLessThan(15);
    expect(tightest.toAlongIn).toBeGreaterThan(15);
    expectEveryGapCarriesItsLoad(s, stations);
  });
});

describe('a gauge or rivet that cannot carry the load', () => {
  const s = pitchSchedule({ ...base, stations: line(12, (x) => (x < 3 ? 400 : 5)) });

  it('is reported insufficient, with where and what pitch it would need', () => {
    expect(s.feasible).toBe(false);
    expect(s.insufficient).toHaveLength(1);
    expect(s.insufficient[0].fromIn).toBeCloseTo(2, 6);
    expect(s.insufficient[0].neededPitchIn).toBeLessThan(0.375);
    expect(s.reasons[0]).toMatch(/insufficient/);
  });

  it('is still drawn at the minimum pitch there, with its negative margins', () => {
    expect(s.zones[0].pitchIn).toBeCloseTo(0.375, 12);
    expect(s.zones[0].msLimit).toBeLessThan(0);
  });
});

describe('skin shear from wing torque', () => {
  it('limits the pitch by the combined tension and shear rule', () => {
    const tensionOnly = pitchSchedule({ ...base, stations: line(12, () => 8) });
    const withShear = pitchSchedule({ ...base, stations: line(12, () => 8, 250) });
    expect(withShear.zones[0].pitchIn).toBeLessThan(tensionOnly.zones[0].pitchIn);
    for (const h of withShear.holes) expect(h.msLimit).toBeGreaterThanOrEqual(0);
  });
});

describe('schedule settings', () => {
  const stations = line(12, () => 10);

  it('refuse a pitch increment larger than the maximum pitch', () => {
    expect(refusal(() => pitchSchedule({ ...base, stations, pitchIncrementIn: 2 })).field).toBe('pitchIncrementIn');
  });

  it('refuse a maximum pitch below the 3D minimum', () => {
    expect(refusal(() => pitchSchedule({ ...base, stations, maxPitchDiameters: 2 })).field).toBe('maxPitchDiameters');
  });

  it('refuse zero zones', () => {
    expect(refusal(() => pitchSchedule({ ...base, stations, maxZones: 0 })).field).toBe('maxZones');
  });

  it('refuse stations out of order along the line', () => {
    const shuffled = [stations[0], stations[2], stations[1], ...stations.slice(3)];
    expect(refusal(() => pitchSchedule({ ...base, stations: shuffled })).field).toBe('stations[2].alongIn');
  });

  it('report a line too short for the edge distance at both ends', () => {
    const s = pitchSchedule({ ...base, stations: line(0.4, () => 1) });
    expect(s.holes).toHaveLength(0);
    expect(s.feasible).toBe(false);
  });
});

describe('the end rivets of a line (issue 9)', () => {
  // Coupons fix the allowables at 10 lb limit and 15 lb ultimate (1.5 × 10: both criteria alike).
  const coupons = [
    { material: '6061-T6', gaugeIn: 0.032, rivetSpec: 'MS20470AD4', loadLb: 10, outcome: 'no_deformation' as const },
    {
      material: '6061-T6',
      gaugeIn: 0.032,
      rivetSpec: 'MS20470AD4',
      loadLb: 15,
      outcome: 'slight_deformation' as const,
    },
  ];
  const stations = line(6, () => 22);
  const s = pitchSchedule({ ...base, stations, coupons, pitchIncrementIn: 0.01, maxZones: 3 });

  it('give the first rivet its real share, the 0.25 in ahead of it as well as half the gap behind it: 9.9 lb', () => {
    // By hand: 22 lb/in uniform; a rivet may carry 10 lb, so 10/22 = 0.4545 in of line. Inside the line
    // that is a pitch of 0.45 in (on the 0.01 in increment). The first rivet sits at the 0.25 in (2D) edge
    // distance and carries 0.25 + p/2: p ≤ 2·(0.4545 − 0.25) = 0.409 → 0.40 in, a share of
    // 0.25 + 0.20 = 0.45 in and 22 × 0.45 = 9.9 lb (MS 10/9.9 − 1 = 0.0101). Taking its share as one
    // gap, the old way, a 0.45 in first gap looked like 9.9 lb but carried 22 × 0.475 = 10.45 lb.
    const [h0, h1] = s.holes;
    expect(h0.alongIn).toBeCloseTo(0.25, 10);
    expect(h1.alongIn - h0.alongIn).toBeCloseTo(0.4, 10);
    expect(h0.tributaryIn).toBeCloseTo(0.45, 10);
    expect(h0.appliedLimitLb).toBeCloseTo(9.9, 10);
    expect(h0.msLimit).toBeCloseTo(10 / 9.9 - 1, 10);
  });

  it('hold the first and last gaps to what the end rivets carry, and open up to 0.45 in between', () => {
    expect(s.feasible).toBe(true);
    expect(s.zones.map((z) => z.pitchIn)).toEqual([0.4, 0.45, 0.4]);
    const n = s.holes.length;
    expect(s.holes[n - 1].alongIn).toBeCloseTo(6 - 0.25, 10);
    expect(s.holes[n - 1].tributaryIn).toBeCloseTo(0.25 + (s.holes[n - 1].alongIn - s.holes[n - 2].alongIn) / 2, 10);
    for (const h of s.holes) expect(h.msLimit!).toBeGreaterThanOrEqual(-1e-9);
  });

  it('make the shares add up to the whole line', () => {
    expect(s.holes.reduce((a, h) => a + h.tributaryIn, 0)).toBeCloseTo(6, 10);
  });

  it('call the gauge insufficient when even the 3D minimum overloads the first rivet', () => {
    // 25 lb/in: 0.4 in per rivet; the first carries at least 0.25 + 0.375/2 = 0.4375 in = 10.9 lb.
    const over = pitchSchedule({ ...base, stations: line(6, () => 25), coupons, pitchIncrementIn: 0.01, maxZones: 3 });
    expect(over.feasible).toBe(false);
    expect(over.reasons.join(' ')).toMatch(/the first rivet carries the pull over the 0\.250 in edge distance/);
    expect(over.holes[0].msLimit!).toBeLessThan(0);
  });
});
