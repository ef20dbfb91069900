import type { OilPattern } from './types';
import { BOARD_COUNT, HEADPIN_FT } from './constants';
import { inRange, integerInRange, list, oneOf, record, callerName } from './internal/checks';

/**
 * Checks that a value is a well-formed OilPattern and throws if it is not.
 *
 * Well-formed: a string name and an array of sweeps; each sweep has a direction 'forward' or
 * 'reverse', integer boards 1–39 (either order), 0 ≤ startFt < endFt ≤ 60 (oil is spread over a
 * distance, and a pattern ends before the headpin), a whole number of crossings (0 or more) and a
 * finite, non-negative µL per board. A pattern with no sweeps is well-formed (a dry lane).
 *
 * Source: engine invalid-input policy (README.md); boards and distances from Lanewright's conventions.
 *
 * @param pattern the value to check.
 * @param fn the public function to name in the error message; default 'validatePattern'.
 * @throws TypeError for a mistyped field; RangeError for a value out of range, e.g.
 *   "analyzePattern: sweep 2 endFt 12 is before startFt 30".
 *
 * @example
 * validatePattern({ name: 'Harrow Bay house', sweeps: [] }); // passes
 */
export function validatePattern(pattern: unknown, fn = 'validatePattern'): asserts pattern is OilPattern {
  callerName('validatePattern', fn);
  const p = record(fn, 'pattern', pattern);
  if (typeof p.name !== 'string') throw new TypeError(`${fn}: pattern name must be a string, got ${typeof p.name}`);
  const sweeps = list(fn, 'pattern sweeps', p.sweeps);
  sweeps.forEach((raw, i) => {
    const n = `sweep ${i + 1}`;
    const s = record(fn, n, raw);
    oneOf(fn, `${n} direction`, s.direction, ['forward', 'reverse'] as const);
    integerInRange(fn, `${n} fromBoard`, s.fromBoard, 1, BOARD_COUNT);
    integerInRange(fn, `${n} toBoard`, s.toBoard, 1, BOARD_COUNT);
    const start = inRange(fn, `${n} startFt`, s.startFt, 0, HEADPIN_FT, 'ft');
    const end = inRange(fn, `${n} endFt`, s.endFt, 0, HEADPIN_FT, 'ft');
    if (end < start) throw new RangeError(`${fn}: ${n} endFt ${end} is before startFt ${start}`);
    if (end === start) throw new RangeError(`${fn}: ${n} endFt ${end} equals startFt ${start}; oil needs a distance to spread over`);
    integerInRange(fn, `${n} crossings`, s.crossings, 0, Number.MAX_SAFE_INTEGER);
    inRange(fn, `${n} microlitersPerBoard`, s.microlitersPerBoard, 0, undefined, 'µL');
  });
}
