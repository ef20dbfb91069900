import { describe, expect, it } from 'vitest';
import { api, createUser, errorOf } from '../../helpers/api';
import { createBall, createCenter } from '../../helpers/fixtures';
import { logGame, type FrameLog } from '../sessions/shotlog';

// Check values are worked by hand. Scoring: the USBC playing rules (a spare counts the next ball, a strike the
// next two). Averages: total pins ÷ games, fractions dropped; handicap: a percentage of (basis − average),
// fractions dropped (USBC league rules — from memory; 90 % of 220 is a common league choice).

/** 9 and a spare every frame, 9 on the fill ball: 19 a frame, 190. */
const SPARES_190: FrameLog[] = [...Array.from({ length: 9 }, () => [[10], []]), [[10], [], [10]]];
/** 9 and a miss every frame: 90. */
const NINES_90: FrameLog[] = Array.from({ length: 10 }, () => [[10], [10]]);
/** Twelve strikes: 300. */
const PERFECT: FrameLog[] = [...Array.from({ length: 9 }, () => [[]]), [[], [], []]];

async function night(
  auth: { Authorization: string },
  leagueId: number,
  date: string,
  lanePair: string,
  centerId: number,
  games: FrameLog[][],
  ballId: number,
) {
  const res = await api.post('/api/sessions').set(auth).send({ date, kind: 'league', leagueId, lanePair, centerId });
  expect(res.status).toBe(201);
  expect(res.body.item).toMatchObject({ leagueId, lanePair });
  for (const [i, g] of games.entries()) await logGame(auth, res.body.item.id, i + 1, g, () => ({}), ballId);
  return res.body.item.id as number;
}

describe('leagues: a season with handicap 90 % of 220, entering average 185', () => {
  it('two nights: series, the average and handicap each night was bowled on, the season, and its CSV — by hand', async () => {
    const me = await createUser();
    const prop = await createUser('proprietor');
    const center = await createCenter(prop.user.id);
    const ball = await createBall(me.user.id);
    const created = await api
      .post('/api/leagues')
      .set(me.auth)
      .send({
        name: 'Tuesday Mixers',
        centerId: center.id,
        weekday: 2,
        seasonStart: '2026-09-01',
        handicap: { basis: 220, percentage: 90 },
        enteringAverage: 185,
      });
    expect(created.status).toBe(201);
    const id = created.body.item.id as number;
    expect(created.body.item).toMatchObject({
      name: 'Tuesday Mixers',
      centerName: center.name,
      handicap: { basis: 220, percentage: 90 },
      nights: 0,
    });

    await night(me.auth, id, '2026-09-01', '13-14', center.id, [SPARES_190, SPARES_190, NINES_90], ball.id);
    // night 2: a 300, a 190 and a game left after three frames (it does not count until complete)
    await night(me.auth, id, '2026-09-08', '15-16', center.id, [PERFECT, SPARES_190, NINES_90.slice(0, 3)], ball.id);

    const res = await api.get(`/api/leagues/${id}/standing`).set(me.auth);
    expect(res.status).toBe(200);
    const { season, nights, league } = res.body.item;
    expect(league.nights).toBe(2);
    // night 1: 470 on the entering 185 → 0.9 × 35 = 31.5 → 31 a game, 470 + 93 = 563; average after 470 / 3 = 156
    expect(season.nights[0]).toMatchObject({
      games: [190, 190, 90],
      series: 470,
      averageBefore: 185,
      handicapPerGame: 31,
      handicapSeries: 563,
      averageAfter: 156,
    });
    // night 2: 490 on 156 → 0.9 × 64 = 57.6 → 57 a game, 490 + 114 = 604; average after 960 / 5 = 192
    expect(season.nights[1]).toMatchObject({
      games: [300, 190],
      series: 490,
      averageBefore: 156,
      handicapPerGame: 57,
      handicapSeries: 604,
      averageAfter: 192,
    });
    // the season: 5 games, 960 pins, average 192, handicap 0.9 × 28 = 25.2 → 25
    expect(season).toMatchObject({ games: 5, pins: 960, average: 192, handicap: 25, highGame: 300, highSeries: 490 });
    expect(nights.map((n: { lanePair: string; incompleteGames: number }) => [n.lanePair, n.incompleteGames])).toEqual([
      ['13-14', 0],
      ['15-16', 1],
    ]);

    const csv = await api.get(`/api/leagues/${id}/season.csv`).set(me.auth);
    expect(csv.status).toBe(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    expect(csv.headers['content-disposition']).toBe('attachment; filename="tuesday-mixers-2026-09-01.csv"');
    expect(csv.text.trim().split('\n')).toEqual([
      'Date,Lane pair,Game 1,Game 2,Game 3,Series,Average before,Handicap per game,Handicap series,Average after',
      '2026-09-01,13-14,190,190,90,470,185,31,563,156',
      '2026-09-08,15-16,300,190,,490,156,57,604,192',
      'Season,,,,,960,,25,,192',
    ]);
  });
});

describe('leagues: who may see them, and bad input', () => {
  it('another bowler gets 404 for the league, its standing and its CSV; anonymous 401', async () => {
    const me = await createUser();
    const other = await createUser();
    const id = (await api.post('/api/leagues').set(me.auth).send({ name: 'Friday Four', seasonStart: '2026-09-04' })).body.item.id;
    for (const url of [`/api/leagues/${id}`, `/api/leagues/${id}/standing`, `/api/leagues/${id}/season.csv`]) {
      expect((await api.get(url).set(other.auth)).status).toBe(404);
      expect((await api.get(url)).status).toBe(401);
    }
    expect((await api.get('/api/leagues').set(other.auth)).body.items).toEqual([]);
  });

  it('a scratch league (no handicap rule) has no handicap', async () => {
    const me = await createUser();
    const res = await api.post('/api/leagues').set(me.auth).send({ name: 'Scratch Trios', seasonStart: '2026-09-04' });
    expect(res.body.item.handicap).toBeNull();
    const st = await api.get(`/api/leagues/${res.body.item.id}/standing`).set(me.auth);
    expect(st.body.item.season).toMatchObject({ games: 0, handicap: null, average: null });
  });

  it('400 with field messages: a season ending before it starts, a percentage over 100, no name', async () => {
    const me = await createUser();
    const res = await api
      .post('/api/leagues')
      .set(me.auth)
      .send({ name: '', seasonStart: '2026-09-04', seasonEnd: '2026-08-01', handicap: { basis: 220, percentage: 120 } });
    expect(res.status).toBe(400);
    const fields = errorOf(res.body).fields!;
    expect(Object.keys(fields)).toEqual(expect.arrayContaining(['body.name', 'body.handicap.percentage']));
  });

  it('a session refuses a lane pair that is not an odd lane and the next, another bowler’s league, and a league night that is not a league session', async () => {
    const me = await createUser();
    const other = await createUser();
    const theirs = (await api.post('/api/leagues').set(other.auth).send({ name: 'Their League', seasonStart: '2026-09-04' })).body.item.id;
    const mine = (await api.post('/api/leagues').set(me.auth).send({ name: 'My League', seasonStart: '2026-09-04' })).body.item.id;
    const bad = await api.post('/api/sessions').set(me.auth).send({ date: '2026-09-04', kind: 'league', lanePair: '14-15' });
    expect(bad.status).toBe(400);
    expect(errorOf(bad.body).fields!['body.lanePair']).toMatch(/odd lane and the next/);
    const notMine = await api.post('/api/sessions').set(me.auth).send({ date: '2026-09-04', kind: 'league', leagueId: theirs });
    expect(notMine.status).toBe(400);
    expect(errorOf(notMine.body).fields!['body.leagueId']).toBeDefined();
    const practice = await api.post('/api/sessions').set(me.auth).send({ date: '2026-09-04', kind: 'practice', leagueId: mine });
    expect(practice.status).toBe(400);
    expect(errorOf(practice.body).fields!['body.kind']).toMatch(/league session/);
    const prop = await createUser('proprietor');
    const center = await createCenter(prop.user.id);
    const beyond = await api
      .post('/api/sessions')
      .set(me.auth)
      .send({ date: '2026-09-04', kind: 'league', centerId: center.id, lanePair: `${center.laneCount + 1}-${center.laneCount + 2}` });
    expect(beyond.status).toBe(400);
    expect(errorOf(beyond.body).fields!['body.lanePair']).toMatch(/has lanes 1–/);
  });
});
