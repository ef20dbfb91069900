import { describe, expect, it } from 'vitest';
import { wilsonInterval } from '../../../engine/index';

// Check values: the Wilson score interval (E. B. Wilson, JASA 22 (1927) 209–212), z = 1.96, worked by
// hand; the same values are tabulated in comparisons of binomial intervals (e.g. Newcombe, Statistics in
// Medicine 17 (1998) 857–872 — from memory).

describe('wilsonInterval (Wilson 1927)', () => {
  it('0 of 10: [0, z²/(n + z²)] = [0, 0.2775] (closed form at 0 hits; Newcombe 1998 table, from memory)', () => {
    const w = wilsonInterval(0, 10);
    expect(w.low).toBe(0);
    expect(w.high).toBeCloseTo(3.8416 / 13.8416, 12);
    expect(w.high).toBeCloseTo(0.2775, 4);
  });

  it('5 of 10: [0.2366, 0.7634] (by hand: centre 0.5, half-width 1.96/1.38416·√(0.025 + 0.009604) = 0.2634)', () => {
    const w = wilsonInterval(5, 10);
    expect(w.low).toBeCloseTo(0.2366, 4);
    expect(w.high).toBeCloseTo(0.7634, 4);
  });

  it('10 of 10 mirrors 0 of 10; z = 1 narrows it; bad input is refused', () => {
    const w = wilsonInterval(10, 10);
    expect(w.high).toBe(1);
    expect(w.low).toBeCloseTo(1 - 3.8416 / 13.8416, 12);
    expect(wilsonInterval(5, 10, 1).high).toBeLessThan(0.7634);
    expect(() => wilsonInterval(0, 0)).toThrow(new RangeError('wilsonInterval: n must be an integer from 1 to 9007199254740991, got 0'));
    expect(() => wilsonInterval(11, 10)).toThrow(/^wilsonInterval: hits must be an integer from 0 to 10, got 11/);
    expect(() => wilsonInterval('3' as unknown as number, 10)).toThrow(TypeError);
    expect(() => wilsonInterval(3, 10, -1)).toThrow(new RangeError('wilsonInterval: z must be greater than 0, got -1'));
  });
});
