import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import type { ReactElement } from 'react';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import type { FindingDetail } from '@/db/contracts';
import { FindingScreen } from '@/components/findings/finding-screen';
import { formatMargin, ReworkCheckPanel } from '@/components/findings/rework-check-panel';
import { findingKeys, type ReworkCheckResult } from '@/hooks/queries/findings';
import { storageKeys } from '@/hooks/storage';
import { UnitsProvider } from '@/hooks/use-units';
import { SessionProvider } from '@/hooks/use-session';
import { renderWeb } from './render-web';

/** The demo finding: hole U-09 of W-104, MS20470AD4 at 0.25 in edge distance, 1 in pitch both sides. */
const finding: FindingDetail = {
  id: 'f-1', travelerId: 'trav-1', serial: 'NK2-0147-W-104', partNumber: 'W-104', kitSerial: 'NK2-0147', holeIds: ['U-09'],
  kind: 'elongated', status: 'in_review', disposition: null, flaggedByName: 'Sam Builder',
  createdAt: '2025-01-10T10:00:00.000Z', updatedAt: '2025-01-10T10:00:00.000Z', photoCount: 0, thumbUrl: null,
  note: 'Hole looks oval', dispositionNote: null, photos: [], events: [],
  context: {
    line: 'U', stationIn: 9, prevStationIn: 8, nextStationIn: 10, edgeDistanceIn: 0.25, drillDiameterIn: 0.1285,
    rivetSpec: 'MS20470AD4', gaugeIn: 0.032, material: '6061-T6',
    oversizeOptions: [{ code: 'MS20470AD5', dash: 5, step: 1 }, { code: 'MS20470AD6', dash: 6, step: 2 }],
  },
};

const caution = 'An aid only: the kit supplier\'s approved data and the applicable airworthiness rules and local authority govern. '
  + 'Margins come from the inputs given and are only as good as they are. Nothing here is certification or approval of a design or repair.';
const rules = ['layout: edge distance ≥ 2D, pitch ≥ 3D (FAA AC 43.13-1B ch. 4) of the new diameter (FAA AC 43.13-1B 4-57)'];
const inputs = {
  rivetSpec: 'MS20470AD4', proposedSpec: 'MS20470AD5', holeStationIn: 9, neighbourStationsIn: [8, 10] as [number, number],
  edgeDistanceIn: 0.25, gaugeIn: 0.032, material: '6061-T6',
};

// Shapes as server/engineering/rework-check.ts answers them (numbers copied from a run of the engine).
/** AD4 → AD5 at the existing 0.25 in edge distance fails: 2D of 5/32 is 0.3125 (FAA AC 43.13-1B 4-57). */
const fail: ReworkCheckResult = {
  inputs, rules, caution, pass: false,
  warnings: ['no applied loads given: strength margins are not checked, only the layout'],
  reasons: ['edge distance 0.2500 in is less than 2D = 0.3125 in for MS20470AD5'],
  newDrill: { name: '#21', diameterIn: 0.159 }, requiredEdgeIn: 0.3125, requiredPitchIn: 0.46875, pitchToNeighboursIn: [1, 1],
  margins: { shearLimit: null, shearUltimate: null, tensionLimit: null, tensionUltimate: null, combinedLimit: null, combinedUltimate: null },
  alternative: 'repair with doubler',
};

const pass: ReworkCheckResult = {
  inputs: { ...inputs, edgeDistanceIn: 0.35, appliedLimitTensionLb: 10, appliedLimitShearLb: 60 }, rules, caution, pass: true,
  warnings: ['no coupon data for 0.032 in 6061-T6 with MS20470AD5: pull-through allowable is a conservative fraction (8 %)'],
  reasons: [], newDrill: { name: '#21', diameterIn: 0.159 }, requiredEdgeIn: 0.3125, requiredPitchIn: 0.46875, pitchToNeighboursIn: [1, 1],
  margins: { shearLimit: 3.9184, shearUltimate: 3.97493, tensionLimit: 1.38797, tensionUltimate: 1.38797, combinedLimit: 1.14816, combinedUltimate: 1.15281 },
  alternative: null,
};

/** Thin sheet, a close neighbour and a pull load: negative margins and a short pitch. */
const negative: ReworkCheckResult = {
  ...fail,
  inputs: { ...inputs, gaugeIn: 0.016, neighbourStationsIn: [8.6, null] as unknown as [number, number], appliedLimitTensionLb: 90 },
  warnings: [],
  reasons: [
    'edge distance 0.2500 in is less than 2D = 0.3125 in for MS20470AD5',
    'pitch to the previous hole 0.4000 in is less than 3D = 0.4688 in for MS20470AD5',
    'margin of safety at limit load is -0.89 with MS20470AD5',
  ],
  pitchToNeighboursIn: [0.4, null],
  margins: { shearLimit: null, shearUltimate: null, tensionLimit: -0.89266, tensionUltimate: -0.89266, combinedLimit: -0.89266, combinedUltimate: -0.89266 },
};

type Call = { url: string; body: unknown };
let calls: Call[] = [];

/** The rework check answers `body` with `status`; a disposition is recorded as sent. */
function answer(status: number, body: unknown) {
  global.fetch = jest.fn(async (url: string, init?: { body?: string }) => {
    const sent = init?.body ? JSON.parse(init.body) : undefined;
    calls.push({ url: String(url), body: sent });
    if (String(url).endsWith('/disposition')) {
      const done = { ...finding, status: 'dispositioned', disposition: sent.disposition, dispositionNote: sent.note };
      return { ok: true, status: 200, text: async () => JSON.stringify(done) };
    }
    return { ok: status < 400, status, text: async () => JSON.stringify(body) };
  }) as unknown as typeof fetch;
}

beforeEach(() => { calls = []; });

function wrap(ui: ReactElement, system: 'imperial' | 'metric' = 'imperial') {
  const qc = new QueryClient({ defaultOptions: { queries: { retry: false, staleTime: Infinity }, mutations: { retry: false } } });
  qc.setQueryData(findingKeys.detail(finding.id), finding);
  return renderWeb(
    <SafeAreaProvider initialMetrics={{ frame: { x: 0, y: 0, width: 390, height: 844 }, insets: { top: 0, left: 0, right: 0, bottom: 0 } }}>
      <QueryClientProvider client={qc}>
        <UnitsProvider initial={system}>
          <SessionProvider>{ui}</SessionProvider>
        </UnitsProvider>
      </QueryClientProvider>
    </SafeAreaProvider>,
  );
}

describe('the oversize rivets offered', () => {
  it('margins read signed with two places, "—" where not checked', () => {
    expect(formatMargin(1.14816)).toBe('+1.15');
    expect(formatMargin(-0.89266)).toBe('−0.89');
    expect(formatMargin(null)).toBe('—');
  });
});

describe('the rework check panel', () => {
  it('offers the next two sizes, the next one chosen, and asks the server for its default', async () => {
    answer(200, fail);
    const r = wrap(<ReworkCheckPanel f={finding} />);
    await r.settle();
    expect(r.byTestId('rework-proposed-MS20470AD5').getAttribute('aria-checked')).toBe('true');
    expect(r.byTestId('rework-proposed-MS20470AD6').getAttribute('aria-checked')).toBe('false');
    expect(r.queryByTestId('rework-result')).toBeNull();
    await r.press('rework-check');
    expect(calls).toEqual([{ url: '/api/findings/f-1/rework-check', body: {} }]);
  });

  it('shows a fail: FAIL with its mark, the reasons, the alternative, the numbers and the caution', async () => {
    answer(200, fail);
    const r = wrap(<ReworkCheckPanel f={finding} />);
    await r.press('rework-check');
    const verdict = r.byTestId('rework-result');
    expect(verdict.textContent).toContain('FAIL');
    expect(verdict.textContent).toContain('MS20470AD5 in place of MS20470AD4');
    // the shape, not colour alone
    expect(verdict.querySelector('[aria-label="fails (cross in a square)"]')).toBeTruthy();
    expect(r.byTestId('rework-reasons').textContent).toContain('0.3125 in');
    expect(r.byTestId('rework-alternative').textContent).toContain('Repair with a doubler');
    expect(r.byTestId('rework-new-drill').textContent).toContain('#21 · 0.159 in');
    const edge = r.byTestId('rework-edge').textContent;
    expect(edge).toContain('needs ≥ 0.3125 in');
    expect(edge).toContain('has 0.250 in');
    expect(edge).toContain('short by 0.0625 in');
    expect(r.byTestId('rework-pitch-before').textContent).toContain('enough');
    expect(r.byTestId('rework-pitch-after').textContent).toContain('needs ≥ 0.4688 in');
    expect(r.byTestId('rework-ms-combined-limit').textContent).toBe('—');
    expect(r.byTestId('rework-warnings').textContent).toContain('no applied loads');
    expect(r.byTestId('rework-caution').textContent).toContain('Nothing here is certification');
    expect(r.queryByTestId('rework-rules')).toBeNull();
    await r.press('rework-rules-toggle');
    expect(r.byTestId('rework-rules').textContent).toContain('FAA AC 43.13-1B 4-57');
  });

  it('shows a pass: PASS with its mark, no alternative, and the margins', async () => {
    answer(200, pass);
    const r = wrap(<ReworkCheckPanel f={finding} />);
    await r.press('rework-check');
    const verdict = r.byTestId('rework-result');
    expect(verdict.textContent).toContain('PASS');
    expect(verdict.textContent).not.toContain('FAIL');
    expect(verdict.querySelector('[aria-label="meets (tick in a circle)"]')).toBeTruthy();
    expect(r.queryByTestId('rework-alternative')).toBeNull();
    expect(r.byTestId('rework-reasons').textContent).toContain('meet the rules');
    expect(r.byTestId('rework-edge').textContent).toContain('enough');
    expect(r.byTestId('rework-ms-combined-limit').textContent).toBe('+1.15');
    expect(r.byTestId('rework-ms-shear-ultimate').textContent).toBe('+3.97');
    expect(r.byTestId('rework-caution')).toBeTruthy();
  });

  it('boxes negative margins and says a missing neighbour is none', async () => {
    answer(200, negative);
    const r = wrap(<ReworkCheckPanel f={finding} />);
    await r.press('rework-check');
    expect(r.byTestId('rework-ms-tension-limit').getAttribute('aria-label')).toBe('negative margin −0.89');
    expect(r.byTestId('rework-ms-shear-limit').getAttribute('aria-label')).toBe('not checked, no applied load');
    expect(r.text()).toContain('a negative margin');
    expect(r.byTestId('rework-pitch-before').textContent).toContain('short by 0.0687 in');
    expect(r.byTestId('rework-pitch-after').textContent).toContain('no hole after');
  });

  it('sends the size chosen, and says when the result shown is for another', async () => {
    answer(200, { ...fail, inputs: { ...inputs, proposedSpec: 'MS20470AD6' } });
    const r = wrap(<ReworkCheckPanel f={finding} />);
    await r.press('rework-proposed-MS20470AD6');
    await r.press('rework-check');
    expect(calls[0].body).toEqual({ proposedSpec: 'MS20470AD6' });
    expect(r.byTestId('rework-result').textContent).toContain('MS20470AD6');
    await r.press('rework-proposed-MS20470AD5');
    expect(r.byTestId('rework-stale').textContent).toContain('Press Check for MS20470AD5');
  });

  it('shows lengths in millimetres on the metric switch', async () => {
    answer(200, fail);
    const r = wrap(<ReworkCheckPanel f={finding} />, 'metric');
    await r.press('rework-check');
    expect(r.byTestId('rework-edge').textContent).toContain('needs ≥ 7.94 mm');
    expect(r.byTestId('rework-edge').textContent).toContain('has 6.35 mm');
  });

  it('says plainly when the server refuses (the largest rivet of its family)', async () => {
    const message = 'MS20470AD8 is the largest rivet of its family: repair with a doubler or scrap';
    answer(409, { error: { code: 'conflict', message } });
    const top = { ...finding, context: { ...finding.context, rivetSpec: 'MS20470AD8', oversizeOptions: [] } };
    const r = wrap(<ReworkCheckPanel f={top} />);
    await r.settle();
    expect(r.byTestId('rework-no-larger').textContent).toContain('largest size of its family');
    await r.press('rework-check');
    expect(r.byTestId('rework-error').textContent).toContain(message);
    expect(r.queryByTestId('rework-result')).toBeNull();
  });
});

describe('the finding screen for the inspector', () => {
  beforeEach(() => {
    const user = { id: 'u-i', email: 'priya@checkpoint.example', name: 'Priya', role: 'inspector', organizationId: null, organizationName: null };
    window.localStorage.setItem(storageKeys.session, JSON.stringify({ token: 't', expiresAt: new Date(Date.now() + 3600e3).toISOString(), user }));
  });
  afterEach(() => window.localStorage.clear());

  it('has the rework check, and choosing rework after a failed check warns without blocking', async () => {
    answer(200, fail);
    const r = wrap(<FindingScreen findingId={finding.id} />);
    await r.settle();
    expect(r.byTestId('rework-check-section')).toBeTruthy();
    await r.press('disposition-rework');
    expect(r.byTestId('rework-check-none')).toBeTruthy();
    expect(r.queryByTestId('rework-check-failed')).toBeNull();

    await r.press('rework-check');
    expect(r.byTestId('rework-result').textContent).toContain('FAIL');
    const warning = r.byTestId('rework-check-failed');
    expect(warning.textContent).toContain('The rework check failed for MS20470AD5');
    expect(warning.textContent).toContain('repair with a doubler');

    await r.press('disposition-repair');
    expect(r.queryByTestId('rework-check-failed')).toBeNull();

    // The inspector decides: rework can still be recorded.
    await r.press('disposition-rework');
    await r.type('disposition-note', 'Drill to #21, fit AD5, dress the edge');
    await r.press('submit-disposition');
    expect(calls.at(-1)).toEqual({
      url: '/api/findings/f-1/disposition',
      body: { disposition: 'rework', note: 'Drill to #21, fit AD5, dress the edge' },
    });
  });

  it('does not warn when the check passed', async () => {
    answer(200, pass);
    const r = wrap(<FindingScreen findingId={finding.id} />);
    await r.settle();
    await r.press('rework-check');
    await r.press('disposition-rework');
    expect(r.queryByTestId('rework-check-failed')).toBeNull();
  });
});
