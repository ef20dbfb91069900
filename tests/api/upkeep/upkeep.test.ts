import { describe, expect, it } from 'vitest';
import { api, createUser, errorOf } from '../../helpers/api';
import { createBall } from '../../helpers/fixtures';
import { newKey } from '../sessions/shotlog';

// Intervals: a resurface every 60 games and an oil extraction every 30 by default (the lower ends of the common
// 60–100 and 30–60 game ranges, common practice). Check values are hand counts of the games logged below.

const today = () => new Date().toISOString().slice(0, 10);

/** Logs `count` games of one first-ball strike each with the ball (a game counts once it has a shot). */
async function games(auth: { Authorization: string }, sessionId: number, first: number, count: number, ballId: number) {
  for (let g = first; g < first + count; g++) {
    const res = await api
      .post(`/api/sessions/${sessionId}/shots`)
      .set(auth)
      .set('Idempotency-Key', newKey())
      .send({ gameNumber: g, frame: 1, delivery: 1, standing: [], ballId });
    expect(res.status).toBe(201);
  }
}
const upkeepOf = async (auth: { Authorization: string }, ballId: number) => {
  const res = await api.get('/api/upkeep').set(auth);
  expect(res.status).toBe(200);
  return res.body.items.find((u: { ballId: number }) => u.ballId === ballId);
};

describe('ball upkeep', () => {
  it('counts games logged since the count was set, reminds at the interval, and restarts after a resurface or extraction', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id); // 10 games since its resurface
    const sid = (await api.post('/api/sessions').set(me.auth).send({ date: today(), kind: 'practice' })).body.item.id as number;

    await games(me.auth, sid, 1, 3, ball.id);
    expect(await upkeepOf(me.auth, ball.id)).toMatchObject({
      resurface: { games: 13, interval: 60, remaining: 47, state: 'ok' },
      extraction: { games: 3, interval: 30, remaining: 27, state: 'ok' },
      ownIntervals: false,
    });

    // the bowler corrects the count to 50: the games logged before that are in the 50
    const version = (await api.get(`/api/arsenal/${ball.id}`).set(me.auth)).body.item.version as number;
    expect((await api.patch(`/api/arsenal/${ball.id}`).set(me.auth).send({ version, gamesSinceResurface: 50 })).status).toBe(200);
    expect((await upkeepOf(me.auth, ball.id)).resurface.games).toBe(50);

    await games(me.auth, sid, 4, 10, ball.id);
    const due = await upkeepOf(me.auth, ball.id);
    expect(due.resurface).toEqual({ games: 60, interval: 60, remaining: 0, state: 'due' });
    expect(due.extraction).toEqual({ games: 13, interval: 30, remaining: 17, state: 'ok' });
    // the most urgent ball first
    const other = await createBall(me.user.id);
    const list = (await api.get('/api/upkeep').set(me.auth)).body.items;
    expect(list.map((u: { ballId: number }) => u.ballId)).toEqual([ball.id, other.id]);

    // the bowler's own interval for this ball
    const own = await api.patch(`/api/upkeep/${ball.id}`).set(me.auth).send({ resurfaceGames: 90 });
    expect(own.status).toBe(200);
    expect(own.body.item).toMatchObject({ resurface: { games: 60, interval: 90, remaining: 30, state: 'ok' }, ownIntervals: true });

    // an extraction done by hand, then a resurface: both counts restart at 0
    const done = await api.patch(`/api/upkeep/${ball.id}`).set(me.auth).send({ extractionDone: true });
    expect(done.body.item.extraction.games).toBe(0);
    const resurfaced = await api.post(`/api/arsenal/${ball.id}/surface`).set(me.auth).send({ surfaceGrit: 2000, polished: false });
    expect(resurfaced.status).toBe(200);
    await games(me.auth, sid, 14, 2, ball.id);
    expect(await upkeepOf(me.auth, ball.id)).toMatchObject({ resurface: { games: 2 }, extraction: { games: 2 } });
  });

  it('a deleted session’s games do not count; a retired ball has no reminders', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id);
    const retired = await createBall(me.user.id, undefined, { status: 'retired' });
    const sid = (await api.post('/api/sessions').set(me.auth).send({ date: today(), kind: 'practice' })).body.item.id as number;
    await games(me.auth, sid, 1, 4, ball.id);
    expect((await upkeepOf(me.auth, ball.id)).resurface.games).toBe(14);
    expect((await api.delete(`/api/sessions/${sid}`).set(me.auth)).status).toBe(204);
    expect((await upkeepOf(me.auth, ball.id)).resurface.games).toBe(10);
    expect(await upkeepOf(me.auth, retired.id)).toBeUndefined();
  });

  it('another bowler’s ball is 404; an interval outside 5–500 is 400 naming the field', async () => {
    const me = await createUser();
    const other = await createUser();
    const ball = await createBall(me.user.id);
    expect((await api.patch(`/api/upkeep/${ball.id}`).set(other.auth).send({ resurfaceGames: 80 })).status).toBe(404);
    const bad = await api.patch(`/api/upkeep/${ball.id}`).set(me.auth).send({ extractionGames: 2 });
    expect(bad.status).toBe(400);
    expect(errorOf(bad.body).fields!['body.extractionGames']).toMatch(/5 to 500/);
  });
});
