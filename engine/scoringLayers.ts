import type { ArsenalBall, LayerResult, MatchupContext } from './types';
import { rulesLayer } from './rulesLayer';

/**
 * One scoring layer of rankArsenal: a name, a weight in the combined score, and `prepare`, called
 * once per ranking with the matchup, which returns the scorer for each ball (so a layer can do
 * its per-matchup work — e.g. build an oil map — once, not once per ball).
 */
export interface ScoringLayer {
  name: string;
  /** Weight in combineLayers, > 0. */
  weight: number;
  prepare: (ctx: MatchupContext) => (ball: ArsenalBall) => LayerResult;
}

/**
 * The generic layers rankArsenal combines, in order: today the rules layer (documented rules of
 * thumb, weight 1). (The ball-motion layer is wired in rankArsenal.ts itself, because it also
 * returns each ball's prediction.) A further layer joins by adding its entry here, e.g.
 * `{ name: 'x', weight: 1, prepare: (ctx) => { const map = …(ctx); return (ball) => …(ball, map) } }`.
 * Source: PRODUCT.md (the ranking combines the rules layer and the ball-motion model); the weights
 * are Lanewright's choice.
 */
export const SCORING_LAYERS: readonly ScoringLayer[] = [
  { name: 'rules', weight: 1, prepare: (ctx) => (ball) => rulesLayer(ball, ctx) },
];
