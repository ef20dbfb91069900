import type { RatioClass } from './types';
import { finite } from './internal/checks';

/**
 * Ratio class boundaries: sport up to and including `sportMax` (the USBC Sport Bowling 3:1 limit),
 * recreation (house) from `recreationFrom`, challenge strictly between.
 * Source: the USBC sport-bowling limit (3:1; 6:1 is Lanewright's choice within the common
 * 4:1–8:1 range).
 */
export const RATIO_CLASS = { sportMax: 3, recreationFrom: 6 } as const;

/**
 * Classifies an oil ratio (middle ÷ outside, see analyzePattern): 'sport' ≤ 3 < 'challenge' < 6 ≤
 * 'recreation'.
 *
 * Source: the USBC sport-bowling ratio limit (3:1).
 * Edge cases: Infinity (oil in the middle, none outside) is 'recreation'.
 * @param ratio a ratio ≥ 0 (Infinity allowed).
 * @throws RangeError for NaN or a negative ratio.
 * @example
 * ratioClass(3); // => 'sport'
 */
export function ratioClass(ratio: number): RatioClass {
  const fn = 'ratioClass';
  if (typeof ratio !== 'number') finite(fn, 'ratio', ratio);
  if (Number.isNaN(ratio) || ratio < 0) throw new RangeError(`${fn}: ratio must be 0 or more, got ${ratio}`);
  if (ratio <= RATIO_CLASS.sportMax) return 'sport';
  if (ratio < RATIO_CLASS.recreationFrom) return 'challenge';
  return 'recreation';
}
