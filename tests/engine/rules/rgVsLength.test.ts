import { describe, expect, it } from 'vitest';
import { rgVsLength } from '../../../engine/index';
import { longHeavy, polishedPearl, shortLight } from '../fixtures';
import { effect } from './helpers';

// Source: common practice, TRADE.md 7.2 RG row (lower RG revs up and rolls earlier; higher RG more
// length), consistent with TRADE.md 6.2 (a lower RG spins up faster).

const withRg = (rg: number) => ({ ...polishedPearl, rg });

describe('rules/rgVsLength', () => {
  it('points, long pattern (44 ft): RG 2.47 in > RG 2.75 in', () => {
    expect(effect(rgVsLength, withRg(2.47), longHeavy)).toBeGreaterThan(effect(rgVsLength, withRg(2.75), longHeavy));
  });
  it('points, short pattern (35 ft): RG 2.75 in > RG 2.47 in', () => {
    expect(effect(rgVsLength, withRg(2.75), shortLight)).toBeGreaterThan(effect(rgVsLength, withRg(2.47), shortLight));
  });
});
