import { act } from 'react';
import type { PartDesignSummary, StudyDetail } from '@/db/contracts';
import { StudyResults } from '@/components/studies/study-results';
import { initialCandidate, readStudyResult, tradeRowTestId } from '@/components/studies/study-result';
import { designKeys } from '@/hooks/queries/designs';
import { studyKeys } from '@/hooks/queries/studies';
// The test computes the demo study with the real engine, so the screen is checked against the very
// shape the server stores (the app itself never imports server/).
import { ribCandidate, ribStudy } from '@/server/engineering';
import { tradeCoupons } from '../fixtures/coupons';
import { standardRibStudy } from '../fixtures/rib-study';
import { fakeLayout, KIT_ID, renderWithQueries } from './studies-render';

// Whole screens render in jsdom: slower than a unit test, more so when the machine is busy.
jest.setTimeout(30_000);

// jsdom lays nothing out: every element is as wide as a results pane.
fakeLayout(() => 640);

const KIT = KIT_ID;
const inputs = standardRibStudy;
// The trade's coupons, each on a 1 in wide strip.
const coupons = tradeCoupons.map((c) => ({ ...c, couponWidthIn: 1 }));
const result = ribStudy({ ...inputs, coupons });
// What GET /api/studies/:id/candidate answers for a candidate stored without its holes.
const unstored = { gaugeIn: 0.016, rivet: 'PULLED-4' };
const unstoredWhole = ribCandidate({ ...inputs, coupons }, unstored);

const detail = (revision = 2): StudyDetail => ({
  id: 'study-1',
  kind: 'rib',
  kitModelId: KIT,
  kitName: 'NK-2 Quillon',
  name: 'Inboard rib',
  revision,
  updatedAt: '2026-10-14T10:00:00Z',
  recommended: result.recommended,
  inputs,
  result: result as never,
  revisions: [
    { revision: 1, createdAt: '2026-10-13T10:00:00Z', createdByName: 'Maren' },
    { revision: 2, createdAt: '2026-10-14T10:00:00Z', createdByName: 'Maren' },
  ],
});

const designs: PartDesignSummary[] = [
  {
    id: 'd-104',
    kitModelId: KIT,
    kitName: 'NK-2',
    partNumber: 'W-104',
    name: 'Wing rib, inboard',
    kind: 'rib',
    latest: { id: 'r', letter: 'A', status: 'published' },
    publishedLetter: 'A',
  },
];

function renderResults(
  d = detail(),
  latest = 2,
  system: 'imperial' | 'metric' = 'imperial',
  candidates: { holes: boolean } = { holes: true },
) {
  return renderWithQueries(
    system,
    (qc) => {
      qc.setQueryData(designKeys.choices(KIT), designs);
      if (candidates.holes)
        qc.setQueryData(studyKeys.candidate(d.id, d.revision, unstored.gaugeIn, unstored.rivet), unstoredWhole);
    },
    <StudyResults detail={d} latestRevision={latest} />,
  );
}

describe('reading a stored study result', () => {
  it('accepts the engine’s result and starts from its recommendation', () => {
    const r = readStudyResult(result)!;
    expect(r).not.toBeNull();
    expect(initialCandidate(r)).toEqual({ gaugeIn: 0.02, rivet: 'PULLED-4' });
  });

  it('keeps the holes of the recommended candidate only', () => {
    const r = readStudyResult(result)!;
    const stored = r.candidates.filter((c) => c.holesStored);
    expect(stored.map((c) => `${c.gaugeIn} ${c.rivet}`)).toEqual(['0.02 PULLED-4']);
    const other = r.candidates.find((c) => c.gaugeIn === 0.016 && c.rivet === 'PULLED-4')!;
    expect(other.lines.every((l) => l.holes.length === 0 && l.zones.length > 0)).toBe(true);
  });

  it('refuses a stored result of another shape instead of drawing nonsense', () => {
    expect(readStudyResult({ conditions: [] })).toBeNull();
    expect(readStudyResult(null)).toBeNull();
  });

  it('names a trade row by the gauge as JavaScript prints it', () => {
    expect(tradeRowTestId({ gaugeIn: 0.02, rivet: 'PULLED-4' })).toBe('trade-row-0.02-PULLED-4');
  });
});

describe('the results of a load study', () => {
  it('shows the engine’s caution with the result', async () => {
    const r = await renderResults();
    expect(r.byTestId('study-caution').textContent).toContain(result.caution);
  });

  it('marks the recommended row of the trade table and shows it first', async () => {
    const r = await renderResults();
    expect(r.byTestId('study-recommended').textContent).toContain('0.020 in');
    expect(r.byTestId('trade-row-0.02-PULLED-4-recommended')).toBeTruthy();
    expect(r.byTestId('trade-row-0.02-PULLED-4-chosen')).toBeTruthy();
    expect(r.allByTestIdPrefix('trade-row-')[0].getAttribute('data-testid')).toBe('trade-row-0.02-PULLED-4');
  });

  it('draws the rib, the pressure of the chosen condition, the loads and the zones', async () => {
    const r = await renderResults();
    expect(r.byTestId('cp-outline')).toBeTruthy();
    expect(r.byTestId('cp-curve-upper')).toBeTruthy();
    expect(r.byTestId('allowable-limit')).toBeTruthy();
    expect(r.byTestId('allowable-ultimate')).toBeTruthy();
    expect(r.byTestId('zone-0-0')).toBeTruthy();
    expect(r.byTestId('load-plot-summary').textContent).toContain('every one under both allowables');
  });

  it('changes the pressure picture with the condition chosen', async () => {
    const r = await renderResults();
    const before = r.byTestId('cp-curve-upper').getAttribute('points');
    await r.press('cp-condition-gust-down-vc');
    expect(r.byTestId('cp-condition-facts').textContent).toContain('n -2.11');
    expect(r.byTestId('cp-curve-upper').getAttribute('points')).not.toBe(before);
  });

  it('lists the first four candidates on a phone, the rest on request, keeping the one on show', async () => {
    const r = await renderResults();
    const rows = () =>
      r
        .allByTestIdPrefix('trade-row-')
        .filter(
          (e) =>
            /^trade-row-[\d.]+-[A-Z0-9-]+$/.test(e.getAttribute('data-testid')!) &&
            !/-(chosen|recommended)$/.test(e.getAttribute('data-testid')!),
        );
    expect(rows()).toHaveLength(4);
    expect(r.byTestId('trade-show-all').textContent).toBe('Show all 18 candidates');
    await r.press('trade-show-all');
    expect(rows()).toHaveLength(18);
    await r.press('trade-row-0.016-PULLED-4');
    await r.press('trade-show-all');
    // Folded again, the candidate tapped stays listed under the first four.
    expect(rows().map((e) => e.getAttribute('data-testid'))).toContain('trade-row-0.016-PULLED-4');
    expect(rows()).toHaveLength(5);
  });

  it('shows the candidate tapped in the trade table, with its negative margins marked', async () => {
    const r = await renderResults();
    await r.press('trade-show-all');
    await r.press('trade-row-0.016-PULLED-4');
    expect(r.byTestId('trade-row-0.016-PULLED-4-chosen')).toBeTruthy();
    expect(r.byTestId('candidate-reasons').textContent).toContain('does not carry the loads');
    expect(r.byTestId('zone-ms-limit-0-0').textContent).toContain('✕');
    expect(r.byTestId('apply-not-feasible')).toBeTruthy();
  });

  it('asks the server for the holes of a candidate stored without them, showing its zones meanwhile', async () => {
    const asked: string[] = [];
    const saved = global.fetch;
    // Never answers: the screen stays in its waiting state.
    global.fetch = jest.fn((url: string) => {
      asked.push(String(url));
      return new Promise(() => {});
    }) as never;
    try {
      const r = await renderResults(detail(), 2, 'imperial', { holes: false });
      await r.press('trade-show-all');
      await r.press('trade-row-0.016-PULLED-4');
      expect(
        asked.some((u) => u.includes('/api/studies/study-1/candidate?gaugeIn=0.016&rivet=PULLED-4&revision=2')),
      ).toBe(true);
      expect(r.byTestId('section-loads').textContent).toContain('Working out every hole of 0.016 in · PULLED-4');
      expect(r.queryByTestId('load-plot')).toBeNull();
      expect(r.byTestId('zone-row-0-0')).toBeTruthy();
    } finally {
      global.fetch = saved;
    }
  });

  it('draws the fetched candidate’s holes once they arrive', async () => {
    const r = await renderResults();
    await r.press('trade-show-all');
    await r.press('trade-row-0.016-PULLED-4');
    // Every hole of the fetched schedule is a point of the load plot (two series of them).
    const holes = unstoredWhole.lines.reduce((n, l) => n + l.holes.length, 0);
    expect(holes).toBeGreaterThan(20);
    expect(r.byTestId('load-plot')).toBeTruthy();
    const drawing = r.byTestId('zones-drawing').querySelector('svg[aria-label^="Pitch zones"]')!;
    expect(drawing.getAttribute('aria-label')).toContain('PULLED-4');
    expect(drawing.querySelectorAll('circle').length).toBe(holes);
  });

  it('sorts the trade table by weight when its header is pressed', async () => {
    const r = await renderResults();
    await r.press('sort-weight');
    const first = r
      .allByTestIdPrefix('trade-row-')
      .find((e) => /^trade-row-[\d.]+-[A-Z0-9-]+$/.test(e.getAttribute('data-testid')!))!;
    const lightest = [...result.trade].sort((a, b) => a.totalWeightLb - b.totalWeightLb)[0];
    expect(first.getAttribute('data-testid')).toBe(tradeRowTestId(lightest));
  });

  it('offers the kit’s part designs to apply the candidate to', async () => {
    const r = await renderResults();
    expect(r.byTestId('apply-design-W-104')).toBeTruthy();
    expect(r.byTestId('apply-study').getAttribute('aria-disabled')).toBe('true');
    await r.press('apply-design-W-104');
    expect(r.byTestId('apply-study').getAttribute('aria-disabled')).not.toBe('true');
  });

  it('applies only from the latest revision', async () => {
    const r = await renderResults(detail(1), 2);
    expect(r.byTestId('apply-latest-only').textContent).toContain('latest revision (2)');
    expect(r.queryByTestId('apply-study')).toBeNull();
  });

  it('shows loads in newtons on the metric switch', async () => {
    const r = await renderResults(detail(), 2, 'metric');
    expect(r.byTestId('load-plot').textContent).toContain('N');
    expect(r.byTestId('study-recommended').textContent).toContain('0.51 mm');
  });

  it('says the server’s refusal plainly when applying fails', async () => {
    const body = JSON.stringify({
      error: { code: 'conflict', message: 'the part design belongs to another kit than the study' },
    });
    const fetchMock = jest.fn(async () => ({ ok: false, status: 409, text: async () => body }));
    const saved = global.fetch;
    global.fetch = fetchMock as never;
    try {
      const r = await renderResults();
      await r.press('apply-design-W-104');
      await act(async () => {
        r.byTestId('apply-study').click();
      });
      await r.settle();
      expect(r.byTestId('apply-error').textContent).toBe(
        'Not applied: the part design belongs to another kit than the study',
      );
    } finally {
      global.fetch = saved;
    }
  });
});
