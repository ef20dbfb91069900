/**
 * Public engine types: how a bowler releases the ball.
 * Units: feet from the foul line, boards (1–39), inches, lb, mph, rpm, degrees, mL and µL.
 */

/** How a bowler releases the ball. */
export interface BowlerProfile {
  hand: 'right' | 'left';
  speedMph: number;
  revRpm: number;
  /** 0 = end-over-end forward roll, 90 = pure side spin. */
  axisRotationDeg: number;
  /** 0 = horizontal axis. */
  axisTiltDeg: number;
  papRightIn?: number;
  papUpIn?: number;
}
