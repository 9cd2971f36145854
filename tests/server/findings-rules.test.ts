import {
  allowedActions,
  allowedPartActions,
  checkStepChange,
  type StepFact,
  checkPartAction,
  decide,
  findingActions,
  findingStatuses,
  mailAudienceOf,
  restoredHoleStatus,
  signOffReadiness,
  type BuildPlace,
  type Disposition,
  type FindingAction,
  type FindingFacts,
  type FindingStatus,
  type PartFacts,
} from '@/db/contracts';
import { FINDING_ACTION_OWNER } from '../fixtures/finding-owners';

// The finding's life written out by hand, independently of the rules module (the owners of each step).
const OWNER = FINDING_ACTION_OWNER;
type Case = { status: FindingStatus; disposition: Disposition | null; workReported: boolean };
const STATES: Case[] = [
  { status: 'raised', disposition: null, workReported: false },
  { status: 'awaiting_approval', disposition: 'repair', workReported: false },
  { status: 'awaiting_approval', disposition: 'use_as_is', workReported: false },
  { status: 'work_ordered', disposition: 'rework', workReported: false },
  { status: 'work_ordered', disposition: 'repair', workReported: false },
  { status: 'work_ordered', disposition: 'rework', workReported: true },
  { status: 'work_done', disposition: 'rework', workReported: true },
  { status: 'work_done', disposition: 'repair', workReported: true },
  { status: 'closed', disposition: 'rework', workReported: true },
  { status: 'closed', disposition: null, workReported: false },
];
function allowedBySpec(c: Case, a: FindingAction): boolean {
  switch (a) {
    case 'disposition':
    case 'not-a-defect':
      return c.status === 'raised';
    case 'approve':
    case 'refuse':
      return c.status === 'awaiting_approval';
    // Before work starts the inspector may amend; after the first report of work done, no longer.
    case 'amend':
      return (c.status === 'awaiting_approval' || c.status === 'work_ordered') && !c.workReported;
    case 'report-done':
      return c.status === 'work_ordered' && (c.disposition === 'rework' || c.disposition === 'repair');
    case 'accept':
    case 'send-back':
      return c.status === 'work_done';
  }
}
const PLACES: BuildPlace[] = ['builder', 'inspector', 'design_authority', 'none'];

describe('the finding rules, every state × action × place', () => {
  const rows = STATES.flatMap((c) =>
    findingActions.flatMap((a) => PLACES.flatMap((p) => [false, true].map((partClosed) => ({ c, a, p, partClosed })))),
  );
  it.each(
    rows.map(
      (r) =>
        [
          `${r.c.status}${r.c.disposition ? ` (${r.c.disposition}${r.c.workReported ? ', work reported' : ''})` : ''}`,
          r.a,
          r.p,
          r.partClosed ? 'part closed' : 'part open',
          r,
        ] as const,
    ),
  )('%s: %s by %s on a %s', (_s, _a, _p, _c, { c, a, p, partClosed }) => {
    const facts: FindingFacts = { ...c, partClosed };
    const d = decide(
      facts,
      a,
      p,
      a === 'disposition' || a === 'amend' ? (c.disposition === 'rework' ? 'repair' : 'rework') : undefined,
    );
    if (p !== OWNER[a]) expect(d).toMatchObject({ ok: false, code: 403 });
    else if (partClosed || !allowedBySpec(c, a)) expect(d).toMatchObject({ ok: false, code: 409 });
    else expect(d.ok).toBe(true);
    expect(allowedActions(facts, p).includes(a)).toBe(d.ok);
  });
});

describe('where each move leads', () => {
  const raised: FindingFacts = { status: 'raised', disposition: null, workReported: false, partClosed: false };
  const next = (f: FindingFacts, a: FindingAction, p: BuildPlace, d?: Disposition) => {
    const r = decide(f, a, p, d);
    if (!r.ok) throw new Error(r.message);
    return r;
  };
  it.each([
    // disposition → state, holes, replacement
    ['rework', 'work_ordered', { to: 'held' }, null, null],
    ['repair', 'awaiting_approval', { to: 'held' }, null, null],
    ['use_as_is', 'awaiting_approval', { to: 'held' }, null, null],
    ['scrap', 'closed', { to: 'held' }, 'scrap', 'scrapped'],
    ['return_to_supplier', 'closed', { to: 'held' }, 'return_to_supplier', 'returned'],
  ] as const)('a disposition of %s sends the finding to %s', (d, status, holes, replacePart, closure) => {
    expect(next(raised, 'disposition', 'inspector', d)).toMatchObject({
      status,
      holes,
      replacePart,
      closure,
      disposition: d,
    });
  });

  it('closes a use-as-is on approval and puts the holes back (riveted ones accepted); a repair goes to work', () => {
    const waiting = (d: Disposition): FindingFacts => ({
      status: 'awaiting_approval',
      disposition: d,
      workReported: false,
      partClosed: false,
    });
    expect(next(waiting('use_as_is'), 'approve', 'design_authority')).toMatchObject({
      status: 'closed',
      closure: 'use_as_is',
      holes: { to: 'restore', acceptInstalled: true },
    });
    expect(next(waiting('repair'), 'approve', 'design_authority')).toMatchObject({
      status: 'work_ordered',
      closure: null,
      holes: { to: 'held' },
    });
    expect(next(waiting('repair'), 'refuse', 'design_authority')).toMatchObject({
      status: 'raised',
      disposition: null,
      holes: { to: 'flagged' },
    });
  });

  it('accepts work done (closed, holes accepted) or sends it back (work ordered, holes held)', () => {
    const done: FindingFacts = { status: 'work_done', disposition: 'repair', workReported: true, partClosed: false };
    expect(next(done, 'accept', 'inspector')).toMatchObject({
      status: 'closed',
      closure: 'accepted',
      holes: { to: 'accepted' },
    });
    expect(next(done, 'send-back', 'inspector')).toMatchObject({ status: 'work_ordered', holes: { to: 'held' } });
    const ordered: FindingFacts = {
      status: 'work_ordered',
      disposition: 'repair',
      workReported: false,
      partClosed: false,
    };
    expect(next(ordered, 'report-done', 'builder')).toMatchObject({ status: 'work_done', holes: { to: 'reworked' } });
  });

  it('closes a finding that turns out fine as not a defect, holes back as they were', () => {
    expect(next(raised, 'not-a-defect', 'inspector')).toMatchObject({
      status: 'closed',
      closure: 'not_a_defect',
      disposition: null,
      holes: { to: 'restore', acceptInstalled: false },
    });
    expect(restoredHoleStatus('pending', true)).toBe('pending');
    expect(restoredHoleStatus('installed', false)).toBe('installed');
    expect(restoredHoleStatus('installed', true)).toBe('accepted');
    expect(restoredHoleStatus('accepted', false)).toBe('accepted');
  });

  it('refuses to amend a disposition to the one it already has', () => {
    const ordered: FindingFacts = {
      status: 'work_ordered',
      disposition: 'rework',
      workReported: false,
      partClosed: false,
    };
    expect(decide(ordered, 'amend', 'inspector', 'rework')).toMatchObject({ ok: false, code: 409 });
    expect(decide(raised, 'disposition', 'inspector')).toMatchObject({ ok: false, code: 409 });
  });

  it('ends every path: from any open state some move leads on, and closed has none', () => {
    for (const c of STATES) {
      const all = PLACES.flatMap((p) => allowedActions({ ...c, partClosed: false }, p));
      if (c.status === 'closed') expect(all).toEqual([]);
      else expect(all.length).toBeGreaterThan(0);
    }
    expect(findingStatuses).toContain('closed');
  });
});

describe('who is mailed', () => {
  it.each([
    ['raise', null, 'builder', ['inspectors']],
    ['raise', null, 'inspector', ['builders']],
    ['raise', null, 'design_authority', ['inspectors', 'builders']],
    ['disposition', 'rework', 'inspector', ['builders']],
    ['disposition', 'repair', 'inspector', ['design_authority', 'builders']],
    ['disposition', 'use_as_is', 'inspector', ['design_authority', 'builders']],
    ['disposition', 'scrap', 'inspector', ['builders']],
    ['disposition', 'return_to_supplier', 'inspector', ['builders', 'design_authority']],
    ['amend', 'use_as_is', 'inspector', ['design_authority', 'builders']],
    ['not-a-defect', null, 'inspector', ['builders']],
    ['approve', 'repair', 'design_authority', ['inspectors', 'builders']],
    ['refuse', null, 'design_authority', ['inspectors']],
    ['report-done', 'rework', 'builder', ['inspectors']],
    ['accept', 'rework', 'inspector', ['builders']],
    ['send-back', 'rework', 'inspector', ['builders']],
    ['part-replaced', 'scrap', 'inspector', []],
  ] as const)('%s (%s) by %s mails %j', (action, d, place, audience) => {
    expect(mailAudienceOf(action, d, place)).toEqual(audience);
  });
});

describe('a part ready to sign off', () => {
  const ready: PartFacts = {
    holes: { installed: 3, accepted: 2 },
    stepsOpen: 0,
    pointsUnstamped: 0,
    openFindings: 0,
    signedOff: false,
    replaced: false,
  };
  it.each([
    ['every hole installed or accepted, every step done, no finding open', ready, true],
    ['a hole pending', { ...ready, holes: { ...ready.holes, pending: 1 } }, false],
    ['a hole flagged', { ...ready, holes: { ...ready.holes, flagged: 1 } }, false],
    ['a hole held', { ...ready, holes: { ...ready.holes, held: 1 } }, false],
    ['a hole reworked, not yet accepted', { ...ready, holes: { ...ready.holes, reworked: 1 } }, false],
    ['a step open', { ...ready, stepsOpen: 1 }, false],
    ['an inspection point not stamped', { ...ready, pointsUnstamped: 1 }, false],
    ['a finding open', { ...ready, openFindings: 1 }, false],
    ['already signed off', { ...ready, signedOff: true }, false],
    ['replaced', { ...ready, replaced: true }, false],
  ] as const)('%s → ready %s', (_w, facts, expected) => {
    expect(signOffReadiness(facts).ready).toBe(expected);
    expect(checkPartAction(facts, 'sign-off', 'inspector') === null).toBe(expected);
    expect(allowedPartActions(facts, 'inspector').includes('sign-off')).toBe(expected);
  });

  it('says why not, in words', () => {
    expect(
      signOffReadiness({
        holes: { pending: 2, installed: 1 },
        stepsOpen: 1,
        pointsUnstamped: 0,
        openFindings: 1,
        signedOff: false,
        replaced: false,
      }).reasons,
    ).toEqual(['2 holes not done', '1 step not done', '1 finding open']);
  });

  it.each([
    ['tick', 'builder', null],
    ['tick', 'inspector', 403],
    ['tick', 'design_authority', 403],
    ['tick', 'none', 403],
    ['step', 'builder', null],
    ['step', 'inspector', 403],
    ['raise', 'builder', null],
    ['raise', 'inspector', null],
    ['raise', 'design_authority', null],
    ['raise', 'none', 403],
    ['sign-off', 'inspector', null],
    ['sign-off', 'builder', 403],
    ['sign-off', 'design_authority', 403],
    ['stamp', 'inspector', null],
    ['stamp', 'builder', 403],
    ['stamp', 'design_authority', 403],
    ['stamp', 'none', 403],
  ] as const)('%s by %s on an open, ready part → %s', (action, place, code) => {
    expect(checkPartAction(ready, action, place)?.code ?? null).toBe(code);
  });

  it.each(['tick', 'step', 'raise', 'stamp'] as const)(
    'refuses %s on a signed-off or replaced part with 409',
    (action) => {
      const place = action === 'raise' || action === 'stamp' ? 'inspector' : 'builder';
      expect(checkPartAction({ ...ready, signedOff: true }, action, place)?.code).toBe(409);
      expect(checkPartAction({ ...ready, replaced: true }, action, place)?.code).toBe(409);
    },
  );
});

describe('inspection points on a traveler', () => {
  // Five steps; step 2 an inspection point (a fit check before riveting: common practice).
  const steps = (over: Partial<Record<number, Partial<StepFact>>> = {}): StepFact[] =>
    [1, 2, 3, 4, 5].map((seq) => ({
      id: `s${seq}`,
      seq,
      inspectionPoint: seq === 2,
      done: false,
      stamped: false,
      ...over[seq],
    }));

  it('lets the steps up to and including the point be done, but none after it until it is stamped', () => {
    expect(checkStepChange(steps(), 's1', 'done')).toBeNull();
    expect(checkStepChange(steps(), 's2', 'done')).toBeNull();
    expect(checkStepChange(steps({ 2: { done: true } }), 's3', 'done')).toEqual({
      code: 409,
      message: 'step 2 is an inspection point: an inspector stamps it before later steps are done',
    });
    expect(checkStepChange(steps({ 2: { done: true } }), 's5', 'done')?.code).toBe(409);
    expect(checkStepChange(steps({ 2: { done: true, stamped: true } }), 's3', 'done')).toBeNull();
  });

  it('stamps only a done inspection point, once, and a stamped step stays done', () => {
    expect(checkStepChange(steps(), 's2', 'stamp')?.message).toBe('step 2 is not done yet: the builder does it first');
    expect(checkStepChange(steps({ 2: { done: true } }), 's2', 'stamp')).toBeNull();
    expect(checkStepChange(steps({ 1: { done: true } }), 's1', 'stamp')?.message).toBe(
      'step 1 is not an inspection point',
    );
    expect(checkStepChange(steps({ 2: { done: true, stamped: true } }), 's2', 'stamp')?.code).toBe(409);
    expect(checkStepChange(steps({ 2: { done: true, stamped: true } }), 's2', 'undone')?.message).toBe(
      'step 2 was stamped by an inspector: it stays done',
    );
    expect(checkStepChange(steps({ 2: { done: true } }), 's2', 'undone')).toBeNull();
  });

  it('holds the sign-off until every point is stamped, and says so', () => {
    expect(
      signOffReadiness({
        holes: { installed: 1 },
        stepsOpen: 0,
        pointsUnstamped: 1,
        openFindings: 0,
        signedOff: false,
        replaced: false,
      }).reasons,
    ).toEqual(['1 inspection point not stamped']);
  });
});
