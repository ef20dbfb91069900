import { describe, expect, it } from 'vitest';
import { ballFeatures, pinToPapInForAngle } from '../../engine/index';
import { polishedPearl, roughAsymSolid } from './fixtures';

// Definitions (engine/ballFeatures.ts): RG and differential scaled by the USBC limits (TRADE.md
// 1.1: RG 2.460–2.800 in, differential ≤ 0.060 in), flare share |sin 2θ| (TRADE.md 6.3).
// Values derived by hand.

describe('ballFeatures', () => {
  it('scale: RG 2.46 in is lowness 1, 2.80 in is 0, 2.63 in is 0.5 (±1e-12)', () => {
    expect(ballFeatures({ ...polishedPearl, rg: 2.46 }).rgLowness).toBeCloseTo(1, 12);
    expect(ballFeatures({ ...polishedPearl, rg: 2.8 }).rgLowness).toBeCloseTo(0, 12);
    expect(ballFeatures({ ...polishedPearl, rg: 2.63 }).rgLowness).toBeCloseTo(0.5, 12);
  });

  it('scale: differential 0.045 in is 0.75 of the 0.060 in limit; beyond the limit is clamped to 1', () => {
    expect(ballFeatures({ ...polishedPearl, differential: 0.045 }).differentialShare).toBeCloseTo(0.75, 12);
    expect(ballFeatures({ ...polishedPearl, differential: 0.08 }).differentialShare).toBe(1);
  });

  it('flare: differential share × layout share; a 30° pin gives 0.75 × sin 60° = 0.6495 (±1e-9)', () => {
    const f = ballFeatures({ ...polishedPearl, differential: 0.045, layout: { pinToPapIn: pinToPapInForAngle(30) } });
    expect(Math.abs(f.flare - 0.75 * Math.sin(Math.PI / 3))).toBeLessThan(1e-9);
  });

  it('flare: without a layout the full differential counts and layoutShare is null', () => {
    const { layout: _omit, ...noLayout } = roughAsymSolid;
    const f = ballFeatures(noLayout);
    expect(f.layoutShare).toBeNull();
    expect(f.flare).toBe(f.differentialShare);
  });

  it('throws naming ballFeatures for a malformed ball', () => {
    expect(() => ballFeatures({ ...polishedPearl, polished: 1 as unknown as boolean })).toThrow(/^ballFeatures: polished must be true or false/);
  });
});
