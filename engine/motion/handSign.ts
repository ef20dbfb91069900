import type { BowlerProfile } from '../types';

/**
 * The hand sign h of PHYSICS.md §1.11: 1 for a right-hander, −1 for a left-hander (mirror rule §3.6).
 * Units: none. Edge cases: anything but 'right' or 'left' throws a TypeError naming handSign.
 * Example: `handSign('left')` → −1.
 */
export function handSign(hand: BowlerProfile['hand']): 1 | -1 {
  if (hand === 'right') return 1;
  if (hand === 'left') return -1;
  throw new TypeError(`handSign: hand must be 'right' or 'left', got ${String(hand)}`);
}
