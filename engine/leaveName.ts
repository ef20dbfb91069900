import { standingSet } from './internal/pins';

/**
 * The name of a leave: the standing pins in ascending number joined by hyphens.
 *
 * Definition and source: common usage "Split naming: list standing pins in ascending number,
 * e.g. 4-7-10" (university course page and common usage, S / C); used for every leave, split or not.
 * Edge cases: no pins standing (a strike or a cleared rack) gives the empty string.
 *
 * @param standing pins left standing, 1–10, any order, no repeats.
 * @returns e.g. '4-7-10'.
 * @throws TypeError if `standing` is not an array; RangeError for a pin outside 1–10 or a repeat.
 * @example
 * leaveName([10, 4, 7]); // => '4-7-10'
 */
export function leaveName(standing: number[]): string {
  return [...standingSet('leaveName', standing)].sort((a, b) => a - b).join('-');
}
