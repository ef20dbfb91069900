import { oneOf } from '../internal/checks';
import { analyzeShots } from './internal/analyzeShots';
import { computeStats } from './internal/computeStats';
import type { ShotRecord, ShotStats } from './types';

/** The keys statsBy groups by. */
export const STATS_KEYS = ['ballId', 'surfaceKey', 'sessionId'] as const;
export type StatsKey = (typeof STATS_KEYS)[number];

/**
 * shotStats for each value of a key: per ball, per surface state, per session — or per combination
 * (e.g. ['ballId', 'surfaceKey']: the same ball at 2000 and 4000 grit side by side).
 *
 * Definition: every shot is first placed on its full game's sheet (so a spare thrown with another ball
 * than the first ball of its frame still has its leave), then the shots of each group are counted as
 * shotStats defines. A group's `average` uses only the complete games thrown wholly within the group.
 * Source: the definitions of shotStats (common scoresheet usage; Wilson 1927 intervals).
 *
 * @param shots ShotRecords of complete or partial games.
 * @param key 'ballId' | 'surfaceKey' | 'sessionId', or an array of them.
 * @returns one entry per group, `key` the value (values joined by ' | ' for an array) and `keys` each
 *   value by name; ordered by the group's earliest date, then key.
 * @throws TypeError for an unknown key or a malformed record; RangeError as shotStats.
 * @example
 * statsBy(shots, 'ballId').map((g) => [g.key, g.stats.strike.pct]); // => [['b1', 40], ['b2', 25]]
 */
export function statsBy(
  shots: ShotRecord[],
  key: StatsKey | StatsKey[],
): { key: string; keys: Partial<Record<StatsKey, string>>; stats: ShotStats }[] {
  const fn = 'statsBy';
  const keys = (Array.isArray(key) ? key : [key]).map((k, i) => oneOf(fn, Array.isArray(key) ? `key[${i}]` : 'key', k, STATS_KEYS));
  if (keys.length === 0) throw new RangeError(`${fn}: key must name at least one of ${STATS_KEYS.join(', ')}`);
  const a = analyzeShots(fn, shots);
  const groups = new Map<string, { keys: Partial<Record<StatsKey, string>>; idx: Set<number>; date: string }>();
  a.entries.forEach((e, i) => {
    const values = keys.map((k) => e.shot[k]);
    const g = values.join(' | ');
    const cur = groups.get(g);
    if (cur) {
      cur.idx.add(i);
      if (e.shot.date < cur.date) cur.date = e.shot.date;
    } else {
      groups.set(g, { keys: Object.fromEntries(keys.map((k, j) => [k, values[j]])), idx: new Set([i]), date: e.shot.date });
    }
  });
  return [...groups.entries()]
    .sort(([ka, a1], [kb, b1]) => (a1.date < b1.date ? -1 : a1.date > b1.date ? 1 : ka < kb ? -1 : ka > kb ? 1 : 0))
    .map(([g, v]) => ({ key: g, keys: v.keys, stats: computeStats(a, v.idx) }));
}
