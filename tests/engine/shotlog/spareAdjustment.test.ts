import { describe, expect, it } from 'vitest';
import { spareAdjustment, THREE_SIX_NINE } from '../../../engine/index';

// Check values: the 3-6-9 spare system as recorded in common practice (C, common practice):
// keep the strike target; move the feet 3, 6, 9 boards, opposite side to the pin, for the 2/8, 4, 7
// pins and likewise for the 3/9, 6, 10 pins. Boards are counted from the hand-side gutter (Lanewright's conventions
// conventions), so a left-hander's move left lowers the board number (the boards mirror).

const at = (leave: number[], hand: 'right' | 'left' = 'right', feet = 15, target = 10) =>
  spareAdjustment({ leave, strikeFeetBoard: feet, strikeTargetBoard: target, hand });

describe('spareAdjustment (3-6-9)', () => {
  it('the table: 2/8 → 3, 4 → 6, 7 → 9 boards right; 3/9 → 3, 6 → 6, 10 → 9 boards left; 1 and 5 from the strike line', () => {
    expect(
      Object.entries(THREE_SIX_NINE)
        .map(([p, r]) => `${p}:${r.boards}${r.side[0]}`)
        .sort(),
    ).toEqual(['10:9r', '1:0c', '2:3l', '3:3r', '4:6l', '5:0c', '6:6r', '7:9l', '8:3l', '9:3r']);
  });

  it('right-hander, strike line 15 → 10: the 10 pin from board 24, the 7 pin from board 6, target kept', () => {
    expect(at([10])).toMatchObject({ keyPin: 10, feetBoard: 24, targetBoard: 10, feet: { direction: 'left', boards: 9 } });
    expect(at([7])).toMatchObject({ keyPin: 7, feetBoard: 6, targetBoard: 10, feet: { direction: 'right', boards: 9 } });
    expect(at([6])).toMatchObject({ feetBoard: 21, feet: { direction: 'left', boards: 6 } });
    expect(at([4])).toMatchObject({ feetBoard: 9, feet: { direction: 'right', boards: 6 } });
    expect(at([5])).toMatchObject({ feetBoard: 15, feet: { boards: 0 } });
  });

  it('left-hander: the same physical moves, boards mirrored (10 pin: 9 boards left = board 6 from the left gutter)', () => {
    expect(at([10], 'left')).toMatchObject({ keyPin: 10, feetBoard: 6, feet: { direction: 'left', boards: 9 } });
    expect(at([7], 'left')).toMatchObject({ keyPin: 7, feetBoard: 24, feet: { direction: 'right', boards: 9 } });
    expect(at([3], 'left')).toMatchObject({ feetBoard: 12, feet: { direction: 'left', boards: 3 } });
  });

  it('the key pin is the one nearest the bowler: 3-6-10 → 3, 2-4-5-8 → 2, 1-2-4-10 → 1, 5-7 → 5; 7-10 → 7 (tie: lower number)', () => {
    expect(at([3, 6, 10]).keyPin).toBe(3);
    expect(at([3, 6, 10]).feetBoard).toBe(18);
    expect(at([2, 4, 5, 8]).keyPin).toBe(2);
    expect(at([1, 2, 4, 10]).keyPin).toBe(1);
    expect(at([5, 7]).keyPin).toBe(5);
    expect(at([7, 10]).keyPin).toBe(7);
    expect(at([4, 7, 8]).keyPin).toBe(4);
  });

  it('the approach ends at board 39: the move is clamped and the detail says so', () => {
    const r = at([10], 'right', 35);
    expect(r).toMatchObject({ feetBoard: 39, feet: { direction: 'left', boards: 4 } });
    expect(r.detail).toMatch(/the approach ends at board 39, so the move is 4 boards instead of 9/);
    expect(at([10]).detail).toBe(
      'For the 10 the key pin is the 10: move your feet 9 boards left (board 24 instead of 15) and keep your strike target, board 10 at the arrows.',
    );
    expect(at([10]).source).toMatch(/^3-6-9 spare system, common practice;/);
  });

  it('refuses bad input naming the function', () => {
    expect(() => at([])).toThrow(new RangeError('spareAdjustment: the leave is empty; there is no spare to shoot'));
    expect(() => at([11])).toThrow(new RangeError('spareAdjustment: leave[0] must be a pin from 1 to 10, got 11'));
    expect(() => at([4, 4])).toThrow(/^spareAdjustment: pin 4 is listed twice/);
    expect(() => at([4], 'both' as 'left')).toThrow(TypeError);
    expect(() => at([4], 'right', 0)).toThrow(/^spareAdjustment: strikeFeetBoard 0 is below the minimum 1/);
  });
});
