import type { Role, SessionUser } from '@/db/contracts';
import type { TabGlyph } from './tab-icon';

export type Tab = {
  name: string;
  title: string;
  glyph: TabGlyph;
  testID: string;
  /**
   * The label under the icon where a phone's tabs are narrow (a supplier's six share 390 px, 53 px of
   * label each): "Catalogue" and "Approvals" broke inside the word there.
   */
  short?: string;
};

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
        { name: 'catalogue', title: 'Catalogue', short: 'Kits', glyph: 'catalogue', testID: 'tab-catalogue' },
        { name: 'studies', title: 'Load studies', glyph: 'studies', testID: 'tab-studies' },
        { name: 'coupons', title: 'Coupons', glyph: 'coupons', testID: 'tab-coupons' },
        { name: 'builds', title: 'Builds', glyph: 'builds', testID: 'tab-builds' },
        // Findings that wait on the supplier's approval; the ticked-list glyph, as the inspector's review.
        { name: 'findings', title: 'Approvals', short: 'Approve', glyph: 'review', testID: 'tab-approvals' },
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
export const allTabRoutes = [
  'index',
  'bench',
  'travelers',
  'findings',
  'catalogue',
  'studies',
  'coupons',
  'builds',
  'people',
  'account',
  'phone',
] as const;

export type AppRoute = (typeof allTabRoutes)[number];

/**
 * Pages that are no part of a role's work: opened by a link or a previous person's last page, they only
 * answered "only a supplier may do this", or showed the admin builds "you inspect". Such a page is
 * closed to the role, and the person lands on their own first page instead. Pages other roles reach by
 * a link in their work (a build, a part, the phones set-up) stay open; the server checks every request.
 */
const closedTo: Record<Role, readonly AppRoute[]> = {
  builder: ['catalogue', 'studies', 'coupons'],
  inspector: ['catalogue', 'studies', 'coupons'],
  supplier: [],
  // The admin keeps people, organisations and phones; the shop's work is the other roles'.
  admin: ['bench', 'travelers', 'findings', 'catalogue', 'studies', 'coupons', 'builds'],
};

export function mayOpen(role: Role | null | undefined, route: AppRoute): boolean {
  return !role || !closedTo[role].includes(route);
}

/** Whether a path inside the app (a pending link) is a page the role works on; its first segment decides. */
export function mayOpenPath(role: Role | null | undefined, path: string): boolean {
  const first = path
    .split(/[?#]/)[0]
    .split('/')
    .find((seg) => seg && !/^\(.*\)$/.test(seg));
  const route = (allTabRoutes as readonly string[]).find((r) => r === first) as AppRoute | undefined;
  return route ? mayOpen(role, route) : true;
}
