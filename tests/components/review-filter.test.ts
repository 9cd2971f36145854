import { isOpenFinding, type FindingSummary } from '@/db/contracts';
import { buildsIn, filterFindings, nextSort, sortFindings } from '@/components/findings/review-filter';

const f = (over: Partial<FindingSummary>): FindingSummary => ({
  id: Math.random().toString(36).slice(2),
  travelerId: 't',
  buildId: 'b',
  serial: 'NK2-0147-W-104',
  partNumber: 'W-104',
  kitSerial: 'NK2-0147',
  holeIds: ['U-03'],
  kind: 'hole_elongated',
  status: 'raised',
  disposition: null,
  closure: null,
  raisedByName: 'Tobias Fenn',
  createdAt: '2026-11-01T10:00:00Z',
  updatedAt: '2026-11-01T10:00:00Z',
  photoCount: 1,
  thumbUrl: null,
  ...over,
});

const rows = [
  f({
    id: 'a',
    createdAt: '2026-11-03T10:00:00Z',
    partNumber: 'W-105',
    status: 'awaiting_approval',
    disposition: 'use_as_is',
    holeIds: ['L-02'],
  }),
  f({
    id: 'b',
    createdAt: '2026-11-01T10:00:00Z',
    partNumber: 'W-104',
    status: 'closed',
    closure: 'accepted',
    kitSerial: 'NK2-0150',
  }),
  f({ id: 'c', createdAt: '2026-11-02T10:00:00Z', partNumber: 'W-10', status: 'raised', kind: 'hole_cracked' }),
];

describe('the review queue', () => {
  it('shows open findings by default and hides closed ones, as the rules module defines open', () => {
    const open = filterFindings(rows, { status: 'open', build: 'all', text: '' });
    expect(open.map((r) => r.id)).toEqual(['a', 'c']);
    expect(open.every((r) => isOpenFinding(r.status))).toBe(true);
  });

  it('filters by one state', () => {
    expect(filterFindings(rows, { status: 'closed', build: 'all', text: '' }).map((r) => r.id)).toEqual(['b']);
    expect(filterFindings(rows, { status: 'awaiting_approval', build: 'all', text: '' }).map((r) => r.id)).toEqual([
      'a',
    ]);
  });

  it('filters by build', () => {
    expect(filterFindings(rows, { status: 'all', build: 'NK2-0150', text: '' }).map((r) => r.id)).toEqual(['b']);
    expect(buildsIn(rows)).toEqual(['NK2-0147', 'NK2-0150']);
  });

  it('finds by hole, kind, part or who raised it, every word counting', () => {
    expect(filterFindings(rows, { status: 'all', build: 'all', text: 'l-02' }).map((r) => r.id)).toEqual(['a']);
    expect(filterFindings(rows, { status: 'all', build: 'all', text: 'crack W-10' }).map((r) => r.id)).toEqual(['c']);
    expect(filterFindings(rows, { status: 'all', build: 'all', text: 'fenn' })).toHaveLength(3);
  });

  it('sorts newest first by date, and flips on a second click', () => {
    expect(sortFindings(rows, { key: 'date', dir: 'desc' }).map((r) => r.id)).toEqual(['a', 'c', 'b']);
    expect(nextSort({ key: 'date', dir: 'desc' }, 'date')).toEqual({ key: 'date', dir: 'asc' });
  });

  it('sorts part numbers in their natural order', () => {
    expect(sortFindings(rows, { key: 'part', dir: 'asc' }).map((r) => r.partNumber)).toEqual([
      'W-10',
      'W-104',
      'W-105',
    ]);
  });

  it('sorts by where each finding is in its life, in the rules module’s order', () => {
    const sorted = sortFindings(rows, { key: 'status', dir: 'asc' }).map((r) => r.status);
    expect(sorted).toEqual(['raised', 'awaiting_approval', 'closed']);
    expect(nextSort({ key: 'date', dir: 'desc' }, 'status')).toEqual({ key: 'status', dir: 'asc' });
  });
});
