import { describe, expect, it } from 'vitest';
import { matchupContext } from '../../engine/index';
import { houseShot, longHeavy, typicalBowler } from './fixtures';

// Definitions (engine/matchupContext.ts): volumeDemand = (mL − 15) ÷ 15, lengthDemand =
// (ft − 33) ÷ 15, oilDemand = 0.55 × volume + 0.45 × length; bowlerNeed from speed and revs;
// breakdown = g ÷ (g + 6). Values derived by hand.

describe('matchupContext', () => {
  it('demand, long heavy fixture (29.7 mL, 44 ft): volume 0.98, length 0.7333, oil 0.869 (±1e-9)', () => {
    const c = matchupContext(typicalBowler, longHeavy);
    expect(c.volumeDemand).toBeCloseTo(14.7 / 15, 9);
    expect(c.lengthDemand).toBeCloseTo(11 / 15, 9);
    expect(c.oilDemand).toBeCloseTo(0.55 * (14.7 / 15) + 0.45 * (11 / 15), 9);
  });

  it('demand, house fixture (19.18 mL, 40 ft): volume 0.27867, length 0.46667 (±1e-9)', () => {
    const c = matchupContext(typicalBowler, houseShot);
    expect(c.volumeDemand).toBeCloseTo(4.18 / 15, 9);
    expect(c.lengthDemand).toBeCloseTo(7 / 15, 9);
  });

  it('bowler need: 17 mph / 350 rpm is 0.5; 21 mph / 200 rpm is 1; 13 mph / 500 rpm is 0', () => {
    expect(matchupContext(typicalBowler, houseShot).bowlerNeed).toBe(0.5);
    expect(matchupContext({ ...typicalBowler, speedMph: 21, revRpm: 200 }, houseShot).bowlerNeed).toBe(1);
    expect(matchupContext({ ...typicalBowler, speedMph: 13, revRpm: 500 }, houseShot).bowlerNeed).toBe(0);
  });

  it('breakdown: 0 games 0; 3 games 3/9 = 0.3333; 6 games 0.5 (±1e-12)', () => {
    expect(matchupContext(typicalBowler, houseShot, 0).breakdown).toBe(0);
    expect(matchupContext(typicalBowler, houseShot, 3).breakdown).toBeCloseTo(1 / 3, 12);
    expect(matchupContext(typicalBowler, houseShot, 6).breakdown).toBe(0.5);
  });

  it('target strength falls as games are bowled and rises with the bowler’s need', () => {
    const t = (g: number, speedMph = 17): number => matchupContext({ ...typicalBowler, speedMph }, houseShot, g).targetStrength;
    expect(t(6)).toBeLessThan(t(0));
    expect(t(0, 20)).toBeGreaterThan(t(0));
  });

  it('throws RangeError for a negative or NaN games count', () => {
    expect(() => matchupContext(typicalBowler, houseShot, -2)).toThrow(/matchupContext: gamesBowled must be 0 or more, got -2/);
    expect(() => matchupContext(typicalBowler, houseShot, Number.NaN)).toThrow(RangeError);
  });
});
