import type { BallSpec, CoverType } from './types';
import { DEFAULT_BALL_DIAMETER_IN } from './constants';
import { bool, inRange, oneOf, positive, record, callerName } from './internal/checks';

/** The cover types the engine knows, weakest-reading to strongest-reading in oil (common practice). */
export const COVER_TYPES: readonly CoverType[] = ['plastic', 'urethane', 'reactive-pearl', 'reactive-hybrid', 'reactive-solid'];

/**
 * Checks that a value is a well-formed BallSpec and throws if it is not.
 *
 * Well-formed is about physical sense, not legality (see checkLegality): weight, diameter and RG
 * are positive, the RG is smaller than the ball's radius (no mass can sit outside the ball), the
 * differentials are zero or more and the intermediate differential is no larger than the
 * differential (the intermediate axis's RG lies between the lowest and the highest), the grit is positive, the
 * hardness (if given) is on the 0–100 durometer scale, games since the last resurface 0–10000, an approval
 * year 1900–2200, and the layout (if given) has a pin-to-PAP distance from 0 to half the
 * circumference and angles from 0° to 180°.
 *
 * Source: engine invalid-input policy (README.md); physical bounds are geometry.
 *
 * @param ball the value to check.
 * @param fn the public function to name in the error message; default 'validateBallSpec'.
 * @throws TypeError for a missing or mistyped field (e.g. an unknown cover type); RangeError for a
 *   value out of range (NaN, negative weight, grit 0 …).
 *
 * @example
 * validateBallSpec({ weightLb: 15, rg: 2.5, differential: 0.05, intermediateDifferential: 0,
 *   coverType: 'reactive-solid', surfaceGrit: 2000, polished: false }); // passes
 */
export function validateBallSpec(ball: unknown, fn = 'validateBallSpec'): asserts ball is BallSpec {
  callerName('validateBallSpec', fn);
  const b = record(fn, 'ball', ball);
  positive(fn, 'weightLb', b.weightLb, 'lb');
  const diameter = b.diameterIn === undefined ? DEFAULT_BALL_DIAMETER_IN : positive(fn, 'diameterIn', b.diameterIn, 'in');
  const rg = positive(fn, 'rg', b.rg, 'in');
  if (rg >= diameter / 2) {
    throw new RangeError(`${fn}: rg ${rg} in is not smaller than the ball's radius ${diameter / 2} in`);
  }
  const diff = inRange(fn, 'differential', b.differential, 0, undefined, 'in');
  const intDiff = inRange(fn, 'intermediateDifferential', b.intermediateDifferential, 0, undefined, 'in');
  if (intDiff > diff) {
    throw new RangeError(
      `${fn}: intermediateDifferential ${intDiff} in is larger than differential ${diff} in; ` +
        'the intermediate RG lies between the lowest and the highest',
    );
  }
  oneOf(fn, 'coverType', b.coverType, COVER_TYPES);
  positive(fn, 'surfaceGrit', b.surfaceGrit);
  bool(fn, 'polished', b.polished);
  if (b.hardnessD !== undefined) inRange(fn, 'hardnessD', b.hardnessD, 0, 100, 'D');
  if (b.gamesSinceResurface !== undefined) inRange(fn, 'gamesSinceResurface', b.gamesSinceResurface, 0, 10000, 'games');
  if (b.approvalYear !== undefined) inRange(fn, 'approvalYear', b.approvalYear, 1900, 2200);
  if (b.layout !== undefined) {
    const l = record(fn, 'layout', b.layout);
    inRange(fn, 'layout.pinToPapIn', l.pinToPapIn, 0, (Math.PI * diameter) / 2, 'in');
    if (l.drillingAngleDeg !== undefined) inRange(fn, 'layout.drillingAngleDeg', l.drillingAngleDeg, 0, 180, '°');
    if (l.valAngleDeg !== undefined) inRange(fn, 'layout.valAngleDeg', l.valAngleDeg, 0, 180, '°');
  }
}
