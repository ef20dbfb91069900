import { integerInRange, record } from '../internal/checks';

/**
 * Default upkeep intervals in games (common practice; sources give a range, the reminder uses its lower end so it
 * comes before the reaction fades): a full resurface at the pro shop every 60–100 games, an oil extraction every
 * 30–60 games.
 */
export const UPKEEP_DEFAULTS = Object.freeze({ resurfaceGames: 60, extractionGames: 30 });

/** How close to an interval a reminder starts: the last 10 % of it (at least 3 games). Lanewright's choice. */
const SOON_SHARE = 0.1;

/** One kind of upkeep for one ball. */
export interface UpkeepItem {
  /** Games bowled with the ball since it was last done. */
  games: number;
  /** The interval, games. */
  interval: number;
  /** Games left before it is due (0 when due or overdue). */
  remaining: number;
  /** 'due' at or past the interval, 'soon' within its last 10 % (at least 3 games), else 'ok'. */
  state: 'ok' | 'soon' | 'due';
}

/**
 * When a ball is due for a resurface and for an oil extraction, from the games bowled since each was last done and
 * the intervals (the user's own, else UPKEEP_DEFAULTS).
 *
 * @param input `gamesSinceResurface`, `gamesSinceExtraction` (whole games ≥ 0) and optional `intervals`
 *   (`resurfaceGames`, `extractionGames`: whole games 5–500).
 * @returns `{ resurface, extraction }` UpkeepItems.
 * @throws RangeError for negative or fractional games, or an interval outside 5–500, naming upkeepDue.
 * @example
 * upkeepDue({ gamesSinceResurface: 200, gamesSinceExtraction: 10 }).resurface; // => { games: 200, interval: 60, remaining: 0, state: 'due' }
 */
export function upkeepDue(input: {
  gamesSinceResurface: number;
  gamesSinceExtraction: number;
  intervals?: { resurfaceGames?: number | null; extractionGames?: number | null };
}): { resurface: UpkeepItem; extraction: UpkeepItem } {
  const fn = 'upkeepDue';
  const inp = record(fn, 'input', input);
  const iv = inp.intervals === undefined ? {} : record(fn, 'intervals', inp.intervals);
  const interval = (k: 'resurfaceGames' | 'extractionGames') =>
    iv[k] === undefined || iv[k] === null ? UPKEEP_DEFAULTS[k] : integerInRange(fn, `intervals.${k}`, iv[k], 5, 500);
  const item = (games: number, every: number): UpkeepItem => {
    const remaining = Math.max(0, every - games);
    const soonWithin = Math.max(3, Math.ceil(every * SOON_SHARE));
    return { games, interval: every, remaining, state: remaining === 0 ? 'due' : remaining <= soonWithin ? 'soon' : 'ok' };
  };
  return {
    resurface: item(integerInRange(fn, 'gamesSinceResurface', inp.gamesSinceResurface, 0, 100_000), interval('resurfaceGames')),
    extraction: item(integerInRange(fn, 'gamesSinceExtraction', inp.gamesSinceExtraction, 0, 100_000), interval('extractionGames')),
  };
}
