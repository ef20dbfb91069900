import type { GameScore } from './types';
import { list, show } from './internal/checks';

/**
 * Scores one complete game of ten-pin bowling from its deliveries.
 *
 * Definition: ten frames; in frames 1–9 a strike (10 on the first delivery) ends the frame and
 * scores 10 + the pins of the next two deliveries, a spare (10 over two deliveries) scores 10 + the
 * pins of the next delivery, an open frame scores its pins. The tenth frame has a third delivery
 * only after a strike or spare in it, and scores its pins without further bonus.
 *
 * Source: USBC playing rules and World Bowling Universal Playing Rules ch. 2, as summarised in
 * ../shared/TRADE.md section 3.1 (the two bodies agree on scoring).
 *
 * @param rolls pins knocked down by each delivery in order, integers 0–10. A foul is recorded as 0
 *   (TRADE.md 3.3: a fouled delivery counts but scores no pins).
 * @returns `frames`: the running total after each frame (10 numbers); `total`: the game's score.
 * @throws TypeError if `rolls` is not an array of numbers.
 * @throws RangeError naming the reason for any impossible or incomplete game: a delivery outside
 *   0–10 or not an integer, more than 10 pins in a frame, a missing delivery, or deliveries after
 *   the game is over.
 *
 * @example
 * scoreGame(Array(12).fill(10)); // => { frames: [30, 60, …, 300], total: 300 }
 */
export function scoreGame(rolls: number[]): GameScore {
  const fn = 'scoreGame';
  const r = list(fn, 'rolls', rolls);
  r.forEach((pins, i) => {
    if (typeof pins !== 'number') throw new TypeError(`${fn}: delivery ${i + 1} must be a number, got ${show(pins)}`);
    if (!Number.isInteger(pins) || pins < 0 || pins > 10) {
      throw new RangeError(`${fn}: delivery ${i + 1} knocks down ${pins} pins; a delivery knocks down an integer 0–10`);
    }
  });
  const p = r as number[];
  if (p.length === 0) throw new RangeError(`${fn}: the game is incomplete: no deliveries`);

  const incomplete = (frame: number, what: string): RangeError =>
    new RangeError(`${fn}: the game is incomplete: frame ${frame} ${what}`);

  const frames: number[] = [];
  let total = 0;
  let i = 0;
  for (let frame = 1; frame <= 9; frame++) {
    if (i >= p.length) throw incomplete(frame, 'has no deliveries');
    const first = p[i];
    if (first === 10) {
      if (i + 2 >= p.length) throw incomplete(frame, 'is a strike still waiting for its two bonus deliveries');
      const b1 = p[i + 1];
      const b2 = p[i + 2];
      // The bonus deliveries must themselves be possible (checked when their own frame is read).
      total += 10 + b1 + b2;
      i += 1;
    } else {
      if (i + 1 >= p.length) throw incomplete(frame, `has only its first delivery (${first})`);
      const second = p[i + 1];
      if (first + second > 10) {
        throw new RangeError(`${fn}: frame ${frame} knocks down ${first + second} pins (${first} + ${second}); a frame has 10`);
      }
      if (first + second === 10) {
        if (i + 2 >= p.length) throw incomplete(frame, 'is a spare still waiting for its bonus delivery');
        total += 10 + p[i + 2];
      } else {
        total += first + second;
      }
      i += 2;
    }
    frames.push(total);
  }

  // Tenth frame.
  if (i >= p.length) throw incomplete(10, 'has no deliveries');
  const t1 = p[i];
  if (i + 1 >= p.length) throw incomplete(10, `has only its first delivery (${t1})`);
  const t2 = p[i + 1];
  let used = 2;
  if (t1 === 10) {
    if (i + 2 >= p.length) throw incomplete(10, 'has a strike and needs two more deliveries');
    const t3 = p[i + 2];
    // After a strike the pins are reset; after a non-strike second delivery they are not.
    if (t2 !== 10 && t2 + t3 > 10) {
      throw new RangeError(
        `${fn}: frame 10 knocks down ${t2 + t3} pins with its second and third deliveries (${t2} + ${t3}); ` +
          'without a second strike the rack has 10',
      );
    }
    total += t1 + t2 + t3;
    used = 3;
  } else if (t1 + t2 > 10) {
    throw new RangeError(`${fn}: frame 10 knocks down ${t1 + t2} pins (${t1} + ${t2}); a frame has 10`);
  } else if (t1 + t2 === 10) {
    if (i + 2 >= p.length) throw incomplete(10, 'has a spare and needs its third delivery');
    total += 10 + p[i + 2];
    used = 3;
  } else {
    total += t1 + t2;
  }
  frames.push(total);

  const extra = p.length - (i + used);
  if (extra > 0) {
    throw new RangeError(
      `${fn}: ${extra} ${extra === 1 ? 'delivery' : 'deliveries'} after the game is over (the tenth frame ` +
        `${used === 3 ? 'had its third delivery' : 'was open, so it has no third delivery'})`,
    );
  }
  return { frames, total };
}
