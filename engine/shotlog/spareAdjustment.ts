import { inRange, list, oneOf, record } from '../internal/checks';
import { leaveName } from '../leaveName';
import type { BoardMove, SpareAdjustment } from './types';

/**
 * The 3-6-9 spare system's feet move for each pin (common practice): boards moved with
 * the feet, keeping the strike target, for the pin as the key pin; `side` is where the pin stands on the
 * deck as the bowler faces it (the feet move to the other side). Pins 1 and 5 are shot from the strike
 * position. The same physical moves hold for both hands (the pins do not change place); only the board
 * numbers mirror, because each bowler counts boards from the gutter on the hand side.
 */
export const THREE_SIX_NINE: Readonly<Record<number, { boards: number; side: 'left' | 'right' | 'centre' }>> = Object.freeze({
  1: { boards: 0, side: 'centre' },
  5: { boards: 0, side: 'centre' },
  2: { boards: 3, side: 'left' },
  8: { boards: 3, side: 'left' },
  4: { boards: 6, side: 'left' },
  7: { boards: 9, side: 'left' },
  3: { boards: 3, side: 'right' },
  9: { boards: 3, side: 'right' },
  6: { boards: 6, side: 'right' },
  10: { boards: 9, side: 'right' },
});

/** Row (0 = headpin … 3 = back row) and lateral place (half pin-spacings, negative toward the 7) of each pin; USBC lane specifications. */
const PLACE: Readonly<Record<number, { row: number; x: number }>> = {
  1: { row: 0, x: 0 },
  2: { row: 1, x: -1 },
  3: { row: 1, x: 1 },
  4: { row: 2, x: -2 },
  5: { row: 2, x: 0 },
  6: { row: 2, x: 2 },
  7: { row: 3, x: -3 },
  8: { row: 3, x: -1 },
  9: { row: 3, x: 1 },
  10: { row: 3, x: 3 },
};

/**
 * The key pin of a leave: the standing pin nearest the bowler (front-most row); among pins in that row
 * the one nearest the centre, then the one on the side where more of the leave stands, then the lower
 * number. Common practice ("play the pin closest to you"); the tie-breaks are Lanewright's choice.
 */
export function keyPin(leave: number[]): number {
  const side = (p: number): number => Math.sign(PLACE[p].x);
  const weight = (s: number): number => leave.filter((p) => side(p) === s).length;
  return [...leave].sort(
    (a, b) => PLACE[a].row - PLACE[b].row || Math.abs(PLACE[a].x) - Math.abs(PLACE[b].x) || weight(side(b)) - weight(side(a)) || a - b,
  )[0];
}

/**
 * Where to stand for a spare by the 3-6-9 system: keep the strike target at the arrows and move the
 * feet 3, 6 or 9 boards away from the key pin's side (2/8 → 3, 4 → 6, 7 → 9 boards right; 3/9 → 3,
 * 6 → 6, 10 → 9 boards left; 1 and 5 from the strike position).
 *
 * Source: 3-6-9 spare system, common practice (variants use 4 boards
 * per pin on the 10-pin side or move the target instead — the 2-4-6 system). Geometry (common practice,
 * D): a 3-board move at a 15-ft stance shifts the ball at the pins by ≈ 4.5 boards for a straight
 * line; adjacent pin columns are ≈ 5.6 boards apart.
 * Boards are counted from the gutter on the bowler's hand side, so a move left is +boards for a
 * right-hander and −boards for a left-hander (left-hander boards mirror); the physical direction is
 * the same for both hands.
 *
 * @param input `leave` (pins standing, 1–10, at least one), `strikeFeetBoard` and `strikeTargetBoard`
 *   (hand-side boards of the strike line, 1–39), `hand`.
 * @returns `keyPin`, `feetBoard` (clamped to the approach's boards 1–39, the detail says so), `targetBoard`
 *   (= the strike target), `feet` (the physical move actually made; 0 boards for the 1 and 5, direction
 *   then 'left' by convention), `detail` (one plain-English sentence) and `source`.
 * @throws TypeError for a wrong type or an unknown hand; RangeError for an empty leave, a pin outside
 *   1–10 or listed twice, a board outside 1–39.
 * @example
 * spareAdjustment({ leave: [10], strikeFeetBoard: 15, strikeTargetBoard: 10, hand: 'right' });
 * // => { keyPin: 10, feetBoard: 24, targetBoard: 10, feet: { direction: 'left', boards: 9 }, … }
 */
export function spareAdjustment(input: {
  leave: number[];
  strikeFeetBoard: number;
  strikeTargetBoard: number;
  hand: 'right' | 'left';
}): SpareAdjustment {
  const fn = 'spareAdjustment';
  const inp = record(fn, 'input', input);
  const leave = list(fn, 'leave', inp.leave);
  const seen = new Set<number>();
  leave.forEach((p, i) => {
    if (typeof p !== 'number') throw new TypeError(`${fn}: leave[${i}] must be a pin number, got ${String(p)}`);
    if (!Number.isInteger(p) || p < 1 || p > 10) throw new RangeError(`${fn}: leave[${i}] must be a pin from 1 to 10, got ${p}`);
    if (seen.has(p)) throw new RangeError(`${fn}: pin ${p} is listed twice in the leave`);
    seen.add(p);
  });
  if (leave.length === 0) throw new RangeError(`${fn}: the leave is empty; there is no spare to shoot`);
  const feet0 = inRange(fn, 'strikeFeetBoard', inp.strikeFeetBoard, 1, 39);
  const target = inRange(fn, 'strikeTargetBoard', inp.strikeTargetBoard, 1, 39);
  const hand = oneOf(fn, 'hand', inp.hand, ['right', 'left'] as const);
  const pins = leave as number[];
  const key = keyPin(pins);
  const rule = THREE_SIX_NINE[key];
  const direction: BoardMove['direction'] = rule.side === 'left' ? 'right' : 'left';
  const sign = (direction === 'left' ? 1 : -1) * (hand === 'right' ? 1 : -1); // own-count boards per board moved
  const wanted = feet0 + sign * rule.boards;
  const feetBoard = Math.min(39, Math.max(1, wanted));
  const moved = Math.abs(feetBoard - feet0);
  const r1 = (x: number) => String(Math.round(x * 10) / 10);
  const name = leaveName(pins);
  const detail =
    rule.boards === 0
      ? `For the ${name} the key pin is the ${key}: shoot it from your strike line — feet on board ${r1(feet0)}, target board ${r1(target)} at the arrows.`
      : `For the ${name} the key pin is the ${key}: move your feet ${rule.boards} boards ${direction} (board ${r1(feetBoard)} instead of ${r1(feet0)}) and keep your strike target, board ${r1(target)} at the arrows${
          feetBoard !== wanted
            ? `; the approach ends at board ${feetBoard}, so the move is ${r1(moved)} boards instead of ${rule.boards}`
            : ''
        }.`;
  return {
    keyPin: key,
    feetBoard,
    targetBoard: target,
    feet: { direction, boards: moved },
    detail,
    source: '3-6-9 spare system, common practice; key pin = the standing pin nearest the bowler',
  };
}
