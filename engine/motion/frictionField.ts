import type { CoverFriction } from './coverFriction';
import type { LaneOilMap } from './laneOilMap';
import { assertNumber } from './assertNumber';
import { MOTION_CALIBRATION as K } from './motionCalibration';

/**
 * What the integrator reads for friction. μ at a point is `mu0 + dMu · G(x, y) · E_b`, where G is
 * bilinear in `grid` (pattern boards × feet, the layout of LaneOilMap) and E_b = exp(−w·b/h_c) the
 * factor of the oil carried on the ball cell in contact (1 when `carriedOil` is false).
 */
export interface FrictionField {
  uniform: boolean;
  mu0: number;
  dMu: number;
  ftStep: number;
  rows: number;
  cols: number;
  /** G values (exp(−h/h_c) for an oil map; μ itself for a sampled μ function). Empty when uniform. */
  grid: Float64Array;
  /** Lane film, µm (for the oil the ball picks up); empty when there is no oil map. */
  filmUm: Float64Array;
  /** Film scale h_c, µm. */
  filmScaleUm: number;
  /** Cover absorption time constant, s. */
  absorptionTimeS: number;
  /** Whether the ball carries oil on its track (PHYSICS.md §5.3). */
  carriedOil: boolean;
}

/**
 * One uniform friction coefficient everywhere (for closed-form tests and calibration,
 * `frictionOverride`). Source: PHYSICS.md §3.2 (uniform μ). Units: dimensionless.
 * Edge cases: μ must be in [0, 1] (0 is the frictionless check of PHYSICS.md §3.5).
 * Example: `uniformFrictionField(0.2)`.
 */
export function uniformFrictionField(mu: number): FrictionField {
  assertNumber('uniformFrictionField', 'mu', mu, 0, 1);
  return {
    uniform: true, mu0: mu, dMu: 0, ftStep: 1, rows: 0, cols: 0, grid: new Float64Array(0), filmUm: new Float64Array(0),
    filmScaleUm: 1, absorptionTimeS: Infinity, carriedOil: false,
  };
}

/**
 * A friction field sampled from a function `(board, ft) => mu` (board counted from the right-hand
 * gutter, 1–39; ft from the foul line), bilinear between samples. Used for the two-zone closed-form
 * checks of PHYSICS.md §3.3 and for development before the oil map exists.
 * Units: dimensionless μ. Edge cases: values outside [0, 1] throw RangeError; ftStep in [0.001, 5] ft.
 * Example: `sampledFrictionField((b, ft) => (ft < 40 ? 0.04 : 0.2), { ftStep: 0.01 })`.
 */
export function sampledFrictionField(
  mu: (board: number, ft: number) => number,
  options: { ftStep?: number; maxFt?: number } = {},
): FrictionField {
  const fn = 'sampledFrictionField';
  const ftStep = assertNumber(fn, 'ftStep', options.ftStep ?? K.oilMapFtStep, 0.001, 5);
  const maxFt = assertNumber(fn, 'maxFt', options.maxFt ?? K.oilMapMaxFt, 1, 200);
  const rows = Math.floor(maxFt / ftStep + 1e-9) + 1;
  const cols = 41;
  const grid = new Float64Array(rows * cols);
  for (let r = 0; r < rows; r++) {
    for (let j = 1; j <= 39; j++) grid[r * cols + j] = assertNumber(fn, `mu(${j}, ${r * ftStep})`, mu(j, r * ftStep), 0, 1);
    grid[r * cols] = grid[r * cols + 1];
    grid[r * cols + 40] = grid[r * cols + 39];
  }
  return { uniform: false, mu0: 0, dMu: 1, ftStep, rows, cols, grid, filmUm: new Float64Array(0), filmScaleUm: 1, absorptionTimeS: Infinity, carriedOil: false };
}

/**
 * The friction field of one ball on one oil map: G = exp(−h/h_c) on the grid, μ = μ_oil +
 * (μ_dry − μ_oil)·G·E_b (PHYSICS.md §5.1 roughness-aware law; §5.3 carried oil through E_b).
 * Units: µm films, dimensionless μ. Edge cases: none beyond its inputs'. Example:
 * `oilFrictionField(laneOilMap(oil, 40), coverFriction(ball))`.
 */
export function oilFrictionField(map: LaneOilMap, cover: CoverFriction, options: { carriedOil?: boolean } = {}): FrictionField {
  const grid = new Float64Array(map.filmUm.length);
  const inv = 1 / cover.filmScaleUm;
  for (let i = 0; i < grid.length; i++) grid[i] = Math.exp(-map.filmUm[i] * inv);
  return {
    uniform: false, mu0: cover.muOil, dMu: cover.muDry - cover.muOil, ftStep: map.ftStep, rows: map.rows, cols: map.cols, grid,
    filmUm: map.filmUm, filmScaleUm: cover.filmScaleUm, absorptionTimeS: cover.absorptionTimeS, carriedOil: options.carriedOil ?? true,
  };
}
