import { describe, expect, it } from 'vitest';
import { scoreGame, scorePartialGame } from '../../../engine/index';
import { Shot } from '../../../server/models/index';
import { api, createUser, errorOf } from '../../helpers/api';
import { createBall, POLISHED_PEARL } from '../../helpers/fixtures';
import { expandGame, logGame, newKey, randomGame, SAMPLE_GAME } from './shotlog';

const today = () => new Date().toISOString().slice(0, 10);

async function sessionOf(auth: { Authorization: string }): Promise<number> {
  return (await api.post('/api/sessions').set(auth).send({ date: today(), kind: 'practice' })).body.item.id as number;
}

const post = (auth: { Authorization: string }, sessionId: number, body: Record<string, unknown>, key: string | null = newKey()) => {
  const req = api.post(`/api/sessions/${sessionId}/shots`).set(auth);
  return key === null ? req.send(body) : req.set('Idempotency-Key', key).send(body);
};

interface FrameView {
  runningTotal: number | null;
  deliveries: { symbol: string; split: boolean; pins: number }[];
}

describe('logged games score as scoreGame does', () => {
  it('a full game with strikes, spares, a split and a tenth-frame fill: the frame sheet equals scoreGame, frame by frame', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id);
    const sid = await sessionOf(me.auth);
    const { rolls, deliveries } = expandGame(SAMPLE_GAME);
    // Part way through, the running totals are scorePartialGame's.
    for (const [i, d] of deliveries.entries()) {
      const res = await post(me.auth, sid, { gameNumber: 1, ballId: ball.id, ...d, feetBoard: 20, targetBoard: 11 });
      expect(res.status).toBe(201);
      const partial = scorePartialGame(rolls.slice(0, i + 1));
      expect(res.body.game.number).toBe(1);
      expect(res.body.game.total).toBe(partial.complete ? scoreGame(rolls).total : partial.total);
      expect(res.body.game.frames.map((f: FrameView) => f.runningTotal)).toEqual(partial.frames);
      expect(res.body.item).toMatchObject({
        sessionId: sid,
        gameNumber: 1,
        frame: d.frame,
        delivery: d.delivery,
        standing: d.standing,
        ballId: ball.id,
        feetBoard: 20,
        targetBoard: 11,
      });
    }
    const detail = await api.get(`/api/sessions/${sid}`).set(me.auth);
    expect(detail.status).toBe(200);
    const game = detail.body.item.gameViews[0];
    const expected = scoreGame(rolls);
    expect(game).toMatchObject({ number: 1, complete: true, total: expected.total, rolls, next: null });
    expect(game.frames.map((f: FrameView) => f.runningTotal)).toEqual(expected.frames);
    // Marks as a scoresheet shows them: X, spare, and the 7-10 split on frame 3's first ball.
    expect(game.frames[0].deliveries[0].symbol).toBe('X');
    expect(game.frames[1].deliveries[1].symbol).toBe('/');
    expect(game.frames[2].deliveries[0].split).toBe(true);
    expect(game.frames[6].deliveries[0].split).toBe(false);
    expect(game.frames[9].deliveries.map((d: { symbol: string }) => d.symbol)).toEqual(['X', '8', '/']);
    expect(detail.body.item).toMatchObject({ games: 1, shotCount: deliveries.length });
    expect(detail.body.item.shots).toHaveLength(deliveries.length);
    expect(detail.body.item.stats.shots).toBe(deliveries.length);
    expect(detail.body.item.stats.average).toBe(expected.total);
    expect(Array.isArray(detail.body.item.moves)).toBe(true);
  });

  it('random complete games (seeded) score exactly as scoreGame, several games in one session', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id);
    const sid = await sessionOf(me.auth);
    const seeds = [7, 19, 2026, 31337];
    for (const [i, seed] of seeds.entries()) await logGame(me.auth, sid, i + 1, randomGame(seed), () => ({}), ball.id);
    const detail = await api.get(`/api/sessions/${sid}`).set(me.auth);
    expect(detail.body.item.gameViews.map((g: { number: number }) => g.number)).toEqual([1, 2, 3, 4]);
    for (const [i, seed] of seeds.entries()) {
      const { rolls } = expandGame(randomGame(seed));
      const g = detail.body.item.gameViews[i];
      expect(g.rolls).toEqual(rolls);
      expect(g.total).toBe(scoreGame(rolls).total);
      expect(g.frames.map((f: FrameView) => f.runningTotal)).toEqual(scoreGame(rolls).frames);
    }
  });

  it('a fouled first ball counts, scores 0 and the rack is re-set (USBC playing rules: a foul counts as a delivery and scores 0)', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id);
    const sid = await sessionOf(me.auth);
    const foul = await post(me.auth, sid, { gameNumber: 1, frame: 1, delivery: 1, ballId: ball.id, standing: [10], foul: true });
    expect(foul.status).toBe(201);
    expect(foul.body.game.frames[0].deliveries[0]).toMatchObject({ foul: true, pins: 0, symbol: 'F' });
    // All ten down on the second ball after a first-ball foul is a spare.
    const spare = await post(me.auth, sid, { gameNumber: 1, frame: 1, delivery: 2, ballId: ball.id, standing: [] });
    expect(spare.status).toBe(201);
    expect(spare.body.game.frames[0].deliveries[1].symbol).toBe('/');
  });

  it('stores the ball’s surface at the time: a resurfaced ball’s later shots carry the new surface', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id, POLISHED_PEARL, { surfaceGrit: 2000, polished: false });
    const sid = await sessionOf(me.auth);
    const first = await post(me.auth, sid, { gameNumber: 1, frame: 1, delivery: 1, ballId: ball.id, standing: [10] });
    expect(first.body.item.surfaceKey).toBe('2000 grit');
    expect((await api.post(`/api/arsenal/${ball.id}/surface`).set(me.auth).send({ surfaceGrit: 4000, polished: false })).status).toBe(200);
    const second = await post(me.auth, sid, { gameNumber: 1, frame: 1, delivery: 2, ballId: ball.id, standing: [] });
    expect(second.body.item.surfaceKey).toBe('4000 grit');
    const rows = await Shot.findAll({ where: { sessionId: sid }, order: [['id', 'ASC']] });
    expect(rows.map((r) => [r.surfaceGrit, r.surfacePolished])).toEqual([
      [2000, false],
      [4000, false],
    ]);
    expect((await api.get(`/api/sessions/${sid}`).set(me.auth)).body.item.shots.map((s: { surfaceKey: string }) => s.surfaceKey)).toEqual([
      '2000 grit',
      '4000 grit',
    ]);
  });
});

describe('invalid shots are refused with a reason, and nothing is stored', () => {
  it('more pins standing than before, a delivery out of order, a delivery a frame cannot have, a game already complete', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id);
    const sid = await sessionOf(me.auth);
    const base = { gameNumber: 1, ballId: ball.id };
    expect((await post(me.auth, sid, { ...base, frame: 1, delivery: 1, standing: [7] })).status).toBe(201);

    const morePins = await post(me.auth, sid, { ...base, frame: 1, delivery: 2, standing: [7, 10] });
    expect(morePins.status).toBe(400);
    const e1 = errorOf(morePins.body);
    expect(e1.code).toBe('invalid_shot');
    expect(e1.fields?.['body.standing']).toMatch(/10/);
    expect(e1.message).toBe(e1.fields?.['body.standing']);

    const skipped = await post(me.auth, sid, { ...base, frame: 3, delivery: 1, standing: [] });
    expect(skipped.status).toBe(400);
    expect(errorOf(skipped.body).code).toBe('invalid_shot');
    expect(Object.keys(errorOf(skipped.body).fields ?? {}).join()).toMatch(/body\.(frame|delivery)/);

    // Close frame 1 with a spare, then frame 2 is a strike: it has no second or third delivery.
    expect((await post(me.auth, sid, { ...base, frame: 1, delivery: 2, standing: [] })).status).toBe(201);
    expect((await post(me.auth, sid, { ...base, frame: 2, delivery: 1, standing: [] })).status).toBe(201);
    const third = await post(me.auth, sid, { ...base, frame: 2, delivery: 3, standing: [] });
    expect(third.status).toBe(400);
    expect(errorOf(third.body).code).toBe('invalid_shot');

    // A frame that cannot exist at all fails validation on its field.
    const frame11 = await post(me.auth, sid, { ...base, frame: 11, delivery: 1, standing: [] });
    expect(frame11.status).toBe(400);
    expect(errorOf(frame11.body).fields).toHaveProperty(['body.frame']);
    const pin11 = await post(me.auth, sid, { ...base, frame: 3, delivery: 1, standing: [11, 3, 3] });
    expect(errorOf(pin11.body).fields).toHaveProperty(['body.standing.0']);
    expect(await Shot.count({ where: { sessionId: sid } })).toBe(3);

    // A finished game takes no more deliveries.
    const done = await createUser();
    const b2 = await createBall(done.user.id);
    const sid2 = await sessionOf(done.auth);
    await logGame(done.auth, sid2, 1, SAMPLE_GAME, () => ({}), b2.id);
    const after = await post(done.auth, sid2, { gameNumber: 1, ballId: b2.id, frame: 10, delivery: 3, standing: [] });
    expect(after.status).toBe(400);
    expect(errorOf(after.body).code).toBe('invalid_shot');
    // Games are numbered without gaps.
    const gap = await post(done.auth, sid2, { gameNumber: 3, ballId: b2.id, frame: 1, delivery: 1, standing: [] });
    expect(gap.status).toBe(400);
    expect(errorOf(gap.body).fields).toHaveProperty(['body.gameNumber']);
    expect((await post(done.auth, sid2, { gameNumber: 2, ballId: b2.id, frame: 1, delivery: 1, standing: [] })).status).toBe(201);
  });

  it('a ball not in my arsenal (another bowler’s, a removed one, an unknown id) is refused on ballId', async () => {
    const me = await createUser();
    const other = await createUser();
    const theirs = await createBall(other.user.id);
    const removed = await createBall(me.user.id);
    await removed.destroy();
    const sid = await sessionOf(me.auth);
    for (const ballId of [theirs.id, removed.id, 99999999]) {
      const res = await post(me.auth, sid, { gameNumber: 1, frame: 1, delivery: 1, ballId, standing: [] });
      expect(res.status).toBe(400);
      expect(errorOf(res.body)).toMatchObject({ code: 'invalid_shot', fields: { 'body.ballId': expect.stringMatching(/arsenal/) } });
    }
    expect(await Shot.count({ where: { sessionId: sid } })).toBe(0);
  });
});

describe('Idempotency-Key: a retried shot is stored once', () => {
  it('the same key again answers 200 with the first body and stores no second row; another body with that key is 409', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id);
    const sid = await sessionOf(me.auth);
    const key = newKey();
    const body = {
      gameNumber: 1,
      frame: 1,
      delivery: 1,
      ballId: ball.id,
      standing: [4, 7],
      feetBoard: 22,
      targetBoard: 12,
      breakpointBoard: 7,
      hit: 'light',
    };
    const first = await post(me.auth, sid, body, key);
    expect(first.status).toBe(201);
    const again = await post(me.auth, sid, body, key);
    expect(again.status).toBe(200);
    expect(again.body).toEqual(first.body);
    // A later shot does not change the answer a retry of the first one gets.
    expect((await post(me.auth, sid, { ...body, delivery: 2, standing: [] })).status).toBe(201);
    const late = await post(me.auth, sid, body, key);
    expect(late.status).toBe(200);
    expect(late.body).toEqual(first.body);
    expect(await Shot.count({ where: { sessionId: sid } })).toBe(2);
    const conflict = await post(me.auth, sid, { ...body, standing: [7] }, key);
    expect(conflict.status).toBe(409);
    expect(errorOf(conflict.body).code).toBe('idempotency_conflict');
    expect(await Shot.count({ where: { sessionId: sid } })).toBe(2);
  });

  it('concurrent requests with the same key make one row: one 201, the others 200 with the same shot', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id);
    const sid = await sessionOf(me.auth);
    const key = newKey();
    const body = { gameNumber: 1, frame: 1, delivery: 1, ballId: ball.id, standing: [10] };
    const all = await Promise.all(Array.from({ length: 6 }, () => post(me.auth, sid, body, key)));
    expect(all.map((r) => r.status).sort()).toEqual([200, 200, 200, 200, 200, 201]);
    expect(new Set(all.map((r) => r.body.item.id)).size).toBe(1);
    expect(await Shot.count({ where: { sessionId: sid } })).toBe(1);
    // Two different keys for the same delivery at once: one is stored, the other refused.
    const race = await Promise.all([
      post(me.auth, sid, { ...body, delivery: 2, standing: [] }),
      post(me.auth, sid, { ...body, delivery: 2, standing: [] }),
    ]);
    expect(race.map((r) => r.status).sort()).toEqual([201, 400]);
    expect(await Shot.count({ where: { sessionId: sid } })).toBe(2);
  });

  it('the database itself refuses a second row with the same key in a session', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id);
    const sid = await sessionOf(me.auth);
    const key = newKey();
    await post(me.auth, sid, { gameNumber: 1, frame: 1, delivery: 1, ballId: ball.id, standing: [] }, key);
    const row = (await Shot.findOne({ where: { sessionId: sid } }))!.get({ plain: true });
    const { id: _id, createdAt: _c, updatedAt: _u, ...copy } = row;
    await expect(Shot.create({ ...copy, gameNumber: 2 })).rejects.toThrow(/unique|Validation/i);
  });

  it('a missing or malformed key is 400 on the header, and nothing is stored', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id);
    const sid = await sessionOf(me.auth);
    const body = { gameNumber: 1, frame: 1, delivery: 1, ballId: ball.id, standing: [] };
    for (const key of [null, 'short', 'x'.repeat(101), 'has space in it']) {
      const res = await post(me.auth, sid, body, key);
      expect(res.status).toBe(400);
      expect(errorOf(res.body).fields).toHaveProperty(['headers.idempotency-key']);
    }
    expect(await Shot.count({ where: { sessionId: sid } })).toBe(0);
  });
});

describe('DELETE /api/sessions/:id/shots/:shotId (undo)', () => {
  it('removes only a game’s last delivery; an earlier one is 409; another bowler 404, anonymous 401', async () => {
    const me = await createUser();
    const other = await createUser();
    const ball = await createBall(me.user.id);
    const sid = await sessionOf(me.auth);
    const a = await post(me.auth, sid, { gameNumber: 1, frame: 1, delivery: 1, ballId: ball.id, standing: [3] });
    const b = await post(me.auth, sid, { gameNumber: 1, frame: 1, delivery: 2, ballId: ball.id, standing: [3] });
    const early = await api.delete(`/api/sessions/${sid}/shots/${a.body.item.id}`).set(me.auth);
    expect(early.status).toBe(409);
    expect(errorOf(early.body).code).toBe('not_last_shot');
    expect((await api.delete(`/api/sessions/${sid}/shots/${b.body.item.id}`).set(other.auth)).status).toBe(404);
    expect((await api.delete(`/api/sessions/${sid}/shots/${b.body.item.id}`)).status).toBe(401);
    expect((await api.delete(`/api/sessions/${sid}/shots/${b.body.item.id}`).set(me.auth)).status).toBe(204);
    expect((await api.delete(`/api/sessions/${sid}/shots/${b.body.item.id}`).set(me.auth)).status).toBe(404);
    // The undone delivery can be logged again (for instance with the right pins).
    const redo = await post(me.auth, sid, { gameNumber: 1, frame: 1, delivery: 2, ballId: ball.id, standing: [] });
    expect(redo.status).toBe(201);
    expect(redo.body.game.frames[0].deliveries[1].symbol).toBe('/');
  });
});
