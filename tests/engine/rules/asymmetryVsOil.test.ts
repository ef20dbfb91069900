import { describe, expect, it } from 'vitest';
import { asymmetryVsOil } from '../../../engine/index';
import { longHeavy, polishedPearl, shortLight } from '../fixtures';
import { effect, run } from './helpers';

// Source: common practice, TRADE.md 7.2 intermediate-differential row (asymmetry = quicker, more
// angular response to friction; symmetric = smoother).

const withInt = (intermediateDifferential: number) => ({ ...polishedPearl, intermediateDifferential });

describe('rules/asymmetryVsOil', () => {
  it('points, heavy oil: an asymmetric core (0.018 in) > a symmetric one', () => {
    expect(effect(asymmetryVsOil, withInt(0.018), longHeavy)).toBeGreaterThan(effect(asymmetryVsOil, withInt(0), longHeavy));
  });
  it('points, light oil: a symmetric core > an asymmetric one (0.018 in)', () => {
    expect(effect(asymmetryVsOil, withInt(0), shortLight)).toBeGreaterThan(effect(asymmetryVsOil, withInt(0.018), shortLight));
  });
  it('text says symmetric for an intermediate differential of 0', () => {
    expect(run(asymmetryVsOil, withInt(0), shortLight)?.text).toMatch(/^A symmetric core/);
  });
});
