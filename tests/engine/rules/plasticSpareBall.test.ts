import { describe, expect, it } from 'vitest';
import { PLASTIC_STRIKE_PENALTY, plasticSpareBall } from '../../../engine/index';
import { houseShot, plasticBall, urethaneBall } from '../fixtures';
import { run } from './helpers';

// Source: common practice, TRADE.md 7.1 ("straight ball for corner pins … often plastic") and 7.2
// (plastic/polyester: little hook; spare ball).

describe('rules/plasticSpareBall', () => {
  it('points: a plastic ball loses 60 points for strikes', () => {
    expect(run(plasticSpareBall, plasticBall, houseShot)?.effect).toBe(-PLASTIC_STRIKE_PENALTY);
    expect(PLASTIC_STRIKE_PENALTY).toBe(60);
  });
  it('does not apply to a urethane ball', () => {
    expect(run(plasticSpareBall, urethaneBall, houseShot)).toBeNull();
  });
});
