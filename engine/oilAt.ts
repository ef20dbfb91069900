import type { OilPattern } from './types';
import { inRange } from './internal/checks';
import { oilAtUnchecked, wholeBoard } from './internal/sweeps';
import { validatePattern } from './validatePattern';

/**
 * The oil a pattern leaves at one spot on the lane, in µL per board per foot.
 *
 * Definition: the sum, over the sweeps that cover the board and whose span holds the distance
 * (startFt ≤ ft < endFt), of crossings × µL per board ÷ (endFt − startFt) — each sweep spreads its
 * oil evenly along its span (the Sweep type's contract). Integrating over ft gives the µL on the
 * board (lane-machine volume arithmetic).
 *
 * Edge cases: a span is closed at its start and open at its end, so at the pattern's length the
 * oil is 0 and two sweeps that meet at a distance are not counted twice. A fractional board is the
 * whole board that holds it (board b spans b − 0.5 to b + 0.5; 17.5 is board 18). Distances past
 * the pattern give 0. Boards are pattern boards, counted from the right-hand gutter: for a
 * left-hander's board b ask for 40 − b.
 *
 * @param p the pattern.
 * @param board lateral position in pattern boards, 0.5–39.5.
 * @param ft distance from the foul line, feet, 0 or more.
 * @returns µL per board per foot.
 * @throws TypeError/RangeError for a malformed pattern (validatePattern), a board outside
 *   0.5–39.5 or a negative or non-finite distance.
 *
 * @example
 * // 10 crossings × 50 µL on boards 1–39, spread over 0–40 ft: 500 µL ÷ 40 ft
 * oilAt({ name: 'flat', sweeps: [{ direction: 'forward', fromBoard: 1, toBoard: 39, startFt: 0,
 *   endFt: 40, crossings: 10, microlitersPerBoard: 50 }] }, 20, 10); // => 12.5
 */
export function oilAt(p: OilPattern, board: number, ft: number): number {
  const fn = 'oilAt';
  validatePattern(p, fn);
  const b = inRange(fn, 'board', board, 0.5, 39.5);
  const f = inRange(fn, 'ft', ft, 0, undefined, 'ft');
  return oilAtUnchecked(p.sweeps, wholeBoard(b), f);
}
