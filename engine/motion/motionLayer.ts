import type { BallSpec, BowlerProfile, LaneSurface, LayerResult, OilPattern, RankedBall, RuleResult, Suggestion } from '../types';
import { conditionOilMap } from './conditionOilMap';
import type { LaneOilMap } from './laneOilMap';
import { missRoom, type MissRoom } from './missRoom';
import { MOTION_CALIBRATION as K } from './motionCalibration';
import { prepareShot } from './prepareShot';
import type { ShotPrediction } from './shotPrediction';
import { toShotPrediction } from './toShotPrediction';
import { solvePocketLine, type PocketLineHint } from './solvePocketLine';

/** The ball-motion layer's verdict on one ball: its score and reasons, the prediction and miss room. */
export interface MotionVerdict {
  result: LayerResult;
  prediction: ShotPrediction;
  missRoom: MissRoom;
  pocketReached: boolean;
  /** Laydown − target of the line found, boards (3 ≈ 1°). */
  launchBoards: number;
  /** Where the line search settled: passed back as `hint`, it warm-starts the search of this ball on a nearby condition. */
  settled?: PocketLineHint;
}

/** A ranked ball of rankArsenal with the ball-motion model's prediction and miss room. */
export type RankedBallWithPrediction = RankedBall & {
  prediction: ShotPrediction;
  missRoom: MissRoom;
  /** The calibrated friction multiplier the motion layer used; absent when uncalibrated. */
  frictionScale?: number;
};

/** Weight of the motion layer in rankArsenal's combined score (the fit layer has FIT_LAYER_WEIGHT; Lanewright's choice). */
export const MOTION_LAYER_WEIGHT = 0.4;

/** Points of the motion layer (Lanewright's choice; see motionLayer). */
export const MOTION_LAYER_POINTS = Object.freeze({
  base: 50,
  /** Entry angles from `angleFloorDeg` to `angleCeilingDeg` carry; below, up to `lowAngle` points are lost at 2° less. */
  angleFloorDeg: 4,
  angleCeilingDeg: 7.5,
  lowAngle: 20,
  /** Above the ceiling: points lost per degree (a steep entry leaves more splits, common practice). */
  perDegreeTooSteep: 4,
  /** Miss room: points per board above `missNeutralBoards`, up to `missCapBoards` (and lost per board below). */
  perMissBoard: 6,
  missNeutralBoards: 2,
  missCapBoards: 7,
  /** A line whose launch is more than `launchFreeBoards` from the usual one loses `perLaunchBoard` points a board (a ball that must be opened far across the lane, or thrown straight up the boards, leaves the bowler no room to adjust). */
  launchFreeBoards: 2,
  perLaunchBoard: 3,
  /** Subtracted when the pocket cannot be reached on the lane. */
  unreachable: 40,
});

const f1 = (x: number) => (Math.round(x * 10) / 10).toFixed(1);
const SRC = 'ball-motion model (rigid-body sliding and rolling on the oil map, after Frohlich, Am. J. Phys. 72, 2004)';

/**
 * The ball-motion model's verdict on one ball on one (conditioned) oil map: the ball is thrown on the line that
 * reaches the pocket (solvePocketLine: the bowler's usual launch, opened for a ball that hooks too much, the most
 * forgiving line on a pattern with a hold area) and judged by what the trade values there:
 * score = 50 + entry-angle points + miss-room points + launch points − (no line ? 40 : 0), clamped to 0–100, where
 * the entry angle carries from 4° to 7.5° (below 4° up to 20 points are lost at 2°; steeper than 7.5° loses 4
 * points a degree), miss room earns 6 points a board above 2 boards (up to 7) and loses 6 a board below, and a
 * launch more than 2 boards from the usual one (wider for a ball that hooks too early, straighter for one that
 * hooks too little) loses 3 points a board.
 * Source: about 6° carries best (USBC pin-carry research, reported second-hand); miss room is common practice;
 * the weights are Lanewright's choice. The physics is simulateShot's.
 *
 * Reasons: the line and breakpoint (with the launch it took against the usual one, and why when no line reaches
 * the pocket), the entry angle, the miss room. Suggestions: a 'line' with the solved laydown and target (not for
 * plastic spare balls). `frictionScale` (default 1) is the calibration multiplier; `hint` starts the solver from
 * a known line. Units: degrees, boards. Example: `motionLayer(ball, bowler, pattern, conditionOilMap(pattern, bowler, 0))`.
 */
export function motionLayer(
  ball: BallSpec,
  bowler: BowlerProfile,
  pattern: OilPattern,
  oilMap?: LaneOilMap,
  gamesBowled = 0,
  frictionScale = 1,
  options: { lane?: LaneSurface; hint?: PocketLineHint } = {},
): MotionVerdict {
  const map = oilMap ?? conditionOilMap(pattern, bowler, gamesBowled, options.lane);
  const shot = prepareShot({ ball, bowler, pattern, frictionScale, lane: options.lane }, map);
  const line = solvePocketLine(shot.run, {}, options.hint, shot.preview);
  const prediction = toShotPrediction(line.result, line.laydownBoard, line.targetBoard);
  const room = line.reached
    ? missRoom(shot.run, line.laydownBoard, line.targetBoard, line.result, shot.preview)
    : { outsideBoards: 0, insideBoards: 0, totalBoards: 0 };
  const P = MOTION_LAYER_POINTS;
  const reasons: RuleResult[] = [];
  const theta = prediction.entryAngleDeg;
  let anglePts = 0;
  if (theta < P.angleFloorDeg) anglePts = -Math.min(P.lowAngle, (P.lowAngle * (P.angleFloorDeg - theta)) / 2);
  else if (theta > P.angleCeilingDeg) anglePts = -P.perDegreeTooSteep * (theta - P.angleCeilingDeg);
  const missPts = line.reached ? P.perMissBoard * (Math.min(P.missCapBoards, room.totalBoards) - P.missNeutralBoards) : 0;
  const usual = K.solverFirstLaunchBoards;
  const launchOff = line.reached ? Math.max(0, Math.abs(line.launchBoards - usual) - P.launchFreeBoards) : 0;
  const launchPts = -P.perLaunchBoard * launchOff;
  const launchDeg = (b: number) => ((Math.atan2(b * (41.5 / 39), 15 * 12) * 180) / Math.PI).toFixed(1);
  if (!line.reached) {
    reasons.push({
      rule: 'motion-pocket',
      effect: -P.unreachable,
      text: `${line.reason} Closest: board ${f1(prediction.entryBoard)} at the headpin.`,
      source: `${SRC}; pocket board 17.5 (USBC pin-carry research, reported second-hand)`,
    });
  } else {
    const wider = line.launchBoards - usual;
    const launchWords =
      Math.abs(wider) < 1
        ? `at your usual launch (${launchDeg(line.launchBoards)}° out)`
        : wider > 0
          ? `only launched wider than usual (${launchDeg(line.launchBoards)}° out from deeper inside): it hooks early`
          : `thrown straighter than usual (${launchDeg(line.launchBoards)}° out): it needs the help`;
    reasons.push({
      rule: 'motion-pocket',
      effect: 0,
      text: `Reaches the pocket ${launchWords}, laid down on board ${f1(line.laydownBoard)} over board ${f1(line.targetBoard)} at the arrows; skids to ${f1(prediction.skidFt)} ft, breakpoint board ${f1(prediction.breakpoint.board)} at ${f1(prediction.breakpoint.ft)} ft${prediction.rollStartFt === null ? ', still sliding at the pins' : `, rolls from ${f1(prediction.rollStartFt)} ft`}.`,
      source: `${SRC}; pocket board 17.5 (USBC pin-carry research, reported second-hand)`,
    });
  }
  const angleWords =
    theta < P.angleFloorDeg ? 'too shallow to carry well' : theta > P.angleCeilingDeg ? 'steep: more splits' : 'in the range that carries';
  reasons.push({
    rule: 'motion-entry-angle',
    effect: Math.round(anglePts * 10) / 10,
    text: `Predicted entry angle ${f1(theta)}°: ${angleWords} (about 6° carries best).`,
    source: `${SRC}; 6° from USBC pin-carry research (reported second-hand)`,
  });
  if (line.reached) {
    const roomWords = missPts > 0 ? 'a forgiving line' : missPts < 0 ? 'little room for a miss' : 'some room for a miss';
    reasons.push({
      rule: 'motion-miss-room',
      effect: Math.round(missPts * 10) / 10,
      text: `Miss room ${f1(room.totalBoards)} boards (${f1(room.outsideBoards)} outside, ${f1(room.insideBoards)} inside) still reach the pocket: ${roomWords}.`,
      source: `${SRC}; miss room is common practice, the ±${K.pocketHalfWidthBoards}-board strike window an assumption`,
    });
  }
  if (launchOff > 0) {
    const wider = line.launchBoards > usual;
    reasons.push({
      rule: 'motion-launch',
      effect: Math.round(launchPts * 10) / 10,
      text: wider
        ? `It takes a launch ${f1(line.launchBoards - usual)} boards wider than usual to keep this ball out of the nose: it hooks too early for this condition.`
        : `It has to be thrown ${f1(usual - line.launchBoards)} boards straighter than usual to get back to the pocket: it hooks too little for this condition.`,
      source: `${SRC}; a launch of 1–3° is the usual (common practice)`,
    });
  }
  const raw = P.base + anglePts + missPts + launchPts - (line.reached ? 0 : P.unreachable);
  const score = Math.round(Math.max(0, Math.min(100, raw)) * 10) / 10;
  const suggestions: Suggestion[] =
    line.reached && ball.coverType !== 'plastic'
      ? [
          {
            kind: 'line',
            text: `Model's line: lay down on board ${f1(line.laydownBoard)} and aim over board ${f1(line.targetBoard)} at the arrows.`,
            change: { laydownBoard: Math.round(line.laydownBoard * 10) / 10, targetBoard: Math.round(line.targetBoard * 10) / 10 },
          },
        ]
      : [];
  return {
    result: { score, reasons, suggestions },
    prediction,
    missRoom: room,
    pocketReached: line.reached,
    launchBoards: line.launchBoards,
    ...(line.settled ? { settled: line.settled } : {}),
  };
}
