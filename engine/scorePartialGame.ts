import type { PartialGameScore } from './types';
import { parseGame } from './internal/parseGame';

/**
 * Scores a game in progress: the running totals of the frames that can be scored so far, and
 * what the next delivery is for.
 *
 * Definition: the scoring rules of scoreGame (the USBC and World Bowling playing rules). A frame's total
 * is known once its own deliveries and its bonus deliveries are in; `frames` holds the running
 * total after each frame up to the last one known and null after it (a strike or spare waiting
 * for its bonus leaves its frame and every later one null).
 *
 * @param rolls the deliveries so far, integers 0–10 (a foul is 0, the USBC playing rules on fouls); may be empty.
 * @returns `frames` (10 entries, running totals or null), `total` (the last known running total, 0
 *   at the start), `complete`, `nextFrame` (1–10, or null when complete) and `pinsStanding` (pins
 *   standing for the next delivery: 10 on a fresh rack, 0 when complete).
 * @throws TypeError if `rolls` is not an array of numbers; RangeError for an impossible game (a
 *   delivery outside 0–10, more pins than the rack holds, deliveries after the game is over).
 *
 * @example
 * scorePartialGame([10, 7]);
 * // => { frames: [null, …], total: 0, complete: false, nextFrame: 2, pinsStanding: 3 }
 */
export function scorePartialGame(rolls: number[]): PartialGameScore {
  const g = parseGame('scorePartialGame', rolls);
  const frames: (number | null)[] = [];
  let total = 0;
  let known = true;
  for (const points of g.framePoints) {
    if (known && points !== null) {
      total += points;
      frames.push(total);
    } else {
      known = false;
      frames.push(null);
    }
  }
  return { frames, total, complete: g.pending === null, nextFrame: g.nextFrame, pinsStanding: g.pinsStanding };
}
