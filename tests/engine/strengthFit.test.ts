import { describe, expect, it } from 'vitest';
import { FIT_SCALE, matchupContext, strengthFit } from '../../engine/index';
import type { BallSpec } from '../../engine/index';
import { houseShot, longHeavy, polishedPearl, roughAsymSolid, typicalBowler, urethaneBall } from './fixtures';

// strengthFit: one model of the matchup — the ball's reaction against the condition's demand — with the points
// the fit loses shared among the parts that make the gap (so nothing is counted twice and no reason contradicts
// another). Lanewright's definition; the directions of the parts are the trade's (ballReaction, conditionDemand).

const fitOf = (ball: BallSpec, pattern = houseShot, g = 0) => strengthFit(ball, matchupContext(typicalBowler, pattern, g));

describe('strengthFit', () => {
  it('gap = strength − demand; the verdict follows the tolerance', () => {
    for (const b of [roughAsymSolid, polishedPearl, urethaneBall]) {
      const f = fitOf(b);
      expect(f.gap).toBeCloseTo(f.strength - f.demand, 6);
      expect(f.verdict).toBe(f.gap > FIT_SCALE.tolerance ? 'too-strong' : f.gap < -FIT_SCALE.tolerance ? 'too-weak' : 'suits');
    }
  });

  it('points: a ball within the tolerance scores 100 and every reason has effect 0', () => {
    // tune a ball to the house demand: the pearl's surface moved until the gap is inside the tolerance
    const grits = [500, 1000, 1500, 2000, 3000, 4000, 5000];
    const suited = grits.map((surfaceGrit) => fitOf({ ...polishedPearl, surfaceGrit, polished: false })).find((f) => f.verdict === 'suits');
    expect(suited).toBeDefined();
    expect(suited!.score).toBe(100);
    for (const r of suited!.reasons) expect(r.effect).toBe(0);
  });

  it('points: the reasons share exactly the points lost (±0.3 for rounding), only among the parts that push the gap’s way', () => {
    for (const [b, p] of [
      [roughAsymSolid, houseShot],
      [urethaneBall, longHeavy],
      [polishedPearl, longHeavy],
    ] as const) {
      const f = fitOf(b, p);
      expect(f.verdict).not.toBe('suits');
      const sum = f.reasons.reduce((a, r) => a + r.effect, 0);
      expect(Math.abs(sum + (100 - f.score))).toBeLessThan(0.3);
      const pushing = f.reasons.filter((r) => r.effect < 0);
      expect(pushing.length).toBeGreaterThan(0);
      for (const r of pushing) expect(r.text).toMatch(f.verdict === 'too-strong' ? /too strong/ : /too weak/);
    }
  });

  it('points: too much ball costs more than the same amount too little (common practice: a ball that hooks too much cannot be contained)', () => {
    const { perPoint, tooStrongFactor, tolerance } = FIT_SCALE;
    const lost = (gap: number) =>
      100 * (1 - Math.exp((-perPoint * Math.max(0, Math.abs(gap) - tolerance) * (gap > 0 ? tooStrongFactor : 1)) / 100));
    expect(lost(8)).toBeGreaterThan(lost(-8));
    const f = fitOf(roughAsymSolid);
    expect(f.score).toBeCloseTo(100 - lost(f.gap), 1);
  });

  it('as games are bowled the demand falls, so a too-strong ball’s gap grows (common practice)', () => {
    expect(fitOf(roughAsymSolid, houseShot, 9).gap).toBeGreaterThan(fitOf(roughAsymSolid, houseShot, 0).gap);
  });
});
