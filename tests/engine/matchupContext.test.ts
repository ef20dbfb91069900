import { describe, expect, it } from 'vitest';
import { analyzePattern, conditionDemand, matchupContext } from '../../engine/index';
import { houseShot, longHeavy, typicalBowler } from './fixtures';

// matchupContext: the pattern's numbers, the lane surface, the games bowled and what the condition asks of
// this bowler (conditionDemand) — built once per matchup.

describe('matchupContext', () => {
  it('carries the pattern analysis, the games, a default synthetic medium-friction lane and the demand', () => {
    const ctx = matchupContext(typicalBowler, houseShot, 3);
    expect(ctx.analysis).toEqual(analyzePattern(houseShot));
    expect(ctx.gamesBowled).toBe(3);
    expect(ctx.lane).toEqual({ kind: 'synthetic', friction: 'medium' });
    expect(ctx.demand).toEqual(conditionDemand({ analysis: ctx.analysis, bowler: typicalBowler, lane: ctx.lane, gamesBowled: 3 }));
  });

  it('points: the long heavy fixture (29.7 mL, 44 ft) asks for more ball than the house fixture (19.18 mL, 40 ft) — common practice', () => {
    expect(matchupContext(typicalBowler, longHeavy).demand.total).toBeGreaterThan(matchupContext(typicalBowler, houseShot).demand.total);
  });

  it('points: a wood lane after 6 games asks for less ball than a synthetic one after 6 games (wood breaks down faster, common practice)', () => {
    const wood = matchupContext(typicalBowler, houseShot, 6, 'matchupContext', { kind: 'wood', friction: 'medium' });
    const syn = matchupContext(typicalBowler, houseShot, 6, 'matchupContext', { kind: 'synthetic', friction: 'medium' });
    expect(wood.demand.total).toBeLessThan(syn.demand.total);
  });

  it('throws RangeError for negative games and TypeError for a lane surface it does not know, naming the caller', () => {
    expect(() => matchupContext(typicalBowler, houseShot, -1)).toThrow(/matchupContext: gamesBowled must be 0 or more, got -1/);
    expect(() => matchupContext(typicalBowler, houseShot, 0, 'rankArsenal', { kind: 'glass' as 'wood', friction: 'medium' })).toThrow(
      /rankArsenal: lane.kind must be wood or synthetic/,
    );
  });
});
