import type { BuildLogPage, BuildLogEntry } from '@/db/contracts';
import { BuildLogScreen } from '@/components/build-log/build-log-screen';
import { buildLogKeys } from '@/hooks/queries/build-log';
import { logEntry } from '../fixtures/build-log';
import { renderInApp, testQueryClient } from './render-web';

const mockPush = jest.fn();
jest.mock('expo-router', () => ({
  useRouter: () => ({ push: mockPush, replace: jest.fn(), back: jest.fn(), canGoBack: () => false }),
}));

const entry = (over: Partial<BuildLogEntry>): BuildLogEntry =>
  logEntry({ text: 'Installed 8 holes: U-01 to U-08.', holeIds: ['U-01'], ...over });

const flag = entry({
  id: 'f:1',
  at: '2026-11-04T15:00:00.000Z',
  kind: 'finding_raised',
  group: 'findings',
  text: 'Flagged hole U-09 as suspect: elongated hole.',
  holeIds: ['U-09'],
  note: 'Hole looks oval',
  findingId: 'find-1',
  photos: [{ id: 'p1', thumbUrl: '/api/photos/p1/thumb?sig=x', url: '/api/photos/p1/full?sig=x' }],
});
const tick = entry({ id: 't:1' });

const log = (entries: BuildLogEntry[]): BuildLogPage => ({
  build: {
    id: 'b1',
    kitSerial: 'NK2-0147',
    kitName: 'NK-2 Quillon',
    supplierName: 'Northfold Kitworks',
    createdAt: '2026-11-01T10:00:00Z',
    builders: [{ id: 'u1', name: 'Tobias Fenn', email: 't@x.example' }],
    inspectors: [{ id: 'u2', name: 'Priya Ashdown', email: 'p@x.example' }],
    travelerCount: 2,
    holesTotal: 100,
    holesDone: 8,
    openFindings: 1,
  },
  parts: [
    { travelerId: 'inner', serial: 'NK2-0147-W-104', partNumber: 'W-104', partName: 'Wing rib, inboard' },
    { travelerId: 'outer', serial: 'NK2-0147-W-105', partNumber: 'W-105', partName: 'Wing rib, outboard' },
  ],
  items: entries,
  next: null,
});

function renderLog(data: BuildLogPage, more: [Parameters<typeof buildLogKeys.filtered>[1], BuildLogPage][] = []) {
  const qc = testQueryClient();
  qc.setQueryData(buildLogKeys.filtered('b1', {}), { pages: [data], pageParams: [null] });
  for (const [f, d] of more) qc.setQueryData(buildLogKeys.filtered('b1', f), { pages: [d], pageParams: [null] });
  return renderInApp(<BuildLogScreen buildId="b1" />, qc);
}

afterEach(() => {
  mockPush.mockReset();
});

describe('the build log screen', () => {
  it('shows the timeline by day with the caution and both export buttons', async () => {
    const r = renderLog(log([flag, tick]));
    await r.settle();
    expect(r.byTestId('log-caution').textContent).toContain('not certification');
    expect(r.queryByTestId('export-csv')).not.toBeNull();
    expect(r.queryByTestId('export-pdf')).not.toBeNull();
    expect(r.allByTestIdPrefix('log-day-')).toHaveLength(2);
    expect(r.byTestId('log-entry-f:1').textContent).toContain('Flagged hole U-09');
    expect(r.byTestId('log-entry-f:1').textContent).toContain('“Hole looks oval”');
    expect(r.byTestId('log-count').textContent).toContain('2 entries over 2 days');
  });

  it('says when an entry done without signal arrived, and flags a device clock that was off', async () => {
    const late = entry({ id: 't:2', at: '2026-11-03T09:00:00.000Z', receivedAt: '2026-11-03T11:30:00.000Z' });
    const skewed = entry({ id: 't:3', receivedAt: '2026-11-03T15:00:01.000Z', clockOffsetMs: -42 * 60_000 });
    const r = renderLog(log([tick, late, skewed]));
    await r.settle();
    expect(r.queryByTestId('log-timing-t:1')).toBeNull();
    // The day and time of arrival read on the device's clock, as the entry's own time is.
    expect(r.byTestId('log-timing-t:2').textContent).toMatch(/^Done on the device; received 2026-11-0[34] \d\d:30\.$/);
    expect(r.byTestId('log-timing-t:3').textContent).toBe(
      'Device clock 42 min ahead of the server’s: this time may be off by as much.',
    );
  });

  it('opens the finding when its photo is tapped', async () => {
    const r = renderLog(log([flag, tick]));
    await r.settle();
    await r.press('log-photo-find-1-0');
    expect(mockPush).toHaveBeenCalledWith('/findings/find-1');
  });

  it('narrows to findings at once, and by search words', async () => {
    const r = renderLog(log([flag, tick]), [[{ group: 'findings' }, log([flag])]]);
    await r.settle();
    await r.press('log-kind-findings');
    expect(r.queryByTestId('log-entry-t:1')).toBeNull();
    expect(r.queryByTestId('log-entry-f:1')).not.toBeNull();
    await r.press('log-kind-all');
    await r.type('log-search', 'u-01');
    expect(r.queryByTestId('log-entry-f:1')).toBeNull();
    expect(r.queryByTestId('log-entry-t:1')).not.toBeNull();
    await r.type('log-search', 'nothing like this');
    expect(r.byTestId('empty').textContent).toContain('Nothing matches these filters.');
    await r.press('log-empty-clear');
    expect(r.allByTestIdPrefix('log-entry-')).toHaveLength(2);
  });

  it('says so when nothing has been recorded yet', async () => {
    const r = renderLog(log([]));
    await r.settle();
    expect(r.byTestId('empty').textContent).toContain('Nothing recorded yet.');
  });

  it('exports by fetching the file and handing it to the browser as a download, with the filters and the zone', async () => {
    const click = jest.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => {});
    const created: string[] = [];
    const original = { create: URL.createObjectURL, revoke: URL.revokeObjectURL, fetch: globalThis.fetch };
    URL.createObjectURL = jest.fn(() => {
      created.push('blob:1');
      return 'blob:1';
    });
    URL.revokeObjectURL = jest.fn();
    const fetchMock = jest.fn(async () => ({
      ok: true,
      status: 200,
      headers: {
        get: (h: string) =>
          h.toLowerCase() === 'content-disposition' ? 'attachment; filename="build-log-NK2-0147-2026-11-04.pdf"' : null,
      },
      blob: async () => new Blob(['%PDF-1.7'], { type: 'application/pdf' }),
    }));
    globalThis.fetch = fetchMock as unknown as typeof fetch;
    try {
      const r = renderLog(log([flag, tick]), [[{ group: 'findings' }, log([flag])]]);
      await r.settle();
      await r.press('log-kind-findings');
      await r.press('export-pdf');
      const [calledUrl] = fetchMock.mock.calls[0] as unknown as [string];
      expect(calledUrl).toMatch(/\/api\/builds\/b1\/log\.pdf\?kind=findings/);
      expect(calledUrl).toMatch(/tz=/);
      expect(created).toHaveLength(1);
      expect(click).toHaveBeenCalled();
      expect(r.byTestId('export-done').textContent).toContain('build-log-NK2-0147-2026-11-04.pdf');
    } finally {
      click.mockRestore();
      URL.createObjectURL = original.create;
      URL.revokeObjectURL = original.revoke;
      globalThis.fetch = original.fetch;
    }
  });
});
