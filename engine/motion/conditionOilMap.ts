import { namedErrors } from '../internal/checks';
import type { BallSpec, BowlerProfile, LaneSurface, OilPattern } from '../types';
import { laneSurfaceOf } from './laneSurfaceOf';
import { assertNumber } from './assertNumber';
import type { LaneOilMap } from './laneOilMap';
import { MOTION_CALIBRATION as K } from './motionCalibration';
import { patternOilMap } from './patternOilMap';
import { solvePocketLine } from './solvePocketLine';
import { shotOnField } from './shotOnField';
import { ballInertia } from './ballInertia';
import { coverFriction } from './coverFriction';
import { oilFrictionField } from './frictionField';
import { handSign } from './handSign';
import { transitionOilMap } from './transitionOilMap';

/**
 * The oil map a bowler meets after `gamesBowled` games on a pattern: the fresh map
 * (patternOilMap), then, when games > 0, transitionOilMap along the track of the pair's typical line —
 * the pocket line of MOTION_CALIBRATION.transitionReferenceBall thrown with this bowler's release on the
 * fresh pattern (assumption: the pair plays lines like the bowler's own), on the condition's lane surface
 * (`lane`, default synthetic and medium friction; wood loses oil faster).
 *
 * Units: µm map, boards, ft. Edge cases: gamesBowled in [0, 50] (RangeError otherwise); a pattern on
 * which even the reference ball cannot reach the pocket uses the solver's closest line.
 * Example: `conditionOilMap(pattern, bowler, 3)`.
 */
export function conditionOilMap(pattern: OilPattern, bowler: BowlerProfile, gamesBowled = 0, lane?: LaneSurface): LaneOilMap {
  const fn = 'conditionOilMap';
  const games = assertNumber(fn, 'gamesBowled', gamesBowled, 0, 50);
  const surface = laneSurfaceOf(fn, lane);
  const fresh = namedErrors(fn, () => patternOilMap(pattern));
  if (games === 0) return fresh;
  if (bowler === null || typeof bowler !== 'object') throw new TypeError(`${fn}: bowler must be an object, got ${String(bowler)}`);
  const hand = handSign(bowler.hand, fn);
  return namedErrors(fn, () => transitioned(fresh, bowler, hand, games, surface));
}

/** The fresh map after `games` on the pair's track (the reference ball's pocket line for this release). */
function transitioned(fresh: LaneOilMap, bowler: BowlerProfile, hand: 1 | -1, games: number, surface: LaneSurface): LaneOilMap {
  const ref = K.transitionReferenceBall as BallSpec;
  const shot = shotOnField(ref, bowler, hand, ballInertia(ref), oilFrictionField(fresh, coverFriction(ref, surface)));
  const line = solvePocketLine(shot.run, {}, {}, shot.preview);
  const r = line.result;
  const track: { ft: number; board: number }[] = [];
  for (let i = 0; i < r.sampleCount; i++) {
    const b = r.sampleBoard[i];
    track.push({ ft: r.sampleFt[i], board: hand === 1 ? b : 40 - b });
  }
  if (track.length < 2) track.push({ ft: 60, board: track[0]?.board ?? 20 });
  return transitionOilMap(fresh, track, games, { wood: surface.kind === 'wood' }).map;
}
