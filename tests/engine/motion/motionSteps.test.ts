import { describe, expect, it } from 'vitest';
import { MOTION_CALIBRATION, motionSteps, rankArsenal, simulateShot, withMotionSteps } from '../../../engine/index';
import type { BallSpec, BowlerProfile } from '../../../engine/types';
import { housePattern } from './fixtures';

// The integrator's step settings and the scoped override accuracy studies use (bench/accuracy.ts).

const ball: BallSpec = {
  weightLb: 15,
  rg: 2.5,
  differential: 0.05,
  intermediateDifferential: 0.012,
  coverType: 'reactive-solid',
  surfaceGrit: 2000,
  polished: false,
  layout: { pinToPapIn: 4.5 },
};
const bowler: BowlerProfile = { hand: 'right', speedMph: 17, revRpm: 350, axisRotationDeg: 45, axisTiltDeg: 15 };
const house = housePattern();

describe('motion steps', () => {
  it('s: the defaults are MOTION_CALIBRATION’s (6 ms near rolling, longer while sliding fast)', () => {
    expect(motionSteps()).toEqual({ stepS: MOTION_CALIBRATION.stepS, maxStepS: MOTION_CALIBRATION.maxStepS });
    expect(MOTION_CALIBRATION.maxStepS).toBeGreaterThanOrEqual(MOTION_CALIBRATION.stepS);
  });

  it('withMotionSteps holds for its call only, restores the settings after a throw, and nests', () => {
    const fine = { stepS: 0.001, maxStepS: 0.001 };
    expect(withMotionSteps(fine, () => motionSteps())).toEqual(fine);
    expect(motionSteps().stepS).toBe(MOTION_CALIBRATION.stepS);
    expect(() =>
      withMotionSteps(fine, () => {
        throw new Error('inside');
      }),
    ).toThrow('inside');
    expect(motionSteps().stepS).toBe(MOTION_CALIBRATION.stepS);
    expect(withMotionSteps(fine, () => withMotionSteps({ stepS: 0.002, maxStepS: 0.004 }, () => motionSteps()))).toEqual({
      stepS: 0.002,
      maxStepS: 0.004,
    });
  });

  it('boards and degrees: on one line the production steps agree with a 1 ms fixed step within 0.2 board of entry, 0.3° of entry angle and 1 ft of breakpoint (the accuracy the ranking needs)', () => {
    const shot = (laydownBoard: number, targetBoard: number) => simulateShot({ ball, bowler, pattern: house, laydownBoard, targetBoard });
    for (const [l, t] of [
      [20, 11],
      [25, 14],
      [15, 9],
    ] as const) {
      const fast = shot(l, t);
      const ref = withMotionSteps({ stepS: 0.001, maxStepS: 0.001 }, () => shot(l, t));
      expect(Math.abs(fast.entryBoard - ref.entryBoard)).toBeLessThan(0.2);
      expect(Math.abs(fast.entryAngleDeg - ref.entryAngleDeg)).toBeLessThan(0.3);
      expect(Math.abs(fast.breakpoint.ft - ref.breakpoint.ft)).toBeLessThan(1);
    }
  });

  it('a ranking at the 1 ms reference step puts each ball on a line within a board of the production one', () => {
    const balls = [
      { ...ball, id: 'solid' },
      { ...ball, id: 'pearl', coverType: 'reactive-pearl' as const, surfaceGrit: 4000, polished: true },
    ];
    const fast = rankArsenal({ balls, bowler, pattern: house });
    const ref = withMotionSteps({ stepS: 0.001, maxStepS: 0.001 }, () => rankArsenal({ balls, bowler, pattern: house }));
    for (const r of fast) {
      const q = ref.find((x) => x.id === r.id)!;
      expect(Math.abs(r.prediction.laydownBoard - q.prediction.laydownBoard)).toBeLessThan(1);
      expect(Math.abs(r.prediction.targetBoard - q.prediction.targetBoard)).toBeLessThan(1);
    }
  });
});
