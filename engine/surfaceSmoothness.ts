import { bool, positive } from './internal/checks';

/**
 * Lanewright's scale of a ball surface from rough to smooth, 0–1: the grit on a log scale from
 * 360 grit (0) to 4000 grit (0.85), plus 0.15 for polish or compound over it.
 *
 * Definition: 0.85 × clamp(ln(grit / 360) ÷ ln(4000 / 360), 0, 1) + (polished ? 0.15 : 0).
 * Source: common practice for the direction (TRADE.md 7.2: rougher = earlier read and more hook in
 * oil; smoother or polished = more length and a sharper backend); the log scale and the 0.15 for
 * polish are Lanewright's choice (grit steps 500 → 1000 → 2000 → 4000 are roughly doubling).
 *
 * Edge cases: grit below 360 counts as 360 and above 4000 as 4000.
 * @param grit grit of the last abrasive pad, > 0.
 * @param polished polish or compound over that grit.
 * @returns 0 (roughest) … 1 (4000 grit polished).
 * @throws RangeError for a grit ≤ 0 or not finite; TypeError if polished is not a boolean.
 * @example
 * surfaceSmoothness(4000, true); // => 1
 * surfaceSmoothness(500, false); // => 0.116
 */
export function surfaceSmoothness(grit: number, polished: boolean): number {
  const fn = 'surfaceSmoothness';
  const g = positive(fn, 'grit', grit);
  bool(fn, 'polished', polished);
  const t = Math.log(g / SMOOTHNESS_SCALE.roughGrit) / Math.log(SMOOTHNESS_SCALE.smoothGrit / SMOOTHNESS_SCALE.roughGrit);
  const base = SMOOTHNESS_SCALE.gritShare * Math.min(1, Math.max(0, t));
  return base + (polished ? 1 - SMOOTHNESS_SCALE.gritShare : 0);
}

/** The ends of the surfaceSmoothness scale: grits and the share of the scale the grit covers. */
export const SMOOTHNESS_SCALE = { roughGrit: 360, smoothGrit: 4000, gritShare: 0.85 } as const;
