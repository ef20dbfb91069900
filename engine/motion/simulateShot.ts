import { namedErrors } from '../internal/checks';
import { assertNumber } from './assertNumber';
import { prepareShot } from './prepareShot';
import type { ShotPrediction, SimulateShotInput } from './shotPrediction';
import { solvePocketLine } from './solvePocketLine';
import { toShotPrediction } from './toShotPrediction';

/**
 * Predicts one delivery with the ball-motion model: skid, hook, roll, breakpoint and entry angle on
 * the pattern's oil map (after `gamesBowled`), for a given line or for the line that reaches the pocket.
 *
 * Definition: rigid-body Newton–Euler with smoothed Coulomb friction, RK4 at 4 ms (integrateDelivery;
 * rigid-body mechanics, RK4); friction from the oil film through the cover's roughness-aware law
 * (coverFriction, the mixed-lubrication law) and the oil the ball carries on its track (the track-ring model); release from
 * the BowlerProfile (releaseState); the oil map after games (conditionOilMap). When
 * `laydownBoard` or `targetBoard` is omitted, solvePocketLine picks the line to board 17.5.
 *
 * Units: boards from the hand-side gutter, ft, mph, degrees, s. Edge cases: invalid input throws
 * TypeError/RangeError naming the rejecting function and the value; a ball that cannot reach the pocket
 * returns the closest line; a gutter ball's path ends at the gutter (`gutter` true) while
 * entryBoard/angle are those of a lane that went on (so they stay continuous for solvers).
 * Example: `simulateShot({ ball, bowler, pattern }).entryAngleDeg` → about 4–6° for a 300-rpm stroker.
 */
export function simulateShot(input: SimulateShotInput): ShotPrediction {
  // name the public function first, keep the inner function's message and the error type
  return namedErrors('simulateShot', () => simulate(input));
}

function simulate(input: SimulateShotInput): ShotPrediction {
  const fn = 'simulateShot';
  if (input === null || typeof input !== 'object') throw new TypeError(`${fn}: input must be an object, got ${String(input)}`);
  const shot = prepareShot(input);
  const { laydownBoard, targetBoard } = input;
  if (laydownBoard !== undefined) assertNumber(fn, 'laydownBoard', laydownBoard, -5, 45);
  if (targetBoard !== undefined) assertNumber(fn, 'targetBoard', targetBoard, -5, 45);
  if (laydownBoard !== undefined && targetBoard !== undefined)
    return toShotPrediction(shot.run(laydownBoard, targetBoard), laydownBoard, targetBoard);
  const line = solvePocketLine(shot.run, { laydownBoard, targetBoard }, {}, shot.preview);
  return toShotPrediction(line.result, line.laydownBoard, line.targetBoard);
}
