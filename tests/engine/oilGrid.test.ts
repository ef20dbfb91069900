import { describe, expect, it } from 'vitest';
import { oilAt, oilGrid } from '../../engine/index';
import { sweep, workedExample } from './fixtures';

// Definition: values[i][j] = oilAt(pattern, boards[i], ft[j]); see oilAt.test.ts for the density
// arithmetic. Worked example (lane-machine volume arithmetic): boards 18–22 receive 550 µL each, boards 3–7 50 µL.

describe('oilGrid', () => {
  it('shape, defaults: boards 1–39 by 1, distances 0–60 ft by 1 (39 × 61 samples)', () => {
    const g = oilGrid(workedExample);
    expect(g.boards).toEqual(Array.from({ length: 39 }, (_, i) => i + 1));
    expect(g.ft).toEqual(Array.from({ length: 61 }, (_, j) => j));
    expect(g.values).toHaveLength(39);
    for (const row of g.values) expect(row).toHaveLength(61);
  });

  it('values equal oilAt at every sample (µL/board/ft)', () => {
    const g = oilGrid(workedExample, { boardStep: 2, ftStep: 3, maxFt: 45 });
    g.boards.forEach((b, i) => g.ft.forEach((f, j) => expect(g.values[i][j]).toBe(oilAt(workedExample, b, f))));
  });

  it('µL, integrating a board over distance gives the oil it received: board 20 → 550 µL, board 5 → 50 µL (±1e-9)', () => {
    // Derived by hand: a left Riemann sum of a piecewise-constant density whose steps (0, 2, 30, 34,
    // 38 ft) fall on the 0.5 ft grid is exact: A 50 + B 200 + C 300 = 550 µL on board 20.
    const step = 0.5;
    const g = oilGrid(workedExample, { ftStep: step });
    const integral = (board: number): number => g.values[board - 1].reduce((s, v) => s + v * step, 0);
    expect(Math.abs(integral(20) - 550)).toBeLessThan(1e-9);
    expect(Math.abs(integral(5) - 50)).toBeLessThan(1e-9);
  });

  it('boards: a step of 0.5 samples 1, 1.5, … 39 (77 boards); 1.5 reads board 2', () => {
    const g = oilGrid({ name: 'b2', sweeps: [sweep(2, 2, 40, 4, 10)] }, { boardStep: 0.5, maxFt: 10 });
    expect(g.boards).toHaveLength(77);
    expect(g.boards[76]).toBe(39);
    expect(g.values[1][0]).toBe(1); // board 1.5 → board 2: 4 × 10 ÷ 40
    expect(g.values[0][0]).toBe(0); // board 1
  });

  it('distances: maxFt is included when it falls on a step, without rounding drift (0.1 ft steps to 6 ft → 61 samples)', () => {
    const g = oilGrid(workedExample, { ftStep: 0.1, maxFt: 6 });
    expect(g.ft).toHaveLength(61);
    expect(g.ft[60]).toBeCloseTo(6, 12);
  });

  it('throws RangeError for a step ≤ 0, a negative maxFt and a grid over the sample limit', () => {
    expect(() => oilGrid(workedExample, { ftStep: 0 })).toThrow(/oilGrid: ftStep must be greater than 0/);
    expect(() => oilGrid(workedExample, { boardStep: -1 })).toThrow(/oilGrid: boardStep must be greater than 0/);
    expect(() => oilGrid(workedExample, { maxFt: -1 })).toThrow(/oilGrid: maxFt -1 ft is below the minimum 0 ft/);
    expect(() => oilGrid(workedExample, { boardStep: 0.001, ftStep: 0.001 })).toThrow(/oilGrid: .* samples exceed the limit/);
  });
});
