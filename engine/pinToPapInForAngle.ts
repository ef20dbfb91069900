import { DEFAULT_BALL_DIAMETER_IN } from './constants';
import { inRange, positive } from './internal/checks';

/**
 * The pin-to-PAP distance along the ball's surface that gives a chosen angle at the centre; the
 * inverse of pinToPapAngleDeg.
 *
 * Definition: arc length = radius × angle (radians). Source: rigid-body mechanics (derived).
 *
 * @param angleDeg angle at the centre between pin and PAP, degrees, 0–180.
 * @param diameterIn ball diameter, inches; default 8.5.
 * @returns the distance in inches.
 * @throws RangeError for an angle outside 0–180° or a diameter ≤ 0.
 *
 * @example
 * pinToPapInForAngle(45); // => 3.338 (8.5 in ball)
 */
export function pinToPapInForAngle(angleDeg: number, diameterIn: number = DEFAULT_BALL_DIAMETER_IN): number {
  const fn = 'pinToPapInForAngle';
  const d = positive(fn, 'diameterIn', diameterIn, 'in');
  const a = inRange(fn, 'angleDeg', angleDeg, 0, 180, '°');
  return (d / 2) * ((a * Math.PI) / 180);
}
