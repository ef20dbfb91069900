import { list } from '../internal/checks';
import { scoreGame } from '../scoreGame';
import { scorePartialGame } from '../scorePartialGame';
import { checkShape, initialState, step, type GameState } from './internal/replay';
import type { DeliveryView, FrameView, GameView, LoggedDelivery } from './types';

/**
 * Builds a game's frame sheet from its logged deliveries (pins standing after each): every
 * delivery's pins, symbol and split mark, each frame's running total, and the next delivery expected.
 *
 * Definition: scoring per the USBC and World Bowling playing rules (scoreGame for a complete
 * game, scorePartialGame for one in progress — the totals are theirs); fouls per the USBC playing rules on fouls: a
 * fouled delivery counts, is credited 0 pins and its rack is re-spotted as before the delivery (so
 * all ten on the second ball after a first-ball foul is a spare, and a foul on the second ball keeps
 * only the first ball's pins). Splits per isSplit (the USBC playing rules on splits), marked on the first delivery at a
 * full rack. Symbols as a scoresheet shows them: 'X' strike, '/' spare, '-' no pins, 'F' foul,
 * otherwise the count. In the tenth frame the rack is re-set after each strike or spare.
 *
 * @param deliveries the game's deliveries in the order thrown (frame, delivery, standing, foul?);
 *   may be empty.
 * @returns a GameView with always 10 frames (frames not yet started have no deliveries), `rolls`
 *   (the pins credited, scoreGame's input), `total`, `complete` and `next` (null when complete).
 * @throws TypeError when `deliveries` is not an array or a delivery has the wrong shape (a frame that
 *   is not a number, standing that is not an array of numbers, a foul that is not a boolean);
 *   RangeError `buildGame: delivery i (frame f, delivery d): <reason>` for the first impossible one
 *   (the reasons of checkDelivery: a pin already down, a frame or delivery that cannot exist, out of
 *   order, the game already complete).
 *
 * @example
 * buildGame([{ frame: 1, delivery: 1, standing: [] }, { frame: 2, delivery: 1, standing: [7, 10] }]);
 * // => frames[0].deliveries[0].symbol 'X', frames[1].deliveries[0].split true,
 * //    next { frame: 2, delivery: 2, pinsBefore: [7, 10] }
 */
export function buildGame(deliveries: LoggedDelivery[]): GameView {
  const fn = 'buildGame';
  const ds = list(fn, 'deliveries', deliveries);
  let state = initialState();
  const views: DeliveryView[] = [];
  ds.forEach((raw, i) => {
    const d = checkShape(fn, `deliveries[${i}]`, raw);
    const r = step(state, d);
    if (!r.ok) throw new RangeError(`${fn}: delivery ${i + 1} (frame ${d.frame}, delivery ${d.delivery}): ${r.reason}`);
    views.push(r.view);
    state = r.state;
  });
  return gameView(views, state);
}

/** Assembles the GameView from the accepted deliveries and the state after them (internal). */
export function gameView(views: DeliveryView[], state: GameState): GameView {
  const rolls = views.map((v) => v.pins);
  const partial = scorePartialGame(rolls);
  const totals = state.complete ? scoreGame(rolls).frames : partial.frames;
  const frames: FrameView[] = [];
  for (let f = 1; f <= 10; f++) {
    const ds = views.filter((v) => v.frame === f);
    const complete = state.complete || (ds.length > 0 && f < 10 && (ds.length === 2 || ds[0].symbol === 'X'));
    frames.push({ frame: f, deliveries: ds, runningTotal: totals[f - 1], complete });
  }
  return {
    frames,
    rolls,
    total: state.complete ? scoreGame(rolls).total : partial.total,
    complete: state.complete,
    next: state.complete ? null : { frame: state.frame, delivery: state.delivery, pinsBefore: state.pinsBefore.slice() },
  };
}
