import { describe, expect, it } from 'vitest';
import { differentialVsOil } from '../../../engine/index';
import { longHeavy, polishedPearl, shortLight } from '../fixtures';
import { effect } from './helpers';

// Source: common practice, TRADE.md 7.2 differential row (more differential = more flare and total
// hook; less = straighter, more control).

const withDiff = (differential: number) => ({ ...polishedPearl, differential });

describe('rules/differentialVsOil', () => {
  it('points, heavy oil: differential 0.055 in > 0.015 in', () => {
    expect(effect(differentialVsOil, withDiff(0.055), longHeavy)).toBeGreaterThan(effect(differentialVsOil, withDiff(0.015), longHeavy));
  });
  it('points, light oil: differential 0.015 in > 0.055 in', () => {
    expect(effect(differentialVsOil, withDiff(0.015), shortLight)).toBeGreaterThan(effect(differentialVsOil, withDiff(0.055), shortLight));
  });
});
