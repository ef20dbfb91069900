import { DEFAULT_BALL_DIAMETER_IN } from './constants';
import { inRange, positive } from './internal/checks';

/**
 * The angle at the ball's centre between the pin (low-RG axis) and the bowler's positive axis
 * point (PAP), from their distance measured along the ball's surface.
 *
 * Definition: angle = arc length ÷ radius (radians), returned in degrees.
 * Source: Lanewright's conventions (engine/README.md) and rigid-body mechanics (derived: 45° is 3.34 in on an 8.5 in ball,
 * 3 3/8 in on a maximum-diameter 8.595 in ball).
 *
 * @param pinToPapIn distance from pin to PAP along the surface, inches, from 0 to half the
 *   circumference (the far pole).
 * @param diameterIn ball diameter, inches; default 8.5.
 * @returns the angle in degrees, 0–180.
 * @throws RangeError for a negative distance, one beyond half the circumference, or a diameter ≤ 0.
 *
 * @example
 * pinToPapAngleDeg(3.338); // => 45.0
 */
export function pinToPapAngleDeg(pinToPapIn: number, diameterIn: number = DEFAULT_BALL_DIAMETER_IN): number {
  const fn = 'pinToPapAngleDeg';
  const d = positive(fn, 'diameterIn', diameterIn, 'in');
  const s = inRange(fn, 'pinToPapIn', pinToPapIn, 0, (Math.PI * d) / 2, 'in');
  return ((s / (d / 2)) * 180) / Math.PI;
}
