import type { BallSpec, BowlerProfile } from '../../../engine/types';

/** An isotropic ball of PHYSICS.md §3.3's common settings: m = 7.257 kg, R = 4.25 in, RG `rg` in. */
export function isotropicBall(rg: number, extra: Partial<BallSpec> = {}): BallSpec {
  return {
    weightLb: 7.257 / 0.45359237, diameterIn: 8.5, rg, differential: 0, intermediateDifferential: 0,
    coverType: 'reactive-solid', surfaceGrit: 2000, polished: false, ...extra,
  };
}

/** An invented asymmetric test ball (no real product): RG 2.50, differential 0.055, intermediate 0.015. */
export function asymmetricBall(extra: Partial<BallSpec> = {}): BallSpec {
  return {
    weightLb: 15, diameterIn: 8.5, rg: 2.5, differential: 0.055, intermediateDifferential: 0.015,
    coverType: 'reactive-solid', surfaceGrit: 2000, polished: false, layout: { pinToPapIn: 3.4, valAngleDeg: 50 }, ...extra,
  };
}

/** PHYSICS.md §3.3 release: v₀ = 8 m/s, 300 rpm, 45° rotation, 15° tilt, right hand. */
export function referenceBowler(extra: Partial<BowlerProfile> = {}): BowlerProfile {
  return { hand: 'right', speedMph: 8 / 0.44704, revRpm: 300, axisRotationDeg: 45, axisTiltDeg: 15, ...extra };
}

/** Board offset for a lateral displacement in mm (board = 41.5/39 in = 27.0281 mm, TRADE.md conventions). */
export const MM_PER_BOARD = (41.5 / 39) * 25.4;

/** Launch boards (laydown, target) for a heading ψ in degrees from board 20 (PHYSICS.md §3.3 "heading"). */
export function linePsi(psiDeg: number): [number, number] {
  const dBoards = (Math.tan((psiDeg * Math.PI) / 180) * 15 * 304.8) / MM_PER_BOARD;
  return [20, 20 + dBoards];
}
