import { assertNumber } from './assertNumber';
import { MOTION_CALIBRATION as K } from './motionCalibration';
import { PHYSICAL_CONSTANTS as C } from './physicalConstants';

/** Oil on the lane as a film-thickness grid (µm), pattern boards × feet, for bilinear lookup. */
export interface LaneOilMap {
  /** Row spacing along the lane, ft; row r is at r·ftStep. */
  ftStep: number;
  rows: number;
  /** Columns are pattern boards 0…40 (0 and 40 repeat boards 1 and 39, the lane edges). */
  cols: number;
  /** Film thickness, µm, row-major: filmUm[r·cols + j] for pattern board j at r·ftStep ft. */
  filmUm: Float64Array;
  /** Where the applied oil ends, ft (Lanewright's convention: pattern length). */
  patternEndFt: number;
}

/**
 * Samples an oil function onto the grid the integrator reads.
 *
 * Definition: filmUm = oil(board, ft) × 0.12139 µm per (µL per board per foot) (1 mL on
 * one board-foot is a 121 µm film). `oil` is the first layer's `oilAt(pattern, board, ft)` with the
 * pattern bound, boards counted from the right-hand gutter (engine/types.ts OilPattern). Bilinear
 * interpolation of this grid makes μ continuous along and across the lane, so RK4 never straddles a
 * jump (the numerical method: friction discontinuities).
 *
 * Units: µL per board per foot in; µm out; ft. Edge cases: negative or non-finite oil values throw
 * RangeError/TypeError naming the board and distance; ftStep must be in [0.01, 5] ft.
 * Example: `laneOilMap(() => 12, 40)` → a uniform 1.457 µm film ending at 40 ft.
 */
export function laneOilMap(
  oil: (board: number, ft: number) => number,
  patternEndFt: number,
  options: { ftStep?: number; maxFt?: number } = {},
): LaneOilMap {
  const fn = 'laneOilMap';
  if (typeof oil !== 'function') throw new TypeError(`${fn}: oil must be a function, got ${typeof oil}`);
  assertNumber(fn, 'patternEndFt', patternEndFt, 0, 200);
  const ftStep = assertNumber(fn, 'ftStep', options.ftStep ?? K.oilMapFtStep, 0.01, 5);
  const maxFt = assertNumber(fn, 'maxFt', options.maxFt ?? K.oilMapMaxFt, 1, 200);
  const rows = Math.floor(maxFt / ftStep + 1e-9) + 1;
  const cols = 41;
  const filmUm = new Float64Array(rows * cols);
  for (let r = 0; r < rows; r++) {
    const ft = r * ftStep;
    for (let j = 1; j <= 39; j++) {
      const v = oil(j, ft);
      if (typeof v !== 'number' || !Number.isFinite(v)) throw new TypeError(`${fn}: oil(${j}, ${ft}) is not a finite number: ${String(v)}`);
      if (v < 0) throw new RangeError(`${fn}: oil(${j}, ${ft}) is negative: ${v}`);
      filmUm[r * cols + j] = v * C.filmUmPerMicroliterBoardFt;
    }
    filmUm[r * cols] = filmUm[r * cols + 1];
    filmUm[r * cols + 40] = filmUm[r * cols + 39];
  }
  return { ftStep, rows, cols, filmUm, patternEndFt };
}
