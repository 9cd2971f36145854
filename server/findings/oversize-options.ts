import { EngineeringInputError, findRivetByCallout, nextRivetSize } from '../engineering';

export type OversizeOption = { code: string; dash: number; step: 1 | 2 };

/**
 * The next two sizes of the same family as the traveler's rivet, for the inspector to choose from:
 * [] at the top of the family, null for a rivet outside the engine's catalogue.
 */
export function oversizeOptions(rivetSpec: string): OversizeOption[] | null {
  let spec;
  try {
    spec = findRivetByCallout(rivetSpec);
  } catch (err) {
    if (err instanceof EngineeringInputError) return null;
    throw err;
  }
  const out: OversizeOption[] = [];
  for (let next = nextRivetSize(spec); next && out.length < 2; next = nextRivetSize(next)) {
    out.push({ code: next.code, dash: next.dash, step: (out.length + 1) as 1 | 2 });
  }
  return out;
}

/** The catalogue rivet a callout names, or null for a rivet outside the engine's catalogue. */
export function rivetOfCallout(rivetSpec: string) {
  try {
    return findRivetByCallout(rivetSpec);
  } catch (err) {
    if (err instanceof EngineeringInputError) return null;
    throw err;
  }
}
