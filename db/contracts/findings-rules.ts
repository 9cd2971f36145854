/**
 * The life of a finding, in the trade's material-review terms, and a part's readiness for sign-off.
 * This is the one home of these rules: the server changes a finding only through `decide`, every answer
 * carries `allowedActions`, and the screens draw their buttons from that list.
 *
 *   raised ──disposition──▶ work ordered (rework)            ──report done──▶ work done ──accept──▶ closed
 *     ▲                   ▶ awaiting design authority (repair, use as is) ──approve──▶ work ordered / closed
 *     └──────refuse────────┘                                             work done ──send back──▶ work ordered
 *   raised ──disposition──▶ closed (scrap, return to supplier: the build gets a replacement part)
 *   raised ──not a defect──▶ closed
 */
import type { HoleStatus } from './travelers';

export const findingStatuses = ['raised', 'awaiting_approval', 'work_ordered', 'work_done', 'closed'] as const;
export type FindingStatus = (typeof findingStatuses)[number];

export const findingStatusLabels: Record<FindingStatus, string> = {
  raised: 'Raised',
  awaiting_approval: 'Awaiting design authority',
  work_ordered: 'Work ordered',
  work_done: 'Work done, to inspect',
  closed: 'Closed',
};

/** What the inspector decides (ISO 9000:2015 3.12.8/3.12.9; AS9100 8.7). */
export const dispositions = ['rework', 'repair', 'use_as_is', 'scrap', 'return_to_supplier'] as const;
export type Disposition = (typeof dispositions)[number];

export const dispositionLabels: Record<Disposition, string> = {
  rework: 'Rework',
  repair: 'Repair',
  use_as_is: 'Use as is',
  scrap: 'Scrap',
  return_to_supplier: 'Return to supplier',
};

export const dispositionHelp: Record<Disposition, string> = {
  rework: 'Bring the hole back to the drawing: drill out and set the same rivet again.',
  repair:
    'A departure from the drawing made acceptable (next-size rivet, doubler): the design authority approves it first.',
  use_as_is: 'Accept the departure as it stands: the design authority approves it first.',
  scrap: 'The part is not to be used: the build gets a replacement part.',
  return_to_supplier: 'A defect of the kit part itself: it goes back, and the build gets a replacement part.',
};

/** Dispositions that end the part itself: the build gets a replacement traveler. */
export const replacementReasons = ['scrap', 'return_to_supplier'] as const satisfies readonly Disposition[];
export type ReplacementReason = (typeof replacementReasons)[number];

/** How a closed finding ended. */
export const findingClosures = ['accepted', 'use_as_is', 'not_a_defect', 'scrapped', 'returned'] as const;
export type FindingClosure = (typeof findingClosures)[number];

export const findingClosureLabels: Record<FindingClosure, string> = {
  accepted: 'Work accepted',
  use_as_is: 'Used as is',
  not_a_defect: 'Not a defect',
  scrapped: 'Part scrapped',
  returned: 'Returned to supplier',
};

/** How a repair makes the departure acceptable. */
export const repairSchemes = ['oversize_rivet', 'doubler', 'other'] as const;
export type RepairScheme = (typeof repairSchemes)[number];
export const repairSchemeLabels: Record<RepairScheme, string> = {
  oversize_rivet: 'Next-size rivet',
  doubler: 'Doubler',
  other: 'Other scheme (in the note)',
};

export const findingActions = [
  'disposition',
  'amend',
  'not-a-defect',
  'approve',
  'refuse',
  'report-done',
  'accept',
  'send-back',
] as const;
export type FindingAction = (typeof findingActions)[number];

export const findingActionLabels: Record<FindingAction, string> = {
  disposition: 'Record the disposition',
  amend: 'Amend the disposition',
  'not-a-defect': 'Not a defect',
  approve: 'Approve',
  refuse: 'Refuse',
  'report-done': 'Report the work done',
  accept: 'Accept the work',
  'send-back': 'Send back',
};

/** Where a person stands towards one build: it decides what they may do, not their account's role alone. */
export const buildPlaces = ['builder', 'inspector', 'design_authority', 'none'] as const;
export type BuildPlace = (typeof buildPlaces)[number];

export const buildPlaceLabels: Record<BuildPlace, string> = {
  builder: 'a builder of this build',
  inspector: 'an inspector of this build',
  design_authority: "the kit supplier's engineer (design authority)",
  none: 'not on this build',
};

/** Who is mailed about an event. */
export type MailAudience = 'builders' | 'inspectors' | 'design_authority';

/** The one definition of an open finding. */
export const isOpenFinding = (status: FindingStatus): boolean => status !== 'closed';
export const openFindingStatuses: readonly FindingStatus[] = findingStatuses.filter(isOpenFinding);

/** The facts about a finding that the rules read. */
export type FindingFacts = {
  status: FindingStatus;
  disposition: Disposition | null;
  /** The builder has reported work done at least once: the disposition can no longer be amended. */
  workReported: boolean;
  /** The part is signed off or replaced: nothing moves on it. */
  partClosed: boolean;
};

/** What a move does to the finding's holes. `restore` puts back what they were before the flag. */
export type HoleEffect = { to: HoleStatus } | { to: 'restore'; acceptInstalled: boolean } | null;

export type Decision =
  | {
      ok: true;
      status: FindingStatus;
      disposition: Disposition | null;
      closure: FindingClosure | null;
      holes: HoleEffect;
      /** Scrap and return to supplier give the build a replacement traveler for the same part. */
      replacePart: ReplacementReason | null;
      mail: MailAudience[];
    }
  | { ok: false; code: 403 | 409; message: string };

type Rule = {
  who: BuildPlace;
  from: readonly FindingStatus[];
  /** Further condition on the finding, with the words said when it does not hold. */
  when?: (f: FindingFacts) => string | null;
};

const RULES: Record<FindingAction, Rule> = {
  disposition: { who: 'inspector', from: ['raised'] },
  amend: {
    who: 'inspector',
    from: ['awaiting_approval', 'work_ordered'],
    when: (f) => (f.workReported ? 'the work has started: the disposition can no longer be amended' : null),
  },
  'not-a-defect': { who: 'inspector', from: ['raised'] },
  approve: { who: 'design_authority', from: ['awaiting_approval'] },
  refuse: { who: 'design_authority', from: ['awaiting_approval'] },
  'report-done': {
    who: 'builder',
    from: ['work_ordered'],
    when: (f) =>
      f.disposition === 'rework' || f.disposition === 'repair' ? null : 'no work is ordered on this finding',
  },
  accept: { who: 'inspector', from: ['work_done'] },
  'send-back': { who: 'inspector', from: ['work_done'] },
};

const words = (s: string) => s.replace(/_/g, ' ');

/** Whether `action` is allowed, and if not, why (403: not yours to do; 409: not now). */
export function checkAction(
  f: FindingFacts,
  action: FindingAction,
  place: BuildPlace,
): { ok: true } | { ok: false; code: 403 | 409; message: string } {
  const rule = RULES[action];
  if (place !== rule.who) {
    return {
      ok: false,
      code: 403,
      message: `only ${buildPlaceLabels[rule.who]} may ${findingActionLabels[action].toLowerCase()}`,
    };
  }
  if (f.partClosed)
    return { ok: false, code: 409, message: 'this part is signed off or replaced: its findings no longer move' };
  if (!rule.from.includes(f.status)) {
    return {
      ok: false,
      code: 409,
      message: `the finding is ${findingStatusLabels[f.status].toLowerCase()}: it cannot be moved this way now`,
    };
  }
  const why = rule.when?.(f);
  if (why) return { ok: false, code: 409, message: why };
  return { ok: true };
}

/** The moves this person may make now: what the screen offers. */
export function allowedActions(f: FindingFacts, place: BuildPlace): FindingAction[] {
  return findingActions.filter((a) => checkAction(f, a, place).ok);
}

/** Where a disposition sends the finding. */
function afterDisposition(d: Disposition): Omit<Extract<Decision, { ok: true }>, 'ok' | 'disposition' | 'mail'> {
  switch (d) {
    case 'rework':
      return { status: 'work_ordered', closure: null, holes: { to: 'held' }, replacePart: null };
    case 'repair':
    case 'use_as_is':
      return { status: 'awaiting_approval', closure: null, holes: { to: 'held' }, replacePart: null };
    case 'scrap':
      return { status: 'closed', closure: 'scrapped', holes: { to: 'held' }, replacePart: 'scrap' };
    case 'return_to_supplier':
      return { status: 'closed', closure: 'returned', holes: { to: 'held' }, replacePart: 'return_to_supplier' };
  }
}

/**
 * Who is mailed about an event: whoever must act next, and the builders whenever a decision touches
 * their part. The mail worker reads the same function, so the rule and the mail cannot drift apart.
 */
export function mailAudienceOf(
  action: FindingEventAction,
  disposition: Disposition | null,
  actorPlace: BuildPlace,
): MailAudience[] {
  switch (action) {
    case 'raise':
      return raiseAudience(actorPlace);
    case 'disposition':
    case 'amend':
      if (disposition === 'repair' || disposition === 'use_as_is') return ['design_authority', 'builders'];
      if (disposition === 'return_to_supplier') return ['builders', 'design_authority'];
      return ['builders'];
    case 'not-a-defect':
      return ['builders'];
    case 'approve':
      return ['inspectors', 'builders'];
    case 'refuse':
      return ['inspectors'];
    case 'report-done':
      return ['inspectors'];
    case 'accept':
      return ['builders'];
    case 'send-back':
      return ['builders'];
    case 'part-replaced':
      return [];
  }
}

/**
 * The move itself: the next state, what happens to the holes, and who is mailed. `disposition` is the
 * inspector's choice for `disposition` and `amend`, ignored otherwise.
 */
export function decide(f: FindingFacts, action: FindingAction, place: BuildPlace, disposition?: Disposition): Decision {
  const allowed = checkAction(f, action, place);
  if (!allowed.ok) return allowed;
  const next = nextOf(f, action, disposition);
  if ('message' in next) return { ok: false, code: 409, message: next.message };
  return { ok: true, ...next, mail: mailAudienceOf(action, next.disposition, place) };
}

type Next = Omit<Extract<Decision, { ok: true }>, 'ok' | 'mail'>;

function nextOf(f: FindingFacts, action: FindingAction, disposition?: Disposition): Next | { message: string } {
  switch (action) {
    case 'disposition':
    case 'amend':
      if (!disposition) return { message: 'choose a disposition' };
      if (action === 'amend' && disposition === f.disposition) {
        return { message: `the disposition is already ${words(disposition)}: choose another to amend it` };
      }
      return { disposition, ...afterDisposition(disposition) };
    case 'not-a-defect':
      return {
        status: 'closed',
        disposition: null,
        closure: 'not_a_defect',
        holes: { to: 'restore', acceptInstalled: false },
        replacePart: null,
      };
    case 'approve':
      return f.disposition === 'use_as_is'
        ? {
            status: 'closed',
            disposition: f.disposition,
            closure: 'use_as_is',
            holes: { to: 'restore', acceptInstalled: true },
            replacePart: null,
          }
        : {
            status: 'work_ordered',
            disposition: f.disposition,
            closure: null,
            holes: { to: 'held' },
            replacePart: null,
          };
    case 'refuse':
      // Back to the inspector to decide again; the holes are suspect once more.
      return { status: 'raised', disposition: null, closure: null, holes: { to: 'flagged' }, replacePart: null };
    case 'report-done':
      return {
        status: 'work_done',
        disposition: f.disposition,
        closure: null,
        holes: { to: 'reworked' },
        replacePart: null,
      };
    case 'accept':
      return {
        status: 'closed',
        disposition: f.disposition,
        closure: 'accepted',
        holes: { to: 'accepted' },
        replacePart: null,
      };
    case 'send-back':
      return {
        status: 'work_ordered',
        disposition: f.disposition,
        closure: null,
        holes: { to: 'held' },
        replacePart: null,
      };
  }
}

/** A hole's status once a finding closes with `restore`: what it was before the flag, accepted if it was riveted. */
export function restoredHoleStatus(before: HoleStatus, acceptInstalled: boolean): HoleStatus {
  if (before === 'pending') return 'pending';
  if (before === 'accepted') return 'accepted';
  return acceptInstalled ? 'accepted' : 'installed';
}

/** The fewest characters a required note may have. */
export const NOTE_MIN_LENGTH = 3;

/** Which moves need a note (at least NOTE_MIN_LENGTH): a refusal or a send-back must say why. */
export const noteRequired: Record<FindingAction, boolean> = {
  disposition: true,
  amend: true,
  'not-a-defect': true,
  approve: false,
  refuse: true,
  'report-done': true,
  accept: false,
  'send-back': true,
};

/** Raising a finding: the builder at the bench, the inspector, or the supplier's engineer on a visit. */
export function checkRaise(
  place: BuildPlace,
  partClosed: boolean,
): { ok: true } | { ok: false; code: 403 | 409; message: string } {
  if (place === 'none') return { ok: false, code: 403, message: 'only people on this build may raise a finding' };
  if (partClosed) return { ok: false, code: 409, message: 'this part is signed off or replaced: no new findings' };
  return { ok: true };
}

/** Who hears of a new finding: everyone who must act on it, never the person who raised it. */
export function raiseAudience(place: BuildPlace): MailAudience[] {
  const out: MailAudience[] = [];
  if (place !== 'inspector') out.push('inspectors');
  if (place !== 'builder') out.push('builders');
  return out;
}

/** Holes that may be flagged: a hole already under a finding is the inspector's until it closes. */
export const flaggableHoleStatuses: readonly HoleStatus[] = ['pending', 'installed', 'accepted'];

// ---- The part: ticking and sign-off ----

/** Holes done for good; holes waiting for the inspector are counted apart. */
export const holesDoneStatuses: readonly HoleStatus[] = ['installed', 'accepted'];
export const holesAwaitingInspectorStatuses: readonly HoleStatus[] = ['flagged', 'reworked'];

/** Holes done for good and holes waiting for the inspector: the server's counts and the bench's own while it waits. */
export function countHoles(holes: readonly { status: HoleStatus }[]): { done: number; awaiting: number } {
  let done = 0;
  let awaiting = 0;
  for (const h of holes) {
    if (holesDoneStatuses.includes(h.status)) done++;
    else if (holesAwaitingInspectorStatuses.includes(h.status)) awaiting++;
  }
  return { done, awaiting };
}

export type PartFacts = {
  holes: Partial<Record<HoleStatus, number>>;
  stepsOpen: number;
  /** Inspection points done but not yet stamped by an inspector (or not yet done). */
  pointsUnstamped: number;
  openFindings: number;
  signedOff: boolean;
  replaced: boolean;
};

/** A step as the step rules see it. */
export type StepFact = { id: string; seq: number; inspectionPoint: boolean; done: boolean; stamped: boolean };

/** The part's step counts for readiness: steps not done, and inspection points not stamped. */
export function stepCounts(steps: readonly Pick<StepFact, 'inspectionPoint' | 'done' | 'stamped'>[]) {
  return {
    stepsOpen: steps.filter((s) => !s.done).length,
    pointsUnstamped: steps.filter((s) => s.inspectionPoint && !s.stamped).length,
  };
}

export type Readiness = { ready: boolean; reasons: string[] };

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** The one definition of a part ready to sign off: every hole done, every step done, no finding open. */
export function signOffReadiness(p: PartFacts): Readiness {
  if (p.replaced) return { ready: false, reasons: ['this part was replaced: sign off its replacement'] };
  if (p.signedOff) return { ready: false, reasons: ['this part is already signed off'] };
  const notDone = Object.entries(p.holes)
    .filter(([s]) => !holesDoneStatuses.includes(s as HoleStatus))
    .reduce((n, [, c]) => n + (c ?? 0), 0);
  const reasons = [
    notDone ? `${plural(notDone, 'hole')} not done` : '',
    p.stepsOpen ? `${plural(p.stepsOpen, 'step')} not done` : '',
    p.pointsUnstamped ? `${plural(p.pointsUnstamped, 'inspection point')} not stamped` : '',
    p.openFindings ? `${plural(p.openFindings, 'finding')} open` : '',
  ].filter(Boolean);
  return { ready: reasons.length === 0, reasons };
}

export const partActions = ['tick', 'step', 'stamp', 'raise', 'sign-off', 'withdraw-sign-off'] as const;
export type PartAction = (typeof partActions)[number];

/** What a person may do on a part now. Sign-off needs readiness; the rest need an open part. */
export function allowedPartActions(p: PartFacts, place: BuildPlace): PartAction[] {
  const open = !p.signedOff && !p.replaced;
  const out: PartAction[] = [];
  if (open && place === 'builder') out.push('tick', 'step');
  if (open && place === 'inspector') out.push('stamp');
  if (checkRaise(place, !open).ok) out.push('raise');
  if (place === 'inspector' && signOffReadiness(p).ready) out.push('sign-off');
  if (checkPartAction(p, 'withdraw-sign-off', place) === null) out.push('withdraw-sign-off');
  return out;
}

/** Why a part action is refused, or null when it is allowed: the server's words for 403/409. */
export function checkPartAction(
  p: PartFacts,
  action: PartAction,
  place: BuildPlace,
): { code: 403 | 409; message: string } | null {
  switch (action) {
    case 'tick':
    case 'step':
      if (place !== 'builder') return { code: 403, message: 'only a builder of this build works the traveler' };
      if (p.replaced) return { code: 409, message: 'this part was replaced: work its replacement' };
      if (p.signedOff) return { code: 409, message: 'this part is signed off and can no longer change' };
      return null;
    case 'stamp':
      if (place !== 'inspector')
        return { code: 403, message: 'only an inspector of this build stamps an inspection point' };
      if (p.replaced) return { code: 409, message: 'this part was replaced: work its replacement' };
      if (p.signedOff) return { code: 409, message: 'this part is signed off and can no longer change' };
      return null;
    case 'raise': {
      const r = checkRaise(place, p.signedOff || p.replaced);
      return r.ok ? null : { code: r.code, message: r.message };
    }
    case 'sign-off': {
      if (place !== 'inspector') return { code: 403, message: 'only an inspector of this build signs a part off' };
      const r = signOffReadiness(p);
      return r.ready ? null : { code: 409, message: `not ready to sign off: ${r.reasons.join(', ')}` };
    }
    // Whoever may sign a part off may take the sign-off back (with a reason, logged); the part reopens.
    case 'withdraw-sign-off':
      if (place !== 'inspector') return { code: 403, message: 'only an inspector of this build withdraws a sign-off' };
      if (p.replaced) return { code: 409, message: 'this part was replaced: its record stays as it is' };
      if (!p.signedOff) return { code: 409, message: 'this part is not signed off: there is no sign-off to withdraw' };
      return null;
  }
}

/**
 * The order an inspection point keeps: no step after an unstamped point may be done, a stamped step
 * stays done, and only a done inspection point is stamped, once. Null when the change is allowed (a
 * step that is not on the part is the caller's 404).
 */
export function checkStepChange(
  steps: readonly StepFact[],
  stepId: string,
  change: 'done' | 'undone' | 'stamp',
): { code: 409; message: string } | null {
  const step = steps.find((s) => s.id === stepId);
  if (!step) return null;
  switch (change) {
    case 'done': {
      const waiting = steps.find((s) => s.seq < step.seq && s.inspectionPoint && !s.stamped);
      return waiting
        ? {
            code: 409,
            message: `step ${waiting.seq} is an inspection point: an inspector stamps it before later steps are done`,
          }
        : null;
    }
    case 'undone':
      return step.stamped
        ? { code: 409, message: `step ${step.seq} was stamped by an inspector: it stays done` }
        : null;
    case 'stamp':
      if (!step.inspectionPoint) return { code: 409, message: `step ${step.seq} is not an inspection point` };
      if (!step.done) return { code: 409, message: `step ${step.seq} is not done yet: the builder does it first` };
      if (step.stamped) return { code: 409, message: `step ${step.seq} is stamped already` };
      return null;
  }
}

/** The build log's word for each finding event. */
export const findingLogKindOfAction = {
  raise: 'finding_raised',
  disposition: 'finding_dispositioned',
  amend: 'finding_dispositioned',
  'not-a-defect': 'finding_closed',
  approve: 'finding_approval',
  refuse: 'finding_approval',
  'report-done': 'finding_work_done',
  accept: 'finding_closed',
  'send-back': 'finding_sent_back',
  'part-replaced': 'finding_closed',
} as const;
export type FindingEventAction = keyof typeof findingLogKindOfAction;
export const findingEventActions = Object.keys(findingLogKindOfAction) as [FindingEventAction, ...FindingEventAction[]];
