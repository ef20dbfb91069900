import { validatePattern } from '../validatePattern';
import type { OilPattern } from '../types';
import { oilGrid } from '../oilGrid';
import type { LaneOilMap } from './laneOilMap';
import { MOTION_CALIBRATION as K } from './motionCalibration';
import { PHYSICAL_CONSTANTS as C } from './physicalConstants';

/**
 * The fresh oil map of a pattern, as the integrator reads it: the first layer's `oilGrid` (µL per
 * board per foot, every board, every `oilMapFtStep` ft) converted to film thickness (µm).
 *
 * Source: oilGrid / oilAt (lane-machine volume arithmetic, spread evenly along each sweep); film
 * conversion 1 mL on one board-foot = 121 µm. Pattern length = the largest sweep `endFt` (Lanewright's conventions).
 * Units: µm, ft. Edge cases: a malformed pattern throws from oilGrid (TypeError/RangeError naming
 * 'oilGrid'); an empty sweep list gives a dry lane with length 0.
 * Example: `patternOilMap(pattern).filmUm[80 * 41 + 20]` → film on board 20 at 40 ft.
 */
export function patternOilMap(pattern: OilPattern): LaneOilMap {
  const ftStep = K.oilMapFtStep;
  validatePattern(pattern, 'patternOilMap');
  const grid = oilGrid(pattern, { boardStep: 1, ftStep, maxFt: K.oilMapMaxFt });
  const rows = grid.ft.length,
    cols = 41;
  const filmUm = new Float64Array(rows * cols);
  const f = C.filmUmPerMicroliterBoardFt;
  for (let i = 0; i < grid.boards.length; i++) {
    const j = Math.round(grid.boards[i]);
    const col = grid.values[i];
    for (let r = 0; r < rows; r++) filmUm[r * cols + j] = col[r] * f;
  }
  for (let r = 0; r < rows; r++) {
    filmUm[r * cols] = filmUm[r * cols + 1];
    filmUm[r * cols + 40] = filmUm[r * cols + 39];
  }
  let end = 0;
  for (const s of pattern.sweeps) end = Math.max(end, s.startFt, s.endFt);
  return { ftStep, rows, cols, filmUm, patternEndFt: end };
}
