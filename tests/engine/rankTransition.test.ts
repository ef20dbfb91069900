import { describe, expect, it } from 'vitest';
import { rankArsenal, rankTransition } from '../../engine/index';
import { fourBalls, houseShot, roughAsymSolid, typicalBowler } from './fixtures';

// Definition: rankArsenal at each games-bowled count (common practice: as the track dries the lane asks for
// less ball, so the strong ball loses ground as the pattern breaks down).

describe('rankTransition', () => {
  const input = { balls: fourBalls, bowler: typicalBowler, pattern: houseShot };

  it('default counts 0, 3, 6, 9 games, each equal to rankArsenal at that count', () => {
    const t = rankTransition(input);
    expect(t.map((x) => x.gamesBowled)).toEqual([0, 3, 6, 9]);
    for (const x of t) expect(x.ranking).toEqual(rankArsenal({ ...input, gamesBowled: x.gamesBowled }));
  });

  it('points: the strong solid’s gap to the demand grows from 0 to 9 games (it is more too strong), and its fit score falls', () => {
    const entry = (g: number) => rankTransition(input, [g])[0].ranking.find((r) => r.id === roughAsymSolid.id)!;
    expect(entry(9).fit!.gap).toBeGreaterThan(entry(0).fit!.gap);
    const fit = (g: number) => entry(g).layers?.find((l) => l.name === 'fit')?.score ?? Number.NaN;
    expect(fit(9)).toBeLessThan(fit(0));
  });

  it('throws RangeError naming rankArsenal for a negative count, TypeError for games that are not an array', () => {
    expect(() => rankTransition(input, [-1])).toThrow(/^rankTransition: rankArsenal: gamesBowled must be 0 or more/);
    expect(() => rankTransition({ ...input, balls: undefined as unknown as [] })).toThrow(
      /^rankTransition: rankArsenal: balls must be an array/,
    );
    expect(() => rankTransition(input, 3 as unknown as number[])).toThrow(TypeError);
  });
});
