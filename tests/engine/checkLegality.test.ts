import { describe, expect, it } from 'vitest';
import { checkLegality, USBC_BALL_LIMITS } from '../../engine/index';
import type { BallSpec } from '../../engine/index';

// Check values: the current USBC equipment specifications (docs/sources.md) — weight ≤ 16 lb, diameter
// 8.500–8.595 in, RG 2.460–2.800 in, differential ≤ 0.060 in, hardness ≥ 73 D (the USBC release of June 2020;
// 72 D for balls approved before 2021); limits for balls ≥ 13 lb.

const legal: BallSpec = {
  weightLb: 15,
  diameterIn: 8.55,
  rg: 2.55,
  differential: 0.045,
  intermediateDifferential: 0.01,
  coverType: 'reactive-solid',
  surfaceGrit: 2000,
  polished: false,
  hardnessD: 76,
};

const fields = (b: BallSpec): string[] => checkLegality(b).violations.map((v) => v.field);

describe('checkLegality: each limit, at it and just past it', () => {
  it('a typical 15 lb reactive ball within every limit is legal with no violations', () => {
    expect(checkLegality(legal)).toMatchObject({ legal: true, violations: [] });
  });

  it('weight: 16.00 lb is legal, 16.01 lb is not (USBC equipment specifications: maximum 16.00 lb)', () => {
    expect(checkLegality({ ...legal, weightLb: 16 }).legal).toBe(true);
    expect(fields({ ...legal, weightLb: 16.01 })).toEqual(['weightLb']);
  });

  it('diameter: 8.500 in is legal, 8.499 in is not (USBC equipment specifications: minimum 8.500 in)', () => {
    expect(checkLegality({ ...legal, diameterIn: 8.5 }).legal).toBe(true);
    expect(fields({ ...legal, diameterIn: 8.499 })).toEqual(['diameterIn']);
  });

  it('diameter: 8.595 in is legal, 8.596 in is not (USBC equipment specifications: maximum 8.595 in)', () => {
    expect(checkLegality({ ...legal, diameterIn: 8.595 }).legal).toBe(true);
    expect(fields({ ...legal, diameterIn: 8.596 })).toEqual(['diameterIn']);
  });

  it('diameter: a ball with no diameter is taken as the nominal 8.5 in and is legal', () => {
    // Lanewright's conventions: 8.5 in nominal; USBC equipment specifications: minimum 8.500 in.
    const { diameterIn: _omit, ...noDiameter } = legal;
    expect(checkLegality(noDiameter).legal).toBe(true);
  });

  it('RG: 2.460 in is legal, 2.459 in is not (USBC equipment specifications: minimum 2.460 in)', () => {
    expect(checkLegality({ ...legal, rg: 2.46 }).legal).toBe(true);
    expect(fields({ ...legal, rg: 2.459 })).toEqual(['rg']);
  });

  it('RG: 2.800 in is legal, 2.801 in is not (USBC equipment specifications: maximum 2.800 in)', () => {
    expect(checkLegality({ ...legal, rg: 2.8 }).legal).toBe(true);
    expect(fields({ ...legal, rg: 2.801 })).toEqual(['rg']);
  });

  it('differential: 0.060 in is legal, 0.061 in is not (USBC equipment specifications: maximum 0.060 in)', () => {
    expect(checkLegality({ ...legal, differential: 0.06 }).legal).toBe(true);
    expect(fields({ ...legal, differential: 0.061 })).toEqual(['differential']);
  });

  it('hardness: 73 D is legal, 72.9 D is not (USBC equipment specifications: current minimum 73 D)', () => {
    expect(checkLegality({ ...legal, hardnessD: 73 }).legal).toBe(true);
    expect(fields({ ...legal, hardnessD: 72.9 })).toEqual(['hardnessD']);
  });

  it('several broken limits are all reported, each with its limit and source', () => {
    const r = checkLegality({ ...legal, weightLb: 17, rg: 2.9, differential: 0.07 });
    expect(r.legal).toBe(false);
    expect(r.violations.map((v) => v.field)).toEqual(['weightLb', 'rg', 'differential']);
    expect(r.violations[0].limit).toBe('≤ 16 lb');
    for (const v of r.violations) expect(v.source).toMatch(/USBC/);
  });

  it('intermediate differential is never a violation and is listed as unchecked (no USBC limit found)', () => {
    // No USBC limit on intermediate (mass-bias) differential was found (from memory).
    const r = checkLegality({ ...legal, differential: 0.06, intermediateDifferential: 0.06 });
    expect(r.legal).toBe(true);
    expect(r.unchecked.map((u) => u.field)).toContain('intermediateDifferential');
  });

  it('a ball without a hardness lists hardness as unchecked', () => {
    const { hardnessD: _omit, ...noHardness } = legal;
    expect(checkLegality(noHardness).unchecked.map((u) => u.field)).toContain('hardnessD');
  });

  it('a 10 lb ball: the RG, differential and hardness limits (given for 13 lb and more) are unchecked', () => {
    // Lanewright's conventions (engine/README.md): "current USBC limits for balls of 13 lb and more".
    const r = checkLegality({ ...legal, weightLb: 10, rg: 2.4 });
    expect(r.legal).toBe(true);
    expect(r.unchecked.map((u) => u.field)).toEqual(['rg', 'differential', 'hardnessD', 'intermediateDifferential']);
  });

  it('the exported limits are the USBC values', () => {
    expect(USBC_BALL_LIMITS).toMatchObject({
      maxWeightLb: 16,
      minDiameterIn: 8.5,
      maxDiameterIn: 8.595,
      minRgIn: 2.46,
      maxRgIn: 2.8,
      maxDifferentialIn: 0.06,
      minHardnessD: 73,
    });
  });
});

describe('checkLegality: malformed input throws', () => {
  it.each([
    ['NaN weight', { ...legal, weightLb: Number.NaN }, /checkLegality: weightLb must be a finite number, got NaN/],
    ['negative weight', { ...legal, weightLb: -1 }, /checkLegality: weightLb must be greater than 0, got -1 lb/],
    ['grit 0', { ...legal, surfaceGrit: 0 }, /checkLegality: surfaceGrit must be greater than 0, got 0/],
    ['negative differential', { ...legal, differential: -0.01 }, /checkLegality: differential -0.01 in is below the minimum 0/],
    ['RG as large as the radius', { ...legal, rg: 4.3 }, /checkLegality: rg 4.3 in is not smaller than the ball's radius/],
    ['hardness 101 D', { ...legal, hardnessD: 101 }, /checkLegality: hardnessD 101 D is above the maximum 100 D/],
  ])('RangeError for %s', (_label, ball, message) => {
    expect(() => checkLegality(ball)).toThrow(RangeError);
    expect(() => checkLegality(ball)).toThrow(message);
  });

  it('TypeError for an unknown cover type', () => {
    expect(() => checkLegality({ ...legal, coverType: 'rubber' } as unknown as BallSpec)).toThrow(TypeError);
  });
});
