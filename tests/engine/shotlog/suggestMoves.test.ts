import { describe, expect, it } from 'vitest';
import { suggestMoves, type HitKind, type ShotRecord } from '../../../engine/index';

// Check values: the 2-and-1 adjustment (common practice, C): feet 2 boards and target 1 board
// the same way; "move in the direction of the miss" (common practice): a right-hander hitting high
// moves left, light moves right; a left-hander the mirror. 3-6-9 for spares (common practice, C).
// Thresholds are suggestMoves' own (MOVE_THRESHOLDS).

interface F {
  hit?: HitKind | null;
  feet?: number | null;
  target?: number | null;
  bp?: number | null;
  ball?: string;
  leave?: number[];
  spare?: number[];
  session?: string;
}

/** One game of frames; each frame a first ball leaving `leave` (default a strike) and, if it left pins, a second ball leaving `spare` (default none). */
function game(frames: F[], gameNumber = 1, session = 's1', date = '2026-11-20'): ShotRecord[] {
  const out: ShotRecord[] = [];
  frames.forEach((f, i) => {
    const base = { sessionId: f.session ?? session, gameNumber, date, ballId: f.ball ?? 'b1', surfaceKey: '2000 grit' };
    out.push({
      ...base,
      frame: i + 1,
      delivery: 1,
      standing: f.leave ?? [],
      hit: f.hit ?? null,
      feetBoard: f.feet === undefined ? 20 : f.feet,
      targetBoard: f.target === undefined ? 10 : f.target,
      breakpointBoard: f.bp ?? null,
    });
    if ((f.leave ?? []).length > 0) out.push({ ...base, frame: i + 1, delivery: 2, standing: f.spare ?? [] });
  });
  return out;
}
const n = (k: number, f: F): F[] => Array.from({ length: k }, () => ({ ...f }));

describe('suggestMoves: 2-and-1', () => {
  it('right-hander, four high hits on one line: feet 2 and target 1 to the left, from board 20 to 22 and 10 to 11', () => {
    const moves = suggestMoves({ shots: game([{ hit: 'pocket' }, ...n(4, { hit: 'high' })]), hand: 'right' });
    expect(moves).toHaveLength(1);
    expect(moves[0]).toMatchObject({
      kind: 'two-and-one',
      feet: { direction: 'left', boards: 2 },
      target: { direction: 'left', boards: 1 },
    });
    expect(moves[0].evidence).toBe('the last 4 first balls with a recorded hit on this line were high.');
    expect(moves[0].detail).toMatch(/from board 20 to 22 with the feet and from 10 to 11 at the arrows/);
    expect(moves[0].source).toMatch(/common practice/);
  });

  it('left-hander high: the mirror, to the right (own boards still 20 → 22)', () => {
    const [m] = suggestMoves({ shots: game(n(3, { hit: 'high' })), hand: 'left' });
    expect(m).toMatchObject({ feet: { direction: 'right', boards: 2 }, target: { direction: 'right', boards: 1 } });
    expect(m.detail).toMatch(/from board 20 to 22/);
  });

  it('light hits: right-hander moves right (20 → 18, 10 → 9), left-hander left', () => {
    const [r] = suggestMoves({ shots: game(n(3, { hit: 'light', leave: [10], spare: [] })), hand: 'right' });
    expect(r).toMatchObject({ feet: { direction: 'right', boards: 2 }, target: { direction: 'right', boards: 1 } });
    expect(r.detail).toMatch(/from board 20 to 18 with the feet and from 10 to 9/);
    const [l] = suggestMoves({ shots: game(n(3, { hit: 'light' })), hand: 'left' });
    expect(l.feet).toEqual({ direction: 'left', boards: 2 });
  });

  it('a Brooklyn in the streak: twice the move, 4 and 2', () => {
    const [m] = suggestMoves({ shots: game([{ hit: 'high' }, { hit: 'brooklyn' }, { hit: 'high' }]), hand: 'right' });
    expect(m).toMatchObject({ feet: { boards: 4 }, target: { boards: 2 } });
    expect(m.evidence).toMatch(/\(1 of them Brooklyn\)/);
  });

  it('no move for two in a row, a broken streak, or a streak on an earlier line', () => {
    expect(suggestMoves({ shots: game(n(2, { hit: 'high' })), hand: 'right' })).toEqual([]);
    expect(suggestMoves({ shots: game([{ hit: 'high' }, { hit: 'high' }, { hit: 'pocket' }, { hit: 'high' }]), hand: 'right' })).toEqual(
      [],
    );
    expect(suggestMoves({ shots: game([...n(3, { hit: 'high' }), { hit: 'high', feet: 22, target: 11 }]), hand: 'right' })).toEqual([]);
    expect(suggestMoves({ shots: game([...n(3, { hit: 'high' }), { hit: 'high', ball: 'b2' }]), hand: 'right' })).toEqual([]);
    expect(suggestMoves({ shots: [], hand: 'right' })).toEqual([]);
  });

  it('breakpoint drifting toward the middle (8 → 11 over 6 shots) reads as high: move in', () => {
    const [m] = suggestMoves({ shots: game([8, 8, 9, 10, 10, 11].map((bp) => ({ bp }))), hand: 'right' });
    expect(m).toMatchObject({ kind: 'two-and-one', feet: { direction: 'left', boards: 2 } });
    // least squares on (0,8) (1,8) (2,9) (3,10) (4,10) (5,11): slope 22/35 = 0.629, × 5 = 3.1 boards
    expect(m.evidence).toBe('the breakpoint moved 3.1 boards toward the middle over the last 6 shots with a breakpoint on this line.');
    const [out] = suggestMoves({ shots: game([11, 10, 10, 9, 8, 8].map((bp) => ({ bp }))), hand: 'right' });
    expect(out.feet).toEqual({ direction: 'right', boards: 2 });
    expect(suggestMoves({ shots: game([9, 10, 9, 10, 9, 10].map((bp) => ({ bp }))), hand: 'right' })).toEqual([]);
  });

  it('still high after moving 4 boards in with the same ball this session: suggests a weaker ball or smoother surface', () => {
    const shots = game([
      ...n(3, { hit: 'high' }),
      ...n(3, { hit: 'high', feet: 22, target: 11 }),
      ...n(3, { hit: 'high', feet: 24, target: 12 }),
    ]);
    const moves = suggestMoves({ shots, hand: 'right' });
    expect(moves.map((m) => m.kind)).toEqual(['two-and-one', 'ball-change']);
    expect(moves[1].title).toBe('Try a weaker ball or a smoother surface');
    expect(moves[1].evidence).toBe(
      'You have already moved 4 boards left with this ball this session (feet board 20 → 24) and the last 3 first balls were still high.',
    );
  });
});

describe('suggestMoves: spares', () => {
  it('the 10 pin missed twice: the 3-6-9 board from the strike line (20 → 29 for a right-hander)', () => {
    const shots = game([{ leave: [10], spare: [10] }, { hit: 'pocket' }, { leave: [10], spare: [10] }, { leave: [10], spare: [] }]);
    const moves = suggestMoves({ shots, hand: 'right' });
    expect(moves).toHaveLength(1);
    expect(moves[0]).toMatchObject({ kind: 'spare-system', feet: { direction: 'left', boards: 9 }, title: '10 pin: stand on board 29' });
    expect(moves[0].evidence).toBe('The 10 pin was missed 2 of 3 times in the last 3 single-pin spare chances.');
    const [lh] = suggestMoves({ shots, hand: 'left' });
    expect(lh.title).toBe('10 pin: stand on board 11');
  });

  it('refuses bad input naming the function', () => {
    expect(() => suggestMoves({ shots: game([{}]), hand: 'middle' as 'left' })).toThrow(/^suggestMoves: hand must be one of right, left/);
    expect(() => suggestMoves({ shots: 'x' as unknown as ShotRecord[], hand: 'right' })).toThrow(
      new TypeError('suggestMoves: shots must be an array, got "x"'),
    );
  });
});
