import { room } from './arrays';
import { surfacePoints, type AirfoilGeometry } from './airfoil';
import { EngineeringInputError } from './errors';
import type { FastenerLineInput, Point } from '../../lib/engineering-results';

/**
 * The rib drawn at its chord, and stations along a fastener line: the line follows the outline
 * (rivets sit on the flange, so pitch is measured along the surface, not along the chord).
 */

export interface LineStation {
  xc: number;
  stationIn: number;
  alongIn: number;
  xIn: number;
  yIn: number;
}

export function ribOutline(geometry: AirfoilGeometry, chordIn: number): Point[] {
  return geometry.points.map(([x, y]) => [x * chordIn, y * chordIn]);
}

/** Area inside the outline, in², for the web weight. */
export function outlineAreaSqIn(points: Point[]): number {
  let a = 0;
  for (let i = 0; i < points.length; i++) {
    const p = points[i];
    const q = points[(i + 1) % points.length];
    a += p[0] * q[1] - q[0] * p[1];
  }
  return Math.abs(a) / 2;
}

/** Arc length at which the surface (leading edge → trailing edge) first reaches x. */
function arcAt(surface: Point[], cumulative: number[], x: number): number {
  for (let i = 1; i < surface.length; i++) {
    const [x0] = surface[i - 1];
    const [x1] = surface[i];
    if ((x0 <= x && x <= x1) || (x1 <= x && x <= x0)) {
      const t = x1 === x0 ? 0 : (x - x0) / (x1 - x0);
      return cumulative[i - 1] + t * (cumulative[i] - cumulative[i - 1]);
    }
  }
  return x <= surface[0][0] ? 0 : cumulative[cumulative.length - 1];
}

/** The segment holding arc length s (the index of its end point), looking from segment `from` on. */
function segmentAt(cumulative: number[], s: number, from = 1): number {
  let i = from;
  while (i < cumulative.length - 1 && cumulative[i] < s) i++;
  return i;
}

export function validateLine(line: FastenerLineInput, field: string): void {
  if (line === null || typeof line !== 'object')
    throw new EngineeringInputError(field, 'each fastener line must be an object');
  if (typeof line.name !== 'string' || !line.name.trim())
    throw new EngineeringInputError(`${field}.name`, 'the line needs a name');
  if (line.surface !== 'upper' && line.surface !== 'lower')
    throw new EngineeringInputError(`${field}.surface`, 'must be "upper" or "lower"');
  if (!(typeof line.startXc === 'number' && line.startXc >= 0 && line.startXc < 1)) {
    throw new EngineeringInputError(`${field}.startXc`, 'the start must be a fraction of the chord from 0 to below 1');
  }
  if (!(typeof line.endXc === 'number' && line.endXc > line.startXc && line.endXc <= 1)) {
    throw new EngineeringInputError(
      `${field}.endXc`,
      'the end must be a fraction of the chord after the start and at most 1',
    );
  }
}

/** A line's surface at the rib's chord and where it starts and ends along it (arc length, in). */
function lineArc(geometry: AirfoilGeometry, line: FastenerLineInput, chordIn: number) {
  const surface = surfacePoints(geometry, line.surface).map(([x, y]): Point => [x * chordIn, y * chordIn]);
  const cumulative = [0];
  for (let i = 1; i < surface.length; i++) {
    cumulative.push(
      cumulative[i - 1] + Math.hypot(surface[i][0] - surface[i - 1][0], surface[i][1] - surface[i - 1][1]),
    );
  }
  return {
    surface,
    cumulative,
    s0: arcAt(surface, cumulative, line.startXc * chordIn),
    s1: arcAt(surface, cumulative, line.endXc * chordIn),
  };
}

/** How many stations `lineStations` makes: known before any is made, for the study's work budget. */
export function lineStationCount(
  geometry: AirfoilGeometry,
  line: FastenerLineInput,
  chordIn: number,
  stepIn: number,
): { count: number; lengthIn: number } {
  const { s0, s1 } = lineArc(geometry, line, chordIn);
  return { count: Math.max(2, Math.ceil((s1 - s0) / stepIn) + 1), lengthIn: s1 - s0 };
}

/** Stations along a line at most `stepIn` apart (along the surface), at the rib's chord. */
export function lineStations(
  geometry: AirfoilGeometry,
  line: FastenerLineInput,
  chordIn: number,
  stepIn: number,
): LineStation[] {
  const c = lineStationColumns(geometry, line, chordIn, stepIn);
  const stations: LineStation[] = new Array(c.x.length);
  for (let k = 0; k < stations.length; k++)
    stations[k] = { xc: c.xc[k], stationIn: c.x[k], alongIn: c.along[k], xIn: c.x[k], yIn: c.y[k] };
  return stations;
}

/** `lineStations` as columns, one entry per station (x is also the station): what a study's loads are made from. */
export function lineStationColumns(
  geometry: AirfoilGeometry,
  line: FastenerLineInput,
  chordIn: number,
  stepIn: number,
): { xc: number[]; x: number[]; y: number[]; along: number[] } {
  const { surface, cumulative, s0, s1 } = lineArc(geometry, line, chordIn);
  const count = Math.max(2, Math.ceil((s1 - s0) / stepIn) + 1);
  // (packed arrays: see arrays.ts)
  const xc = room(count);
  const xs = room(count);
  const ys = room(count);
  const along = room(count);
  // The stations come in order along the surface: the search for each picks up where the last one ended
  // (every segment it skipped ends before the station), instead of walking from the start each time.
  let segment = 1;
  let last = -Infinity;
  for (let k = 0; k < count; k++) {
    const s = s0 + ((s1 - s0) * k) / (count - 1);
    segment = segmentAt(cumulative, s, s >= last ? segment : 1);
    last = s;
    // the point at arc length s on its segment
    const span = cumulative[segment] - cumulative[segment - 1];
    const t = span > 0 ? Math.min(1, Math.max(0, (s - cumulative[segment - 1]) / span)) : 0;
    const a = surface[segment - 1];
    const b = surface[segment];
    const x = a[0] + t * (b[0] - a[0]);
    xc[k] = x / chordIn;
    xs[k] = x;
    ys[k] = a[1] + t * (b[1] - a[1]);
    along[k] = s - s0;
  }
  return { xc, x: xs, y: ys, along };
}
