import { describe, expect, it } from 'vitest';
import { rankArsenal, solvePocketLine, prepareShot, conditionOilMap } from '../../../engine/index';
import type { PocketLineHint } from '../../../engine/index';
import { houseShot, typicalBowler } from '../fixtures';
import { fifteenBalls } from './fixtures';

// The warm start (RankArsenalOptions.hints): a ball's line search starts where its search on a nearby condition
// settled, skipping the scan and the launch steps already taken. On the same condition it takes the same steps to
// the same line; bench/accuracy.ts measures how far apart two conditions may be before answers move.

describe('rankArsenal — warm-started line search', () => {
  const balls = fifteenBalls();
  const input = { balls, bowler: typicalBowler, pattern: houseShot, gamesBowled: 2 };

  it('gives exactly the cold answer when the hints come from the same condition, with fewer deliveries', () => {
    const hints = new Map<string, PocketLineHint>();
    const cold = rankArsenal(input, { onSettled: (id, h) => hints.set(id, h) });
    expect(hints.size).toBeGreaterThan(0);
    expect(rankArsenal(input, { hints })).toEqual(cold);

    // the solver on its own: same line, fewer deliveries (previews and full) for a ball whose launch had to move
    const map = conditionOilMap(houseShot, typicalBowler, 2);
    let fewer = 0;
    for (const ball of balls) {
      const shot = prepareShot({ ball, bowler: typicalBowler, pattern: houseShot }, map);
      let n = 0;
      const count =
        <A extends unknown[], R>(f: (...a: A) => R) =>
        (...a: A): R => {
          n++;
          return f(...a);
        };
      const first = solvePocketLine(count(shot.run), {}, {}, count(shot.preview!));
      const coldN = n;
      if (!first.settled) continue;
      n = 0;
      const again = solvePocketLine(count(shot.run), {}, first.settled, count(shot.preview!));
      expect([again.laydownBoard, again.targetBoard, again.result.entryBoard]).toEqual([
        first.laydownBoard,
        first.targetBoard,
        first.result.entryBoard,
      ]);
      expect(n).toBeLessThan(coldN);
      fewer++;
    }
    expect(fewer).toBeGreaterThan(0);
  });

  it('stops between balls when the caller went away (an Error named AbortError), and not before it is asked', () => {
    let asked = 0;
    expect(() => rankArsenal(input, { aborted: () => ++asked > 3 })).toThrow(expect.objectContaining({ name: 'AbortError' }));
    expect(asked).toBe(4);
    expect(rankArsenal(input, { aborted: () => false })).toHaveLength(balls.length);
  });

  it('ignores options that are not what they describe', () => {
    const cold = rankArsenal(input);
    expect(rankArsenal(input, { hints: 'x', aborted: 1, onSettled: null } as never)).toEqual(cold);
    expect(rankArsenal(input, null as never)).toEqual(cold);
  });
});
