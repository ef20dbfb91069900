import { describe, expect, it } from 'vitest';
import { pinToPapAngleDeg, pinToPapInForAngle } from '../../engine/index';

// Check values: rigid-body mechanics (derived): arc for 45° is R·π/4 = 3.338 in on an
// 8.5 in ball and 3.375 in on an 8.595 in ball.

describe('pinToPapInForAngle', () => {
  it('inches, 8.5 in ball: 45° is 3.338 in (±0.001 in)', () => {
    expect(pinToPapInForAngle(45)).toBeCloseTo(3.338, 3);
  });

  it('inches, 8.595 in ball: 45° is 3.375 in (±0.001 in)', () => {
    expect(pinToPapInForAngle(45, 8.595)).toBeCloseTo(3.375, 3);
  });

  it('inverts pinToPapAngleDeg for 5 in on an 8.5 in ball (±1e-12 in)', () => {
    expect(Math.abs(pinToPapInForAngle(pinToPapAngleDeg(5)) - 5)).toBeLessThan(1e-12);
  });

  it('throws RangeError for an angle past 180°', () => {
    expect(() => pinToPapInForAngle(181)).toThrow(/pinToPapInForAngle: angleDeg 181° is above the maximum 180°/);
  });
});
