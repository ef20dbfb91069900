import type { CoverType, MatchupRule } from '../types';
import { fitEffect, patternWords, points } from '../internal/fit';

/**
 * The oil demand (0–1, see matchupContext) each strike cover suits best. Source: TRADE.md 7.2
 * (common practice: urethane early and smooth with low angle, pearl length and backend, hybrid in
 * between, solid the earliest and strongest read in oil); the numbers are Lanewright's scale.
 */
export const COVER_IDEAL_DEMAND: Readonly<Record<Exclude<CoverType, 'plastic'>, number>> = {
  urethane: 0.15,
  'reactive-pearl': 0.45,
  'reactive-hybrid': 0.65,
  'reactive-solid': 0.85,
};

/** Largest number of points coverVsOil gives or takes. */
export const COVER_VS_OIL_POINTS = 15;

const WORDS: Record<Exclude<CoverType, 'plastic'>, string> = {
  urethane: 'A urethane cover reads early and smoothly with little angle',
  'reactive-pearl': 'A reactive pearl cover goes long and turns hard at the back',
  'reactive-hybrid': 'A reactive hybrid cover sits between a pearl and a solid',
  'reactive-solid': 'A reactive solid cover reads oil earliest and strongest',
};

/**
 * Rule: the cover family should match the oil — solids for heavy, long oil; pearls for medium or
 * shorter patterns; urethane for short, light ones.
 *
 * Effect: up to ±15 points, fitEffect(oilDemand vs COVER_IDEAL_DEMAND[cover]).
 * Source: common practice (TRADE.md 7.2, cover type order). Not applied to plastic (see
 * plasticSpareBall).
 *
 * @example
 * coverVsOil(solidBall, features, heavyLongContext).effect > 0; // => true (a solid suits heavy, long oil)
 */
export const coverVsOil: MatchupRule = (ball, _f, ctx) => {
  if (ball.coverType === 'plastic') return null;
  const ideal = COVER_IDEAL_DEMAND[ball.coverType];
  const effect = points(fitEffect(ctx.oilDemand, ideal, COVER_VS_OIL_POINTS));
  const verdict =
    Math.abs(ctx.oilDemand - ideal) < 0.15
      ? 'which suits'
      : ctx.oilDemand > ideal
        ? 'which is too little for'
        : 'which is too much for';
  return {
    rule: 'cover-vs-oil',
    effect,
    text: `${WORDS[ball.coverType]}, ${verdict} this pattern (${patternWords(ctx)}).`,
    source: 'common practice (TRADE.md 7.2, cover types)',
  };
};
