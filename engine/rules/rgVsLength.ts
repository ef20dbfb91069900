import type { MatchupRule } from '../types';
import { fitEffect, points } from '../internal/fit';

/** Largest number of points rgVsLength gives or takes. */
export const RG_VS_LENGTH_POINTS = 8;

/**
 * Rule: a low-RG ball revs up and starts to roll earlier, which a long, oily pattern needs; a
 * high-RG ball keeps its energy for later, which suits a short pattern with a long dry backend.
 * The best RG lowness is 0.7 × lengthDemand + 0.3 × volumeDemand.
 *
 * Effect: up to ±8 points, fitEffect(rgLowness vs that target).
 * Source: common practice (TRADE.md 7.2, RG row), consistent with the sliding-sphere result that a
 * lower RG spins up faster (TRADE.md 6.2, derived).
 *
 * @example
 * rgVsLength(lowRgBall, features, longContext).effect > 0; // => true
 */
export const rgVsLength: MatchupRule = (ball, f, ctx) => {
  const target = 0.7 * ctx.lengthDemand + 0.3 * ctx.volumeDemand;
  const effect = points(fitEffect(f.rgLowness, target, RG_VS_LENGTH_POINTS));
  const rg = ball.rg.toFixed(3);
  const L = ctx.analysis.lengthFt;
  let text: string;
  if (Math.abs(f.rgLowness - target) < 0.2) text = `An RG of ${rg} in rolls at about the right time for a ${L} ft pattern.`;
  else if (f.rgLowness > target) text = `An RG of ${rg} in revs up early; on a ${L} ft pattern it may roll out before the pins.`;
  else text = `An RG of ${rg} in saves its roll for late; on a ${L} ft pattern it may not turn in time.`;
  return { rule: 'rg-vs-length', effect, text, source: 'common practice (TRADE.md 7.2, RG; 6.2)' };
};
