import type { ArsenalBall, LayerResult, MatchupContext } from './types';
import { FIT_LAYER_WEIGHT, fitLayer } from './fitLayer';

/**
 * One scoring layer of rankArsenal: a name, a weight in the combined score, and `prepare`, called once per
 * ranking with the matchup, which returns the scorer for each ball (so a layer does its per-matchup work once).
 */
export interface ScoringLayer {
  name: string;
  /** Weight in combineLayers, > 0. */
  weight: number;
  prepare: (ctx: MatchupContext) => (ball: ArsenalBall) => LayerResult;
}

/**
 * The generic layers rankArsenal combines, in order: the matchup model's fit (reaction against demand,
 * FIT_LAYER_WEIGHT). The ball-motion layer is wired in rankArsenal.ts itself, because it also returns each
 * ball's prediction. Source: Lanewright's design (the ranking combines the matchup model and the ball-motion
 * model); the weights are Lanewright's choice.
 */
export const SCORING_LAYERS: readonly ScoringLayer[] = [
  { name: 'fit', weight: FIT_LAYER_WEIGHT, prepare: (ctx) => (ball) => fitLayer(ball, ctx) },
];
