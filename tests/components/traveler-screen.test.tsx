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
  steps: [
    {
      id: 's1',
      seq: 1,
      text: 'Deburr all holes',
      kind: 'deburr',
      inspectionPoint: false,
      doneAt: null,
      doneByName: null,
      by: null,
      byName: null,
      stampedAt: null,
      stampedByName: null,
    },
  ],
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

describe('steps as operations', () => {
  const step = detail.steps[0];
  const steps: TravelerDetail['steps'] = [
    { ...step, kind: 'deburr', doneAt: '2026-11-03T09:00:00.000Z', doneByName: 'Tobias Fenn', by: 'builder' },
    {
      ...step,
      id: 's2',
      seq: 2,
      text: 'Cleco and check the fit',
      kind: 'inspect',
      inspectionPoint: true,
      doneAt: '2026-11-03T10:00:00.000Z',
      doneByName: 'Tobias Fenn',
      by: 'builder',
    },
    { ...step, id: 's3', seq: 3, text: 'Rivet upper flange', kind: 'rivet' },
  ];
  const original = global.fetch;
  afterEach(() => {
    global.fetch = original;
  });

  it('shows each step’s operation and the inspection point waiting for its stamp, and lets an inspector stamp it', async () => {
    const sent: string[] = [];
    global.fetch = jest.fn(async (url: string) => {
      sent.push(url);
      const body = JSON.stringify({ ...detail, steps, place: 'inspector', allowedActions: ['raise', 'stamp'] });
      return { ok: true, status: 200, json: async () => JSON.parse(body), text: async () => body };
    }) as unknown as typeof fetch;
    const r = renderTraveler({ steps, place: 'inspector', allowedActions: ['raise', 'stamp'] });
    await r.settle();
    expect(r.byTestId('step-1').textContent).toContain('Deburr');
    expect(r.byTestId('step-point-2').textContent).toBe('Inspection point');
    expect(r.byTestId('step-2').textContent).toContain('Waiting for an inspector’s stamp');
    // The builder's chooser of whose work it was is not the inspector's.
    expect(r.queryByTestId('step-credit')).toBeNull();
    expect(r.queryByTestId('step-stamp-3')).toBeNull();
    await r.press('step-stamp-2');
    await r.settle();
    expect(sent.some((u) => u.endsWith('/api/travelers/trav-1/steps/s2/stamp'))).toBe(true);
  });

  it('offers no stamp to a builder, who says whose work the next step is', async () => {
    const r = renderTraveler({ steps, allowedActions: ['tick', 'step', 'raise'] });
    await r.settle();
    expect(r.queryByTestId('step-stamp-2')).toBeNull();
    await r.press('step-by-helper');
    expect(r.byTestId('step-by-name')).toBeTruthy();
  });
});

describe('time worked', () => {
  const original = global.fetch;
  afterEach(() => {
    global.fetch = original;
  });
  const work = {
    running: null,
    recent: [
      {
        id: 'w1',
        personName: 'Tobias Fenn',
        by: 'helper' as const,
        byName: 'Sam Ortiz',
        startedAt: '2026-11-03T09:00:00.000Z',
        endedAt: '2026-11-03T10:15:00.000Z',
        entered: true,
      },
    ],
    totalHours: 1.25,
    byWho: [{ who: 'Sam Ortiz', by: 'helper' as const, hours: 1.25 }],
  };

  it('shows the part’s hours by who and starts a session as the help named above the steps', async () => {
    const sent: { url: string; body: Record<string, unknown> }[] = [];
    global.fetch = jest.fn(async (url: string, init?: { body?: string }) => {
      sent.push({ url, body: JSON.parse(init?.body ?? '{}') });
      const body = JSON.stringify({ ...detail, work: { ...work, running: { ...work.recent[0], endedAt: null } } });
      return { ok: true, status: 200, json: async () => JSON.parse(body), text: async () => body };
    }) as unknown as typeof fetch;
    const r = renderTraveler({ work, allowedActions: ['tick', 'step', 'raise'] });
    await r.settle();
    expect(r.byTestId('work-total').textContent).toBe('1 h 15 min on this part: Sam Ortiz (a helper) 1 h 15 min');
    expect(r.byTestId('work-recent').textContent).toContain('entered afterwards');
    // Photos of the work are the builder's too; what they show is asked once one is picked.
    expect(r.byTestId('work-photos-section').textContent).toContain('No photo picked');
    expect(r.queryByTestId('work-photos-send')).toBeNull();
    await r.press('step-by-helper');
    await r.type('step-by-name', 'Sam Ortiz');
    await r.press('work-start');
    await r.settle();
    // The screen asks for other things too (the notices reaching the part): the start is the one sent here.
    const start = sent.find((c) => /\/api\/travelers\/trav-1\/work\/start$/.test(c.url));
    expect(start?.body).toMatchObject({ by: 'helper', byName: 'Sam Ortiz', doneAt: expect.any(String) });
    expect(r.byTestId('work-running').textContent).toContain('Working since');
  });

  it('offers nothing to keep time to an inspector', async () => {
    const r = renderTraveler({ work, place: 'inspector', allowedActions: ['raise'] });
    await r.settle();
    expect(r.queryByTestId('work-start')).toBeNull();
    expect(r.queryByTestId('work-hours-form')).toBeNull();
    expect(r.queryByTestId('work-photos-section')).toBeNull();
    expect(r.byTestId('work-total').textContent).toContain('1 h 15 min');
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
