import type { Role } from '@shared/auth';
import type { AppRouteName } from '@/router/routes';

export interface AppLayoutNavItem {
  name: AppRouteName;
  label: string;
  /** Roles that see the entry; absent = every signed-in user. */
  roles?: readonly Role[];
}

/**
 * Top-level navigation. Coach ("Coach", for coaches and admins) and proprietor ("Center admin") entries
 * join here when those screens exist; until then they are left out rather than linking to nothing.
 */
export const NAV_ITEMS: readonly AppLayoutNavItem[] = [
  { name: 'home', label: 'Home' },
  { name: 'arsenal', label: 'Arsenal' },
  { name: 'catalogue', label: 'Catalogue' },
  { name: 'matchup', label: 'Matchup' },
  { name: 'patterns', label: 'Patterns' },
  { name: 'conditions', label: 'Conditions' },
  { name: 'sessions', label: 'Sessions' },
  { name: 'stats', label: 'Stats' },
  { name: 'decisions', label: 'Decide' },
  { name: 'coach', label: 'Coach' },
  { name: 'orders', label: 'Orders' },
  { name: 'center-admin', label: 'Center admin', roles: ['proprietor', 'admin'] },
  { name: 'profile', label: 'Profile' },
  { name: 'admin-users', label: 'Admin', roles: ['admin'] },
  { name: 'dev-mail', label: 'Dev mailbox', roles: ['admin'] },
];

export function navItemsFor(role: Role | null): AppLayoutNavItem[] {
  if (!role) return [];
  return NAV_ITEMS.filter((item) => !item.roles || item.roles.includes(role));
}
