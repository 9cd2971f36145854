import {
  chordAt,
  planformGeometry,
  schrenkDistribution,
  schrenkLiftRatio,
  schrenkStation,
  stationEta,
  type PlanformInput,
} from '@/server/engineering';
import { refusal } from './refusal';

// Spanwise lift by Schrenk's approximation: O. Schrenk, NACA TM 948 (1940) [C, values computed from
// its definition: lift per unit span ∝ ½(c + c_elliptic)].

const rectangle: PlanformInput = { kind: 'rectangle', spanIn: 360, chordIn: 54 };
const tapered: PlanformInput = { kind: 'tapered', spanIn: 360, rootChordIn: 60, tipChordIn: 30 };

describe("Schrenk's section cl / wing CL", () => {
  it('is ½(1 + 4/π·√(1 − η²)) on a rectangular wing: 1.13662 at the root, 0.77750 at η = 0.9', () => {
    // Schrenk, NACA TM 948 [C, values computed]
    expect(schrenkLiftRatio(rectangle, 0)).toBeCloseTo(1.13662, 5);
    expect(schrenkLiftRatio(rectangle, 0.9)).toBeCloseTo(0.7775, 5);
  });

  it('gives a tapered wing the values worked by hand from the definition', () => {
    // Schrenk, NACA TM 948 [C, values computed by hand]. Root 60 in, tip 30 in, span 360 in:
    // c̄ = S/b = (60 + 30)/2 = 45 in; c(η) = 60·(1 − 0.5η); c_e/c̄ = (4/π)·√(1 − η²), 4/π = 1.27323954.
    //   η = 0:   c/c̄ = 60/45 = 1.33333333; c_e/c̄ = 1.27323954;
    //            cl/CL = ½(1.33333333 + 1.27323954)/1.33333333 = 1.30328644 × 0.75 = 0.97746483
    //   η = 0.5: c = 45, c/c̄ = 1; √0.75 = 0.86602540, c_e/c̄ = 1.10265779;
    //            cl/CL = ½(1 + 1.10265779) = 1.05132890
    //   η = 0.9: c = 33, c/c̄ = 0.73333333; √0.19 = 0.43588989, c_e/c̄ = 0.55499224;
    //            cl/CL = ½(0.73333333 + 0.55499224)/0.73333333 = 0.64416279/0.73333333 = 0.87840380
    //   η = 1:   c_e = 0, cl/CL = ½ whatever the taper
    expect(schrenkLiftRatio(tapered, 0)).toBeCloseTo(0.97746483, 7);
    expect(schrenkLiftRatio(tapered, 0.5)).toBeCloseTo(1.0513289, 7);
    expect(schrenkLiftRatio(tapered, 0.9)).toBeCloseTo(0.8784038, 7);
    expect(schrenkLiftRatio(tapered, 1)).toBeCloseTo(0.5, 12);
  });

  it('loads the wing with exactly its lift: ∫ c·(cl/CL) dy over the span is the wing area', () => {
    // From the definition: ∫c dy = S and ∫c_e dy = S, so ∫½(c + c_e) dy = S (Simpson, 2000 strips).
    for (const planform of [rectangle, tapered]) {
      const p = planformGeometry(planform);
      const n = 2000;
      let sum = 0;
      for (let i = 0; i <= n; i++) {
        const eta = i / n;
        const w = i === 0 || i === n ? 1 : i % 2 ? 4 : 2;
        sum += w * schrenkStation(planform, eta).schrenkChordIn;
      }
      const halfArea = (sum / (3 * n)) * (p.spanIn / 2);
      expect(2 * halfArea).toBeCloseTo(p.areaSqIn, 0);
      expect(Math.abs(2 * halfArea - p.areaSqIn) / p.areaSqIn).toBeLessThan(1e-4);
    }
  });

  it('gives every station its chord, the elliptic chord and the load grading', () => {
    const s = schrenkStation(tapered, 0.5);
    expect(s.chordIn).toBeCloseTo(45, 12);
    expect(s.yIn).toBeCloseTo(90, 12);
    expect(s.schrenkChordIn).toBeCloseTo((s.chordIn + s.ellipticChordIn) / 2, 12);
    expect(s.loadRatio).toBeCloseTo(s.schrenkChordIn / 45, 12);
    expect(chordAt(planformGeometry(tapered), 1)).toBe(30);
  });

  it('takes a rib station in inches from the centre line as η = 2y/b', () => {
    const p = planformGeometry(rectangle);
    expect(stationEta(p, 90)).toBeCloseTo(0.5, 12);
    expect(refusal(() => stationEta(p, 200, 'ribs[3].stationIn')).field).toBe('ribs[3].stationIn');
  });

  it('states the rule and its assumptions, and warns close to the tip', () => {
    const d = schrenkDistribution(tapered, [0, 0.5, 0.97]);
    expect(d.stations).toHaveLength(3);
    expect(d.rules.join(' ')).toMatch(/NACA TM 948/);
    expect(d.rules.join(' ')).toMatch(/untwisted/);
    expect(d.warnings.join(' ')).toMatch(/close to the tip/);
    expect(d.caution).toMatch(/aid only/);
  });
});

describe('planform bounds', () => {
  it.each([
    ['a span below 60 in', { ...rectangle, spanIn: 59 }, 'planform.spanIn'],
    ['a span above 1,200 in', { ...rectangle, spanIn: 1201, chordIn: 60 }, 'planform.spanIn'],
    ['a chord of 1e6 in', { ...rectangle, chordIn: 1e6 }, 'planform.chordIn'],
    ['a root chord of 2 in', { ...tapered, rootChordIn: 2 }, 'planform.rootChordIn'],
    ['a pointed tip', { ...tapered, tipChordIn: 4 }, 'planform.tipChordIn'],
    ['inverse taper', { ...tapered, tipChordIn: 70 }, 'planform.tipChordIn'],
    ['a plank: aspect ratio 1.2', { kind: 'rectangle', spanIn: 72, chordIn: 60 }, 'planform.spanIn'],
    ['an unknown kind', { kind: 'delta', spanIn: 360 }, 'planform.kind'],
  ] as const)('refuses %s, naming the field', (_what, planform, field) => {
    expect(refusal(() => schrenkLiftRatio(planform as PlanformInput, 0.5)).field).toBe(field);
  });

  it.each([-0.01, 1.01, NaN])('refuses η = %p', (eta) => {
    expect(refusal(() => schrenkLiftRatio(rectangle, eta)).field).toBe('eta');
  });

  it('refuses more stations than it takes, naming the list', () => {
    expect(
      refusal(() =>
        schrenkDistribution(
          rectangle,
          Array.from({ length: 201 }, () => 0.5),
        ),
      ).field,
    ).toBe('etas');
    expect(refusal(() => schrenkDistribution(rectangle, [0.2, 2])).field).toBe('etas[1]');
  });
});
