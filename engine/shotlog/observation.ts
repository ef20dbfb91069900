import { finite, record } from '../internal/checks';
import type { HitKind } from './types';

/**
 * Where the ball lands relative to where the bowler stands: a right-hander's ball is laid down a few boards
 * outside the slide foot (toward the hand-side gutter), so the laydown board is the feet board minus this.
 * Source: common coaching practice ("the ball lays down about 5–7 boards outside the slide foot"); the
 * calibration fits the friction scale on top of it.
 */
export const LAYDOWN_OFFSET_BOARDS = 6;

/** The laydown board of a shot from the board the bowler's feet were on (at least board 1). */
export function laydownBoardOf(feetBoard: number): number {
  return Math.max(1, finite('laydownBoardOf', 'feetBoard', feetBoard) - LAYDOWN_OFFSET_BOARDS);
}

/** The fields of a logged delivery that decide whether it says something about the ball's motion. */
export interface LoggedLine {
  delivery: number;
  feetBoard?: number | null;
  targetBoard?: number | null;
  breakpointBoard?: number | null;
  hit?: HitKind | null;
}

/**
 * A logged delivery is a calibration observation when it is a first ball (a full rack) thrown from a known feet
 * board at a known target, with its breakpoint board or its pocket result recorded.
 */
export function isCalibrationShot(s: LoggedLine): boolean {
  record('isCalibrationShot', 'shot', s);
  return s.delivery === 1 && s.feetBoard != null && s.targetBoard != null && (s.breakpointBoard != null || s.hit != null);
}
