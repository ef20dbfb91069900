import { describe, expect, it } from 'vitest';
import { scoreGame, scorePartialGame } from '../../engine/index';

// Check values: USBC / World Bowling scoring (the USBC and World Bowling playing rules, P) applied to games in progress; a
// frame is scored once its bonus deliveries are in (strike: next two; spare: next one). Pins
// standing: a rack has 10 pins and is reset after a strike, a spare or a completed frame.
// Expected numbers derived by hand.

const zeros = (n: number): number[] => Array<number>(n).fill(0);
const nulls = (n: number): null[] => Array<null>(n).fill(null);

describe('scorePartialGame', () => {
  it('no deliveries: nothing scored, frame 1 next with 10 pins standing', () => {
    expect(scorePartialGame([])).toEqual({ frames: nulls(10), total: 0, complete: false, nextFrame: 1, pinsStanding: 10 });
  });

  it('a first delivery of 7: frame 1 next with 10 − 7 = 3 pins standing', () => {
    expect(scorePartialGame([7])).toMatchObject({ nextFrame: 1, pinsStanding: 3, total: 0 });
  });

  it('an open frame 7 2: frame 1 scores 9, frame 2 next on a fresh rack', () => {
    expect(scorePartialGame([7, 2])).toEqual({ frames: [9, ...nulls(9)], total: 9, complete: false, nextFrame: 2, pinsStanding: 10 });
  });

  it('a strike then 7: the strike waits for its second bonus delivery; frame 2 next with 3 pins standing', () => {
    expect(scorePartialGame([10, 7])).toEqual({ frames: nulls(10), total: 0, complete: false, nextFrame: 2, pinsStanding: 3 });
  });

  it('a strike then 7 2: 10 + 7 + 2 = 19, then 19 + 9 = 28', () => {
    expect(scorePartialGame([10, 7, 2]).frames.slice(0, 3)).toEqual([19, 28, null]);
  });

  it('a spare 6 4 waits for its bonus delivery: nothing scored, frame 2 next on a fresh rack', () => {
    expect(scorePartialGame([6, 4])).toMatchObject({ frames: nulls(10), nextFrame: 2, pinsStanding: 10 });
  });

  it('the World Bowling sheet, complete: same totals as scoreGame, no next frame, 0 pins standing', () => {
    // the USBC and World Bowling playing rules WB worked example (P).
    const rolls = [10, 10, 10, 7, 2, 8, 2, 0, 9, 10, 7, 3, 9, 0, 10, 10, 8];
    expect(scorePartialGame(rolls)).toEqual({ ...scoreGame(rolls), complete: true, nextFrame: null, pinsStanding: 0 });
  });

  it('the World Bowling sheet after its first 15 deliveries: frames 1–8 scored (143), frame 9 is open 9 0 = 152, frame 10 next', () => {
    // the USBC and World Bowling playing rules WB worked example: running totals 30 57 76 85 95 104 124 143 152 (P).
    const rolls = [10, 10, 10, 7, 2, 8, 2, 0, 9, 10, 7, 3, 9, 0];
    expect(scorePartialGame(rolls)).toMatchObject({
      frames: [30, 57, 76, 85, 95, 104, 124, 143, 152, null],
      total: 152,
      nextFrame: 10,
      pinsStanding: 10,
    });
  });

  it.each([
    ['a strike', [10], 10],
    ['a strike and 7', [10, 7], 3],
    ['two strikes', [10, 10], 10],
    ['a 7', [7], 3],
    ['a spare 7 3', [7, 3], 10],
  ])('tenth frame after %s: pins standing for the next delivery is %s', (_label, tenth, standing) => {
    expect(scorePartialGame([...zeros(18), ...tenth])).toMatchObject({ nextFrame: 10, pinsStanding: standing, complete: false });
  });

  it('throws RangeError for an impossible frame and for deliveries after the game is over', () => {
    expect(() => scorePartialGame([7, 5])).toThrow(/scorePartialGame: frame 1 knocks down 12 pins/);
    expect(() => scorePartialGame([...zeros(20), 1])).toThrow(/scorePartialGame: 1 delivery after the game is over/);
  });
});
