import type { TravelerDetail } from '@/db/contracts';
import { TravelerScreen } from '@/components/travelers/traveler-screen';
import { filterTravelers } from '@/components/travelers/travelers-screen';
import { holeU, standardTraveler, upperFlangeOf } from '../fixtures/traveler';
import { wrap } from './finding-fixtures';

const mockPush = jest.fn();
jest.mock('expo-router', () => ({
  useRouter: () => ({ push: mockPush, replace: jest.fn(), back: jest.fn(), canGoBack: () => false }),
}));

beforeEach(() => mockPush.mockReset());

const detail: TravelerDetail = {
  ...standardTraveler,
  holesTotal: 4,
  holesDone: 1,
  holesAwaitingInspector: 1,
  openFindings: 1,
  newerRevision: 'B',
  lines: [upperFlangeOf(4)],
  outline: [
    [0, 0],
    [3, 1.5],
    [10, 0],
    [10, -0.5],
    [0, -0.5],
  ],
  holes: [holeU(1, 0.25, 'installed'), holeU(2, 1.25, 'pending'), holeU(3, 2.25, 'flagged'), holeU(4, 3.75, 'pending')],
  steps: [{ id: 's1', seq: 1, text: 'Deburr all holes', doneAt: null, doneByName: null }],
  approvedByName: 'Maren Holt',
  readiness: { ready: false, reasons: ['2 holes not done', '1 step not done', '1 finding open'] },
};

function renderTraveler(over: Partial<TravelerDetail> = {}) {
  const t = { ...detail, ...over };
  return wrap(<TravelerScreen travelerId={t.id} />, { traveler: t });
}

describe('the traveler screen', () => {
  it('shows the header numbers in the units chosen, with the caution and the approver', async () => {
    const r = renderTraveler();
    await r.settle();
    expect(r.byTestId('gauge').textContent).toContain('0.025 in');
    expect(r.byTestId('drill').textContent).toContain('0.1285 in');
    expect(r.byTestId('edge-distance').textContent).toContain('0.250 in');
    expect(r.byTestId('caution').textContent).toContain('not certification');
    expect(r.byTestId('approved-by').textContent).toContain('Maren Holt');
  });

  it('warns that a newer revision is out', async () => {
    const r = renderTraveler();
    await r.settle();
    expect(r.byTestId('newer-revision').textContent).toContain('Revision B');
  });

  it('lists every hole with its own large target and status', async () => {
    const r = renderTraveler();
    await r.settle();
    for (const id of ['U-01', 'U-02', 'U-03', 'U-04']) expect(r.byTestId(`hole-${id}`)).toBeTruthy();
    expect(r.byTestId('hole-U-03').getAttribute('aria-label')).toContain('Flagged');
  });

  it('counts holes done apart from holes waiting for the inspector', async () => {
    const r = renderTraveler({
      holes: [...detail.holes.slice(0, 3), { holeId: 'U-04', line: 'U', seq: 4, stationIn: 3.75, status: 'reworked' }],
    });
    await r.settle();
    expect(r.byTestId('progress-count').textContent).toBe('1 / 4');
    expect(r.byTestId('progress-awaiting').textContent).toBe('2holes awaiting the inspector');
    // A reworked hole is not ticked done.
    expect(r.byTestId('hole-U-04').getAttribute('aria-checked')).toBe('false');
    expect(r.byTestId('hole-U-01').getAttribute('aria-checked')).toBe('true');
  });

  it('shows the pitch schedule zones of each line', async () => {
    const r = renderTraveler();
    await r.settle();
    expect(r.byTestId('zones-U').textContent).toContain('1.00');
  });
});

describe('what the reader may do comes from allowedActions', () => {
  it('lets a builder tick, work steps and flag', async () => {
    const r = renderTraveler();
    await r.settle();
    expect(r.byTestId('run-mode')).toBeTruthy();
    expect(r.byTestId('hole-U-02').getAttribute('aria-disabled')).not.toBe('true');
    expect(r.byTestId('step-1').getAttribute('aria-disabled')).not.toBe('true');
    expect(r.byTestId('flag-hole')).toBeTruthy();
    expect(r.queryByTestId('sign-off')).toBeNull();
    expect(r.queryByTestId('readiness-reasons')).toBeNull();
  });

  it('lets an inspector raise a finding but not tick, and says why the part cannot be signed off', async () => {
    const r = renderTraveler({ place: 'inspector', allowedActions: ['raise'] });
    await r.settle();
    expect(r.queryByTestId('run-mode')).toBeNull();
    expect(r.byTestId('hole-U-02').getAttribute('aria-disabled')).toBe('true');
    expect(r.byTestId('step-1').getAttribute('aria-disabled')).toBe('true');
    expect(r.byTestId('flag-hole')).toBeTruthy();
    expect(r.queryByTestId('sign-off')).toBeNull();
    const reasons = r.byTestId('readiness-reasons').textContent;
    expect(reasons).toContain('2 holes not done');
    expect(reasons).toContain('1 finding open');
  });

  it('offers the sign-off only when the server allows it', async () => {
    const r = renderTraveler({
      place: 'inspector',
      allowedActions: ['raise', 'sign-off'],
      readiness: { ready: true, reasons: [] },
    });
    await r.settle();
    expect(r.byTestId('sign-off')).toBeTruthy();
    expect(r.queryByTestId('readiness-reasons')).toBeNull();
  });

  it('offers nothing to someone with no place on the build', async () => {
    const r = renderTraveler({ place: 'none', allowedActions: [] });
    await r.settle();
    expect(r.queryByTestId('flag-hole')).toBeNull();
    expect(r.queryByTestId('run-mode')).toBeNull();
    expect(r.queryByTestId('sign-off')).toBeNull();
  });
});

describe('a replaced part', () => {
  it('says so plainly and links its replacement', async () => {
    const r = renderTraveler({
      allowedActions: [],
      replaced: { byId: 'trav-2', reason: 'return_to_supplier' },
      replacedBy: { id: 'trav-2', serial: 'NK2-0147-W-104-R1' },
    });
    await r.settle();
    const banner = r.byTestId('replaced-by');
    expect(banner.textContent).toContain('replaced (return to supplier)');
    expect(banner.textContent).toContain('NK2-0147-W-104-R1');
    await r.press('replaced-by-open');
    expect(mockPush).toHaveBeenCalledWith('/travelers/trav-2');
    expect(r.queryByTestId('flag-hole')).toBeNull();
  });

  it('shows on the replacement what it replaces', async () => {
    const r = renderTraveler({
      id: 'trav-2',
      replacesId: 'trav-1',
      replaces: { id: 'trav-1', serial: 'NK2-0147-W-104' },
    });
    await r.settle();
    expect(r.byTestId('replaces').textContent).toContain('NK2-0147-W-104');
  });

  it('is listed after the live parts', () => {
    const rows = [
      { ...detail, id: 'old', replaced: { byId: 'new', reason: 'scrap' as const } },
      { ...detail, id: 'new', replacesId: 'old' },
    ];
    expect(filterTravelers(rows, 'all', '').map((t) => t.id)).toEqual(['new', 'old']);
  });
});
