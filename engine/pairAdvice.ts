import { integerInRange, namedErrors, record } from './internal/checks';
import { rankTransition } from './rankTransition';
import type { RankArsenalInput, RankedBall } from './types';

/** Thresholds of pairAdvice (Lanewright's choices). */
export const PAIR_ADVICE = Object.freeze({
  /** Score points (0–100 scale of rankArsenal) by which another ball must lead the one in use before a change is suggested. */
  minLead: 5,
});

/** pairAdvice's answer. */
export interface PairAdvice {
  gamesBowled: number;
  /** The ball in use, where the model placed it on the fresh pattern and after these games (1 = first). */
  inUse: { id: string; label: string; placeFresh: number; placeNow: number; scoreFresh: number; scoreNow: number };
  /** The model's first ball after these games. */
  best: { id: string; label: string; score: number };
  /** Whether to change: another ball leads the one in use by at least PAIR_ADVICE.minLead points. */
  change: boolean;
  /** One sentence for the bowler. */
  detail: string;
}

/**
 * What the pair's wear says about the ball in use: the arsenal ranked on the fresh pattern and after the games
 * bowled on the pair (rankTransition, so the pattern's breakdown and carrydown as the model has them — common
 * practice: as the heads and the front break down the lane hooks earlier and a weaker or cleaner ball keeps its
 * shape), and whether another ball now leads the one in use by enough to change.
 *
 * @param input as rankArsenal without `gamesBowled` (balls may carry a `label` for the sentence), plus `gamesBowled` (games on the pair, 1–50) and `ballInUse`
 *   (an id among `balls`).
 * @returns PairAdvice.
 * @throws as rankArsenal (naming 'pairAdvice'); RangeError for games outside 1–50 or a ball in use not in the arsenal.
 * @example
 * pairAdvice({ balls, bowler, pattern, gamesBowled: 6, ballInUse: 'solid' }).change; // => true when another ball now leads
 */
export function pairAdvice(input: Omit<RankArsenalInput, 'gamesBowled'> & { gamesBowled: number; ballInUse: string }): PairAdvice {
  const fn = 'pairAdvice';
  const inp = record(fn, 'input', input);
  const games = integerInRange(fn, 'gamesBowled', inp.gamesBowled, 1, 50);
  const { gamesBowled: _g, ballInUse, ...rest } = input;
  return namedErrors(fn, () => {
    const [fresh, now] = rankTransition(rest, [0, games]);
    const find = (r: RankedBall[]) => r.findIndex((b) => b.id === ballInUse);
    const i0 = find(fresh.ranking);
    const i1 = find(now.ranking);
    if (i0 < 0 || i1 < 0) throw new RangeError(`${fn}: ballInUse ${JSON.stringify(ballInUse)} is not one of the balls`);
    const labelOf = (id: string) => rest.balls.find((b) => b.id === id)?.label ?? id;
    const used = { ...now.ranking[i1], label: labelOf(now.ranking[i1].id) };
    const best = { ...now.ranking[0], label: labelOf(now.ranking[0].id) };
    const change = best.id !== used.id && best.score - used.score >= PAIR_ADVICE.minLead;
    const gamesText = `${games} ${games === 1 ? 'game' : 'games'}`;
    const detail = change
      ? `After ${gamesText} on this pair the model ranks ${best.label} first (${best.score.toFixed(0)} points) and ${used.label} ${ordinal(i1 + 1)} (${used.score.toFixed(0)}): time to think about changing balls.`
      : best.id === used.id
        ? `After ${gamesText} on this pair ${used.label} is still the model's first choice.`
        : `After ${gamesText} on this pair ${best.label} is ahead of ${used.label} by less than ${PAIR_ADVICE.minLead} points: within the model's precision, no change needed yet.`;
    return {
      gamesBowled: games,
      inUse: {
        id: used.id,
        label: used.label,
        placeFresh: i0 + 1,
        placeNow: i1 + 1,
        scoreFresh: fresh.ranking[i0].score,
        scoreNow: used.score,
      },
      best: { id: best.id, label: best.label, score: best.score },
      change,
      detail,
    };
  });
}

const ordinal = (n: number): string =>
  `${n}${n % 10 === 1 && n % 100 !== 11 ? 'st' : n % 10 === 2 && n % 100 !== 12 ? 'nd' : n % 10 === 3 && n % 100 !== 13 ? 'rd' : 'th'}`;
