import type { MatchupRule } from '../types';
import { fitEffect, points } from '../internal/fit';
import { pinToPapAngleDeg } from '../pinToPapAngleDeg';
import { DEFAULT_BALL_DIAMETER_IN } from '../constants';

/** Largest number of points layoutFlare gives or takes. */
export const LAYOUT_FLARE_POINTS = 5;

/** The flare share (0–1) a matchup calls for: 0.55 + 0.45 × oilDemand (Lanewright's scale). */
export function targetFlareShare(oilDemand: number): number {
  return 0.55 + 0.45 * oilDemand;
}

/**
 * Rule: the layout decides how much of the core's flare the bowler gets. A pin-to-PAP distance
 * near 45° on the sphere (3 3/8 in) gives the most flare — wanted on heavy oil; farther or nearer
 * pins give less flare and more control — better with little oil.
 *
 * Effect: up to ±5 points, fitEffect(flareShare vs targetFlareShare(oilDemand), slope 3).
 * Not applied to a ball without a layout.
 * Source: TRADE.md 6.3 (derived: migration ∝ sin 2θ, largest at 45°; trade figure 3 3/8 in).
 *
 * @example
 * layoutFlare(ballAt45Deg, features, heavyContext).effect > 0; // => true
 */
export const layoutFlare: MatchupRule = (ball, f, ctx) => {
  if (!ball.layout || f.layoutShare === null) return null;
  const target = targetFlareShare(ctx.oilDemand);
  const effect = points(fitEffect(f.layoutShare, target, LAYOUT_FLARE_POINTS, 3));
  const deg = pinToPapAngleDeg(ball.layout.pinToPapIn, ball.diameterIn ?? DEFAULT_BALL_DIAMETER_IN);
  const share = Math.round(f.layoutShare * 100);
  const where = `A pin ${ball.layout.pinToPapIn} in from the PAP (${deg.toFixed(0)}°) gives ${share}% of the core's flare`;
  let text: string;
  if (Math.abs(f.layoutShare - target) < 0.12) text = `${where}, about what this pattern calls for.`;
  else if (f.layoutShare > target) text = `${where}; with this little oil less flare would be easier to control.`;
  else text = `${where}; this much oil calls for more flare.`;
  return { rule: 'layout-flare', effect, text, source: 'TRADE.md 6.3 (derived: flare ∝ sin 2θ, largest at 45°)' };
};
