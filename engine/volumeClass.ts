import type { VolumeClass } from './types';
import { inRange } from './internal/checks';

/**
 * Volume class boundaries, mL: light below `lightBelowMl`, medium from there up to and including
 * `heavyAboveMl`, heavy above it. Source: common practice (Lanewright's class boundaries in engine/README.md;
 * authors draw them differently).
 */
export const VOLUME_CLASS_ML = { lightBelowMl: 20, heavyAboveMl: 25 } as const;

/**
 * Classifies a pattern volume: 'light' < 20 mL ≤ 'medium' ≤ 25 mL < 'heavy'.
 *
 * Source: common practice (Lanewright's class boundaries).
 * @param volumeMl total oil, mL, 0 or more.
 * @throws RangeError for a negative or non-finite volume.
 * @example
 * volumeClass(25); // => 'medium'
 */
export function volumeClass(volumeMl: number): VolumeClass {
  const v = inRange('volumeClass', 'volumeMl', volumeMl, 0, undefined, 'mL');
  if (v < VOLUME_CLASS_ML.lightBelowMl) return 'light';
  if (v <= VOLUME_CLASS_ML.heavyAboveMl) return 'medium';
  return 'heavy';
}
