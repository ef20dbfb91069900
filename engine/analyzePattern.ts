import type { OilPattern, PatternAnalysis } from './types';
import { MICROLITERS_PER_ML } from './constants';
import { boardsCovered, covers, perBoardUl } from './internal/sweeps';
import { lengthClass } from './lengthClass';
import { ratioClass } from './ratioClass';
import { validatePattern } from './validatePattern';
import { volumeClass } from './volumeClass';

/**
 * Boards of the ratio: the middle (18–22) and the outside (3–7 and 33–37).
 * Source: common practice (Lanewright's class boundaries after the USBC description of middle vs
 * outside boards; conventions vary, so the boards are exported to be shown with the ratio).
 */
export const RATIO_BOARDS = {
  middle: [18, 19, 20, 21, 22],
  outside: [3, 4, 5, 6, 7, 33, 34, 35, 36, 37],
} as const;

/**
 * The numbers of an oil pattern: length, volume (total, forward, reverse), ratio and classes.
 *
 * Definitions (the USBC sport-bowling ratio limit and the lane-machine arithmetic):
 * - volume: Σ over sweeps of boards covered × crossings × µL per board, in mL (÷ 1000);
 *   forwardMl / reverseMl: the same over forward / reverse sweeps only;
 * - lengthFt: the distance where the applied oil ends, the largest endFt of a sweep that lays oil;
 * - ratio: mean oil per board on boards 18–22 ÷ mean oil per board on boards 3–7 and 33–37, over
 *   the pattern's whole length (so it is a ratio of the µL each board receives);
 * - classes: lengthClass, volumeClass and ratioClass of those numbers.
 *
 * Edge cases: a pattern that lays no oil has length 0, volume 0 and ratio 1 (no difference between
 * middle and outside). Oil in the middle with none outside gives ratio Infinity ('recreation').
 * Boards are pattern boards; the ratio boards are symmetric, so the hand does not change it.
 *
 * @param p the pattern.
 * @returns the PatternAnalysis (ft, mL, ratio, classes).
 * @throws TypeError/RangeError for a malformed pattern (see validatePattern), e.g.
 *   "analyzePattern: sweep 2 endFt 12 is before startFt 30".
 *
 * @example
 * // worked example of the lane-machine arithmetic: 37 × 1 + 25 × 4 + 17 × 6 = 239 crossings × 50 µL
 * analyzePattern(p).volumeMl; // => 11.95
 */
export function analyzePattern(p: OilPattern): PatternAnalysis {
  validatePattern(p, 'analyzePattern');
  let forwardUl = 0;
  let reverseUl = 0;
  let lengthFt = 0;
  const onBoard = new Array<number>(40).fill(0);
  for (const s of p.sweeps) {
    const perBoard = perBoardUl(s);
    const ul = boardsCovered(s) * perBoard;
    if (s.direction === 'forward') forwardUl += ul;
    else reverseUl += ul;
    if (perBoard > 0) {
      lengthFt = Math.max(lengthFt, s.endFt);
      for (let b = 1; b <= 39; b++) if (covers(s, b)) onBoard[b] += perBoard;
    }
  }
  const mean = (boards: readonly number[]): number => boards.reduce((sum, b) => sum + onBoard[b], 0) / boards.length;
  const middle = mean(RATIO_BOARDS.middle);
  const outside = mean(RATIO_BOARDS.outside);
  const ratio = outside > 0 ? middle / outside : middle > 0 ? Infinity : 1;

  const volumeMl = (forwardUl + reverseUl) / MICROLITERS_PER_ML;
  return {
    lengthFt,
    volumeMl,
    forwardMl: forwardUl / MICROLITERS_PER_ML,
    reverseMl: reverseUl / MICROLITERS_PER_ML,
    ratio,
    lengthClass: lengthClass(lengthFt),
    volumeClass: volumeClass(volumeMl),
    ratioClass: ratioClass(ratio),
  };
}
