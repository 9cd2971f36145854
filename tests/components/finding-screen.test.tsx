import { findingActions, type FindingAction, type FindingDetail } from '@/db/contracts';
import { FindingScreen } from '@/components/findings/finding-screen';
import { failedCheck, finding, passedCheck, recordFetch, wrap } from './finding-fixtures';

const mockPush = jest.fn();
jest.mock('expo-router', () => ({
  useRouter: () => ({ push: mockPush, replace: jest.fn(), back: jest.fn(), canGoBack: () => false }),
}));

beforeEach(() => mockPush.mockReset());

const show = (f: FindingDetail) => wrap(<FindingScreen findingId={f.id} />, { finding: f });
const actionButtons = (r: ReturnType<typeof show>) =>
  r.allByTestIdPrefix('finding-action-').map((el) => el.getAttribute('data-testid'));

describe('the finding screen offers exactly what the server allows', () => {
  const table: [string, Partial<FindingDetail>, FindingAction[]][] = [
    ['nothing for the builder while the inspector decides', { place: 'builder' }, []],
    ['disposition and not a defect for the inspector on a raised finding', {}, ['disposition', 'not-a-defect']],
    [
      'amend while the design authority has not approved',
      { status: 'awaiting_approval', disposition: 'use_as_is' },
      ['amend'],
    ],
    [
      'approve and refuse for the design authority',
      { status: 'awaiting_approval', disposition: 'use_as_is', place: 'design_authority' },
      ['approve', 'refuse'],
    ],
    [
      'report done for the builder of ordered work',
      { status: 'work_ordered', disposition: 'rework', place: 'builder' },
      ['report-done'],
    ],
    [
      'accept and send back for the inspector once the work is done',
      { status: 'work_done', disposition: 'rework' },
      ['accept', 'send-back'],
    ],
    ['nothing on a closed finding', { status: 'closed', closure: 'not_a_defect' }, []],
  ];

  it.each(table)('%s', async (_name, over, allowed) => {
    const r = show({ ...finding, ...over, allowedActions: allowed });
    await r.settle();
    expect(actionButtons(r)).toEqual(allowed.map((a) => `finding-action-${a}`));
    if (!allowed.length) {
      expect(r.queryByTestId('action-note')).toBeNull();
      expect(r.queryByTestId('finding-decision')).toBeNull();
    }
  });

  it('draws no form for an action the list lacks, even where the state would allow it', async () => {
    // A raised finding read by someone the server gives nothing: no disposition chips, no note.
    const r = show({ ...finding, allowedActions: [] });
    await r.settle();
    expect(r.queryByTestId('disposition-rework')).toBeNull();
    expect(r.byTestId('finding-waiting').textContent).toContain('inspector');
  });

  it('names every action of the rules module in a button when all are allowed (no action without its button)', async () => {
    const r = show({ ...finding, allowedActions: [...findingActions] });
    await r.settle();
    expect(actionButtons(r)).toEqual(findingActions.map((a) => `finding-action-${a}`));
  });
});

describe('the disposition form', () => {
  const decided = (sent: Record<string, unknown>): FindingDetail => ({
    ...finding,
    status: 'awaiting_approval',
    disposition: 'repair',
    dispositionNote: sent.note as string,
    allowedActions: ['amend'],
    repair: {
      scheme: 'oversize_rivet',
      rivetSpec: 'MS20470AD5',
      overrideReason: (sent.overrideReason as string) ?? null,
      check: {
        pass: false,
        reasons: failedCheck.reasons,
        alternative: failedCheck.alternative,
        newDrill: failedCheck.newDrill,
      },
    },
  });

  /** The inspector chooses a repair with the next-size rivet (MS20470AD5); the server's check answers `check`. */
  async function nextSizeChosen(check: typeof failedCheck) {
    const calls = recordFetch({
      '/repair-check': { body: check },
      '/disposition': (sent) => ({ body: decided(sent as Record<string, unknown>) }),
    });
    const r = show(finding);
    await r.settle();
    await r.press('disposition-repair');
    await r.press('repair-scheme-oversize_rivet');
    await r.press('repair-rivet-MS20470AD5');
    return { calls, r };
  }

  it('demands an override reason after a failed check, and sends one request with it', async () => {
    const { calls, r } = await nextSizeChosen(failedCheck);
    expect(r.queryByTestId('override-reason')).toBeNull();
    await r.press('repair-rivet-check');

    const result = r.byTestId('repair-rivet-result');
    expect(result.textContent).toContain('Fails at 2 of 2 holes');
    expect(result.textContent).toContain('U-08: edge distance');
    expect(r.byTestId('repair-rivet-caution').textContent).toContain('Nothing here is certification');
    expect(r.byTestId('override-reason')).toBeTruthy();

    await r.type('action-note', 'Drill to #21 and fit MS20470AD5');
    await r.press('finding-action-disposition');
    expect(r.byTestId('override-reason-field-error').textContent).toContain('say why you choose this repair anyway');
    expect(calls.filter((c) => c.url.endsWith('/disposition'))).toHaveLength(0);

    await r.type('override-reason', 'Edge is backed by the spar cap flange: bearing checked by hand');
    await r.press('finding-action-disposition');
    const sent = calls.filter((c) => c.url.endsWith('/disposition'));
    expect(sent).toEqual([
      {
        url: '/api/findings/f-1/disposition',
        method: 'POST',
        body: {
          note: 'Drill to #21 and fit MS20470AD5',
          disposition: 'repair',
          repairScheme: 'oversize_rivet',
          repairRivetSpec: 'MS20470AD5',
          overrideReason: 'Edge is backed by the spar cap flange: bearing checked by hand',
        },
      },
    ]);
    // The result is shown where the reader now is, with the stored check and the reason.
    expect(r.byTestId('action-result').textContent).toContain('Record the disposition: recorded');
    expect(r.byTestId('action-result').textContent).toContain('awaiting design authority');
    expect(r.byTestId('override-reason-shown').textContent).toContain('spar cap flange');
    expect(document.activeElement).toBe(r.byTestId('action-result'));
  });

  it('asks for no reason when the check passed', async () => {
    const { calls, r } = await nextSizeChosen(passedCheck);
    await r.press('repair-rivet-check');
    expect(r.queryByTestId('override-reason')).toBeNull();
    await r.type('action-note', 'Drill to #21 and fit MS20470AD5');
    await r.press('finding-action-disposition');
    const body = calls.find((c) => c.url.endsWith('/disposition'))?.body as Record<string, unknown>;
    expect(body).toEqual({
      note: 'Drill to #21 and fit MS20470AD5',
      disposition: 'repair',
      repairScheme: 'oversize_rivet',
      repairRivetSpec: 'MS20470AD5',
    });
  });

  it('brings up the reason when the server finds the check failing though none was run here', async () => {
    recordFetch({
      '/disposition': {
        status: 400,
        body: {
          error: {
            code: 'bad_request',
            message: 'the repair check fails',
            fields: { overrideReason: 'the check fails: say why you choose this repair anyway' },
          },
        },
      },
    });
    const r = show(finding);
    await r.settle();
    await r.press('disposition-repair');
    await r.press('repair-scheme-oversize_rivet');
    await r.press('repair-rivet-MS20470AD6');
    await r.type('action-note', 'Fit the AD6');
    await r.press('finding-action-disposition');
    expect(r.byTestId('override-reason')).toBeTruthy();
    expect(r.byTestId('override-reason-field-error').textContent).toContain('say why');
    expect(r.byTestId('action-error').textContent).toContain('the repair check fails');
  });

  it('sends rework with its note alone: no repair fields go with it', async () => {
    const calls = recordFetch({
      '/disposition': {
        body: { ...finding, status: 'work_ordered', disposition: 'rework', allowedActions: ['amend'] },
      },
    });
    const r = show(finding);
    await r.settle();
    await r.press('disposition-rework');
    await r.type('action-note', 'Drill out and set the same rivet again');
    await r.press('finding-action-disposition');
    expect(calls.map((c) => c.body)).toEqual([
      { note: 'Drill out and set the same rivet again', disposition: 'rework' },
    ]);
  });

  it('asks why before not a defect, as the rules module says', async () => {
    const calls = recordFetch({});
    const r = show(finding);
    await r.settle();
    await r.press('finding-action-not-a-defect');
    expect(r.byTestId('action-note-field-error').textContent).toContain('say why');
    expect(calls).toHaveLength(0);
  });
});

describe('the design authority', () => {
  const awaiting: FindingDetail = {
    ...finding,
    status: 'awaiting_approval',
    disposition: 'repair',
    dispositionNote: 'Fit AD5 at both holes',
    place: 'design_authority',
    allowedActions: ['approve', 'refuse'],
    repair: {
      scheme: 'oversize_rivet',
      rivetSpec: 'MS20470AD5',
      overrideReason: 'Spar cap backs the edge',
      check: {
        pass: false,
        reasons: failedCheck.reasons,
        alternative: 'repair with doubler',
        newDrill: failedCheck.newDrill,
      },
    },
  };

  it('reads the disposition, the repair, its stored check and the override reason before deciding', async () => {
    recordFetch({});
    const r = show(awaiting);
    await r.settle();
    const d = r.byTestId('disposition');
    expect(d.textContent).toContain('Repair');
    expect(d.textContent).toContain('Fit AD5 at both holes');
    expect(d.textContent).toContain('Next-size rivet');
    expect(r.byTestId('repair-stored-result').textContent).toContain('FAIL');
    expect(r.byTestId('repair-stored-reasons').textContent).toContain('U-09: edge distance');
    expect(r.byTestId('override-reason-shown').textContent).toContain('Spar cap backs the edge');
    expect(r.byTestId('repair-stored-caution')).toBeTruthy();
  });

  it('refuses only with a reason, and approves in one request', async () => {
    const calls = recordFetch({ '/approve': { body: { ...awaiting, status: 'work_ordered', allowedActions: [] } } });
    const r = show(awaiting);
    await r.settle();
    await r.press('finding-action-refuse');
    expect(r.byTestId('action-note-field-error')).toBeTruthy();
    await r.press('finding-action-approve');
    expect(calls).toEqual([{ url: '/api/findings/f-1/approve', method: 'POST', body: { note: '' } }]);
    expect(r.byTestId('action-result').textContent).toContain('work ordered');
  });
});

describe('the work done', () => {
  it('needs a photo before it is sent', async () => {
    const calls = recordFetch({});
    const r = show({
      ...finding,
      status: 'work_ordered',
      disposition: 'rework',
      place: 'builder',
      allowedActions: ['report-done'],
    });
    await r.settle();
    await r.type('action-note', 'Drilled out, set a new AD4');
    await r.press('finding-action-report-done');
    expect(r.byTestId('photos-error').textContent).toContain('at least one photo');
    expect(calls).toHaveLength(0);
  });

  it('shows the photos as found and of the work done apart', async () => {
    recordFetch({});
    const r = show({
      ...finding,
      status: 'work_done',
      disposition: 'rework',
      allowedActions: [],
      photos: [
        ...finding.photos,
        { id: 'p2', width: 640, height: 480, url: '/p2', thumbUrl: '/p2t', stage: 'work', eventId: 'e2' },
      ],
    });
    await r.settle();
    expect(r.byTestId('finding-photos').textContent).toContain('As found (1)');
    expect(r.byTestId('finding-photo-0')).toBeTruthy();
    expect(r.queryByTestId('finding-photo-1')).toBeNull();
    expect(r.byTestId('work-photos').textContent).toContain('Work done (1)');
    expect(r.byTestId('work-photo-0')).toBeTruthy();
  });
});

describe('a closed finding', () => {
  it('says how it closed, in words, and links the replacement part', async () => {
    recordFetch({});
    const r = show({
      ...finding,
      status: 'closed',
      disposition: 'scrap',
      closure: 'scrapped',
      allowedActions: [],
      replacement: { travelerId: 'trav-2', serial: 'NK2-0147-W-104-R1' },
    });
    await r.settle();
    expect(r.byTestId('finding-status-closed').textContent).toContain('Closed');
    expect(r.byTestId('closure').textContent).toContain('Part scrapped');
    expect(r.byTestId('finding-closed').textContent).toContain('Part scrapped');
    await r.press('finding-replacement');
    expect(mockPush).toHaveBeenCalledWith('/travelers/trav-2');
  });
});
