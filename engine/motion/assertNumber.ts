/**
 * The engine's invalid-input policy for the motion model: a value that is not a
 * finite number throws a `TypeError`, a finite number outside `[min, max]` a `RangeError`; both
 * messages name the function and the bad value.
 *
 * Source: engine/README.md, invalid-input policy. Units: those of the checked value. Edge cases: `min`/`max` inclusive;
 * NaN and ±Infinity are TypeErrors. Example: `assertNumber('simulateShot', 'speedMph', 99, 5, 30)`
 * throws `RangeError: simulateShot: speedMph must be in [5, 30], got 99`.
 */
export function assertNumber(fn: string, name: string, value: unknown, min: number, max: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new TypeError(`${fn}: ${name} must be a finite number, got ${String(value)}`);
  }
  if (value < min || value > max) {
    throw new RangeError(`${fn}: ${name} must be in [${min}, ${max}], got ${value}`);
  }
  return value;
}
