import { integerInRange } from '../internal/checks';

/**
 * A bowler's average: total pins ÷ games, fractions dropped (USBC Playing Rules, averages: "fractions are
 * disregarded" — from memory).
 * @throws RangeError for games < 1 or a negative pin count.
 * @example
 * leagueAverage(1154, 6); // => 192
 */
export function leagueAverage(pins: number, games: number): number {
  const fn = 'leagueAverage';
  const g = integerInRange(fn, 'games', games, 1, 1_000_000);
  const p = integerInRange(fn, 'pins', pins, 0, 300 * g);
  return Math.floor(p / g);
}
