import { func, record } from '../internal/checks';
import { assertNumber } from './assertNumber';
import type { DeliveryResult } from './integrateDelivery';
import type { LineTrial } from './solvePocketLine';
import { MOTION_CALIBRATION as K } from './motionCalibration';
import { PHYSICAL_CONSTANTS as C } from './physicalConstants';

/** How far a delivery may miss its line and the ball still reach the pocket. */
export interface MissRoom {
  /** Boards of miss toward the hand-side gutter (a miss "right" for a right-hander). */
  outsideBoards: number;
  /** Boards of miss toward the middle (a miss "left" for a right-hander). */
  insideBoards: number;
  /** outside + inside. */
  totalBoards: number;
}

const STEPS = [1.5, 3, 6];

/**
 * Miss room: how many boards the whole line may be missed by — the ball laid down and sent over the arrows
 * that many boards outside or inside the intended line, at the same launch angle — and still enter within
 * ±pocketHalfWidthBoards of board 17.5 at the headpin, on the lane.
 *
 * Definition: on each side the line is shifted 1.5, 3 and 6 boards until the entry leaves the window (or
 * the ball drops in the gutter); the edge is interpolated linearly between the last line inside and the first
 * outside; missRoomMaxBoards (6) is the most reported. On a pattern with a hold area a miss outside finds
 * friction and comes back and a miss inside is held by the oil, so the entry moves less than the miss; on a
 * flat pattern it moves board for board. Source: the trade's "miss room" or "area" (common practice); the
 * ±1-board window is an assumption (MOTION_CALIBRATION.pocketHalfWidthBoards).
 *
 * `onLine` is the delivery on the line itself when the caller already has it (saves one delivery). `preview`
 * (prepareShot's) reads the misses from the fast preview, shifted by its offset from the full model on the line.
 * Units: boards. Edge cases: a line that itself misses the window has 0 miss room on both sides.
 * Example: `missRoom(shot.run, 22, 13).totalBoards` → several boards on a house shot, about 2 on a flat one.
 */
export function missRoom(
  run: (laydownBoard: number, targetBoard: number) => DeliveryResult,
  laydownBoard: number,
  targetBoard: number,
  onLine?: DeliveryResult,
  preview?: (laydownBoard: number, targetBoard: number) => LineTrial,
): MissRoom {
  const fn = 'missRoom';
  func(fn, 'run', run);
  assertNumber(fn, 'laydownBoard', laydownBoard, -5, 45);
  assertNumber(fn, 'targetBoard', targetBoard, -5, 45);
  if (onLine !== undefined) assertNumber(fn, 'onLine.entryBoard', record(fn, 'onLine', onLine).entryBoard, -1e6, 1e6);
  if (preview !== undefined) func(fn, 'preview', preview);
  const w = K.pocketHalfWidthBoards;
  const here = onLine ?? run(laydownBoard, targetBoard);
  // With a preview, the misses are read from it, shifted by its offset from the full model on the line itself.
  const offset = preview ? here.entryBoard - preview(laydownBoard, targetBoard).entryBoard : 0;
  const trial = preview
    ? (l: number, t: number): LineTrial => {
        const r = preview(l, t);
        return { ...r, entryBoard: r.entryBoard + offset };
      }
    : run;
  const miss = (r: LineTrial): number => (r.gutter || !r.reachedPins ? Infinity : Math.abs(r.entryBoard - C.pocketBoard) - w);
  const m0 = miss(here);
  if (!(m0 <= 0)) return { outsideBoards: 0, insideBoards: 0, totalBoards: 0 };
  const maxB = K.missRoomMaxBoards;
  const side = (sign: number): number => {
    let lastIn = 0,
      mIn = m0;
    for (const d of STEPS) {
      if (d > maxB) break;
      const m = miss(trial(laydownBoard + sign * d, targetBoard + sign * d));
      if (m > 0) {
        if (!Number.isFinite(m)) return lastIn + (d - lastIn) / 2;
        return lastIn + ((d - lastIn) * -mIn) / (m - mIn);
      }
      lastIn = d;
      mIn = m;
    }
    return Math.min(maxB, lastIn);
  };
  const outsideBoards = side(-1),
    insideBoards = side(1);
  return { outsideBoards, insideBoards, totalBoards: outsideBoards + insideBoards };
}
