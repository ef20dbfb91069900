import type { LengthClass } from './types';
import { inRange } from './internal/checks';

/**
 * Length class boundaries, feet: short below `shortBelowFt`, medium from there to below
 * `longFromFt`, long from `longFromFt`. Source: common practice (Lanewright's class boundaries,
 * in engine/README.md: boundaries vary by author; these are Lanewright's choice).
 */
export const LENGTH_CLASS_FT = { shortBelowFt: 37, longFromFt: 43 } as const;

/**
 * Classifies a pattern length: 'short' < 37 ft ≤ 'medium' < 43 ft ≤ 'long'.
 *
 * Source: common practice (Lanewright's class boundaries).
 * @param lengthFt pattern length, feet, 0 or more.
 * @throws RangeError for a negative or non-finite length.
 * @example
 * lengthClass(43); // => 'long'
 */
export function lengthClass(lengthFt: number): LengthClass {
  const l = inRange('lengthClass', 'lengthFt', lengthFt, 0, undefined, 'ft');
  if (l < LENGTH_CLASS_FT.shortBelowFt) return 'short';
  if (l < LENGTH_CLASS_FT.longFromFt) return 'medium';
  return 'long';
}
