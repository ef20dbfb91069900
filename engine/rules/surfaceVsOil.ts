import type { MatchupRule } from '../types';
import { fitEffect, patternWords, points } from '../internal/fit';

/** Largest number of points surfaceVsOil gives or takes (scaled by the cover's surface response). */
export const SURFACE_VS_OIL_POINTS = 12;

/**
 * Rule: a rough (low-grit) surface reads oil earlier and hooks more in it; a smooth (high-grit)
 * or polished one goes longer with a sharper backend. More oil calls for more surface, less oil
 * for less: the best smoothness is 1 − oilDemand.
 *
 * Effect: up to ±12 points × the cover's surface response (reactive 1, urethane 0.7, plastic 0.2),
 * fitEffect(smoothness vs 1 − oilDemand). So a strong solid at 500 grit scores below the same
 * ball at 3000–4000 grit on a fresh, light house shot, and above it on heavy oil.
 * Source: common practice (TRADE.md 7.2, surface grit row; PRODUCT.md "a ball with too much
 * surface for a fresh house shot reads the lane early").
 *
 * @example
 * surfaceVsOil(ball500Grit, features, heavyContext).effect > 0; // => true
 */
export const surfaceVsOil: MatchupRule = (ball, f, ctx) => {
  const target = 1 - ctx.oilDemand;
  const effect = points(fitEffect(f.smoothness, target, SURFACE_VS_OIL_POINTS) * f.surfaceResponse);
  const finish = ball.polished ? `${ball.surfaceGrit} grit polished` : `${ball.surfaceGrit} grit`;
  let text: string;
  if (Math.abs(f.smoothness - target) < 0.15) {
    text = `The ${finish} surface suits this oil (${patternWords(ctx)}).`;
  } else if (f.smoothness < target) {
    text = `The ${finish} surface is rough for this pattern (${patternWords(ctx)}): it will read the lane early and use up energy before the pins.`;
  } else {
    text = `The ${finish} surface is smooth for this much oil (${patternWords(ctx)}): it will skid too far before it reads.`;
  }
  return { rule: 'surface-vs-oil', effect, text, source: 'common practice (TRADE.md 7.2, surface grit)' };
};
