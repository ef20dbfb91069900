import { describe, expect, it } from 'vitest';
import { scoreGame } from '../../engine/index';

// Check values: USBC playing rules and World Bowling Universal Playing Rules ch. 2, as recorded in
// the USBC and World Bowling playing rules (status P; the two bodies agree on scoring).

const zeros = (n: number): number[] => Array<number>(n).fill(0);

describe('scoreGame: complete games', () => {
  it('World Bowling worked score sheet: X X X 7 2 (8)/ F9 X 7/ 9- X X 8 gives 30 57 76 85 95 104 124 143 152 180', () => {
    // the USBC and World Bowling playing rules "WB worked example sheet" (P), https://bowling.sport/?p=6749. A foul (F) scores 0
    // pins (the USBC playing rules on fouls), so "F9" is the deliveries 0 and 9.
    const rolls = [10, 10, 10, 7, 2, 8, 2, 0, 9, 10, 7, 3, 9, 0, 10, 10, 8];
    expect(scoreGame(rolls)).toEqual({ frames: [30, 57, 76, 85, 95, 104, 124, 143, 152, 180], total: 180 });
  });

  it('twelve strikes in a row score the maximum game of 300, 30 per frame', () => {
    // the USBC and World Bowling playing rules "Maximum game: 300 = 12 strikes in a row" and "Triple: first strike = 30" (P).
    expect(scoreGame(Array<number>(12).fill(10))).toEqual({
      frames: [30, 60, 90, 120, 150, 180, 210, 240, 270, 300],
      total: 300,
    });
  });

  it('twenty gutter balls score 0 in every frame', () => {
    // the USBC and World Bowling playing rules "Open frame: pins knocked down, no bonus" (P): 0 pins → 0.
    expect(scoreGame(zeros(20))).toEqual({ frames: zeros(10), total: 0 });
  });

  it('a spare scores 10 plus the next delivery: 7 3 then 4 2 gives 14 then 20', () => {
    // the USBC and World Bowling playing rules "Spare value: 10 + pins of the next delivery" (P): 10 + 4 = 14; 14 + 4 + 2 = 20.
    const { frames } = scoreGame([7, 3, 4, 2, ...zeros(16)]);
    expect(frames.slice(0, 2)).toEqual([14, 20]);
  });

  it('a double scores the first strike 20 plus the delivery after the second strike: X X 7 2 gives 27, 46, 55', () => {
    // the USBC and World Bowling playing rules "Double: first strike = 20 + pins of the first delivery after the second strike" (P).
    // Derived by hand: 20 + 7 = 27; second strike 10 + 7 + 2 = 19 → 46; open 7 + 2 = 9 → 55.
    const { frames, total } = scoreGame([10, 10, 7, 2, ...zeros(14)]);
    expect(frames.slice(0, 3)).toEqual([27, 46, 55]);
    expect(total).toBe(55);
  });

  it('a strike scores 10 plus the next two deliveries even when they are a spare: X 4 6 gives 20', () => {
    // the USBC and World Bowling playing rules "Strike value: 10 + pins of the next two deliveries" (P): 10 + 4 + 6 = 20.
    const { frames } = scoreGame([10, 4, 6, ...zeros(16)]);
    expect(frames[0]).toBe(20);
  });

  it('all spares of 5 with a 5 bonus score 15 per frame, 150 in all', () => {
    // Derived by hand from the USBC and World Bowling playing rules spare value: each frame 10 + 5 = 15; 10 × 15 = 150.
    expect(scoreGame(Array<number>(21).fill(5)).total).toBe(150);
  });

  it('a foul on the first delivery then all ten pins is a spare: 0 10 then 3 0 gives 13, 16', () => {
    // the USBC playing rules on fouls "Foul on first ball: pins respotted; all ten on the second ball = spare" (S).
    const { frames } = scoreGame([0, 10, 3, 0, ...zeros(16)]);
    expect(frames.slice(0, 2)).toEqual([13, 16]);
  });

  it('tenth frame: a spare earns exactly one more delivery (… 9 1 10 → 20 in the tenth)', () => {
    // the USBC and World Bowling playing rules "10th frame: three deliveries if a strike or spare is made in it" (P).
    expect(scoreGame([...zeros(18), 9, 1, 10])).toEqual({ frames: [...zeros(9), 20], total: 20 });
  });

  it('tenth frame: a strike then a non-strike leaves a rack of 10 for the third delivery (X 7 3 → 20)', () => {
    // the USBC and World Bowling playing rules tenth-frame rule (P); derived by hand: 10 + 7 + 3 = 20.
    expect(scoreGame([...zeros(18), 10, 7, 3]).total).toBe(20);
  });

  it('tenth frame: X X 8 → 28 (a fresh rack after each strike)', () => {
    // the USBC and World Bowling playing rules WB sheet, tenth frame X X 8 = 28 (P).
    expect(scoreGame([...zeros(18), 10, 10, 8]).total).toBe(28);
  });
});

describe('scoreGame: impossible or incomplete games throw RangeError with the reason', () => {
  it('throws TypeError for a value that is not an array', () => {
    expect(() => scoreGame('X X X' as unknown as number[])).toThrow(TypeError);
  });

  it('throws TypeError for a delivery that is not a number', () => {
    expect(() => scoreGame([10, '9', ...zeros(17)] as unknown as number[])).toThrow(/scoreGame: delivery 2 must be a number/);
  });

  it.each([
    ['11 pins', 11],
    ['-1 pins', -1],
    ['2.5 pins', 2.5],
    ['NaN', Number.NaN],
  ])('throws RangeError for a delivery of %s', (_label, bad) => {
    // the USBC and World Bowling playing rules: ten pins in a rack, so a delivery knocks down an integer 0–10.
    expect(() => scoreGame([bad, ...zeros(19)])).toThrow(RangeError);
    expect(() => scoreGame([bad, ...zeros(19)])).toThrow(/scoreGame: delivery 1 knocks down/);
  });

  it('throws RangeError for a frame of more than 10 pins (7 + 5 in frame 1)', () => {
    expect(() => scoreGame([7, 5, ...zeros(18)])).toThrow(/scoreGame: frame 1 knocks down 12 pins \(7 \+ 5\)/);
  });

  it('throws RangeError for no deliveries', () => {
    expect(() => scoreGame([])).toThrow(/scoreGame: the game is incomplete: no deliveries/);
  });

  it('throws RangeError for a game that stops after nine frames', () => {
    expect(() => scoreGame(zeros(18))).toThrow(/incomplete: frame 10 has no deliveries/);
  });

  it('throws RangeError for a frame with only its first delivery', () => {
    expect(() => scoreGame([3, 4, 5])).toThrow(/incomplete: frame 2 has only its first delivery \(5\)/);
  });

  it('throws RangeError for a strike still waiting for its bonus deliveries', () => {
    expect(() => scoreGame([...zeros(16), 10, 3])).toThrow(/incomplete: frame 9 is a strike still waiting/);
  });

  it('throws RangeError for a spare in frames 1–9 still waiting for its bonus delivery', () => {
    expect(() => scoreGame([6, 4])).toThrow(/incomplete: frame 1 is a spare still waiting/);
  });

  it('throws RangeError for a tenth-frame strike without its two extra deliveries', () => {
    expect(() => scoreGame([...zeros(18), 10, 10])).toThrow(/incomplete: frame 10 has a strike/);
  });

  it('throws RangeError for a tenth-frame spare without its third delivery', () => {
    expect(() => scoreGame([...zeros(18), 6, 4])).toThrow(/incomplete: frame 10 has a spare/);
  });

  it('throws RangeError for a tenth frame with only its first delivery', () => {
    expect(() => scoreGame([...zeros(18), 6])).toThrow(/incomplete: frame 10 has only its first delivery/);
  });

  it('throws RangeError for more than 10 pins in an open tenth frame (6 + 5)', () => {
    expect(() => scoreGame([...zeros(18), 6, 5])).toThrow(/frame 10 knocks down 11 pins \(6 \+ 5\)/);
  });

  it('throws RangeError for a tenth-frame strike followed by 7 and 5 (12 pins from one rack)', () => {
    expect(() => scoreGame([...zeros(18), 10, 7, 5])).toThrow(/frame 10 knocks down 12 pins with its second and third/);
  });

  it('throws RangeError for a third delivery after an open tenth frame', () => {
    expect(() => scoreGame([...zeros(20), 5])).toThrow(/1 delivery after the game is over/);
  });

  it('throws RangeError for deliveries after a tenth frame that had its third delivery', () => {
    expect(() => scoreGame([...Array<number>(12).fill(10), 10, 10])).toThrow(/2 deliveries after the game is over/);
  });

  it('throws RangeError when a strike in frame 9 is followed by an impossible tenth frame (X then 6 5)', () => {
    expect(() => scoreGame([...zeros(16), 10, 6, 5])).toThrow(RangeError);
  });
});
