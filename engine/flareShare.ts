import { DEFAULT_BALL_DIAMETER_IN } from './constants';
import { inRange, positive } from './internal/checks';

/**
 * The share (0–1) of a ball's maximum flare potential that a pin-to-PAP distance gives.
 *
 * Definition: |sin 2θ|, θ the angle at the centre between pin and PAP (pinToPapAngleDeg). The
 * angular-momentum component that drives axis migration is ½ ΔI ω sin 2θ, largest at θ = 45°.
 * Source: rigid-body mechanics (derived); the trade figure "about
 * 3 3/8 in gives maximum flare potential" matches it.
 *
 * Edge cases: 0 with the pin on the PAP (θ = 0) and with the pin 90° away on the track (θ = 90°).
 *
 * @param pinToPapIn distance from pin to PAP along the surface, inches.
 * @param diameterIn ball diameter, inches; default 8.5.
 * @returns 0–1.
 * @throws RangeError for a negative distance, one beyond half the circumference, or a diameter ≤ 0.
 *
 * @example
 * flareShare(3.338); // => 1.0 (45°)
 * flareShare(5.0);   // => 0.709 (67.4°: |sin 134.8°|)
 */
export function flareShare(pinToPapIn: number, diameterIn: number = DEFAULT_BALL_DIAMETER_IN): number {
  const fn = 'flareShare';
  const d = positive(fn, 'diameterIn', diameterIn, 'in');
  const s = inRange(fn, 'pinToPapIn', pinToPapIn, 0, (Math.PI * d) / 2, 'in');
  const theta = s / (d / 2);
  return Math.abs(Math.sin(2 * theta));
}
