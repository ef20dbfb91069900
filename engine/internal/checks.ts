/**
 * Internal argument checks shared by the engine's public functions (not exported from the index).
 * They implement the engine's one invalid-input policy (see README.md): a wrong type throws a
 * TypeError, a value outside its range throws a RangeError, and the message starts with the public
 * function's name and quotes the bad value.
 */

/** Renders a value for an error message. */
export function show(value: unknown): string {
  if (typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'number' || typeof value === 'boolean' || value === undefined || value === null) {
    return String(value);
  }
  if (Array.isArray(value)) return 'an array';
  return typeof value;
}

/** Throws a TypeError unless `value` is a number; a RangeError if it is NaN or infinite. */
export function finite(fn: string, name: string, value: unknown): number {
  if (typeof value !== 'number') throw new TypeError(`${fn}: ${name} must be a number, got ${show(value)}`);
  if (!Number.isFinite(value)) throw new RangeError(`${fn}: ${name} must be a finite number, got ${show(value)}`);
  return value;
}

/** A finite number within [min, max] (either bound may be omitted). */
export function inRange(fn: string, name: string, value: unknown, min?: number, max?: number, unit = ''): number {
  const v = finite(fn, name, value);
  const u = unit === '°' ? '°' : unit ? ` ${unit}` : '';
  if (min !== undefined && v < min) throw new RangeError(`${fn}: ${name} ${v}${u} is below the minimum ${min}${u}`);
  if (max !== undefined && v > max) throw new RangeError(`${fn}: ${name} ${v}${u} is above the maximum ${max}${u}`);
  return v;
}

/** A finite number strictly greater than zero. */
export function positive(fn: string, name: string, value: unknown, unit = ''): number {
  const v = finite(fn, name, value);
  if (v <= 0) throw new RangeError(`${fn}: ${name} must be greater than 0, got ${v}${unit ? ` ${unit}` : ''}`);
  return v;
}

/** An integer within [min, max]. */
export function integerInRange(fn: string, name: string, value: unknown, min: number, max: number): number {
  const v = finite(fn, name, value);
  if (!Number.isInteger(v) || v < min || v > max) {
    throw new RangeError(`${fn}: ${name} must be an integer from ${min} to ${max}, got ${v}`);
  }
  return v;
}

/** Throws a TypeError unless `value` is a non-null object (and not an array). */
export function record(fn: string, name: string, value: unknown): Record<string, unknown> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw new TypeError(`${fn}: ${name} must be an object, got ${show(value)}`);
  }
  return value as Record<string, unknown>;
}

/** Throws a TypeError unless `value` is an array. */
export function list(fn: string, name: string, value: unknown): unknown[] {
  if (!Array.isArray(value)) throw new TypeError(`${fn}: ${name} must be an array, got ${show(value)}`);
  // a sparse array (a hole left by `delete a[i]`) would be skipped by map/forEach and break later checks
  for (let i = 0; i < value.length; i++) if (!(i in value)) throw new TypeError(`${fn}: ${name} has no entry at index ${i}`);
  return value;
}

/** Throws a TypeError unless `value` is one of `options`. */
export function oneOf<T extends string>(fn: string, name: string, value: unknown, options: readonly T[]): T {
  if (typeof value !== 'string' || !(options as readonly string[]).includes(value)) {
    throw new TypeError(`${fn}: ${name} must be one of ${options.join(', ')}, got ${show(value)}`);
  }
  return value as T;
}

/** Throws a TypeError unless `value` is a boolean. */
export function bool(fn: string, name: string, value: unknown): boolean {
  if (typeof value !== 'boolean') throw new TypeError(`${fn}: ${name} must be true or false, got ${show(value)}`);
  return value;
}

/** Clamps x to [lo, hi]. */
export function clamp(x: number, lo: number, hi: number): number {
  return x < lo ? lo : x > hi ? hi : x;
}

/** Throws a TypeError unless `value` is a function. */
export function func(fn: string, name: string, value: unknown): (...args: never[]) => unknown {
  if (typeof value !== 'function') throw new TypeError(`${fn}: ${name} must be a function, got ${show(value)}`);
  return value as (...args: never[]) => unknown;
}

/**
 * The caller's function name a shared check puts first in its messages (validateBallSpec's `fn`, …): an
 * identifier, else a TypeError naming `own`, the function that was given it.
 */
export function callerName(own: string, fn: unknown): string {
  if (typeof fn !== 'string' || !/^[A-Za-z_$][\w$]*$/.test(fn)) throw new TypeError(`${own}: fn must be a function name, got ${show(fn)}`);
  return fn;
}

/**
 * Runs `body` and names the public function `fn` first in any TypeError or RangeError it throws from the
 * functions it calls (their message kept after it, the error type unchanged), so every message starts with the
 * name of the function the caller called.
 */
export function namedErrors<T>(fn: string, body: () => T): T {
  try {
    return body();
  } catch (e) {
    if (e instanceof RangeError && !e.message.startsWith(`${fn}: `)) throw new RangeError(`${fn}: ${e.message}`);
    if (e instanceof TypeError && !e.message.startsWith(`${fn}: `)) throw new TypeError(`${fn}: ${e.message}`);
    throw e;
  }
}
