import {
  buildAirfoil,
  closeTrailingEdge,
  cosineSpacing,
  degToRad,
  liftCoefficientAt,
  solvePanelMethod,
  nacaGeometry,
  normaliseCoordinates,
  parseNacaDesignation,
  type Point,
} from '@/server/engineering';
import { refusal } from './refusal';

const naca2412 = nacaGeometry('2412', 60).points;

describe('NACA sections', () => {
  it('reads 4- and 5-digit designations with or without the NACA prefix', () => {
    expect(parseNacaDesignation('naca 2412').name).toBe('NACA 2412');
    expect(parseNacaDesignation('23015').thickness).toBeCloseTo(0.15, 12);
  });

  it('gives the 23012 its 1.84 % camber at 15 % chord', () => {
    // NACA Report 824 5-digit mean line 230 (from memory: maximum camber about 1.84 % at 0.15c)
    const line = parseNacaDesignation('23012').meanLine;
    const xs = Array.from({ length: 1001 }, (_, i) => i / 1000);
    const peak = xs.reduce((a, x) => (line.camber(x).yc > line.camber(a).yc ? x : a), 0);
    expect(peak).toBeCloseTo(0.15, 2);
    expect(line.camber(peak).yc).toBeCloseTo(0.0184, 4);
  });

  it.each(['24A2', '2412x', '23112', '26012', '2400'])('refuses "%s"', (designation) => {
    expect(refusal(() => parseNacaDesignation(designation)).field).toBe('airfoil.designation');
  });

  it('bunches the stations at the nose and the tail', () => {
    const x = cosineSpacing(20);
    expect(x[0]).toBe(0);
    expect(x[20]).toBe(1);
    expect(x[1] - x[0]).toBeLessThan(x[11] - x[10]);
  });

  it('builds the contour from the trailing edge over the upper surface to the nose and back underneath', () => {
    const g = nacaGeometry('2412', 60);
    expect(g.points).toHaveLength(61);
    expect(g.points[g.leadingEdgeIndex]).toEqual([0, 0]);
    expect(g.points[10][1]).toBeGreaterThan(0);
    expect(g.points[50][1]).toBeLessThan(0);
  });

  it('refuses an odd number of panels', () => {
    expect(refusal(() => buildAirfoil({ kind: 'naca', designation: '0012' }, 61)).field).toBe('panels');
  });
});

describe('closing the trailing edge', () => {
  it('makes both ends meet at the old gap midpoint and leaves the nose alone', () => {
    const open = nacaGeometry('0012', 40);
    const closed = closeTrailingEdge(open.points, open.leadingEdgeIndex);
    expect(closed[0]).toEqual(closed[closed.length - 1]);
    expect(closed[0][1]).toBeCloseTo(0, 12);
    expect(closed[open.leadingEdgeIndex]).toEqual(open.points[open.leadingEdgeIndex]);
    expect(Math.abs(closed[15][1] - open.points[15][1])).toBeLessThan(1e-4);
  });
});

describe('uploaded coordinates', () => {
  it('are normalised to unit chord whatever their scale, position and rotation', () => {
    const angle = 0.2;
    const moved = naca2412.map(([x, y]): Point => [
      50 + 60 * (x * Math.cos(angle) - y * Math.sin(angle)),
      -3 + 60 * (x * Math.sin(angle) + y * Math.cos(angle)),
    ]);
    const { contour } = normaliseCoordinates(moved);
    contour.forEach(([x, y], i) => {
      expect(x).toBeCloseTo(naca2412[i][0], 6);
      expect(y).toBeCloseTo(naca2412[i][1], 6);
    });
  });

  it('are accepted listed clockwise, and turned to go over the upper surface first', () => {
    const { contour } = normaliseCoordinates([...naca2412].reverse());
    expect(contour[10][1]).toBeGreaterThan(0);
  });

  it('are accepted as two surfaces each from the nose to the tail', () => {
    const le = 30;
    const upper = naca2412.slice(0, le + 1).reverse();
    const lower = naca2412.slice(le);
    const { contour } = normaliseCoordinates([...upper, ...lower]);
    expect(contour).toHaveLength(naca2412.length);
    expect(contour[0][0]).toBeCloseTo(naca2412[0][0], 6);
  });

  it('are re-panelled to the panel count asked for and keep their shape', () => {
    const a = buildAirfoil({ kind: 'coordinates', points: nacaGeometry('2412', 40).points }, 160);
    expect(a.points).toHaveLength(161);
    // Upper-surface ordinate at x, linear between the points (they run from the trailing edge to the nose).
    const upperY = (pts: Point[], le: number, x: number) => {
      for (let i = 0; i < le; i++) {
        const [x0, y0] = pts[i + 1];
        const [x1, y1] = pts[i];
        if (x0 <= x && x <= x1) return y0 + ((y1 - y0) * (x - x0)) / (x1 - x0);
      }
      return NaN;
    };
    const reference = buildAirfoil({ kind: 'naca', designation: '2412' }, 400); // closed, like the re-panelled one
    for (const x of [0.02, 0.1, 0.3, 0.6, 0.9]) {
      expect(upperY(a.points, a.leadingEdgeIndex, x)).toBeCloseTo(
        upperY(reference.points, reference.leadingEdgeIndex, x),
        3,
      );
    }
  });

  it('warn about a trailing edge open by more than half a percent of chord', () => {
    const open = naca2412.map(([x, y], i): Point => [x, i < 30 ? y + 0.004 * x : y - 0.004 * x]);
    expect(buildAirfoil({ kind: 'coordinates', points: open }, 60).warnings.join(' ')).toMatch(/open by/);
  });

  it('refuse an outline that is not a closed contour', () => {
    const open = naca2412.map(([x, y], i): Point => [x, i < 30 ? y + 0.03 * x : y - 0.03 * x]);
    const e = refusal(() => normaliseCoordinates(open));
    expect(e.field).toBe('airfoil.points');
    expect(e.reason).toMatch(/not a closed contour/);
  });

  it('refuse points that are not pairs of numbers, naming the point', () => {
    const bad = [...naca2412] as unknown[];
    bad[4] = [0.5, 'x'];
    expect(refusal(() => normaliseCoordinates(bad)).field).toBe('airfoil.points[4]');
  });

  it('refuse an outline with no area', () => {
    const flat = Array.from({ length: 12 }, (_, i): Point => [Math.abs(1 - i / 5.5), 0]);
    expect(refusal(() => normaliseCoordinates(flat)).field).toBe('airfoil.points');
  });
});

describe('a closed contour (issue 9)', () => {
  // A list of points is a closed polygon: a last point that repeats the first changes nothing.
  const lift = (points: Point[]) => {
    const a = buildAirfoil({ kind: 'coordinates', points }, 160);
    return {
      cl: liftCoefficientAt(solvePanelMethod(a.points, a.leadingEdgeIndex), degToRad(5)),
      gap: a.trailingEdgeGap,
      warnings: a.warnings,
    };
  };
  const sharp = nacaGeometry('2412', 60, true).points; // closed trailing edge: the last point repeats the first
  const blunt = nacaGeometry('2412', 60).points; // open trailing edge, 0.25 % of chord

  it('gives the same CL with and without the repeated closing point, and reads a sharp edge as closed', () => {
    expect(sharp[sharp.length - 1][0]).toBe(sharp[0][0]);
    expect(sharp[sharp.length - 1][1]).toBeCloseTo(sharp[0][1], 15);
    const withRepeat = lift(sharp);
    const without = lift(sharp.slice(0, -1));
    expect(withRepeat.cl).toBe(without.cl);
    expect(withRepeat.gap).toBe(0);
    expect(without.gap).toBe(0);
    expect(withRepeat.warnings).toEqual([]);
  });

  it('gives the closed section the CL of the same section panelled directly (no reshaping)', () => {
    const direct = nacaGeometry('2412', 160, true);
    const cl = liftCoefficientAt(solvePanelMethod(direct.points, direct.leadingEdgeIndex), degToRad(5));
    expect(Math.abs(lift(sharp).cl - cl) / cl).toBeLessThan(1e-4);
  });

  it('reads a blunt trailing edge the same with its first point repeated at the end', () => {
    const a = lift(blunt);
    const b = lift([...blunt, blunt[0]]);
    expect(b.cl).toBe(a.cl);
    expect(b.gap).toBeCloseTo(0.00252, 5);
  });

  it('accepts a closed loop that starts at the nose, as the same section', () => {
    const le = 30;
    const fromNose = [...sharp.slice(le), ...sharp.slice(1, le + 1)];
    expect(lift(fromNose).cl).toBeCloseTo(lift(sharp).cl, 12);
  });
});

describe('reversed and upside-down outlines (issue 9)', () => {
  const sharp = nacaGeometry('2412', 60, true).points;
  const warningsOf = (points: Point[]) => buildAirfoil({ kind: 'coordinates', points }, 80).warnings.join(' ');

  it('warns about points listed clockwise, and reads them upper surface first', () => {
    expect(warningsOf([...sharp].reverse())).toMatch(/run clockwise/);
    expect(warningsOf(sharp)).not.toMatch(/clockwise|upside down|nose to the right/);
  });

  it('warns about an upside-down file (mean line below the chord) and uses it as given', () => {
    const flipped = sharp.map(([x, y]): Point => [x, -y]);
    expect(warningsOf(flipped)).toMatch(/upside down/);
    const { contour } = normaliseCoordinates(flipped);
    expect(Math.min(...contour.slice(5, 25).map((p) => p[1]))).toBeGreaterThan(0); // upper surface first
  });

  it('warns about an outline drawn nose to the right, and about the mirror image it makes', () => {
    const turned = sharp.map(([x, y]): Point => [2 - x, -y]); // turned round: the same section
    expect(warningsOf(turned)).toMatch(/nose to the right/);
    expect(warningsOf(turned)).not.toMatch(/upside down/);
    const mirrored = sharp.map(([x, y]): Point => [2 - x, y]); // mirrored: upside down once turned round
    expect(warningsOf(mirrored)).toMatch(/nose to the right/);
    expect(warningsOf(mirrored)).toMatch(/upside down/);
  });

  it('does not call a symmetric section upside down', () => {
    const sym = nacaGeometry('0012', 60, true).points.map(([x, y]): Point => [x, -y]);
    expect(warningsOf(sym)).not.toMatch(/upside down/);
  });
});
