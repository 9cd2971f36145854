import { EngineeringInputError } from './errors';
import { interpolateCp } from './panel-method';
import { requireCount, requireStudyBound, STUDY_BOUNDS } from './bounds';
import { requireArray } from './validate';
import type { CpSample, CpTableInput } from '../../lib/engineering-results';

/**
 * A supplier's own pressure distribution (wind tunnel, or a viscous code) in place of the panel method:
 * one or more tables, each for a lift coefficient, rows of (x/c, Cp upper, Cp lower). A condition between
 * two tables of its sign is interpolated in CL; outside them the nearest table is scaled by CL/CL_table
 * (its shape held), with a warning, scaling up being unconservative near stall. A condition with no table
 * of its sign is left to the panel method.
 */

export interface CpTable {
  cl: number;
  upper: CpSample[];
  lower: CpSample[];
}

export const MIN_CP_TABLE_ROWS = 5;

export function validateCpTables(input: unknown, field = 'cpTables'): CpTable[] {
  const tables = requireArray<CpTableInput>(input, field, 1, 'list of Cp tables');
  requireCount(tables, field, STUDY_BOUNDS.cpTables);
  return tables.map((t, k) => {
    const f = `${field}[${k}]`;
    if (t === null || typeof t !== 'object') throw new EngineeringInputError(f, 'each Cp table must be an object');
    const cl = requireStudyBound(t.cl, 'cpTables[].cl', `${f}.cl`);
    if (cl === 0)
      throw new EngineeringInputError(`${f}.cl`, 'a Cp table needs the (non-zero) lift coefficient it was measured at');
    const rows = requireArray<unknown>(
      t.rows,
      `${f}.rows`,
      MIN_CP_TABLE_ROWS,
      'list of [x/c, Cp upper, Cp lower] rows',
    );
    requireCount(rows, `${f}.rows`, STUDY_BOUNDS['cpTables[].rows']);
    let prev = -Infinity;
    const upper: CpSample[] = [];
    const lower: CpSample[] = [];
    rows.forEach((r, i) => {
      const rf = `${f}.rows[${i}]`;
      if (!Array.isArray(r) || r.length !== 3 || !r.every((v) => typeof v === 'number' && Number.isFinite(v))) {
        throw new EngineeringInputError(rf, 'each row must be three numbers: x/c, Cp upper, Cp lower');
      }
      const [xc, cu, cl2] = r as number[];
      if (xc < 0 || xc > 1) throw new EngineeringInputError(rf, `x/c must be between 0 and 1 (got ${xc})`);
      if (xc <= prev) throw new EngineeringInputError(rf, 'x/c must increase from row to row');
      if (cu > 1.001 || cl2 > 1.001)
        throw new EngineeringInputError(
          rf,
          'Cp above 1 (more than stagnation pressure) is impossible in subsonic flow',
        );
      if (cu < -30 || cl2 < -30) throw new EngineeringInputError(rf, 'Cp below −30 is not a plausible pressure');
      prev = xc;
      upper.push({ xc, cp: cu });
      lower.push({ xc, cp: cl2 });
    });
    return { cl, upper, lower };
  });
}

function blend(a: CpSample[], b: CpSample[], wa: number, wb: number): CpSample[] {
  const xs = [...new Set([...a.map((s) => s.xc), ...b.map((s) => s.xc)])].sort((p, q) => p - q);
  return xs.map((xc) => ({ xc, cp: Math.min(1, wa * interpolateCp(a, xc) + wb * interpolateCp(b, xc)) }));
}

/** Cp distribution for a lift coefficient from the tables, or null when no table has its sign. */
export function cpFromTables(
  tables: CpTable[],
  cl: number,
): { upper: CpSample[]; lower: CpSample[]; warning: string | null } | null {
  const same = tables.filter((t) => Math.sign(t.cl) === Math.sign(cl)).sort((p, q) => Math.abs(p.cl) - Math.abs(q.cl));
  if (same.length === 0) return null;
  const lo = same[0];
  const hi = same[same.length - 1];
  if (Math.abs(cl) <= Math.abs(lo.cl) || Math.abs(cl) >= Math.abs(hi.cl)) {
    const t = Math.abs(cl) <= Math.abs(lo.cl) ? lo : hi;
    const k = cl / t.cl;
    const warning =
      k > 1 + 1e-9
        ? `CL ${cl.toFixed(3)} is above the highest Cp table (CL ${t.cl}): that table is scaled up by ${k.toFixed(2)}, which is not conservative near stall`
        : k < 1 - 1e-9
          ? `CL ${cl.toFixed(3)} is below the lowest Cp table (CL ${t.cl}): that table is scaled down by ${k.toFixed(2)}`
          : null;
    return { upper: blend(t.upper, t.upper, k, 0), lower: blend(t.lower, t.lower, k, 0), warning };
  }
  const i = same.findIndex((t) => Math.abs(t.cl) >= Math.abs(cl));
  const a = same[i - 1];
  const b = same[i];
  const wb = (cl - a.cl) / (b.cl - a.cl);
  return { upper: blend(a.upper, b.upper, 1 - wb, wb), lower: blend(a.lower, b.lower, 1 - wb, wb), warning: null };
}
