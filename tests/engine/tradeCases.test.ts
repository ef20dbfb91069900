import { describe, expect, it } from 'vitest';
import { analyzePattern, rankArsenal } from '../../engine/index';
import type { ArsenalBall, BowlerProfile, OilPattern, Sweep } from '../../engine/index';

// Trade cases for the whole matchup (rankArsenal): what a pro-shop operator, a coach and the physics each
// expect, in direction and in size. Every ball and pattern here is invented; the expectations are facts of
// the trade, named beside each check ("common practice" where no single publication states them).

const s = (
  fromBoard: number,
  toBoard: number,
  endFt: number,
  crossings: number,
  ul: number,
  direction: Sweep['direction'] = 'forward',
): Sweep => ({ direction, fromBoard, toBoard, startFt: 0, endFt, crossings, microlitersPerBoard: ul });

/** A fresh house shot: about 40 ft, medium volume, a high ratio with friction outside (invented pattern). */
const house: OilPattern = {
  name: 'Harrow Bay house',
  sweeps: [s(2, 38, 40, 2, 65), s(8, 32, 38, 4, 65), s(13, 27, 36, 6, 65), s(16, 24, 32, 6, 65, 'reverse')],
};
/** The same house shot with 30 % more oil on every board: heavier volume, same length and ratio. */
const heavierHouse: OilPattern = {
  name: 'Harrow Bay house, heavier',
  sweeps: house.sweeps.map((w) => ({ ...w, microlitersPerBoard: w.microlitersPerBoard * 1.3 })),
};
/** A long, heavy pattern (invented). */
const longHeavy: OilPattern = {
  name: 'Harrow Bay long',
  sweeps: [
    s(2, 38, 47, 2, 60),
    s(6, 34, 44, 4, 60),
    s(10, 30, 42, 4, 60),
    s(15, 25, 40, 4, 60),
    s(2, 38, 36, 2, 60, 'reverse'),
    s(12, 28, 34, 4, 60, 'reverse'),
  ],
};
/** A short, light pattern (invented). */
const shortLight: OilPattern = {
  name: 'Harrow Bay short',
  sweeps: [s(3, 37, 34, 2, 60), s(10, 30, 32, 4, 60), s(14, 26, 30, 4, 60), s(16, 24, 28, 4, 60, 'reverse')],
};
/** A flat sport pattern: as much oil outside as in the middle (invented). */
const flatSport: OilPattern = {
  name: 'Harrow Bay flat',
  sweeps: [s(2, 38, 41, 4, 66), s(5, 35, 39, 2, 66), s(12, 28, 37, 2, 66), s(2, 38, 33, 2, 66, 'reverse')],
};

/** The bowler of the trade case: right-handed, about 16.5 mph and 375 rpm. */
const caseBowler: BowlerProfile = { hand: 'right', speedMph: 16.5, revRpm: 375, axisRotationDeg: 45, axisTiltDeg: 15 };
/** A bowler in the middle of the usual ranges (common practice: 16–21 mph, 250–400 rpm). */
const typical: BowlerProfile = { hand: 'right', speedMph: 17, revRpm: 350, axisRotationDeg: 45, axisTiltDeg: 15 };

/** The trade case's ball: a strong asymmetric reactive solid, 15 lb, RG 2.49, differential 0.052, intermediate 0.018, layout: drilling angle 45°, pin 4 3/8 in from the PAP, VAL angle 65°. */
const strongSolid = (surfaceGrit: number, polished = false, id = `solid-${surfaceGrit}${polished ? '-polished' : ''}`): ArsenalBall => ({
  id,
  weightLb: 15,
  rg: 2.49,
  differential: 0.052,
  intermediateDifferential: 0.018,
  coverType: 'reactive-solid',
  surfaceGrit,
  polished,
  layout: { pinToPapIn: 4.375, drillingAngleDeg: 45, valAngleDeg: 65 },
});
const pearl: ArsenalBall = {
  id: 'pearl',
  weightLb: 15,
  rg: 2.54,
  differential: 0.045,
  intermediateDifferential: 0.008,
  coverType: 'reactive-pearl',
  surfaceGrit: 4000,
  polished: true,
  layout: { pinToPapIn: 4.5 },
};
const urethane: ArsenalBall = {
  id: 'urethane',
  weightLb: 15,
  rg: 2.62,
  differential: 0.022,
  intermediateDifferential: 0,
  coverType: 'urethane',
  surfaceGrit: 2000,
  polished: false,
  layout: { pinToPapIn: 4.5 },
};
const plastic: ArsenalBall = {
  id: 'plastic',
  weightLb: 14,
  rg: 2.68,
  differential: 0.008,
  intermediateDifferential: 0,
  coverType: 'plastic',
  surfaceGrit: 4000,
  polished: true,
};

const rank = (
  balls: ArsenalBall[],
  pattern: OilPattern,
  bowler: BowlerProfile = caseBowler,
  extra: { gamesBowled?: number; lane?: { kind: 'wood' | 'synthetic'; friction: 'low' | 'medium' | 'high' } } = {},
) => rankArsenal({ balls, bowler, pattern, ...extra });
const byId = (r: ReturnType<typeof rank>, id: string) => {
  const e = r.find((x) => x.id === id);
  expect(e, `ball ${id} ranked`).toBeDefined();
  return e!;
};
const order = (r: ReturnType<typeof rank>) => r.map((x) => x.id);
const surfaceSuggestion = (e: ReturnType<typeof rank>[number]) => e.suggestions.find((x) => x.kind === 'surface');
/** Smoothness order of the pro shop's finishes: higher grit is smoother; polish over a grit is smoother still. */
const smoothness = (grit: number, polished: boolean) => Math.log2(grit) + (polished ? 1 : 0);

describe('the trade case: a strong asymmetric solid on a fresh house shot (common practice)', () => {
  it('the patterns are what their names say (length, volume, ratio)', () => {
    const h = analyzePattern(house);
    expect(h.lengthFt).toBe(40);
    expect(h.volumeMl).toBeGreaterThan(18);
    expect(h.volumeMl).toBeLessThan(24);
    expect(h.ratioClass).toBe('recreation');
    expect(analyzePattern(heavierHouse).volumeMl).toBeGreaterThan(h.volumeMl * 1.25);
    expect(analyzePattern(flatSport).ratio).toBeLessThanOrEqual(3); // USBC sport limit 3:1
  });

  it('house shot: the 4000-grit finish ranks clearly above the 2000-grit one (at least 5 points)', () => {
    const r = rank([strongSolid(2000), strongSolid(4000)], house);
    expect(order(r)).toEqual(['solid-4000', 'solid-2000']);
    expect(byId(r, 'solid-4000').score - byId(r, 'solid-2000').score).toBeGreaterThanOrEqual(5);
  });

  it('house shot: the 2000 is too strong and told to go smoother (a higher grit or polish), by the amount needed', () => {
    const e = byId(rank([strongSolid(2000)], house), 'solid-2000');
    expect(e.fit?.verdict).toBe('too-strong');
    const sug = surfaceSuggestion(e);
    expect(sug, 'a surface suggestion').toBeDefined();
    const to = sug!.change as { surfaceGrit: number; polished: boolean };
    expect(smoothness(to.surfaceGrit, to.polished)).toBeGreaterThan(smoothness(2000, false));
    expect(sug!.text).toMatch(/smoother/i);
    expect(sug!.text).toMatch(/between sessions/i); // no abrasives during competition (USBC dry-towel rule)
  });

  it('house shot: the 4000 suits and is not told to sand, nor is a ball just resurfaced to 4000 told to undo it', () => {
    const fresh = byId(rank([{ ...strongSolid(4000), gamesSinceResurface: 0 }], house), 'solid-4000');
    expect(fresh.fit?.verdict).toBe('suits');
    const sug = surfaceSuggestion(fresh);
    if (sug) {
      const to = sug.change as { surfaceGrit: number; polished: boolean };
      expect(smoothness(to.surfaceGrit, to.polished)).toBeGreaterThan(smoothness(4000, false));
    }
    expect(fresh.suggestions.some((x) => x.kind === 'surface' && (x.change as { surfaceGrit: number }).surfaceGrit < 4000)).toBe(false);
  });

  it('house shot: the 2000 reads the lane earlier — the model needs a wider launch from deeper inside to reach the pocket, and the entry angle is lower', () => {
    const r = rank([strongSolid(2000), strongSolid(4000)], house);
    const a = byId(r, 'solid-2000').prediction,
      b = byId(r, 'solid-4000').prediction;
    expect(a.laydownBoard - a.targetBoard).toBeGreaterThan(b.laydownBoard - b.targetBoard);
    expect(a.entryAngleDeg).toBeLessThan(b.entryAngleDeg);
  });

  it('a heavier-volume house shot: the 2000 finish is the right one and ranks above the 4000', () => {
    const r = rank([strongSolid(2000), strongSolid(4000)], heavierHouse);
    expect(order(r)).toEqual(['solid-2000', 'solid-4000']);
    expect(byId(r, 'solid-2000').fit?.verdict).toBe('suits');
    expect(byId(r, 'solid-4000').fit?.verdict).toBe('too-weak');
    const sug = surfaceSuggestion(byId(r, 'solid-4000'));
    expect(sug).toBeDefined();
    expect((sug!.change as { surfaceGrit: number }).surfaceGrit).toBeLessThan(4000);
  });

  it('a long heavy pattern: the roughest fits best, and for a bowler whose gaps a surface can close (450 rpm) each finish is told to sand only as far as its gap needs', () => {
    expect(order(rank([strongSolid(1000), strongSolid(2000), strongSolid(4000)], longHeavy))).toEqual([
      'solid-1000',
      'solid-2000',
      'solid-4000',
    ]);
    const r = rank([strongSolid(1000), strongSolid(2000), strongSolid(4000)], longHeavy, { ...caseBowler, revRpm: 450 });
    expect(order(r)).toEqual(['solid-1000', 'solid-2000', 'solid-4000']);
    const targets = r.map((e) => (surfaceSuggestion(e)?.change as { surfaceGrit?: number } | undefined)?.surfaceGrit ?? e.id);
    // the suggestions are not all one fixed grit: each finish closes its own gap
    expect(new Set(targets).size).toBeGreaterThan(1);
  });
});

describe('cover and surface order across conditions (common practice: in oil solid > hybrid > pearl; urethane early and weak; plastic is a spare ball)', () => {
  it('long heavy oil, every cover at 2000 grit on the same core: solid > hybrid > pearl > urethane, plastic last', () => {
    const core = {
      weightLb: 15,
      rg: 2.52,
      differential: 0.045,
      intermediateDifferential: 0,
      surfaceGrit: 2000,
      polished: false,
      layout: { pinToPapIn: 4.5 },
    };
    const covers = (['reactive-solid', 'reactive-hybrid', 'reactive-pearl', 'urethane', 'plastic'] as const).map((coverType) => ({
      ...core,
      id: coverType,
      coverType,
    }));
    expect(order(rank(covers, longHeavy, typical))).toEqual(['reactive-solid', 'reactive-hybrid', 'reactive-pearl', 'urethane', 'plastic']);
  });

  it('short light oil, the same five: the order turns — the pearl ranks above the solid', () => {
    const core = {
      weightLb: 15,
      rg: 2.52,
      differential: 0.045,
      intermediateDifferential: 0,
      surfaceGrit: 3000,
      polished: false,
      layout: { pinToPapIn: 4.5 },
    };
    const covers = (['reactive-solid', 'reactive-pearl'] as const).map((coverType) => ({ ...core, id: coverType, coverType }));
    expect(order(rank(covers, shortLight, caseBowler))[0]).toBe('reactive-pearl');
  });

  it('short light pattern: the polished pearl ranks above the rough solid, which is too strong there', () => {
    const r = rank([strongSolid(1000), pearl], shortLight, typical);
    expect(order(r)[0]).toBe('pearl');
    expect(byId(r, 'solid-1000').fit?.verdict).toBe('too-strong');
  });

  it('short light pattern for a lower-rev bowler (300 rpm): the urethane and the polished pearl still rank above the 1000-grit strong solid', () => {
    // Common practice: fewer revs ask for more ball, but not for a rough strong solid on short, light oil, where it
    // reads the long dry backend early and rolls out.
    const r = rank([strongSolid(1000), pearl, urethane], shortLight, { ...typical, revRpm: 300 });
    expect(order(r).indexOf('solid-1000')).toBeGreaterThan(order(r).indexOf('urethane'));
    expect(order(r).indexOf('solid-1000')).toBeGreaterThan(order(r).indexOf('pearl'));
  });

  it('pattern length alone (same oil spread 8 ft farther): the longer pattern asks for more ball by more than one surface step, and the rough solid gains on the polished pearl', () => {
    // Common practice: length is the pattern variable ball choice is keyed to first (short: weaker, cleaner; long: stronger, rougher).
    const stretched: OilPattern = { name: 'Harrow Bay house, stretched', sweeps: house.sweeps.map((w) => ({ ...w, endFt: w.endFt + 8 })) };
    expect(analyzePattern(stretched).volumeMl).toBeCloseTo(analyzePattern(house).volumeMl, 6);
    const onHouse = rank([strongSolid(1000), pearl], house, typical);
    const onLong = rank([strongSolid(1000), pearl], stretched, typical);
    expect(byId(onLong, 'pearl').fit!.demand - byId(onHouse, 'pearl').fit!.demand).toBeGreaterThan(5);
    const margin = (r: ReturnType<typeof rank>) => byId(r, 'solid-1000').score - byId(r, 'pearl').score;
    expect(margin(onLong)).toBeGreaterThan(margin(onHouse));
  });

  it('plastic is a spare ball: never ranked for strikes, listed after the strike balls, and suggested for corner spares', () => {
    const r = rank([plastic, strongSolid(2000)], shortLight, typical);
    expect(order(r)).toEqual(['solid-2000', 'plastic']);
    expect(byId(r, 'plastic').standing).toBe('spare');
    expect(byId(r, 'plastic').suggestions).toContainEqual(expect.objectContaining({ kind: 'line', change: { spareTargets: [7, 10] } }));
  });
});

describe('the bowler and the lane (common practice)', () => {
  const balls = [strongSolid(2000), pearl];
  it('a high-speed, low-rev bowler needs more ball: the strong solid ranks first for them, the pearl for a high-rev, low-speed bowler', () => {
    const power: BowlerProfile = { ...typical, speedMph: 19.5, revRpm: 260 };
    const cranker: BowlerProfile = { ...typical, speedMph: 15.5, revRpm: 460 };
    expect(order(rank(balls, house, power))[0]).toBe('solid-2000');
    expect(order(rank(balls, house, cranker))[0]).toBe('pearl');
  });

  it('a high-friction lane surface asks for less ball than a low-friction one: the demand falls and the weaker ball gains on the stronger', () => {
    const hi = rank(balls, house, typical, { lane: { kind: 'synthetic', friction: 'high' } });
    const lo = rank(balls, house, typical, { lane: { kind: 'synthetic', friction: 'low' } });
    expect(byId(hi, 'pearl').fit!.demand).toBeLessThan(byId(lo, 'pearl').fit!.demand);
    const margin = (r: typeof hi) => byId(r, 'pearl').score - byId(r, 'solid-2000').score;
    expect(margin(hi)).toBeGreaterThan(margin(lo));
  });

  it('transition: after nine games the lane asks for less ball, so the weaker ball gains on the strong solid', () => {
    const margin = (g: number) => {
      const r = rank(balls, house, typical, { gamesBowled: g });
      return byId(r, 'pearl').score - byId(r, 'solid-2000').score;
    };
    expect(margin(9)).toBeGreaterThan(margin(0));
  });

  it('a left-hander on the mirrored pattern gets the same ranking and the same predictions (boards counted from their own gutter)', () => {
    const mirror = (p: OilPattern): OilPattern => ({
      name: `${p.name} mirrored`,
      sweeps: p.sweeps.map((w) => ({ ...w, fromBoard: 40 - w.toBoard, toBoard: 40 - w.fromBoard })),
    });
    const right = rank(balls, house, typical);
    const left = rank(balls, mirror(house), { ...typical, hand: 'left' });
    expect(order(left)).toEqual(order(right));
    for (const id of order(right)) {
      expect(byId(left, id).prediction.entryBoard).toBeCloseTo(byId(right, id).prediction.entryBoard, 6);
      expect(byId(left, id).score).toBeCloseTo(byId(right, id).score, 6);
    }
  });
});

describe('legality (USBC equipment specifications)', () => {
  it('a 17 lb ball is not ranked for strikes: listed apart, after every other ball, with the broken limit, even where it would fit best', () => {
    const heavy: ArsenalBall = { ...strongSolid(4000), id: 'overweight', weightLb: 17 };
    const r = rank([strongSolid(2000), heavy, plastic], house);
    expect(order(r)).toEqual(['solid-2000', 'plastic', 'overweight']);
    const e = byId(r, 'overweight');
    expect(e.standing).toBe('illegal');
    expect(e.legality?.violations.map((v) => v.field)).toContain('weightLb');
    expect(e.reasons[0]).toMatchObject({ rule: 'legality' });
  });

  it('hardness: 72.5 D is legal for a ball approved in 2019 and not for one approved in 2022 (73 D from 2021 approvals, USBC 2020 release)', () => {
    const old: ArsenalBall = { ...strongSolid(4000), id: 'older', hardnessD: 72.5, approvalYear: 2019 };
    const newer: ArsenalBall = { ...strongSolid(4000), id: 'newer', hardnessD: 72.5, approvalYear: 2022 };
    const r = rank([old, newer], house);
    expect(byId(r, 'older').standing).toBe('strike');
    expect(byId(r, 'newer').standing).toBe('illegal');
  });
});

describe('reasons and suggestions say one consistent thing', () => {
  const all = [strongSolid(500), strongSolid(2000), strongSolid(4000, true), pearl, urethane];
  const cases: [string, OilPattern][] = [
    ['house', house],
    ['long heavy', longHeavy],
    ['short light', shortLight],
    ['flat sport', flatSport],
  ];
  it.each(cases)(
    '%s: every negative fit reason says it is part of the gap; the fit reasons add up to the points the fit lost; no ball that suits is told to change its surface',
    (_n, pattern) => {
      const r = rank(all, pattern, typical);
      expect(r).toHaveLength(all.length);
      for (const e of r) {
        const fitReasons = e.reasons.filter((x) => x.rule.startsWith('reaction-') || x.rule.startsWith('demand-'));
        expect(fitReasons.length).toBeGreaterThan(3);
        for (const x of fitReasons) {
          if (x.effect < 0) expect(x.text).toMatch(/part of why/);
          expect(x.effect).toBeLessThanOrEqual(0); // a fit part never adds points: the fit can only lose them
          expect(x.source.length).toBeGreaterThan(5);
        }
        const fitLayer = e.layers?.find((l) => l.name === 'fit');
        expect(fitLayer).toBeDefined();
        const sum = fitReasons.reduce((a, x) => a + x.effect, 0);
        expect(sum).toBeCloseTo(-(100 - fitLayer!.score), 0);
        if (e.fit?.verdict === 'suits') expect(e.suggestions.some((x) => x.kind === 'surface')).toBe(false);
        if (e.fit?.verdict === 'too-strong') {
          for (const x of e.suggestions.filter((y) => y.kind === 'surface')) {
            const c = x.change as { surfaceGrit: number; polished: boolean };
            const ball = all.find((b) => b.id === e.id)!;
            expect(smoothness(c.surfaceGrit, c.polished)).toBeGreaterThan(smoothness(ball.surfaceGrit, ball.polished));
          }
        }
      }
    },
  );
});
