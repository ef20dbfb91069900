import type { GameScore } from './types';
import { parseGame } from './internal/parseGame';

/**
 * Scores one complete game of ten-pin bowling from its deliveries.
 *
 * Definition: ten frames; in frames 1–9 a strike (10 on the first delivery) ends the frame and
 * scores 10 + the pins of the next two deliveries, a spare (10 over two deliveries) scores 10 + the
 * pins of the next delivery, an open frame scores its pins. The tenth frame has a third delivery
 * only after a strike or spare in it, and scores its pins without further bonus.
 *
 * Source: USBC playing rules and World Bowling Universal Playing Rules ch. 2, as summarised in
 * the USBC and World Bowling playing rules (the two bodies agree on scoring).
 *
 * @param rolls pins knocked down by each delivery in order, integers 0–10. A foul is recorded as 0
 *   (the USBC playing rules on fouls: a fouled delivery counts but scores no pins).
 * @returns `frames`: the running total after each frame (10 numbers); `total`: the game's score.
 * @throws TypeError if `rolls` is not an array of numbers.
 * @throws RangeError naming the reason for any impossible or incomplete game: a delivery outside
 *   0–10 or not an integer, more than 10 pins in a frame, a missing delivery, or deliveries after
 *   the game is over. For a game in progress use scorePartialGame.
 *
 * @example
 * scoreGame(Array(12).fill(10)); // => { frames: [30, 60, …, 300], total: 300 }
 */
export function scoreGame(rolls: number[]): GameScore {
  const fn = 'scoreGame';
  const g = parseGame(fn, rolls);
  if (g.pending !== null) {
    throw new RangeError(`${fn}: the game is incomplete: ${rolls.length === 0 ? 'no deliveries' : g.pending}`);
  }
  const frames: number[] = [];
  let total = 0;
  for (const points of g.framePoints) {
    total += points as number;
    frames.push(total);
  }
  return { frames, total };
}
