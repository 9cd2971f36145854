import { luFactor, luSolve, SingularMatrixError, solveLinear } from '@/server/engineering';
import { luFactorInPlace } from '@/server/engineering/linear-solve';

describe('LU with partial pivoting', () => {
  it('solves a system whose first pivot is zero', () => {
    const x = solveLinear(
      [
        [0, 2, 1],
        [1, 1, 1],
        [2, 1, 3],
      ],
      [7, 6, 13],
    );
    [1, 2, 3].forEach((v, i) => expect(x[i]).toBeCloseTo(v, 12));
  });

  it('solves a large random system to a small residual, and reuses its factors for a second right-hand side', () => {
    const n = 120;
    let seed = 7;
    const rand = () => (seed = (seed * 16807) % 2147483647) / 2147483647 - 0.5;
    const a = Array.from({ length: n }, () => Array.from({ length: n }, rand));
    const f = luFactor(a);
    for (const b of [Array.from({ length: n }, rand), Array.from({ length: n }, rand)]) {
      const x = luSolve(f, b);
      const residual = Math.max(...a.map((row, i) => Math.abs(row.reduce((s, v, j) => s + v * x[j], 0) - b[i])));
      expect(residual).toBeLessThan(1e-10);
    }
  });

  it("factors a matrix handed over in place to the very factors a copy gives (the panel method's way)", () => {
    // The first-pivot-zero system above: x = (1, 2, 3).
    const rows = [
      [0, 2, 1],
      [1, 1, 1],
      [2, 1, 3],
    ];
    const handed = Float64Array.from(rows.flat());
    const f = luFactorInPlace(handed, 3);
    expect(f.lu).toBe(handed);
    const copied = luFactor(rows);
    expect(Array.from(f.lu)).toEqual(Array.from(copied.lu));
    expect(Array.from(f.perm)).toEqual(Array.from(copied.perm));
    const x = luSolve(f, [7, 6, 13]);
    [1, 2, 3].forEach((v, i) => expect(x[i]).toBeCloseTo(v, 12));
  });

  it('refuses a singular matrix', () => {
    expect(() =>
      luFactor([
        [1, 2],
        [2, 4],
      ]),
    ).toThrow(SingularMatrixError);
  });

  it('does not change the matrix it is given', () => {
    const a = new Float64Array([4, 3, 6, 3]);
    luFactor(a, 2);
    expect(Array.from(a)).toEqual([4, 3, 6, 3]);
  });
});
