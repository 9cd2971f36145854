import type { Hole, HoleStatus } from '@/db/contracts';
import { isInRun, pickRunEnd, planRun, runHoles, toggleHole, type RunPick } from '@/components/travelers/run-selection';

function line(code: string, statuses: HoleStatus[]): Hole[] {
  return statuses.map((status, i) => ({
    holeId: `${code}-${String(i + 1).padStart(2, '0')}`,
    line: code,
    seq: i + 1,
    stationIn: 0.5 + i,
    status,
  }));
}

const upper = line('U', ['pending', 'pending', 'installed', 'flagged', 'pending', 'pending']);
const lower = line('L', ['pending', 'pending', 'pending']);
const holes = [...lower, ...upper];
const hole = (id: string) => holes.find((h) => h.holeId === id)!;

describe('picking a run of holes', () => {
  it('starts a run at the first hole tapped', () => {
    expect(pickRunEnd(null, hole('U-02'))).toEqual({ line: 'U', firstId: 'U-02', lastId: null });
  });

  it('closes the run at the second hole tapped on the same line', () => {
    const pick = pickRunEnd(pickRunEnd(null, hole('U-02')), hole('U-05'));
    expect(pick).toEqual({ line: 'U', firstId: 'U-02', lastId: 'U-05' });
    expect(runHoles(holes, pick).map((h) => h.holeId)).toEqual(['U-02', 'U-03', 'U-04', 'U-05']);
  });

  it('takes the run in order along the line whichever end was tapped first', () => {
    const pick = pickRunEnd(pickRunEnd(null, hole('U-05')), hole('U-01'));
    expect(runHoles(holes, pick).map((h) => h.holeId)).toEqual(['U-01', 'U-02', 'U-03', 'U-04', 'U-05']);
  });

  it('starts again when the second tap is on another line', () => {
    const pick = pickRunEnd(pickRunEnd(null, hole('U-02')), hole('L-03'));
    expect(pick).toEqual({ line: 'L', firstId: 'L-03', lastId: null });
  });

  it('clears the pick when the first hole is tapped again', () => {
    expect(pickRunEnd(pickRunEnd(null, hole('U-02')), hole('U-02'))).toBeNull();
  });

  it('starts a new run after a finished one', () => {
    const done: RunPick = { line: 'U', firstId: 'U-01', lastId: 'U-03' };
    expect(pickRunEnd(done, hole('U-05'))).toEqual({ line: 'U', firstId: 'U-05', lastId: null });
  });

  it('never reaches into another line', () => {
    const pick: RunPick = { line: 'L', firstId: 'L-01', lastId: 'L-03' };
    const run = runHoles(holes, pick);
    expect(run.every((h) => h.line === 'L')).toBe(true);
    expect(isInRun(run, 'U-02')).toBe(false);
  });
});

describe('ticking a run', () => {
  it('ticks only the pending holes and leaves a flagged hole alone', () => {
    const plan = planRun(runHoles(holes, { line: 'U', firstId: 'U-02', lastId: 'U-05' }));
    expect(plan.action).toEqual({ holeIds: ['U-02', 'U-05'], status: 'installed' });
    expect(plan.left.map((h) => h.holeId)).toEqual(['U-04']);
    expect(plan.summary).toContain('2 to tick');
  });

  it('offers to untick a run that is all ticked already', () => {
    const ticked = line('U', ['installed', 'installed']);
    expect(planRun(ticked).action).toEqual({ holeIds: ['U-01', 'U-02'], status: 'pending' });
  });

  it('does nothing with a run of held holes', () => {
    expect(planRun(line('U', ['held', 'held'])).action).toBeNull();
  });
});

describe('tapping one hole', () => {
  it('ticks a pending hole and unticks an installed one', () => {
    expect(toggleHole(hole('U-01')).action).toEqual({ holeIds: ['U-01'], status: 'installed' });
    expect(toggleHole(hole('U-03')).action).toEqual({ holeIds: ['U-03'], status: 'pending' });
  });

  it('says why a flagged hole cannot be ticked', () => {
    const r = toggleHole(hole('U-04'));
    expect(r.action).toBeNull();
    expect(r.reason).toMatch(/through its finding/);
  });
});
