import type { BallSpec, CoverType } from '../types';
import { assertNumber } from './assertNumber';
import { MOTION_CALIBRATION as K, type LaneFriction } from './motionCalibration';

/** How one ball's cover meets oil: the friction law's parameters for that ball on that lane. */
export interface CoverFriction {
  /** Sliding coefficient under a full oil film (the hydrodynamic floor). */
  muFilm: number;
  /** Sliding coefficient on a dry lane for this cover and lane. */
  muDry: number;
  /** μ on a 3 µm film, the middle of a typical house shot (for explanations and comparisons). */
  muOil: number;
  /** Combined roughness σ = √(Ra_ball² + Ra_lane²), µm. */
  roughnessUm: number;
  /** Film scale h_c of the friction law, µm. */
  filmScaleUm: number;
  /** Oil absorption time constant of the cover, s. */
  absorptionTimeS: number;
}

/** Film at which `muOil` is quoted, µm (about the middle of a 19–22 mL house shot). */
export const REFERENCE_FILM_UM = 3;

const COVERS: readonly CoverType[] = ['plastic', 'urethane', 'reactive-pearl', 'reactive-hybrid', 'reactive-solid'];
const FRICTIONS: readonly LaneFriction[] = ['low', 'medium', 'high'];

/**
 * The friction law's parameters for a ball: μ(h) = μ_film + (μ_dry − μ_film)·h_c/(h + h_c) (mixed lubrication,
 * MOTION_CALIBRATION), with h_c = filmScalePerRoughness·σ and σ = √(Ra_ball² + Ra_lane²).
 *
 * Source: the Stribeck-curve picture of mixed lubrication (textbook tribology) with the anchors μ ≈ 0.04 on oil
 * and ≈ 0.2 on the dry lane (C. Frohlich, Am. J. Phys. 72, 2004, as quoted; from memory); the cover and surface
 * scaling is a documented **model assumption** along the trade's directions (common practice: rougher reads
 * earlier; pearl and polish go longer; urethane reads early with little back end; a cover loses reaction as it
 * soaks up oil). Ra = Ra_ref·(refGrit/grit)^p·texture, × polishRaFactor when polished, × (1 − dulling) with use.
 *
 * Units: grit (dimensionless), µm, s. Edge cases: TypeError for an unknown cover type or lane friction,
 * RangeError for grit outside [1, 1e6] or games outside [0, 10000]; μ_dry is capped at the USBC 0.32 limit.
 * Example: a fresh 2000-grit reactive solid on a medium lane → muOil ≈ 0.046, muDry 0.2, filmScaleUm ≈ 0.59.
 */
export function coverFriction(
  ball: Pick<BallSpec, 'coverType' | 'surfaceGrit' | 'polished'> & { gamesSinceResurface?: number },
  lane: { friction?: LaneFriction } = {},
): CoverFriction {
  const fn = 'coverFriction';
  if (ball === null || typeof ball !== 'object') throw new TypeError(`${fn}: ball must be an object, got ${String(ball)}`);
  if (lane === null || typeof lane !== 'object') throw new TypeError(`${fn}: lane must be an object, got ${String(lane)}`);
  if (!COVERS.includes(ball.coverType)) throw new TypeError(`${fn}: unknown coverType ${String(ball.coverType)}`);
  const grit = assertNumber(fn, 'surfaceGrit', ball.surfaceGrit, 1, 1e6);
  if (typeof ball.polished !== 'boolean') throw new TypeError(`${fn}: polished must be a boolean, got ${String(ball.polished)}`);
  const games = ball.gamesSinceResurface === undefined ? 0 : assertNumber(fn, 'gamesSinceResurface', ball.gamesSinceResurface, 0, 10000);
  const friction = lane.friction ?? 'medium';
  if (!FRICTIONS.includes(friction)) throw new TypeError(`${fn}: lane friction must be low, medium or high, got ${String(friction)}`);
  const c = K.covers[ball.coverType];
  const dulling = 1 - (K.dullingMax * games) / (games + K.dullingHalfGames);
  const ra =
    K.ballRaAtRefGritUm * Math.pow(K.refGrit / grit, K.gritExponent) * c.textureFactor * (ball.polished ? K.polishRaFactor : 1) * dulling;
  const laneRa = K.laneRaUm[friction];
  const sigma = Math.sqrt(ra * ra + laneRa * laneRa);
  const muDry = Math.min(K.muMax, K.muDry * c.muDryFactor * K.laneDryFactor[friction]);
  const muFilm = Math.min(muDry, K.muFilm * c.filmFloorFactor);
  const hc = K.filmScalePerRoughness * sigma;
  const muOil = muFilm + ((muDry - muFilm) * hc) / (REFERENCE_FILM_UM + hc);
  return { muFilm, muDry, muOil, roughnessUm: sigma, filmScaleUm: hc, absorptionTimeS: c.absorptionTimeS };
}
