import type { MatchupRule } from '../types';

/** Points plasticSpareBall takes from a plastic ball's strike score. */
export const PLASTIC_STRIKE_PENALTY = 60;

/**
 * Rule: a plastic (polyester) ball barely hooks; it is a spare ball, thrown straight at corner
 * pins, not a strike ball. It is ranked after every other cover for strikes (rankArsenal also sorts
 * it last) and suggested for corner spares.
 *
 * Effect: −60 points for a plastic cover; not applied to other covers.
 * Source: common practice (TRADE.md 7.1 "straight ball for corner pins" and 7.2 cover types).
 *
 * @example
 * plasticSpareBall(plasticBall, f, ctx).effect; // => -60
 */
export const plasticSpareBall: MatchupRule = (ball) => {
  if (ball.coverType !== 'plastic') return null;
  return {
    rule: 'plastic-spare-ball',
    effect: -PLASTIC_STRIKE_PENALTY,
    text: 'Plastic barely hooks: it is a spare ball, ranked last for strikes — use it to shoot corner pins straight.',
    source: 'common practice (TRADE.md 7.1, 7.2)',
  };
};
