import { describe, expect, it } from 'vitest';
import { MATCHUP_RULES, RULES_BASE_SCORE, rankArsenal, scoreByRules } from '../../engine/index';
import { houseShot, longHeavy, plasticBall, roughAsymSolid, typicalBowler } from './fixtures';

// The rules layer: 50 + the sum of the rules' effects, clamped to 0–100 (engine/rulesLayer.ts).
// The directions of each rule are tested in tests/engine/rules/ with their sources.

describe('scoreByRules', () => {
  it('points: the score is 50 plus the sum of the listed effects (±0.11 for rounding)', () => {
    const r = scoreByRules(roughAsymSolid, typicalBowler, houseShot, 0);
    const sum = r.reasons.reduce((s, x) => s + x.effect, 0);
    expect(Math.abs(r.score - (RULES_BASE_SCORE + sum))).toBeLessThan(0.11);
  });

  it('points: the score is clamped to 0 for a plastic ball on heavy oil', () => {
    const r = scoreByRules(plasticBall, typicalBowler, longHeavy);
    expect(r.score).toBeGreaterThanOrEqual(0);
    expect(r.reasons[0].rule).toBe('plastic-spare-ball');
  });

  it('reasons are sorted by the size of their effect, largest first', () => {
    const sizes = scoreByRules(roughAsymSolid, typicalBowler, houseShot).reasons.map((r) => Math.abs(r.effect));
    expect([...sizes].sort((a, b) => b - a)).toEqual(sizes);
  });

  it('is the rules layer of rankArsenal: same score as the ranked ball’s "rules" layer', () => {
    const ranked = rankArsenal({ balls: [roughAsymSolid], bowler: typicalBowler, pattern: houseShot, gamesBowled: 2 })[0];
    const rules = scoreByRules(roughAsymSolid, typicalBowler, houseShot, 2);
    expect(ranked.layers?.find((l) => l.name === 'rules')?.score).toBe(rules.score);
  });

  it('gamesBowled defaults to 0 (no breakdown reason)', () => {
    const r = scoreByRules(roughAsymSolid, typicalBowler, houseShot);
    expect(r.reasons.map((x) => x.rule)).not.toContain('pattern-breakdown');
  });

  it('every rule is a function in MATCHUP_RULES (11 rules)', () => {
    expect(MATCHUP_RULES).toHaveLength(11);
    for (const rule of MATCHUP_RULES) expect(typeof rule).toBe('function');
  });

  it('throws naming scoreByRules for a malformed ball or pattern', () => {
    expect(() => scoreByRules({ ...roughAsymSolid, rg: Number.NaN }, typicalBowler, houseShot)).toThrow(/^scoreByRules: rg/);
    expect(() => scoreByRules(roughAsymSolid, typicalBowler, { name: 'x', sweeps: 'none' } as never)).toThrow(TypeError);
  });
});
