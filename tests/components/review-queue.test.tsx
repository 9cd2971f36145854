import { QueryClient } from '@tanstack/react-query';
import type { FindingSummary } from '@/db/contracts';
import { findingKeys, patchFindingInLists } from '@/hooks/queries/findings';
import { ReviewQueueScreen } from '@/components/findings/review-queue-screen';
import { MyFindingsScreen } from '@/components/findings/my-findings-screen';
import { wrap } from './finding-fixtures';

jest.mock('expo-router', () => jest.requireActual('../helpers/expo-router-stub'));
jest.mock('@/hooks/use-wide', () => ({ useWide: () => false }));

const summary = (over: Partial<FindingSummary>): FindingSummary => ({
  id: 'f1',
  travelerId: 't1',
  serial: 'NK2-0147-W104',
  partNumber: 'W-104',
  kitSerial: 'NK2-0147',
  buildId: 'b1',
  holeIds: ['U-12', 'U-11'],
  kind: 'hole_elongated',
  status: 'raised',
  disposition: null,
  closure: null,
  raisedByName: 'Ada Builder',
  createdAt: '2026-11-30T10:00:00Z',
  updatedAt: '2026-11-30T10:00:00Z',
  photoCount: 1,
  thumbUrl: '/api/photos/p1/thumb',
  ...over,
});

/**
 * GET /api/findings as the contract says (db/contracts/findings.ts): the rows that pass `status` and
 * `buildId`, `limit` (here 2 unless asked) at a time, `next` an opaque cursor. Every URL asked is kept.
 */
function serveFindings(rows: FindingSummary[], pageSize = 2) {
  const asked: URL[] = [];
  global.fetch = jest.fn(async (input: string) => {
    const url = new URL(String(input), 'http://app.test');
    if (url.pathname !== '/api/findings')
      return {
        ok: false,
        status: 404,
        text: async () => JSON.stringify({ error: { code: 'not_found', message: 'no route' } }),
      };
    asked.push(url);
    const status = url.searchParams.get('status');
    const buildId = url.searchParams.get('buildId');
    const matching = rows.filter(
      (r) =>
        (!status || (status === 'open' ? r.status !== 'closed' : r.status === status)) &&
        (!buildId || r.buildId === buildId),
    );
    const from = url.searchParams.get('cursor')
      ? Number(Buffer.from(url.searchParams.get('cursor')!, 'base64url').toString())
      : 0;
    const items = matching.slice(from, from + pageSize);
    const next = from + pageSize < matching.length ? Buffer.from(String(from + pageSize)).toString('base64url') : null;
    return { ok: true, status: 200, text: async () => JSON.stringify({ items, next }) };
  }) as unknown as typeof fetch;
  return asked;
}

describe('the review queue on a phone', () => {
  it('folds its filters behind one button that says what is filtered, so the first finding is on the first screen', async () => {
    const asked = serveFindings([
      summary({}),
      summary({ id: 'f2', kitSerial: 'NK2-0150', buildId: 'b2', photoCount: 0, thumbUrl: null }),
    ]);
    const r = wrap(<ReviewQueueScreen />);
    await r.settle();
    expect(r.queryByTestId('filter-status-open')).toBeNull();
    expect(r.byTestId('toggle-filters').textContent).toBe('Filters: Open · all builds');
    expect(r.byTestId('review-row-f1')).toBeTruthy();
    await r.press('toggle-filters');
    expect(r.byTestId('filter-status-open')).toBeTruthy();
    expect(r.byTestId('filter-build-NK2-0150')).toBeTruthy();
    await r.press('filter-build-NK2-0150');
    await r.press('toggle-filters');
    expect(r.byTestId('toggle-filters').textContent).toBe('Filters: Open · NK2-0150');
    expect(r.queryByTestId('review-row-f1')).toBeNull();
    // State and build are the server's to filter, so each page is full of what was asked for.
    expect(asked[0].searchParams.get('status')).toBe('open');
    expect(asked.at(-1)!.searchParams.get('buildId')).toBe('b2');
  });

  it("shows each finding's photo on its card, named by its holes", async () => {
    serveFindings([summary({})]);
    const r = wrap(<ReviewQueueScreen />);
    await r.settle();
    const img = r.byTestId('review-row-f1').querySelector('img');
    expect(img?.getAttribute('src')).toContain('/api/photos/p1/thumb');
    expect(r.byTestId('review-row-f1').querySelector('[aria-label="Photo of U-11 U-12"]')).toBeTruthy();
  });
});

describe('the findings lists in pages', () => {
  const many = ['f1', 'f2', 'f3', 'f4', 'f5'].map((id, i) =>
    summary({ id, holeIds: [`U-0${i + 1}`], status: i === 4 ? 'closed' : 'raised' }),
  );

  it('shows the first page and loads the next at its foot, with the cursor the server gave, until all are shown', async () => {
    const asked = serveFindings(many);
    const r = wrap(<ReviewQueueScreen />);
    await r.settle();
    expect(r.allByTestIdPrefix('review-row-').map((e) => e.dataset.testid)).toEqual(['review-row-f1', 'review-row-f2']);
    expect(r.byTestId('review-count').textContent).toBe('2 shown · more to load');
    await r.press('review-more');
    expect(asked[1].searchParams.get('cursor')).toBe(Buffer.from('2').toString('base64url'));
    // f5 is closed: the open queue ends at f4, and says so.
    expect(r.allByTestIdPrefix('review-row-').map((e) => e.dataset.testid)).toEqual([
      'review-row-f1',
      'review-row-f2',
      'review-row-f3',
      'review-row-f4',
    ]);
    expect(r.byTestId('review-more-end').textContent).toBe('All 4 findings shown');
    expect(asked).toHaveLength(2);
  });

  it('asks the server for what awaits the design authority oldest first, and pages it too', async () => {
    const asked = serveFindings(many.map((f) => ({ ...f, status: 'awaiting_approval' as const })));
    const r = wrap(
      <ReviewQueueScreen
        first={{ status: 'awaiting_approval', title: 'Awaiting your approval', empty: 'Nothing awaits your approval.' }}
      />,
    );
    await r.settle();
    const first = asked.find((u) => u.searchParams.get('status') === 'awaiting_approval')!;
    expect(first.searchParams.get('order')).toBe('oldest');
    expect(r.byTestId('review-first').textContent).toContain('Awaiting your approval (2+)');
    await r.press('review-first-more');
    expect(r.byTestId('review-first').textContent).toContain('Awaiting your approval (4+)');
  });

  it('gives the builder their open findings a page at a time, and all of them when asked', async () => {
    const asked = serveFindings(many);
    const r = wrap(<MyFindingsScreen />);
    await r.settle();
    expect(r.allByTestIdPrefix('finding-').filter((e) => /^finding-f\d$/.test(e.dataset.testid ?? '')).length).toBe(2);
    await r.press('findings-more');
    expect(r.byTestId('findings-more-end').textContent).toBe('All 4 findings shown');
    await r.press('findings-show-all');
    expect(asked.at(-1)!.searchParams.get('status')).toBeNull();
    await r.press('findings-more');
    await r.press('findings-more');
    expect(r.byTestId('findings-more-end').textContent).toBe('All 5 findings shown');
  });
});

describe('a finding changed by a decision', () => {
  it('is written into every loaded page that shows it, the pages keeping their shape', () => {
    const qc = new QueryClient();
    const pages = {
      pageParams: [null, 'c2'],
      pages: [
        { items: [summary({ id: 'f1' }), summary({ id: 'f2' })], next: 'c2' },
        { items: [summary({ id: 'f3' })], next: null },
      ],
    };
    qc.setQueryData(findingKeys.list({ status: 'open' }), pages);
    qc.setQueryData(findingKeys.list({ status: 'closed' }), { pageParams: [null], pages: [{ items: [], next: null }] });
    patchFindingInLists(qc, summary({ id: 'f3', status: 'work_ordered', disposition: 'rework' }));
    const open = qc.getQueryData<typeof pages>(findingKeys.list({ status: 'open' }))!;
    expect(open.pageParams).toEqual([null, 'c2']);
    expect(open.pages.map((p) => p.items.map((f) => `${f.id}:${f.status}`))).toEqual([
      ['f1:raised', 'f2:raised'],
      ['f3:work_ordered'],
    ]);
    expect(open.pages[0]).toBe(pages.pages[0]);
    expect(qc.getQueryData(findingKeys.list({ status: 'closed' }))).toEqual({
      pageParams: [null],
      pages: [{ items: [], next: null }],
    });
  });
});
