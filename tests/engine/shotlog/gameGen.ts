// Test helper (not a test file): games generated from random choices of the pins left standing,
// walked through the frame rules of the USBC and World Bowling playing rules and the foul rule of the USBC playing rules on fouls independently of
// the engine, with the pins credited by each delivery (the input of scoreGame).
import fc from 'fast-check';
import type { LoggedDelivery } from '../../../engine/index';

export const ALL = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];

export interface Choice {
  /** Bit p − 1 set: pin p stays standing (if it was standing). */
  mask: number;
  foul: boolean;
}

/** Strikes and spares often (mask 0 clears the rack), fouls about 1 in 15. */
export const choiceArb: fc.Arbitrary<Choice> = fc.record({
  mask: fc.oneof(
    { arbitrary: fc.constant(0), weight: 2 },
    { arbitrary: fc.nat(1023), weight: 3 },
    { arbitrary: fc.constantFrom(1 << 6, 1 << 9, (1 << 6) | (1 << 9)), weight: 1 },
  ),
  foul: fc.nat(14).map((x) => x === 0),
});

export interface Generated {
  deliveries: LoggedDelivery[];
  rolls: number[];
  /** Pins standing before each delivery. */
  before: number[][];
}

/** The complete game the choices describe (choices are reused cyclically). */
export function makeGame(choices: Choice[]): Generated {
  const out: Generated = { deliveries: [], rolls: [], before: [] };
  let i = 0;
  const throwAt = (frame: number, delivery: number, rack: number[]): { after: number[]; cleared: boolean } => {
    const c = choices[i++ % choices.length];
    const standing = rack.filter((p) => (c.mask & (1 << (p - 1))) !== 0);
    out.deliveries.push(c.foul ? { frame, delivery, standing, foul: true } : { frame, delivery, standing });
    out.rolls.push(c.foul ? 0 : rack.length - standing.length);
    out.before.push(rack);
    const after = c.foul ? rack : standing; // a foul re-spots the rack (the USBC playing rules on fouls)
    return { after, cleared: !c.foul && standing.length === 0 };
  };
  for (let frame = 1; frame <= 9; frame++) {
    const a = throwAt(frame, 1, ALL);
    if (!a.cleared) throwAt(frame, 2, a.after);
  }
  const a = throwAt(10, 1, ALL);
  if (a.cleared) {
    const b = throwAt(10, 2, ALL);
    throwAt(10, 3, b.cleared ? ALL : b.after);
  } else {
    const b = throwAt(10, 2, a.after);
    if (b.cleared) throwAt(10, 3, ALL);
  }
  return out;
}

export const gameArb: fc.Arbitrary<Generated> = fc.array(choiceArb, { minLength: 21, maxLength: 21 }).map(makeGame);
