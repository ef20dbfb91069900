import { list } from '../internal/checks';
import { checkShape, initialState, step } from './internal/replay';
import type { DeliveryCheck, LoggedDelivery } from './types';

/**
 * Checks whether one more delivery can follow a game's logged deliveries, and how it would appear on
 * the frame sheet — the check behind refusing an impossible shot with a reason.
 *
 * Definition: the rules of buildGame (USBC and World Bowling playing rules: scoring and frames, splits via isSplit, and
 * fouls: a fouled delivery counts, is credited 0 and its rack is re-spotted). The reasons are plain
 * English and name what is wrong, e.g. "pin 7 was already down before this delivery; only 7-10 were
 * standing", "frame 3 has no delivery 3; frames 1 to 9 have at most 2", "frame 4 has no delivery 2:
 * its first delivery was a strike; …", "the next delivery is frame 4, delivery 1", "the game is
 * already complete", "pin 11 does not exist; pins are numbered 1 to 10", "pin 4 is listed twice".
 * `field` says which input to correct: 'frame', 'delivery' or 'standing' ('foul' is reserved; any
 * true/false foul is possible).
 *
 * @param prior the game's deliveries so far, in order (must themselves be possible).
 * @param next the delivery to check.
 * @returns `{ ok: true, view }` (the DeliveryView it would get) or `{ ok: false, field, reason }`.
 * @throws TypeError for the wrong shapes (see buildGame); RangeError
 *   `checkDelivery: prior delivery i (…): <reason>` when `prior` itself is impossible.
 *
 * @example
 * checkDelivery([{ frame: 1, delivery: 1, standing: [7, 10] }], { frame: 1, delivery: 2, standing: [4, 7] });
 * // => { ok: false, field: 'standing', reason: 'pin 4 was already down before this delivery; only 7-10 were standing' }
 */
export function checkDelivery(prior: LoggedDelivery[], next: LoggedDelivery): DeliveryCheck {
  const fn = 'checkDelivery';
  const ds = list(fn, 'prior', prior);
  let state = initialState();
  ds.forEach((raw, i) => {
    const d = checkShape(fn, `prior[${i}]`, raw);
    const r = step(state, d);
    if (!r.ok) throw new RangeError(`${fn}: prior delivery ${i + 1} (frame ${d.frame}, delivery ${d.delivery}): ${r.reason}`);
    state = r.state;
  });
  const d = checkShape(fn, 'next', next);
  const r = step(state, d);
  return r.ok ? { ok: true, view: r.view } : { ok: false, field: r.field, reason: r.reason };
}
