import type { BallSpec, BowlerProfile, LayerResult, OilPattern, RankedBall, RuleResult, Suggestion } from '../types';
import { conditionOilMap } from './conditionOilMap';
import type { LaneOilMap } from './laneOilMap';
import { missRoom, type MissRoom } from './missRoom';
import { MOTION_CALIBRATION as K } from './motionCalibration';
import { prepareShot } from './prepareShot';
import type { ShotPrediction } from './shotPrediction';
import { toShotPrediction } from './toShotPrediction';
import { solvePocketLine } from './solvePocketLine';

/** The ball-motion layer's verdict on one ball: its score and reasons, the prediction and miss room. */
export interface MotionVerdict {
  result: LayerResult;
  prediction: ShotPrediction;
  missRoom: MissRoom;
  pocketReached: boolean;
}

/** A ranked ball of rankArsenal with the ball-motion model's prediction and miss room (issue 4). */
export type RankedBallWithPrediction = RankedBall & {
  prediction: ShotPrediction;
  missRoom: MissRoom;
  /** The calibrated friction multiplier the motion layer used (issue 7); absent when uncalibrated. */
  frictionScale?: number;
};

/** Weight of the motion layer in rankArsenal's combined score (the rules layer has 1; Lanewright's choice). */
export const MOTION_LAYER_WEIGHT = 1;

/** Points of the motion layer (Lanewright's choice; see motionLayer). */
export const MOTION_LAYER_POINTS = Object.freeze({
  base: 50,
  /** At the ideal entry angle; falls linearly to 0 at 3° away and to −maxAngle beyond. */
  maxAngle: 25,
  angleScaleDeg: 3,
  /** Per board of total miss room, up to missCapBoards. */
  perMissBoard: 8,
  missCapBoards: 3,
  /** Subtracted when the pocket cannot be reached on the lane. */
  unreachable: 40,
});

/**
 * The ball-motion model's score for one ball on one (conditioned) oil map: the ball is thrown on the
 * line that reaches the pocket (solvePocketLine) and judged by
 * score = 50 + angle points + miss-room points − (unreachable ? 40 : 0), clamped to 0–100, where
 * angle points = 25·(1 − |θ − 6°| / 3°) (clamped to ±25; 6° carries best, TRADE.md §2.2, S) and
 * miss-room points = 8 per board of miss room up to 3 boards, minus 8 (so no miss room costs points).
 * Source: the weights are Lanewright's choice (common practice ranks angle, reachability and
 * forgiveness); the physics is simulateShot's (PHYSICS.md §1, §4, §5).
 *
 * Suggestions: a 'line' suggestion with the solved laydown and target (not for plastic spare balls).
 * Units: degrees, boards. Edge cases: a ball that cannot reach the pocket keeps its closest line; its
 * miss room is 0 and it gets no line suggestion. `frictionScale` (default 1) is the calibration multiplier of
 * the ball's friction coefficients (prepareShot; fitted by fitCalibration). Example: `motionLayer(ball, bowler, pattern, conditionOilMap(pattern, bowler, 0))`.
 */
export function motionLayer(ball: BallSpec, bowler: BowlerProfile, pattern: OilPattern, oilMap?: LaneOilMap, gamesBowled = 0, frictionScale = 1): MotionVerdict {
  const map = oilMap ?? conditionOilMap(pattern, bowler, gamesBowled);
  const shot = prepareShot({ ball, bowler, pattern, frictionScale }, map);
  const line = solvePocketLine(shot.run, {});
  const prediction = toShotPrediction(line.result, line.laydownBoard, line.targetBoard);
  const room = line.reached ? missRoom(shot.run, line.laydownBoard, line.targetBoard, line.result) : { outsideBoards: 0, insideBoards: 0, totalBoards: 0 };
  const P = MOTION_LAYER_POINTS;
  const src = 'ball-motion model (engine/motion, PHYSICS.md §1, §4, §5)';
  const reasons: RuleResult[] = [];
  const theta = prediction.entryAngleDeg;
  const anglePts = Math.max(-P.maxAngle, Math.min(P.maxAngle, P.maxAngle * (1 - Math.abs(theta - K.idealEntryAngleDeg) / P.angleScaleDeg)));
  const missPts = P.perMissBoard * Math.min(P.missCapBoards, room.totalBoards) - P.perMissBoard;
  const f1 = (x: number) => (Math.round(x * 10) / 10).toFixed(1);
  if (!line.reached) {
    reasons.push({ rule: 'motion-pocket', effect: -P.unreachable, text: `The model finds no line on which this ball reaches the pocket (closest: board ${f1(prediction.entryBoard)} at the headpin).`, source: `${src}; pocket board 17.5, TRADE.md §2.2` });
  } else {
    reasons.push({ rule: 'motion-pocket', effect: 0, text: `Reaches the pocket laid down on board ${f1(line.laydownBoard)} over board ${f1(line.targetBoard)} at the arrows; breakpoint board ${f1(prediction.breakpoint.board)} at ${f1(prediction.breakpoint.ft)} ft.`, source: `${src}; pocket board 17.5, TRADE.md §2.2` });
  }
  reasons.push({ rule: 'motion-entry-angle', effect: Math.round(anglePts * 10) / 10, text: `Predicted entry angle ${f1(theta)}° (about 6° carries best).`, source: `${src}; 6° from USBC pin-carry research, TRADE.md §2.2 (S)` });
  if (line.reached) reasons.push({ rule: 'motion-miss-room', effect: Math.round(missPts * 10) / 10, text: `Miss room ${f1(room.totalBoards)} boards at the arrows (${f1(room.outsideBoards)} outside, ${f1(room.insideBoards)} inside) still reach the pocket.`, source: `${src}; miss room is common practice, ±${K.pocketHalfWidthBoards} board window an assumption` });
  const raw = P.base + anglePts + (line.reached ? missPts : -P.unreachable);
  const score = Math.round(Math.max(0, Math.min(100, raw)) * 10) / 10;
  const suggestions: Suggestion[] = line.reached && ball.coverType !== 'plastic'
    ? [{ kind: 'line', text: `Ball-motion model: lay down on board ${f1(line.laydownBoard)} and aim over board ${f1(line.targetBoard)} at the arrows to reach the pocket.`, change: { laydownBoard: Math.round(line.laydownBoard * 10) / 10, targetBoard: Math.round(line.targetBoard * 10) / 10 } }]
    : [];
  return { result: { score, reasons, suggestions }, prediction, missRoom: room, pocketReached: line.reached };
}
