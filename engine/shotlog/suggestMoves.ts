import { linearRegression, median } from 'simple-statistics';
import { oneOf, record } from '../internal/checks';
import { leaveName } from '../leaveName';
import { analyzeShots, type ShotEntry } from './internal/analyzeShots';
import { isFirstBall, orderShots } from './internal/orderShots';
import { spareAdjustment } from './spareAdjustment';
import type { BoardMove, Move, ShotRecord } from './types';

/** Thresholds of suggestMoves (Lanewright's choices, documented there). */
export const MOVE_THRESHOLDS = Object.freeze({
  /** Consecutive same-side misses (high or light) on the current line and ball that call for a move. */
  streak: 3,
  /** First balls read for a streak. */
  window: 6,
  /** Breakpoint boards recorded on the current line and ball before a drift is judged … */
  driftMinShots: 4,
  /** … the last this many of them … */
  driftWindow: 8,
  /** … and the fitted drift over them that calls for a move, boards. */
  driftBoards: 2,
  /** Feet boards already moved the same way with the same ball in the session before a ball change is suggested. */
  ballChangeAfterBoards: 4,
  /** Misses of the same single-pin spare (among the recent spare chances) before the 3-6-9 move is shown. */
  spareMisses: 2,
  /** Recent spare chances read. */
  spareWindow: 20,
});

const TWO_AND_ONE_SOURCE =
  '2-and-1 adjustment, common practice: feet 2 boards and target 1 board the same way, in the direction of the miss';

/** Physical direction and boards → the bowler's own board count (+ toward the non-hand side). */
const own = (m: BoardMove, hand: 'right' | 'left'): number => (m.direction === 'left' ? 1 : -1) * (hand === 'right' ? 1 : -1) * m.boards;

/**
 * Suggests adjustments from the pattern in the most recent shots: the 2-and-1 move when the ball keeps
 * hitting high or light or its breakpoint drifts, a ball or surface change when moves have not cured
 * the miss, and the 3-6-9 feet board for a spare that keeps being missed.
 *
 * Definitions (thresholds in MOVE_THRESHOLDS, Lanewright's choices):
 * - shots are read in order (date, then the order the sessions first appear, game, frame, delivery);
 *   the **current line** is the latest first ball's ball, feet board and target board — earlier shots
 *   on another line or ball do not count toward a streak or a drift;
 * - **hit streak**: the last ≥ 3 first balls at a full rack on the current line with a recorded hit were
 *   all on one side — 'high' or 'brooklyn' (too much hook) or 'light' (too little) — 'miss' and
 *   'pocket' end a streak;
 * - **breakpoint drift**: over the last ≤ 8 (at least 4) recorded breakpoint boards on the current
 *   line, the least-squares slope × (shots − 1) is ≥ 2 boards; a breakpoint moving to higher boards
 *   (toward the middle: the ball reads the lane earlier, as when the pattern breaks down) is treated as
 *   a high miss, toward the gutter as a light one;
 * - **2-and-1**: move feet 2 boards and target 1 board the same way, in the direction of the miss
 *   (common practice): high → toward the middle of the lane from the hand side (left for a
 *   right-hander, right for a left-hander), light → toward the hand-side gutter; a streak with a
 *   Brooklyn hit in it calls for twice that (4 and 2, the same 2:1 ratio);
 * - **ball change**: the streak goes on although the bowler has already moved the feet ≥ 4 boards the
 *   same way with this ball in this session: high → a weaker ball or a smoother surface (higher grit or
 *   polish), light → a stronger ball or a rougher surface (the trade's directions, common practice);
 * - **spare system**: a single-pin leave missed ≥ 2 times among the last 20 spare chances gets the
 *   3-6-9 feet board (spareAdjustment) from the median strike feet and target of the recent first balls.
 * `evidence` says how many shots triggered each move.
 *
 * @param input `shots` (ShotRecords, any order) and the bowler's `hand`.
 * @returns the moves, 2-and-1 first, then a ball change, then spare moves; [] when nothing stands out.
 * @throws TypeError/RangeError for malformed shots or hand (as shotStats), naming 'suggestMoves'.
 * @example
 * suggestMoves({ shots, hand: 'right' })[0];
 * // => { kind: 'two-and-one', feet: { direction: 'left', boards: 2 }, target: { direction: 'left', boards: 1 }, … }
 */
export function suggestMoves(input: { shots: ShotRecord[]; hand: 'right' | 'left' }): Move[] {
  const fn = 'suggestMoves';
  const inp = record(fn, 'input', input);
  const hand = oneOf(fn, 'hand', inp.hand, ['right', 'left'] as const);
  const a = analyzeShots(fn, inp.shots);
  const T = MOVE_THRESHOLDS;

  const ordered = orderShots(a).map((x) => x.e);
  const firsts = ordered.filter(isFirstBall);
  const moves: Move[] = [];
  const last = firsts[firsts.length - 1];

  if (last) {
    const sameLine = (e: ShotEntry): boolean =>
      e.shot.ballId === last.shot.ballId &&
      (e.shot.feetBoard ?? null) === (last.shot.feetBoard ?? null) &&
      (e.shot.targetBoard ?? null) === (last.shot.targetBoard ?? null);
    // the current line: the run of first balls at the end with the same ball, feet and target
    const line: ShotEntry[] = [];
    for (let k = firsts.length - 1; k >= 0 && sameLine(firsts[k]); k--) line.unshift(firsts[k]);

    // hit streak
    const withHit = line.filter((e) => e.shot.hit !== undefined && e.shot.hit !== null).slice(-T.window);
    let streak = 0;
    let side: 'high' | 'light' | null = null;
    let brooklyn = 0;
    for (let k = withHit.length - 1; k >= 0; k--) {
      const h = withHit[k].shot.hit;
      const s = h === 'high' || h === 'brooklyn' ? 'high' : h === 'light' ? 'light' : null;
      if (s === null || (side !== null && s !== side)) break;
      side = s;
      streak++;
      if (h === 'brooklyn') brooklyn++;
    }
    // breakpoint drift
    const bps = line.filter((e) => typeof e.shot.breakpointBoard === 'number').slice(-T.driftWindow);
    let drift = 0;
    if (bps.length >= T.driftMinShots) {
      const fit = linearRegression(bps.map((e, k) => [k, e.shot.breakpointBoard as number]));
      drift = fit.m * (bps.length - 1);
    }
    const driftSide: 'high' | 'light' | null = Math.abs(drift) >= T.driftBoards ? (drift > 0 ? 'high' : 'light') : null;

    const missSide = streak >= T.streak ? side : driftSide;
    if (missSide) {
      const towardMiddle: BoardMove['direction'] = hand === 'right' ? 'left' : 'right';
      const towardGutter: BoardMove['direction'] = hand === 'right' ? 'right' : 'left';
      const direction = missSide === 'high' ? towardMiddle : towardGutter;
      const big = streak >= T.streak && brooklyn > 0;
      const feet = { direction, boards: big ? 4 : 2 };
      const target = { direction, boards: big ? 2 : 1 };
      const parts: string[] = [];
      if (streak >= T.streak) {
        parts.push(
          `the last ${streak} first balls with a recorded hit on this line were ${side}${brooklyn > 0 ? ` (${brooklyn} of them Brooklyn)` : ''}`,
        );
      }
      if (driftSide === missSide) {
        parts.push(
          `the breakpoint moved ${Math.abs(drift).toFixed(1)} boards ${drift > 0 ? 'toward the middle' : 'toward the gutter'} over the last ${bps.length} shots with a breakpoint on this line`,
        );
      }
      const f0 = last.shot.feetBoard;
      const t0 = last.shot.targetBoard;
      const whereTo =
        typeof f0 === 'number' && typeof t0 === 'number'
          ? ` — from board ${f0} to ${f0 + own(feet, hand)} with the feet and from ${t0} to ${t0 + own(target, hand)} at the arrows`
          : '';
      moves.push({
        kind: 'two-and-one',
        title: `Move ${feet.boards} and ${target.boards} ${direction}`,
        detail: `${
          streak >= T.streak
            ? missSide === 'high'
              ? 'The ball is hooking too much and hitting high'
              : 'The ball is not getting back to the pocket'
            : missSide === 'high'
              ? 'The breakpoint is moving toward the middle: the ball is reading the lane earlier'
              : 'The breakpoint is moving toward the gutter: the ball is going longer'
        }: move your feet ${feet.boards} boards and your target ${target.boards} board${target.boards > 1 ? 's' : ''} ${direction}${whereTo}, to change the angle while keeping about the same breakpoint.`,
        feet,
        target,
        evidence: `${parts.join('; ')}.`,
        source: big ? `${TWO_AND_ONE_SOURCE}; a bigger miss, a bigger move in the same 2:1 ratio (common practice)` : TWO_AND_ONE_SOURCE,
      });

      // ball change: the same miss after moves already made this way with this ball in this session
      if (streak >= T.streak && typeof f0 === 'number') {
        const session = firsts.filter(
          (e) => e.shot.sessionId === last.shot.sessionId && e.shot.ballId === last.shot.ballId && typeof e.shot.feetBoard === 'number',
        );
        const startFeet = session[0]?.shot.feetBoard as number;
        const moved = (f0 - startFeet) * (hand === 'right' ? 1 : -1) * (direction === 'left' ? 1 : -1);
        if (session.length > 0 && moved >= T.ballChangeAfterBoards) {
          moves.push({
            kind: 'ball-change',
            title: missSide === 'high' ? 'Try a weaker ball or a smoother surface' : 'Try a stronger ball or a rougher surface',
            detail:
              missSide === 'high'
                ? 'Moving has not stopped the high hits: a ball that reads the lane later (a weaker cover, a higher grit or polish) keeps its energy for the back end.'
                : 'Moving has not brought the ball back: a ball that reads the oil earlier (a stronger cover, a lower grit) will hook more.',
            evidence: `You have already moved ${moved} boards ${direction} with this ball this session (feet board ${startFeet} → ${f0}) and the last ${streak} first balls were still ${side}.`,
            source: 'common practice; cover and surface directions',
          });
        }
      }
    }
  }

  // spare system: a single-pin leave missed again and again
  const spareChances = ordered
    .filter((e) => e.view !== null && e.view.rackBall === 2 && e.view.pinsBefore.length === 1 && !e.view.foul)
    .slice(-T.spareWindow);
  const missed = new Map<number, number>();
  const seen = new Map<number, number>();
  for (const e of spareChances) {
    const pin = (e.view as NonNullable<ShotEntry['view']>).pinsBefore[0];
    seen.set(pin, (seen.get(pin) ?? 0) + 1);
    if (e.view?.symbol !== '/') missed.set(pin, (missed.get(pin) ?? 0) + 1);
  }
  const lineOf = firsts.filter((e) => typeof e.shot.feetBoard === 'number' && typeof e.shot.targetBoard === 'number').slice(-T.window);
  const pinsByMisses = [...missed.entries()].filter(([, n]) => n >= T.spareMisses).sort((x, y) => y[1] - x[1] || x[0] - y[0]);
  for (const [pin, n] of pinsByMisses) {
    const evidence = `The ${pin} pin was missed ${n} of ${seen.get(pin)} times in the last ${spareChances.length} single-pin spare chances.`;
    if (lineOf.length > 0) {
      const adj = spareAdjustment({
        leave: [pin],
        strikeFeetBoard: median(lineOf.map((e) => e.shot.feetBoard as number)),
        strikeTargetBoard: median(lineOf.map((e) => e.shot.targetBoard as number)),
        hand,
      });
      moves.push({
        kind: 'spare-system',
        title: `${leaveName([pin])} pin: stand on board ${adj.feetBoard}`,
        detail: adj.detail,
        feet: adj.feet,
        evidence,
        source: adj.source,
      });
    } else {
      const adj = spareAdjustment({ leave: [pin], strikeFeetBoard: 20, strikeTargetBoard: 10, hand });
      moves.push({
        kind: 'spare-system',
        title:
          adj.feet.boards === 0
            ? `${pin} pin: shoot it from your strike line`
            : `${pin} pin: move ${adj.feet.boards} boards ${adj.feet.direction}`,
        detail:
          adj.feet.boards === 0
            ? 'By the 3-6-9 system this pin is shot from the strike position, feet and target unchanged.'
            : `Keep your strike target and move your feet ${adj.feet.boards} boards ${adj.feet.direction} from your strike position (record feet and target boards to get the exact board).`,
        feet: adj.feet,
        evidence,
        source: adj.source,
      });
    }
  }
  return moves;
}
