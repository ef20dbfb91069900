import type { MatchupRule } from '../types';
import { checkLegality } from '../checkLegality';

/** Points usbcLegality takes from a ball that breaks a USBC limit. */
export const ILLEGAL_BALL_PENALTY = 10;

/**
 * Rule: a ball that breaks a USBC equipment limit cannot be used in USBC competition, so it is
 * marked down and the broken limits are named.
 *
 * Effect: −10 points when checkLegality finds a violation; not applied to a legal ball.
 * Source: USBC equipment specifications (TRADE.md 1.1) via checkLegality.
 *
 * @example
 * usbcLegality({ ...ball, weightLb: 17 }, f, ctx).effect; // => -10
 */
export const usbcLegality: MatchupRule = (ball) => {
  const { legal, violations } = checkLegality(ball);
  if (legal) return null;
  const list = violations.map((v) => `${v.field} ${v.limit}`).join(', ');
  return {
    rule: 'usbc-legality',
    effect: -ILLEGAL_BALL_PENALTY,
    text: `Not legal in USBC competition (limit${violations.length > 1 ? 's' : ''}: ${list}).`,
    source: 'USBC equipment specifications (TRADE.md 1.1)',
  };
};
