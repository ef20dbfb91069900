import { namedErrors } from '../internal/checks';
import type { BallSpec, BowlerProfile, LaneSurface, OilPattern } from '../types';
import { laneSurfaceOf } from './laneSurfaceOf';
import { assertNumber } from './assertNumber';
import { ballInertia } from './ballInertia';
import { conditionOilMap } from './conditionOilMap';
import { coverFriction } from './coverFriction';
import { oilFrictionField, uniformFrictionField, type FrictionField } from './frictionField';
import { shotOnField, type PreparedShot } from './shotOnField';
import type { LaneOilMap } from './laneOilMap';
import { handSign } from './handSign';
import { releaseState } from './releaseState';

export type { PreparedShot } from './shotOnField';

/**
 * Validates a shot's inputs once and builds what every delivery of that ball on that lane shares:
 * inertia (ballInertia), the friction field (uniform `frictionOverride`, or the oil map after
 * `gamesBowled` — conditionOilMap — read through the ball's cover on this lane surface, oilFrictionField).
 * `frictionScale` (default 1, in [0.1, 10]) multiplies the friction coefficients — the cover's, or
 * `frictionOverride` — and is how a calibration from logged shots enters the model (fitCalibration).
 * `lane` (default synthetic, medium friction) is the lane surface the condition names.
 *
 * Units: as simulateShot. Edge cases: `oilMap` (already conditioned) skips building the map, so a
 * ranking shares one map among its balls; TypeError/RangeError name the function that rejected the value.
 * Example: `prepareShot({ ball, bowler, pattern }).run(20, 12).entryBoard`.
 */
export function prepareShot(
  input: {
    ball: BallSpec;
    bowler: BowlerProfile;
    pattern: OilPattern;
    gamesBowled?: number;
    frictionOverride?: number;
    frictionScale?: number;
    lane?: LaneSurface;
  },
  oilMap?: LaneOilMap,
): PreparedShot {
  return namedErrors('prepareShot', () => prepare(input, oilMap));
}

function prepare(input: Parameters<typeof prepareShot>[0], oilMap: LaneOilMap | undefined): PreparedShot {
  const fn = 'prepareShot';
  if (input === null || typeof input !== 'object') throw new TypeError(`${fn}: input must be an object, got ${String(input)}`);
  const { ball, bowler } = input;
  if (bowler === null || typeof bowler !== 'object') throw new TypeError(`${fn}: bowler must be an object, got ${String(bowler)}`);
  const hand = handSign(bowler.hand, fn);
  const inertia = ballInertia(ball);
  const scale = input.frictionScale === undefined ? 1 : assertNumber(fn, 'frictionScale', input.frictionScale, 0.1, 10);
  const lane = laneSurfaceOf(fn, input.lane);
  const cover = coverFriction(ball, lane);
  releaseState(ball, bowler, 20, 20); // validates the release once
  let field: FrictionField;
  if (input.frictionOverride !== undefined) {
    field = uniformFrictionField(
      assertNumber(
        fn,
        'frictionOverride × frictionScale',
        assertNumber(fn, 'frictionOverride', input.frictionOverride, 0, 1) * scale,
        0,
        1,
      ),
    );
  } else {
    if (input.pattern === null || typeof input.pattern !== 'object')
      throw new TypeError(`${fn}: pattern must be an object, got ${String(input.pattern)}`);
    field = oilFrictionField(oilMap ?? conditionOilMap(input.pattern, bowler, input.gamesBowled ?? 0, lane), cover, {
      frictionScale: scale,
    });
  }
  return shotOnField(ball, bowler, hand, inertia, field);
}
