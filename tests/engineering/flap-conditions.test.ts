import {
  designConditions,
  dynamicPressurePsi,
  envelopeConditions,
  flapConditions,
  flapDesignSpeedKeas,
  negativeEnvelopeCorners,
  type KitInput,
} from '@/server/engineering';
import { normalKit58 } from '../fixtures/rib-study';
import { refusal } from './refusal';

const kit: KitInput = normalKit58;

describe('flaps extended (14 CFR 23.345)', () => {
  const f = flapConditions(kit, { stallSpeedKeas: 40 });

  it('maneuver to a positive limit load factor of 2.0 and gusts of ±25 ft/s at VF', () => {
    // 14 CFR 23.345(a)(1), (a)(2) [C]
    expect(f.loadFactors.maneuver).toBe(2.0);
    expect(f.conditions.map((c) => c.id)).toEqual(['flaps-maneuver-up-vf', 'flaps-gust-up-vf', 'flaps-gust-down-vf']);
    expect(f.rules.join(' ')).toMatch(/23\.345\(a\)/);
  });

  it('take VF not less than 1.4 VS or 1.8 VSF, whichever is greater: 72 kt for VS 45, VSF 40', () => {
    // 14 CFR 23.345(b) [C for the paragraph; the factors 1.4 and 1.8 from memory]
    expect(flapDesignSpeedKeas(45, 40)).toBeCloseTo(72, 12); // 1.8 × 40 = 72 > 1.4 × 45 = 63
    expect(flapDesignSpeedKeas(45, 30)).toBeCloseTo(63, 12); // 1.4 × 45 = 63 > 1.8 × 30 = 54
    expect(f.speeds.designKeas).toBeCloseTo(72, 12);
    expect(f.rules.join(' ')).toMatch(/from memory/);
  });

  it('work the gust at VF with 23.341: n = 1 ± 0.972346 here', () => {
    // 14 CFR 23.341 [C] by hand: W/S = 11 psf, c = 4.8333 ft, a = 4.8, ρ0: μ = 22/(0.0023769·4.8333·4.8·32.174)
    // = 12.39983; Kg = 0.88μ/(5.3 + μ) = 0.616494; Δn = Kg·25·72·4.8/(498·11) = 0.972346
    expect(f.loadFactors.gustUp).toBeCloseTo(1.972346, 4);
    expect(f.loadFactors.gustDown).toBeCloseTo(0.027654, 4);
  });

  it('give each condition its CL needed = nW/(qS) at VF', () => {
    for (const c of f.conditions) {
      expect(c.speedKeas).toBeCloseTo(72, 12);
      expect(c.clNeeded).toBeCloseTo((c.n * 1320) / (dynamicPressurePsi(72) * 120 * 144), 12);
    }
  });

  it('raise a VF below the rule minimum to it, with a warning; keep one above', () => {
    const low = flapConditions(kit, { stallSpeedKeas: 40, designSpeedKeas: 60 });
    expect(low.speeds.designKeas).toBeCloseTo(72, 12);
    expect(low.warnings.join(' ')).toMatch(/below the rule minimum/);
    expect(flapConditions(kit, { stallSpeedKeas: 40, designSpeedKeas: 85 }).speeds.designKeas).toBe(85);
  });

  it('say that the flapped section pressure and the flap itself are not modelled', () => {
    expect(f.warnings.join(' ')).toMatch(/Cp table of the flapped section/);
    expect(f.warnings.join(' ')).toMatch(/23\.345\(d\)/);
  });

  it('refuse a flapped stall speed above the clean one, or out of range, naming the field', () => {
    expect(refusal(() => flapConditions(kit, { stallSpeedKeas: 50 })).field).toBe('flaps.stallSpeedKeas');
    expect(refusal(() => flapConditions(kit, { stallSpeedKeas: 10 })).field).toBe('flaps.stallSpeedKeas');
    expect(refusal(() => flapConditions(kit, { stallSpeedKeas: 40, designSpeedKeas: 1e6 })).field).toBe(
      'flaps.designSpeedKeas',
    );
    expect(refusal(() => flapConditions({ ...kit, weightLb: 1e9 }, { stallSpeedKeas: 40 })).field).toBe('kit.weightLb');
  });
});

describe('the negative corners of the envelope at VC and VD (14 CFR 23.333(d))', () => {
  it('take the negative maneuver factor at VD as 0.0 (normal) and −1.0 (utility, acrobatic)', () => {
    // 14 CFR 23.333(b)(3) [C]: linear from the VC value to 0.0 at VD (normal, commuter), −1.0 (acrobatic, utility)
    expect(negativeEnvelopeCorners(kit).conditions[0]).toMatchObject({ id: 'maneuver-down-vd', n: 0 });
    expect(negativeEnvelopeCorners({ ...kit, category: 'utility' }).conditions[0].n).toBe(-1);
    expect(negativeEnvelopeCorners({ ...kit, category: 'acrobatic' }).conditions[0].n).toBe(-1);
  });

  it('are the more negative of the maneuver and down-gust factors at each speed', () => {
    // 14 CFR 23.333(b)(2), (c), (d) [C]
    const d = designConditions(kit);
    const c = negativeEnvelopeCorners(kit);
    const gustVc = d.conditions.find((x) => x.id === 'gust-down-vc')!.n;
    const gustVd = d.conditions.find((x) => x.id === 'gust-down-vd')!.n;
    expect(c.atCruise.n).toBeCloseTo(Math.min(-1.52, gustVc), 12);
    expect(c.atDive.n).toBeCloseTo(Math.min(0, gustVd), 12);
    expect(c.atCruise.speedKeas).toBeCloseTo(d.speeds.cruiseKeas, 12);
    expect(c.atDive.speedKeas).toBeCloseTo(d.speeds.diveKeas, 12);
    // This light kit's down-gusts are the corners; a heavy acrobatic one's maneuver factor can be.
    expect(c.atCruise.governing).toBe('gust');
    const heavy = negativeEnvelopeCorners({
      ...kit,
      weightLb: 3000,
      wingAreaSqFt: 100,
      meanChordIn: 50,
      category: 'acrobatic',
    });
    expect(heavy.atCruise.governing).toBe('maneuver');
    expect(heavy.atCruise.n).toBe(-3);
  });

  it('leave design-conditions as it was and add only what it lacked', () => {
    const all = envelopeConditions(kit, { stallSpeedKeas: 40 });
    const ids = all.conditions.map((c) => c.id);
    expect(ids.slice(0, 7)).toEqual(designConditions(kit).conditions.map((c) => c.id));
    expect(ids.slice(7)).toEqual([
      'maneuver-down-vd',
      'flaps-maneuver-up-vf',
      'flaps-gust-up-vf',
      'flaps-gust-down-vf',
    ]);
    expect(new Set(ids).size).toBe(ids.length);
    expect(envelopeConditions(kit).conditions).toHaveLength(8);
    expect(all.rules.join(' ')).toMatch(/23\.333\(d\)/);
  });
});
