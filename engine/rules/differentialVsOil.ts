import type { MatchupRule } from '../types';
import { demandWords, fitEffect, points } from '../internal/fit';

/** Largest number of points differentialVsOil gives or takes. */
export const DIFFERENTIAL_VS_OIL_POINTS = 7;

/**
 * Rule: a higher differential flares more and hooks more in total, which heavy oil needs; a lower
 * one is straighter and easier to control when there is little oil. The best differential share
 * (differential ÷ 0.060 in) is 0.2 + 0.7 × oilDemand.
 *
 * Effect: up to ±7 points, fitEffect(differentialShare vs that target).
 * Source: common practice (TRADE.md 7.2, differential row); 0.060 in is the USBC limit (1.1).
 *
 * @example
 * differentialVsOil(highDiffBall, features, heavyContext).effect > 0; // => true
 */
export const differentialVsOil: MatchupRule = (ball, f, ctx) => {
  const target = 0.2 + 0.7 * ctx.oilDemand;
  const effect = points(fitEffect(f.differentialShare, target, DIFFERENTIAL_VS_OIL_POINTS));
  const diff = ball.differential.toFixed(3);
  let text: string;
  if (Math.abs(f.differentialShare - target) < 0.2) {
    text = `A differential of ${diff} in gives about the hook this pattern calls for.`;
  } else if (f.differentialShare > target) {
    text = `A differential of ${diff} in flares a lot for a pattern that needs ${demandWords(ctx.oilDemand)} ball; expect less control.`;
  } else {
    text = `A differential of ${diff} in flares little; this pattern needs ${demandWords(ctx.oilDemand)} ball.`;
  }
  return { rule: 'differential-vs-oil', effect, text, source: 'common practice (TRADE.md 7.2, differential)' };
};
