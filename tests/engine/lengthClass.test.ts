import { describe, expect, it } from 'vitest';
import { lengthClass, LENGTH_CLASS_FT } from '../../engine/index';

// Check values: Lanewright's conventions (engine/README.md) — short < 37 ft; medium 37 ft to < 43 ft;
// long ≥ 43 ft (common practice, Lanewright's documented choice).

describe('lengthClass', () => {
  it('ft: 36.99 is short, 37 is medium', () => {
    expect(lengthClass(36.99)).toBe('short');
    expect(lengthClass(37)).toBe('medium');
  });
  it('ft: 42.99 is medium, 43 is long', () => {
    expect(lengthClass(42.99)).toBe('medium');
    expect(lengthClass(43)).toBe('long');
  });
  it('thresholds are exported as 37 and 43 ft', () => {
    expect(LENGTH_CLASS_FT).toEqual({ shortBelowFt: 37, longFromFt: 43 });
  });
  it('throws RangeError for a negative length', () => {
    expect(() => lengthClass(-1)).toThrow(/lengthClass: lengthFt -1 ft is below the minimum 0 ft/);
  });
});
