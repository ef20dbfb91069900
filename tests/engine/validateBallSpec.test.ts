import { describe, expect, it } from 'vitest';
import { COVER_TYPES, validateBallSpec } from '../../engine/index';
import { polishedPearl } from './fixtures';

// Policy: engine/README.md invalid-input policy.

describe('validateBallSpec', () => {
  it('accepts a well-formed ball, also one over the USBC limits (legality is checkLegality’s job)', () => {
    expect(() => validateBallSpec(polishedPearl)).not.toThrow();
    expect(() => validateBallSpec({ ...polishedPearl, weightLb: 18, differential: 0.09 })).not.toThrow();
  });
  it('knows the five cover types of issue 3', () => {
    expect(COVER_TYPES).toEqual(['plastic', 'urethane', 'reactive-pearl', 'reactive-hybrid', 'reactive-solid']);
  });
  it('RangeError for a pin-to-PAP past the far pole (half the circumference, 13.35 in on 8.5 in)', () => {
    expect(() => validateBallSpec({ ...polishedPearl, layout: { pinToPapIn: 14 } })).toThrow(
      /validateBallSpec: layout.pinToPapIn 14 in is above the maximum/,
    );
  });
  it('RangeError for a drilling angle of 200°', () => {
    expect(() => validateBallSpec({ ...polishedPearl, layout: { pinToPapIn: 4, drillingAngleDeg: 200 } })).toThrow(RangeError);
  });
  it('RangeError for an intermediate differential larger than the differential (0.015 in with 0.012 in)', () => {
    // Definition (rigid-body mechanics, RG = √(I/m) about each axis): the intermediate axis's RG lies
    // between the lowest and the highest, so the intermediate differential cannot exceed the total.
    expect(() => validateBallSpec({ ...polishedPearl, differential: 0.012, intermediateDifferential: 0.015 })).toThrow(
      /validateBallSpec: intermediateDifferential 0.015 in is larger than differential 0.012 in/,
    );
    expect(() => validateBallSpec({ ...polishedPearl, differential: 0.012, intermediateDifferential: 0.012 })).not.toThrow();
  });

  it('TypeError for a value that is not an object', () => {
    expect(() => validateBallSpec(42)).toThrow(/validateBallSpec: ball must be an object, got 42/);
  });
  it('TypeError for a weight given as a string', () => {
    expect(() => validateBallSpec({ ...polishedPearl, weightLb: '15' })).toThrow(/validateBallSpec: weightLb must be a number, got "15"/);
  });
});
