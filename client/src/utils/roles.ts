import type { Role } from '@shared/auth';

export const ROLE_LABELS: Readonly<Record<Role, string>> = {
  bowler: 'Bowler',
  coach: 'Coach',
  proprietor: 'Proprietor',
  admin: 'Admin',
};

export const ROLE_PLURALS: Readonly<Record<Role, string>> = {
  bowler: 'bowlers',
  coach: 'coaches',
  proprietor: 'proprietors',
  admin: 'admins',
};

/** What each role can do, in a sentence (shown on Home and in the role dialog). */
export const ROLE_SUMMARIES: Readonly<Record<Role, string>> = {
  bowler: 'Keep your release profile, your arsenal and its upkeep, your sessions and leagues, and rank your balls for any condition.',
  coach: 'Everything a bowler can do, plus working with the students who accept your invitation.',
  proprietor: 'Run your centers: lanes, price list, oil patterns and the published house condition.',
  admin: 'Grant roles, look after the shared ball catalogue and read the audit log.',
};

/** "a bowler", "an admin" */
export function withArticle(role: Role): string {
  const label = ROLE_LABELS[role].toLowerCase();
  return /^[aeiou]/.test(label) ? `an ${label}` : `a ${label}`;
}
