import type { DeliveryResult } from './integrateDelivery';
import { MOTION_CALIBRATION as K } from './motionCalibration';
import { PHYSICAL_CONSTANTS as C } from './physicalConstants';

/** How far the target at the arrows may be missed and the ball still reach the pocket. */
export interface MissRoom {
  /** Boards of target error toward the hand-side gutter (a miss "right" for a right-hander). */
  outsideBoards: number;
  /** Boards of target error toward the middle (a miss "left" for a right-hander). */
  insideBoards: number;
  /** outside + inside. */
  totalBoards: number;
}

const STEPS = [0.5, 1, 2, 4];

/**
 * Miss room: how many boards of target error at the arrows (laydown held) still put the ball within
 * ±pocketHalfWidthBoards of board 17.5 at the headpin, on the lane.
 *
 * Definition: on each side the target is moved 0.5, 1, 2, 4 boards until the entry leaves the window
 * (or the ball drops in the gutter); the edge is interpolated linearly between the last line inside and
 * the first outside; 4 boards is the most reported. Source: the trade's "miss room" (common practice);
 * the ±1-board window is an assumption (MOTION_CALIBRATION.pocketHalfWidthBoards).
 *
 * `onLine` is the delivery on the line itself when the caller already has it (saves one delivery).
 * Units: boards. Edge cases: a line that itself misses the window has 0 miss room on both sides.
 * Example: `missRoom(shot.run, 15, 10).totalBoards` → about 1–2 boards for a strong ball on a flat pattern.
 */
export function missRoom(
  run: (laydownBoard: number, targetBoard: number) => DeliveryResult,
  laydownBoard: number,
  targetBoard: number,
  onLine?: DeliveryResult,
): MissRoom {
  const w = K.pocketHalfWidthBoards;
  const miss = (r: DeliveryResult): number => (r.gutter || !r.reachedPins ? Infinity : Math.abs(r.entryBoard - C.pocketBoard) - w);
  const m0 = miss(onLine ?? run(laydownBoard, targetBoard));
  if (!(m0 <= 0)) return { outsideBoards: 0, insideBoards: 0, totalBoards: 0 };
  const side = (sign: number): number => {
    let lastIn = 0, mIn = m0;
    for (const d of STEPS) {
      const m = miss(run(laydownBoard, targetBoard + sign * d));
      if (m > 0) {
        if (!Number.isFinite(m)) return lastIn + (d - lastIn) / 2;
        return lastIn + ((d - lastIn) * -mIn) / (m - mIn);
      }
      lastIn = d; mIn = m;
    }
    return STEPS[STEPS.length - 1];
  };
  const outsideBoards = side(-1), insideBoards = side(1);
  return { outsideBoards, insideBoards, totalBoards: outsideBoards + insideBoards };
}
