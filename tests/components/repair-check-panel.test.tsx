import { RepairCheckPanel, formatMargin } from '@/components/findings/repair-check-panel';
import type { RepairCheckResult } from '@/hooks/queries/findings';
import { failedCheck, finding, passedCheck, recordFetch, wrap } from './finding-fixtures';

jest.mock('expo-router', () => jest.requireActual('../helpers/expo-router-stub'));

const show = (f = finding, system: 'imperial' | 'metric' = 'imperial') =>
  wrap(<RepairCheckPanel f={f} />, { finding: f }, system);

describe('margins', () => {
  it('read signed with two places, "—" where not checked', () => {
    expect(formatMargin(1.14816)).toBe('+1.15');
    expect(formatMargin(-0.89266)).toBe('−0.89');
    expect(formatMargin(null)).toBe('—');
  });
});

describe('the repair check panel', () => {
  it('offers the next two sizes, the next one chosen, and checks it when asked (not before)', async () => {
    const calls = recordFetch({ '/repair-check': { body: failedCheck } });
    const r = show();
    await r.settle();
    expect(r.byTestId('repair-proposed-MS20470AD5').getAttribute('aria-checked')).toBe('true');
    expect(r.byTestId('repair-proposed-MS20470AD6').getAttribute('aria-checked')).toBe('false');
    expect(calls).toHaveLength(0);
    await r.press('repair-check');
    expect(calls).toEqual([
      { url: '/api/findings/f-1/repair-check', method: 'POST', body: { proposedSpec: 'MS20470AD5' } },
    ]);
  });

  it('checks every hole of the finding and shows each with its verdict and reasons', async () => {
    recordFetch({ '/repair-check': { body: failedCheck } });
    const r = show();
    await r.press('repair-check');
    const verdict = r.byTestId('repair-result');
    expect(verdict.textContent).toContain('FAIL');
    expect(verdict.textContent).toContain('MS20470AD5 in place of MS20470AD4');
    expect(verdict.textContent).toContain('2 holes checked, 2 failing');
    expect(verdict.querySelector('[aria-label="fails (cross in a square)"]')).toBeTruthy();
    expect(r.byTestId('repair-reasons').textContent).toContain('U-08: edge distance');
    for (const id of ['U-08', 'U-09']) {
      expect(r.byTestId(`repair-hole-${id}`).textContent).toContain('fails');
      expect(r.byTestId(`repair-hole-${id}-reasons`).textContent).toContain('less than 2D');
    }
    expect(r.byTestId('repair-alternative').textContent).toContain('Repair with a doubler');
  });

  it('says whether the edge distance was measured or taken from the layout', async () => {
    recordFetch({ '/repair-check': { body: failedCheck } });
    const r = show();
    await r.press('repair-check');
    const measured = r.byTestId('repair-hole-U-08-edge').textContent;
    expect(measured).toContain('has 0.280 in');
    expect(measured).toContain('as measured; 0.250 in as laid out');
    expect(measured).toContain('short by 0.0325 in');
    const nominal = r.byTestId('repair-hole-U-09-edge').textContent;
    expect(nominal).toContain('as laid out, not measured');
    expect(r.byTestId('repair-hole-U-09-pitch-after').textContent).toContain('no hole after');
  });

  it('shows the new drill, what the new size needs, the countersink and the caution', async () => {
    recordFetch({ '/repair-check': { body: failedCheck } });
    const r = show();
    await r.press('repair-check');
    expect(r.byTestId('repair-new-drill').textContent).toContain('#21 · 0.159 in');
    expect(r.byTestId('repair-required').textContent).toContain('edge distance ≥ 0.3125 in');
    expect(r.byTestId('repair-countersink').textContent).toContain('Protruding head');
    expect(r.byTestId('repair-warnings').textContent).toContain('no applied loads');
    expect(r.byTestId('repair-caution').textContent).toContain('Nothing here is certification');
    expect(r.queryByTestId('repair-rules')).toBeNull();
    await r.press('repair-rules-toggle');
    expect(r.byTestId('repair-rules').textContent).toContain('FAA AC 43.13-1B');
  });

  it('fails a countersunk rivet that would knife-edge the sheet, and says to dimple', async () => {
    const csk: RepairCheckResult = {
      ...passedCheck,
      pass: false,
      inputs: { ...passedCheck.inputs, proposedSpec: 'MS20426AD5' },
      countersink: { required: true, headHeightIn: 0.0529, limitIn: 0.0213, pass: false },
    };
    recordFetch({ '/repair-check': { body: csk } });
    const r = show();
    await r.press('repair-check');
    const c = r.byTestId('repair-countersink').textContent;
    expect(c).toContain('head 0.0529 in deep');
    expect(c).toContain('at most 0.0213 in');
    expect(c).toContain('dimple instead');
  });

  it('opens each hole’s margins on demand and boxes a negative one', async () => {
    const negative: RepairCheckResult = {
      ...failedCheck,
      holes: failedCheck.holes.map((h) => ({
        ...h,
        margins: { ...h.margins, tensionLimit: -0.89266, combinedLimit: 1.14816 },
      })),
    };
    recordFetch({ '/repair-check': { body: negative } });
    const r = show();
    await r.press('repair-check');
    expect(r.queryByTestId('repair-hole-U-08-ms')).toBeNull();
    await r.press('repair-hole-U-08-margins-toggle');
    expect(r.byTestId('repair-hole-U-08-ms-tension-limit').getAttribute('aria-label')).toBe('negative margin −0.89');
    expect(r.byTestId('repair-hole-U-08-ms-combined-limit').textContent).toBe('+1.15');
    expect(r.byTestId('repair-hole-U-08-ms-shear-limit').getAttribute('aria-label')).toBe(
      'not checked, no applied load',
    );
  });

  it('sends the size chosen, and keeps each size’s answer apart', async () => {
    const calls = recordFetch({
      '/repair-check': (sent) => ({
        body:
          (sent as { proposedSpec: string }).proposedSpec === 'MS20470AD6'
            ? { ...passedCheck, inputs: { ...passedCheck.inputs, proposedSpec: 'MS20470AD6' } }
            : failedCheck,
      }),
    });
    const r = show();
    await r.press('repair-proposed-MS20470AD6');
    await r.press('repair-check');
    expect(calls[0].body).toEqual({ proposedSpec: 'MS20470AD6' });
    expect(r.byTestId('repair-result').textContent).toContain('PASS');
    await r.press('repair-proposed-MS20470AD5');
    expect(r.queryByTestId('repair-result')).toBeNull();
  });

  it('shows lengths in millimetres on the metric switch', async () => {
    recordFetch({ '/repair-check': { body: failedCheck } });
    const r = show(finding, 'metric');
    await r.press('repair-check');
    expect(r.byTestId('repair-hole-U-09-edge').textContent).toContain('needs ≥ 7.94 mm');
    expect(r.byTestId('repair-hole-U-09-edge').textContent).toContain('has 6.35 mm');
  });

  it('says plainly when the server refuses (the largest rivet of its family)', async () => {
    const message = 'MS20470AD8 is the largest rivet of its family: repair with a doubler or scrap';
    recordFetch({ '/repair-check': { status: 409, body: { error: { code: 'conflict', message } } } });
    const top = { ...finding, context: { ...finding.context, rivetSpec: 'MS20470AD8', oversizeOptions: [] } };
    const r = show(top);
    await r.settle();
    expect(r.byTestId('repair-no-larger').textContent).toContain('largest size of its family');
    await r.press('repair-check');
    expect(r.byTestId('repair-error').textContent).toContain(message);
    expect(r.queryByTestId('repair-result')).toBeNull();
  });
});

describe('the stored result', () => {
  it('is named beside a fresh check, which is not kept', async () => {
    recordFetch({});
    const r = show({
      ...finding,
      status: 'awaiting_approval',
      disposition: 'repair',
      repair: {
        scheme: 'oversize_rivet',
        rivetSpec: 'MS20470AD5',
        overrideReason: 'backed by the spar cap',
        check: { pass: false, reasons: failedCheck.reasons, alternative: null, newDrill: failedCheck.newDrill },
      },
    });
    await r.settle();
    const stored = r.byTestId('repair-check-stored').textContent;
    expect(stored).toContain('FAIL for MS20470AD5');
    expect(stored).toContain('2 reasons');
  });
});
