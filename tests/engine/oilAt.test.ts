import { describe, expect, it } from 'vitest';
import { oilAt } from '../../engine/index';
import type { OilPattern } from '../../engine/index';
import { sweep, workedExample } from './fixtures';

// Definition: each sweep spreads crossings × µL per board evenly between startFt and endFt
// (the Sweep contract of issue 3), so its density is crossings × µL ÷ (endFt − startFt) µL per
// board per foot; densities of overlapping sweeps add (lane-machine volume arithmetic, D).
// Worked example sweeps: A boards 2–38, 1 × 50 µL over 0–38 ft; B boards 8–32, 4 × 50 µL over
// 0–34 ft; C boards 12–28, 6 × 50 µL over 2–30 ft. Expected values derived by hand.

const TOL = 1e-9;

describe('oilAt', () => {
  it('µL/board/ft, one flat sweep: 10 × 50 µL over 0–40 ft is 500 ÷ 40 = 12.5 on board 20 at 10 ft', () => {
    const p: OilPattern = { name: 'flat', sweeps: [sweep(1, 39, 40, 10, 50)] };
    expect(oilAt(p, 20, 10)).toBe(12.5);
  });

  it('µL/board/ft, worked example, board 20 at 10 ft: 50/38 + 200/34 + 300/28 = 17.91243', () => {
    // 1.315789 + 5.882353 + 10.714286 = 17.912428
    expect(Math.abs(oilAt(workedExample, 20, 10) - (50 / 38 + 200 / 34 + 300 / 28))).toBeLessThan(TOL);
    expect(oilAt(workedExample, 20, 10)).toBeCloseTo(17.91243, 5);
  });

  it('µL/board/ft, worked example, board 20 at 1 ft (before C starts at 2 ft): 50/38 + 200/34 = 7.19814', () => {
    expect(oilAt(workedExample, 20, 1)).toBeCloseTo(7.19814, 5);
  });

  it('µL/board/ft, worked example, board 5 at 10 ft (A only): 50/38 = 1.31579', () => {
    expect(oilAt(workedExample, 5, 10)).toBeCloseTo(1.31579, 5);
  });

  it('µL/board/ft: board 1 (outside every sweep) is dry, 0', () => {
    expect(oilAt(workedExample, 1, 10)).toBe(0);
  });

  it('µL/board/ft: a span is open at its end, so at the pattern length (38 ft) the oil is 0', () => {
    expect(oilAt(workedExample, 20, 38)).toBe(0);
    expect(oilAt(workedExample, 20, 37.999)).toBeGreaterThan(0);
  });

  it('µL/board/ft: a span is closed at its start (C counts at 2 ft)', () => {
    expect(oilAt(workedExample, 20, 2)).toBeCloseTo(17.91243, 5);
  });

  it('µL/board/ft: past the pattern, at the headpin (60 ft), 0', () => {
    expect(oilAt(workedExample, 20, 60)).toBe(0);
  });

  it('boards: a fractional board reads the board that holds it (17.5 → board 18, 17.49 → board 17)', () => {
    const p: OilPattern = { name: 'one board', sweeps: [sweep(18, 18, 40, 4, 10)] };
    expect(oilAt(p, 17.5, 5)).toBe(1); // 4 × 10 ÷ 40
    expect(oilAt(p, 17.49, 5)).toBe(0);
    expect(oilAt(p, 18.49, 5)).toBe(1);
  });

  it('boards: the lane edges 0.5 and 39.5 are boards 1 and 39', () => {
    const p: OilPattern = { name: 'edges', sweeps: [sweep(1, 1, 40, 4, 10), sweep(39, 39, 40, 8, 10)] };
    expect(oilAt(p, 0.5, 5)).toBe(1);
    expect(oilAt(p, 39.5, 5)).toBe(2);
  });

  it('throws RangeError for a board off the lane (0.4, 39.6) or a distance behind the foul line', () => {
    expect(() => oilAt(workedExample, 0.4, 10)).toThrow(/oilAt: board 0.4 is below the minimum 0.5/);
    expect(() => oilAt(workedExample, 39.6, 10)).toThrow(/oilAt: board 39.6 is above the maximum 39.5/);
    expect(() => oilAt(workedExample, 20, -1)).toThrow(/oilAt: ft -1 ft is below the minimum 0 ft/);
    expect(() => oilAt(workedExample, Number.NaN, 10)).toThrow(RangeError);
  });

  it('throws for a malformed pattern, naming oilAt', () => {
    const p = { name: 'bad', sweeps: [sweep(1, 39, 10, 1, 50, 'forward', 20)] };
    expect(() => oilAt(p, 20, 5)).toThrow('oilAt: sweep 1 endFt 10 is before startFt 20');
  });
});
