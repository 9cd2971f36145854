import {
  designConditions,
  dynamicPressurePsi,
  estimatedWingLiftSlope,
  gustVelocitiesFps,
  type KitInput,
} from '@/server/engineering';
import { normalKit58 } from '../fixtures/rib-study';
import { refusal } from './refusal';

const kit: KitInput = normalKit58;

describe('design conditions of a kit', () => {
  const d = designConditions(kit);

  it('cover both maneuver corners, the gusts at VC and VD both ways and the negative maneuver', () => {
    expect(d.conditions.map((c) => c.id)).toEqual([
      'maneuver-up-va',
      'maneuver-up-vd',
      'gust-up-vc',
      'gust-up-vd',
      'maneuver-down-vc',
      'gust-down-vc',
      'gust-down-vd',
    ]);
  });

  it('ask each condition for CL = nW/(qS), with q in psi', () => {
    for (const c of d.conditions) {
      expect(c.qPsi).toBeCloseTo(dynamicPressurePsi(c.speedKeas), 12);
      expect(c.clNeeded).toBeCloseTo((c.n * kit.weightLb) / (c.qPsi * kit.wingAreaSqFt * 144), 12);
    }
  });

  it('put the positive maneuver at VA exactly at the stall CL, W/(qS) at the stall speed', () => {
    const va = d.conditions.find((c) => c.id === 'maneuver-up-va')!;
    expect(va.clNeeded).toBeCloseTo(
      kit.weightLb / (dynamicPressurePsi(kit.stallSpeedKeas) * kit.wingAreaSqFt * 144),
      10,
    );
  });

  it('use the rule minimum cruise and dive speeds when none are given', () => {
    expect(d.speeds.cruiseKeas).toBeCloseTo(d.speeds.cruiseMinKeas, 12);
    expect(d.speeds.diveKeas).toBeCloseTo(d.speeds.diveMinKeas, 12);
  });

  it('carry the inputs, the rules applied, the warnings and the caution', () => {
    expect(d.inputs).toBe(kit);
    expect(d.rules.join(' ')).toMatch(/23\.337/);
    expect(d.caution).toMatch(/aid only/);
  });
});

describe('speeds given by the supplier', () => {
  it('are kept when above the rule minimums', () => {
    const d = designConditions({ ...kit, cruiseSpeedKeas: 140, diveSpeedKeas: 200 });
    expect(d.speeds.cruiseKeas).toBe(140);
    expect(d.speeds.diveKeas).toBe(200);
  });

  it('are raised to the rule minimum with a warning when below it', () => {
    const d = designConditions({ ...kit, cruiseSpeedKeas: 90 });
    expect(d.speeds.cruiseKeas).toBeCloseTo(d.speeds.cruiseMinKeas, 12);
    expect(d.warnings.join(' ')).toMatch(/below the rule minimum/);
  });

  it('never put VA above VC', () => {
    const d = designConditions({ ...kit, stallSpeedKeas: 70, cruiseSpeedKeas: 125 });
    expect(d.speeds.maneuveringKeas).toBeLessThanOrEqual(d.speeds.cruiseKeas);
  });

  it('refuse a dive speed not above the cruise speed', () => {
    expect(refusal(() => designConditions({ ...kit, cruiseSpeedKeas: 140, diveSpeedKeas: 130 })).field).toBe(
      'kit.diveSpeedKeas',
    );
  });

  it('refuse a stall speed above the minimum cruise speed when no cruise speed is given', () => {
    expect(refusal(() => designConditions({ ...kit, stallSpeedKeas: 150 })).field).toBe('kit.stallSpeedKeas');
  });
});

describe('the gust formula inputs', () => {
  it('estimate the lift slope from the aspect ratio when not given, and say so', () => {
    const { liftSlopePerRad, ...rest } = kit;
    void liftSlopePerRad;
    const d = designConditions(rest);
    const ar = (120 * 144) / (58 * 58);
    expect(d.gust.liftSlopePerRad).toBeCloseTo(estimatedWingLiftSlope(ar), 12);
    expect(d.gust.liftSlopePerRad).toBeLessThan(2 * Math.PI);
    expect(d.warnings.join(' ')).toMatch(/lift slope not given/);
  });

  it('reduce the gust velocities linearly above 20 000 ft to half at 50 000 ft', () => {
    // 14 CFR 23.333(c) [C]
    expect(gustVelocitiesFps(20000)).toEqual({ atCruise: 50, atDive: 25 });
    expect(gustVelocitiesFps(35000)).toEqual({ atCruise: 37.5, atDive: 18.75 });
  });

  it('use the thinner air at altitude, which raises the gust factor', () => {
    const low = designConditions(kit).conditions.find((c) => c.id === 'gust-up-vc')!.n;
    const high = designConditions({ ...kit, altitudeFt: 10000 }).conditions.find((c) => c.id === 'gust-up-vc')!.n;
    expect(high).toBeGreaterThan(low);
  });

  it('refuse an unknown category', () => {
    expect(refusal(() => designConditions({ ...kit, category: 'sporty' as KitInput['category'] })).field).toBe(
      'kit.category',
    );
  });
});
