import { describe, expect, it } from 'vitest';
import { pinToPapAngleDeg } from '../../engine/index';

// Check values: our conventions (engine/README.md) and rigid-body mechanics (derived): angle = arc length
// ÷ radius; 45° is 3.34 in on an 8.5 in ball and 3 3/8 in on a maximum-diameter (8.595 in) ball.

describe('pinToPapAngleDeg', () => {
  it('degrees, 8.5 in ball: 3.34 in from pin to PAP is 45° (±0.05°)', () => {
    // rigid-body mechanics: R·π/4 = 4.25 × 0.7854 = 3.338 in; 3.34 / 4.25 rad = 45.03°.
    expect(pinToPapAngleDeg(3.34)).toBeCloseTo(45, 1);
  });

  it('degrees, 8.5 in ball: exactly R·π/4 = 3.3379 in is 45° (±1e-9)', () => {
    // Derived: (4.25 × π/4) / 4.25 = π/4 rad = 45°.
    expect(Math.abs(pinToPapAngleDeg((4.25 * Math.PI) / 4) - 45)).toBeLessThan(1e-9);
  });

  it('degrees, 8.595 in ball: 3 3/8 in is 45° (±0.01°)', () => {
    // rigid-body mechanics: R·π/4 = 4.2975 × 0.7854 = 3.375 in; 3.375 / 4.2975 rad = 44.997°.
    expect(Math.abs(pinToPapAngleDeg(3.375, 8.595) - 45)).toBeLessThan(0.01);
  });

  it('degrees, 8.5 in ball: the default diameter is 8.5 in (same as passing 8.5)', () => {
    // Lanewright's conventions: ball diameter 8.5 in nominal.
    expect(pinToPapAngleDeg(5)).toBe(pinToPapAngleDeg(5, 8.5));
  });

  it('degrees: 0 in is 0°, and half the circumference (π × 4.25 in) is 180° (±1e-9)', () => {
    // Derived: the far pole is π radians along the surface.
    expect(pinToPapAngleDeg(0)).toBe(0);
    expect(Math.abs(pinToPapAngleDeg(Math.PI * 4.25) - 180)).toBeLessThan(1e-9);
  });

  it('throws RangeError for a negative distance, one past the far pole, or a zero diameter', () => {
    expect(() => pinToPapAngleDeg(-0.1)).toThrow(/pinToPapAngleDeg: pinToPapIn -0.1 in is below the minimum 0/);
    expect(() => pinToPapAngleDeg(13.5)).toThrow(/pinToPapAngleDeg: pinToPapIn 13.5 in is above the maximum/);
    expect(() => pinToPapAngleDeg(3, 0)).toThrow(/pinToPapAngleDeg: diameterIn must be greater than 0/);
  });
});
