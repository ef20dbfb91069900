import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  emptyShotCounts,
  countsOfShots,
  gameCounts,
  movesOfRecentShots,
  recentShotsSuffice,
  shotStats,
  shotStatsOfCounts,
  statsBy,
  suggestMoves,
  type GameCountsRow,
  type HitKind,
  type ShotCounts,
  type ShotRecord,
} from '../../../engine/index';
import { makeGame, choiceArb } from './gameGen';

// Hand counts: the World Bowling worked sheet of the USBC and World Bowling playing rules (X X X 7 2 (8)/ F9 X 7/ 9- X X 8 = 180),
// logged with the leaves of shotStats.test.ts; counted by hand under shotStats' documented definitions.
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
const sheetShots: ShotRecord[] = sheet.map((r) => ({
  frame: r[0],
  delivery: r[1],
  standing: r[2],
  foul: r[3]?.foul ?? false,
  hit: r[3]?.hit ?? null,
  sessionId: 's1',
  gameNumber: 1,
  date: '2026-11-20',
  ballId: r[1] === 1 || r[0] === 10 ? 'strike-ball' : 'spare-ball',
  surfaceKey: '2000 grit',
}));

const ZERO: ShotCounts = {
  shots: 0,
  games: 0,
  totalSum: 0,
  completeGames: 0,
  strikes: 0,
  strikeN: 0,
  spares: 0,
  spareN: 0,
  singleMade: 0,
  singleN: 0,
  multiMade: 0,
  multiN: 0,
  splitMade: 0,
  splitN: 0,
  pocket: 0,
  pocketN: 0,
  carried: 0,
  tallies: {},
};

/** Rows summed as the database sums them (games counted once each; the score of each row `score` picks). */
function sum(rows: GameCountsRow[], score: (r: GameCountsRow) => boolean): ShotCounts {
  const c: ShotCounts = { ...ZERO, tallies: {} };
  const games = new Set<string>();
  for (const r of rows) {
    games.add(`${r.sessionId}|${r.gameNumber}`);
    for (const k of Object.keys(ZERO) as (keyof ShotCounts)[]) {
      if (k === 'tallies' || k === 'games' || k === 'totalSum' || k === 'completeGames') continue;
      c[k] += r.counts[k];
    }
    for (const [k, n] of Object.entries(r.counts.tallies)) c.tallies[k] = (c.tallies[k] ?? 0) + n;
    if (r.gameTotal !== null && score(r)) {
      c.totalSum += r.gameTotal;
      c.completeGames++;
    }
  }
  c.games = games.size;
  return c;
}

describe('countsOfShots on the worked sheet (hand counts)', () => {
  const c = countsOfShots(sheetShots);

  it('counts every rate by hand: strikes 6/12, spares 2/5, single 0/1, multi 2/4, split 1/1, pocket 3/6, carry 2', () => {
    expect(c).toMatchObject({
      shots: 17,
      games: 1,
      totalSum: 180,
      completeGames: 1,
      strikes: 6,
      strikeN: 12,
      spares: 2,
      spareN: 5,
      singleMade: 0,
      singleN: 1,
      multiMade: 2,
      multiN: 4,
      splitMade: 1,
      splitN: 1,
      pocket: 3,
      pocketN: 6,
      carried: 2,
    });
  });

  it('tallies first balls by pins (six tens, two sevens, two eights, a nine and the foul’s 0) and the five leaves once each', () => {
    expect(c.tallies).toEqual({
      'fb:10': 6,
      'fb:7': 2,
      'fb:8': 2,
      'fb:9': 1,
      'fb:0': 1,
      'leave:4,7,8': 1,
      'leave:3,10': 1,
      'leave:2,4,7': 1,
      'leave:10': 1,
      'leave:6,10': 1,
    });
  });

  it('shotStatsOfCounts gives shotStats’ figures: mean 99/12, sd √(90.25/11), the 3-10 a split', () => {
    const s = shotStatsOfCounts(c);
    expect(s).toEqual(shotStats(sheetShots));
    expect(s.firstBallAverage.mean).toBe(99 / 12);
    expect(s.firstBallAverage.sd).toBeCloseTo(Math.sqrt(90.25 / 11), 12);
    expect(s.leaves.find((l) => l.name === '3-10')?.split).toBe(true);
  });

  it('no shots: zero counts and the empty statistics', () => {
    expect(countsOfShots([])).toEqual(ZERO);
    expect(shotStatsOfCounts(ZERO)).toEqual(shotStats([]));
  });
});

/** A season: sessions of games, each delivery thrown with one of three balls at one of two surfaces. */
const seasonOf = (sessions: { minLength: number; maxLength: number }, games: { minLength: number; maxLength: number }) =>
  fc
    .array(
      fc.record({
        games: fc.array(fc.array(choiceArb, { minLength: 21, maxLength: 21 }), games),
        balls: fc.array(fc.nat(5), { minLength: 21, maxLength: 21 }),
        day: fc.nat(20),
        boards: fc.array(
          fc.record({ feet: fc.integer({ min: 18, max: 21 }), hit: fc.constantFrom<HitKind | null>('pocket', 'high', 'light', null) }),
          {
            minLength: 21,
            maxLength: 21,
          },
        ),
      }),
      sessions,
    )
    .map((sessions) =>
      sessions.flatMap((s, si) =>
        s.games.flatMap((choices, gi) => {
          const g = makeGame(choices);
          // a partial game now and then (the last one of a session cut short)
          const ds = gi === s.games.length - 1 && s.day % 3 === 0 ? g.deliveries.slice(0, 9) : g.deliveries;
          return ds.map((d, k): ShotRecord => ({
            ...d,
            sessionId: `s${si}`,
            gameNumber: gi + 1,
            date: `2026-11-${String(1 + s.day).padStart(2, '0')}`,
            ballId: `b${s.balls[k % 21] % 3}`,
            surfaceKey: s.balls[k % 21] >= 3 ? '4000 grit' : '2000 grit',
            feetBoard: s.boards[k % 21].feet,
            targetBoard: 10,
            breakpointBoard: s.boards[k % 21].feet - 12,
            hit: d.delivery === 1 ? s.boards[k % 21].hit : null,
          }));
        }),
      ),
    );

const seasonArb = seasonOf({ minLength: 1, maxLength: 6 }, { minLength: 1, maxLength: 3 });
/** Long enough for 20 single-pin spare chances in the latest sessions now and then. */
const longSeasonArb = seasonOf({ minLength: 6, maxLength: 12 }, { minLength: 3, maxLength: 4 });

describe('gameCounts summed give the statistics of the raw shots', () => {
  it('overall, per ball, per ball and surface, per session, and over one ball’s shots alone', () => {
    fc.assert(
      fc.property(seasonArb, (shots) => {
        const rows = gameCounts(shots);
        const full = rows.filter((r) => !r.alone);
        expect(shotStatsOfCounts(sum(full, (r) => r.lead))).toEqual(shotStats(shots));
        for (const g of statsBy(shots, 'ballId')) {
          const own = full.filter((r) => r.ballId === g.key);
          expect(shotStatsOfCounts(sum(own, (r) => r.lead && r.gameBalls === 1))).toEqual(g.stats);
        }
        for (const g of statsBy(shots, ['ballId', 'surfaceKey'])) {
          const own = full.filter((r) => r.ballId === g.keys.ballId && r.surfaceKey === g.keys.surfaceKey);
          expect(shotStatsOfCounts(sum(own, (r) => r.gameRows === 1))).toEqual(g.stats);
        }
        for (const g of statsBy(shots, 'sessionId')) {
          expect(
            shotStatsOfCounts(
              sum(
                full.filter((r) => r.sessionId === g.key),
                (r) => r.lead,
              ),
            ),
          ).toEqual(g.stats);
        }
        for (const ball of ['b0', 'b1', 'b2']) {
          const alone = rows.filter((r) => r.alone && r.ballId === ball);
          const own = shots.filter((s) => s.ballId === ball);
          expect(shotStatsOfCounts(sum(alone, (r) => r.lead && r.gameBalls === 1))).toEqual(shotStats(own));
          for (const g of statsBy(own, ['ballId', 'surfaceKey'])) {
            const part = alone.filter((r) => r.surfaceKey === g.keys.surfaceKey);
            expect(shotStatsOfCounts(sum(part, (r) => r.gameRows === 1))).toEqual(g.stats);
          }
        }
      }),
      { numRuns: 60 },
    );
  });
});

describe('recentShotsSuffice', () => {
  it('when the latest sessions suffice, suggestMoves on them equals suggestMoves on the season', () => {
    let sufficed = 0;
    fc.assert(
      fc.property(longSeasonArb, fc.nat(11), fc.constantFrom<'right' | 'left'>('right', 'left'), (shots, keep, hand) => {
        const order = [...new Set(shots.map((s) => s.sessionId))].sort((a, b) => {
          const da = shots.find((s) => s.sessionId === a)!.date;
          const db = shots.find((s) => s.sessionId === b)!.date;
          return da < db ? -1 : da > db ? 1 : Number(a.slice(1)) - Number(b.slice(1));
        });
        const inOrder = order.flatMap((id) => shots.filter((s) => s.sessionId === id));
        const latest = new Set(order.slice(Math.max(0, order.length - 1 - keep)));
        const recent = inOrder.filter((s) => latest.has(s.sessionId));
        const all = suggestMoves({ shots: inOrder, hand });
        expect(movesOfRecentShots({ shots: inOrder, hand, complete: true })).toEqual(all);
        if (recentShotsSuffice(recent)) {
          sufficed++;
          expect(suggestMoves({ shots: recent, hand })).toEqual(all);
          expect(movesOfRecentShots({ shots: recent, hand, complete: false })).toEqual(all);
        } else {
          expect(movesOfRecentShots({ shots: recent, hand, complete: false })).toBeNull();
        }
      }),
      { numRuns: 60 },
    );
    expect(sufficed).toBeGreaterThan(0);
  });

  it('is false while the current line reaches back past the shots and has fewer than 6 recorded hits', () => {
    const shots: ShotRecord[] = Array.from({ length: 10 }, (_, i) => ({
      frame: i + 1,
      delivery: 1,
      standing: [],
      sessionId: 's1',
      gameNumber: 1,
      date: '2026-11-20',
      ballId: 'b1',
      surfaceKey: '2000 grit',
      feetBoard: 20,
      targetBoard: 10,
    }));
    expect(recentShotsSuffice(shots)).toBe(false);
    expect(recentShotsSuffice([])).toBe(false);
  });
});

describe('emptyShotCounts', () => {
  it('is the counts of no shots: its statistics are those of an empty log, and it is a fresh object each time', () => {
    expect(emptyShotCounts()).toEqual(countsOfShots([]));
    expect(shotStatsOfCounts(emptyShotCounts())).toEqual(shotStats([]));
    const a = emptyShotCounts();
    a.strikes = 3;
    expect(emptyShotCounts().strikes).toBe(0);
  });
});
