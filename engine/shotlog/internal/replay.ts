import { isSplit } from '../../isSplit';
import { leaveName } from '../../leaveName';
import { show } from '../../internal/checks';
import type { DeliveryView, LoggedDelivery } from '../types';

/**
 * The state of a game between deliveries, and one step of it (internal to buildGame/checkDelivery).
 *
 * Rules: the USBC and World Bowling playing rules (frames 1–9 end after a strike or two deliveries; the tenth has a third
 * delivery after a strike or spare in it, and its rack is re-set after each strike or spare) and
 * the USBC playing rules on fouls (a fouled delivery counts, is credited 0 pins, and the pins are re-spotted: "foul on
 * first ball: pins respotted; all ten on the second ball = spare").
 */
export interface GameState {
  /** The next delivery, or null when the game is over. */
  frame: number;
  delivery: number;
  /** Pins standing for the next delivery, ascending. */
  pinsBefore: number[];
  /** 1 when the next delivery is the first ball at a full rack, 2 when it is the second ball at this rack. */
  rackBall: 1 | 2;
  complete: boolean;
  /** Why the game ended (for the reason given when more deliveries come). */
  endedBy: 'open-tenth' | 'third-delivery' | null;
  /** Frames 1–9 ended by a strike so far (they have no delivery 2). */
  strikeFrames: number[];
}

export type Field = 'frame' | 'delivery' | 'standing' | 'foul';
export type StepResult = { ok: true; view: DeliveryView; state: GameState } | { ok: false; field: Field; reason: string };

const ALL = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];

export function initialState(): GameState {
  return frameStart(1);
}

/** The state before the first delivery of frame f (every frame starts at a full rack). */
export function frameStart(frame: number): GameState {
  return { frame, delivery: 1, pinsBefore: ALL.slice(), rackBall: 1, complete: false, endedBy: null, strikeFrames: [] };
}

/** TypeErrors for a delivery of the wrong shape (the engine's invalid-input policy). */
export function checkShape(fn: string, name: string, d: unknown): LoggedDelivery {
  if (typeof d !== 'object' || d === null || Array.isArray(d)) throw new TypeError(`${fn}: ${name} must be an object, got ${show(d)}`);
  const r = d as Record<string, unknown>;
  if (typeof r.frame !== 'number') throw new TypeError(`${fn}: ${name}.frame must be a number, got ${show(r.frame)}`);
  if (typeof r.delivery !== 'number') throw new TypeError(`${fn}: ${name}.delivery must be a number, got ${show(r.delivery)}`);
  if (!Array.isArray(r.standing)) throw new TypeError(`${fn}: ${name}.standing must be an array of pin numbers, got ${show(r.standing)}`);
  r.standing.forEach((p, i) => {
    if (typeof p !== 'number') throw new TypeError(`${fn}: ${name}.standing[${i}] must be a pin number, got ${show(p)}`);
  });
  if (r.foul !== undefined && typeof r.foul !== 'boolean')
    throw new TypeError(`${fn}: ${name}.foul must be true or false, got ${show(r.foul)}`);
  return d as LoggedDelivery;
}

const where = (s: GameState): string => `the next delivery is frame ${s.frame}, delivery ${s.delivery}`;
const pinList = (pins: number[]): string => (pins.length === 0 ? 'none' : leaveName(pins));
const andList = (xs: number[]): string => (xs.length === 1 ? `${xs[0]}` : `${xs.slice(0, -1).join(', ')} and ${xs[xs.length - 1]}`);

/** One delivery applied to the state: the view and the new state, or the field at fault and why. */
export function step(s: GameState, d: LoggedDelivery): StepResult {
  const { frame, delivery } = d;
  const foul = d.foul === true;

  if (s.complete) {
    if (s.endedBy === 'open-tenth' && frame === 10 && delivery === 3) {
      return {
        ok: false,
        field: 'delivery',
        reason: 'frame 10 has no delivery 3: its first two deliveries made neither a strike nor a spare, so the game is already complete',
      };
    }
    return { ok: false, field: 'frame', reason: 'the game is already complete' };
  }
  if (!Number.isInteger(frame) || frame < 1 || frame > 10) {
    return { ok: false, field: 'frame', reason: `frame ${frame} cannot exist; a game has frames 1 to 10` };
  }
  const maxDelivery = frame === 10 ? 3 : 2;
  if (!Number.isInteger(delivery) || delivery < 1 || delivery > maxDelivery) {
    return {
      ok: false,
      field: 'delivery',
      reason: `frame ${frame} has no delivery ${delivery}; ${frame === 10 ? 'the tenth frame has at most 3' : 'frames 1 to 9 have at most 2'}`,
    };
  }
  if (frame !== s.frame || delivery !== s.delivery) {
    if (delivery === 2 && s.strikeFrames.includes(frame)) {
      return { ok: false, field: 'delivery', reason: `frame ${frame} has no delivery 2: its first delivery was a strike; ${where(s)}` };
    }
    const earlier = frame < s.frame || (frame === s.frame && delivery < s.delivery);
    const field: Field = frame !== s.frame ? 'frame' : 'delivery';
    if (earlier) return { ok: false, field, reason: `frame ${frame}, delivery ${delivery} is already logged; ${where(s)}` };
    return { ok: false, field, reason: where(s) };
  }

  // The pins standing after it.
  const seen = new Set<number>();
  for (const p of d.standing) {
    if (!Number.isInteger(p) || p < 1 || p > 10)
      return { ok: false, field: 'standing', reason: `pin ${p} does not exist; pins are numbered 1 to 10` };
    if (seen.has(p)) return { ok: false, field: 'standing', reason: `pin ${p} is listed twice` };
    seen.add(p);
  }
  const before = new Set(s.pinsBefore);
  const wasDown = [...seen].filter((p) => !before.has(p)).sort((a, b) => a - b);
  if (wasDown.length > 0) {
    const what = wasDown.length === 1 ? `pin ${wasDown[0]} was` : `pins ${andList(wasDown)} were`;
    let context = `only ${pinList(s.pinsBefore)} ${s.pinsBefore.length === 1 ? 'was' : 'were'} standing`;
    if (frame === 10 && s.rackBall === 2 && delivery > 1)
      context += ' (in the tenth frame the rack is re-set only after a strike or a spare)';
    return { ok: false, field: 'standing', reason: `${what} already down before this delivery; ${context}` };
  }

  const after = [...seen].sort((a, b) => a - b);
  const cleared = !foul && after.length === 0;
  const pins = foul ? 0 : s.pinsBefore.length - after.length;
  const symbol = foul ? 'F' : cleared ? (s.rackBall === 1 ? 'X' : '/') : pins === 0 ? '-' : String(pins);
  const split = !foul && s.rackBall === 1 && isSplit(after);
  const view: DeliveryView = {
    frame,
    delivery,
    pinsBefore: s.pinsBefore.slice(),
    standing: foul ? s.pinsBefore.slice() : after,
    pins,
    foul,
    symbol,
    split,
    rackBall: s.rackBall,
  };
  const rackAfter = foul ? s.pinsBefore.slice() : after;
  const strikeFrames = frame < 10 && delivery === 1 && cleared ? [...s.strikeFrames, frame] : s.strikeFrames;
  const next = (f: number, dl: number, rack: number[], rackBall: 1 | 2): GameState => ({
    frame: f,
    delivery: dl,
    pinsBefore: rack,
    rackBall,
    complete: false,
    endedBy: null,
    strikeFrames,
  });
  const over = (endedBy: GameState['endedBy']): GameState => ({
    frame: 0,
    delivery: 0,
    pinsBefore: [],
    rackBall: 1,
    complete: true,
    endedBy,
    strikeFrames,
  });

  let state: GameState;
  if (frame < 10) {
    if (delivery === 1 && !cleared) state = next(frame, 2, rackAfter, 2);
    else state = next(frame + 1, 1, ALL.slice(), 1);
  } else if (delivery === 1) {
    state = cleared ? next(10, 2, ALL.slice(), 1) : next(10, 2, rackAfter, 2);
  } else if (delivery === 2) {
    if (s.rackBall === 1)
      state = cleared ? next(10, 3, ALL.slice(), 1) : next(10, 3, rackAfter, 2); // after a strike
    else state = cleared ? next(10, 3, ALL.slice(), 1) : over('open-tenth'); // a spare earns the third delivery
  } else {
    state = over('third-delivery');
  }
  return { ok: true, view, state };
}
