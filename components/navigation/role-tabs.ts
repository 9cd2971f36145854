import type { Role } from '@/db/contracts';
import type { TabGlyph } from './tab-icon';

export type Tab = { name: string; title: string; glyph: TabGlyph; testID: string };

/** Which tabs each role sees. Other screens stay reachable by link; the server checks every request. */
export function tabsFor(role: Role | null): Tab[] {
  switch (role) {
    case 'builder':
      return [
        { name: 'bench', title: 'Bench', glyph: 'bench', testID: 'tab-bench' },
        { name: 'travelers', title: 'Parts', glyph: 'parts', testID: 'tab-parts' },
        { name: 'findings', title: 'Findings', glyph: 'findings', testID: 'tab-findings' },
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
      ];
    case 'admin':
      return [{ name: 'admin', title: 'Session', glyph: 'session', testID: 'tab-admin' }];
    default:
      return [];
  }
}

// 'index' first: it is the navigator's first route, which sends each role to its own first tab.
export const allTabRoutes = ['index', 'bench', 'travelers', 'findings', 'catalogue', 'studies', 'coupons', 'builds', 'admin'] as const;

