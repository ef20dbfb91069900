import { describe, expect, it } from 'vitest';
import { isCalibrationShot, LAYDOWN_OFFSET_BOARDS, laydownBoardOf } from '../../../engine/index';

describe('calibration observations (common coaching practice: the ball lays down 5–7 boards outside the slide foot)', () => {
  it('lays the ball down the offset outside the feet board, never off the lane', () => {
    expect(LAYDOWN_OFFSET_BOARDS).toBeGreaterThanOrEqual(5);
    expect(LAYDOWN_OFFSET_BOARDS).toBeLessThanOrEqual(7);
    expect(laydownBoardOf(25)).toBe(25 - LAYDOWN_OFFSET_BOARDS);
    expect(laydownBoardOf(3)).toBe(1);
  });

  it('takes a first ball with its feet, target and a breakpoint or a result', () => {
    const line = { delivery: 1, feetBoard: 25, targetBoard: 12 };
    expect(isCalibrationShot({ ...line, breakpointBoard: 6 })).toBe(true);
    expect(isCalibrationShot({ ...line, hit: 'pocket' })).toBe(true);
    expect(isCalibrationShot(line)).toBe(false);
    expect(isCalibrationShot({ ...line, delivery: 2, breakpointBoard: 6 })).toBe(false);
    expect(isCalibrationShot({ ...line, feetBoard: null, breakpointBoard: 6 })).toBe(false);
    expect(isCalibrationShot({ ...line, targetBoard: undefined, hit: 'high' })).toBe(false);
  });

  it('refuses input that is not a shot or a board, naming the function', () => {
    expect(() => laydownBoardOf(Number.NaN)).toThrow(/laydownBoardOf: feetBoard/);
    expect(() => isCalibrationShot(null as never)).toThrow(/isCalibrationShot: shot/);
  });
});
