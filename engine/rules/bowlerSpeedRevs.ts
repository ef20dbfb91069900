import type { MatchupRule } from '../types';
import { clamp } from '../internal/checks';
import { points } from '../internal/fit';
import { strengthOf } from '../ballStrength';

/** Largest number of points bowlerSpeedRevs gives or takes. */
export const BOWLER_SPEED_REVS_POINTS = 10;

/**
 * Rule: a high-speed, low-rev bowler needs more ball (a stronger ball reads the lane for them); a
 * high-rev, low-speed bowler needs less (a strong ball hooks too early for them).
 *
 * Effect: 20 × (bowlerNeed − 0.5) × (2 × ballStrength − 1), kept within ±10 points: positive for a
 * strong ball in the hands of a bowler who needs more ball and for a weak one in the hands of a
 * bowler who needs less. Not applied when bowlerNeed is within 0.05 of the middle.
 * Source: common practice (issue 3; PRODUCT.md), bowler ranges TRADE.md 7.3.
 *
 * @example
 * bowlerSpeedRevs(strongBall, f, fastLowRevContext).effect > 0; // => true
 */
export const bowlerSpeedRevs: MatchupRule = (_ball, f, ctx) => {
  const need = ctx.bowlerNeed - 0.5;
  if (Math.abs(need) < 0.05) return null;
  const strength = strengthOf(f);
  const effect = points(clamp(20 * need * (2 * strength - 1), -BOWLER_SPEED_REVS_POINTS, BOWLER_SPEED_REVS_POINTS));
  const b = ctx.bowler;
  const release = `${b.speedMph} mph with ${b.revRpm} rpm`;
  const strong = strength >= 0.5;
  let text: string;
  if (need > 0) {
    text = strong
      ? `At ${release} you need more ball than most; this strong ball helps it read the lane.`
      : `At ${release} you need more ball than most; this one may skid past the breakpoint.`;
  } else {
    text = strong
      ? `At ${release} you make the ball hook easily; this strong ball may hook too early.`
      : `At ${release} you make the ball hook easily; a milder ball like this keeps it under control.`;
  }
  return { rule: 'bowler-speed-revs', effect, text, source: 'common practice (bowler ranges: TRADE.md 7.3)' };
};
