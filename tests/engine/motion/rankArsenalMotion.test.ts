import { describe, expect, it } from 'vitest';
import { rankArsenal } from '../../../engine/index';
import { fourBalls, houseShot, polishedPearl, roughAsymSolid, typicalBowler } from '../fixtures';
import { fifteenBalls } from './fixtures';

// rankArsenal with the ball-motion layer (issue 4): each ball gets the model's prediction on its
// pocket line and its miss room; the score uses entry angle (≈ 6° best, TRADE.md §2.2), pocket
// reachability and miss room; games bowled shift the order (PHYSICS.md §5.4, TRADE.md §5.2).

describe('rankArsenal — ball-motion layer', () => {
  const ranked = rankArsenal({ balls: fourBalls, bowler: typicalBowler, pattern: houseShot });

  it('boards, every ball: a prediction on its pocket line (entry 17.5 ± 0.05, on the lane), miss room ≥ 0, and a "motion" layer score', () => {
    for (const r of ranked) {
      expect(Math.abs(r.prediction.entryBoard - 17.5)).toBeLessThanOrEqual(0.05);
      expect(r.prediction.gutter).toBe(false);
      expect(r.prediction.path.length).toBeGreaterThanOrEqual(61);
      expect(r.missRoom.totalBoards).toBeGreaterThanOrEqual(0);
      expect(r.missRoom.totalBoards).toBeCloseTo(r.missRoom.insideBoards + r.missRoom.outsideBoards, 12);
      expect(r.layers?.map((l) => l.name)).toContain('motion');
    }
  });

  it('reasons, every ball: entry-angle, pocket and miss-room reasons from the model, each with a source naming PHYSICS.md', () => {
    for (const r of ranked) {
      const motion = r.reasons.filter((x) => x.rule.startsWith('motion-'));
      expect(motion.map((x) => x.rule).sort()).toEqual(['motion-entry-angle', 'motion-miss-room', 'motion-pocket']);
      for (const x of motion) { expect(x.source).toMatch(/PHYSICS\.md/); expect(x.text.length).toBeGreaterThan(10); }
    }
  });

  it('boards, every strike ball: a line suggestion from the model whose laydown and target are the prediction\'s line (to 0.05 board)', () => {
    for (const r of ranked.filter((x) => fourBalls.find((b) => b.id === x.id)?.coverType !== 'plastic')) {
      const s = r.suggestions.find((x) => x.kind === 'line' && x.text.startsWith('Ball-motion model'));
      expect(s).toBeDefined();
      const change = s?.change as { laydownBoard: number; targetBoard: number };
      expect(Math.abs(change.laydownBoard - r.prediction.laydownBoard)).toBeLessThanOrEqual(0.05 + 1e-9);
      expect(Math.abs(change.targetBoard - r.prediction.targetBoard)).toBeLessThanOrEqual(0.05 + 1e-9);
    }
  });

  it('points, 0 → 9 games on the house shot: the strong rough solid loses motion-layer points, more than the polished pearl (oil depletes on the track, PHYSICS.md §5.4)', () => {
    const motion = (id: string, g: number) => rankArsenal({ balls: fourBalls, bowler: typicalBowler, pattern: houseShot, gamesBowled: g })
      .find((r) => r.id === id)?.layers?.find((l) => l.name === 'motion')?.score as number;
    const solidDrop = motion(roughAsymSolid.id, 0) - motion(roughAsymSolid.id, 9);
    const pearlDrop = motion(polishedPearl.id, 0) - motion(polishedPearl.id, 9);
    expect(solidDrop).toBeGreaterThan(0);
    expect(solidDrop).toBeGreaterThan(pearlDrop);
  });

  it('rank, 15 balls, 0 → 9 games on the house shot: the strong sanded solids move down and the cleaner, weaker balls move up on average (TRADE.md §5.2 breakdown, common practice)', () => {
    const strong = ['solid-500', 'solid-1000', 'solid-2000'];
    const clean = ['pearl-polished', 'hybrid-long', 'pearl-weak', 'hybrid-polished'];
    const meanRank = (g: number, ids: string[]) => {
      const order = rankArsenal({ balls: fifteenBalls(), bowler: typicalBowler, pattern: houseShot, gamesBowled: g }).map((r) => r.id);
      return ids.reduce((s, id) => s + order.indexOf(id), 0) / ids.length;
    };
    expect(meanRank(9, strong)).toBeGreaterThan(meanRank(0, strong));
    expect(meanRank(9, clean)).toBeLessThan(meanRank(0, clean));
  });
});
