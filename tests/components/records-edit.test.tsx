import type { CouponTest, PartDesignDetail, Revision } from '@/db/contracts';
import { BuildScreen } from '@/components/builds/build-screen';
import { CouponsScreen } from '@/components/coupons/coupons-screen';
import { DesignScreen } from '@/components/designs/design-screen';
import { buildKeys, type BuildPage } from '@/hooks/queries/builds';
import { couponKeys } from '@/hooks/queries/coupons';
import { designKeys } from '@/hooks/queries/designs';
import { flangeLine, ribRevision } from '../fixtures/rib-revision';
import { buildPeople, lead, recordFetch, wrapSignedIn } from './people-fixtures';

jest.mock('expo-router', () => jest.requireActual('../helpers/expo-router-stub'));

const revision = (over: Partial<Revision> = {}): Revision => ({
  id: 'r-b',
  partDesignId: 'd-1',
  letter: 'B',
  status: 'draft',
  ...ribRevision,
  lines: [flangeLine('U', 30, [{ fromIn: 0, toIn: 30, pitchIn: 1 }])],
  steps: [],
  changeNote: 'Wider pitch aft',
  basis: null,
  studyId: null,
  createdAt: '2026-11-01T00:00:00.000Z',
  publishedAt: null,
  publishedByName: null,
  allowedActions: ['edit', 'publish', 'discard'],
  ...over,
});
const design = (revisions: Revision[]): PartDesignDetail => ({
  id: 'd-1',
  kitModelId: 'k-1',
  kitName: 'NK-2 Quillon',
  partNumber: 'W-104',
  name: 'Wing rib, inboard',
  kind: 'rib',
  publishedLetter: 'A',
  revisions,
});
const publishedA = revision({
  id: 'r-a',
  letter: 'A',
  status: 'published',
  publishedAt: '2026-10-01T00:00:00.000Z',
  publishedByName: 'Maren Holt',
  allowedActions: [],
});

function showDesign(revisions: Revision[], routes: Parameters<typeof recordFetch>[0] = {}) {
  const calls = recordFetch(routes);
  const r = wrapSignedIn(<DesignScreen designId="d-1" />, lead, [
    [designKeys.detail('d-1'), design(revisions)],
    [designKeys.clusters('d-1'), []],
  ]);
  return { r, calls };
}
const writes = (calls: { method: string }[]) => calls.filter((c) => c.method !== 'GET');

describe('publishing is asked before it is sent', () => {
  it('says the approval cannot be undone, sends nothing until confirmed, and nothing when left as it is', async () => {
    const { r, calls } = showDesign([revision(), publishedA], {
      '/api/revisions/r-b/publish': { body: revision({ status: 'published', allowedActions: [] }) },
    });
    await r.settle();
    await r.press('publish');
    expect(r.byTestId('publish-ask-message').textContent).toMatch(/cannot be undone/);
    expect(writes(calls)).toEqual([]);
    await r.press('publish-ask-cancel');
    expect(r.queryByTestId('publish-ask')).toBeNull();
    expect(writes(calls)).toEqual([]);
    await r.press('publish');
    await r.press('publish-ask-confirm');
    expect(writes(calls)).toEqual([{ url: '/api/revisions/r-b/publish', method: 'POST', body: {} }]);
  });

  it('discards a draft only after asking, with one DELETE of that revision', async () => {
    const { r, calls } = showDesign([revision(), publishedA], { '/api/revisions/r-b': { body: design([publishedA]) } });
    await r.settle();
    await r.press('discard-draft');
    expect(r.byTestId('discard-ask-message').textContent).toMatch(/published revisions of this part stay/);
    expect(writes(calls)).toEqual([]);
    await r.press('discard-ask-confirm');
    expect(writes(calls)).toEqual([{ url: '/api/revisions/r-b', method: 'DELETE', body: undefined }]);
    expect(r.queryByTestId('revision-B')).toBeNull();
  });

  it('draws no save, publish or discard that the answer does not list', async () => {
    const { r } = showDesign([revision({ allowedActions: [] })]);
    await r.settle();
    for (const id of ['save-draft', 'publish', 'discard-draft']) expect(r.queryByTestId(id)).toBeNull();
  });
});

const coupon = (over: Partial<CouponTest>): CouponTest => ({
  id: 'c-1',
  material: '6061-T6',
  gaugeIn: 0.02,
  couponWidthIn: 1,
  rivetSpec: 'PULLED-4',
  loadLb: 30,
  outcome: 'slight_deformation',
  note: '',
  testedOn: '2026-10-14',
  createdAt: '2026-10-14T10:00:00.000Z',
  createdByName: 'Maren Holt',
  correctionReason: '',
  correctedBy: null,
  backs: [],
  allowedActions: ['correct', 'delete'],
  ...over,
});

describe('the coupon record', () => {
  const show = (tests: CouponTest[]) => {
    const calls = recordFetch({ '/api/coupons/c-3': { status: 204, body: '' } });
    const r = wrapSignedIn(<CouponsScreen />, lead, [
      [couponKeys.list(), { pages: [{ items: tests, next: null }], pageParams: [null] }],
      [couponKeys.allowables(), []],
    ]);
    return { r, calls };
  };

  it('shows a corrected entry as corrected, with who and why, and offers nothing on it', async () => {
    const { r } = show([
      coupon({
        id: 'c-1',
        correctedBy: { id: 'c-2', byName: 'Maren Holt', at: '2026-11-02T09:00:00.000Z', reason: 'tare left on' },
        allowedActions: [],
      }),
      coupon({ id: 'c-2', loadLb: 25, correctionReason: 'tare left on' }),
    ]);
    await r.settle();
    expect(r.byTestId('coupon-corrected-c-1').textContent).toMatch(/Corrected 2026-11-02 by Maren Holt: tare left on/);
    expect(r.queryByTestId('coupon-correct-c-1')).toBeNull();
    expect(r.queryByTestId('coupon-delete-c-1')).toBeNull();
    expect(r.byTestId('coupon-correction-of-c-2').textContent).toMatch(/tare left on/);
  });

  it('offers delete only where the answer lists it, and says which revision a kept test may back', async () => {
    const { r, calls } = show([
      coupon({ id: 'c-1', backs: ['W-190 revision A'], allowedActions: ['correct'] }),
      coupon({ id: 'c-3', loadLb: 12 }),
    ]);
    await r.settle();
    expect(r.queryByTestId('coupon-delete-c-1')).toBeNull();
    expect(r.byTestId('coupon-row-c-1').textContent).toMatch(/May back W-190 revision A/);
    await r.press('coupon-delete-c-3');
    expect(writes(calls)).toEqual([]);
    await r.press('coupon-delete-ask-confirm');
    expect(writes(calls)).toEqual([{ url: '/api/coupons/c-3', method: 'DELETE', body: undefined }]);
  });
});

describe('a build as shipped', () => {
  const page = (over: Partial<BuildPage>): BuildPage => ({
    id: 'b-1',
    kitSerial: 'NK2-0200',
    kitName: 'NK-2 Quillon',
    supplierName: 'Northfold Kitworks',
    createdAt: '2026-01-03T00:00:00.000Z',
    builders: [],
    inspectors: [],
    travelerCount: 2,
    holesTotal: 0,
    holesDone: 0,
    openFindings: 0,
    travelers: [],
    people: buildPeople([]),
    note: '',
    allowedActions: [],
    fixedBecause: null,
    ...over,
  });
  const show = (p: BuildPage) => {
    const calls = recordFetch({ '/api/builds/b-1': { status: 204, body: '' } });
    const r = wrapSignedIn(<BuildScreen buildId="b-1" />, lead, [[buildKeys.detail('b-1'), p]]);
    return { r, calls };
  };

  it('offers the note only, saying why, once work is recorded', async () => {
    const { r } = show(
      page({ allowedActions: ['edit-note'], fixedBecause: 'work is recorded on this build (9 holes worked)' }),
    );
    await r.settle();
    expect(r.byTestId('build-edit').textContent).toBe('Change the note…');
    expect(r.byTestId('build-fixed').textContent).toMatch(/9 holes worked/);
    expect(r.queryByTestId('build-delete')).toBeNull();
    await r.press('build-edit');
    expect(r.queryByTestId('build-serial-edit')).toBeNull();
  });

  it('offers nothing to a reader the answer lists nothing for', async () => {
    const { r } = show(page({}));
    await r.settle();
    expect(r.queryByTestId('build-record')).toBeNull();
  });

  it('deletes a fresh build only after asking', async () => {
    const { r, calls } = show(page({ allowedActions: ['edit-note', 'change-serial', 'delete'] }));
    await r.settle();
    await r.press('build-delete');
    expect(r.byTestId('build-delete-ask-message').textContent).toMatch(/Delete build NK2-0200\? Its 2 parts/);
    expect(writes(calls)).toEqual([]);
    await r.press('build-delete-ask-confirm');
    expect(writes(calls)).toEqual([{ url: '/api/builds/b-1', method: 'DELETE', body: undefined }]);
  });
});
