import type { ShotCounts } from '../types';

/** The counts every ShotCounts carries, besides its tallies (one home: countsOf, shotStatsOfCounts, emptyShotCounts). */
export const COUNT_KEYS = [
  'shots',
  'games',
  'totalSum',
  'completeGames',
  'strikes',
  'strikeN',
  'spares',
  'spareN',
  'singleMade',
  'singleN',
  'multiMade',
  'multiN',
  'splitMade',
  'splitN',
  'pocket',
  'pocketN',
  'carried',
] as const satisfies readonly Exclude<keyof ShotCounts, 'tallies'>[];

/** ShotCounts of no shots: every count 0, no tallies. */
export function zeroCounts(): ShotCounts {
  const c = { tallies: {} } as ShotCounts;
  for (const k of COUNT_KEYS) c[k] = 0;
  return c;
}
