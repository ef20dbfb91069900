import type { Sweep } from '../types';

/** Number of boards a sweep covers: |toBoard − fromBoard| + 1 (lane-machine volume arithmetic, inclusive ends). */
export function boardsCovered(s: Sweep): number {
  return Math.abs(s.toBoard - s.fromBoard) + 1;
}

/** True when the sweep covers pattern board `board` (an integer board). */
export function covers(s: Sweep, board: number): boolean {
  return board >= Math.min(s.fromBoard, s.toBoard) && board <= Math.max(s.fromBoard, s.toBoard);
}

/** µL the sweep lays on each board it covers: crossings × µL per board. */
export function perBoardUl(s: Sweep): number {
  return s.crossings * s.microlitersPerBoard;
}

/** µL per board per foot the sweep lays on a covered board between its start and end. */
export function densityUlPerFt(s: Sweep): number {
  return perBoardUl(s) / (s.endFt - s.startFt);
}

/**
 * The whole board holding lateral position `board` (boards are centred on whole numbers: board b
 * spans b − 0.5 to b + 0.5; the lane spans 0.5 to 39.5). A boundary belongs to the higher board,
 * and 39.5 to board 39.
 */
export function wholeBoard(board: number): number {
  return Math.min(39, Math.floor(board + 0.5));
}

/** Oil of the (already validated) sweeps at a whole board and distance, µL per board per foot. */
export function oilAtUnchecked(sweeps: Sweep[], board: number, ft: number): number {
  let sum = 0;
  for (const s of sweeps) {
    if (ft >= s.startFt && ft < s.endFt && covers(s, board)) sum += densityUlPerFt(s);
  }
  return sum;
}
