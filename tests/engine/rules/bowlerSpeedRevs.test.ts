import { describe, expect, it } from 'vitest';
import { bowlerSpeedRevs } from '../../../engine/index';
import { houseShot, roughAsymSolid, typicalBowler, urethaneBall } from '../fixtures';
import { effect, run } from './helpers';

// Source: common practice (issue 3): a high-rev, low-speed bowler needs less ball than a
// high-speed, low-rev bowler. Bowler ranges TRADE.md 7.3 (16–21 mph; 250–400+ rpm).

const fastLowRev = { ...typicalBowler, speedMph: 20, revRpm: 250 };
const slowHighRev = { ...typicalBowler, speedMph: 15, revRpm: 500 };

describe('rules/bowlerSpeedRevs', () => {
  it('points: a strong ball gains for a 20 mph / 250 rpm bowler and loses for a 15 mph / 500 rpm bowler', () => {
    expect(effect(bowlerSpeedRevs, roughAsymSolid, houseShot, fastLowRev)).toBeGreaterThan(0);
    expect(effect(bowlerSpeedRevs, roughAsymSolid, houseShot, slowHighRev)).toBeLessThan(0);
  });
  it('points: a mild urethane ball gains for the high-rev, low-speed bowler', () => {
    expect(effect(bowlerSpeedRevs, urethaneBall, houseShot, slowHighRev)).toBeGreaterThan(0);
  });
  it('does not apply to a bowler at the reference release (17 mph, 350 rpm)', () => {
    expect(run(bowlerSpeedRevs, roughAsymSolid, houseShot, typicalBowler)).toBeNull();
  });
});
