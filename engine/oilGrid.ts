import type { OilGrid, OilGridOptions, OilPattern } from './types';
import { HEADPIN_FT, BOARD_COUNT } from './constants';
import { inRange, positive, record } from './internal/checks';
import { oilAtUnchecked, wholeBoard } from './internal/sweeps';
import { validatePattern } from './validatePattern';

/** Largest number of samples oilGrid will compute, to keep a bad step from freezing a page. */
export const OIL_GRID_MAX_CELLS = 1_000_000;

/**
 * The pattern's oil sampled on a grid of boards × distances, µL per board per foot (as oilAt),
 * for charts and for the ball-motion model.
 *
 * Definition: boards = 1, 1 + boardStep, … ≤ 39; ft = 0, ftStep, … ≤ maxFt (maxFt itself is
 * included when it falls on a step); values[i][j] = oilAt(pattern, boards[i], ft[j]).
 * Source: same definition as oilAt (lane-machine volume arithmetic, spread evenly along each sweep).
 *
 * Edge cases: boards are pattern boards (from the right-hand gutter). A fractional board sample
 * reads the whole board that holds it. Sample points are computed as start + k × step, so they do
 * not accumulate rounding drift.
 *
 * @param pattern the pattern.
 * @param options `boardStep` (boards, default 1), `ftStep` (ft, default 1), `maxFt` (ft, default 60).
 * @returns `{ boards, ft, values }` with values[i][j] on boards[i] at ft[j].
 * @throws TypeError/RangeError for a malformed pattern, a step ≤ 0, a negative maxFt, or a grid of
 *   more than OIL_GRID_MAX_CELLS samples.
 *
 * @example
 * oilGrid(pattern, { ftStep: 5, maxFt: 50 }); // => 39 boards × 11 distances
 */
export function oilGrid(pattern: OilPattern, options: OilGridOptions = {}): OilGrid {
  const fn = 'oilGrid';
  validatePattern(pattern, fn);
  const o = record(fn, 'options', options);
  const boardStep = o.boardStep === undefined ? 1 : positive(fn, 'boardStep', o.boardStep, 'boards');
  const ftStep = o.ftStep === undefined ? 1 : positive(fn, 'ftStep', o.ftStep, 'ft');
  const maxFt = o.maxFt === undefined ? HEADPIN_FT : inRange(fn, 'maxFt', o.maxFt, 0, undefined, 'ft');

  const eps = 1e-9;
  const nBoards = Math.floor((BOARD_COUNT - 1) / boardStep + eps) + 1;
  const nFt = Math.floor(maxFt / ftStep + eps) + 1;
  if (nBoards * nFt > OIL_GRID_MAX_CELLS) {
    throw new RangeError(`${fn}: ${nBoards} × ${nFt} samples exceed the limit of ${OIL_GRID_MAX_CELLS}`);
  }
  const boards = Array.from({ length: nBoards }, (_, i) => 1 + i * boardStep);
  const ft = Array.from({ length: nFt }, (_, j) => j * ftStep);
  const values = boards.map((b) => {
    const whole = wholeBoard(b);
    return ft.map((f) => oilAtUnchecked(pattern.sweeps, whole, f));
  });
  return { boards, ft, values };
}
