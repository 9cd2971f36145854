import type { SessionUser } from '@/db/contracts';
import type { TabGlyph } from './tab-icon';

export type Tab = { name: string; title: string; glyph: TabGlyph; testID: string };

const peopleTab: Tab = { name: 'people', title: 'People', glyph: 'people', testID: 'tab-people' };

/**
 * Which tabs the signed-in person sees: by role, and for a supplier's lead engineer the people of
 * their organisation too. Other screens stay reachable by link; the server checks every request.
 */
export function tabsFor(user: Pick<SessionUser, 'role' | 'lead'> | null): Tab[] {
  switch (user?.role ?? null) {
    case 'builder':
      return [
        { name: 'bench', title: 'Bench', glyph: 'bench', testID: 'tab-bench' },
        { name: 'travelers', title: 'Parts', glyph: 'parts', testID: 'tab-parts' },
        { name: 'findings', title: 'Findings', glyph: 'findings', testID: 'tab-findings' },
        // The owner of a build brings helpers and inspectors onto it from the build's page.
        { name: 'builds', title: 'Builds', glyph: 'builds', testID: 'tab-builds' },
      ];
    case 'inspector':
      return [
        { name: 'findings', title: 'Review', glyph: 'review', testID: 'tab-review' },
        { name: 'builds', title: 'Builds', glyph: 'builds', testID: 'tab-builds' },
      ];
    case 'supplier':
      return [
        { name: 'catalogue', title: 'Catalogue', glyph: 'catalogue', testID: 'tab-catalogue' },
        { name: 'studies', title: 'Load studies', glyph: 'studies', testID: 'tab-studies' },
        { name: 'coupons', title: 'Coupons', glyph: 'coupons', testID: 'tab-coupons' },
        { name: 'builds', title: 'Builds', glyph: 'builds', testID: 'tab-builds' },
        // Findings that wait on the supplier's approval; the ticked-list glyph, as the inspector's review.
        { name: 'findings', title: 'Approvals', glyph: 'review', testID: 'tab-approvals' },
        // A stored session from before `lead` existed reads as not a lead.
        ...(user?.lead ? [peopleTab] : []),
      ];
    case 'admin':
      return [peopleTab, { name: 'phone', title: 'Phones', glyph: 'session', testID: 'tab-phones' }];
    default:
      return [];
  }
}

// 'index' first: it is the navigator's first route, which sends each role to its own first tab.
// 'account' is no tab of anyone's: it opens from every screen's header; 'phone' is the admin's tab and
// opens from a supplier's account page.
export const allTabRoutes = ['index', 'bench', 'travelers', 'findings', 'catalogue', 'studies', 'coupons', 'builds', 'people', 'account', 'phone'] as const;

