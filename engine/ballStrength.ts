import type { BallFeatures, BallSpec } from './types';
import { featuresUnchecked } from './ballFeatures';
import { validateBallSpec } from './validateBallSpec';

/** Weights of ballStrength's terms (they sum to 1). Lanewright's choice; see ballStrength. */
export const STRENGTH_WEIGHTS = { cover: 0.45, surface: 0.25, rg: 0.1, flare: 0.15, asymmetry: 0.05 } as const;

/**
 * How much ball a ball is — how early and how much it hooks in oil — on a 0–1 scale.
 *
 * Definition: 0.45 × cover read + 0.25 × (1 − smoothness) × the cover's surface response
 * + 0.10 × RG lowness + 0.15 × flare + 0.05 × asymmetry (see ballFeatures).
 * Source: common practice for each direction (TRADE.md 7.2); cover and surface weigh most because
 * the USBC Ball Motion Study ranked cover and surface first (TRADE.md 5.1, P); the weights are
 * Lanewright's choice.
 *
 * @param ball the ball.
 * @returns 0 (a polished plastic spare ball is near 0) … 1.
 * @throws TypeError/RangeError for a malformed ball.
 * @example
 * ballStrength({ ...solid, surfaceGrit: 500 }) > ballStrength({ ...solid, surfaceGrit: 4000 }); // => true
 */
export function ballStrength(ball: BallSpec): number {
  validateBallSpec(ball, 'ballStrength');
  return strengthOf(featuresUnchecked(ball));
}

/** ballStrength from already computed features (internal use by the rules layer). */
export function strengthOf(f: BallFeatures): number {
  const w = STRENGTH_WEIGHTS;
  return (
    w.cover * f.coverRead +
    w.surface * (1 - f.smoothness) * f.surfaceResponse +
    w.rg * f.rgLowness +
    w.flare * f.flare +
    w.asymmetry * f.asymmetry
  );
}
