import type { BallSpec, CoverType } from '../types';
import { assertNumber } from './assertNumber';
import { MOTION_CALIBRATION as K } from './motionCalibration';

/** How one ball's cover meets oil: the friction law's parameters for that ball. */
export interface CoverFriction {
  /** Sliding coefficient on a fully oiled lane for this cover. */
  muOil: number;
  /** Sliding coefficient on a dry lane for this cover. */
  muDry: number;
  /** Combined roughness σ = √(Ra_ball² + Ra_lane²), µm. */
  roughnessUm: number;
  /** Film scale h_c = Λ₀ σ of the roughness-aware law, µm. */
  filmScaleUm: number;
  /** Oil absorption time constant of the cover, s. */
  absorptionTimeS: number;
}

const COVERS: readonly CoverType[] = ['plastic', 'urethane', 'reactive-pearl', 'reactive-hybrid', 'reactive-solid'];

/**
 * The friction law's parameters for a ball: μ(h) = μ_oil + (μ_dry − μ_oil)·exp(−h / (Λ₀ σ)).
 *
 * Source: the roughness-aware (mixed-lubrication) law of PHYSICS.md §5.1 with the anchors
 * μ_oil ≈ 0.04, μ_dry ≈ 0.2 (PHYSICS.md §2.1, M); the cover and surface scaling is a documented
 * **model assumption** (PHYSICS.md §5.2, TRADE.md §7.2 directions) kept in `MOTION_CALIBRATION`:
 * Ra = Ra_ref·(refGrit/grit)^p·texture, × polishRaFactor when polished. A rougher cover (coarser grit)
 * gives a larger σ, so a given film lubricates less and the ball reads the oil earlier.
 *
 * Units: grit (dimensionless, 100–10000), µm, s. Edge cases: TypeError for an unknown cover type,
 * RangeError for grit outside [1, 1e6]; μ_dry is capped at the USBC 0.32 limit.
 * Example: a 500-grit reactive solid → muOil 0.044, muDry 0.22, filmScaleUm ≈ 0.91.
 */
export function coverFriction(ball: Pick<BallSpec, 'coverType' | 'surfaceGrit' | 'polished'>): CoverFriction {
  const fn = 'coverFriction';
  if (!COVERS.includes(ball.coverType)) throw new TypeError(`${fn}: unknown coverType ${String(ball.coverType)}`);
  const grit = assertNumber(fn, 'surfaceGrit', ball.surfaceGrit, 1, 1e6);
  if (typeof ball.polished !== 'boolean') throw new TypeError(`${fn}: polished must be a boolean, got ${String(ball.polished)}`);
  const c = K.covers[ball.coverType];
  const ra = K.ballRaAtRefGritUm * Math.pow(K.refGrit / grit, K.gritExponent) * c.textureFactor * (ball.polished ? K.polishRaFactor : 1);
  const sigma = Math.sqrt(ra * ra + K.laneRaUm * K.laneRaUm);
  const muDry = Math.min(K.muMax, K.muDry * c.muDryFactor);
  const muOil = Math.min(muDry, K.muOil * c.muOilFactor);
  return { muOil, muDry, roughnessUm: sigma, filmScaleUm: K.lambda0 * sigma, absorptionTimeS: c.absorptionTimeS };
}
