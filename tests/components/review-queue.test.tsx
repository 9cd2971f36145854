import type { FindingSummary } from '@/db/contracts';
import { ReviewQueueScreen } from '@/components/findings/review-queue-screen';
import { recordFetch, wrap } from './finding-fixtures';

jest.mock('expo-router', () => ({
  useRouter: () => ({ push: jest.fn(), replace: jest.fn(), back: jest.fn(), dismissTo: jest.fn(), canGoBack: () => false }),
}));
jest.mock('@/hooks/use-wide', () => ({ useWide: () => false }));

const summary = (over: Partial<FindingSummary>): FindingSummary => ({
  id: 'f1', travelerId: 't1', serial: 'NK2-0147-W104', partNumber: 'W-104', kitSerial: 'NK2-0147', buildId: 'b1', holeIds: ['U-12', 'U-11'],
  kind: 'hole_elongated', status: 'raised', disposition: null, closure: null, raisedByName: 'Ada Builder',
  createdAt: '2026-11-30T10:00:00Z', updatedAt: '2026-11-30T10:00:00Z', photoCount: 1, thumbUrl: '/api/photos/p1/thumb', ...over,
});

describe('the review queue on a phone', () => {
  it('folds its filters behind one button that says what is filtered, so the first finding is on the first screen', async () => {
    recordFetch({ '/api/findings': { body: [summary({}), summary({ id: 'f2', kitSerial: 'NK2-0150', buildId: 'b2', photoCount: 0, thumbUrl: null })] } });
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
  });

  it('shows each finding\'s photo on its card, named by its holes', async () => {
    recordFetch({ '/api/findings': { body: [summary({})] } });
    const r = wrap(<ReviewQueueScreen />);
    await r.settle();
    const img = r.byTestId('review-row-f1').querySelector('img');
    expect(img?.getAttribute('src')).toContain('/api/photos/p1/thumb');
    expect(r.byTestId('review-row-f1').querySelector('[aria-label="Photo of U-11 U-12"]')).toBeTruthy();
  });
});
