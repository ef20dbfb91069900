import { describe, expect, it } from 'vitest';
import { ratioClass, RATIO_CLASS } from '../../engine/index';

// Check values: Lanewright's conventions (engine/README.md) — sport ≤ 3:1 (USBC Sport Bowling limit, P,
// lane-machine volume arithmetic); challenge above 3:1 and below 6:1; recreation 6:1 and above (Lanewright's choice
// within common practice 4:1–8:1).

describe('ratioClass', () => {
  it('ratio: 3 is sport, 3.01 is challenge', () => {
    expect(ratioClass(3)).toBe('sport');
    expect(ratioClass(3.01)).toBe('challenge');
  });
  it('ratio: 5.99 is challenge, 6 is recreation', () => {
    expect(ratioClass(5.99)).toBe('challenge');
    expect(ratioClass(6)).toBe('recreation');
  });
  it('ratio: Infinity (no oil outside) is recreation', () => {
    expect(ratioClass(Infinity)).toBe('recreation');
  });
  it('thresholds are exported as 3 and 6', () => {
    expect(RATIO_CLASS).toEqual({ sportMax: 3, recreationFrom: 6 });
  });
  it('throws RangeError for a negative ratio or NaN', () => {
    expect(() => ratioClass(-1)).toThrow(/ratioClass: ratio must be 0 or more, got -1/);
    expect(() => ratioClass(Number.NaN)).toThrow(RangeError);
  });
});
