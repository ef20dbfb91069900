import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { buildGame, checkDelivery, isSplit, scoreGame, scorePartialGame, type LoggedDelivery } from '../../../engine/index';
import { gameArb } from './gameGen';

// Check values: scoring per the USBC and World Bowling playing rules (status P),
// splits per the USBC playing rules on splits (isSplit), fouls per the USBC playing rules on fouls (S: "delivery counts; no pins credited",
// "foul on first ball: pins respotted; all ten on the second ball = spare", "foul on second ball:
// only the first-ball pins count", "both balls fouled: frame scores 0").

const d = (frame: number, delivery: number, standing: number[], foul?: boolean): LoggedDelivery =>
  foul ? { frame, delivery, standing, foul } : { frame, delivery, standing };
const X = (frame: number, delivery = 1): LoggedDelivery => d(frame, delivery, []);

/**
 * The World Bowling worked score sheet of the USBC and World Bowling playing rules (P): X X X 7 2 (8)/ F9 X 7/ 9- X X 8 →
 * 30 57 76 85 95 104 124 143 152 180. The circled 8 is a split (we leave the 3-10 baby split,
 * the USBC playing rules on splits common split names) converted; F9 is a foul then 9 at the re-spotted rack.
 */
const wbSheet: LoggedDelivery[] = [
  X(1),
  X(2),
  X(3),
  d(4, 1, [4, 7, 8]),
  d(4, 2, [8]),
  d(5, 1, [3, 10]),
  d(5, 2, []),
  d(6, 1, [1, 2, 3, 4, 5, 6], true),
  d(6, 2, [10]),
  X(7),
  d(8, 1, [2, 4, 7]),
  d(8, 2, []),
  d(9, 1, [10]),
  d(9, 2, [10]),
  X(10, 1),
  X(10, 2),
  d(10, 3, [6, 10]),
];

describe('buildGame: worked examples', () => {
  it('the World Bowling worked sheet gives 30 57 76 85 95 104 124 143 152 180 with its marks', () => {
    const g = buildGame(wbSheet);
    expect(g.frames.map((f) => f.runningTotal)).toEqual([30, 57, 76, 85, 95, 104, 124, 143, 152, 180]);
    expect(g.total).toBe(180);
    expect(g.complete).toBe(true);
    expect(g.next).toBeNull();
    expect(g.rolls).toEqual([10, 10, 10, 7, 2, 8, 2, 0, 9, 10, 7, 3, 9, 0, 10, 10, 8]);
    const symbols = g.frames.map((f) => f.deliveries.map((v) => v.symbol).join(''));
    expect(symbols).toEqual(['X', 'X', 'X', '72', '8/', 'F9', 'X', '7/', '9-', 'XX8']);
    // the 3-10 after the first ball of frame 5 is a split (the USBC playing rules on splits "baby split"); nothing else is
    expect(g.frames.flatMap((f) => f.deliveries.filter((v) => v.split).map((v) => `${v.frame}.${v.delivery}`))).toEqual(['5.1']);
    // the foul re-spots the rack: the second ball of frame 6 has all ten pins before it
    expect(g.frames[5].deliveries[0]).toMatchObject({ pins: 0, foul: true, standing: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10] });
    expect(g.frames[5].deliveries[1].pinsBefore).toHaveLength(10);
    expect(g.frames.every((f) => f.complete)).toBe(true);
  });

  it('twelve strikes are 300 (the USBC and World Bowling playing rules maximum game) and the tenth frame rack is re-set after each strike', () => {
    const g = buildGame([...Array.from({ length: 9 }, (_, i) => X(i + 1)), X(10, 1), X(10, 2), X(10, 3)]);
    expect(g.total).toBe(300);
    expect(g.frames[9].deliveries.map((v) => v.symbol)).toEqual(['X', 'X', 'X']);
    expect(g.frames[9].deliveries.map((v) => v.pinsBefore.length)).toEqual([10, 10, 10]);
  });

  it('a foul on the first ball then all ten is a spare; two fouls score 0 (the USBC playing rules on fouls)', () => {
    const g = buildGame([d(1, 1, [], true), d(1, 2, []), d(2, 1, [5], true), d(2, 2, [3], true), d(3, 1, [1, 2])]);
    expect(g.frames[0].deliveries.map((v) => v.symbol)).toEqual(['F', '/']);
    expect(g.frames[0].runningTotal).toBe(10); // 10 + the next delivery (0, a foul)
    expect(g.frames[1].deliveries.map((v) => v.symbol)).toEqual(['F', 'F']);
    expect(g.frames[1].runningTotal).toBe(10);
    expect(g.next).toEqual({ frame: 3, delivery: 2, pinsBefore: [1, 2] });
  });

  it('a foul on the second ball keeps only the first ball pins (the USBC playing rules on fouls)', () => {
    const g = buildGame([d(1, 1, [7, 10]), d(1, 2, [], true)]);
    expect(g.frames[0].deliveries[1]).toMatchObject({ symbol: 'F', pins: 0, standing: [7, 10] });
    expect(g.frames[0].runningTotal).toBe(8);
    expect(g.frames[0].deliveries[0].split).toBe(true); // 7-10 (the USBC playing rules on splits)
  });

  it('a game in progress: a strike waiting for its bonus has no total yet; next is the expected delivery', () => {
    const g = buildGame([X(1), d(2, 1, [1, 2, 4])]);
    expect(g.frames[0].runningTotal).toBeNull();
    expect(g.frames[0].complete).toBe(true);
    expect(g.frames[1].complete).toBe(false);
    expect(g.next).toEqual({ frame: 2, delivery: 2, pinsBefore: [1, 2, 4] });
    expect(g.total).toBe(0);
    expect(buildGame([]).next).toEqual({ frame: 1, delivery: 1, pinsBefore: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10] });
    expect(buildGame([]).frames).toHaveLength(10);
  });

  it("the tenth frame: after a strike and a count the third ball is at the second ball's leave", () => {
    const prior = [
      ...Array.from({ length: 9 }, (_, i) => d(i + 1, 1, [1, 2, 3, 4, 5, 6, 7, 8, 9, 10])).flatMap((x) => [
        x,
        d(x.frame, 2, [1, 2, 3, 4, 5, 6, 7, 8, 9, 10]),
      ]),
      X(10, 1),
      d(10, 2, [3, 6, 10]),
    ];
    const g = buildGame(prior);
    expect(g.next).toEqual({ frame: 10, delivery: 3, pinsBefore: [3, 6, 10] });
    const done = buildGame([...prior, d(10, 3, [])]);
    expect(done.frames[9].deliveries.map((v) => v.symbol)).toEqual(['X', '7', '/']);
    expect(done.total).toBe(20);
  });
});

describe('buildGame and checkDelivery: impossible deliveries are refused with a reason', () => {
  const cases: [string, LoggedDelivery[], LoggedDelivery, string, string][] = [
    [
      'a pin already down',
      [d(1, 1, [7, 10])],
      d(1, 2, [4, 7]),
      'standing',
      'pin 4 was already down before this delivery; only 7-10 were standing',
    ],
    [
      'more pins standing than before',
      [d(1, 1, [10])],
      d(1, 2, [6, 10]),
      'standing',
      'pin 6 was already down before this delivery; only 10 was standing',
    ],
    ['frame 3 delivery 3', [X(1), X(2)], d(3, 3, []), 'delivery', 'frame 3 has no delivery 3; frames 1 to 9 have at most 2'],
    ['frame 11', [], d(11, 1, []), 'frame', 'frame 11 cannot exist; a game has frames 1 to 10'],
    ['frame 0', [], d(0, 1, []), 'frame', 'frame 0 cannot exist; a game has frames 1 to 10'],
    [
      'delivery 2 after a strike',
      [X(1), X(2), X(3)],
      d(3, 2, []),
      'delivery',
      'frame 3 has no delivery 2: its first delivery was a strike; the next delivery is frame 4, delivery 1',
    ],
    ['a skipped frame', [X(1), X(2), X(3)], d(6, 1, []), 'frame', 'the next delivery is frame 4, delivery 1'],
    [
      'a repeated delivery',
      [d(1, 1, [5])],
      d(1, 1, [5]),
      'delivery',
      'frame 1, delivery 1 is already logged; the next delivery is frame 1, delivery 2',
    ],
    ['pin 11', [], d(1, 1, [11]), 'standing', 'pin 11 does not exist; pins are numbered 1 to 10'],
    ['a pin twice', [], d(1, 1, [4, 4]), 'standing', 'pin 4 is listed twice'],
  ];
  it.each(cases)('%s', (_, prior, next, field, reason) => {
    expect(checkDelivery(prior, next)).toEqual({ ok: false, field, reason });
    expect(() => buildGame([...prior, next])).toThrow(
      new RangeError(`buildGame: delivery ${prior.length + 1} (frame ${next.frame}, delivery ${next.delivery}): ${reason}`),
    );
  });

  it('after the game is complete every delivery is refused; an open tenth frame has no third delivery', () => {
    expect(checkDelivery(wbSheet, X(10, 3))).toEqual({ ok: false, field: 'frame', reason: 'the game is already complete' });
    const open = Array.from({ length: 10 }, (_, i) => [d(i + 1, 1, [10]), d(i + 1, 2, [10])]).flat();
    expect(checkDelivery(open, d(10, 3, []))).toEqual({
      ok: false,
      field: 'delivery',
      reason: 'frame 10 has no delivery 3: its first two deliveries made neither a strike nor a spare, so the game is already complete',
    });
    expect(buildGame(open).total).toBe(90);
  });

  it('the tenth frame rack is not re-set after a count: the reason says so', () => {
    const nine = Array.from({ length: 9 }, (_, i) => X(i + 1));
    const r = checkDelivery([...nine, X(10, 1), d(10, 2, [7])], d(10, 3, [7, 10]));
    expect(r).toEqual({
      ok: false,
      field: 'standing',
      reason:
        'pin 10 was already down before this delivery; only 7 was standing (in the tenth frame the rack is re-set only after a strike or a spare)',
    });
  });

  it('wrong types are TypeErrors naming the function; an impossible prior a RangeError', () => {
    expect(() => buildGame('X' as unknown as LoggedDelivery[])).toThrow(new TypeError('buildGame: deliveries must be an array, got "X"'));
    expect(() => buildGame([{ frame: '1', delivery: 1, standing: [] } as unknown as LoggedDelivery])).toThrow(TypeError);
    expect(() => checkDelivery([], { frame: 1, delivery: 1, standing: 'none' } as unknown as LoggedDelivery)).toThrow(
      /^checkDelivery: next.standing must be an array/,
    );
    expect(() => checkDelivery([], { frame: 1, delivery: 1, standing: [], foul: 'yes' } as unknown as LoggedDelivery)).toThrow(TypeError);
    expect(() => checkDelivery([d(1, 2, [])], X(2))).toThrow(
      new RangeError('checkDelivery: prior delivery 1 (frame 1, delivery 2): the next delivery is frame 1, delivery 1'),
    );
  });

  it('accepts a possible delivery with its view', () => {
    expect(checkDelivery([d(1, 1, [7, 10])], d(1, 2, [10]))).toEqual({
      ok: true,
      view: { frame: 1, delivery: 2, pinsBefore: [7, 10], standing: [10], pins: 1, foul: false, symbol: '1', split: false, rackBall: 2 },
    });
  });
});

describe('buildGame: property tests against scoreGame / scorePartialGame (fast-check)', () => {
  it('complete generated games score exactly scoreGame; every prefix scores scorePartialGame', () => {
    fc.assert(
      fc.property(gameArb, (g) => {
        const view = buildGame(g.deliveries);
        expect(view.rolls).toEqual(g.rolls);
        const s = scoreGame(g.rolls);
        expect(view.complete).toBe(true);
        expect(view.total).toBe(s.total);
        expect(view.frames.map((f) => f.runningTotal)).toEqual(s.frames);
        for (let k = 0; k < g.deliveries.length; k++) {
          const part = buildGame(g.deliveries.slice(0, k));
          const p = scorePartialGame(g.rolls.slice(0, k));
          expect(part.frames.map((f) => f.runningTotal)).toEqual(p.frames);
          expect(part.total).toBe(p.total);
          expect(part.next?.frame).toBe(p.nextFrame);
          expect(part.next?.pinsBefore.length).toBe(p.pinsStanding);
          expect(part.next?.pinsBefore).toEqual(g.before[k]);
          expect(part.next?.frame).toBe(g.deliveries[k].frame);
          expect(part.next?.delivery).toBe(g.deliveries[k].delivery);
        }
      }),
      { numRuns: 300 },
    );
  }, 60_000);

  it('checkDelivery accepts each next delivery with the view buildGame shows; symbols and splits follow the rules', () => {
    fc.assert(
      fc.property(gameArb, (g) => {
        const view = buildGame(g.deliveries);
        const all = view.frames.flatMap((f) => f.deliveries);
        g.deliveries.forEach((next, k) => {
          const r = checkDelivery(g.deliveries.slice(0, k), next);
          expect(r).toEqual({ ok: true, view: all[k] });
          const v = all[k];
          const fullRackFirstBall =
            v.pinsBefore.length === 10 &&
            (k === 0 || all[k - 1].frame !== v.frame || all[k - 1].symbol === 'X' || all[k - 1].symbol === '/');
          expect(v.rackBall).toBe(fullRackFirstBall ? 1 : 2);
          if (v.foul) expect(v.symbol).toBe('F');
          else if (v.pins === v.pinsBefore.length) expect(v.symbol).toBe(fullRackFirstBall ? 'X' : '/');
          else expect(v.symbol).toBe(v.pins === 0 ? '-' : String(v.pins));
          expect(v.split).toBe(!v.foul && fullRackFirstBall && isSplit(v.standing));
        });
        expect(checkDelivery(g.deliveries, g.deliveries[g.deliveries.length - 1])).toEqual({
          ok: false,
          field: 'frame',
          reason: 'the game is already complete',
        });
      }),
      { numRuns: 200 },
    );
  }, 60_000);

  it('any frame/delivery other than the next expected one is refused on frame or delivery, never accepted', () => {
    fc.assert(
      fc.property(gameArb, fc.nat(), fc.integer({ min: -1, max: 12 }), fc.integer({ min: 0, max: 4 }), (g, cut, frame, delivery) => {
        const k = cut % (g.deliveries.length + 1);
        const prior = g.deliveries.slice(0, k);
        const expected = buildGame(prior).next;
        fc.pre(expected === null || frame !== expected.frame || delivery !== expected.delivery);
        const r = checkDelivery(prior, { frame, delivery, standing: [] });
        expect(r.ok).toBe(false);
        if (!r.ok) {
          expect(['frame', 'delivery']).toContain(r.field);
          expect(r.reason.length).toBeGreaterThan(10);
        }
      }),
      { numRuns: 300 },
    );
  }, 60_000);

  it('a delivery that lists a pin already down is refused at that delivery', () => {
    fc.assert(
      fc.property(gameArb, fc.nat(), (g, pick) => {
        const candidates = g.deliveries.map((_, k) => k).filter((k) => g.before[k].length < 10);
        fc.pre(candidates.length > 0);
        const k = candidates[pick % candidates.length];
        const down = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10].find((p) => !g.before[k].includes(p)) as number;
        const bad = { ...g.deliveries[k], standing: [...g.deliveries[k].standing, down] };
        const r = checkDelivery(g.deliveries.slice(0, k), bad);
        expect(r.ok).toBe(false);
        if (!r.ok) {
          expect(r.field).toBe('standing');
          expect(r.reason).toMatch(new RegExp(`^pin ${down} was already down before this delivery`));
        }
      }),
      { numRuns: 200 },
    );
  }, 60_000);
});
