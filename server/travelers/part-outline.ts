import type { PartKind } from '../../db/contracts';
import { nacaGeometry } from '../engineering/airfoil';
import { BoundedMap } from '../bounded-map';

/** Unit-chord outlines by airfoil: the same few kits' airfoils are drawn on every part page. */
const unitOutlines = new BoundedMap<string, readonly (readonly [number, number])[]>(64);

function unitOutline(airfoil: string): readonly (readonly [number, number])[] {
  let points = unitOutlines.get(airfoil);
  if (!points) {
    points = nacaGeometry(airfoil, 80).points.map(([x, y]) => [x, y] as const);
    unitOutlines.set(airfoil, points);
  }
  return points;
}

/** The part's outline in inches for the traveler drawing: the airfoil at the rib's chord, or a panel rectangle. */
export function partOutline(kind: PartKind, airfoil: string, chordIn: number): [number, number][] {
  if (kind === 'rib' || kind === 'nose_rib') {
    try {
      return unitOutline(airfoil).map(([x, y]) => [x * chordIn, y * chordIn]);
    } catch {
      // A kit whose airfoil the engine cannot draw still gets a traveler: fall through to a plain outline.
    }
  }
  const h = Math.max(chordIn * 0.25, 2);
  return [
    [0, 0],
    [chordIn, 0],
    [chordIn, h],
    [0, h],
  ];
}
