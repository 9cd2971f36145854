import type { FindingDetail, MeasureBasis, TravelerDetail } from '@/db/contracts';

/**
 * The rivet a measurement is judged against, read from the traveler's rivet callout in the open
 * standards' notation: the dash number is the shank diameter in 32nds of an inch (MS20470AD4 = 1/8 in),
 * MS20426 and the "-CSK" blind rivets have countersunk heads; a trailing "-N" is the length.
 *
 * Why here: the traveler's answer does not carry the rivet's diameter (the finding's does, in
 * `context.rivetDiameterIn`), and the flag form judges measurements before the finding exists. A callout
 * this does not read gives null, and the form then shows the rule without a verdict rather than guess.
 */
export function rivetOfCallout(spec: string): { diameterIn: number; countersunk: boolean } | null {
  const k = spec.trim().toUpperCase();
  const solid = k.match(/^(MS20470|MS20426|AN470|AN426)[A-Z]+(\d{1,2})(?:-\d+)?$/);
  if (solid) {
    const dash = Number(solid[2]);
    return dash > 0 ? { diameterIn: dash / 32, countersunk: solid[1].endsWith('426') } : null;
  }
  const blind = k.match(/^PULLED-(\d{1,2})(-CSK)?$/);
  if (blind) {
    const dash = Number(blind[1]);
    return dash > 0 ? { diameterIn: dash / 32, countersunk: !!blind[2] } : null;
  }
  return null;
}

export function basisOfTraveler(t: Pick<TravelerDetail, 'rivetSpec' | 'drillDiameterIn'>): MeasureBasis | null {
  const r = rivetOfCallout(t.rivetSpec);
  return r ? { rivetDiameterIn: r.diameterIn, drillDiameterIn: t.drillDiameterIn, countersunk: r.countersunk } : null;
}

/** The finding carries its rivet from the server's catalogue: no reading of the callout needed. */
export function basisOfFinding(c: FindingDetail['context']): MeasureBasis | null {
  return c.rivetDiameterIn == null ? null : { rivetDiameterIn: c.rivetDiameterIn, drillDiameterIn: c.drillDiameterIn, countersunk: c.countersunk };
}
