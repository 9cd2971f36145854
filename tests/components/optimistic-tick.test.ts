import type { TravelerDetail } from '@/db/contracts';
import { applyTick } from '@/hooks/queries/travelers';
import { holeNumbers } from '@/components/findings/hole-context';

const detail = {
  holes: [
    { holeId: 'U-01', line: 'U', seq: 1, stationIn: 0.25, status: 'pending' },
    { holeId: 'U-02', line: 'U', seq: 2, stationIn: 1.25, status: 'installed' },
    { holeId: 'U-03', line: 'U', seq: 3, stationIn: 2.25, status: 'held' },
  ],
  holesDone: 1,
} as unknown as TravelerDetail;

describe('a tick shows at once', () => {
  it('marks pending holes installed and counts them done before the server answers', () => {
    const next = applyTick(detail, { holeIds: ['U-01', 'U-03'], status: 'installed' });
    expect(next.holes.map((h) => h.status)).toEqual(['installed', 'installed', 'held']);
    expect(next.holesDone).toBe(2);
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

describe('the hole in context', () => {
  const ctx = { line: 'U', stationIn: 3, prevStationIn: 2, nextStationIn: 4.5, edgeDistanceIn: 0.25, drillDiameterIn: 0.125, rivetSpec: 'MS20470AD4', gaugeIn: 0.032, material: '2024-T3', oversizeOptions: null };

  it('gives the pitch to each neighbour and in drill diameters', () => {
    const n = holeNumbers(ctx);
    expect(n.pitchBefore).toBeCloseTo(1);
    expect(n.pitchAfter).toBeCloseTo(1.5);
    expect(n.pitchAfterInDiameters).toBeCloseTo(12);
    expect(n.edgeInDiameters).toBeCloseTo(2);
  });

  it('has no pitch before the first hole of a line', () => {
    expect(holeNumbers({ ...ctx, prevStationIn: null }).pitchBefore).toBeNull();
  });
});
