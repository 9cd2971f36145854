import type { FastenerLine, Hole } from '@/db/contracts';
import {
  crossings,
  flatLineY,
  linePath,
  outlineBounds,
  placeHole,
  placeHoles,
  surfaceY,
  walkerOver,
  xAlongSurface,
  type Point,
} from '@/components/travelers/part-geometry';

// A simple lens-shaped rib: a peak of 3 in at 10 in aft, chord 40 in, flat bottom at -1.
const rib: Point[] = [
  [0, 0],
  [10, 3],
  [40, 0],
  [40, -1],
  [0, -1],
];

const zones = [{ fromIn: 0, toIn: 20, pitchIn: 1 }];
const upper: FastenerLine = { code: 'U', name: 'Upper flange', surface: 'upper', startIn: 5, lengthIn: 20, zones };
const lower: FastenerLine = { code: 'L', name: 'Lower flange', surface: 'lower', startIn: 5, lengthIn: 20, zones };

describe('reading the outline', () => {
  it('finds the upper surface by interpolating along the top edges', () => {
    expect(surfaceY(rib, 5, 'upper')).toBeCloseTo(1.5);
    expect(surfaceY(rib, 10, 'upper')).toBeCloseTo(3);
    expect(surfaceY(rib, 25, 'upper')).toBeCloseTo(1.5);
  });

  it('finds the lower surface on the bottom edge', () => {
    expect(surfaceY(rib, 25, 'lower')).toBeCloseTo(-1);
  });

  it('clamps a station beyond the trailing edge to the end of the outline', () => {
    expect(surfaceY(rib, 55, 'upper')).toBeCloseTo(0);
  });

  it('counts a vertical edge once at each of its ends', () => {
    expect(crossings(rib, 40).sort()).toEqual([-1, -1, 0, 0].sort());
  });

  it('measures the outline', () => {
    expect(outlineBounds(rib)).toEqual({ minX: 0, maxX: 40, minY: -1, maxY: 3 });
  });
});

describe('placing holes', () => {
  const h = (line: string, stationIn: number): Hole => ({
    holeId: `${line}-x`,
    line,
    seq: 1,
    stationIn,
    status: 'pending',
  });

  it("walks a hole's station along the curved upper surface from the line start", () => {
    // From x = 5 the upper side climbs at 3/10: 5 in along it is 5/√1.09 = 4.789 in of chord.
    const p = placeHole(rib, [upper, lower], h('U', 5));
    expect(p.x).toBeCloseTo(5 + 5 / Math.sqrt(1.09), 3);
    expect(p.y).toBeCloseTo(0.3 * p.x, 3);
  });

  it('puts a lower-line hole on the lower surface', () => {
    const p = placeHole(rib, [upper, lower], h('L', 15));
    expect(p.x).toBeCloseTo(20);
    expect(p.y).toBeCloseTo(-1);
  });

  it('spreads flat lines evenly across the height of the part', () => {
    const panel: Point[] = [
      [0, 0],
      [30, 0],
      [30, 12],
      [0, 12],
    ];
    const a: FastenerLine = { ...upper, code: 'A', surface: 'flat' };
    const b: FastenerLine = { ...upper, code: 'B', surface: 'flat' };
    expect(flatLineY(panel, [a, b], 'A')).toBeCloseTo(4);
    expect(flatLineY(panel, [a, b], 'B')).toBeCloseTo(8);
    expect(placeHoles(panel, [a, b], [h('B', 1)])[0].y).toBeCloseTo(8);
  });

  it('traces a surface line from its start to where its length runs out along the surface', () => {
    const path = linePath(rib, [upper], upper, 4);
    expect(path[0]).toEqual([5, expect.closeTo(1.5)]);
    // 5 in up the front slope to the peak (5.22 in along it), then down the back at 1/10 for the rest.
    expect(path[path.length - 1][0]).toBeCloseTo(10 + (20 - 5 * Math.sqrt(1.09)) / Math.sqrt(1.01), 2);
  });
});

describe('walking a side', () => {
  // The walk over the side read edge by edge (surfaceY) at each step, as first written. The walker
  // sweeps the edges in order instead; it must land on exactly the same x.
  const walkEdgeByEdge = (outline: Point[], side: 'upper' | 'lower', x0: number) =>
    walkerOver((x) => surfaceY(outline, x, side), x0, outlineBounds(outline).maxX);

  // The rib, a notched outline with vertical steps inside the chord, and one with its edges out of order.
  const notched: Point[] = [
    [0, 0],
    [8, 2],
    [8, 2.5],
    [20, 2.5],
    [20, 1.5],
    [34, 0.5],
    [34, -1],
    [0, -1],
  ];
  const shuffled: Point[] = [
    [30, 0],
    [12, 2],
    [0, 0.5],
    [3, -1.5],
    [30, -0.5],
  ];

  it.each([
    ['the rib', rib],
    ['a notched outline', notched],
    ['an outline started mid-chord', shuffled],
  ])('lands where reading %s edge by edge lands', (_name, outline) => {
    for (const side of ['upper', 'lower'] as const)
      for (const x0 of [-2, 0, 5, 8, 19.99]) {
        const walk = walkEdgeByEdge(outline, side, x0);
        for (let d = -1; d <= 45; d += 0.37) expect(xAlongSurface(outline, side, x0, d)).toBe(walk(d));
      }
  });
});
