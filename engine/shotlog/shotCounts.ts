import { integerInRange, record } from '../internal/checks';
import { analyzeShots } from './internal/analyzeShots';
import { COUNT_KEYS, zeroCounts } from './internal/countKeys';
import { countsOf, statsFromCounts } from './internal/computeStats';
import type { ShotCounts, ShotRecord, ShotStats } from './types';

/**
 * ShotStats from counts: the same definitions as shotStats (common scoresheet usage; Wilson 1927 intervals), the
 * first-ball mean and sample standard deviation from the tally of first-ball counts, the leaves named by leaveName
 * and marked by isSplit (the USBC playing rules on splits).
 *
 * @param c ShotCounts (non-negative integers; a tally key other than `fb:` or `leave:` is ignored).
 * @returns the ShotStats those shots give: shotStatsOfCounts(countsOfShots(s)) equals shotStats(s).
 * @throws TypeError for a missing or non-numeric count or tally; RangeError for a negative or fractional count, or a
 *   rate with more hits than chances (from wilsonInterval), naming shotStatsOfCounts.
 * @example
 * shotStatsOfCounts({ ...zero, strikes: 4, strikeN: 11 }).strike; // => { hits: 4, n: 11, pct: 36.36…, low: 15.2…, high: 64.6… }
 */
export function shotStatsOfCounts(c: ShotCounts): ShotStats {
  const fn = 'shotStatsOfCounts';
  const r = record(fn, 'counts', c);
  for (const k of COUNT_KEYS) integerInRange(fn, `counts.${k}`, r[k], 0, Number.MAX_SAFE_INTEGER);
  const tallies = record(fn, 'counts.tallies', r.tallies);
  for (const [k, v] of Object.entries(tallies)) integerInRange(fn, `counts.tallies.${k}`, v, 0, Number.MAX_SAFE_INTEGER);
  return statsFromCounts(c);
}

/**
 * The counts of a set of logged shots (the input of shotStatsOfCounts), placed on their games' sheets as shotStats
 * places them.
 *
 * @param shots ShotRecords, as for shotStats.
 * @returns ShotCounts; zero counts and no tallies for no shots.
 * @throws as shotStats.
 * @example
 * countsOfShots(shots).strikeN; // => first balls at a full rack
 */
export function countsOfShots(shots: ShotRecord[]): ShotCounts {
  const a = analyzeShots('countsOfShots', shots);
  return countsOf(a, new Set(a.entries.map((_, i) => i)));
}

/**
 * One stored row of a game's counts: the shots of one ball with one surface in one game. `alone` false: counted on the
 * game's full sheet (what statsBy does with every shot present); `alone` true: counted with only this ball's shots of
 * the game present (what shotStats does on the shots of one ball: a delivery whose frame began with another ball has
 * no rack to count from). `gameTotal` is the game's score when its shots make one complete game, `gameBalls` and
 * `gameRows` the balls and the ball–surface rows of the game (of its `alone` false rows), and `lead` marks one row per
 * game (per game and ball for `alone` rows), so a game's score is counted once when rows are summed.
 */
export interface GameCountsRow {
  sessionId: string;
  gameNumber: number;
  ballId: string;
  surfaceKey: string;
  alone: boolean;
  gameTotal: number | null;
  gameBalls: number;
  gameRows: number;
  lead: boolean;
  counts: ShotCounts;
}

/**
 * The rows of counts of each game among the shots (GameCountsRow), in order of game, then ball and surface,
 * the full-sheet rows before the one-ball rows. Summing rows gives shotStatsOfCounts its input:
 * - every shot of a set of whole games: the `alone` false rows, their games counted once each and the scores of the
 *   `lead` rows with a total;
 * - one ball's shots: the `alone` true rows of the ball, scores of the `lead` rows of games with `gameBalls` 1;
 * - per ball (statsBy 'ballId'): `lead` rows with `gameBalls` 1; per ball and surface: rows with `gameRows` 1.
 *
 * @param shots ShotRecords of whole games (a game's shots all present).
 * @returns the rows; [] for no shots.
 * @throws as shotStats.
 * @example
 * gameCounts(oneGameWithOneBall); // => two rows (alone false and true) with the same counts and the game's total
 */
export function gameCounts(shots: ShotRecord[]): GameCountsRow[] {
  const fn = 'gameCounts';
  const a = analyzeShots(fn, shots);
  const out: GameCountsRow[] = [];
  const cmp = (x: string, y: string) => (x < y ? -1 : x > y ? 1 : 0);
  for (const g of a.games) {
    const first = a.entries[g.entries[0]].shot;
    const groups = new Map<string, { ballId: string; surfaceKey: string; idx: Set<number> }>();
    for (const i of g.entries) {
      const s = a.entries[i].shot;
      const k = `${s.ballId}\u0000${s.surfaceKey}`;
      const cur = groups.get(k);
      if (cur) cur.idx.add(i);
      else groups.set(k, { ballId: s.ballId, surfaceKey: s.surfaceKey, idx: new Set([i]) });
    }
    const rows = [...groups.values()].sort((x, y) => cmp(x.ballId, y.ballId) || cmp(x.surfaceKey, y.surfaceKey));
    const balls = [...new Set(rows.map((r) => r.ballId))];
    const base = {
      sessionId: first.sessionId,
      gameNumber: first.gameNumber,
      gameTotal: g.total,
      gameBalls: balls.length,
      gameRows: rows.length,
    };
    const withGame = (c: ShotCounts): ShotCounts => ({ ...c, games: 1, totalSum: 0, completeGames: 0 });
    rows.forEach((r, k) => {
      out.push({ ...base, ballId: r.ballId, surfaceKey: r.surfaceKey, alone: false, lead: k === 0, counts: withGame(countsOf(a, r.idx)) });
    });
    for (const ball of balls) {
      const b = analyzeShots(
        fn,
        g.entries.map((i) => a.entries[i].shot).filter((s) => s.ballId === ball),
      );
      rows
        .filter((r) => r.ballId === ball)
        .forEach((r, k) => {
          const idx = new Set<number>();
          b.entries.forEach((e, i) => {
            if (e.shot.surfaceKey === r.surfaceKey) idx.add(i);
          });
          out.push({ ...base, ballId: ball, surfaceKey: r.surfaceKey, alone: true, lead: k === 0, counts: withGame(countsOf(b, idx)) });
        });
    }
  }
  return out;
}

/**
 * The counts of no shots (every count 0, no tallies): the start of a sum of ShotCounts.
 * @example
 * shotStatsOfCounts(emptyShotCounts()).strike; // => { hits: 0, n: 0, pct: null, low: null, high: null }
 */
export function emptyShotCounts(): ShotCounts {
  return zeroCounts();
}
