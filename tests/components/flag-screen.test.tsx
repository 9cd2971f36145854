import { findingKindGroups, judgeMeasurement, type FindingDetail, type TravelerDetail } from '@/db/contracts';
import { FlagScreen, measurementsFor } from '@/components/findings/flag-screen';
import { basisOfTraveler } from '@/components/findings/measure-basis';
import { MeasurementJudgement } from '@/components/findings/measurement-line';
import { storageKeys } from '@/lib/storage';
import { holeU, standardTraveler, upperFlangeOf } from '../fixtures/traveler';
import { finding, recordFetch, wrap } from './finding-fixtures';

const mockDismissTo = jest.fn();
jest.mock('expo-router', () => ({
  useRouter: () => ({
    push: jest.fn(),
    replace: jest.fn(),
    back: jest.fn(),
    dismissTo: mockDismissTo,
    canGoBack: () => false,
  }),
}));
// A phone: one column, the hole grid behind "Change holes".
jest.mock('@/hooks/use-wide', () => ({ useWide: () => false }));

const traveler: TravelerDetail = {
  ...standardTraveler,
  id: '0b7e9a52-5a1c-4b8e-9d0e-3f1f2a6c7d11',
  holesTotal: 3,
  holesDone: 1,
  lines: [upperFlangeOf(4)],
  holes: [holeU(1, 0.25, 'installed'), holeU(2, 1.25, 'pending'), holeU(3, 2.25, 'installed')],
  readiness: { ready: false, reasons: [] },
};

const basis = basisOfTraveler(traveler)!;
const flag = (holes: string[] = ['U-03'], system: 'imperial' | 'metric' = 'imperial') =>
  wrap(<FlagScreen travelerId={traveler.id} initialHoleIds={holes} />, { traveler }, system);

afterEach(() => window.localStorage.clear());

describe('a measurement beside its rule', () => {
  it('shows the rule, its source and whether the value passes, as judgeMeasurement says', () => {
    const over = judgeMeasurement('holeDiameterIn', 0.14, basis);
    const r = wrap(<MeasurementJudgement measure="holeDiameterIn" value={0.14} basis={basis} />);
    const line = r.byTestId('measure-judgement-holeDiameterIn');
    expect(over.pass).toBe(false);
    expect(line.textContent).toContain('Outside the limit');
    expect(line.textContent).toContain(over.limit);
    expect(line.textContent).toContain(`Rule: ${over.rule}`);
    expect(line.textContent).toContain(`Source: ${over.source}`);
    expect(line.querySelector('[aria-label="fails (cross in a square)"]')).toBeTruthy();
  });

  it('passes a value within the rule', () => {
    const r = wrap(<MeasurementJudgement measure="shopHeadDiameterIn" value={0.19} basis={basis} />);
    expect(judgeMeasurement('shopHeadDiameterIn', 0.19, basis).pass).toBe(true);
    expect(r.byTestId('measure-judgement-shopHeadDiameterIn').textContent).toContain('Within the limit');
  });

  it('shows the rule alone before anything is typed', () => {
    const r = wrap(<MeasurementJudgement measure="edgeDistanceIn" value={undefined} basis={basis} />);
    const text = r.byTestId('measure-judgement-edgeDistanceIn').textContent;
    expect(text).toContain('Limit');
    expect(text).toContain(judgeMeasurement('edgeDistanceIn', 0, basis).rule);
    expect(text).not.toContain('Within');
    expect(text).not.toContain('Outside');
  });

  it('gives no verdict when the rivet cannot be read', () => {
    const r = wrap(<MeasurementJudgement measure="edgeDistanceIn" value={0.2} basis={null} />);
    expect(r.byTestId('measure-judgement-edgeDistanceIn').textContent).toContain('the inspector judges it');
  });
});

describe('the flag form', () => {
  it('groups the kinds under what was looked at', async () => {
    const r = flag();
    await r.settle();
    for (const g of findingKindGroups) {
      const group = r.byTestId(`finding-kind-group-${g.group}`);
      expect(group.textContent).toContain(g.label);
      for (const k of g.kinds) expect(group.querySelector(`[data-testid="finding-kind-${k}"]`)).toBeTruthy();
    }
  });

  it('offers only the measurements the kind allows, each beside its rule', async () => {
    const r = flag();
    await r.settle();
    expect(r.queryByTestId('finding-measures')).toBeNull();
    await r.press('finding-kind-hole_elongated');
    expect(r.byTestId('measure-holeDiameterIn')).toBeTruthy();
    expect(r.queryByTestId('measure-edgeDistanceIn')).toBeNull();
    await r.type('measure-holeDiameterIn', '0.140');
    expect(r.byTestId('measure-judgement-holeDiameterIn').textContent).toContain('Outside the limit');
    await r.press('finding-kind-shop_head_small');
    expect(r.queryByTestId('measure-holeDiameterIn')).toBeNull();
    expect(r.byTestId('measure-shopHeadDiameterIn')).toBeTruthy();
    expect(r.byTestId('measure-shopHeadHeightIn')).toBeTruthy();
    await r.press('finding-kind-hole_burrs');
    expect(r.queryByTestId('finding-measures')).toBeNull();
  });

  it('takes millimetres on the metric switch and judges the value in inches', async () => {
    const r = flag(['U-03'], 'metric');
    await r.settle();
    await r.press('finding-kind-hole_elongated');
    await r.type('measure-holeDiameterIn', '3.2');
    // 3.2 mm = 0.126 in: inside the 0.1285 in drill plus clearance.
    expect(r.byTestId('measure-judgement-holeDiameterIn').textContent).toContain('Within the limit');
  });

  it('lists the holes brought from the traveler in one line, the grid behind "Change holes"', async () => {
    const r = flag(['U-03']);
    await r.settle();
    expect(r.byTestId('chosen-holes').textContent).toContain('U-03');
    expect(r.queryByTestId('pick-hole-U-01')).toBeNull();
    await r.press('change-holes');
    expect(r.byTestId('pick-hole-U-03').getAttribute('aria-checked')).toBe('true');
    // The form comes before the grid.
    const order = Array.from(r.container.querySelectorAll('[data-testid]')).map((e) => e.getAttribute('data-testid'));
    expect(order.indexOf('finding-note')).toBeLessThan(order.indexOf('pick-hole-U-01'));
  });

  it('opens the grid at once when no hole was brought', async () => {
    const r = flag([]);
    await r.settle();
    expect(r.byTestId('pick-hole-U-01')).toBeTruthy();
  });

  it('sends the measurements as one JSON field, in inches, and only those of the kind', async () => {
    window.localStorage.setItem(
      storageKeys.findingDraft(null, traveler.id),
      JSON.stringify({
        values: {
          holeIds: ['U-03'],
          kind: 'hole_elongated',
          note: 'Oval toward the trailing edge',
          measurements: { holeDiameterIn: 0.2, shopHeadDiameterIn: 0.3 },
        },
        photos: [{ uri: 'data:image/jpeg;base64,AAAA', name: 'hole.jpg', type: 'image/jpeg' }],
        savedAt: '2026-11-04T10:00:00.000Z',
      }),
    );
    const created: FindingDetail = { ...finding, id: 'f-9' };
    const calls = recordFetch({ '/api/findings': { status: 201, body: created } });
    const r = flag(['U-03'], 'metric');
    await r.settle();
    expect(r.byTestId('draft-restored')).toBeTruthy();
    await r.type('measure-holeDiameterIn', '3.556');
    await r.press('submit-finding');
    const post = calls.find((c) => c.url === '/api/findings' && c.method === 'POST');
    const form = post?.body as FormData;
    expect(JSON.parse(String(form.get('measurements')))).toEqual({ holeDiameterIn: expect.closeTo(0.14, 6) });
    expect(JSON.parse(String(form.get('holeIds')))).toEqual(['U-03']);
    expect(form.get('kind')).toBe('hole_elongated');
    expect(form.getAll('photos')).toHaveLength(1);
    expect(mockDismissTo).toHaveBeenCalledWith(`/travelers/${traveler.id}`);
  });

  it('with no signal and a photo it cannot keep past the page, stays as a draft to send again, not queued', async () => {
    // No IndexedDB here (as in a browser that refuses it): the photo is only the page's, so the finding is
    // not handed to the bench's queue, which could not send it after a reload.
    window.localStorage.setItem(
      storageKeys.findingDraft(null, traveler.id),
      JSON.stringify({
        values: { holeIds: ['U-03'], kind: 'hole_elongated', note: 'Oval toward the trailing edge', measurements: {} },
        photos: [{ uri: 'data:image/jpeg;base64,AAAA', name: 'hole.jpg', type: 'image/jpeg' }],
        savedAt: '2026-11-04T10:00:00.000Z',
      }),
    );
    recordFetch({});
    const answered = global.fetch;
    global.fetch = jest.fn(async (url: string, init?: { method?: string }) => {
      if (init?.method === 'POST') throw new TypeError('Failed to fetch');
      return (answered as unknown as (u: string, i?: unknown) => Promise<unknown>)(url, init);
    }) as unknown as typeof fetch;
    mockDismissTo.mockClear();
    const r = flag(['U-03']);
    await r.settle();
    await r.press('submit-finding');
    await r.settle();
    expect(r.text()).toContain('No connection, so the finding was not sent. It is kept on this device');
    expect(mockDismissTo).not.toHaveBeenCalled();
    expect(
      r.qc
        .getMutationCache()
        .getAll()
        .filter((m) => m.state.status === 'pending'),
    ).toHaveLength(0);
    expect(window.localStorage.getItem(storageKeys.findingDraft(null, traveler.id))).toContain('Oval toward');
  });

  it('keeps only the measurements a kind allows', () => {
    expect(measurementsFor('hole_burrs', { holeDiameterIn: 0.2 })).toEqual({});
    expect(measurementsFor('hole_mislocated', { holeDiameterIn: 0.2, edgeDistanceIn: 0.22, headGapIn: 0.01 })).toEqual({
      holeDiameterIn: 0.2,
      edgeDistanceIn: 0.22,
    });
    expect(measurementsFor('hole_oversize', { holeDiameterIn: Number.NaN })).toEqual({});
  });
});

describe('a draft on a phone two people use', () => {
  const signedInAs = (id: string) =>
    window.localStorage.setItem(
      storageKeys.session,
      JSON.stringify({
        token: `token-of-${id}`,
        expiresAt: '2099-01-01T00:00:00.000Z',
        user: {
          id,
          email: `${id}@bench.example`,
          name: id,
          role: 'builder',
          lead: false,
          organizationId: null,
          organizationName: null,
        },
      }),
    );

  const keepDraft = (key: string, note: string) =>
    window.localStorage.setItem(
      key,
      JSON.stringify({ values: { holeIds: ['U-03'], note }, photos: [], savedAt: '2026-11-04T10:00:00.000Z' }),
    );

  it("is the maker's: restored for them, neither shown to nor sendable by the next person", async () => {
    recordFetch({});
    keepDraft(storageKeys.findingDraft('person-a', traveler.id), 'Oval toward the trailing edge');
    signedInAs('person-b');
    const next = flag(['U-01']);
    await next.settle();
    expect(next.queryByTestId('draft-restored')).toBeNull();
    expect(next.container.textContent).not.toContain('Oval toward the trailing edge');
    next.unmount();

    signedInAs('person-a');
    const maker = flag(['U-01']);
    await maker.settle();
    expect(maker.byTestId('draft-restored')).toBeTruthy();
    expect((maker.byTestId('finding-note') as HTMLTextAreaElement).value).toBe('Oval toward the trailing edge');
  });

  it('kept before drafts had an owner, goes to the first person to open the form, and is theirs after', async () => {
    recordFetch({});
    const unowned = storageKeys.findingDraft(null, traveler.id);
    keepDraft(unowned, 'Crack at the edge');
    signedInAs('person-a');
    const first = flag(['U-03']);
    await first.settle();
    expect(first.byTestId('draft-restored')).toBeTruthy();
    expect(window.localStorage.getItem(unowned)).toBeNull();
    expect(window.localStorage.getItem(storageKeys.findingDraft('person-a', traveler.id))).toContain(
      'Crack at the edge',
    );
  });
});
