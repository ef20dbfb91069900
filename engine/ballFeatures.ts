import type { BallFeatures, BallSpec, CoverType } from './types';
import { DEFAULT_BALL_DIAMETER_IN } from './constants';
import { flareShare } from './flareShare';
import { USBC_BALL_LIMITS } from './checkLegality';
import { surfaceSmoothness } from './surfaceSmoothness';
import { clamp } from './internal/checks';
import { validateBallSpec } from './validateBallSpec';

/**
 * How early and strongly each cover family reads oil, 0–1 (plastic 0 … reactive solid 0.9).
 * Source: TRADE.md 7.2 cover-type order (common practice: plastic → urethane → reactive pearl →
 * reactive hybrid → reactive solid); the numbers are Lanewright's scale along that order.
 */
export const COVER_READ: Readonly<Record<CoverType, number>> = {
  plastic: 0,
  urethane: 0.35,
  'reactive-pearl': 0.6,
  'reactive-hybrid': 0.75,
  'reactive-solid': 0.9,
};

/**
 * How much a cover family's reaction changes with its surface, 0–1: reactive covers fully,
 * urethane less, plastic little. Source: common practice (TRADE.md 7.2); numbers are Lanewright's.
 */
export const COVER_SURFACE_RESPONSE: Readonly<Record<CoverType, number>> = {
  plastic: 0.2,
  urethane: 0.7,
  'reactive-pearl': 1,
  'reactive-hybrid': 1,
  'reactive-solid': 1,
};

/** Intermediate differential at which the asymmetry feature reaches 1, inches (Lanewright's scale). */
export const FULL_ASYMMETRY_IN = 0.02;


/**
 * A ball's properties put on the 0–1 scales the rules layer compares with a pattern.
 *
 * Definition: see the BallFeatures fields. RG and differential are scaled by the USBC limits
 * (TRADE.md 1.1), layout by flareShare (TRADE.md 6.3), cover and surface by COVER_READ,
 * COVER_SURFACE_RESPONSE and surfaceSmoothness (TRADE.md 7.2, common practice).
 * Edge cases: values beyond the legal limits are clamped to the ends of the scales.
 *
 * @param ball the ball.
 * @returns its BallFeatures.
 * @throws TypeError/RangeError for a malformed ball (validateBallSpec).
 * @example
 * ballFeatures(ball).rgLowness; // => 1 for RG 2.46 in
 */
export function ballFeatures(ball: BallSpec): BallFeatures {
  validateBallSpec(ball, 'ballFeatures');
  return featuresUnchecked(ball);
}

/** ballFeatures for a ball already validated (internal use by the rules layer). */
export function featuresUnchecked(ball: BallSpec): BallFeatures {
  const L = USBC_BALL_LIMITS;
  const layoutShare = ball.layout
    ? flareShare(ball.layout.pinToPapIn, ball.diameterIn ?? DEFAULT_BALL_DIAMETER_IN)
    : null;
  const differentialShare = clamp(ball.differential / L.maxDifferentialIn, 0, 1);
  return {
    coverRead: COVER_READ[ball.coverType],
    surfaceResponse: COVER_SURFACE_RESPONSE[ball.coverType],
    smoothness: surfaceSmoothness(ball.surfaceGrit, ball.polished),
    rgLowness: clamp((L.maxRgIn - ball.rg) / (L.maxRgIn - L.minRgIn), 0, 1),
    differentialShare,
    asymmetry: clamp(ball.intermediateDifferential / FULL_ASYMMETRY_IN, 0, 1),
    layoutShare,
    flare: differentialShare * (layoutShare ?? 1),
  };
}
