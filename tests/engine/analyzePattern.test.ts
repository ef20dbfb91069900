import { describe, expect, it } from 'vitest';
import { analyzePattern, RATIO_BOARDS } from '../../engine/index';
import type { OilPattern } from '../../engine/index';
import { houseShot, longHeavy, shortLight, sweep, workedExample } from './fixtures';

// Definitions: Lanewright's conventions (engine/README.md) — volume = Σ boards × crossings × µL (D),
// length = where the oil ends (C), ratio = mean µL on boards 18–22 ÷ mean µL on boards 3–7 and
// 33–37 (C), classes (C / P for 3:1). Every expected number below is derived by hand.

const TOL = 1e-9;

describe('analyzePattern: volumes on hand-worked patterns', () => {
  it('mL, worked example of the lane-machine arithmetic: 37 × 1 + 25 × 4 + 17 × 6 = 239 crossings × 50 µL = 11.95 mL', () => {
    // lane-machine volume arithmetic "Worked example (own numbers)" (D).
    expect(Math.abs(analyzePattern(workedExample).volumeMl - 11.95)).toBeLessThan(TOL);
  });

  it('mL, worked example split: forward A + C = (37 + 102) × 50 = 6.95 mL, reverse B = 100 × 50 = 5.00 mL', () => {
    // Derived by hand: A 37 × 1 × 50 = 1850 µL; C 17 × 6 × 50 = 5100 µL; B 25 × 4 × 50 = 5000 µL.
    const a = analyzePattern(workedExample);
    expect(Math.abs(a.forwardMl - 6.95)).toBeLessThan(TOL);
    expect(Math.abs(a.reverseMl - 5)).toBeLessThan(TOL);
    expect(Math.abs(a.forwardMl + a.reverseMl - a.volumeMl)).toBeLessThan(TOL);
  });

  it('mL, boards counted from their own gutters: board 2 left to board 2 right covers 41 − 2 − 2 = 37 boards', () => {
    // lane-machine volume arithmetic "Boards covered … 41 − a − b" (D): pattern boards 2–38, 1 crossing × 100 µL = 3.7 mL.
    const p: OilPattern = { name: 'edge to edge', sweeps: [sweep(2, 38, 40, 1, 100)] };
    expect(Math.abs(analyzePattern(p).volumeMl - 3.7)).toBeLessThan(TOL);
  });

  it('mL: the two board numbers may come in either order (38 → 2 equals 2 → 38)', () => {
    const p: OilPattern = { name: 'reversed ends', sweeps: [sweep(38, 2, 40, 1, 100)] };
    expect(Math.abs(analyzePattern(p).volumeMl - 3.7)).toBeLessThan(TOL);
  });

  it('mL, long heavy fixture: 39 × 10 × 60 + 21 × 5 × 60 = 23 400 + 6 300 µL = 29.7 mL', () => {
    const a = analyzePattern(longHeavy);
    expect(Math.abs(a.volumeMl - 29.7)).toBeLessThan(TOL);
    expect(Math.abs(a.forwardMl - 23.4)).toBeLessThan(TOL);
    expect(Math.abs(a.reverseMl - 6.3)).toBeLessThan(TOL);
  });
});

describe('analyzePattern: length and ratio on hand-worked patterns', () => {
  it('ft, worked example: sweeps end at 38, 34 and 30 ft, so the oil ends at 38 ft', () => {
    // Lanewright's convention: pattern length = the distance where the applied oil ends (C).
    expect(analyzePattern(workedExample).lengthFt).toBe(38);
  });

  it('ratio, worked example: middle boards get (1 + 4 + 6) × 50 = 550 µL, outside 1 × 50 = 50 µL → 11', () => {
    // Derived by hand: boards 18–22 lie in A, B and C; boards 3–7 and 33–37 only in A (B is 8–32).
    expect(Math.abs(analyzePattern(workedExample).ratio - 11)).toBeLessThan(TOL);
  });

  it('ratio, long heavy fixture: middle 600 + 300 = 900 µL, outside 600 µL → 1.5', () => {
    expect(Math.abs(analyzePattern(longHeavy).ratio - 1.5)).toBeLessThan(TOL);
  });

  it('ratio, house fixture: middle (2 + 6 + 6) × 70 = 980 µL, outside 2 × 70 = 140 µL → 7', () => {
    expect(Math.abs(analyzePattern(houseShot).ratio - 7)).toBeLessThan(TOL);
  });

  it('ratio: uneven sides average all ten outside boards (boards 1–20 only: middle (3 × 1000 + 0 + 0) ÷ 5 = 600, outside (5 × 1000) ÷ 10 = 500 → 1.2)', () => {
    const p: OilPattern = { name: 'one side', sweeps: [sweep(1, 20, 37, 10, 100)] };
    expect(Math.abs(analyzePattern(p).ratio - 1.2)).toBeLessThan(TOL);
  });

  it('ratio boards are the conventions table’s 18–22 and 3–7 / 33–37', () => {
    expect(RATIO_BOARDS.middle).toEqual([18, 19, 20, 21, 22]);
    expect(RATIO_BOARDS.outside).toEqual([3, 4, 5, 6, 7, 33, 34, 35, 36, 37]);
  });
});

describe('analyzePattern: classes', () => {
  it('worked example: 38 ft medium, 11.95 mL light, 11:1 recreation', () => {
    expect(analyzePattern(workedExample)).toMatchObject({ lengthClass: 'medium', volumeClass: 'light', ratioClass: 'recreation' });
  });

  it('long heavy fixture: 44 ft long, 29.7 mL heavy, 1.5:1 sport', () => {
    expect(analyzePattern(longHeavy)).toMatchObject({ lengthClass: 'long', volumeClass: 'heavy', ratioClass: 'sport' });
  });

  it('short light fixture: 35 ft short, 15.12 mL light, 2.33:1 sport', () => {
    const a = analyzePattern(shortLight);
    expect(Math.abs(a.volumeMl - 15.12)).toBeLessThan(TOL);
    expect(a).toMatchObject({ lengthFt: 35, lengthClass: 'short', volumeClass: 'light', ratioClass: 'sport' });
  });

  it('at the boundaries: 37 ft is medium and 20 mL is medium (boards 1–20 × 10 × 100 µL = 20 mL)', () => {
    // Lanewright's conventions: medium 37 ft to < 43 ft; medium 20–25 mL.
    const p: OilPattern = { name: 'boundary', sweeps: [sweep(1, 20, 37, 10, 100)] };
    expect(analyzePattern(p)).toMatchObject({ lengthFt: 37, volumeMl: 20, lengthClass: 'medium', volumeClass: 'medium' });
  });

  it('ratio exactly 3:1 is sport, 3.02:1 is challenge, exactly 6:1 is recreation', () => {
    // Lanewright's conventions: sport ≤ 3:1 (USBC Sport limit, P); recreation 6:1 and above.
    // Derived: base 1 × 50 µL on all boards plus k × 50 µL on boards 18–22 → ratio (50 + 50k) ÷ 50.
    const flat = (extraUl: number): OilPattern => ({
      name: 'ratio',
      sweeps: [sweep(1, 39, 40, 1, 50), sweep(18, 22, 40, 2, extraUl)],
    });
    expect(analyzePattern(flat(50))).toMatchObject({ ratio: 3, ratioClass: 'sport' });
    const c = analyzePattern(flat(50.5)); // (50 + 101) ÷ 50 = 3.02
    expect(Math.abs(c.ratio - 3.02)).toBeLessThan(TOL);
    expect(c.ratioClass).toBe('challenge');
    expect(analyzePattern(flat(125))).toMatchObject({ ratio: 6, ratioClass: 'recreation' }); // (50 + 250) ÷ 50
  });
});

describe('analyzePattern: edge cases', () => {
  it('a pattern with no sweeps (dry lane): length 0, volume 0, ratio 1, short / light / sport', () => {
    expect(analyzePattern({ name: 'dry', sweeps: [] })).toEqual({
      lengthFt: 0,
      volumeMl: 0,
      forwardMl: 0,
      reverseMl: 0,
      ratio: 1,
      lengthClass: 'short',
      volumeClass: 'light',
      ratioClass: 'sport',
    });
  });

  it('a sweep with 0 crossings lays no oil and does not set the length', () => {
    const p: OilPattern = { name: 'idle pass', sweeps: [sweep(1, 39, 30, 2), sweep(1, 39, 50, 0)] };
    expect(analyzePattern(p).lengthFt).toBe(30);
  });

  it('oil in the middle only: ratio Infinity, recreation', () => {
    const p: OilPattern = { name: 'middle only', sweeps: [sweep(15, 25, 40, 2)] };
    expect(analyzePattern(p)).toMatchObject({ ratio: Infinity, ratioClass: 'recreation' });
  });
});

describe('analyzePattern: malformed patterns throw, naming the function and the value', () => {
  const bad = (s: object): OilPattern => ({ name: 'bad', sweeps: [sweep(1, 39, 40, 1), { ...sweep(1, 39, 40, 1), ...s }] }) as OilPattern;

  it.each([
    ['a sweep whose end is before its start', { startFt: 30, endFt: 12 }, 'analyzePattern: sweep 2 endFt 12 is before startFt 30'],
    ['a sweep with no length', { startFt: 12, endFt: 12 }, 'analyzePattern: sweep 2 endFt 12 equals startFt 12'],
    ['board 41', { toBoard: 41 }, 'analyzePattern: sweep 2 toBoard must be an integer from 1 to 39, got 41'],
    ['board 0', { fromBoard: 0 }, 'analyzePattern: sweep 2 fromBoard must be an integer from 1 to 39, got 0'],
    ['board 2.5', { fromBoard: 2.5 }, 'analyzePattern: sweep 2 fromBoard must be an integer from 1 to 39, got 2.5'],
    ['a negative start', { startFt: -1 }, 'analyzePattern: sweep 2 startFt -1 ft is below the minimum 0 ft'],
    ['an end past the headpin', { endFt: 61 }, 'analyzePattern: sweep 2 endFt 61 ft is above the maximum 60 ft'],
    ['NaN µL', { microlitersPerBoard: Number.NaN }, 'analyzePattern: sweep 2 microlitersPerBoard must be a finite number, got NaN'],
    ['negative µL', { microlitersPerBoard: -5 }, 'analyzePattern: sweep 2 microlitersPerBoard -5 µL is below the minimum 0 µL'],
    ['1.5 crossings', { crossings: 1.5 }, 'analyzePattern: sweep 2 crossings must be an integer from 0'],
  ])('RangeError for %s', (_label, change, message) => {
    expect(() => analyzePattern(bad(change))).toThrow(RangeError);
    expect(() => analyzePattern(bad(change))).toThrow(message);
  });

  it('TypeError for an unknown direction', () => {
    expect(() => analyzePattern(bad({ direction: 'sideways' }))).toThrow(TypeError);
    expect(() => analyzePattern(bad({ direction: 'sideways' }))).toThrow(
      /analyzePattern: sweep 2 direction must be one of forward, reverse/,
    );
  });

  it('TypeError for sweeps that are not an array and for a pattern that is not an object', () => {
    expect(() => analyzePattern({ name: 'x', sweeps: {} } as unknown as OilPattern)).toThrow(TypeError);
    expect(() => analyzePattern(null as unknown as OilPattern)).toThrow(TypeError);
  });
});
