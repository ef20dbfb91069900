import { describe, expect, it } from 'vitest';
import { flareVsRatio } from '../../../engine/index';
import { houseShot, longHeavy, polishedPearl } from '../fixtures';
import { effect, run } from './helpers';

// Source: common practice (flat sport patterns leave less room for a miss); ratio classes from
// TRADE.md conventions (sport ≤ 3:1, recreation ≥ 6:1).

describe('rules/flareVsRatio', () => {
  it('points, flat 1.5:1 pattern: a high-flare ball loses points, a low-flare ball gains', () => {
    expect(effect(flareVsRatio, { ...polishedPearl, differential: 0.058 }, longHeavy)).toBeLessThan(0);
    expect(effect(flareVsRatio, { ...polishedPearl, differential: 0.01 }, longHeavy)).toBeGreaterThan(0);
  });
  it('does not apply on a house ratio of 7:1 (≥ 6:1)', () => {
    expect(run(flareVsRatio, polishedPearl, houseShot)).toBeNull();
  });
});
