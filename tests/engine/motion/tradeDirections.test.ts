import { describe, expect, it } from 'vitest';
import { missRoom, prepareShot, rankArsenal, simulateShot, solvePocketLine } from '../../../engine/index';
import type { BallSpec, BowlerProfile, OilPattern } from '../../../engine/types';
import { flatPattern, housePattern, mirroredPattern } from './fixtures';

// The ball-motion model against the directions the trade agrees on, each with its size in the trade's bands.
// Sources: common practice unless named; "from memory" marks a value recalled but not verified. Every ball and
// pattern is invented. The line is fixed (laid down on board 20, over board 11 at the arrows) unless a check is
// about the line itself.

/** A benchmark reactive hybrid, 3000 grit. */
const ball = (o: Partial<BallSpec> = {}): BallSpec => ({
  weightLb: 15,
  rg: 2.52,
  differential: 0.045,
  intermediateDifferential: 0,
  coverType: 'reactive-hybrid',
  surfaceGrit: 3000,
  polished: false,
  layout: { pinToPapIn: 4.5, drillingAngleDeg: 45 },
  ...o,
});
/** A right-hander in the middle of the usual ranges (16–21 mph, 250–400 rpm, 30–60° rotation, 10–20° tilt). */
const bowler = (o: Partial<BowlerProfile> = {}): BowlerProfile => ({
  hand: 'right',
  speedMph: 17,
  revRpm: 350,
  axisRotationDeg: 45,
  axisTiltDeg: 15,
  ...o,
});
const house = housePattern();
/** The same pattern, oil per foot unchanged, `d` ft longer (every sweep's end moves out, its oil with it). */
const longer = (p: OilPattern, d: number): OilPattern => ({
  name: `${p.name} +${d}`,
  sweeps: p.sweeps.map((s) => {
    const k = (s.endFt + d) / s.endFt;
    return { ...s, endFt: s.endFt + d, microlitersPerBoard: s.microlitersPerBoard * k };
  }),
});

function shot(
  o: { ball?: Partial<BallSpec>; bowler?: Partial<BowlerProfile>; pattern?: OilPattern; games?: number; line?: [number, number] } = {},
) {
  const [laydownBoard, targetBoard] = o.line ?? [20, 11];
  const p = simulateShot({
    ball: ball(o.ball),
    bowler: bowler(o.bowler),
    pattern: o.pattern ?? house,
    laydownBoard,
    targetBoard,
    gamesBowled: o.games ?? 0,
  });
  expect(p.gutter).toBe(false);
  return { ...p, hook: p.entryBoard - p.breakpoint.board };
}
const rising = (xs: number[]) => {
  for (let i = 1; i < xs.length; i++) expect(xs[i]).toBeGreaterThan(xs[i - 1]);
};
const falling = (xs: number[]) => {
  for (let i = 1; i < xs.length; i++) expect(xs[i]).toBeLessThan(xs[i - 1]);
};

describe('surface and cover (common practice: the cover and its surface are the main lever — USBC Ball Motion Study 2008 ranked cover surface first)', () => {
  it('grit 500 → 1000 → 2000 → 3000 → 4000 → 4000 polished: the skid ends later and the breakpoint moves later', () => {
    const r = [
      [500, false],
      [1000, false],
      [2000, false],
      [3000, false],
      [4000, false],
      [4000, true],
    ].map(([g, p]) => shot({ ball: { surfaceGrit: g as number, polished: p as boolean } }));
    rising(r.map((x) => x.skidFt));
    rising(r.map((x) => x.breakpoint.ft));
  });

  it('ft, a strong solid 2000 → 4000 grit on the house shot: the breakpoint moves 1.5–6 ft later (trade-sized: "a few feet of length")', () => {
    const at = (g: number) =>
      shot({ ball: { coverType: 'reactive-solid', surfaceGrit: g, rg: 2.49, differential: 0.052, intermediateDifferential: 0.018 } });
    const d = at(4000).breakpoint.ft - at(2000).breakpoint.ft;
    expect(d).toBeGreaterThanOrEqual(1.5);
    expect(d).toBeLessThanOrEqual(6);
  });

  it('pearl against solid on the same core and surface: the pearl skids longer and breaks later; a polished pearl later still', () => {
    const solid = shot({ ball: { coverType: 'reactive-solid' } });
    const pearl = shot({ ball: { coverType: 'reactive-pearl' } });
    const polished = shot({ ball: { coverType: 'reactive-pearl', polished: true } });
    expect(pearl.skidFt).toBeGreaterThan(solid.skidFt);
    expect(pearl.breakpoint.ft).toBeGreaterThan(solid.breakpoint.ft);
    expect(polished.breakpoint.ft).toBeGreaterThan(pearl.breakpoint.ft);
  });

  it('urethane reads early and smoothly with little back end: its skid ends before the reactive covers’, and it hooks less from its breakpoint to the pins', () => {
    const ure = shot({ ball: { coverType: 'urethane' } });
    for (const c of ['reactive-pearl', 'reactive-hybrid', 'reactive-solid'] as const) {
      const r = shot({ ball: { coverType: c } });
      expect(ure.skidFt).toBeLessThan(r.skidFt);
      expect(ure.hook).toBeLessThan(r.hook);
    }
  });

  it('a cover that has soaked up oil over 60 games since its resurface reads later than the same cover fresh', () => {
    expect(shot({ ball: { gamesSinceResurface: 60 } }).breakpoint.ft).toBeGreaterThan(shot().breakpoint.ft);
  });
});

describe('core and layout', () => {
  it('RG 2.46 → 2.60 → 2.70 in: the ball starts to roll later (a lower RG revs up earlier; textbook sliding sphere: a lower RG spins up faster)', () => {
    rising([2.46, 2.6, 2.7].map((rg) => shot({ ball: { rg } }).rollStartFt as number));
  });

  it('differential 0.015 → 0.030 → 0.058 in: more flare and more hook; flare 1–4 in at 0.015 and 4–9 in at 0.058 (rigid-body mechanics; high-flare balls show several inches of rings, from memory)', () => {
    const r = [0.015, 0.03, 0.058].map((differential) => shot({ ball: { differential } }));
    rising(r.map((x) => x.flareIn));
    rising(r.map((x) => x.entryBoard));
    expect(r[0].flareIn).toBeGreaterThanOrEqual(1);
    expect(r[0].flareIn).toBeLessThanOrEqual(4);
    expect(r[2].flareIn).toBeGreaterThanOrEqual(4);
    expect(r[2].flareIn).toBeLessThanOrEqual(9);
  });

  it('an asymmetric core (intermediate differential 0 → 0.016 in) flares a little more and hooks a little more', () => {
    const [sym, asym] = [0, 0.016].map((intermediateDifferential) => shot({ ball: { intermediateDifferential } }));
    expect(asym.flareIn).toBeGreaterThan(sym.flareIn);
    expect(asym.entryBoard).toBeGreaterThan(sym.entryBoard);
  });

  it('pin-to-PAP: the flare is largest near 45° from the PAP (3 3/8 in on a maximum-diameter ball): more than with the pin 1 in or 6 1/2 in away, and so is the hook (rigid-body mechanics: ½ ΔI ω sin 2θ)', () => {
    const at = (pinToPapIn: number) => shot({ ball: { layout: { pinToPapIn } } });
    const best = at(3.375);
    for (const other of [at(1), at(6.5)]) {
      expect(best.flareIn).toBeGreaterThan(other.flareIn + 1);
      expect(best.entryBoard).toBeGreaterThan(other.entryBoard);
    }
  });
});

describe('the pattern (common practice)', () => {
  it('oil volume ×1 → ×1.25 → ×1.5: the breakpoint moves later and the ball hooks less', () => {
    const r = [1, 1.25, 1.5].map((k) => shot({ pattern: housePattern(k) }));
    rising(r.map((x) => x.breakpoint.ft));
    falling(r.map((x) => x.entryBoard));
  });

  it('a longer pattern (36 → 40 → 44 → 48 ft, the same oil per foot), on a line that stays in the oil (22 → 12): the breakpoint moves later and the ball hooks less', () => {
    const r = [-4, 0, 4, 8].map((d) => shot({ pattern: longer(house, d), line: [22, 12] }));
    rising(r.map((x) => x.breakpoint.ft));
    falling(r.map((x) => x.entryBoard));
  });

  it('miss room: the same ball has clearly more room on the high-ratio house shot than on a flat pattern (a miss outside finds friction and comes back, a miss inside is held by the oil)', () => {
    const room = (pattern: OilPattern) => {
      const s = prepareShot({ ball: ball(), bowler: bowler(), pattern });
      const line = solvePocketLine(s.run, {});
      expect(line.reached).toBe(true);
      return missRoom(s.run, line.laydownBoard, line.targetBoard, line.result).totalBoards;
    };
    const onHouse = room(house),
      onFlat = room(flatPattern());
    expect(onHouse).toBeGreaterThanOrEqual(1.5 * onFlat);
    expect(onFlat).toBeGreaterThan(0.5);
  });
});

describe('the bowler (common practice)', () => {
  it('speed 15 → 16.5 → 18 → 19.5 mph: the breakpoint moves later and the ball hooks less', () => {
    const r = [15, 16.5, 18, 19.5].map((speedMph) => shot({ bowler: { speedMph } }));
    rising(r.map((x) => x.breakpoint.ft));
    falling(r.map((x) => x.entryBoard));
  });

  it('rev rate 250 → 350 → 450 rpm: more hook and a steeper entry', () => {
    const r = [250, 350, 450].map((revRpm) => shot({ bowler: { revRpm } }));
    rising(r.map((x) => x.hook));
    rising(r.map((x) => x.entryAngleDeg));
  });

  it('axis rotation 30 → 45 → 60°: a longer skid and more hook at the back', () => {
    const r = [30, 45, 60].map((axisRotationDeg) => shot({ bowler: { axisRotationDeg } }));
    rising(r.map((x) => x.skidFt));
    rising(r.map((x) => x.hook));
  });

  it('axis tilt 5 → 15 → 25°: less hook', () => {
    falling([5, 15, 25].map((axisTiltDeg) => shot({ bowler: { axisTiltDeg } }).hook));
  });

  it('a left-hander on the mirrored pattern throws the same shot, board for board from their own gutter (mirror symmetry)', () => {
    const r = shot();
    const l = simulateShot({
      ball: ball(),
      bowler: bowler({ hand: 'left' }),
      pattern: mirroredPattern(house),
      laydownBoard: 20,
      targetBoard: 11,
    });
    expect(l.entryBoard).toBeCloseTo(r.entryBoard, 9);
    expect(l.breakpoint.ft).toBeCloseTo(r.breakpoint.ft, 9);
  });
});

describe('transition (common practice: the track dries, the line moves deeper)', () => {
  it('0 → 3 → 6 → 9 games on the house shot: on the same line the breakpoint comes earlier and the ball hooks more', () => {
    const r = [0, 3, 6, 9].map((games) => shot({ games }));
    falling(r.map((x) => x.breakpoint.ft));
    rising(r.map((x) => x.entryBoard));
  });

  it('boards: after 9 games the model plays the same ball from deeper (a higher laydown board for a right-hander) than on the fresh pattern', () => {
    const line = (gamesBowled: number) =>
      rankArsenal({ balls: [{ ...ball(), id: 'b' }], bowler: bowler(), pattern: house, gamesBowled })[0].prediction;
    expect(line(9).laydownBoard).toBeGreaterThan(line(0).laydownBoard);
  });
});

describe('the line a weak release plays (common practice: a ball that will not come back is played straighter up the boards, not thrown across the lane)', () => {
  const speedDominant = bowler({ speedMph: 18.5, revRpm: 260, axisRotationDeg: 35, axisTiltDeg: 18 });
  it.each([['right'], ['left']] as const)(
    'a %s-handed speed-dominant, low-rev bowler (18.5 mph, 260 rpm, 35° rotation, 18° tilt) on the house shot: a launch of at most 2° (6 boards) from no deeper than board 20, entry at least 2°',
    (hand) => {
      const p = rankArsenal({
        balls: [{ ...ball(), id: 'b' }],
        bowler: { ...speedDominant, hand },
        pattern: hand === 'left' ? mirroredPattern(house) : house,
      })[0].prediction;
      expect(p.laydownBoard - p.targetBoard).toBeLessThanOrEqual(6);
      expect(p.laydownBoard).toBeLessThanOrEqual(20);
      expect(p.targetBoard).toBeGreaterThanOrEqual(4);
      expect(p.entryAngleDeg).toBeGreaterThanOrEqual(2);
    },
  );
});

describe('the sizes of the reported numbers, on the pocket line (common practice)', () => {
  const cases: [string, BowlerProfile][] = [
    ['a typical right-hander (17 mph, 350 rpm)', bowler()],
    ['a tweener (16.5 mph, 375 rpm)', bowler({ speedMph: 16.5, revRpm: 375 })],
    ['a stroker (18 mph, 290 rpm)', bowler({ speedMph: 18, revRpm: 290, axisRotationDeg: 40 })],
  ];
  it.each(cases)(
    '%s on the house shot: entry 3–7° (about 6° carries best, USBC pin-carry research second-hand), skid ends before the breakpoint and rolling after it, breakpoint 30–48 ft on boards 2–14, line between boards 8 and 35',
    (_n, b) => {
      const p = rankArsenal({ balls: [{ ...ball(), id: 'b' }], bowler: b, pattern: house })[0].prediction;
      expect(p.entryAngleDeg).toBeGreaterThanOrEqual(3);
      expect(p.entryAngleDeg).toBeLessThanOrEqual(7);
      expect(p.skidFt).toBeLessThan(p.breakpoint.ft);
      expect(p.rollStartFt ?? 60).toBeGreaterThan(p.breakpoint.ft);
      expect(p.skidFt).toBeGreaterThanOrEqual(12);
      expect(p.breakpoint.ft).toBeGreaterThanOrEqual(30);
      expect(p.breakpoint.ft).toBeLessThanOrEqual(48);
      expect(p.breakpoint.board).toBeGreaterThanOrEqual(2);
      expect(p.breakpoint.board).toBeLessThanOrEqual(14);
      expect(p.laydownBoard).toBeGreaterThanOrEqual(8);
      expect(p.laydownBoard).toBeLessThanOrEqual(35);
      expect(p.targetBoard).toBeGreaterThanOrEqual(4);
    },
  );
});
