import type { BallSpec, BowlerProfile, OilPattern, Sweep } from '../../engine/index';
import { strokerBowler, strongBall } from '../../tests/engine/motion/fixtures';

/** A forward sweep from the foul line, 60 µL per board per crossing: [from board, to board, end ft, crossings]. */
type Forward = readonly [fromBoard: number, toBoard: number, endFt: number, crossings: number];
const forward = ([fromBoard, toBoard, endFt, crossings]: Forward): Sweep => {
  const sweep: Sweep = { direction: 'forward', fromBoard, toBoard, startFt: 0, endFt, crossings, microlitersPerBoard: 60 };
  return sweep;
};

/** An invented 40 ft house-style pattern (≈ 19 mL), the condition of the motion and calibration benchmarks. */
export const BENCH_HOUSE_PATTERN: OilPattern = {
  name: 'Bench House 40',
  sweeps: (
    [
      [2, 38, 40, 2],
      [8, 32, 38, 4],
      [12, 28, 36, 6],
      [15, 25, 32, 4],
    ] as const
  ).map(forward),
};

/** The right-handed stroker of the motion tests (tests/engine/motion/fixtures.ts), also the benchmarks' bowler. */
export const BENCH_BOWLER: BowlerProfile = strokerBowler();

/** The strong asymmetric solid of the motion tests, also the benchmarks' strong ball. */
export const BENCH_STRONG_SOLID: BallSpec = strongBall();
