import { describe, expect, it } from 'vitest';
import { rankArsenal } from '../../../engine/index';
import { fourBalls, houseShot, typicalBowler } from '../fixtures';
import { fifteenBalls } from './fixtures';

// rankArsenal with the ball-motion layer (issue 4): each ball gets the model's prediction on its
// pocket line and its miss room; the score uses entry angle (≈ 6° best, USBC pin-carry research, reported second-hand), pocket
// reachability and miss room; games bowled shift the order (the transition model; common practice).

describe('rankArsenal — ball-motion layer', () => {
  const ranked = rankArsenal({ balls: fourBalls, bowler: typicalBowler, pattern: houseShot });

  it('boards, every ball: a prediction on its pocket line (entry 17.5 ± 0.05, on the lane), miss room ≥ 0, and a "motion" layer score', () => {
    expect(ranked).toHaveLength(fourBalls.length);
    for (const r of ranked) {
      expect(Math.abs(r.prediction.entryBoard - 17.5)).toBeLessThanOrEqual(0.05);
      expect(r.prediction.gutter).toBe(false);
      expect(r.prediction.path.length).toBeGreaterThanOrEqual(61);
      expect(r.missRoom.totalBoards).toBeGreaterThanOrEqual(0);
      expect(r.missRoom.totalBoards).toBeCloseTo(r.missRoom.insideBoards + r.missRoom.outsideBoards, 12);
      expect(r.layers?.map((l) => l.name)).toContain('motion');
    }
  });

  it('reasons, every ball: entry-angle, pocket and miss-room reasons from the model (and a launch reason when the line needs an unusual launch), each with a source naming the model and its publication', () => {
    expect(ranked).toHaveLength(fourBalls.length);
    for (const r of ranked) {
      const motion = r.reasons.filter((x) => x.rule.startsWith('motion-'));
      expect(
        motion
          .map((x) => x.rule)
          .filter((x) => x !== 'motion-launch')
          .sort(),
      ).toEqual(['motion-entry-angle', 'motion-miss-room', 'motion-pocket']);
      for (const x of motion) {
        expect(x.source).toMatch(/ball-motion model.*Frohlich/);
        expect(x.text.length).toBeGreaterThan(10);
      }
    }
  });

  it("boards, every strike ball: a line suggestion from the model whose laydown and target are the prediction's line (to 0.05 board)", () => {
    const strike = ranked.filter((x) => fourBalls.find((b) => b.id === x.id)?.coverType !== 'plastic');
    expect(strike).toHaveLength(3);
    for (const r of strike) {
      const s = r.suggestions.find((x) => x.kind === 'line' && x.text.startsWith("Model's line"));
      expect(s).toBeDefined();
      const change = s?.change as { laydownBoard: number; targetBoard: number };
      expect(Math.abs(change.laydownBoard - r.prediction.laydownBoard)).toBeLessThanOrEqual(0.05 + 1e-9);
      expect(Math.abs(change.targetBoard - r.prediction.targetBoard)).toBeLessThanOrEqual(0.05 + 1e-9);
    }
  });

  // Breakdown on the house shot (the transition model; common practice: a broken-down lane
  // favours cleaner, weaker balls). 15 invented balls, 0 → 9 games.
  const at = (g: number) => rankArsenal({ balls: fifteenBalls(), bowler: typicalBowler, pattern: houseShot, gamesBowled: g });
  const motionOf = (r: ReturnType<typeof at>, id: string) =>
    r.find((x) => x.id === id)?.layers?.find((l) => l.name === 'motion')?.score as number;
  const scoreOf = (r: ReturnType<typeof at>, id: string) => r.find((x) => x.id === id)?.score as number;

  it('points, motion layer alone, 0 → 9 games: the polished pearl gains on the 500-grit solid (the solid needs a still wider launch)', () => {
    const [r0, r9] = [at(0), at(9)];
    const launch = (r: ReturnType<typeof at>) => {
      const p = r.find((x) => x.id === 'solid-500')!.prediction;
      return p.laydownBoard - p.targetBoard;
    };
    expect(launch(r9)).toBeGreaterThan(launch(r0));
    expect(motionOf(r9, 'pearl-polished') - motionOf(r9, 'solid-500')).toBeGreaterThan(
      motionOf(r0, 'pearl-polished') - motionOf(r0, 'solid-500'),
    );
  });

  it('points and rank, combined, 0 → 9 games: every strong sanded solid (500/1000/2000 grit) loses points, the polished pearl gains, and no sanded solid is best', () => {
    const [r0, r9] = [at(0), at(9)];
    for (const id of ['solid-500', 'solid-1000', 'solid-2000']) expect(scoreOf(r9, id)).toBeLessThan(scoreOf(r0, id));
    expect(scoreOf(r9, 'pearl-polished')).toBeGreaterThan(scoreOf(r0, 'pearl-polished'));
    expect(['solid-500', 'solid-1000', 'solid-2000']).not.toContain(r9[0].id);
  });
});
