import { describe, expect, it } from 'vitest';
import { rankArsenal, SCORING_LAYERS, scoreByRules } from '../../engine/index';
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

// Directional checks of issue 3, from the rules of thumb in ../shared/TRADE.md 7.2 (common
// practice): cover order plastic → urethane → pearl → hybrid → solid; rougher surface = earlier
// read and more hook in oil, smoother/polished = more length and backend; lower RG = earlier roll;
// plastic is a spare ball (7.1). These are directions, not hard numbers, so the tests check order.

const ids = (pattern: OilPattern, balls: ArsenalBall[] = fourBalls, gamesBowled = 0): string[] =>
  rankArsenal({ balls, bowler: typicalBowler, pattern, gamesBowled }).map((r) => r.id);

const scoreOf = (ball: ArsenalBall, pattern: OilPattern, bowler = typicalBowler, gamesBowled = 0): number =>
  rankArsenal({ balls: [ball], bowler, pattern, gamesBowled })[0].score;

describe('rankArsenal: directional order (common practice, TRADE.md 7.2)', () => {
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
    // TRADE.md 7.1 / 7.2: plastic is a spare ball. On the short light pattern the rough solid
    // scores very low, yet the plastic ball is still listed after it.
    const order = ids(shortLight, [plasticBall, roughAsymSolid]);
    expect(order).toEqual([roughAsymSolid.id, plasticBall.id]);
  });

  it('plastic is suggested for corner spares (a line suggestion naming the 7 and 10 pins)', () => {
    const plastic = rankArsenal({ balls: fourBalls, bowler: typicalBowler, pattern: houseShot }).find((r) => r.id === plasticBall.id);
    expect(plastic?.suggestions).toContainEqual(expect.objectContaining({ kind: 'line', change: { spareTargets: [7, 10] } }));
  });
});

describe('rankArsenal: surface changes move a ball the documented way (TRADE.md 7.2 surface row)', () => {
  const at = (grit: number, polished = false): ArsenalBall => ({ ...roughAsymSolid, id: `solid-${grit}${polished ? 'p' : ''}`, surfaceGrit: grit, polished });

  it('fresh house shot (40 ft, 19.2 mL, 7:1): the strong asymmetric solid at 500 grit reads too early; at 3000 and 4000 grit it fits better', () => {
    expect(scoreOf(at(3000), houseShot)).toBeGreaterThan(scoreOf(at(500), houseShot));
    expect(scoreOf(at(4000), houseShot)).toBeGreaterThan(scoreOf(at(500), houseShot));
    expect(ids(houseShot, [at(500), at(3000)])[0]).toBe('solid-3000');
  });

  it('heavy oil (44 ft, 29.7 mL): the rougher finish is the better one — 500 grit > 2000 grit > 4000 grit polished', () => {
    expect(ids(longHeavy, [at(4000, true), at(500), at(2000)])).toEqual(['solid-500', 'solid-2000', 'solid-4000p']);
  });

  it('the 500 grit solid on the house shot is told to go smoother; the polished pearl on heavy oil is told to sand', () => {
    const solid = rankArsenal({ balls: [at(500)], bowler: typicalBowler, pattern: houseShot })[0];
    const s = solid.suggestions.find((x) => x.kind === 'surface');
    expect(s?.change?.surfaceGrit).toBeGreaterThan(500);
    const pearl = rankArsenal({ balls: [polishedPearl], bowler: typicalBowler, pattern: longHeavy })[0];
    const p = pearl.suggestions.find((x) => x.kind === 'surface');
    expect(p?.text).toMatch(/^Sand to/);
    expect(p?.change).toMatchObject({ polished: false });
  });
});

describe('rankArsenal: bowler and pattern breakdown', () => {
  const fastLowRev = { ...typicalBowler, speedMph: 20, revRpm: 250 };
  const slowHighRev = { ...typicalBowler, speedMph: 15, revRpm: 500 };
  // 1–39 × 10 × 50 µL to 44 ft + 10–30 × 5 × 50 µL to 40 ft = 19 500 + 5 250 µL = 24.75 mL (medium).
  const medium: OilPattern = { name: 'Harrow Bay medium', sweeps: [sweep(1, 39, 44, 10, 50), sweep(10, 30, 40, 5, 50, 'reverse')] };

  // The bowler and breakdown directions belong to the rules layer (issue 3), so they are checked on
  // scoreByRules; the ball-motion layer adds its own physics on top in rankArsenal.
  const rules = (ball: ArsenalBall, pattern: OilPattern, bowler = typicalBowler, g = 0): number =>
    scoreByRules(ball, bowler, pattern, g).score;

  it('rules layer: a high-speed, low-rev bowler needs more ball than a high-rev, low-speed one — the strong solid scores higher for the first, the urethane for the second', () => {
    // Common practice (issue 3; TRADE.md 7.3 ranges).
    expect(rules(roughAsymSolid, medium, fastLowRev)).toBeGreaterThan(rules(roughAsymSolid, medium, slowHighRev));
    expect(rules(urethaneBall, medium, slowHighRev)).toBeGreaterThan(rules(urethaneBall, medium, fastLowRev));
  });

  it('rules layer, medium pattern (24.75 mL): the solid beats the pearl for the high-speed, low-rev bowler and the pearl beats the solid for the high-rev, low-speed bowler', () => {
    expect(rules(roughAsymSolid, medium, fastLowRev)).toBeGreaterThan(rules(polishedPearl, medium, fastLowRev));
    expect(rules(polishedPearl, medium, slowHighRev)).toBeGreaterThan(rules(roughAsymSolid, medium, slowHighRev));
  });

  it('as games are bowled (0 → 3 → 9) the rules layer takes points from the strong solid and gives them to the urethane (oil depletes, the lane hooks more)', () => {
    // Common practice direction (engine/rules/patternBreakdown.ts; TRADE.md 5.2 rationale).
    expect(rules(roughAsymSolid, houseShot, typicalBowler, 3)).toBeLessThan(rules(roughAsymSolid, houseShot, typicalBowler, 0));
    expect(rules(roughAsymSolid, houseShot, typicalBowler, 9)).toBeLessThan(rules(roughAsymSolid, houseShot, typicalBowler, 3));
    expect(rules(urethaneBall, houseShot, typicalBowler, 3)).toBeGreaterThan(rules(urethaneBall, houseShot, typicalBowler, 0));
    expect(rules(urethaneBall, houseShot, typicalBowler, 9)).toBeGreaterThan(rules(urethaneBall, houseShot, typicalBowler, 3));
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

  it('suggestions are of the kinds surface, layout, release and line, and a strike ball gets the rule-of-31 board (40 ft − 31 = 9)', () => {
    // TRADE.md 7.1 rule of 31 (common practice).
    for (const r of result) for (const s of r.suggestions) expect(['surface', 'layout', 'release', 'line']).toContain(s.kind);
    const pearl = result.find((r) => r.id === polishedPearl.id);
    expect(pearl?.suggestions).toContainEqual(expect.objectContaining({ kind: 'line', change: { exitBoard: 9 } }));
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

  it('lists every layer’s own score, the rules layer first, and its score is scoreByRules’', () => {
    // engine/scoringLayers.ts: the rules layer is SCORING_LAYERS[0].
    expect(SCORING_LAYERS[0].name).toBe('rules');
    expect(r.layers?.[0]).toEqual({ name: 'rules', weight: 1, score: scoreByRules(urethaneBall, typicalBowler, houseShot, 2).score });
  });

  it('points: the ball’s score is the weighted mean of its layers’ scores (±0.06 for rounding)', () => {
    // engine/combineLayers.ts: Σ weight × score ÷ Σ weight.
    const layers = r.layers ?? [];
    const mean = layers.reduce((s, l) => s + l.weight * l.score, 0) / layers.reduce((s, l) => s + l.weight, 0);
    expect(Math.abs(r.score - mean)).toBeLessThan(0.06);
  });

  it('the rules layer’s reasons are all among the ball’s reasons', () => {
    const rules = scoreByRules(urethaneBall, typicalBowler, houseShot, 2).reasons;
    for (const reason of rules) expect(r.reasons).toContainEqual(reason);
  });
});
