import { describe, expect, it } from 'vitest';
import { PAIR_ADVICE, pairAdvice, rankTransition } from '../../engine/index';
import { fourBalls, houseShot, polishedPearl, roughAsymSolid, shortLight, typicalBowler, urethaneBall } from './fixtures';

// Direction check (common practice): as a pattern breaks down over games the lane hooks earlier, so a strong rough
// solid that suits the fresh house shot gives way to a cleaner, weaker ball (a polished pearl); on a short, light
// pattern that breaks down, urethane's smooth, early, controlled motion takes over from the pearl. The figures are
// the model's own (rankTransition); PAIR_ADVICE.minLead is Lanewright's threshold.

const base = { balls: fourBalls, bowler: typicalBowler };

describe('pairAdvice', () => {
  it('fresh house shot: the rough solid and the pearl are within the threshold; after 10 games the pearl leads the solid clearly — change', () => {
    const [fresh] = rankTransition({ ...base, pattern: houseShot }, [0]);
    const s0 = fresh.ranking.find((b) => b.id === roughAsymSolid.id)!.score;
    const p0 = fresh.ranking.find((b) => b.id === polishedPearl.id)!.score;
    expect(Math.abs(p0 - s0)).toBeLessThan(PAIR_ADVICE.minLead);

    const a = pairAdvice({ ...base, pattern: houseShot, gamesBowled: 10, ballInUse: roughAsymSolid.id });
    expect(a.change).toBe(true);
    expect(a.best.id).toBe(polishedPearl.id);
    expect(a.inUse.placeNow).toBeGreaterThan(a.inUse.placeFresh);
    expect(a.inUse.scoreNow).toBeLessThan(a.inUse.scoreFresh);
    expect(a.best.score - a.inUse.scoreNow).toBeGreaterThanOrEqual(PAIR_ADVICE.minLead);
    expect(a.detail).toMatch(/^After 10 games on this pair the model ranks .+ first .+ time to think about changing balls\.$/);
  });

  it('the pearl on the same pair after 10 games: keep it', () => {
    const a = pairAdvice({ ...base, pattern: houseShot, gamesBowled: 10, ballInUse: polishedPearl.id });
    expect(a.change).toBe(false);
    expect(a.detail).toBe(`After 10 games on this pair ${polishedPearl.id} is still the model's first choice.`);
  });

  it('short, light pattern: the pearl leads fresh, urethane takes over by 20 games', () => {
    expect(pairAdvice({ ...base, pattern: shortLight, gamesBowled: 1, ballInUse: polishedPearl.id }).change).toBe(false);
    const late = pairAdvice({ ...base, pattern: shortLight, gamesBowled: 20, ballInUse: polishedPearl.id });
    expect(late.best.id).toBe(urethaneBall.id);
    expect(late.change).toBe(true);
  });

  it('uses the balls’ labels in its sentence; refuses games outside 1–50 and a ball not in the arsenal', () => {
    const labelled = fourBalls.map((b) => ({ ...b, label: `Ball ${b.id}` }));
    expect(
      pairAdvice({ balls: labelled, bowler: typicalBowler, pattern: houseShot, gamesBowled: 10, ballInUse: polishedPearl.id }).detail,
    ).toContain(`Ball ${polishedPearl.id} is still`);
    expect(() => pairAdvice({ ...base, pattern: houseShot, gamesBowled: 0, ballInUse: polishedPearl.id })).toThrow(RangeError);
    expect(() => pairAdvice({ ...base, pattern: houseShot, gamesBowled: 3, ballInUse: 'nobody' })).toThrow(/pairAdvice: ballInUse/);
  });
});
