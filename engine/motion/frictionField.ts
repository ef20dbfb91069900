import { assertGrid, assertObject, assertOilMap } from './assertState';
import type { CoverFriction } from './coverFriction';
import type { LaneOilMap } from './laneOilMap';
import { assertNumber } from './assertNumber';
import { MOTION_CALIBRATION as K } from './motionCalibration';

/**
 * What the integrator reads for friction:
 * - `uniform`: μ = mu0 everywhere;
 * - `sampled`: μ = bilinear(grid) (a μ value per pattern board × row);
 * - `oil`: μ = mu0 + dMu·h_c/(h + w·b + h_c), h = bilinear(filmUm) the lane film and b the oil carried on
 *   the ball's track (the mixed-lubrication law of coverFriction).
 * The grid layout is LaneOilMap's (pattern boards 0…40 × rows every ftStep).
 */
export interface FrictionField {
  kind: 'uniform' | 'sampled' | 'oil';
  mu0: number;
  dMu: number;
  ftStep: number;
  rows: number;
  cols: number;
  /** μ values of a sampled field; empty otherwise. */
  grid: Float64Array;
  /** Lane film, µm, of an oil field; empty otherwise. */
  filmUm: Float64Array;
  /** Film scale h_c, µm. */
  filmScaleUm: number;
  /** Cover absorption time constant, s. */
  absorptionTimeS: number;
  /** Whether the ball carries oil on its track (oil fields only). */
  carriedOil: boolean;
  /** The largest μ anywhere in the field (for the integrator's stability bound). */
  muMax: number;
}

/**
 * One uniform friction coefficient everywhere (for closed-form tests and calibration, `frictionOverride`).
 * Source: the sliding-to-rolling sphere on a uniform surface (textbook mechanics). Units: dimensionless.
 * Edge cases: μ must be in [0, 1] (0 is the frictionless check). Example: `uniformFrictionField(0.2)`.
 */
export function uniformFrictionField(mu: number): FrictionField {
  assertNumber('uniformFrictionField', 'mu', mu, 0, 1);
  return {
    kind: 'uniform',
    mu0: mu,
    dMu: 0,
    ftStep: 1,
    rows: 0,
    cols: 0,
    grid: new Float64Array(0),
    filmUm: new Float64Array(0),
    filmScaleUm: 1,
    absorptionTimeS: Infinity,
    carriedOil: false,
    muMax: mu,
  };
}

/**
 * A friction field sampled from a function `(board, ft) => mu` (board counted from the right-hand gutter,
 * 1–39; ft from the foul line), bilinear between samples. Used for the two-zone closed-form checks (oil in
 * front, dry behind, after Frohlich 2004) and for studies of a friction law.
 * Units: dimensionless μ. Edge cases: values outside [0, 1] throw RangeError; ftStep in [0.001, 5] ft.
 * Example: `sampledFrictionField((b, ft) => (ft < 40 ? 0.04 : 0.2), { ftStep: 0.01 })`.
 */
export function sampledFrictionField(
  mu: (board: number, ft: number) => number,
  options: { ftStep?: number; maxFt?: number } = {},
): FrictionField {
  const fn = 'sampledFrictionField';
  if (typeof mu !== 'function') throw new TypeError(`${fn}: mu must be a function (board, ft) => μ, got ${String(mu)}`);
  if (options === null || typeof options !== 'object') throw new TypeError(`${fn}: options must be an object, got ${String(options)}`);
  const ftStep = assertNumber(fn, 'ftStep', options.ftStep ?? K.oilMapFtStep, 0.001, 5);
  const maxFt = assertNumber(fn, 'maxFt', options.maxFt ?? K.oilMapMaxFt, 1, 200);
  const rows = Math.floor(maxFt / ftStep + 1e-9) + 1;
  const cols = 41;
  const grid = new Float64Array(rows * cols);
  let muMax = 0;
  for (let r = 0; r < rows; r++) {
    for (let j = 1; j <= 39; j++) {
      const v = assertNumber(fn, `mu(${j}, ${r * ftStep})`, mu(j, r * ftStep), 0, 1);
      grid[r * cols + j] = v;
      if (v > muMax) muMax = v;
    }
    grid[r * cols] = grid[r * cols + 1];
    grid[r * cols + 40] = grid[r * cols + 39];
  }
  return {
    kind: 'sampled',
    mu0: 0,
    dMu: 1,
    ftStep,
    rows,
    cols,
    grid,
    filmUm: new Float64Array(0),
    filmScaleUm: 1,
    absorptionTimeS: Infinity,
    carriedOil: false,
    muMax,
  };
}

/**
 * The friction field of one ball on one oil map: μ = μ_film + (μ_dry − μ_film)·h_c/(h + w·b + h_c) with h the
 * lane film under the ball and b the film carried on its track (coverFriction's mixed-lubrication law).
 * `frictionScale` (default 1) multiplies every coefficient — the calibration from logged shots.
 * Units: µm films, dimensionless μ. Edge cases: scale in [0.1, 10]. Example:
 * `oilFrictionField(patternOilMap(pattern), coverFriction(ball))`.
 */
export function oilFrictionField(
  map: LaneOilMap,
  cover: CoverFriction,
  options: { carriedOil?: boolean; frictionScale?: number } = {},
): FrictionField {
  const fn = 'oilFrictionField';
  assertOilMap(fn, map);
  if (cover === null || typeof cover !== 'object') throw new TypeError(`${fn}: cover must be an object, got ${String(cover)}`);
  assertNumber(fn, 'cover.muFilm', cover.muFilm, 0, 1);
  assertNumber(fn, 'cover.muDry', cover.muDry, cover.muFilm, 1);
  assertNumber(fn, 'cover.filmScaleUm', cover.filmScaleUm, 1e-9, 1e6);
  if (typeof cover.absorptionTimeS !== 'number' || !(cover.absorptionTimeS > 0))
    throw new RangeError(`${fn}: cover.absorptionTimeS must be a positive number of seconds, got ${String(cover.absorptionTimeS)}`);
  if (options === null || typeof options !== 'object') throw new TypeError(`${fn}: options must be an object, got ${String(options)}`);
  if (options.carriedOil !== undefined && typeof options.carriedOil !== 'boolean')
    throw new TypeError(`${fn}: carriedOil must be a boolean, got ${String(options.carriedOil)}`);
  const scale = options.frictionScale === undefined ? 1 : assertNumber(fn, 'frictionScale', options.frictionScale, 0.1, 10);
  const mu0 = cover.muFilm * scale;
  const dMu = (cover.muDry - cover.muFilm) * scale;
  return {
    kind: 'oil',
    mu0,
    dMu,
    ftStep: map.ftStep,
    rows: map.rows,
    cols: map.cols,
    grid: new Float64Array(0),
    filmUm: map.filmUm,
    filmScaleUm: cover.filmScaleUm,
    absorptionTimeS: cover.absorptionTimeS,
    carriedOil: options.carriedOil ?? true,
    muMax: mu0 + dMu,
  };
}

const KINDS = new Set(['uniform', 'sampled', 'oil']);

/** A friction field (uniformFrictionField's, sampledFrictionField's or oilFrictionField's). */
export function assertField(fn: string, field: unknown): FrictionField {
  assertObject(fn, 'field', field);
  const f = field as FrictionField;
  if (!KINDS.has(f.kind)) throw new TypeError(`${fn}: field.kind must be 'uniform', 'sampled' or 'oil', got ${String(f.kind)}`);
  assertNumber(fn, 'field.mu0', f.mu0, 0, 10);
  assertNumber(fn, 'field.dMu', f.dMu, -10, 10);
  assertNumber(fn, 'field.muMax', f.muMax, 0, 10);
  if (f.kind === 'sampled') assertGrid(fn, 'field', f.ftStep, f.rows, f.cols, f.grid);
  if (f.kind === 'oil') {
    assertGrid(fn, 'field', f.ftStep, f.rows, f.cols, f.filmUm);
    assertNumber(fn, 'field.filmScaleUm', f.filmScaleUm, 1e-9, 1e6);
    if (typeof f.absorptionTimeS !== 'number' || !(f.absorptionTimeS > 0))
      throw new RangeError(`${fn}: field.absorptionTimeS must be a positive number of seconds, got ${String(f.absorptionTimeS)}`);
    if (typeof f.carriedOil !== 'boolean') throw new TypeError(`${fn}: field.carriedOil must be a boolean, got ${String(f.carriedOil)}`);
  }
  return f;
}
