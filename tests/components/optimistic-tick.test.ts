import type { TravelerDetail } from '@/db/contracts';
import { countHoles } from '@/db/contracts';
import { applyTick } from '@/hooks/queries/bench-actions';
import { holeNumbers } from '@/components/findings/hole-context';

const detail = {
  holes: [
    { holeId: 'U-01', line: 'U', seq: 1, stationIn: 0.25, status: 'pending' },
    { holeId: 'U-02', line: 'U', seq: 2, stationIn: 1.25, status: 'installed' },
    { holeId: 'U-03', line: 'U', seq: 3, stationIn: 2.25, status: 'held' },
    { holeId: 'U-04', line: 'U', seq: 4, stationIn: 3.25, status: 'reworked' },
    { holeId: 'U-05', line: 'U', seq: 5, stationIn: 4.25, status: 'flagged' },
  ],
  holesDone: 1,
  holesAwaitingInspector: 2,
} as unknown as TravelerDetail;

describe('a tick shows at once', () => {
  it('marks pending holes installed and counts them done before the server answers', () => {
    const next = applyTick(detail, { holeIds: ['U-01', 'U-03'], status: 'installed' });
    expect(next.holes.map((h) => h.status)).toEqual(['installed', 'installed', 'held', 'reworked', 'flagged']);
    expect(next.holesDone).toBe(2);
  });

  it('counts a reworked hole as waiting for the inspector, not done', () => {
    expect(countHoles(detail.holes)).toEqual({ done: 1, awaiting: 2 });
    expect(applyTick(detail, { holeIds: ['U-01'], status: 'installed' }).holesAwaitingInspector).toBe(2);
  });

  it('never changes a held hole by ticking', () => {
    const next = applyTick(detail, { holeIds: ['U-03'], status: 'pending' });
    expect(next.holes[2].status).toBe('held');
  });

  it('leaves the cached traveler as it was', () => {
    applyTick(detail, { holeIds: ['U-01'], status: 'installed' });
    expect(detail.holes[0].status).toBe('pending');
  });
});

describe('a hole in context', () => {
  const hole = { stationIn: 3, prevStationIn: 2, nextStationIn: 4.5 };

  it('gives the pitch to each neighbour and in drill diameters', () => {
    const n = holeNumbers(hole, 0.125);
    expect(n.pitchBefore).toBeCloseTo(1);
    expect(n.pitchAfter).toBeCloseTo(1.5);
    expect(n.pitchAfterInDiameters).toBeCloseTo(12);
  });

  it('has no pitch before the first hole of a line', () => {
    expect(holeNumbers({ ...hole, prevStationIn: null }, 0.125).pitchBefore).toBeNull();
  });
});
