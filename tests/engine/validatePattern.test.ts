import { describe, expect, it } from 'vitest';
import { validatePattern } from '../../engine/index';
import { sweep, workedExample } from './fixtures';

// Policy: engine/README.md invalid-input policy: TypeError for a wrong type,
// RangeError for a value out of range, message naming the function and the value.

describe('validatePattern', () => {
  it('accepts the worked example of the lane-machine arithmetic and a pattern with no sweeps', () => {
    expect(() => validatePattern(workedExample)).not.toThrow();
    expect(() => validatePattern({ name: '', sweeps: [] })).not.toThrow();
  });

  it('names the function given by the caller, and itself by default', () => {
    const p = { name: 'x', sweeps: [sweep(1, 40, 40, 1)] };
    expect(() => validatePattern(p)).toThrow(/^validatePattern: sweep 1 toBoard/);
    expect(() => validatePattern(p, 'patternEditor')).toThrow(/^patternEditor: sweep 1 toBoard/);
  });

  it('TypeError for a missing name', () => {
    expect(() => validatePattern({ sweeps: [] })).toThrow(/validatePattern: pattern name must be a string/);
  });

  it('TypeError for a sweep that is not an object', () => {
    expect(() => validatePattern({ name: 'x', sweeps: [7] })).toThrow(/validatePattern: sweep 1 must be an object, got 7/);
  });

  it('TypeError for a board given as a string', () => {
    expect(() => validatePattern({ name: 'x', sweeps: [{ ...sweep(1, 39, 40, 1), fromBoard: '1' }] })).toThrow(TypeError);
  });
});
