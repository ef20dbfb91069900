import { describe, expect, it } from 'vitest';
import { analyzePattern, conditionDemand, DEMAND_SCALE } from '../../engine/index';
import type { BowlerProfile, OilPattern } from '../../engine/index';
import { houseShot, sweep, typicalBowler } from './fixtures';

// conditionDemand: how much ball a condition asks of a bowler, and its parts. Directions from the trade (common
// practice); sizes are Lanewright's scale (5 points ≈ one surface step).

const scaled = (p: OilPattern, k: number): OilPattern => ({
  name: p.name,
  sweeps: p.sweeps.map((s) => ({ ...s, microlitersPerBoard: s.microlitersPerBoard * k })),
});
const d = (
  o: {
    pattern?: OilPattern;
    bowler?: Partial<BowlerProfile>;
    games?: number;
    lane?: { kind: 'wood' | 'synthetic'; friction: 'low' | 'medium' | 'high' };
  } = {},
) =>
  conditionDemand({
    analysis: analyzePattern(o.pattern ?? houseShot),
    bowler: { ...typicalBowler, ...o.bowler },
    gamesBowled: o.games,
    lane: o.lane,
  }).total;

describe('conditionDemand', () => {
  it('points: the reference condition (40 ft, 21 mL, 4:1, medium synthetic, fresh, 17 mph / 350 rpm / 45° / 15°) asks for DEMAND_SCALE.reference', () => {
    // Worked by hand: boards 1–39 × 1 crossing × 300 µL, boards 10–30 × 3 crossings × 300 µL (reverse), both to 40 ft:
    // outside boards 300 µL, middle boards 1 200 µL → 4:1; 39 × 300 + 21 × 900 = 30 600 µL = 30.6 mL.
    const p: OilPattern = { name: 'reference', sweeps: [sweep(1, 39, 40, 1, 300), sweep(10, 30, 40, 3, 300, 'reverse')] };
    const a = analyzePattern(p);
    expect(a.lengthFt).toBe(40);
    expect(a.volumeMl).toBeCloseTo(30.6, 6);
    expect(a.ratio).toBeCloseTo(4, 6);
    const r = conditionDemand({ analysis: a, bowler: typicalBowler });
    // only the volume differs from the reference: (30.6 − 21) × 1.0
    expect(r.total).toBeCloseTo(DEMAND_SCALE.reference + DEMAND_SCALE.perMl * (30.6 - DEMAND_SCALE.referenceMl), 1);
    expect(r.factors.map((f) => f.key)).toEqual(['volume']);
  });

  it('more oil asks for more ball; a longer pattern at the same volume more, about one and a half surface steps per 5 ft (common practice)', () => {
    expect(d({ pattern: scaled(houseShot, 1.5) })).toBeGreaterThan(d());
    const longer: OilPattern = { name: 'longer', sweeps: houseShot.sweeps.map((s) => ({ ...s, endFt: s.endFt + 5 })) };
    expect(analyzePattern(longer).volumeMl).toBeCloseTo(analyzePattern(houseShot).volumeMl, 6);
    expect(d({ pattern: longer }) - d()).toBeGreaterThan(5);
    expect(d({ pattern: longer }) - d()).toBeLessThan(10);
  });

  it('a high ratio (friction outside) asks for less ball than a flat pattern of the same volume (common practice; USBC sport limit 3:1)', () => {
    const flat: OilPattern = { name: 'flat', sweeps: [sweep(1, 39, 40, 1, 490)] };
    expect(analyzePattern(flat).ratio).toBeCloseTo(1, 6);
    expect(analyzePattern(houseShot).ratio).toBeGreaterThan(6);
    const flatAtHouseVolume = scaled(flat, analyzePattern(houseShot).volumeMl / analyzePattern(flat).volumeMl);
    expect(d({ pattern: flatAtHouseVolume })).toBeGreaterThan(d());
  });

  it('the lane: a high-friction surface asks for less ball than a low-friction one; after games a wood lane has broken down more (common practice)', () => {
    expect(d({ lane: { kind: 'synthetic', friction: 'high' } })).toBeLessThan(d({ lane: { kind: 'synthetic', friction: 'low' } }));
    expect(d({ games: 6, lane: { kind: 'wood', friction: 'medium' } })).toBeLessThan(
      d({ games: 6, lane: { kind: 'synthetic', friction: 'medium' } }),
    );
  });

  it('transition: 0 → 3 → 9 games asks for less and less ball (the track dries, common practice)', () => {
    expect(d({ games: 3 })).toBeLessThan(d({ games: 0 }));
    expect(d({ games: 9 })).toBeLessThan(d({ games: 3 }));
  });

  it('the bowler: more speed and more tilt ask for more ball; more revs and more axis rotation for less (common practice)', () => {
    expect(d({ bowler: { speedMph: 19 } })).toBeGreaterThan(d({ bowler: { speedMph: 16 } }));
    expect(d({ bowler: { axisTiltDeg: 25 } })).toBeGreaterThan(d({ bowler: { axisTiltDeg: 5 } }));
    expect(d({ bowler: { revRpm: 450 } })).toBeLessThan(d({ bowler: { revRpm: 280 } }));
    expect(d({ bowler: { axisRotationDeg: 65 } })).toBeLessThan(d({ bowler: { axisRotationDeg: 30 } }));
  });

  it('a left-hander asks the same of a mirrored pattern as a right-hander of the original', () => {
    const mirrored: OilPattern = {
      name: 'm',
      sweeps: houseShot.sweeps.map((s) => ({ ...s, fromBoard: 40 - s.toBoard, toBoard: 40 - s.fromBoard })),
    };
    expect(d({ pattern: mirrored, bowler: { hand: 'left' } })).toBe(d());
  });
});
