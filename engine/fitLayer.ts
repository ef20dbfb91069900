import type { BallSpec, LayerResult, MatchupContext } from './types';
import { checkMatchup } from './internal/matchupChecks';
import { fitUnchecked, type StrengthFit } from './strengthFit';
import { suggestionsUnchecked } from './suggestChanges';

/** Weight of the fit layer in rankArsenal's combined score (the ball-motion layer has MOTION_LAYER_WEIGHT; Lanewright's choice). */
export const FIT_LAYER_WEIGHT = 0.6;

/**
 * The matchup model's layer for one ball: its fit (strengthFit: reaction against demand, score 0–100, one
 * reason per part) and what to change (suggestChanges, by the amount the gap calls for).
 * Source: see strengthFit and suggestChanges. Units: points. Edge cases: a ball already validated.
 *
 * @param ball the ball.
 * @param ctx the matchup (matchupContext).
 * @returns `{ score, reasons, suggestions, fit }`.
 * @example
 * fitLayer(ball, matchupContext(bowler, pattern)).fit.verdict; // => 'suits'
 */
export function fitLayer(ball: BallSpec, ctx: MatchupContext): LayerResult & { fit: StrengthFit } {
  checkMatchup('fitLayer', ball, ctx);
  const fit = fitUnchecked(ball, ctx);
  return { score: fit.score, reasons: fit.reasons, suggestions: suggestionsUnchecked(ball, ctx, fit), fit };
}
