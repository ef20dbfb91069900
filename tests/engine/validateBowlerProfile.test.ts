import { describe, expect, it } from 'vitest';
import { validateBowlerProfile } from '../../engine/index';
import { typicalBowler } from './fixtures';

// Policy: engine/README.md invalid-input policy; bounds engine/validateBowlerProfile.ts (wide
// bounds around common practice's typical ranges).

describe('validateBowlerProfile', () => {
  it('accepts the typical bowler and a left-hander', () => {
    expect(() => validateBowlerProfile(typicalBowler)).not.toThrow();
    expect(() => validateBowlerProfile({ ...typicalBowler, hand: 'left' })).not.toThrow();
  });
  it('TypeError for a hand that is neither right nor left', () => {
    expect(() => validateBowlerProfile({ ...typicalBowler, hand: 'both' })).toThrow(TypeError);
  });
  it.each([
    ['speed 0 mph', { speedMph: 0 }, /speedMph must be greater than 0/],
    ['speed 45 mph', { speedMph: 45 }, /speedMph 45 mph is above the maximum 40 mph/],
    ['revs −10 rpm', { revRpm: -10 }, /revRpm -10 rpm is below the minimum 0 rpm/],
    ['axis rotation 95°', { axisRotationDeg: 95 }, /axisRotationDeg 95° is above the maximum 90°/],
    ['tilt NaN', { axisTiltDeg: Number.NaN }, /axisTiltDeg must be a finite number/],
  ])('RangeError for %s', (_label, change, message) => {
    expect(() => validateBowlerProfile({ ...typicalBowler, ...change })).toThrow(message);
  });
});
