import type { Role } from '@shared/auth';
import type { AppRouteName } from '@/router/routes';

export interface AppLayoutNavItem {
  name: AppRouteName;
  label: string;
  /** Roles that see the entry; absent = every signed-in user. */
  roles?: readonly Role[];
  /**
   * When the top bar is too narrow for every link, links move into the "More" menu lowest `keep` first
   * (absent = 5). Admin and the screens a role exists for stay in the bar longest.
   */
  keep?: number;
}

/**
 * Top-level navigation. Coach ("Coach", for coaches and admins) and proprietor ("Center admin") entries
 * join here when those screens exist; until then they are left out rather than linking to nothing.
 */
export const NAV_ITEMS: readonly AppLayoutNavItem[] = [
  { name: 'home', label: 'Home', keep: 8 },
  { name: 'arsenal', label: 'Arsenal', keep: 7 },
  { name: 'catalogue', label: 'Catalogue', keep: 6 },
  { name: 'matchup', label: 'Matchup', keep: 7 },
  { name: 'patterns', label: 'Patterns', keep: 6 },
  { name: 'conditions', label: 'Conditions', keep: 6 },
  { name: 'sessions', label: 'Sessions', keep: 3 },
  { name: 'stats', label: 'Stats', keep: 2 },
  { name: 'decisions', label: 'Decide', keep: 1 },
  { name: 'coach', label: 'Coach', keep: 2 },
  { name: 'orders', label: 'Orders', keep: 4 },
  { name: 'center-admin', label: 'Center admin', roles: ['proprietor', 'admin'], keep: 8 },
  { name: 'profile', label: 'Profile', keep: 5 },
  { name: 'admin-users', label: 'Admin', roles: ['admin'], keep: 9 },
  { name: 'dev-mail', label: 'Dev mailbox', roles: ['admin'], keep: 8 },
];

/** The entries for a user holding these roles (any of an entry's roles shows it). */
export function navItemsFor(roles: Role | readonly Role[] | null): AppLayoutNavItem[] {
  if (!roles) return [];
  const held: readonly Role[] = typeof roles === 'string' ? [roles] : roles;
  return NAV_ITEMS.filter((item) => !item.roles || item.roles.some((r) => held.includes(r)));
}

/**
 * Which entries fit a bar `available` pixels wide, given each entry's width and the "More" button's: all when they
 * fit; otherwise entries leave lowest `keep` first (the later of equals first) until the rest and "More" fit.
 */
export function splitNav(
  items: readonly AppLayoutNavItem[],
  widths: readonly number[],
  available: number,
  moreWidth: number,
): { shown: AppLayoutNavItem[]; more: AppLayoutNavItem[] } {
  const total = widths.reduce((a, b) => a + b, 0);
  if (total <= available || items.length === 0) return { shown: [...items], more: [] };
  const order = items.map((item, i) => ({ i, keep: item.keep ?? 5 })).sort((a, b) => a.keep - b.keep || b.i - a.i);
  const hidden = new Set<number>();
  let used = total;
  for (const { i } of order) {
    if (used + moreWidth <= available) break;
    hidden.add(i);
    used -= widths[i] ?? 0;
  }
  return { shown: items.filter((_, i) => !hidden.has(i)), more: items.filter((_, i) => hidden.has(i)) };
}
