import { integerInRange, list, record } from '../internal/checks';
import { handicapFor, type HandicapRule } from './handicapFor';
import { leagueAverage } from './leagueAverage';

/** One league night: its date and the scores of the complete games bowled. */
export interface LeagueNight {
  date: string;
  games: number[];
}

/** One night of the season with the average and handicap it was bowled on. */
export interface LeagueNightResult {
  date: string;
  games: number[];
  /** The scratch series: the sum of the night's games. */
  series: number;
  /** The average the night was bowled on (entering average, else the season's running average before it); null if none yet. */
  averageBefore: number | null;
  /** Handicap per game from averageBefore; null when there is no average yet or the league is scratch. */
  handicapPerGame: number | null;
  /** The series with handicap (series + games × handicap per game); equal to `series` without handicap. */
  handicapSeries: number;
  /** The season's average after this night. */
  averageAfter: number;
  /** Games and pins so far in the season. */
  gamesToDate: number;
  pinsToDate: number;
}

/** leagueSeason's answer. */
export interface LeagueSeason {
  nights: LeagueNightResult[];
  games: number;
  pins: number;
  /** The season's average (null before the first game). */
  average: number | null;
  /** Handicap per game from the current average (null when scratch or no average). */
  handicap: number | null;
  highGame: number | null;
  highSeries: number | null;
}

/**
 * A league season from its nights in date order: each night's scratch series, the average it was bowled on
 * (the entering average for the first night when there is one, then the running season average before the
 * night, fractions dropped), its handicap and handicap series, and the season's totals.
 *
 * @param input `nights` (dates YYYY-MM-DD and complete game scores 0–300), `handicap` (null for a scratch
 *   league), `enteringAverage` (last season's or an establishing average, optional).
 * @throws TypeError/RangeError for malformed input, naming leagueSeason.
 * @example
 * leagueSeason({ nights: [{ date: '2026-09-01', games: [180, 200, 190] }], handicap: { basis: 220, percentage: 90 }, enteringAverage: 185 })
 *   .nights[0].handicapSeries; // => 663 (570 + 3 × 31)
 */
export function leagueSeason(input: {
  nights: LeagueNight[];
  handicap: HandicapRule | null;
  enteringAverage?: number | null;
}): LeagueSeason {
  const fn = 'leagueSeason';
  const inp = record(fn, 'input', input);
  const rule = inp.handicap === null || inp.handicap === undefined ? null : (inp.handicap as HandicapRule);
  const entering =
    inp.enteringAverage === undefined || inp.enteringAverage === null
      ? null
      : integerInRange(fn, 'enteringAverage', inp.enteringAverage, 0, 300);
  const nights = list(fn, 'nights', inp.nights).map((raw, i) => {
    const n = record(fn, `nights[${i}]`, raw);
    if (typeof n.date !== 'string' || !/^\d{4}-\d{2}-\d{2}$/.test(n.date))
      throw new RangeError(`${fn}: nights[${i}].date must be YYYY-MM-DD`);
    const games = list(fn, `nights[${i}].games`, n.games).map((g, j) => integerInRange(fn, `nights[${i}].games[${j}]`, g, 0, 300));
    return { date: n.date, games };
  });
  for (let i = 1; i < nights.length; i++) {
    if (nights[i].date < nights[i - 1].date)
      throw new RangeError(`${fn}: nights must be in date order (${nights[i].date} after ${nights[i - 1].date})`);
  }

  let games = 0;
  let pins = 0;
  let highGame: number | null = null;
  let highSeries: number | null = null;
  const out: LeagueNightResult[] = [];
  for (const n of nights) {
    const averageBefore = games > 0 ? leagueAverage(pins, games) : entering;
    const handicapPerGame = rule && averageBefore !== null ? handicapFor(averageBefore, rule) : null;
    const series = n.games.reduce((s, g) => s + g, 0);
    games += n.games.length;
    pins += series;
    for (const g of n.games) highGame = highGame === null ? g : Math.max(highGame, g);
    if (n.games.length > 0) highSeries = highSeries === null ? series : Math.max(highSeries, series);
    out.push({
      date: n.date,
      games: n.games,
      series,
      averageBefore,
      handicapPerGame,
      handicapSeries: series + (handicapPerGame ?? 0) * n.games.length,
      averageAfter: games > 0 ? leagueAverage(pins, games) : (entering ?? 0),
      gamesToDate: games,
      pinsToDate: pins,
    });
  }
  const average = games > 0 ? leagueAverage(pins, games) : entering;
  return {
    nights: out,
    games,
    pins,
    average,
    handicap: rule && average !== null ? handicapFor(average, rule) : null,
    highGame,
    highSeries,
  };
}
