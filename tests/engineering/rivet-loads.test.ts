import { interpolateCp, loadEnvelope, type CpSample } from '@/server/engineering';

// The pull on a rib's fastener line per inch of pitch, T/s = max(0, Cp,int − Cp)·q·b (the chain's step 5:
// the net outward pressure on the skin times its tributary width). With Cp linear between samples the
// values below are exact by hand.

const q = 0.5; // psi
const b = 10; // in

// Cp = −2(1 − x/c) on the upper surface: suction falling off linearly from the nose.
const linear: CpSample[] = [0, 0.25, 0.5, 0.75, 1].map((xc) => ({ xc, cp: -2 * (1 - xc) }));
// A peak at 0.2 (Cp −1.5) between zero at the nose and the tail.
const peaked: CpSample[] = [
  { xc: 0, cp: 0 },
  { xc: 0.2, cp: -1.5 },
  { xc: 1, cp: 0 },
];

describe('the load envelope along a fastener line', () => {
  it('pulls with max(0, Cp,int − Cp)·q·b at every station, from pressure samples read in step', () => {
    const xcs = [0.1, 0.3, 0.6, 0.9];
    const env = loadEnvelope(xcs, [{ id: 'linear', qPsi: q, cpSamples: linear }], 0, b);
    // −Cp = 2(1 − x): 1.8, 1.4, 0.8, 0.2 → × 0.5 psi × 10 in
    [9, 7, 4, 1].forEach((w, i) => expect(env[i].limitLbPerIn).toBeCloseTo(w, 12));
    env.forEach((e) => expect(e.governing).toBe('linear'));
  });

  it('reads the samples the same whichever way the stations run (back towards the nose, or jumping about)', () => {
    const xcs = [0.9, 0.6, 0.05, 0.2, 0.95, 0.1];
    const env = loadEnvelope(xcs, [{ id: 'peak', qPsi: q, cpSamples: peaked }], 0, b);
    // −Cp = 7.5x up to 0.2, then 1.5(1 − x)/0.8
    const exact = xcs.map((x) => (x <= 0.2 ? 7.5 * x : (1.5 * (1 - x)) / 0.8) * q * b);
    env.forEach((e, i) => expect(e.limitLbPerIn).toBeCloseTo(exact[i], 12));
  });

  it('takes the larger pull of two conditions at each station, and the same from a function as from samples', () => {
    const xcs = [0.1, 0.2, 0.5, 0.9];
    const cpOf = (s: CpSample[]) => (xc: number) => {
      const k = s.findIndex((p, j) => j > 0 && xc <= p.xc);
      const [a, c] = [s[k - 1], s[k]];
      return a.cp + ((c.cp - a.cp) * (xc - a.xc)) / (c.xc - a.xc);
    };
    const fromSamples = loadEnvelope(
      xcs,
      [
        { id: 'linear', qPsi: q, cpSamples: linear },
        { id: 'peak', qPsi: q, cpSamples: peaked },
      ],
      0,
      b,
    );
    const fromFunctions = loadEnvelope(
      xcs,
      [
        { id: 'linear', qPsi: q, cpAt: cpOf(linear) },
        { id: 'peak', qPsi: q, cpAt: cpOf(peaked) },
      ],
      0,
      b,
    );
    // at 0.1: linear 9 lb/in, peak 3.75; at 0.2: linear 8, peak 7.5; at 0.5: 5 vs 4.6875; at 0.9: 1 vs 0.9375
    expect(fromSamples.map((e) => e.governing)).toEqual(['linear', 'linear', 'linear', 'linear']);
    [9, 8, 5, 1].forEach((w, i) => {
      expect(fromSamples[i].limitLbPerIn).toBeCloseTo(w, 12);
      expect(fromFunctions[i].limitLbPerIn).toBeCloseTo(w, 12);
    });
  });

  it('reads samples whose x/c dips back at the nose (a cambered upper surface) as interpolateCp reads them', () => {
    // x/c runs 0, 0.001, then back to −0.002 before the surface turns aft: past the dip the envelope walks
    // the samples in step, short of it it leaves the reading to interpolateCp; either way the same pull.
    const dipped: CpSample[] = [
      { xc: 0, cp: -1 },
      { xc: 0.001, cp: -1.5 },
      { xc: -0.002, cp: -2 },
      { xc: 0.2, cp: -1 },
      { xc: 1, cp: 0 },
    ];
    const xcs = [0, 0.0005, 0.1, 0.6, 1];
    const env = loadEnvelope(xcs, [{ id: 'dip', qPsi: q, cpSamples: dipped }], 0, b);
    env.forEach((e, i) => expect(e.limitLbPerIn).toBe(Math.max(0, 0 - interpolateCp(dipped, xcs[i])) * q * b));
    // Past the dip, linear between the samples either side of it (by hand): Cp(0.1) = −2 + 0.102/0.202, Cp(0.6) = −0.5.
    expect(env[2].limitLbPerIn).toBeCloseTo((2 - 0.102 / 0.202) * q * b, 12);
    expect(env[3].limitLbPerIn).toBeCloseTo(0.5 * q * b, 12);
  });

  it('has no pull and no governing condition where the inside pressure matches the outside suction', () => {
    // Cp,int = −2 (a vented wing at the nose suction): nothing pulls anywhere.
    const env = loadEnvelope([0, 0.5, 1], [{ id: 'linear', qPsi: q, cpSamples: linear }], -2, b);
    env.forEach((e) => {
      expect(e.limitLbPerIn).toBe(0);
      expect(e.governing).toBeNull();
    });
  });
});
