import { describe, expect, it } from 'vitest';
import { surfaceVsOil } from '../../../engine/index';
import { houseShot, longHeavy, roughAsymSolid, urethaneBall } from '../fixtures';
import { effect } from './helpers';

// Source: common practice, TRADE.md 7.2 surface-grit row: rougher (lower grit) = earlier read, more
// hook in oil; smoother/polished = more length, sharper backend, less read in oil.

const solidAt = (grit: number, polished = false) => ({ ...roughAsymSolid, surfaceGrit: grit, polished });

describe('rules/surfaceVsOil', () => {
  it('points, heavy oil: 500 grit > 2000 grit > 4000 grit polished', () => {
    expect(effect(surfaceVsOil, solidAt(500), longHeavy)).toBeGreaterThan(effect(surfaceVsOil, solidAt(2000), longHeavy));
    expect(effect(surfaceVsOil, solidAt(2000), longHeavy)).toBeGreaterThan(effect(surfaceVsOil, solidAt(4000, true), longHeavy));
  });

  it('points, fresh light house shot: 3000 grit > 500 grit (too much surface reads early)', () => {
    expect(effect(surfaceVsOil, solidAt(3000), houseShot)).toBeGreaterThan(effect(surfaceVsOil, solidAt(500), houseShot));
  });

  it('points: urethane responds less to surface than a reactive cover (smaller swing from 500 to 4000 grit)', () => {
    const swing = (b: typeof roughAsymSolid): number =>
      Math.abs(effect(surfaceVsOil, { ...b, surfaceGrit: 500 }, longHeavy) - effect(surfaceVsOil, { ...b, surfaceGrit: 4000 }, longHeavy));
    expect(swing(urethaneBall)).toBeLessThan(swing(roughAsymSolid));
  });
});
