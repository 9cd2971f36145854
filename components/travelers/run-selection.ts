import type { Hole, TickHolesInput } from '@/db/contracts';

/**
 * Ticking a run: the builder taps the first and the last hole of a run on one line, then ticks all of
 * them at once. Only pending ↔ installed can change by ticking; flagged, held, reworked and accepted
 * holes move through their finding and are left as they are.
 */
export type RunPick = { line: string; firstId: string; lastId: string | null } | null;

export function pickRunEnd(pick: RunPick, hole: Pick<Hole, 'holeId' | 'line'>): RunPick {
  if (!pick || pick.lastId !== null || pick.line !== hole.line) {
    // Start afresh: no run yet, a finished run, or a tap on another line.
    return { line: hole.line, firstId: hole.holeId, lastId: null };
  }
  if (pick.firstId === hole.holeId) return null; // a second tap on the first hole clears it
  return { ...pick, lastId: hole.holeId };
}

/** The holes of the run, in order along the line, whichever end was tapped first. */
export function runHoles(holes: readonly Hole[], pick: RunPick): Hole[] {
  if (!pick) return [];
  const onLine = holes.filter((h) => h.line === pick.line).sort((a, b) => a.seq - b.seq);
  const first = onLine.find((h) => h.holeId === pick.firstId);
  if (!first) return [];
  const last = pick.lastId ? onLine.find((h) => h.holeId === pick.lastId) : first;
  if (!last) return [first];
  const lo = Math.min(first.seq, last.seq);
  const hi = Math.max(first.seq, last.seq);
  return onLine.filter((h) => h.seq >= lo && h.seq <= hi);
}

export type RunPlan = {
  /** What to send: tick the pending holes, or, when every tickable hole is already in, untick them. */
  action: TickHolesInput | null;
  left: Hole[];
  summary: string;
};

export function planRun(run: readonly Hole[]): RunPlan {
  const pending = run.filter((h) => h.status === 'pending');
  const installed = run.filter((h) => h.status === 'installed');
  const left = run.filter((h) => h.status !== 'pending' && h.status !== 'installed');
  const tail = left.length ? `; ${left.length} left as they are (they change through their finding)` : '';
  if (pending.length) {
    return {
      action: { holeIds: pending.map((h) => h.holeId), status: 'installed' },
      left,
      summary: `${run.length} holes: ${pending.length} to tick${installed.length ? `, ${installed.length} already in` : ''}${tail}`,
    };
  }
  if (installed.length) {
    return {
      action: { holeIds: installed.map((h) => h.holeId), status: 'pending' },
      left,
      summary: `${run.length} holes, all ticked already${tail}. Untick them?`,
    };
  }
  return { action: null, left, summary: `${run.length} holes; none can be ticked here${tail}` };
}

export function isInRun(run: readonly Hole[], holeId: string): boolean {
  return run.some((h) => h.holeId === holeId);
}

/** One tap on one hole. */
export function toggleHole(hole: Hole): { action: TickHolesInput | null; reason?: string } {
  if (hole.status === 'pending') return { action: { holeIds: [hole.holeId], status: 'installed' } };
  if (hole.status === 'installed') return { action: { holeIds: [hole.holeId], status: 'pending' } };
  return { action: null, reason: `${hole.holeId} is ${hole.status}. It changes through its finding, not by ticking.` };
}

/** The most holes one tick request may carry (tickHolesInput in db/contracts/travelers.ts). */
export const TICK_BATCH_MAX = 500;

/**
 * A run longer than one request may carry, as requests of at most TICK_BATCH_MAX holes in order along
 * the line: a whole line of a large part is more than 500 holes.
 */
export function tickBatches(action: TickHolesInput, max = TICK_BATCH_MAX): TickHolesInput[] {
  const out: TickHolesInput[] = [];
  for (let i = 0; i < action.holeIds.length; i += max)
    out.push({ ...action, holeIds: action.holeIds.slice(i, i + max) });
  return out;
}
