import type { MatchupRule } from '../types';
import { clamp } from '../internal/checks';
import { points } from '../internal/fit';
import { strengthOf } from '../ballStrength';

/** Largest number of points patternBreakdown gives or takes. */
export const PATTERN_BREAKDOWN_POINTS = 10;

/** Ball strength (0–1) that neither gains nor loses as the pattern breaks down. */
export const BREAKDOWN_NEUTRAL_STRENGTH = 0.45;

/**
 * Rule: as games are bowled, balls push and soak oil out of the track, so the lane hooks more and
 * earlier; weaker and cleaner (smoother) balls then fit better and strong, rough ones worse.
 *
 * Effect: −30 × breakdown × (ballStrength − 0.45), kept within ±10 points, breakdown = g ÷ (g + 6)
 * (matchupContext). Not applied on a fresh pattern (0 games).
 * Source: common practice (direction); supported by the USBC Bowling Technology Study rationale
 * that stronger balls break patterns down faster (TRADE.md 5.2, P). The pace is Lanewright's choice.
 *
 * @example
 * patternBreakdown(strongBall, f, contextAfter9Games).effect < 0; // => true
 */
export const patternBreakdown: MatchupRule = (_ball, f, ctx) => {
  if (ctx.gamesBowled === 0) return null;
  const strength = strengthOf(f);
  const effect = points(
    clamp(-30 * ctx.breakdown * (strength - BREAKDOWN_NEUTRAL_STRENGTH), -PATTERN_BREAKDOWN_POINTS, PATTERN_BREAKDOWN_POINTS),
  );
  const games = `${ctx.gamesBowled} ${ctx.gamesBowled === 1 ? 'game' : 'games'}`;
  const text =
    strength > BREAKDOWN_NEUTRAL_STRENGTH
      ? `After ${games} the track has lost oil and hooks earlier; a strong ball like this reads it sooner than it did fresh.`
      : `After ${games} the track has lost oil and hooks earlier; a milder ball like this gains from it.`;
  return { rule: 'pattern-breakdown', effect, text, source: 'common practice (direction; TRADE.md 5.2)' };
};
