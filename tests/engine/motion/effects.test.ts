import { describe, expect, it } from 'vitest';
import { ballInertia, conditionOilMap, coverFriction, integrateDelivery, oilFrictionField, releaseState } from '../../../engine/index';
import type { BallSpec, OilPattern } from '../../../engine/index';
import { flatPattern, housePattern, strokerBowler, strongBall } from './fixtures';

// How large each mass-distribution effect comes out (engine/motion/README.md "Effect sizes"):
// A rigid-body prototype study found that the bare rigid body moves the path by about half a board and the axis
// migrates 4–7 in on the surface; the differential matters through friction (carried oil,
// fresh cover rotated into contact by flare).

const bowler = strokerBowler();
const unitBodyOmega = (s: Float64Array): [number, number, number] => {
  const [qw, qx, qy, qz] = [s[7], s[8], s[9], s[10]];
  const wx = s[4],
    wy = s[5],
    wz = s[6];
  const v: [number, number, number] = [
    (1 - 2 * (qy * qy + qz * qz)) * wx + 2 * (qx * qy + qw * qz) * wy + 2 * (qx * qz - qw * qy) * wz,
    2 * (qx * qy - qw * qz) * wx + (1 - 2 * (qx * qx + qz * qz)) * wy + 2 * (qy * qz + qw * qx) * wz,
    2 * (qx * qz + qw * qy) * wx + 2 * (qy * qz - qw * qx) * wy + (1 - 2 * (qx * qx + qy * qy)) * wz,
  ];
  const n = Math.hypot(...v);
  return [v[0] / n, v[1] / n, v[2] / n];
};

function throwOn(ball: BallSpec, pattern: OilPattern, laydown: number, target: number, carriedOil: boolean) {
  const I = ballInertia(ball);
  const field = oilFrictionField(conditionOilMap(pattern, bowler, 0), coverFriction(ball), { carriedOil });
  const s0 = releaseState(ball, bowler, laydown, target);
  const w0 = unitBodyOmega(s0);
  let w = w0;
  const r = integrateDelivery(s0, I, field, {
    hand: 1,
    onStep: (_t, s) => {
      w = unitBodyOmega(s);
    },
  });
  const migrationIn = Math.acos(Math.min(1, w0[0] * w[0] + w0[1] * w[1] + w0[2] * w[2])) * ((ball.diameterIn ?? 8.5) / 2);
  return { entry: r.entryBoard, migrationIn };
}

const flaring = strongBall({ differential: 0.058, intermediateDifferential: 0 });
const lowDiff = strongBall({ differential: 0.01, intermediateDifferential: 0 });
const pinOnAxis = strongBall({ differential: 0.058, intermediateDifferential: 0, layout: { pinToPapIn: 0.3 } });

describe.each([
  ['flat 42 ft', flatPattern(), 15, 10],
  ['house 40 ft', housePattern(), 13, 6.2],
] as const)('mass-distribution effects on the %s pattern', (_name, pattern, laydown, target) => {
  it('in, differential 0.058 in with the pin 3.4 in from the PAP: the axis migrates 4–7.5 in over the ball surface (a rigid-body prototype study: 4–7 in), under 1 in with the pin on the axis (the prototype study)', () => {
    expect(throwOn(flaring, pattern, laydown, target, false).migrationIn).toBeGreaterThanOrEqual(4);
    expect(throwOn(flaring, pattern, laydown, target, false).migrationIn).toBeLessThanOrEqual(7.5);
    expect(throwOn(pinOnAxis, pattern, laydown, target, false).migrationIn).toBeLessThan(1);
  });

  it('boards, bare rigid body (no carried oil): differential 0.058 vs 0.010 moves the entry board by under half a board (Euler’s equations alone)', () => {
    const d = throwOn(flaring, pattern, laydown, target, false).entry - throwOn(lowDiff, pattern, laydown, target, false).entry;
    expect(Math.abs(d)).toBeLessThan(0.5);
  });

  it('boards, with the oil carried on the track: the ball hooks less than the bare rigid body, by more than a board (the track-ring model)', () => {
    expect(
      throwOn(flaring, pattern, laydown, target, false).entry - throwOn(flaring, pattern, laydown, target, true).entry,
    ).toBeGreaterThan(1);
  });

  it('boards, with carried oil: the flaring ball hooks at least half a board more than with the pin on the axis, and more than the rigid-body difference (fresh cover rotated into contact by flare)', () => {
    const withOil = throwOn(flaring, pattern, laydown, target, true).entry - throwOn(pinOnAxis, pattern, laydown, target, true).entry;
    const rigid = throwOn(flaring, pattern, laydown, target, false).entry - throwOn(pinOnAxis, pattern, laydown, target, false).entry;
    expect(withOil).toBeGreaterThan(0.5);
    expect(withOil - rigid).toBeGreaterThan(0.3);
  });
});
