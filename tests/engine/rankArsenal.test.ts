import { describe, expect, it } from 'vitest';
import { fitLayer, matchupContext, rankArsenal, SCORING_LAYERS } from '../../engine/index';
import type { ArsenalBall, OilPattern } from '../../engine/index';
import {
  fourBalls,
  houseShot,
  longHeavy,
  plasticBall,
  polishedPearl,
  roughAsymSolid,
  shortLight,
  sweep,
  typicalBowler,
  urethaneBall,
} from './fixtures';

// Directional checks from the trade (common practice): cover order plastic → urethane → pearl → hybrid →
// solid in oil; a rougher surface reads earlier and hooks more in oil, a smoother or polished one goes longer;
// plastic is a spare ball (a straight ball for corner pins). These are directions, not hard numbers, so the
// tests check order. The trade's headline cases are in tradeCases.test.ts.

const ids = (pattern: OilPattern, balls: ArsenalBall[] = fourBalls, gamesBowled = 0): string[] =>
  rankArsenal({ balls, bowler: typicalBowler, pattern, gamesBowled }).map((r) => r.id);

const scoreOf = (ball: ArsenalBall, pattern: OilPattern, bowler = typicalBowler, gamesBowled = 0): number =>
  rankArsenal({ balls: [ball], bowler, pattern, gamesBowled })[0].score;

describe('rankArsenal: directional order (common practice: cover types and surfaces)', () => {
  it('long heavy pattern (44 ft, 29.7 mL): rough strong low-RG asymmetric solid > polished pearl > urethane > plastic', () => {
    expect(ids(longHeavy)).toEqual([roughAsymSolid.id, polishedPearl.id, urethaneBall.id, plasticBall.id]);
  });

  it('short light pattern (35 ft, 15.1 mL): the order turns — urethane and the polished pearl outrank the rough solid', () => {
    const order = ids(shortLight);
    expect(order[0]).not.toBe(roughAsymSolid.id);
    expect(order.indexOf(urethaneBall.id)).toBeLessThan(order.indexOf(roughAsymSolid.id));
    expect(order.indexOf(polishedPearl.id)).toBeLessThan(order.indexOf(roughAsymSolid.id));
    expect(order[order.length - 1]).toBe(plasticBall.id);
  });

  it('plastic is never first for strikes, even next to a strike ball that scores lower', () => {
    // Common practice: plastic is a spare ball. On the short light pattern the rough solid
    // scores very low, yet the plastic ball is still listed after it.
    const order = ids(shortLight, [plasticBall, roughAsymSolid]);
    expect(order).toEqual([roughAsymSolid.id, plasticBall.id]);
  });

  it('plastic is suggested for corner spares (a line suggestion naming the 7 and 10 pins)', () => {
    const plastic = rankArsenal({ balls: fourBalls, bowler: typicalBowler, pattern: houseShot }).find((r) => r.id === plasticBall.id);
    expect(plastic?.suggestions).toContainEqual(expect.objectContaining({ kind: 'line', change: { spareTargets: [7, 10] } }));
  });
});

describe('rankArsenal: surface changes move a ball the way the trade teaches (common practice: lower grit reads earlier)', () => {
  const at = (grit: number, polished = false): ArsenalBall => ({
    ...roughAsymSolid,
    id: `solid-${grit}${polished ? 'p' : ''}`,
    surfaceGrit: grit,
    polished,
  });

  it('fresh house shot (40 ft, 19.2 mL, 7:1): the strong asymmetric solid at 500 grit reads too early; at 3000 and 4000 grit it fits better', () => {
    expect(scoreOf(at(3000), houseShot)).toBeGreaterThan(scoreOf(at(500), houseShot));
    expect(scoreOf(at(4000), houseShot)).toBeGreaterThan(scoreOf(at(500), houseShot));
    expect(ids(houseShot, [at(500), at(3000)])[0]).toBe('solid-3000');
  });

  it('heavy oil (44 ft, 29.7 mL): the rougher finish is the better one — 500 grit > 2000 grit > 4000 grit polished', () => {
    expect(ids(longHeavy, [at(4000, true), at(500), at(2000)])).toEqual(['solid-500', 'solid-2000', 'solid-4000p']);
  });

  it('the 500 grit solid on the house shot is told to go smoother; the polished pearl on heavy oil is told to sand, without polish', () => {
    const solid = rankArsenal({ balls: [at(500)], bowler: typicalBowler, pattern: houseShot })[0];
    const s = solid.suggestions.find((x) => x.kind === 'surface');
    expect(s?.change?.surfaceGrit).toBeGreaterThan(500);
    expect(s?.text).toMatch(/^Go smoother/);
    const pearl = rankArsenal({ balls: [polishedPearl], bowler: typicalBowler, pattern: longHeavy })[0];
    const p = pearl.suggestions.find((x) => x.kind === 'surface');
    expect(p?.text).toMatch(/^Sand it rougher/);
    expect(p?.change).toMatchObject({ polished: false });
  });
});

describe('rankArsenal: the bowler and the games bowled (common practice)', () => {
  const fastLowRev = { ...typicalBowler, speedMph: 20, revRpm: 250 };
  const slowHighRev = { ...typicalBowler, speedMph: 15, revRpm: 500 };
  // 1–39 × 10 × 50 µL to 41 ft + 10–30 × 5 × 50 µL to 38 ft = 19 500 + 5 250 µL = 24.75 mL (medium, 41 ft).
  const medium: OilPattern = { name: 'Harrow Bay medium', sweeps: [sweep(1, 39, 41, 10, 50), sweep(10, 30, 38, 5, 50, 'reverse')] };
  const fit = (ball: ArsenalBall, pattern: OilPattern, bowler = typicalBowler, g = 0) => fitLayer(ball, matchupContext(bowler, pattern, g));

  it('a high-speed, low-rev bowler needs more ball than a high-rev, low-speed one: the demand is higher, and the strong solid fits the first, the urethane the second', () => {
    expect(fit(roughAsymSolid, medium, fastLowRev).fit.demand).toBeGreaterThan(fit(roughAsymSolid, medium, slowHighRev).fit.demand);
    expect(fit(roughAsymSolid, medium, fastLowRev).score).toBeGreaterThan(fit(roughAsymSolid, medium, slowHighRev).score);
    expect(fit(urethaneBall, medium, slowHighRev).score).toBeGreaterThan(fit(urethaneBall, medium, fastLowRev).score);
  });

  it('medium pattern (24.75 mL): the solid ranks above the pearl for the high-speed, low-rev bowler, the pearl above the solid for the high-rev, low-speed one', () => {
    expect(
      ids(
        medium,
        [roughAsymSolid, polishedPearl].map((b) => b),
        0,
      ).length,
    ).toBe(2);
    const first = (bowler: typeof typicalBowler) => rankArsenal({ balls: [roughAsymSolid, polishedPearl], bowler, pattern: medium })[0].id;
    expect(first(fastLowRev)).toBe(roughAsymSolid.id);
    expect(first(slowHighRev)).toBe(polishedPearl.id);
  });

  it('as games are bowled (0 → 3 → 9) the demand falls, so the strong solid loses fit points and the urethane gains', () => {
    const d = [0, 3, 9].map((g) => fit(roughAsymSolid, houseShot, typicalBowler, g).fit.demand);
    expect(d[1]).toBeLessThan(d[0]);
    expect(d[2]).toBeLessThan(d[1]);
    expect(fit(roughAsymSolid, houseShot, typicalBowler, 9).score).toBeLessThanOrEqual(
      fit(roughAsymSolid, houseShot, typicalBowler, 0).score,
    );
    expect(fit(urethaneBall, houseShot, typicalBowler, 9).score).toBeGreaterThan(fit(urethaneBall, houseShot, typicalBowler, 0).score);
  });
});

describe('rankArsenal: result shape', () => {
  const result = rankArsenal({ balls: fourBalls, bowler: typicalBowler, pattern: houseShot });

  it('one entry per ball, scores 0–100, strike balls best first', () => {
    expect(result).toHaveLength(4);
    for (const r of result) {
      expect(r.score).toBeGreaterThanOrEqual(0);
      expect(r.score).toBeLessThanOrEqual(100);
    }
    const strike = result.filter((r) => r.id !== plasticBall.id).map((r) => r.score);
    expect([...strike].sort((a, b) => b - a)).toEqual(strike);
  });

  it('every reason names its rule, effect, a sentence and a source', () => {
    for (const r of result) {
      expect(r.reasons.length).toBeGreaterThan(0);
      for (const reason of r.reasons) {
        expect(reason.rule).toMatch(/^[a-z0-9-]+$/);
        expect(Number.isFinite(reason.effect)).toBe(true);
        expect(reason.text).toMatch(/\.$/);
        expect(reason.source.length).toBeGreaterThan(5);
      }
    }
  });

  it("suggestions are of the kinds surface, layout, release, line and ball; every strike ball gets the model's line", () => {
    expect(result).toHaveLength(4);
    for (const r of result) for (const s of r.suggestions) expect(['surface', 'layout', 'release', 'line', 'ball']).toContain(s.kind);
    for (const r of result.filter((x) => x.standing === 'strike'))
      expect(r.suggestions.some((x) => x.kind === 'line' && 'laydownBoard' in (x.change ?? {}))).toBe(true);
  });

  it('a ball that is too strong or too weak is pointed to the strike ball of the arsenal that fits best', () => {
    const r = rankArsenal({
      balls: [roughAsymSolid, polishedPearl, { ...polishedPearl, id: 'pearl-1000', surfaceGrit: 1000, polished: false }],
      bowler: typicalBowler,
      pattern: shortLight,
    });
    const solid = r.find((x) => x.id === roughAsymSolid.id)!;
    expect(solid.fit?.verdict).toBe('too-strong');
    const ball = solid.suggestions.find((x) => x.kind === 'ball');
    expect(ball).toBeDefined();
    const best = r
      .filter((x) => x.standing === 'strike' && x.id !== solid.id)
      .sort((a, b) => Math.abs(a.fit!.gap) - Math.abs(b.fit!.gap))[0];
    expect(ball?.change).toEqual({ ballId: best.id });
  });

  it('the same input gives the same result (no randomness, no clock)', () => {
    expect(rankArsenal({ balls: fourBalls, bowler: typicalBowler, pattern: houseShot })).toEqual(result);
  });

  it('an empty arsenal gives an empty ranking', () => {
    expect(rankArsenal({ balls: [], bowler: typicalBowler, pattern: houseShot })).toEqual([]);
  });

  it('ties are broken by id, so equal balls come out in a fixed order', () => {
    const twin = { ...urethaneBall, id: 'a-twin' };
    expect(ids(houseShot, [urethaneBall, twin])).toEqual(['a-twin', urethaneBall.id]);
  });
});

describe('rankArsenal: malformed input throws, naming rankArsenal', () => {
  it('RangeError for two balls with the same id', () => {
    expect(() => rankArsenal({ balls: [urethaneBall, urethaneBall], bowler: typicalBowler, pattern: houseShot })).toThrow(
      /rankArsenal: ball id "kestrel-loam" is used twice/,
    );
  });
  it('TypeError for a ball without an id', () => {
    const { id: _omit, ...noId } = urethaneBall;
    expect(() => rankArsenal({ balls: [noId as ArsenalBall], bowler: typicalBowler, pattern: houseShot })).toThrow(TypeError);
  });
  it('RangeError for a negative games count, a grit of 0 and a bowler speed of 0', () => {
    expect(() => rankArsenal({ balls: fourBalls, bowler: typicalBowler, pattern: houseShot, gamesBowled: -1 })).toThrow(
      /rankArsenal: gamesBowled must be 0 or more, got -1/,
    );
    expect(() => rankArsenal({ balls: [{ ...urethaneBall, surfaceGrit: 0 }], bowler: typicalBowler, pattern: houseShot })).toThrow(
      /rankArsenal: surfaceGrit must be greater than 0, got 0/,
    );
    expect(() => rankArsenal({ balls: fourBalls, bowler: { ...typicalBowler, speedMph: 0 }, pattern: houseShot })).toThrow(
      /rankArsenal: speedMph must be greater than 0/,
    );
  });
  it('TypeError for balls that are not an array', () => {
    expect(() => rankArsenal({ balls: {} as ArsenalBall[], bowler: typicalBowler, pattern: houseShot })).toThrow(TypeError);
  });
});

describe('rankArsenal: scoring layers', () => {
  const [r] = rankArsenal({ balls: [urethaneBall], bowler: typicalBowler, pattern: houseShot, gamesBowled: 2 });

  it('lists every layer’s own score, the fit layer first, and its score is fitLayer’s', () => {
    expect(SCORING_LAYERS[0].name).toBe('fit');
    expect(r.layers?.map((l) => l.name)).toEqual(['fit', 'motion']);
    expect(r.layers?.[0].score).toBe(fitLayer(urethaneBall, matchupContext(typicalBowler, houseShot, 2)).score);
  });

  it('points: the ball’s score is the weighted mean of its layers’ scores (±0.06 for rounding)', () => {
    const layers = r.layers ?? [];
    expect(layers).toHaveLength(2);
    const mean = layers.reduce((s, l) => s + l.weight * l.score, 0) / layers.reduce((s, l) => s + l.weight, 0);
    expect(Math.abs(r.score - mean)).toBeLessThan(0.06);
  });

  it('the fit layer’s reasons are all among the ball’s reasons, and its verdict is the entry’s fit', () => {
    const f = fitLayer(urethaneBall, matchupContext(typicalBowler, houseShot, 2));
    expect(f.reasons.length).toBeGreaterThan(3);
    for (const reason of f.reasons) expect(r.reasons).toContainEqual(reason);
    expect(r.fit).toEqual({ strength: f.fit.strength, demand: f.fit.demand, gap: f.fit.gap, verdict: f.fit.verdict });
  });
});
