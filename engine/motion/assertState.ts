import type { BallInertia } from './ballInertia';
import type { LaneOilMap } from './laneOilMap';
import { assertNumber } from './assertNumber';
import { STATE } from './releaseState';

/**
 * The invalid-input policy for the motion model's building blocks (engine/README.md): the checks a function that
 * takes a delivery state, a ball's inertia, a friction field or an oil map makes first. Each throws a TypeError
 * for a value of the wrong type and a RangeError for one out of range, the message starting with `fn`. Only
 * scalars and array lengths are checked (never the elements of a large grid): the checks cost nothing measurable.
 *
 * Source: engine/README.md, invalid-input policy. Units: SI. Edge cases: a zero orientation quaternion is a
 * RangeError (it has no rotation). Example: `assertState('kineticEnergy', new Float64Array(3))` throws
 * `TypeError: kineticEnergy: state must be a Float64Array of length 11`.
 */
export function assertState(fn: string, s: unknown): Float64Array {
  if (!(s instanceof Float64Array) || s.length !== STATE.length)
    throw new TypeError(`${fn}: state must be a Float64Array of length ${STATE.length}`);
  for (let i = 0; i < STATE.length; i++) if (!Number.isFinite(s[i])) throw new TypeError(`${fn}: state[${i}] is not finite: ${s[i]}`);
  if (s[7] === 0 && s[8] === 0 && s[9] === 0 && s[10] === 0) throw new RangeError(`${fn}: state's orientation quaternion is zero`);
  return s;
}

export function assertObject(fn: string, name: string, value: unknown): void {
  if (value === null || typeof value !== 'object') throw new TypeError(`${fn}: ${name} must be an object, got ${String(value)}`);
}

/** A ball's inertia (ballInertia's): positive mass, radius and principal moments. */
export function assertInertia(fn: string, inertia: unknown): BallInertia {
  assertObject(fn, 'inertia', inertia);
  const b = inertia as BallInertia;
  assertNumber(fn, 'inertia.massKg', b.massKg, 1e-6, 100);
  assertNumber(fn, 'inertia.radiusM', b.radiusM, 1e-4, 1);
  assertNumber(fn, 'inertia.iLow', b.iLow, 1e-12, 100);
  assertNumber(fn, 'inertia.iHigh', b.iHigh, 1e-12, 100);
  assertNumber(fn, 'inertia.iInt', b.iInt, 1e-12, 100);
  return b;
}

/** A pattern-board × foot grid's shape: ftStep > 0, whole rows ≥ 2, 41 columns, and a Float64Array of rows × cols. */
export function assertGrid(fn: string, name: string, ftStep: unknown, rows: unknown, cols: unknown, grid: unknown): void {
  // the well-formed case without building a message (this runs for every delivery)
  if (
    typeof ftStep === 'number' &&
    ftStep >= 1e-3 &&
    ftStep <= 5 &&
    Number.isInteger(rows) &&
    (rows as number) >= 2 &&
    cols === 41 &&
    grid instanceof Float64Array &&
    grid.length === (rows as number) * 41
  )
    return;
  assertNumber(fn, `${name}.ftStep`, ftStep, 1e-3, 5);
  if (!Number.isInteger(rows) || (rows as number) < 2)
    throw new RangeError(`${fn}: ${name}.rows must be a whole number ≥ 2, got ${String(rows)}`);
  if (cols !== 41) throw new RangeError(`${fn}: ${name}.cols must be 41 (pattern boards 0–40), got ${String(cols)}`);
  if (!(grid instanceof Float64Array) || grid.length !== (rows as number) * 41)
    throw new TypeError(`${fn}: ${name}'s grid must be a Float64Array of rows × cols = ${(rows as number) * 41} values`);
}

/** A lane oil map (laneOilMap's). */
export function assertOilMap(fn: string, map: unknown): LaneOilMap {
  assertObject(fn, 'map', map);
  const m = map as LaneOilMap;
  assertGrid(fn, 'map', m.ftStep, m.rows, m.cols, m.filmUm);
  assertNumber(fn, 'map.patternEndFt', m.patternEndFt, 0, 200);
  return m;
}
