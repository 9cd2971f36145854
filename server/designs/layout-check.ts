import type { FastenerLine } from '../../db/contracts';
import { EngineeringInputError, findRivetByCallout, layoutRules } from '../engineering';
import { badRequest } from '../http-error';

/**
 * The layout rules of the trade for a hand-entered revision (edge distance ≥ 2D, 2.5D countersunk;
 * pitch ≥ 3D), when its rivet is one the engine knows. Returns the minimum pitch for hole placement.
 */
export function checkLayout(
  r: { rivetSpec: string; drillDiameterIn: number; edgeDistanceIn: number; lines: FastenerLine[] },
  /** where the revision sits in the request body, for the field names of the errors ("revision.") */
  at = '',
): number {
  let spec;
  try {
    spec = findRivetByCallout(r.rivetSpec);
  } catch (err) {
    if (!(err instanceof EngineeringInputError)) throw err;
    // A rivet outside the catalogue: the supplier's own data govern; hold to 3 × the drill at least.
    return 3 * r.drillDiameterIn;
  }
  const rules = layoutRules(spec);
  const fields: Record<string, string> = {};
  if (r.edgeDistanceIn < rules.minEdgeIn - 1e-6) {
    fields[`${at}edgeDistanceIn`] = `edge distance must be at least ${rules.minEdgeIn.toFixed(3)} in for ${r.rivetSpec} (${spec.countersunk ? '2.5D, countersunk head' : '2D'})`;
  }
  r.lines.forEach((line, i) => line.zones.forEach((z, j) => {
    if (z.pitchIn < rules.minPitchIn - 1e-6) {
      fields[`${at}lines.${i}.zones.${j}.pitchIn`] = `pitch must be at least ${rules.minPitchIn.toFixed(3)} in (3D) for ${r.rivetSpec}`;
    }
  }));
  if (Object.keys(fields).length) throw badRequest(Object.values(fields)[0], fields);
  return rules.minPitchIn;
}
