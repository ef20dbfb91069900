import { describe, expect, it } from 'vitest';
import { ballReaction, REACTION_SCALE } from '../../engine/index';
import type { BallSpec } from '../../engine/index';

// ballReaction: a ball's total reaction on the matchup scale and its parts. Each direction below is the trade's
// (common practice unless a source is named); the sizes are Lanewright's scale (5 points ≈ one surface step).

/** The benchmark of the scale: a reactive hybrid at 3000 grit, RG 2.52, differential 0.045, pin 4 1/2 in from the PAP. */
const benchmark: BallSpec = {
  weightLb: 15,
  rg: 2.52,
  differential: 0.045,
  intermediateDifferential: 0,
  coverType: 'reactive-hybrid',
  surfaceGrit: 3000,
  polished: false,
  layout: { pinToPapIn: 4.5 },
};
const total = (b: Partial<BallSpec>) => ballReaction({ ...benchmark, ...b }).total;
const part = (b: Partial<BallSpec>, key: string) => ballReaction({ ...benchmark, ...b }).factors.find((f) => f.key === key)?.points ?? 0;

describe('ballReaction', () => {
  it('points: the benchmark ball is the middle of the scale (50), every part 0', () => {
    const r = ballReaction(benchmark);
    expect(r.total).toBe(REACTION_SCALE.benchmark);
    expect(r.factors.length).toBeGreaterThan(0);
    for (const f of r.factors) expect(Math.abs(f.points)).toBeLessThanOrEqual(0.1);
  });

  it('cover order in oil: plastic < urethane < pearl < hybrid < solid (common practice)', () => {
    const t = (['plastic', 'urethane', 'reactive-pearl', 'reactive-hybrid', 'reactive-solid'] as const).map((coverType) =>
      total({ coverType }),
    );
    for (let i = 1; i < t.length; i++) expect(t[i]).toBeGreaterThan(t[i - 1]);
  });

  it('surface: 500 > 1000 > 2000 > 3000 > 4000 > 4000 polished, and 2000 → 4000 is one step of 5.5 points (common practice: a lower grit reads earlier, polish adds length)', () => {
    const t = [
      [500, false],
      [1000, false],
      [2000, false],
      [3000, false],
      [4000, false],
      [4000, true],
    ].map(([g, p]) => total({ surfaceGrit: g as number, polished: p as boolean }));
    for (let i = 1; i < t.length; i++) expect(t[i]).toBeLessThan(t[i - 1]);
    expect(total({ surfaceGrit: 2000 }) - total({ surfaceGrit: 4000 })).toBeCloseTo(5.5, 0);
  });

  it('surface matters less on urethane and least on plastic (common practice: reactive covers respond most to sanding)', () => {
    const swing = (coverType: BallSpec['coverType']) =>
      part({ coverType, surfaceGrit: 500 }, 'surface') - part({ coverType, surfaceGrit: 4000 }, 'surface');
    expect(swing('reactive-solid')).toBeGreaterThan(swing('urethane'));
    expect(swing('urethane')).toBeGreaterThan(swing('plastic'));
  });

  it('wear: a cover loses reaction with games since its last resurface, half of the most by 40 games (common practice: resurface every 60–100 games)', () => {
    expect(total({ gamesSinceResurface: 60 })).toBeLessThan(total({ gamesSinceResurface: 0 }));
    expect(part({ gamesSinceResurface: 40 }, 'wear')).toBeCloseTo(-REACTION_SCALE.wearMax / 2, 1);
  });

  it('core: a lower RG, a higher differential and an asymmetric core each add reaction (common practice)', () => {
    expect(total({ rg: 2.46 })).toBeGreaterThan(total({ rg: 2.7 }));
    expect(total({ differential: 0.058 })).toBeGreaterThan(total({ differential: 0.02 }));
    expect(total({ intermediateDifferential: 0.018 })).toBeGreaterThan(total({ intermediateDifferential: 0 }));
  });

  it('layout: the pin 45° from the PAP (3.34 in on an 8.5 in ball) flares most — more reaction than the pin 1 in or 6.5 in away (rigid-body mechanics: migration ∝ sin 2θ)', () => {
    const at45 = part({ layout: { pinToPapIn: (Math.PI / 4) * 4.25 } }, 'flare');
    expect(at45).toBeGreaterThan(part({ layout: { pinToPapIn: 1 } }, 'flare'));
    expect(at45).toBeGreaterThan(part({ layout: { pinToPapIn: 6.5 } }, 'flare'));
  });

  it('drilling angle: a smaller angle reads earlier and smoother than a larger one (common practice), by at most 2 points', () => {
    expect(total({ layout: { pinToPapIn: 4.5, drillingAngleDeg: 30 } })).toBeGreaterThan(
      total({ layout: { pinToPapIn: 4.5, drillingAngleDeg: 70 } }),
    );
    expect(Math.abs(part({ layout: { pinToPapIn: 4.5, drillingAngleDeg: 10 } }, 'drilling-angle'))).toBeLessThanOrEqual(
      REACTION_SCALE.drillingAngleMax,
    );
  });

  it('every part names a source and a label a bowler reads', () => {
    const r = ballReaction({
      ...benchmark,
      coverType: 'reactive-solid',
      surfaceGrit: 2000,
      intermediateDifferential: 0.015,
      gamesSinceResurface: 12,
      layout: { pinToPapIn: 4, drillingAngleDeg: 50 },
    });
    expect(r.factors.map((f) => f.key).sort()).toEqual(['asymmetry', 'cover', 'drilling-angle', 'flare', 'rg', 'surface', 'wear']);
    for (const f of r.factors) {
      expect(f.label.length).toBeGreaterThan(3);
      expect(f.source.length).toBeGreaterThan(10);
    }
  });

  it('throws for a malformed ball, naming ballReaction', () => {
    expect(() => ballReaction({ ...benchmark, surfaceGrit: 0 })).toThrow(/ballReaction: surfaceGrit/);
    expect(() => ballReaction({ ...benchmark, gamesSinceResurface: -1 })).toThrow(/ballReaction: gamesSinceResurface/);
  });
});
