import { describe, expect, it } from 'vitest';
import { differenceInterval, FOLLOW_UP, moveFollowUp, type HitKind, type ShotRecord } from '../../../engine/index';

// Check values are hand counts of the shots built below; the interval of a difference of two proportions
// is the hybrid score ("method 10") of R. G. Newcombe, "Interval estimation for the difference between
// independent proportions: comparison of eleven methods", Statistics in Medicine 17 (1998) 873–890, whose
// worked example 56/70 − 48/80 gives 0.0524 to 0.3339 (from memory; re-derived by hand below from the
// Wilson limits, E. B. Wilson, JASA 22 (1927) 209–212).

interface F {
  hit: HitKind;
  strike: boolean;
  feet?: number | null;
  target?: number | null;
  ball?: string;
  surface?: string;
}

/** First balls in order over as many 9-frame games as needed; a non-strike leaves the 10 pin and is spared. */
function shots(frames: F[]): ShotRecord[] {
  const out: ShotRecord[] = [];
  frames.forEach((f, k) => {
    const base = {
      sessionId: 's1',
      gameNumber: Math.floor(k / 9) + 1,
      date: '2026-11-20',
      ballId: f.ball ?? 'b1',
      surfaceKey: f.surface ?? '2000 grit',
    };
    const frame = (k % 9) + 1;
    out.push({
      ...base,
      frame,
      delivery: 1,
      standing: f.strike ? [] : [10],
      hit: f.hit,
      feetBoard: f.feet === undefined ? 20 : f.feet,
      targetBoard: f.target === undefined ? 10 : f.target,
    });
    if (!f.strike) out.push({ ...base, frame, delivery: 2, standing: [] });
  });
  return out;
}
const n = (k: number, f: F): F[] => Array.from({ length: k }, () => ({ ...f }));
const pocket: F = { hit: 'pocket', strike: true };
const high: F = { hit: 'high', strike: false };
const light: F = { hit: 'light', strike: false };
const moved = (f: F): F => ({ ...f, feet: 22, target: 11 });

/** Wilson 95 % limits written out again (the definition, Wilson 1927). */
function wilson(h: number, m: number): [number, number] {
  const z = 1.96;
  const p = h / m;
  const d = 1 + (z * z) / m;
  const c = (p + (z * z) / (2 * m)) / d;
  const w = (z / d) * Math.sqrt((p * (1 - p)) / m + (z * z) / (4 * m * m));
  return [h === 0 ? 0 : c - w, h === m ? 1 : c + w];
}

describe('differenceInterval (Newcombe 1998, method 10)', () => {
  it('the worked example 56/70 − 48/80: 0.2, 0.0524 to 0.3339', () => {
    const d = differenceInterval({ hits: 56, n: 70 }, { hits: 48, n: 80 });
    expect(d.diff).toBeCloseTo(0.2, 12);
    expect(d.low).toBeCloseTo(0.0524, 4);
    expect(d.high).toBeCloseTo(0.3339, 4);
    const [l1, u1] = wilson(56, 70);
    const [l2, u2] = wilson(48, 80);
    expect(d.low).toBeCloseTo(0.2 - Math.sqrt((0.8 - l1) ** 2 + (u2 - 0.6) ** 2), 12);
    expect(d.high).toBeCloseTo(0.2 + Math.sqrt((u1 - 0.8) ** 2 + (0.6 - l2) ** 2), 12);
  });

  it('is antisymmetric: swapping the samples mirrors the interval', () => {
    const a = differenceInterval({ hits: 3, n: 12 }, { hits: 10, n: 12 });
    const b = differenceInterval({ hits: 10, n: 12 }, { hits: 3, n: 12 });
    expect(a.diff).toBeCloseTo(-b.diff, 12);
    expect(a.low).toBeCloseTo(-b.high, 12);
    expect(a.high).toBeCloseTo(-b.low, 12);
  });

  it('refuses an empty sample or more hits than trials', () => {
    expect(() => differenceInterval({ hits: 0, n: 0 }, { hits: 1, n: 2 })).toThrow(RangeError);
    expect(() => differenceInterval({ hits: 3, n: 2 }, { hits: 1, n: 2 })).toThrow(/after\.hits/);
  });
});

describe('moveFollowUp', () => {
  it('a right-hander moves 2 left and 1 left after high hits: 3 of 12 pocket before, 10 of 12 after — better, by hand count', () => {
    const [f, ...rest] = moveFollowUp({
      shots: shots([...n(3, pocket), ...n(9, high), ...n(10, moved(pocket)), ...n(2, moved(light))]),
      hand: 'right',
    });
    expect(rest).toHaveLength(0);
    expect(f.feet).toEqual({ direction: 'left', boards: 2 });
    expect(f.target).toEqual({ direction: 'left', boards: 1 });
    expect(f.title).toBe('feet 2 left, target 1 left');
    expect(f.at).toMatchObject({ gameNumber: 2, frame: 4 });
    expect(f.before).toMatchObject({ firstBalls: 12, pocket: { hits: 3, n: 12 }, strike: { hits: 3, n: 12 } });
    expect(f.after).toMatchObject({ firstBalls: 12, pocket: { hits: 10, n: 12 }, strike: { hits: 10, n: 12 } });
    expect(f.judgedBy).toBe('pocket');
    // 10/12 − 3/12 = 58.3 points; by hand from the Wilson limits [0.552, 0.953] and [0.089, 0.532]: 18.5 to 78.4
    expect(f.pocketChange.diff).toBeCloseTo((100 * 7) / 12, 9);
    expect(f.pocketChange.low).toBeCloseTo(18.5, 1);
    expect(f.pocketChange.high).toBeCloseTo(78.4, 1);
    expect(f.verdict).toBe('better');
    expect(f.summary).toMatch(/^Pocket rate \+58 points \(95 % interval \+18 to \+78\): the move worked\.$/);
  });

  it('5 of 6 after against 2 of 6 before is not yet a clear change: the interval still spans 0', () => {
    const [f] = moveFollowUp({
      shots: shots([...n(2, pocket), ...n(4, high), ...n(5, moved(pocket)), moved(light)]),
      hand: 'right',
    });
    expect(f.pocketChange.diff).toBeCloseTo(50, 9);
    expect(f.pocketChange.low as number).toBeLessThan(0);
    expect(f.verdict).toBe('unclear');
    expect(f.summary).toMatch(/no clear change yet/);
  });

  it('fewer than FOLLOW_UP.minShots first balls after the move: too soon, and it says how many', () => {
    const [f] = moveFollowUp({ shots: shots([...n(8, high), ...n(3, moved(pocket))]), hand: 'right' });
    expect(FOLLOW_UP.minShots).toBe(5);
    expect(f.verdict).toBe('too-soon');
    expect(f.summary).toBe('Too soon to tell: 3 first balls since the move and 8 before it; 5 on each side are needed.');
  });

  it('a move that made things worse: 8 of 8 pocket before, 1 of 8 after', () => {
    const [f] = moveFollowUp({ shots: shots([...n(8, pocket), moved(pocket), ...n(7, moved(light))]), hand: 'right' });
    expect(f.pocketChange.diff).toBeCloseTo(-87.5, 9);
    expect(f.verdict).toBe('worse');
  });

  it('a left-hander moving feet from board 20 to 22 moves right (boards are counted from the hand side)', () => {
    const [f] = moveFollowUp({ shots: shots([...n(6, high), ...n(6, moved(pocket))]), hand: 'left' });
    expect(f.feet).toEqual({ direction: 'right', boards: 2 });
    expect(f.target).toEqual({ direction: 'right', boards: 1 });
  });

  it('a ball change and a surface change are moves; a board missing on one side is not', () => {
    const follow = moveFollowUp({
      shots: shots([
        ...n(5, high),
        { ...light, feet: null },
        ...n(5, { ...pocket, ball: 'b2' }),
        ...n(5, { ...pocket, ball: 'b2', surface: '4000 grit' }),
      ]),
      hand: 'right',
    });
    expect(follow.map((f) => f.title)).toEqual(['ball change', 'surface 2000 grit → 4000 grit']);
    expect(follow[0].ball).toEqual({ from: 'b1', to: 'b2' });
    expect(follow[0].feet).toBeUndefined();
    expect(follow[0].before.firstBalls).toBe(6);
    expect(follow[1].before.firstBalls).toBe(5);
  });

  it('reads at most `window` first balls each side, and stops the after side at the next move', () => {
    const follow = moveFollowUp({
      shots: shots([...n(10, high), ...n(4, moved(pocket)), ...n(4, { ...pocket, feet: 24, target: 12 })]),
      hand: 'right',
      window: 6,
    });
    expect(follow).toHaveLength(2);
    expect(follow[0].before.firstBalls).toBe(6);
    expect(follow[0].after.firstBalls).toBe(4);
    expect(follow[1].before.firstBalls).toBe(4);
  });

  it('no move, no follow-up; bad input is refused by name', () => {
    expect(moveFollowUp({ shots: shots(n(9, pocket)), hand: 'right' })).toEqual([]);
    expect(() => moveFollowUp({ shots: [], hand: 'both' as 'right' })).toThrow(/moveFollowUp/);
    expect(() => moveFollowUp({ shots: [], hand: 'right', window: 0 })).toThrow(RangeError);
  });
});
