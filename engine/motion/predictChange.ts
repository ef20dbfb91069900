import type { BallSpec, BowlerProfile, LaneSurface, OilPattern } from '../types';
import { validateBallSpec } from '../validateBallSpec';
import { conditionOilMap } from './conditionOilMap';
import { laneSurfaceOf } from './laneSurfaceOf';
import { prepareShot } from './prepareShot';
import type { ShotPrediction } from './shotPrediction';
import { solvePocketLine } from './solvePocketLine';
import { toShotPrediction } from './toShotPrediction';

/** What a change to a ball (a surface, a layout) does, in the ball-motion model. */
export interface ChangePrediction {
  /** The ball as it is, on its pocket line (the same prediction rankArsenal gives it). */
  before: ShotPrediction;
  /** The changed ball thrown on the same line as before: what the bowler sees if they keep their line. */
  sameLine: ShotPrediction;
  /** The changed ball on its own pocket line: where the bowler would move to. */
  newLine: ShotPrediction;
  /** sameLine breakpoint − before breakpoint, ft (positive = later). */
  breakpointShiftFt: number;
  /** sameLine skid end − before skid end, ft. */
  skidShiftFt: number;
  /** sameLine entry board − before entry board (positive = more hook, toward the headpin). */
  entryBoardShift: number;
  /** newLine entry angle − before entry angle, degrees. */
  entryAngleChangeDeg: number;
}

/**
 * What a change to a ball does in the ball-motion model, read the way a bowler reads it: the ball as it is on its
 * pocket line; the changed ball on that same line (so the breakpoint and skid shifts are the change's own, not a
 * change of line); and the changed ball on its own pocket line (where to move, and the entry angle there). Every
 * screen that shows a what-if (the matchup's what-if, the coach's side-by-side, the pro-shop order) calls this,
 * so they show the same numbers as the ranking.
 *
 * Definition: before = the pocket line of `ball` (solvePocketLine) on the oil map after `gamesBowled` on `lane`,
 * with `frictionScale`; sameLine = `{ ...ball, ...change }` on before's laydown and target; newLine = the pocket
 * line of the changed ball. Source: the ball-motion model (engine/motion/README.md).
 * Units: ft, boards, degrees. Edge cases: a change that makes the ball illegal is still predicted (legality is the
 * ranking's business); a changed ball that cannot reach the pocket returns its closest line.
 *
 * @example
 * predictChange({ ball, change: { surfaceGrit: 4000 }, bowler, pattern }).breakpointShiftFt; // => about +3 (later)
 */
export function predictChange(input: {
  ball: BallSpec;
  change: Partial<BallSpec>;
  bowler: BowlerProfile;
  pattern: OilPattern;
  gamesBowled?: number;
  lane?: LaneSurface;
  frictionScale?: number;
}): ChangePrediction {
  const fn = 'predictChange';
  if (input === null || typeof input !== 'object') throw new TypeError(`${fn}: input must be an object, got ${String(input)}`);
  validateBallSpec(input.ball, fn);
  if (input.change === null || typeof input.change !== 'object')
    throw new TypeError(`${fn}: change must be an object, got ${String(input.change)}`);
  const changed = { ...input.ball, ...input.change } as BallSpec;
  validateBallSpec(changed, fn);
  const lane = laneSurfaceOf(fn, input.lane);
  const map = conditionOilMap(input.pattern, input.bowler, input.gamesBowled ?? 0, lane);
  const common = { bowler: input.bowler, pattern: input.pattern, frictionScale: input.frictionScale, lane };
  const a = prepareShot({ ball: input.ball, ...common }, map);
  const la = solvePocketLine(a.run, {}, {}, a.preview);
  const before = toShotPrediction(la.result, la.laydownBoard, la.targetBoard);
  const b = prepareShot({ ball: changed, ...common }, map);
  const sameLine = toShotPrediction(b.run(la.laydownBoard, la.targetBoard), la.laydownBoard, la.targetBoard);
  const lb = solvePocketLine(b.run, {}, {}, b.preview);
  const newLine = toShotPrediction(lb.result, lb.laydownBoard, lb.targetBoard);
  const r1 = (x: number) => Math.round(x * 10) / 10 || 0;
  return {
    before,
    sameLine,
    newLine,
    breakpointShiftFt: r1(sameLine.breakpoint.ft - before.breakpoint.ft),
    skidShiftFt: r1(sameLine.skidFt - before.skidFt),
    entryBoardShift: r1(sameLine.entryBoard - before.entryBoard),
    entryAngleChangeDeg: r1(newLine.entryAngleDeg - before.entryAngleDeg),
  };
}
