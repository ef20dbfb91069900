import type { MatchupRule } from '../types';
import { RATIO_CLASS } from '../ratioClass';
import { clamp } from '../internal/checks';
import { points } from '../internal/fit';

/** Largest number of points flareVsRatio gives or takes. */
export const FLARE_VS_RATIO_POINTS = 3;

/**
 * Rule: a flat (sport) pattern has no oil line to hold a ball in, so a miss goes where the ball
 * takes it; a ball that flares less gives more control there. A house (recreation) ratio forgives
 * flare. Flatness is 1 at a ratio of 3:1 or less, 0 at 6:1 or more, linear between.
 *
 * Effect: −6 × flatness × (flare − 0.5), kept within ±3 points. Not applied when flatness is 0.
 * Source: common practice; class boundaries TRADE.md conventions table (3:1 USBC Sport limit).
 *
 * @example
 * flareVsRatio(highFlareBall, features, sportContext).effect < 0; // => true
 */
export const flareVsRatio: MatchupRule = (_ball, f, ctx) => {
  const r = ctx.analysis.ratio;
  const flatness = clamp((RATIO_CLASS.recreationFrom - r) / (RATIO_CLASS.recreationFrom - RATIO_CLASS.sportMax), 0, 1);
  if (flatness === 0) return null;
  const effect = points(clamp(-6 * flatness * (f.flare - 0.5), -FLARE_VS_RATIO_POINTS, FLARE_VS_RATIO_POINTS));
  const ratio = `${r.toFixed(1)}:1`;
  const text =
    f.flare > 0.5
      ? `On a flat ${ratio} pattern a high-flare ball has less room for a miss.`
      : `On a flat ${ratio} pattern a lower-flare ball is easier to keep in play.`;
  return { rule: 'flare-vs-ratio', effect, text, source: 'common practice (ratio classes: TRADE.md conventions)' };
};
