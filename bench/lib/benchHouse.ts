import type { BallSpec, BowlerProfile, OilPattern, Sweep } from '../../engine/index';

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

/** The right-handed bowler of the motion and calibration benchmarks. */
export const BENCH_BOWLER: BowlerProfile = { hand: 'right', speedMph: 17.5, revRpm: 320, axisRotationDeg: 45, axisTiltDeg: 12 };

/** The strong solid ball of the motion and calibration benchmarks. */
export const BENCH_STRONG_SOLID: BallSpec = {
  weightLb: 15,
  rg: 2.49,
  differential: 0.052,
  intermediateDifferential: 0.014,
  coverType: 'reactive-solid',
  surfaceGrit: 2000,
  polished: false,
  layout: { pinToPapIn: 3.4, valAngleDeg: 45 },
};
