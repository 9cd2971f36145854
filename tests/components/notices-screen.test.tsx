import type { ComplianceCounts, NoticeBuildAnswer, NoticeDetail, SessionUser } from '@/db/contracts';
import { NoticeScreen } from '@/components/notices/notice-screen';
import { noticeKeys } from '@/hooks/queries/notices';
import { lead, owner, recordFetch, wrapSignedIn } from './people-fixtures';

jest.mock('expo-router', () => jest.requireActual('../helpers/expo-router-stub'));

const NOTICE = '7a1c2a4e-0d5b-4c43-9a61-3b7d2f0e9a10';
const BUILD = '7a1c2a4e-0d5b-4c43-9a61-3b7d2f0e9a20';
const OTHER = '7a1c2a4e-0d5b-4c43-9a61-3b7d2f0e9a21';
const THIRD = '7a1c2a4e-0d5b-4c43-9a61-3b7d2f0e9a22';
const answerUrl = `/api/notices/${NOTICE}/builds/${BUILD}/compliance`;

const answer = (over: Partial<NoticeBuildAnswer> = {}): NoticeBuildAnswer => ({
  buildId: BUILD,
  kitSerial: 'NK2-0147',
  status: 'acknowledged',
  acknowledgedAt: '2026-11-02T09:00:00.000Z',
  acknowledgedByName: 'Tobias Fenn',
  answeredAt: null,
  answeredByName: null,
  note: null,
  reason: null,
  photos: [],
  parts: [{ travelerId: 't-1', serial: 'NK2-0147-W-104', partNumber: 'W-104', letter: 'A' }],
  allowed: ['record'],
  ...over,
});

const counts = (over: Partial<ComplianceCounts> = {}): ComplianceCounts => ({
  open: 0,
  acknowledged: 1,
  done: 0,
  not_applicable: 0,
  builds: 1,
  ...over,
});

const notice = (builds: NoticeBuildAnswer[], c = counts()): NoticeDetail => ({
  id: NOTICE,
  number: 3,
  title: 'Check the W-104 flange radius',
  level: 'mandatory',
  kitModelId: 'kit-1',
  kitName: 'NK-2 Quillon two-seat trainer',
  issuedAt: '2026-11-01T10:00:00.000Z',
  issuedByName: 'Maren Holt',
  counts: c,
  body: 'Measure the bend radius of the lower flange at the nose; report it in the note.',
  effectivity: {
    serialFrom: 'NK2-0100',
    serialTo: 'NK2-0199',
    reaches: 'all',
    parts: [{ partDesignId: 'd-1', partNumber: 'W-104', name: 'Wing rib, inboard', letters: ['A'] }],
  },
  files: [],
  builds,
});

function open(user: SessionUser, n: NoticeDetail) {
  return wrapSignedIn(<NoticeScreen noticeId={NOTICE} />, user, [[noticeKeys.detail(NOTICE), n]]);
}

/** The text fields of a multipart body that was sent (absent ones left out). */
const sent = (body: unknown) =>
  Object.fromEntries(
    ['outcome', 'note', 'reason', 'doneAt', 'sentAt']
      .map((k) => [k, (body as FormData).get(k)])
      .filter(([, v]) => v !== null),
  );

describe('a build’s answer to a notice', () => {
  it('says what the notice applies to in words, with the safety caution for a notice about structure', async () => {
    recordFetch({});
    const r = open(owner, notice([answer()]));
    await r.settle();
    const words = r.byTestId('notice-effectivity').textContent;
    expect(words).toContain('kit serials NK2-0100 to NK2-0199');
    expect(words).toContain('W-104 Wing rib, inboard (revision A)');
    expect(r.byTestId('notice-caution').textContent).toMatch(/airworthiness rules/);
    expect(r.byTestId('notice-level-mark-mandatory')).toBeTruthy();
  });

  it('asks for a note when done and a reason when it does not apply, and sends nothing until they are given', async () => {
    const calls = recordFetch({});
    const r = open(owner, notice([answer()]));
    await r.settle();
    expect(r.queryByTestId('notice-acknowledge')).toBeNull();
    await r.press('compliance-submit');
    expect(r.byTestId('compliance-outcome-field-error').textContent).toContain('choose done or does not apply');

    await r.press('compliance-outcome-done');
    await r.press('compliance-submit');
    expect(r.byTestId('compliance-note-field-error').textContent).toContain('say what was done');
    expect(r.byTestId('notice-photos')).toBeTruthy();

    await r.press('compliance-outcome-not_applicable');
    await r.press('compliance-submit');
    expect(r.byTestId('compliance-reason-field-error').textContent).toContain('say why it does not apply');
    // Only the chosen outcome's words are asked for.
    expect(r.queryByTestId('compliance-note')).toBeNull();
    expect(calls).toHaveLength(0);
  });

  it('sends "done" with its note and the device’s time, and shows the answer as it now stands', async () => {
    const done = answer({
      status: 'done',
      answeredAt: '2026-11-03T15:00:00.000Z',
      answeredByName: 'Tobias Fenn',
      note: 'Radius measured 0.12 in, within the drawing',
    });
    const calls = recordFetch({
      [answerUrl]: { body: done },
      [`/api/notices/${NOTICE}`]: { body: notice([done], counts({ acknowledged: 0, done: 1 })) },
    });
    const r = open(owner, notice([answer()]));
    await r.settle();
    await r.press('compliance-outcome-done');
    await r.type('compliance-note', '  Radius measured 0.12 in, within the drawing ');
    await r.press('compliance-submit');
    const post = calls.find((c) => c.method === 'POST')!;
    expect(post.url).toContain(answerUrl);
    const body = sent(post.body);
    expect(body).toMatchObject({ outcome: 'done', note: 'Radius measured 0.12 in, within the drawing' });
    expect(body.reason).toBeUndefined();
    expect(Number.isNaN(Date.parse(String(body.doneAt)))).toBe(false);
    expect(r.byTestId('compliance-saved')).toBeTruthy();
    expect(r.byTestId('notice-answer-NK2-0147').textContent).toContain('Radius measured 0.12 in');
    expect(r.byTestId('compliance-status-done')).toBeTruthy();
  });

  it('sends "does not apply" with its reason only', async () => {
    const na = answer({ status: 'not_applicable', reason: 'part made to revision B already' });
    const calls = recordFetch({ [answerUrl]: { body: na }, [`/api/notices/${NOTICE}`]: { body: notice([na]) } });
    const r = open(owner, notice([answer()]));
    await r.settle();
    await r.press('compliance-outcome-not_applicable');
    await r.type('compliance-reason', 'part made to revision B already');
    await r.press('compliance-submit');
    const body = sent(calls.find((c) => c.method === 'POST')!.body);
    expect(r.byTestId('compliance-status-not_applicable')).toBeTruthy();
    expect(body).toMatchObject({ outcome: 'not_applicable', reason: 'part made to revision B already' });
    expect(body.note).toBeUndefined();
  });

  it('shows the server’s refusal at the field it names, and keeps what was written', async () => {
    recordFetch({
      [answerUrl]: {
        status: 400,
        body: {
          error: {
            code: 'invalid',
            message: 'Some of what was sent is not right',
            fields: { note: 'the note contains a control character: type plain text' },
          },
        },
      },
    });
    const r = open(owner, notice([answer()]));
    await r.settle();
    await r.press('compliance-outcome-done');
    await r.type('compliance-note', 'doubler fitted');
    await r.press('compliance-submit');
    expect(r.byTestId('compliance-note-field-error').textContent).toContain('control character');
    expect(r.byTestId('compliance-error').textContent).toContain('See the marked fields');
    expect((r.byTestId('compliance-note') as HTMLTextAreaElement).value).toBe('doubler fitted');
  });

  it('shows a refusal without fields in the server’s words', async () => {
    recordFetch({
      [answerUrl]: {
        status: 403,
        body: {
          error: { code: 'forbidden', message: 'the builders on this build record what was done about a notice' },
        },
      },
    });
    const r = open(owner, notice([answer()]));
    await r.settle();
    await r.press('compliance-outcome-not_applicable');
    await r.type('compliance-reason', 'not our rib');
    await r.press('compliance-submit');
    expect(r.byTestId('compliance-error').textContent).toContain('the builders on this build record');
  });

  it('offers to acknowledge only when the server lists it, and then no more', async () => {
    const read = answer({ allowed: [] });
    const calls = recordFetch({
      [`/api/notices/${NOTICE}/builds/${BUILD}/acknowledge`]: { body: read },
      [`/api/notices/${NOTICE}`]: { body: notice([read]) },
    });
    const r = open(
      owner,
      notice([answer({ status: 'open', acknowledgedAt: null, acknowledgedByName: null, allowed: ['acknowledge'] })]),
    );
    await r.settle();
    expect(r.queryByTestId('compliance-form')).toBeNull();
    await r.press('notice-acknowledge');
    expect(calls.find((c) => c.method === 'POST')!.url).toContain('/acknowledge');
    expect(r.queryByTestId('notice-acknowledge')).toBeNull();
    expect(r.byTestId('compliance-status-acknowledged')).toBeTruthy();
  });
});

describe('the supplier’s compliance table', () => {
  const builds = [
    answer({
      status: 'done',
      answeredAt: '2026-11-03T15:00:00.000Z',
      answeredByName: 'Tobias Fenn',
      note: 'Radius 0.12 in',
      photos: [{ id: 'ph-1', kind: 'photo', name: 'photo.jpg', url: '/p1', thumbUrl: '/p1t' }],
      allowed: [],
    }),
    answer({
      buildId: OTHER,
      kitSerial: 'NK2-0152',
      status: 'not_applicable',
      answeredAt: '2026-11-04T08:00:00.000Z',
      answeredByName: 'Ada Rowe',
      reason: 'rib made to revision B',
      allowed: [],
    }),
    answer({
      buildId: THIRD,
      kitSerial: 'NK2-0103',
      status: 'open',
      acknowledgedAt: null,
      acknowledgedByName: null,
      allowed: [],
    }),
  ];
  const c = counts({ open: 1, acknowledged: 0, done: 1, not_applicable: 1, builds: 3 });

  it('lists every build in serial order with its status, who and when, its words and its photos, under the counts', async () => {
    recordFetch({});
    const r = open(lead, notice(builds, c));
    await r.settle();
    expect(r.byTestId('compliance-counts').textContent).toBe('1 of 3 builds done · 1 does not apply · 1 not yet read');
    const rows = r.allByTestIdPrefix('compliance-row-').map((e) => e.getAttribute('data-testid'));
    expect(rows).toEqual(['compliance-row-NK2-0103', 'compliance-row-NK2-0147', 'compliance-row-NK2-0152']);
    const done = r.byTestId('compliance-row-NK2-0147').textContent;
    expect(done).toContain('Done');
    expect(done).toContain('Tobias Fenn');
    expect(done).toContain('Radius 0.12 in');
    expect(r.byTestId('compliance-photo-NK2-0147-0')).toBeTruthy();
    expect(r.byTestId('compliance-row-NK2-0152').textContent).toContain('rib made to revision B');
    expect(r.byTestId('compliance-row-NK2-0103').textContent).toContain('Not yet read');
    // The supplier answers nothing: no form of a build's.
    expect(r.queryByTestId('compliance-form')).toBeNull();
    expect(r.queryByTestId('notice-acknowledge')).toBeNull();
  });

  it('narrows the table to one status', async () => {
    recordFetch({});
    const r = open(lead, notice(builds, c));
    await r.settle();
    expect(r.byTestId('compliance-show-open').textContent).toContain('(1)');
    await r.press('compliance-show-done');
    expect(r.allByTestIdPrefix('compliance-row-').map((e) => e.getAttribute('data-testid'))).toEqual([
      'compliance-row-NK2-0147',
    ]);
    await r.press('compliance-show-acknowledged');
    expect(r.byTestId('compliance-none').textContent).toContain('No build in this state');
  });
});
