import { describe, expect, it } from 'vitest';
import { COVER_VS_OIL_POINTS, coverVsOil } from '../../../engine/index';
import { longHeavy, plasticBall, polishedPearl, roughAsymSolid, shortLight, urethaneBall } from '../fixtures';
import { effect, run } from './helpers';

// Source: common practice, TRADE.md 7.2 cover-type row: urethane early and smooth, pearl length +
// backend, hybrid between, solid earliest and strongest read in oil.

describe('rules/coverVsOil', () => {
  it('points, long heavy oil: solid > pearl > urethane', () => {
    const solid = effect(coverVsOil, roughAsymSolid, longHeavy);
    const pearl = effect(coverVsOil, polishedPearl, longHeavy);
    const urethane = effect(coverVsOil, urethaneBall, longHeavy);
    expect(solid).toBeGreaterThan(pearl);
    expect(pearl).toBeGreaterThan(urethane);
  });

  it('points, short light oil: urethane > pearl > solid', () => {
    const solid = effect(coverVsOil, roughAsymSolid, shortLight);
    const pearl = effect(coverVsOil, polishedPearl, shortLight);
    const urethane = effect(coverVsOil, urethaneBall, shortLight);
    expect(urethane).toBeGreaterThan(pearl);
    expect(pearl).toBeGreaterThan(solid);
  });

  it('points: the effect stays within ±15, and the hybrid sits between pearl and solid on heavy oil', () => {
    const hybrid = effect(coverVsOil, { ...roughAsymSolid, coverType: 'reactive-hybrid' }, longHeavy);
    expect(hybrid).toBeLessThan(effect(coverVsOil, roughAsymSolid, longHeavy));
    expect(hybrid).toBeGreaterThan(effect(coverVsOil, polishedPearl, longHeavy));
    for (const b of [roughAsymSolid, polishedPearl, urethaneBall]) {
      for (const p of [longHeavy, shortLight]) expect(Math.abs(effect(coverVsOil, b, p))).toBeLessThanOrEqual(COVER_VS_OIL_POINTS);
    }
  });

  it('does not apply to plastic (the plastic rule handles it) and names its source', () => {
    expect(run(coverVsOil, plasticBall, longHeavy)).toBeNull();
    expect(run(coverVsOil, roughAsymSolid, longHeavy)?.source).toMatch(/common practice/);
  });
});
