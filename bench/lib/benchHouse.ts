import type { BowlerProfile, OilPattern, Sweep } from '../../engine/index';

/** A forward sweep from the foul line, 60 µL per board per crossing. */
const sweep = (fromBoard: number, toBoard: number, endFt: number, crossings: number): Sweep => ({
  direction: 'forward',
  fromBoard,
  toBoard,
  startFt: 0,
  endFt,
  crossings,
  microlitersPerBoard: 60,
});

/** An invented 40 ft house-style pattern (≈ 19 mL), the condition of the motion and calibration benchmarks. */
export const BENCH_HOUSE_PATTERN: OilPattern = {
  name: 'Bench House 40',
  sweeps: [sweep(2, 38, 40, 2), sweep(8, 32, 38, 4), sweep(12, 28, 36, 6), sweep(15, 25, 32, 4)],
};

/** The right-handed bowler of the motion and calibration benchmarks. */
export const BENCH_BOWLER: BowlerProfile = { hand: 'right', speedMph: 17.5, revRpm: 320, axisRotationDeg: 45, axisTiltDeg: 12 };
