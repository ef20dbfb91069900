import { describe, expect, it } from 'vitest';
import { ruleOf31 } from '../../engine/index';

// Check values: common practice "Rule of 31" (common practice): pattern length
// (ft) − 31 ≈ board where the ball should leave the oil; e.g. 39 ft → board 8; 43 ft → board 12.

describe('ruleOf31', () => {
  it('board: a 39 ft pattern gives board 8', () => {
    expect(ruleOf31(39)).toBe(8);
  });
  it('board: a 43 ft pattern gives board 12', () => {
    expect(ruleOf31(43)).toBe(12);
  });
  it('board: a pattern of 32 ft or shorter gives board 1, the outermost board (documented floor)', () => {
    expect(ruleOf31(32)).toBe(1);
    expect(ruleOf31(25)).toBe(1);
  });
  it('throws RangeError for a length past the headpin (61 ft) or NaN', () => {
    expect(() => ruleOf31(61)).toThrow(/ruleOf31: lengthFt 61 ft is above the maximum 60 ft/);
    expect(() => ruleOf31(Number.NaN)).toThrow(RangeError);
  });
});
