// Shared test fixtures for the engine tests (not a test file). Every pattern's numbers are worked
// out by hand in the test that uses it; every ball is invented.
import type { ArsenalBall, BowlerProfile, OilPattern, Sweep } from '../../engine/index';

/** A sweep of `crossings` × `ul` µL per board on boards from–to, spread over startFt–endFt. */
export function sweep(
  fromBoard: number,
  toBoard: number,
  endFt: number,
  crossings: number,
  ul = 50,
  direction: Sweep['direction'] = 'forward',
  startFt = 0,
): Sweep {
  return { direction, fromBoard, toBoard, startFt, endFt, crossings, microlitersPerBoard: ul };
}

/**
 * worked example of the lane-machine arithmetic as a pattern: pass A 37 boards × 1, pass B 25 boards × 4, pass C
 * 17 boards × 6, 50 µL per board each → 239 crossings × 50 µL = 11.95 mL.
 * A: boards 2–38, 0–38 ft, forward. B: boards 8–32, 0–34 ft, reverse. C: boards 12–28, 2–30 ft, forward.
 */
export const workedExample: OilPattern = {
  name: 'Harrow Bay worked example',
  sweeps: [sweep(2, 38, 38, 1), sweep(8, 32, 34, 4, 50, 'reverse'), sweep(12, 28, 30, 6, 50, 'forward', 2)],
};

/**
 * A long, heavy, flat pattern: boards 1–39 × 10 crossings × 60 µL over 0–44 ft (forward) and
 * boards 10–30 × 5 × 60 µL over 0–40 ft (reverse) → 23.4 + 6.3 = 29.7 mL, ratio 900 ÷ 600 = 1.5.
 */
export const longHeavy: OilPattern = {
  name: 'Copperline long heavy',
  sweeps: [sweep(1, 39, 44, 10, 60), sweep(10, 30, 40, 5, 60, 'reverse')],
};

/**
 * A short, light pattern: boards 3–37 × 3 × 80 µL over 0–35 ft, boards 10–30 × 4 × 80 µL over
 * 0–33 ft (reverse) → 35 × 240 + 21 × 320 = 8400 + 6720 µL = 15.12 mL; middle 560 µL ÷ outside
 * 240 µL = 2.33; 35 ft (short), light, sport.
 */
export const shortLight: OilPattern = {
  name: 'Copperline short light',
  sweeps: [sweep(3, 37, 35, 3, 80), sweep(10, 30, 33, 4, 80, 'reverse')],
};

/**
 * A fresh, high-friction house shot: boards 3–37 × 2 × 70 µL over 0–40 ft, boards 10–30 × 6 ×
 * 70 µL over 0–38 ft (reverse), boards 14–26 × 6 × 70 µL over 0–36 ft → 4900 + 8820 + 5460 µL =
 * 19.18 mL (light); middle (2 + 6 + 6) × 70 = 980 µL ÷ outside 2 × 70 = 140 µL = 7 (recreation);
 * 40 ft (medium).
 */
export const houseShot: OilPattern = {
  name: 'Copperline house',
  sweeps: [sweep(3, 37, 40, 2, 70), sweep(10, 30, 38, 6, 70, 'reverse'), sweep(14, 26, 36, 6, 70)],
};

/** A right-handed bowler in the middle of common practice's typical ranges. */
export const typicalBowler: BowlerProfile = {
  hand: 'right',
  speedMph: 17,
  revRpm: 350,
  axisRotationDeg: 45,
  axisTiltDeg: 15,
};

/** Invented balls of the makers "Kestrel Works" and "Ironbark" (Lanewright's demo names). */
export const roughAsymSolid: ArsenalBall = {
  id: 'kestrel-nightjar',
  weightLb: 15,
  rg: 2.48,
  differential: 0.055,
  intermediateDifferential: 0.018,
  coverType: 'reactive-solid',
  surfaceGrit: 500,
  polished: false,
  layout: { pinToPapIn: 3.375 },
};

export const polishedPearl: ArsenalBall = {
  id: 'ironbark-glint',
  weightLb: 15,
  rg: 2.55,
  differential: 0.045,
  intermediateDifferential: 0.008,
  coverType: 'reactive-pearl',
  surfaceGrit: 2000,
  polished: true,
  layout: { pinToPapIn: 4 },
};

export const urethaneBall: ArsenalBall = {
  id: 'kestrel-loam',
  weightLb: 15,
  rg: 2.62,
  differential: 0.025,
  intermediateDifferential: 0,
  coverType: 'urethane',
  surfaceGrit: 2000,
  polished: false,
  layout: { pinToPapIn: 4 },
};

export const plasticBall: ArsenalBall = {
  id: 'ironbark-pebble',
  weightLb: 15,
  rg: 2.68,
  differential: 0.01,
  intermediateDifferential: 0,
  coverType: 'plastic',
  surfaceGrit: 2000,
  polished: true,
};

export const fourBalls: ArsenalBall[] = [plasticBall, urethaneBall, polishedPearl, roughAsymSolid];
