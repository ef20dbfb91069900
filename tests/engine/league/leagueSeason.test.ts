import { describe, expect, it } from 'vitest';
import { handicapFor, leagueAverage, leagueSeason } from '../../../engine/index';

// Check values are worked by hand below. The rules: an average is total pins ÷ games with fractions dropped
// (USBC Playing Rules, averages — from memory); handicap is a percentage of the difference between a basis
// score and the average, fractions dropped (USBC league rules on handicap — from memory; "90 % of 220" and
// "80 % of 210" are common league choices, common practice).

describe('leagueAverage', () => {
  it('drops fractions: 1154 pins in 6 games is 192 (192.33…), 1465 in 8 is 183 (183.125)', () => {
    expect(leagueAverage(1154, 6)).toBe(192);
    expect(leagueAverage(1465, 8)).toBe(183);
    expect(leagueAverage(599, 3)).toBe(199); // 199.67 is still 199
  });
  it('refuses no games or more pins than 300 a game', () => {
    expect(() => leagueAverage(100, 0)).toThrow(RangeError);
    expect(() => leagueAverage(901, 3)).toThrow(/pins/);
  });
});

describe('handicapFor', () => {
  it('90 % of 220 at a 185 average: 0.9 × 35 = 31.5 → 31', () => {
    expect(handicapFor(185, { basis: 220, percentage: 90 })).toBe(31);
  });
  it('80 % of 210 at 170: exactly 32 (no floating-point loss)', () => {
    expect(handicapFor(170, { basis: 210, percentage: 80 })).toBe(32);
  });
  it('an average at or above the basis gets none; a cap limits it', () => {
    expect(handicapFor(220, { basis: 220, percentage: 90 })).toBe(0);
    expect(handicapFor(231, { basis: 220, percentage: 90 })).toBe(0);
    expect(handicapFor(120, { basis: 220, percentage: 100, maxPerGame: 60 })).toBe(60);
  });
  it('refuses a percentage outside 1–100 or a basis outside 100–300', () => {
    expect(() => handicapFor(150, { basis: 220, percentage: 0 })).toThrow(RangeError);
    expect(() => handicapFor(150, { basis: 320, percentage: 90 })).toThrow(/basis/);
  });
});

describe('leagueSeason: a worked season, 90 % of 220, entering average 185', () => {
  const season = leagueSeason({
    nights: [
      { date: '2026-09-01', games: [180, 200, 190] },
      { date: '2026-09-08', games: [210, 175, 199] },
      { date: '2026-09-15', games: [150, 160] },
    ],
    handicap: { basis: 220, percentage: 90 },
    enteringAverage: 185,
  });

  it('night 1 on the entering average: 570 scratch, handicap 31 a game, 663 with handicap; average after 190', () => {
    expect(season.nights[0]).toEqual({
      date: '2026-09-01',
      games: [180, 200, 190],
      series: 570,
      averageBefore: 185,
      handicapPerGame: 31,
      handicapSeries: 663,
      averageAfter: 190,
      gamesToDate: 3,
      pinsToDate: 570,
    });
  });
  it('night 2 on the running average 190: handicap 27, 584 + 81 = 665; average after 1154 / 6 = 192', () => {
    expect(season.nights[1]).toMatchObject({
      averageBefore: 190,
      handicapPerGame: 27,
      series: 584,
      handicapSeries: 665,
      averageAfter: 192,
    });
  });
  it('night 3 with two games on 192: handicap 0.9 × 28 = 25.2 → 25, 310 + 50 = 360; average after 1464 / 8 = 183', () => {
    expect(season.nights[2]).toMatchObject({
      averageBefore: 192,
      handicapPerGame: 25,
      series: 310,
      handicapSeries: 360,
      averageAfter: 183,
    });
  });
  it('the season: 8 games, 1464 pins, average 183, handicap 0.9 × 37 = 33.3 → 33, high game 210, high series 584', () => {
    expect(season).toMatchObject({ games: 8, pins: 1464, average: 183, handicap: 33, highGame: 210, highSeries: 584 });
  });
});

describe('leagueSeason: edge cases', () => {
  it('a scratch league has no handicap and the handicap series is the scratch series', () => {
    const s = leagueSeason({ nights: [{ date: '2026-09-01', games: [200, 200, 200] }], handicap: null });
    expect(s.nights[0]).toMatchObject({ handicapPerGame: null, handicapSeries: 600, averageBefore: null });
    expect(s.handicap).toBeNull();
  });
  it('with no entering average the first night has no handicap; the second uses the first night’s average', () => {
    const s = leagueSeason({
      nights: [
        { date: '2026-09-01', games: [150, 151, 152] },
        { date: '2026-09-08', games: [160] },
      ],
      handicap: { basis: 200, percentage: 100 },
    });
    expect(s.nights[0].handicapPerGame).toBeNull();
    expect(s.nights[1]).toMatchObject({ averageBefore: 151, handicapPerGame: 49, handicapSeries: 209 });
  });
  it('no nights: no games, the entering average stands', () => {
    expect(leagueSeason({ nights: [], handicap: { basis: 220, percentage: 90 }, enteringAverage: 200 })).toMatchObject({
      games: 0,
      average: 200,
      handicap: 18,
      highGame: null,
    });
  });
  it('refuses nights out of date order and scores above 300', () => {
    expect(() =>
      leagueSeason({
        nights: [
          { date: '2026-09-08', games: [100] },
          { date: '2026-09-01', games: [100] },
        ],
        handicap: null,
      }),
    ).toThrow(/date order/);
    expect(() => leagueSeason({ nights: [{ date: '2026-09-01', games: [301] }], handicap: null })).toThrow(RangeError);
  });
});
