import { describe, expect, it } from 'vitest';
import { compareRanked, rankArsenal } from '../../engine/index';
import { fourBalls, houseShot, typicalBowler } from './fixtures';

/** compareRanked is rankArsenal's own order (the what-if re-orders a ranking with it after changing one ball's score). */
describe('compareRanked', () => {
  it('orders by standing, then score (highest first), then id', () => {
    const list = [
      { id: 'b', score: 60, standing: 'spare' as const },
      { id: 'c', score: 70 },
      { id: 'a', score: 70, standing: 'strike' as const },
      { id: 'd', score: 95, standing: 'illegal' as const },
      { id: 'e', score: 40, standing: 'strike' as const },
    ];
    expect([...list].sort(compareRanked).map((r) => r.id)).toEqual(['a', 'c', 'e', 'b', 'd']);
  });

  it('gives back exactly the order rankArsenal returns', () => {
    const ranked = rankArsenal({ balls: fourBalls, bowler: typicalBowler, pattern: houseShot });
    expect(ranked.length).toBe(fourBalls.length);
    const shuffled = [...ranked].reverse().map((r) => ({ id: r.id, score: r.score, standing: r.standing }));
    expect(shuffled.sort(compareRanked).map((r) => r.id)).toEqual(ranked.map((r) => r.id));
  });
});
