import type { FindingDetail, MeasureBasis, TravelerDetail } from '@/db/contracts';

/** The rivet a measurement is judged against, as the server's catalogue gives it; null shows the rule without a verdict. */
export function basisOfTraveler(
  t: Pick<TravelerDetail, 'rivetDiameterIn' | 'drillDiameterIn' | 'countersunk'>,
): MeasureBasis | null {
  return t.rivetDiameterIn == null
    ? null
    : { rivetDiameterIn: t.rivetDiameterIn, drillDiameterIn: t.drillDiameterIn, countersunk: t.countersunk };
}

export function basisOfFinding(c: FindingDetail['context']): MeasureBasis | null {
  return c.rivetDiameterIn == null
    ? null
    : { rivetDiameterIn: c.rivetDiameterIn, drillDiameterIn: c.drillDiameterIn, countersunk: c.countersunk };
}
