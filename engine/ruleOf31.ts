import { HEADPIN_FT } from './constants';
import { inRange } from './internal/checks';

/**
 * The rule of 31: the board where the ball should be as it leaves the oil, from the pattern length.
 *
 * Definition: board = lengthFt − 31, counted from the gutter on the bowler's hand side, but never
 * less than board 1 (a pattern shorter than 32 ft gives board 1, the outermost board).
 * Source: common practice (writers disagree whether it estimates the exit
 * point or the breakpoint — it is a starting guess only). E.g. 39 ft → board 8, 43 ft → board 12.
 *
 * @param lengthFt pattern length, feet, 0–60.
 * @returns a board number, 1 or more (may be fractional for a fractional length).
 * @throws RangeError for a length outside 0–60 ft or not finite.
 *
 * @example
 * ruleOf31(43); // => 12
 */
export function ruleOf31(lengthFt: number): number {
  const l = inRange('ruleOf31', 'lengthFt', lengthFt, 0, HEADPIN_FT, 'ft');
  return Math.max(1, l - 31);
}
