import type { BallSpec, BowlerProfile } from '../../../engine/types';

/** An isotropic ball of the two-zone closed form's common settings: m = 7.257 kg, R = 4.25 in, RG `rg` in. */
export function isotropicBall(rg: number, extra: Partial<BallSpec> = {}): BallSpec {
  return {
    weightLb: 7.257 / 0.45359237,
    diameterIn: 8.5,
    rg,
    differential: 0,
    intermediateDifferential: 0,
    coverType: 'reactive-solid',
    surfaceGrit: 2000,
    polished: false,
    ...extra,
  };
}

/** An invented asymmetric test ball (no real product): RG 2.50, differential 0.055, intermediate 0.015. */
export function asymmetricBall(extra: Partial<BallSpec> = {}): BallSpec {
  return {
    weightLb: 15,
    diameterIn: 8.5,
    rg: 2.5,
    differential: 0.055,
    intermediateDifferential: 0.015,
    coverType: 'reactive-solid',
    surfaceGrit: 2000,
    polished: false,
    layout: { pinToPapIn: 3.4, valAngleDeg: 50 },
    ...extra,
  };
}

/** The two-zone closed form's release: v₀ = 8 m/s, 300 rpm, 45° rotation, 15° tilt, right hand. */
export function referenceBowler(extra: Partial<BowlerProfile> = {}): BowlerProfile {
  return { hand: 'right', speedMph: 8 / 0.44704, revRpm: 300, axisRotationDeg: 45, axisTiltDeg: 15, ...extra };
}

/** Board offset for a lateral displacement in mm (board = 41.5/39 in = 27.0281 mm, Lanewright's conventions). */
export const MM_PER_BOARD = (41.5 / 39) * 25.4;

/** Launch boards (laydown, target) for a heading ψ in degrees from board 20 (the closed form's heading). */
export function linePsi(psiDeg: number): [number, number] {
  const dBoards = (Math.tan((psiDeg * Math.PI) / 180) * 15 * 304.8) / MM_PER_BOARD;
  return [20, 20 + dBoards];
}

import type { OilPattern, Sweep } from '../../../engine/types';

function sweep(fromBoard: number, toBoard: number, endFt: number, crossings: number, ul = 60): Sweep {
  return { direction: 'forward', fromBoard, toBoard, startFt: 0, endFt, crossings, microlitersPerBoard: ul };
}

/** An invented house-style pattern, 40 ft, ≈ 19 mL, heavy in the middle (names invented). */
export function housePattern(scale = 1, lengthFt = 40): OilPattern {
  const k = lengthFt / 40;
  return {
    name: 'Test House 40',
    sweeps: [
      sweep(2, 38, 40 * k, 2, 60 * scale),
      sweep(8, 32, 38 * k, 4, 60 * scale),
      sweep(12, 28, 36 * k, 6, 60 * scale),
      sweep(15, 25, 32 * k, 4, 60 * scale),
    ],
  };
}

/** The same pattern with boards mirrored (b → 40 − b). */
export function mirroredPattern(p: OilPattern): OilPattern {
  return { name: `${p.name} mirrored`, sweeps: p.sweeps.map((s) => ({ ...s, fromBoard: 40 - s.toBoard, toBoard: 40 - s.fromBoard })) };
}

/** An invented flat (sport-like) pattern: the same oil on every board, 42 ft. */
export function flatPattern(ulPerBoard = 50, crossings = 8, lengthFt = 42): OilPattern {
  return { name: 'Test Flat 42', sweeps: [sweep(1, 39, lengthFt, crossings, ulPerBoard)] };
}

/** An invented strong asymmetric reactive solid for the bowler-level tests. */
export function strongBall(extra: Partial<BallSpec> = {}): BallSpec {
  return {
    weightLb: 15,
    rg: 2.49,
    differential: 0.052,
    intermediateDifferential: 0.014,
    coverType: 'reactive-solid',
    surfaceGrit: 2000,
    polished: false,
    layout: { pinToPapIn: 3.4, valAngleDeg: 45 },
    ...extra,
  };
}

/** A typical right-handed stroker (common practice typical values). */
export function strokerBowler(extra: Partial<BowlerProfile> = {}): BowlerProfile {
  return { hand: 'right', speedMph: 17.5, revRpm: 320, axisRotationDeg: 45, axisTiltDeg: 12, ...extra };
}

/** Fifteen invented balls from strong to weak (no real products). */
export function fifteenBalls(): (BallSpec & { id: string })[] {
  const b = (id: string, o: Partial<BallSpec>): BallSpec & { id: string } => ({ ...strongBall(o), id });
  return [
    b('solid-500', { surfaceGrit: 500 }),
    b('solid-1000', { surfaceGrit: 1000 }),
    b('solid-2000', {}),
    b('solid-3000', { surfaceGrit: 3000 }),
    b('hybrid-2000', { coverType: 'reactive-hybrid', rg: 2.52, differential: 0.046, intermediateDifferential: 0.008 }),
    b('hybrid-polished', {
      coverType: 'reactive-hybrid',
      rg: 2.52,
      differential: 0.046,
      intermediateDifferential: 0.008,
      surfaceGrit: 1500,
      polished: true,
    }),
    b('pearl-2000', { coverType: 'reactive-pearl', rg: 2.55, differential: 0.045, intermediateDifferential: 0 }),
    b('pearl-polished', {
      coverType: 'reactive-pearl',
      rg: 2.55,
      differential: 0.045,
      intermediateDifferential: 0,
      surfaceGrit: 1500,
      polished: true,
    }),
    b('pearl-weak', {
      coverType: 'reactive-pearl',
      rg: 2.6,
      differential: 0.025,
      intermediateDifferential: 0,
      surfaceGrit: 3000,
      polished: true,
      layout: { pinToPapIn: 5.5 },
    }),
    b('solid-symmetric', { rg: 2.54, differential: 0.048, intermediateDifferential: 0, surfaceGrit: 2000 }),
    b('solid-lowdiff', { rg: 2.58, differential: 0.02, intermediateDifferential: 0, surfaceGrit: 3000 }),
    b('urethane-1000', { coverType: 'urethane', rg: 2.6, differential: 0.02, intermediateDifferential: 0, surfaceGrit: 1000 }),
    b('urethane-2000', { coverType: 'urethane', rg: 2.65, differential: 0.015, intermediateDifferential: 0, surfaceGrit: 2000 }),
    b('hybrid-long', {
      coverType: 'reactive-hybrid',
      rg: 2.62,
      differential: 0.035,
      intermediateDifferential: 0,
      surfaceGrit: 4000,
      polished: true,
    }),
    b('plastic-spare', {
      coverType: 'plastic',
      rg: 2.7,
      differential: 0.008,
      intermediateDifferential: 0,
      surfaceGrit: 4000,
      polished: true,
      layout: { pinToPapIn: 1 },
    }),
  ];
}
