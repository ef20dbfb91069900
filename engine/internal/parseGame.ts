import { list, show } from './checks';

/** A game read delivery by delivery, complete or not (internal to scoreGame/scorePartialGame). */
export interface ParsedGame {
  /** Points of each of the 10 frames, null while a frame or its bonus deliveries are missing. */
  framePoints: (number | null)[];
  /** Why the earliest unscored frame has no score yet, or null when the game is complete. */
  pending: string | null;
  /** The frame waiting for the next delivery (1–10), or null when the game is over. */
  nextFrame: number | null;
  /** Pins standing for the next delivery (10 on a fresh rack), or 0 when the game is over. */
  pinsStanding: number;
}

/**
 * Reads deliveries under the USBC and World Bowling scoring rules and throws a
 * RangeError (TypeError for a non-number) for anything impossible: a delivery outside 0–10 or not
 * an integer, more pins in a frame than the rack holds, deliveries after the game is over.
 */
export function parseGame(fn: string, rolls: unknown): ParsedGame {
  const r = list(fn, 'rolls', rolls);
  r.forEach((pins, i) => {
    if (typeof pins !== 'number') throw new TypeError(`${fn}: delivery ${i + 1} must be a number, got ${show(pins)}`);
    if (!Number.isInteger(pins) || pins < 0 || pins > 10) {
      throw new RangeError(`${fn}: delivery ${i + 1} knocks down ${pins} pins; a delivery knocks down an integer 0–10`);
    }
  });
  const p = r as number[];

  // Split the deliveries into frames: start index and count of each started frame.
  const starts: number[] = [];
  const counts: number[] = [];
  let i = 0;
  for (let frame = 1; frame <= 10 && i < p.length; frame++) {
    starts.push(i);
    if (frame < 10) {
      if (p[i] === 10) {
        counts.push(1);
        i += 1;
        continue;
      }
      const n = Math.min(2, p.length - i);
      if (n === 2 && p[i] + p[i + 1] > 10) {
        throw new RangeError(`${fn}: frame ${frame} knocks down ${p[i] + p[i + 1]} pins (${p[i]} + ${p[i + 1]}); a frame has 10`);
      }
      counts.push(n);
      i += n;
      continue;
    }
    // Tenth frame: three deliveries after a strike or spare in it, otherwise two.
    const t = p.slice(i, i + 3);
    if (t.length >= 2 && t[0] !== 10 && t[0] + t[1] > 10) {
      throw new RangeError(`${fn}: frame 10 knocks down ${t[0] + t[1]} pins (${t[0]} + ${t[1]}); a frame has 10`);
    }
    if (t.length === 3 && t[0] === 10 && t[1] !== 10 && t[1] + t[2] > 10) {
      throw new RangeError(
        `${fn}: frame 10 knocks down ${t[1] + t[2]} pins with its second and third deliveries (${t[1]} + ${t[2]}); ` +
          'without a second strike the rack has 10',
      );
    }
    const allowed = t.length >= 2 && (t[0] === 10 || t[0] + t[1] === 10) ? 3 : 2;
    const n = Math.min(allowed, t.length);
    counts.push(n);
    i += n;
    const extra = p.length - i;
    if (extra > 0) {
      throw new RangeError(
        `${fn}: ${extra} ${extra === 1 ? 'delivery' : 'deliveries'} after the game is over (the tenth frame ` +
          `${allowed === 3 ? 'had its third delivery' : 'was open, so it has no third delivery'})`,
      );
    }
  }

  // Points of each frame, and why the first unscored one is unscored.
  const framePoints: (number | null)[] = Array<number | null>(10).fill(null);
  let pending: string | null = null;
  for (let f = 0; f < 10; f++) {
    const frame = f + 1;
    const why = (text: string): void => {
      if (pending === null) pending = `frame ${frame} ${text}`;
    };
    if (f >= starts.length) {
      why('has no deliveries');
      continue;
    }
    const s = starts[f];
    const n = counts[f];
    if (frame < 10) {
      if (n === 1 && p[s] === 10) {
        if (s + 2 < p.length) framePoints[f] = 10 + p[s + 1] + p[s + 2];
        else why('is a strike still waiting for its two bonus deliveries');
      } else if (n === 1) {
        why(`has only its first delivery (${p[s]})`);
      } else if (p[s] + p[s + 1] === 10) {
        if (s + 2 < p.length) framePoints[f] = 10 + p[s + 2];
        else why('is a spare still waiting for its bonus delivery');
      } else {
        framePoints[f] = p[s] + p[s + 1];
      }
      continue;
    }
    const t = p.slice(s, s + n);
    const needs = t.length >= 2 && (t[0] === 10 || t[0] + t[1] === 10) ? 3 : 2;
    if (t.length === needs) framePoints[f] = t.reduce((a, b) => a + b, 0);
    else if (t.length === 1) why(`has only its first delivery (${t[0]})`);
    else if (t[0] === 10) why('has a strike and needs 1 more delivery');
    else why('has a spare and needs its third delivery');
  }

  // The frame waiting for the next delivery and the pins standing for it.
  let nextFrame: number | null = null;
  let pinsStanding = 0;
  if (pending !== null) {
    const last = starts.length - 1;
    const lastComplete = last < 0 ? true : last < 9 ? p[starts[last]] === 10 || counts[last] === 2 : framePoints[9] !== null;
    if (lastComplete) {
      nextFrame = last + 2;
      pinsStanding = 10;
    } else {
      nextFrame = last + 1;
      const t = p.slice(starts[last], starts[last] + counts[last]);
      if (last < 9 || t.length === 1) pinsStanding = t[0] === 10 ? 10 : 10 - t[0];
      else pinsStanding = t[0] === 10 ? (t[1] === 10 ? 10 : 10 - t[1]) : 10; // tenth: after X, or after a spare
    }
  }
  return { framePoints, pending, nextFrame, pinsStanding };
}
