import type { BallSpec, BowlerProfile } from '../types';
import { assertNumber } from './assertNumber';
import { handSign } from './handSign';
import { layoutOrientation } from './layoutOrientation';
import { MOTION_CALIBRATION as K } from './motionCalibration';
import { PHYSICAL_CONSTANTS as C } from './physicalConstants';

/** Index of each quantity in a delivery state vector (lane frame, SI). */
export const STATE = Object.freeze({ x: 0, y: 1, vx: 2, vy: 3, wx: 4, wy: 5, wz: 6, qw: 7, qx: 8, qy: 9, qz: 10, length: 11 });

/**
 * The state of the ball at the foul line: position, velocity, angular velocity and orientation.
 *
 * Definition (the release model (engine/motion/README.md)): the ball is laid down on `laydownBoard` at the foul line (x = 0) and
 * heads straight for `targetBoard` at the arrows (15 ft) — heading ψ = atan(Δy / 15 ft). Speed V =
 * `speedMph` (taken as the release speed), |ω| = 2π·rpm/60, and in the travel frame
 * ω = |ω|(−h cos φ sin θ, cos φ cos θ, h sin φ) with θ = axis rotation (0 = end-over-end,
 * engine/types.ts) and φ = axis tilt, then turned by ψ about ẑ. The PAP is the axis end on the bowler's
 * side, −h·ω̂; the layout (pin-to-PAP ÷ R, VAL angle) fixes q₀ via `layoutOrientation`. Lane frame:
 * x down the lane, y to the bowler's left, boards from the right-hand gutter at y = (b − 20)·board; a
 * left-hander's hand board b is pattern board 40 − b, so y = h·(b − 20)·board.
 *
 * Units: boards, mph, rpm, degrees in; SI state out (see `STATE`). Edge cases: speed must be in
 * [3, 40] mph, revs in [0, 1000] rpm (BOWLER_BOUNDS of the first layer), rotation and tilt in [0, 90]°, boards in [−5, 45];
 * `papRightIn`/`papUpIn` are not used (the layout is given relative to the PAP).
 * Example: a right-hander at 17.9 mph, 300 rpm, 45°/15° laid down on 20 aiming at 20 has
 * v = (8.0, 0) m/s and ω ≈ (−21.4, 21.4, 8.13) rad/s.
 */
export function releaseState(ball: BallSpec, bowler: BowlerProfile, laydownBoard: number, targetBoard: number): Float64Array {
  const fn = 'releaseState';
  if (bowler === null || typeof bowler !== 'object') throw new TypeError(`${fn}: bowler must be an object, got ${String(bowler)}`);
  const h = handSign(bowler.hand, fn);
  const V = assertNumber(fn, 'speedMph', bowler.speedMph, 3, 40) * C.mphMs;
  const rpm = assertNumber(fn, 'revRpm', bowler.revRpm, 0, 1000);
  const theta = (assertNumber(fn, 'axisRotationDeg', bowler.axisRotationDeg, 0, 90) * Math.PI) / 180;
  const phi = (assertNumber(fn, 'axisTiltDeg', bowler.axisTiltDeg, 0, 90) * Math.PI) / 180;
  assertNumber(fn, 'laydownBoard', laydownBoard, -5, 45);
  assertNumber(fn, 'targetBoard', targetBoard, -5, 45);
  const bw = C.boardWidthM;
  const y0 = h * (laydownBoard - C.centreBoard) * bw;
  const yt = h * (targetBoard - C.centreBoard) * bw;
  const psi = Math.atan2(yt - y0, C.arrowsFt * C.footM);
  const cp = Math.cos(psi),
    sp = Math.sin(psi);
  const w = (2 * Math.PI * rpm) / 60;
  // travel frame (the release model (engine/motion/README.md))
  const ax = -h * Math.cos(phi) * Math.sin(theta),
    ay = Math.cos(phi) * Math.cos(theta),
    az = h * Math.sin(phi);
  // rotate by ψ about z
  const wxh = cp * ax - sp * ay,
    wyh = sp * ax + cp * ay,
    wzh = az;
  const layout = ball.layout;
  const R = (ball.diameterIn ?? C.defaultDiameterIn) / 2;
  const pinToPap = assertNumber(fn, 'layout.pinToPapIn', layout?.pinToPapIn ?? K.defaultPinToPapIn, 0, Math.PI * R);
  const valDeg = layout?.valAngleDeg ?? layout?.drillingAngleDeg ?? K.defaultValAngleDeg;
  assertNumber(fn, 'layout.valAngleDeg', valDeg, -360, 360);
  const q = layoutOrientation([-h * wxh, -h * wyh, -h * wzh], pinToPap / R, (valDeg * Math.PI) / 180, h);
  const s = new Float64Array(STATE.length);
  s[STATE.x] = 0;
  s[STATE.y] = y0;
  s[STATE.vx] = V * cp;
  s[STATE.vy] = V * sp;
  s[STATE.wx] = w * wxh;
  s[STATE.wy] = w * wyh;
  s[STATE.wz] = w * wzh;
  s[STATE.qw] = q[0];
  s[STATE.qx] = q[1];
  s[STATE.qy] = q[2];
  s[STATE.qz] = q[3];
  return s;
}
