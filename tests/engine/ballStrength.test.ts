import { describe, expect, it } from 'vitest';
import { ballStrength } from '../../engine/index';
import { plasticBall, polishedPearl, roughAsymSolid, urethaneBall } from './fixtures';

// Direction: common practice, TRADE.md 7.2 (cover order; rougher surface and lower RG read
// earlier; more differential more hook). Weights are Lanewright's (engine/ballStrength.ts).

describe('ballStrength', () => {
  it('scale 0–1: rough asymmetric solid > polished pearl > urethane > plastic', () => {
    const s = [roughAsymSolid, polishedPearl, urethaneBall, plasticBall].map(ballStrength);
    for (let i = 1; i < s.length; i++) expect(s[i]).toBeLessThan(s[i - 1]);
    for (const x of s) {
      expect(x).toBeGreaterThanOrEqual(0);
      expect(x).toBeLessThanOrEqual(1);
    }
  });

  it('sanding makes a ball stronger and polishing weaker (500 grit > 4000 grit > 4000 grit polished)', () => {
    const at = (surfaceGrit: number, polished: boolean): number => ballStrength({ ...roughAsymSolid, surfaceGrit, polished });
    expect(at(500, false)).toBeGreaterThan(at(4000, false));
    expect(at(4000, false)).toBeGreaterThan(at(4000, true));
  });

  it('a lower RG and a higher differential make a ball stronger', () => {
    expect(ballStrength({ ...polishedPearl, rg: 2.47 })).toBeGreaterThan(ballStrength({ ...polishedPearl, rg: 2.7 }));
    expect(ballStrength({ ...polishedPearl, differential: 0.055 })).toBeGreaterThan(ballStrength({ ...polishedPearl, differential: 0.02 }));
  });
});
