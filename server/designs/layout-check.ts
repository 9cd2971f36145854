import type { FastenerLine } from '../../db/contracts';
import {
  EngineeringInputError,
  estimateHoles,
  findRivetByCallout,
  layoutRules,
  MAX_REVISION_HOLES,
  type LayoutRules,
} from '../engineering';
import { badRequest } from '../http-error';
import { countText } from '../../lib/number-text';

/**
 * The layout rules of the trade for a revision (edge distance ≥ 2D, 2.5D countersunk; pitch ≥ 3D), and
 * the number of holes its zones can place, checked before any hole is placed. Runs when a revision is
 * saved and again when a traveler is made from it, so a revision stored before these checks existed
 * cannot make shipping place millions of holes. Returns the minimum pitch for hole placement.
 */
export function checkLayout(
  r: { rivetSpec: string; drillDiameterIn: number; edgeDistanceIn: number; lines: FastenerLine[] },
  /** where the revision sits in the request body, for the field names of the errors ("revision.") */
  at = '',
): number {
  let rules: (LayoutRules & { countersunk: boolean }) | null = null;
  let basis: string;
  try {
    const spec = findRivetByCallout(r.rivetSpec);
    rules = { ...layoutRules(spec), countersunk: spec.countersunk };
    basis = `(3D) for ${r.rivetSpec}`;
  } catch (err) {
    if (!(err instanceof EngineeringInputError)) throw err;
    // A rivet outside the catalogue: the supplier's own data govern the edge distance; the pitch is
    // still held to 3 × the drill, so no zone can ask for holes closer than a rivet fits.
    basis = `(3 × the ${r.drillDiameterIn} in drill) for ${r.rivetSpec}`;
  }
  const minPitchIn = rules?.minPitchIn ?? 3 * r.drillDiameterIn;
  const fields: Record<string, string> = {};
  if (rules && r.edgeDistanceIn < rules.minEdgeIn - 1e-6) {
    fields[`${at}edgeDistanceIn`] =
      `edge distance must be at least ${rules.minEdgeIn.toFixed(3)} in for ${r.rivetSpec} (${rules.countersunk ? '2.5D, countersunk head' : '2D'})`;
  }
  r.lines.forEach((line, i) =>
    line.zones.forEach((z, j) => {
      if (!(z.pitchIn >= minPitchIn - 1e-6)) {
        fields[`${at}lines.${i}.zones.${j}.pitchIn`] = `pitch must be at least ${minPitchIn.toFixed(3)} in ${basis}`;
      }
    }),
  );
  if (Object.keys(fields).length) throw badRequest(Object.values(fields)[0], fields);

  // Holes as placed between the edge distances, counted per line from its zones (cheap, never under).
  let total = 0;
  let most = { count: -1, field: `${at}lines` };
  r.lines.forEach((line, i) => {
    const zones = line.zones.map((z) => ({ from: z.fromIn, to: z.toIn, pitch: z.pitchIn }));
    const count = estimateHoles(zones, r.edgeDistanceIn, line.lengthIn - r.edgeDistanceIn, minPitchIn);
    total += count;
    if (count > most.count) {
      const tightest = line.zones.reduce((k, z, j) => (z.pitchIn < line.zones[k].pitchIn ? j : k), 0);
      most = { count, field: `${at}lines.${i}.zones.${tightest}.pitchIn` };
    }
  });
  if (total > MAX_REVISION_HOLES) {
    const message = `the zones give up to ${countText(total)} holes; a revision has at most ${countText(MAX_REVISION_HOLES)}: widen the pitches`;
    throw badRequest(message, { [most.field]: message });
  }
  return minPitchIn;
}
