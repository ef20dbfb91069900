import { describe, expect, it } from 'vitest';
import { elsewhere, feedUp } from '../../helpers/changeFeed';
import { api, createUser } from '../../helpers/api';
import { createBall, createPattern } from '../../helpers/fixtures';
import { expandGame, logGame, randomGame, SAMPLE_GAME } from '../sessions/shotlog';

// GET /api/stats keeps each bowler's computed statistics until their shots, sessions or balls change (from any
// process: the database's change feed). A page shown again is answered from it; a change shows on the next request.

describe('GET /api/stats — kept until the shots change', () => {
  it('counts a shot logged through the API and a session deleted by another process on the very next request', async () => {
    await feedUp();
    const me = await createUser();
    const pattern = await createPattern(null);
    const ball = await createBall(me.user.id);
    const session = async (date: string) =>
      (await api.post('/api/sessions').set(me.auth).send({ date, kind: 'practice', patternId: pattern.id })).body.item.id as number;
    const s1 = await session('2026-11-10');
    await logGame(me.auth, s1, 1, SAMPLE_GAME, () => ({}), ball.id);
    const first = await api.get('/api/stats').set(me.auth);
    expect(first.status).toBe(200);
    const n1 = expandGame(SAMPLE_GAME).deliveries.length;
    expect(first.body.item.overall.shots).toBe(n1);
    expect((await api.get('/api/stats').set(me.auth)).body.item.overall).toEqual(first.body.item.overall); // answered again

    const s2 = await session('2026-11-12');
    const second = randomGame(7);
    await logGame(me.auth, s2, 1, second, () => ({}), ball.id);
    const after = await api.get('/api/stats').set(me.auth);
    expect(after.body.item.overall.shots).toBe(n1 + expandGame(second).deliveries.length);
    expect(after.body.item.trend.map((t: { sessionId: number }) => t.sessionId)).toEqual([s1, s2]);

    await elsewhere('UPDATE sessions SET deleted_at = now() WHERE id = $1', [s2]);
    const gone = await api.get('/api/stats').set(me.auth);
    expect(gone.body.item.overall.shots).toBe(n1);
    expect(gone.body.item.trend.map((t: { sessionId: number }) => t.sessionId)).toEqual([s1]);
  });

  it('is in use: a change that skipped the feed is not seen while the statistics are kept', async () => {
    await feedUp();
    const me = await createUser();
    const ball = await createBall(me.user.id);
    const s = (await api.post('/api/sessions').set(me.auth).send({ date: '2026-11-10', kind: 'practice' })).body.item.id as number;
    await logGame(me.auth, s, 1, SAMPLE_GAME, () => ({}), ball.id);
    const kept = (await api.get('/api/stats').set(me.auth)).body.item.overall.shots as number;
    await elsewhere(
      `BEGIN; ALTER TABLE sessions DISABLE TRIGGER sessions_notify_change; UPDATE sessions SET deleted_at = now() WHERE id = ${Number(s)};
      ALTER TABLE sessions ENABLE TRIGGER sessions_notify_change; COMMIT`,
      [],
    );
    expect((await api.get('/api/stats').set(me.auth)).body.item.overall.shots).toBe(kept);
    await elsewhere('UPDATE balls SET nickname = $1 WHERE id = $2', ['Heard', ball.id]);
    expect((await api.get('/api/stats').set(me.auth)).body.item.overall.shots).toBe(0);
  });
});
