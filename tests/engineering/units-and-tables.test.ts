import {
  cpFromTables,
  EngineeringInputError,
  inToMm,
  kpaToPsi,
  lbfToN,
  mmToIn,
  nToLbf,
  psfToPsi,
  psiToKpa,
  knotsToFtPerS,
  tradeStudy,
  validateCpTables,
  type TradeCandidate,
} from '@/server/engineering';

describe('unit conversions at the edges', () => {
  it('use the exact definitions: 25.4 mm per inch, 4.4482216152605 N per lbf, 6.894757 kPa per psi', () => {
    expect(inToMm(1)).toBe(25.4);
    expect(lbfToN(1)).toBeCloseTo(4.4482216152605, 12);
    expect(psiToKpa(1)).toBeCloseTo(6.894757293168, 9);
    expect(psfToPsi(144)).toBe(1);
    expect(knotsToFtPerS(100)).toBeCloseTo(168.781, 3);
  });

  it('go there and back without loss', () => {
    expect(mmToIn(inToMm(0.032))).toBeCloseTo(0.032, 14);
    expect(nToLbf(lbfToN(150))).toBeCloseTo(150, 12);
    expect(kpaToPsi(psiToKpa(0.46))).toBeCloseTo(0.46, 14);
  });
});

describe("a supplier's Cp tables", () => {
  const row = (cu: number, cl: number): [number, number, number][] =>
    [0, 0.1, 0.3, 0.6, 1].map((x): [number, number, number] => [x, cu * (1 - x), cl * (1 - x)]);
  const tables = validateCpTables([
    { cl: 0.4, rows: row(-1, 0.2) },
    { cl: 1.2, rows: row(-3, 0.4) },
  ]);

  it('are interpolated in CL between two tables', () => {
    const cp = cpFromTables(tables, 0.8)!;
    expect(cp.upper.find((s) => s.xc === 0.1)!.cp).toBeCloseTo(-2 * 0.9, 12);
    expect(cp.warning).toBeNull();
  });

  it('are scaled up beyond the highest table with a warning that this is not conservative near stall', () => {
    const cp = cpFromTables(tables, 1.5)!;
    expect(cp.upper.find((s) => s.xc === 0.1)!.cp).toBeCloseTo(-3 * 0.9 * 1.25, 12);
    expect(cp.warning).toMatch(/not conservative/);
  });

  it('leave a condition of the other sign to the panel method', () => {
    expect(cpFromTables(tables, -0.5)).toBeNull();
  });

  it('refuse rows out of order or Cp above stagnation, naming the row', () => {
    const bad = (rows: [number, number, number][]) => {
      try {
        validateCpTables([{ cl: 0.5, rows }]);
      } catch (e) {
        return (e as EngineeringInputError).field;
      }
      return null;
    };
    expect(
      bad([
        [0, -1, 0],
        [0.2, -1, 0],
        [0.1, -1, 0],
        [0.5, -1, 0],
        [1, 0, 0],
      ]),
    ).toBe('cpTables[0].rows[2]');
    expect(
      bad([
        [0, -1, 0],
        [0.1, 1.5, 0],
        [0.2, -1, 0],
        [0.5, -1, 0],
        [1, 0, 0],
      ]),
    ).toBe('cpTables[0].rows[1]');
  });
});

describe('the trade study', () => {
  const row = (
    gaugeIn: number,
    rivet: string,
    feasible: boolean,
    weight: number,
    basis: 'coupons' | 'fallback' = 'coupons',
    minutes = 60,
  ): TradeCandidate => ({
    gaugeIn,
    rivet,
    feasible,
    rivetCount: 40,
    flangeWeightLb: weight,
    webWeightLb: 0,
    rivetWeightLb: 0,
    buildMinutes: minutes,
    pullThroughBasis: basis,
  });

  it('ranks the feasible candidates by weight and recommends the lightest', () => {
    const t = tradeStudy([row(0.032, 'A', true, 0.5), row(0.025, 'A', true, 0.4), row(0.016, 'A', false, 0.2)]);
    expect(t.rows.map((r) => r.rank)).toEqual([2, 1, null]);
    expect(t.recommended).toEqual({ gaugeIn: 0.025, rivet: 'A' });
  });

  it('ranks by build time when asked', () => {
    const t = tradeStudy(
      [row(0.032, 'A', true, 0.5, 'coupons', 30), row(0.025, 'A', true, 0.4, 'coupons', 60)],
      'buildTime',
    );
    expect(t.recommended).toEqual({ gaugeIn: 0.032, rivet: 'A' });
  });

  it('puts coupon-backed candidates ahead of the fallback, and says a lighter one may be worth testing', () => {
    const t = tradeStudy([row(0.025, 'A', true, 0.4), row(0.016, 'B', true, 0.2, 'fallback')]);
    expect(t.recommended).toEqual({ gaugeIn: 0.025, rivet: 'A' });
    expect(t.warnings.join(' ')).toMatch(/0.016 in with B would be lighter/);
  });

  it('recommends nothing, and says why, when nothing is feasible', () => {
    const t = tradeStudy([row(0.016, 'A', false, 0.2)]);
    expect(t.recommended).toBeNull();
    expect(t.warnings.join(' ')).toMatch(/no gauge and rivet combination/);
  });
});
