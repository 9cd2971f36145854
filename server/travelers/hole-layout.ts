import type { FastenerLine } from '../../db/contracts';

export type PlacedHole = { holeId: string; line: string; seq: number; stationIn: number };

/**
 * Holes of one line from its pitch zones: the end holes sit at the edge distance from the line's ends,
 * and each zone is split into equal spaces no wider than its pitch, so no space ever exceeds what the
 * schedule allows. Stations are inches from the line's start.
 */
export function placeHoles(line: FastenerLine, edgeDistanceIn: number): PlacedHole[] {
  const first = edgeDistanceIn;
  const last = line.lengthIn - edgeDistanceIn;
  const stations: number[] = [first];
  for (const zone of [...line.zones].sort((a, b) => a.fromIn - b.fromIn)) {
    const a = Math.max(zone.fromIn, first);
    const b = Math.min(zone.toIn, last);
    if (b <= a + 1e-9) continue;
    const spaces = Math.ceil((b - a) / zone.pitchIn - 1e-9);
    for (let k = 1; k <= spaces; k++) stations.push(a + ((b - a) * k) / spaces);
  }
  return stations.map((s, i) => ({
    holeId: `${line.code}-${String(i + 1).padStart(2, '0')}`,
    line: line.code,
    seq: i + 1,
    stationIn: Math.round(s * 10000) / 10000,
  }));
}
