import { describe, expect, it } from 'vitest';
import { conditionOilMap, oilVolumeUl, patternOilMap, transitionOilMap } from '../../../engine/index';
import { housePattern, strokerBowler } from './fixtures';

// Transition model tests: total oil conserved; repeated shots on a line widen a depleted track and build
// oil beyond the pattern (carrydown). The amounts are documented assumptions (MOTION_CALIBRATION).
const track = [
  { ft: 0, board: 15 },
  { ft: 40, board: 8 },
  { ft: 60, board: 17.5 },
];
const at = (m: ReturnType<typeof patternOilMap>, board: number, ft: number) => m.filmUm[Math.round(ft / m.ftStep) * m.cols + board];

describe('transitionOilMap (the transition model)', () => {
  it('µL, 3 games on a house pattern: lane before = lane after + oil kept on the balls, to 1e-9 relative', () => {
    const fresh = patternOilMap(housePattern());
    const t = transitionOilMap(fresh, track, 3);
    const before = oilVolumeUl(fresh),
      after = oilVolumeUl(t.map);
    expect(Math.abs(before - (after + t.keptOnBallsUl)) / before).toBeLessThan(1e-9);
    expect(Math.abs(t.removedUl - t.carriedDownUl - t.keptOnBallsUl)).toBeLessThan(1e-9 * before);
    expect(t.removedUl).toBeGreaterThan(0);
    expect(t.carriedDownUl).toBeGreaterThan(0);
  });

  it('µm, 0 → 3 → 9 games: the track dries more and wider, the far boards keep their oil, and oil builds beyond the pattern end', () => {
    const fresh = patternOilMap(housePattern());
    const [g0, g3, g9] = [0, 3, 9].map((g) => transitionOilMap(fresh, track, g).map);
    // on the track at 20 ft (board ≈ 11.5) and 3 boards beside it
    for (const b of [11, 14]) {
      expect(at(g3, b, 20)).toBeLessThan(at(g0, b, 20));
      expect(at(g9, b, 20)).toBeLessThan(at(g3, b, 20));
    }
    // the far side of the lane, 25 boards from the track (five spreads of the bowlers' lines), keeps 99.9 % of its oil
    expect(Math.abs(at(g9, 37, 20) - at(g0, 37, 20))).toBeLessThan(1e-3 * at(g0, 37, 20));
    // beyond the 40 ft pattern: dry when fresh, oiled after games (carrydown)
    expect(at(g0, 9, 44)).toBe(0);
    expect(at(g3, 9, 44)).toBeGreaterThan(0);
    expect(at(g9, 9, 44)).toBeGreaterThan(at(g3, 9, 44));
  });

  it('µm, conditionOilMap with 0 games is the fresh pattern and with 3 games has less oil overall', () => {
    const fresh = patternOilMap(housePattern());
    expect(Array.from(conditionOilMap(housePattern(), strokerBowler(), 0).filmUm)).toEqual(Array.from(fresh.filmUm));
    expect(oilVolumeUl(conditionOilMap(housePattern(), strokerBowler(), 3))).toBeLessThan(oilVolumeUl(fresh));
  });

  it('errors: RangeError naming transitionOilMap for −1 games, TypeError for a one-point track', () => {
    const fresh = patternOilMap(housePattern());
    expect(() => transitionOilMap(fresh, track, -1)).toThrow(/transitionOilMap.*gamesBowled.*-1/);
    expect(() => transitionOilMap(fresh, [{ ft: 0, board: 10 }], 1)).toThrow(TypeError);
  });
});
