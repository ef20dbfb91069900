import { describe, expect, it } from 'vitest';
import { leaveName } from '../../engine/index';

// Check values: common usage "Split naming: list standing pins in ascending number, e.g. 4-7-10"
// (S / C).

describe('leaveName', () => {
  it('name: pins 10, 4, 7 standing are the 4-7-10', () => {
    expect(leaveName([10, 4, 7])).toBe('4-7-10');
  });
  it('name: the 7 and 10 are the 7-10; a single pin is its number', () => {
    expect(leaveName([7, 10])).toBe('7-10');
    expect(leaveName([10])).toBe('10');
  });
  it('name: no pins standing gives the empty string', () => {
    expect(leaveName([])).toBe('');
  });
  it('throws RangeError naming leaveName for pin 0 and for a repeated pin', () => {
    expect(() => leaveName([0])).toThrow(/leaveName: standing\[0\] must be an integer from 1 to 10, got 0/);
    expect(() => leaveName([4, 4])).toThrow(/leaveName: pin 4 is listed twice/);
  });
});
