import { integerInRange, oneOf, record } from '../internal/checks';
import { differenceInterval } from './differenceInterval';
import { analyzeShots, type ShotEntry } from './internal/analyzeShots';
import { computeStats } from './internal/computeStats';
import { isFirstBall, orderShots } from './internal/orderShots';
import type { BoardMove, MoveFollowUp, RateChange, ShotRecord } from './types';

/** Settings of moveFollowUp (Lanewright's choices, documented there). */
export const FOLLOW_UP = Object.freeze({
  /** First balls read on each side of a move (the latest before it, the earliest after it). */
  window: 12,
  /** First balls with a recorded hit (or, without hits, first balls) each side needs before a verdict. */
  minShots: 5,
});

const sideOf = (delta: number, hand: 'right' | 'left'): BoardMove => ({
  // hand-side boards: a higher board is farther from the hand-side gutter (left for a right-hander)
  direction: delta > 0 === (hand === 'right') ? 'left' : 'right',
  boards: Math.abs(delta),
});

const change = (after: { hits: number; n: number }, before: { hits: number; n: number }): RateChange => {
  if (after.n === 0 || before.n === 0) return { diff: null, low: null, high: null };
  const d = differenceInterval(after, before);
  return { diff: 100 * d.diff, low: 100 * d.low, high: 100 * d.high };
};

const num = (v: number | null | undefined): number | null => (typeof v === 'number' ? v : null);

/**
 * Follows up every move a bowler made: a change of feet board, target board, ball or surface between two
 * consecutive first balls. For each move it compares the first balls just before it (on the old line) with
 * the first balls after it (up to the next move), and says whether the pocket and strike rates improved,
 * with the honest interval of the difference.
 *
 * Definitions:
 * - order, first balls, strike % and pocket % as in shotStats (first balls at a full rack; pocket % over
 *   first balls with a recorded hit) — the same counts, over each side's first balls only;
 * - a **move** is a change between consecutive first balls of the ball, its surface, or a feet or target
 *   board recorded on both (a board missing on either side is not read as a move);
 * - **before**: the last ≤ FOLLOW_UP.window first balls on the old line since the previous move;
 *   **after**: the first ≤ FOLLOW_UP.window first balls from the move up to the next move;
 * - **change**: after − before, in percentage points, with the hybrid score interval of a difference of
 *   two proportions (differenceInterval; Newcombe 1998, Statistics in Medicine 17, 873–890);
 * - **verdict** from the pocket rate when both sides have ≥ FOLLOW_UP.minShots recorded hits, else from the
 *   strike rate: 'too-soon' when either side has fewer than that; 'better' when the interval lies above 0;
 *   'worse' when it lies below 0; otherwise 'unclear' (the shots so far cannot tell).
 *
 * @param input `shots` (ShotRecords, any order), the bowler's `hand`, optional `window` (first balls, 1–100).
 * @returns one MoveFollowUp per move, in the order thrown; [] when the line never changed.
 * @throws TypeError/RangeError for malformed shots, hand or window (as shotStats), naming 'moveFollowUp'.
 * @example
 * moveFollowUp({ shots, hand: 'right' })[0].feet; // => { direction: 'left', boards: 2 }
 */
export function moveFollowUp(input: { shots: ShotRecord[]; hand: 'right' | 'left'; window?: number }): MoveFollowUp[] {
  const fn = 'moveFollowUp';
  const inp = record(fn, 'input', input);
  const hand = oneOf(fn, 'hand', inp.hand, ['right', 'left'] as const);
  const window = inp.window === undefined ? FOLLOW_UP.window : integerInRange(fn, 'window', inp.window, 1, 100);
  const a = analyzeShots(fn, inp.shots);
  const firsts = orderShots(a).filter((x) => isFirstBall(x.e));

  const moved = (p: ShotEntry, q: ShotEntry): boolean => {
    const boardMoved = (k: 'feetBoard' | 'targetBoard'): boolean => {
      const x = num(p.shot[k]);
      const y = num(q.shot[k]);
      return x !== null && y !== null && x !== y;
    };
    return (
      p.shot.ballId !== q.shot.ballId || p.shot.surfaceKey !== q.shot.surfaceKey || boardMoved('feetBoard') || boardMoved('targetBoard')
    );
  };
  const starts: number[] = [];
  for (let k = 1; k < firsts.length; k++) if (moved(firsts[k - 1].e, firsts[k].e)) starts.push(k);

  return starts.map((k, m) => {
    const previousStart = m > 0 ? starts[m - 1] : 0;
    const nextStart = m + 1 < starts.length ? starts[m + 1] : firsts.length;
    const before = firsts.slice(Math.max(previousStart, k - window), k);
    const after = firsts.slice(k, Math.min(nextStart, k + window));
    const p = firsts[k - 1].e.shot;
    const q = firsts[k].e.shot;
    const statsOf = (side: typeof firsts) => computeStats(a, new Set(side.map((x) => x.i)));
    const sb = statsOf(before);
    const sa = statsOf(after);

    const feetDelta = num(p.feetBoard) !== null && num(q.feetBoard) !== null ? (q.feetBoard as number) - (p.feetBoard as number) : 0;
    const targetDelta =
      num(p.targetBoard) !== null && num(q.targetBoard) !== null ? (q.targetBoard as number) - (p.targetBoard as number) : 0;
    const feet = feetDelta !== 0 ? sideOf(feetDelta, hand) : undefined;
    const target = targetDelta !== 0 ? sideOf(targetDelta, hand) : undefined;
    const ball = p.ballId !== q.ballId ? { from: p.ballId, to: q.ballId } : undefined;
    const surface = p.ballId === q.ballId && p.surfaceKey !== q.surfaceKey ? { from: p.surfaceKey, to: q.surfaceKey } : undefined;

    const pocketChange = change(sa.pocket, sb.pocket);
    const strikeChange = change(sa.strike, sb.strike);
    const byPocket = sa.pocket.n >= FOLLOW_UP.minShots && sb.pocket.n >= FOLLOW_UP.minShots;
    const judged = byPocket ? pocketChange : strikeChange;
    const enough = byPocket || (sa.strike.n >= FOLLOW_UP.minShots && sb.strike.n >= FOLLOW_UP.minShots);
    const verdict: MoveFollowUp['verdict'] = !enough
      ? 'too-soon'
      : (judged.low as number) > 0
        ? 'better'
        : (judged.high as number) < 0
          ? 'worse'
          : 'unclear';

    const parts: string[] = [];
    if (feet) parts.push(`feet ${feet.boards} ${feet.direction}`);
    if (target) parts.push(`target ${target.boards} ${target.direction}`);
    if (ball) parts.push('ball change');
    if (surface) parts.push(`surface ${surface.from} → ${surface.to}`);
    const what = byPocket ? 'pocket' : 'strike';
    const pts = (v: number | null): string => (v === null ? '—' : `${v > 0 ? '+' : v < 0 ? '−' : ''}${Math.abs(v).toFixed(0)}`);
    const summary =
      verdict === 'too-soon'
        ? `Too soon to tell: ${after.length} first ball${after.length === 1 ? '' : 's'} since the move and ${before.length} before it; ${FOLLOW_UP.minShots} on each side are needed.`
        : `${what === 'pocket' ? 'Pocket' : 'Strike'} rate ${pts(judged.diff)} points (95 % interval ${pts(judged.low)} to ${pts(judged.high)}): ${
            verdict === 'better'
              ? 'the move worked'
              : verdict === 'worse'
                ? 'the move made it worse'
                : 'no clear change yet — the difference is within what chance gives over these shots'
          }.`;

    return {
      at: { sessionId: q.sessionId, gameNumber: q.gameNumber, frame: q.frame, date: q.date },
      title: parts.join(', '),
      ...(feet ? { feet } : {}),
      ...(target ? { target } : {}),
      ...(ball ? { ball } : {}),
      ...(surface ? { surface } : {}),
      before: { firstBalls: before.length, strike: sb.strike, pocket: sb.pocket },
      after: { firstBalls: after.length, strike: sa.strike, pocket: sa.pocket },
      pocketChange,
      strikeChange,
      judgedBy: what,
      verdict,
      summary,
    };
  });
}
