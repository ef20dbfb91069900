import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { buildGame, scoreGame, shotStats, statsBy, wilsonInterval, type HitKind, type ShotRecord } from '../../../engine/index';
import { gameArb } from './gameGen';

// Check values: the World Bowling worked sheet of the USBC and World Bowling playing rules (P) —
// X X X 7 2 (8)/ F9 X 7/ 9- X X 8 = 180 — logged with leaves chosen by us (the circled 8 leaves the
// 3-10 "baby split", the USBC playing rules on splits), counted by hand under shotStats' documented definitions.
// Wilson intervals: Wilson (1927, JASA 22: 209–212), worked by hand below.

type Row = [frame: number, delivery: number, standing: number[], extra?: { foul?: boolean; hit?: HitKind }];
const sheet: Row[] = [
  [1, 1, [], { hit: 'pocket' }],
  [2, 1, [], { hit: 'pocket' }],
  [3, 1, [], { hit: 'high' }],
  [4, 1, [4, 7, 8], { hit: 'light' }],
  [4, 2, [8]],
  [5, 1, [3, 10], { hit: 'pocket' }],
  [5, 2, []],
  [6, 1, [1, 2, 3, 4, 5, 6], { foul: true }],
  [6, 2, [10]],
  [7, 1, [], { hit: 'brooklyn' }],
  [8, 1, [2, 4, 7]],
  [8, 2, []],
  [9, 1, [10]],
  [9, 2, [10]],
  [10, 1, []],
  [10, 2, []],
  [10, 3, [6, 10]],
];

function shots(
  rows: Row[],
  over: Partial<ShotRecord> = {},
  ball: (r: Row) => string = (r: Row) => (r[1] === 1 || r[0] === 10 ? 'strike-ball' : 'spare-ball'),
): ShotRecord[] {
  return rows.map((r) => ({
    frame: r[0],
    delivery: r[1],
    standing: r[2],
    foul: r[3]?.foul ?? false,
    hit: r[3]?.hit ?? null,
    sessionId: 's1',
    gameNumber: 1,
    date: '2026-11-20',
    ballId: ball(r),
    surfaceKey: '2000 grit',
    ...over,
  }));
}

describe('shotStats on the World Bowling worked sheet', () => {
  const s = shotStats(shots(sheet));

  it('counts shots, games and the average of the complete game (180, the USBC and World Bowling playing rules)', () => {
    expect(s.shots).toBe(17);
    expect(s.games).toBe(1);
    expect(s.average).toBe(180);
    expect(s.completeGames).toBe(1);
  });

  it('strike %: 6 strikes in 12 first balls at a full rack (the foul in frame 6 is a chance missed)', () => {
    expect(s.strike).toMatchObject({ hits: 6, n: 12, pct: 50 });
    const w = wilsonInterval(6, 12);
    expect(s.strike.low).toBeCloseTo(100 * w.low, 10);
    expect(s.strike.high).toBeCloseTo(100 * w.high, 10);
  });

  it('spares: 2 of 5 (4-7-8 missed, 3-10 made, re-spotted rack after the foul missed, 2-4-7 made, 10 missed); single 0/1, multi 2/4, split 1/1', () => {
    expect(s.spare).toMatchObject({ hits: 2, n: 5, pct: 40 });
    expect(s.singlePinSpare).toMatchObject({ hits: 0, n: 1, pct: 0 });
    expect(s.multiPinSpare).toMatchObject({ hits: 2, n: 4, pct: 50 });
    expect(s.splitConversion).toMatchObject({ hits: 1, n: 1, pct: 100 });
  });

  it('pocket 3 of 6 recorded hits; carry 2 of the 3 pocket hits', () => {
    expect(s.pocket).toMatchObject({ hits: 3, n: 6, pct: 50 });
    expect(s.carry.hits).toBe(2);
    expect(s.carry.n).toBe(3);
  });

  it('first-ball average 99/12 = 8.25 with the sample standard deviation √(90.25/11)', () => {
    expect(s.firstBallAverage.n).toBe(12);
    expect(s.firstBallAverage.mean).toBeCloseTo(8.25, 12);
    expect(s.firstBallAverage.sd).toBeCloseTo(Math.sqrt(90.25 / 11), 12);
  });

  it('leaves: five different ones, 1/5 each, ties by name; the 3-10 is a split', () => {
    expect(s.leaves.map((l) => l.name)).toEqual(['10', '2-4-7', '3-10', '4-7-8', '6-10']);
    expect(s.leaves.every((l) => l.count === 1 && l.share === 0.2)).toBe(true);
    expect(s.leaves.find((l) => l.name === '3-10')?.split).toBe(true);
  });

  it('the same corner pin again and again comes first', () => {
    const g2 = shots(
      sheet.map((r): Row => (r[0] === 8 && r[1] === 1 ? [8, 1, [10]] : r[0] === 8 && r[1] === 2 ? [8, 2, []] : r)),
      { gameNumber: 2 },
    );
    const st = shotStats([...shots(sheet), ...g2]);
    expect(st.leaves[0]).toMatchObject({ name: '10', count: 3 });
    expect(st.games).toBe(2);
  });

  it('no shots: every rate has n 0 and null values', () => {
    const e = shotStats([]);
    expect(e.strike).toEqual({ hits: 0, n: 0, pct: null, low: null, high: null });
    expect(e.average).toBeNull();
    expect(e.firstBallAverage).toEqual({ mean: null, sd: null, n: 0 });
  });
});

describe('statsBy', () => {
  it('per ball: the spare ball keeps its leaves from the full game; no game is wholly one ball so no average', () => {
    const by = statsBy(shots(sheet), 'ballId');
    expect(by.map((g) => g.key).sort()).toEqual(['spare-ball', 'strike-ball']);
    const spare = by.find((g) => g.key === 'spare-ball')!.stats;
    const strike = by.find((g) => g.key === 'strike-ball')!.stats;
    expect(spare.spare).toMatchObject({ hits: 2, n: 5 });
    expect(spare.strike.n).toBe(0);
    expect(strike.strike).toMatchObject({ hits: 6, n: 12 });
    expect(strike.average).toBeNull();
    expect(spare.shots + strike.shots).toBe(17);
  });

  it('shotStats of a filtered set keeps only what has context: second balls without their first ball are not counted', () => {
    const onlySpareBall = shots(sheet).filter((s) => s.ballId === 'spare-ball');
    const st = shotStats(onlySpareBall);
    expect(st.shots).toBe(5);
    expect(st.spare.n).toBe(0);
  });

  it('by ball and surface side by side: the same ball at 2000 and 4000 grit', () => {
    const a = shots(sheet, { surfaceKey: '2000 grit' }, () => 'b1');
    const b = shots(sheet, { surfaceKey: '4000 grit', gameNumber: 2, date: '2026-11-21' }, () => 'b1');
    const by = statsBy([...b, ...a], ['ballId', 'surfaceKey']);
    expect(by.map((g) => g.key)).toEqual(['b1 | 2000 grit', 'b1 | 4000 grit']); // earliest date first
    expect(by[1].keys).toEqual({ ballId: 'b1', surfaceKey: '4000 grit' });
    expect(by[0].stats.average).toBe(180);
    expect(by.map((g) => g.stats.strike.n)).toEqual([12, 12]);
  });

  it('refuses bad input naming the function', () => {
    expect(() => statsBy(shots(sheet), 'lane' as 'ballId')).toThrow(/^statsBy: key must be one of ballId, surfaceKey, sessionId/);
    const dup = [...shots(sheet), shots(sheet)[3]];
    expect(() => shotStats(dup)).toThrow(new RangeError('shotStats: session s1 game 1: frame 4, delivery 1 is logged twice'));
    const down = shots(sheet).map((s) => (s.frame === 4 && s.delivery === 2 ? { ...s, standing: [8, 9] } : s));
    expect(() => shotStats(down)).toThrow(/^shotStats: session s1 game 1: frame 4, delivery 2: pin 9 was already down/);
    expect(() => shotStats(shots(sheet, { hit: 'gutter' as HitKind }))).toThrow(TypeError);
    expect(() => shotStats(shots(sheet, { date: '20.11.2026' }))).toThrow(/date must be YYYY-MM-DD/);
    expect(() => shotStats({} as unknown as ShotRecord[])).toThrow(new TypeError('shotStats: shots must be an array, got object'));
  });
});

describe('shotStats: property tests on generated games (fast-check)', () => {
  it('the average is scoreGame; strike chances, spare chances and first balls add up to the deliveries', () => {
    fc.assert(
      fc.property(gameArb, (g) => {
        const recs: ShotRecord[] = g.deliveries.map((d) => ({
          ...d,
          sessionId: 's',
          gameNumber: 1,
          date: '2026-01-01',
          ballId: 'b',
          surfaceKey: 'polished',
        }));
        const st = shotStats(recs);
        expect(st.average).toBe(scoreGame(g.rolls).total);
        expect(st.strike.n + st.spare.n).toBe(g.deliveries.length);
        expect(st.firstBallAverage.n).toBe(st.strike.n);
        expect(st.singlePinSpare.n + st.multiPinSpare.n).toBe(st.spare.n);
        const views = buildGame(g.deliveries).frames.flatMap((f) => f.deliveries);
        expect(st.strike.hits).toBe(views.filter((v) => v.symbol === 'X').length);
        expect(st.spare.hits).toBe(views.filter((v) => v.symbol === '/').length);
        expect(st.leaves.reduce((a, l) => a + l.count, 0)).toBe(
          views.filter((v) => v.rackBall === 1 && !v.foul && v.symbol !== 'X').length,
        );
        const mean = views.filter((v) => v.rackBall === 1).reduce((a, v) => a + v.pins, 0) / st.strike.n;
        expect(st.firstBallAverage.mean).toBeCloseTo(mean, 12);
      }),
      { numRuns: 150 },
    );
  }, 60_000);
});
