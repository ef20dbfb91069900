import { describe, expect, it } from 'vitest';
import { ARROW_BOARDS, ARROWS_FT, BOARD_COUNT, BOARD_WIDTH_IN, HEADPIN_FT, IDEAL_ENTRY_ANGLE_DEG, POCKET_BOARD } from '../../engine/index';

// Check values: Lanewright's conventions (engine/README.md) and sections 2, 2.1, 2.2.

describe('constants', () => {
  it('in: a board is 41.5 ÷ 39 = 1.064 in (Lanewright’s conventions, D) (±0.001)', () => {
    expect(BOARD_WIDTH_IN).toBeCloseTo(1.064, 3);
    expect(BOARD_COUNT).toBe(39);
  });
  it('ft and boards: headpin at 60 ft, arrows at 15 ft on boards 5–35 by 5 (Lanewright’s conventions, S)', () => {
    expect(HEADPIN_FT).toBe(60);
    expect(ARROWS_FT).toBe(15);
    expect(ARROW_BOARDS).toEqual([5, 10, 15, 20, 25, 30, 35]);
  });
  it('pocket board 17.5 and best entry angle 6° (USBC pin-carry research, reported second-hand, S)', () => {
    expect(POCKET_BOARD).toBe(17.5);
    expect(IDEAL_ENTRY_ANGLE_DEG).toBe(6);
  });
  it('in: adjacent pin columns (6 in) are 5.64 boards apart (common practice "≈ 5.6 boards", D) (±0.01)', () => {
    expect(6 / BOARD_WIDTH_IN).toBeCloseTo(5.64, 2);
  });
});
