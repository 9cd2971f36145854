import type { StepKind } from './designs';
import type { StepPerformer } from './travelers';

/**
 * The fabrication-and-assembly table of a build: for each part, whose work its done steps were. The
 * builder's own work is split into fabrication (making the piece: lay out, drill, deburr, dimple or
 * countersink, prime) and assembly (joining: rivet, and steps of no named operation); help is counted
 * by who gave it. Inspections are nobody's fabrication or assembly and are listed apart. A tally of
 * what was recorded, not a finding of eligibility: only the aviation authority decides that.
 */
export const creditColumns = [
  'builder_fabrication',
  'builder_assembly',
  'helper',
  'commercial',
  'kit_supplier',
] as const;
export type CreditColumn = (typeof creditColumns)[number];
export const creditColumnLabels: Record<CreditColumn, string> = {
  builder_fabrication: 'Builder: fabrication',
  builder_assembly: 'Builder: assembly',
  helper: 'Helper',
  commercial: 'Commercial help',
  kit_supplier: 'Kit supplier',
};

const FABRICATION: readonly StepKind[] = ['lay_out', 'drill', 'deburr', 'dimple_countersink', 'prime'];

export const fabricationCaution =
  'This table sums the steps recorded on the travelers. It does not decide whether the aircraft was built ' +
  'mostly by its builder: only the aviation authority decides eligibility, from the whole record.';

/** The column a done step's work goes in, or null for an inspection (credited to nobody). */
export function creditOf(kind: StepKind, by: StepPerformer | null): CreditColumn | null {
  if (kind === 'inspect') return null;
  if (by === 'helper' || by === 'commercial' || by === 'kit_supplier') return by;
  // A step recorded before steps said whose work it was was done by the builder who recorded it.
  return FABRICATION.includes(kind) ? 'builder_fabrication' : 'builder_assembly';
}

export type FabricationStep = { kind: StepKind; done: boolean; by: StepPerformer | null };
export type FabricationPartInput = {
  travelerId: string;
  partNumber: string;
  partName: string;
  serial: string;
  steps: readonly FabricationStep[];
};

export type FabricationCounts = {
  credited: Record<CreditColumn, number>;
  /** Done steps credited to someone (inspections excluded). */
  creditedTotal: number;
  inspections: number;
  notDone: number;
  /** The builder's share of the credited steps, 0–1; null when nothing is credited yet. */
  builderShare: number | null;
};
export type FabricationRow = Omit<FabricationPartInput, 'steps'> & FabricationCounts;
export type FabricationTable = { parts: FabricationRow[]; total: FabricationCounts };

const zero = (): Record<CreditColumn, number> =>
  Object.fromEntries(creditColumns.map((c) => [c, 0])) as Record<CreditColumn, number>;

function finish(credited: Record<CreditColumn, number>, inspections: number, notDone: number): FabricationCounts {
  const creditedTotal = creditColumns.reduce((n, c) => n + credited[c], 0);
  const builder = credited.builder_fabrication + credited.builder_assembly;
  return {
    credited,
    creditedTotal,
    inspections,
    notDone,
    builderShare: creditedTotal ? builder / creditedTotal : null,
  };
}

/** The table: one row per part, and the build's total summed from the steps themselves (not from the rows' shares). */
export function fabricationTable(parts: readonly FabricationPartInput[]): FabricationTable {
  const all = zero();
  let allInspections = 0;
  let allNotDone = 0;
  const rows = parts.map(({ steps, ...part }) => {
    const credited = zero();
    let inspections = 0;
    let notDone = 0;
    for (const s of steps) {
      if (!s.done) {
        notDone++;
        continue;
      }
      const col = creditOf(s.kind, s.by);
      if (col) credited[col]++;
      else inspections++;
    }
    for (const c of creditColumns) all[c] += credited[c];
    allInspections += inspections;
    allNotDone += notDone;
    return { ...part, ...finish(credited, inspections, notDone) };
  });
  return { parts: rows, total: finish(all, allInspections, allNotDone) };
}

/** The builder's share as the table and the printed log show it: "56 %", or a dash before anything is credited. */
export const shareText = (share: number | null) => (share === null ? '–' : `${Math.round(share * 100)} %`);
