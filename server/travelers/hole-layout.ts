import type { FastenerLine } from '../../db/contracts';
import { placeHoles as placeAlongZones } from '../engineering';

export type PlacedHole = { holeId: string; line: string; seq: number; stationIn: number };

/**
 * A traveler's holes of one line, placed exactly as the engine places a computed schedule: first and
 * last at the edge distance, stepping by the tightest zone pitch each step touches. Stations are
 * inches along the line from its start.
 */
export function placeHoles(line: FastenerLine, edgeDistanceIn: number, minPitchIn: number): PlacedHole[] {
  const zones = line.zones.map((z) => ({ from: z.fromIn, to: z.toIn, pitch: z.pitchIn }));
  const { positions } = placeAlongZones(zones, edgeDistanceIn, line.lengthIn - edgeDistanceIn, minPitchIn);
  return positions.map((s, i) => ({
    holeId: `${line.code}-${String(i + 1).padStart(positions.length > 99 ? 3 : 2, '0')}`,
    line: line.code,
    seq: i + 1,
    stationIn: Math.round(s * 10000) / 10000,
  }));
}
