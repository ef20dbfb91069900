import type { MatchupRule } from '../types';
import { fitEffect, points } from '../internal/fit';

/** Largest number of points asymmetryVsOil gives or takes. */
export const ASYMMETRY_VS_OIL_POINTS = 5;

/**
 * Rule: an asymmetric core (intermediate differential) responds quicker and more angularly to
 * friction, which helps a ball turn at the end of long, heavy oil; on short or light oil that
 * quick response overreacts, and a symmetric core is smoother. The best asymmetry is oilDemand.
 *
 * Effect: up to ±5 points, fitEffect(asymmetry vs oilDemand).
 * Source: common practice (TRADE.md 7.2, intermediate differential row).
 *
 * @example
 * asymmetryVsOil(asymBall, features, heavyContext).effect > 0; // => true
 */
export const asymmetryVsOil: MatchupRule = (ball, f, ctx) => {
  const effect = points(fitEffect(f.asymmetry, ctx.oilDemand, ASYMMETRY_VS_OIL_POINTS));
  const symmetric = ball.intermediateDifferential === 0;
  const core = symmetric
    ? 'A symmetric core'
    : `An asymmetric core (intermediate differential ${ball.intermediateDifferential.toFixed(3)} in)`;
  let text: string;
  if (Math.abs(f.asymmetry - ctx.oilDemand) < 0.25) text = `${core} responds to friction at the right pace for this pattern.`;
  else if (f.asymmetry > ctx.oilDemand) text = `${core} responds quickly; with this little oil it may overreact at the breakpoint.`;
  else text = `${core} is smooth; this much oil calls for a quicker response at the breakpoint.`;
  return { rule: 'asymmetry-vs-oil', effect, text, source: 'common practice (TRADE.md 7.2, intermediate differential)' };
};
