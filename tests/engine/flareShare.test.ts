import { describe, expect, it } from 'vitest';
import { flareShare, pinToPapInForAngle } from '../../engine/index';

// Check values: rigid-body mechanics (derived): migration ∝ ½ ΔI ω sin 2θ, largest at
// θ = 45°; so the share of the maximum is |sin 2θ|.

describe('flareShare', () => {
  it('share, 8.5 in ball: the 45° pin-to-PAP (3.338 in) gives the full flare, 1 (±1e-12)', () => {
    expect(Math.abs(flareShare(pinToPapInForAngle(45)) - 1)).toBeLessThan(1e-12);
  });

  it('share: 30° and 60° each give sin 60° = 0.8660 (±1e-9)', () => {
    // Derived: sin(2 × 30°) = sin(2 × 60°) = √3 / 2.
    expect(Math.abs(flareShare(pinToPapInForAngle(30)) - Math.sqrt(3) / 2)).toBeLessThan(1e-9);
    expect(Math.abs(flareShare(pinToPapInForAngle(60)) - Math.sqrt(3) / 2)).toBeLessThan(1e-9);
  });

  it('share: pin on the PAP (0 in) and pin 90° away give no flare, 0 (±1e-12)', () => {
    expect(flareShare(0)).toBe(0);
    expect(flareShare(pinToPapInForAngle(90))).toBeLessThan(1e-12);
  });

  it('share: 3 3/8 in on an 8.595 in ball is the maximum (> 0.99999)', () => {
    // rigid-body mechanics trade figure: about 3 3/8 in gives maximum flare potential.
    expect(flareShare(3.375, 8.595)).toBeGreaterThan(0.99999);
  });

  it('throws RangeError naming flareShare for a negative distance', () => {
    expect(() => flareShare(-1)).toThrow(/flareShare: pinToPapIn -1 in is below the minimum 0/);
  });
});
