import type { Disposition, FindingStatus, HoleStatus, Role } from '../../db/contracts';

export type Action = 'review' | 'disposition' | 'rework-done' | 'verify' | 'close';

type Rule = { role: Role; from: FindingStatus[]; when?: (d: Disposition | null, status: FindingStatus) => boolean };

/** Who may move a finding on, and from where. One table, so the rules live in one place. */
export const RULES: Record<Action, Rule> = {
  review: { role: 'inspector', from: ['flagged'] },
  disposition: { role: 'inspector', from: ['flagged', 'in_review'] },
  'rework-done': { role: 'builder', from: ['dispositioned'], when: (d) => d === 'rework' || d === 'repair' },
  verify: { role: 'inspector', from: ['rework_done'] },
  // A scrapped part has nothing to rework: the inspector closes it straight from the disposition.
  close: { role: 'inspector', from: ['verified', 'dispositioned'], when: (d, status) => status === 'verified' || d === 'scrap' },
};

/** Where the finding goes, and what its holes become. */
export function nextState(action: Action, disposition: Disposition | null): { status: FindingStatus; holes: HoleStatus | null } {
  switch (action) {
    case 'review': return { status: 'in_review', holes: null };
    case 'disposition': return disposition === 'use_as_is' ? { status: 'closed', holes: 'accepted' } : { status: 'dispositioned', holes: 'held' };
    case 'rework-done': return { status: 'rework_done', holes: 'reworked' };
    case 'verify': return { status: 'verified', holes: 'accepted' };
    case 'close': return { status: 'closed', holes: null };
  }
}

/** Who hears of an event: the inspectors when the builder acted, the builders when the inspector decided. */
export function mailAudience(toStatus: FindingStatus, disposition: Disposition | null): 'inspector' | 'builder' | null {
  if (toStatus === 'flagged' || toStatus === 'rework_done') return 'inspector';
  if (disposition || toStatus === 'verified') return 'builder';
  return null;
}
