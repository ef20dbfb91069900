import type { RankArsenalInput, RankedBall } from './types';
import { list, namedErrors, record } from './internal/checks';
import { rankArsenal } from './rankArsenal';

/**
 * How the ranking of an arsenal shifts as a pattern breaks down: rankArsenal at each of several
 * games-bowled counts (the matchup's transition view).
 *
 * Definition: for each g in `games`, rankArsenal({ ...input, gamesBowled: g }). The direction of
 * the shift comes from the patternBreakdown rule (common practice: as oil depletes the lane hooks
 * more, favouring weaker, cleaner balls).
 *
 * @param input as rankArsenal, without `gamesBowled`.
 * @param games games-bowled counts, each 0 or more; default [0, 3, 6, 9].
 * @returns one `{ gamesBowled, ranking }` per count, in the order given.
 * @throws as rankArsenal (naming 'rankArsenal'); TypeError if `games` is not an array.
 * @example
 * rankTransition({ balls, bowler, pattern }, [0, 6]).map((t) => t.ranking[0].id); // => best ball fresh, after 6 games
 */
export function rankTransition(
  input: Omit<RankArsenalInput, 'gamesBowled'>,
  games: number[] = [0, 3, 6, 9],
): { gamesBowled: number; ranking: RankedBall[] }[] {
  const fn = 'rankTransition';
  record(fn, 'input', input);
  return namedErrors(fn, () =>
    list(fn, 'games', games).map((g) => ({
      gamesBowled: g as number,
      ranking: rankArsenal({ ...input, gamesBowled: g as number }),
    })),
  );
}
