import { describe, expect, it } from 'vitest';
import { PATTERN_BREAKDOWN_POINTS, patternBreakdown } from '../../../engine/index';
import { houseShot, roughAsymSolid, typicalBowler, urethaneBall } from '../fixtures';
import { effect, run } from './helpers';

// Source: common practice (as oil depletes the lane hooks more, favouring weaker, cleaner balls);
// TRADE.md 5.2 (USBC: stronger balls break patterns down faster).

describe('rules/patternBreakdown', () => {
  it('does not apply on a fresh pattern (0 games)', () => {
    expect(run(patternBreakdown, roughAsymSolid, houseShot, typicalBowler, 0)).toBeNull();
  });
  it('points: the strong solid loses more after 9 games than after 3; the urethane gains', () => {
    const s3 = effect(patternBreakdown, roughAsymSolid, houseShot, typicalBowler, 3);
    const s9 = effect(patternBreakdown, roughAsymSolid, houseShot, typicalBowler, 9);
    expect(s3).toBeLessThan(0);
    expect(s9).toBeLessThan(s3);
    expect(effect(patternBreakdown, urethaneBall, houseShot, typicalBowler, 9)).toBeGreaterThan(0);
  });
  it('points: bounded by ±10 however many games', () => {
    expect(Math.abs(effect(patternBreakdown, roughAsymSolid, houseShot, typicalBowler, 1000))).toBeLessThanOrEqual(PATTERN_BREAKDOWN_POINTS);
  });
  it('text counts the games', () => {
    expect(run(patternBreakdown, roughAsymSolid, houseShot, typicalBowler, 1)?.text).toMatch(/^After 1 game /);
  });
});
