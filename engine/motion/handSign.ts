import type { BowlerProfile } from '../types';

/**
 * The hand sign h of the release model (engine/motion/README.md): 1 for a right-hander, −1 for a left-hander (mirror symmetry).
 * Units: none. Edge cases: anything but 'right' or 'left' throws a TypeError naming `fn` (the caller; default handSign).
 * Example: `handSign('left')` → −1.
 */
export function handSign(hand: BowlerProfile['hand'], fn = 'handSign'): 1 | -1 {
  if (hand === 'right') return 1;
  if (hand === 'left') return -1;
  throw new TypeError(`${fn}: hand must be 'right' or 'left', got ${String(hand)}`);
}
