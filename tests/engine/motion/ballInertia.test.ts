import { describe, expect, it } from 'vitest';
import { ballInertia } from '../../../engine/index';
import { isotropicBall } from './fixtures';

describe('ballInertia (rigid-body mechanics)', () => {
  it('kg·m², 16 lb ball with RG 2.50 in: I_L = 0.02926 (worked by hand) and m R² = 0.08457 at R = 4.25 in', () => {
    const I = ballInertia(isotropicBall(2.5, { weightLb: 16 }));
    expect(Math.abs(I.iLow - 0.02926)).toBeLessThan(1e-5);
    expect(Math.abs(I.massKg * I.radiusM ** 2 - 0.08457)).toBeLessThan(1e-5);
  });

  it('in, RG 2.50 / differential 0.05 / intermediate 0.02: k_H = 2.55, k_I = 2.53 (the USBC axis definitions)', () => {
    const I = ballInertia(isotropicBall(2.5, { differential: 0.05, intermediateDifferential: 0.02 }));
    expect(Math.sqrt(I.iHigh / I.massKg) / 0.0254).toBeCloseTo(2.55, 12);
    expect(Math.sqrt(I.iInt / I.massKg) / 0.0254).toBeCloseTo(2.53, 12);
  });

  it('errors, invalid input: RangeError naming the function for 41 lb, TypeError for a NaN RG, RangeError for intermediate > total differential', () => {
    expect(() => ballInertia(isotropicBall(2.5, { weightLb: 41 }))).toThrow(RangeError);
    expect(() => ballInertia(isotropicBall(2.5, { weightLb: 41 }))).toThrow(/ballInertia: weightLb .* 41/);
    expect(() => ballInertia(isotropicBall(Number.NaN))).toThrow(TypeError);
    expect(() => ballInertia(isotropicBall(2.5, { differential: 0.01, intermediateDifferential: 0.02 }))).toThrow(RangeError);
  });
});
