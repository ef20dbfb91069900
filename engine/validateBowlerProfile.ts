import type { BowlerProfile } from './types';
import { finite, inRange, oneOf, positive, record, callerName } from './internal/checks';

/**
 * Plausibility bounds of a bowler profile: speed in mph, rev rate in rpm, angles in degrees.
 * Source: common practice (typical speeds 16–21 mph, rev rates to 400+ rpm, axis rotation 0–90°);
 * the bounds are wide on purpose and only reject values no release can have.
 */
export const BOWLER_BOUNDS = { maxSpeedMph: 40, maxRevRpm: 1000, maxAxisDeg: 90 } as const;

/**
 * Checks that a value is a well-formed BowlerProfile and throws if it is not.
 *
 * Well-formed: hand 'right' or 'left'; speed > 0 and ≤ 40 mph; rev rate 0–1000 rpm; axis
 * rotation and tilt 0–90°; PAP offsets, if given, finite inches.
 * Source: engine invalid-input policy (README.md); bounds BOWLER_BOUNDS.
 *
 * @param bowler the value to check.
 * @param fn the public function to name in the error message; default 'validateBowlerProfile'.
 * @throws TypeError for a mistyped field; RangeError for a value out of range.
 * @example
 * validateBowlerProfile({ hand: 'right', speedMph: 17, revRpm: 350, axisRotationDeg: 45, axisTiltDeg: 15 });
 */
export function validateBowlerProfile(bowler: unknown, fn = 'validateBowlerProfile'): asserts bowler is BowlerProfile {
  callerName('validateBowlerProfile', fn);
  const b = record(fn, 'bowler', bowler);
  const B = BOWLER_BOUNDS;
  oneOf(fn, 'hand', b.hand, ['right', 'left'] as const);
  const speed = positive(fn, 'speedMph', b.speedMph, 'mph');
  if (speed > B.maxSpeedMph) throw new RangeError(`${fn}: speedMph ${speed} mph is above the maximum ${B.maxSpeedMph} mph`);
  inRange(fn, 'revRpm', b.revRpm, 0, B.maxRevRpm, 'rpm');
  inRange(fn, 'axisRotationDeg', b.axisRotationDeg, 0, B.maxAxisDeg, '°');
  inRange(fn, 'axisTiltDeg', b.axisTiltDeg, 0, B.maxAxisDeg, '°');
  if (b.papRightIn !== undefined) finite(fn, 'papRightIn', b.papRightIn);
  if (b.papUpIn !== undefined) finite(fn, 'papUpIn', b.papUpIn);
}
