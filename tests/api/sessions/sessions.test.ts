import { describe, expect, it } from 'vitest';
import { BowlingSession, Condition } from '../../../server/models/index';
import { api, createUser, errorOf } from '../../helpers/api';
import { createBall, createCenter, createPattern } from '../../helpers/fixtures';
import { expandGame, linkRow, logGame, newKey, SAMPLE_GAME } from './shotlog';

const today = () => new Date().toISOString().slice(0, 10);

/** The owner, another bowler, a linked coach, an unlinked coach and a coach whose link was revoked. */
async function cast() {
  const owner = await createUser();
  const other = await createUser();
  const coach = await createUser('coach');
  const stranger = await createUser('coach');
  const former = await createUser('coach');
  await linkRow(coach.user.id, owner.user);
  const revoked = await linkRow(former.user.id, owner.user);
  await revoked.update({ status: 'revoked', revokedAt: new Date(), revokedBy: owner.user.id });
  return { owner, other, coach, stranger, former };
}

describe('POST /api/sessions', () => {
  it('creates a session on a published condition, taking its center and pattern; the row is stored', async () => {
    const me = await createUser();
    const prop = await createUser('proprietor');
    const center = await createCenter(prop.user.id);
    const pattern = await createPattern(prop.user.id);
    const cond = await Condition.create({
      centerId: center.id,
      patternId: pattern.id,
      patternName: pattern.name,
      sweeps: pattern.sweeps,
      summary: pattern.summary,
      lanes: [1, 2],
      validFrom: today(),
      validTo: null,
      notes: null,
      publishedAt: new Date(),
      publishedBy: prop.user.id,
    });
    const res = await api
      .post('/api/sessions')
      .set(me.auth)
      .send({ date: '2026-11-30', kind: 'practice', conditionId: cond.id, notes: 'Working on the 10 pin' });
    expect(res.status).toBe(201);
    expect(res.body.item).toMatchObject({
      userId: me.user.id,
      date: '2026-11-30',
      kind: 'practice',
      centerId: center.id,
      centerName: center.name,
      conditionId: cond.id,
      patternId: pattern.id,
      patternName: pattern.name,
      notes: 'Working on the 10 pin',
      games: 0,
      shots: 0,
    });
    const row = await BowlingSession.findByPk(res.body.item.id);
    expect(row).toMatchObject({ userId: me.user.id, centerId: center.id, patternId: pattern.id });
  });

  it('refuses bad input by field: date, kind, unknown center, condition and pattern, unknown fields', async () => {
    const me = await createUser();
    const bad = await api.post('/api/sessions').set(me.auth).send({ date: '30/11/2026', kind: 'open-play', extra: 1 });
    expect(bad.status).toBe(400);
    expect(Object.keys(errorOf(bad.body).fields ?? {})).toEqual(expect.arrayContaining(['body.date', 'body.kind']));
    for (const field of ['centerId', 'conditionId', 'patternId']) {
      const res = await api
        .post('/api/sessions')
        .set(me.auth)
        .send({ date: today(), kind: 'league', [field]: 99999999 });
      expect(res.status).toBe(400);
      expect(errorOf(res.body).fields).toHaveProperty([`body.${field}`]);
    }
    expect((await api.post('/api/sessions').send({ date: today(), kind: 'league' })).status).toBe(401);
  });
});

describe('reading sessions: owner, linked coach, others', () => {
  it('GET /api/sessions/:id answers the owner and the linked coach; another bowler, an unlinked coach and a revoked coach get 404; no sign-in 401', async () => {
    const { owner, other, coach, stranger, former } = await cast();
    const s = (await api.post('/api/sessions').set(owner.auth).send({ date: today(), kind: 'practice' })).body.item;
    expect((await api.get(`/api/sessions/${s.id}`).set(owner.auth)).status).toBe(200);
    const seen = await api.get(`/api/sessions/${s.id}`).set(coach.auth);
    expect(seen.status).toBe(200);
    expect(seen.body.item).toMatchObject({
      id: s.id,
      owner: { id: owner.user.id, displayName: owner.user.displayName },
      gameViews: [],
      shots: [],
      annotations: [],
    });
    for (const who of [other, stranger, former]) {
      const res = await api.get(`/api/sessions/${s.id}`).set(who.auth);
      expect(res.status).toBe(404);
      expect(errorOf(res.body).code).toBe('not_found');
    }
    expect((await api.get(`/api/sessions/${s.id}`)).status).toBe(401);
    expect((await api.get('/api/sessions/not-a-number').set(owner.auth)).status).toBe(400);
  });

  it('a link that is revoked later closes the door again', async () => {
    const owner = await createUser();
    const coach = await createUser('coach');
    const link = await linkRow(coach.user.id, owner.user);
    const s = (await api.post('/api/sessions').set(owner.auth).send({ date: today(), kind: 'practice' })).body.item;
    expect((await api.get(`/api/sessions/${s.id}`).set(coach.auth)).status).toBe(200);
    expect((await api.get(`/api/sessions?studentId=${owner.user.id}`).set(coach.auth)).status).toBe(200);
    await link.update({ status: 'revoked' });
    expect((await api.get(`/api/sessions/${s.id}`).set(coach.auth)).status).toBe(404);
    expect((await api.get(`/api/sessions?studentId=${owner.user.id}`).set(coach.auth)).status).toBe(404);
  });

  it('GET /api/sessions lists my sessions newest first with counts, paginated; studentId for a linked coach only', async () => {
    const { owner, other, coach, stranger, former } = await cast();
    const ball = await createBall(owner.user.id);
    const ids: number[] = [];
    for (const date of ['2026-11-01', '2026-11-03', '2026-11-02'])
      ids.push((await api.post('/api/sessions').set(owner.auth).send({ date, kind: 'practice' })).body.item.id);
    await logGame(owner.auth, ids[1], 1, SAMPLE_GAME, () => ({}), ball.id);
    const page1 = await api.get('/api/sessions?page=1&pageSize=2').set(owner.auth);
    expect(page1.status).toBe(200);
    expect(page1.body).toMatchObject({ total: 3, page: 1, pageSize: 2 });
    expect(page1.body.items.map((s: { date: string }) => s.date)).toEqual(['2026-11-03', '2026-11-02']);
    expect(page1.body.items[0]).toMatchObject({ id: ids[1], games: 1, shots: expandGame(SAMPLE_GAME).deliveries.length });
    const page2 = await api.get('/api/sessions?page=2&pageSize=2').set(owner.auth);
    expect(page2.body.items.map((s: { id: number }) => s.id)).toEqual([ids[0]]);
    expect((await api.get('/api/sessions?page=9&pageSize=2').set(owner.auth)).body).toMatchObject({ items: [], total: 3 });
    // Nobody else's sessions show in my list.
    expect((await api.get('/api/sessions').set(other.auth)).body.total).toBe(0);
    const asCoach = await api.get(`/api/sessions?studentId=${owner.user.id}`).set(coach.auth);
    expect(asCoach.status).toBe(200);
    expect(asCoach.body.total).toBe(3);
    for (const who of [other, stranger, former])
      expect((await api.get(`/api/sessions?studentId=${owner.user.id}`).set(who.auth)).status).toBe(404);
    expect((await api.get('/api/sessions?pageSize=1000').set(owner.auth)).status).toBe(400);
    expect((await api.get('/api/sessions')).status).toBe(401);
  });
});

describe('changing sessions: owner only', () => {
  it('PATCH edits notes, kind and date; the linked coach gets 403, others 404, anonymous 401', async () => {
    const { owner, other, coach, stranger, former } = await cast();
    const s = (await api.post('/api/sessions').set(owner.auth).send({ date: today(), kind: 'practice' })).body.item;
    const ok = await api
      .patch(`/api/sessions/${s.id}`)
      .set(owner.auth)
      .send({ notes: 'Lanes hooked early', kind: 'league', date: '2026-11-28' });
    expect(ok.status).toBe(200);
    expect(ok.body.item).toMatchObject({ notes: 'Lanes hooked early', kind: 'league', date: '2026-11-28' });
    expect((await api.patch(`/api/sessions/${s.id}`).set(coach.auth).send({ notes: 'x' })).status).toBe(403);
    for (const who of [other, stranger, former])
      expect((await api.patch(`/api/sessions/${s.id}`).set(who.auth).send({ notes: 'x' })).status).toBe(404);
    expect((await api.patch(`/api/sessions/${s.id}`).send({ notes: 'x' })).status).toBe(401);
    const bad = await api.patch(`/api/sessions/${s.id}`).set(owner.auth).send({ kind: 'bumper' });
    expect(errorOf(bad.body).fields).toHaveProperty(['body.kind']);
    expect((await BowlingSession.findByPk(s.id))!.notes).toBe('Lanes hooked early');
  });

  it('DELETE is a soft delete: gone from the list, GET 404, the row kept; restore brings it back; others cannot delete', async () => {
    const { owner, other, coach } = await cast();
    const s = (await api.post('/api/sessions').set(owner.auth).send({ date: today(), kind: 'practice' })).body.item;
    expect((await api.delete(`/api/sessions/${s.id}`).set(other.auth)).status).toBe(404);
    expect((await api.delete(`/api/sessions/${s.id}`).set(coach.auth)).status).toBe(403);
    expect((await api.delete(`/api/sessions/${s.id}`)).status).toBe(401);
    expect((await api.delete(`/api/sessions/${s.id}`).set(owner.auth)).status).toBe(204);
    expect((await api.get(`/api/sessions/${s.id}`).set(owner.auth)).status).toBe(404);
    expect((await api.get('/api/sessions').set(owner.auth)).body.total).toBe(0);
    const row = await BowlingSession.findByPk(s.id, { paranoid: false });
    expect(row?.deletedAt).toBeInstanceOf(Date);
    expect((await api.post(`/api/sessions/${s.id}/restore`).set(other.auth)).status).toBe(404);
    const back = await api.post(`/api/sessions/${s.id}/restore`).set(owner.auth);
    expect(back.status).toBe(200);
    expect((await api.get(`/api/sessions/${s.id}`).set(owner.auth)).status).toBe(200);
  });
});

describe('POST /api/sessions/:id/annotations', () => {
  it('the owner and the linked coach annotate (shown on the session); others 404; bad input 400', async () => {
    const { owner, other, coach, stranger, former } = await cast();
    const s = (await api.post('/api/sessions').set(owner.auth).send({ date: today(), kind: 'practice' })).body.item;
    const note = await api
      .post(`/api/sessions/${s.id}/annotations`)
      .set(coach.auth)
      .send({ text: 'Stay behind the ball on the 10 pin', gameNumber: 1, frame: 3 });
    expect(note.status).toBe(201);
    expect(note.body.item).toMatchObject({
      sessionId: s.id,
      authorId: coach.user.id,
      authorName: coach.user.displayName,
      gameNumber: 1,
      frame: 3,
      text: 'Stay behind the ball on the 10 pin',
    });
    expect((await api.post(`/api/sessions/${s.id}/annotations`).set(owner.auth).send({ text: 'Felt good' })).status).toBe(201);
    for (const who of [other, stranger, former])
      expect((await api.post(`/api/sessions/${s.id}/annotations`).set(who.auth).send({ text: 'hi' })).status).toBe(404);
    expect((await api.post(`/api/sessions/${s.id}/annotations`).send({ text: 'hi' })).status).toBe(401);
    const bad = await api.post(`/api/sessions/${s.id}/annotations`).set(owner.auth).send({ text: '', frame: 11 });
    expect(Object.keys(errorOf(bad.body).fields ?? {}).sort()).toEqual(['body.frame', 'body.text']);
    const detail = await api.get(`/api/sessions/${s.id}`).set(owner.auth);
    expect(detail.body.item.annotations.map((a: { text: string }) => a.text)).toEqual(['Stay behind the ball on the 10 pin', 'Felt good']);
  });

  it('a shot cannot be logged by the coach (403) nor by another bowler (404)', async () => {
    const { owner, other, coach } = await cast();
    const ball = await createBall(owner.user.id);
    const s = (await api.post('/api/sessions').set(owner.auth).send({ date: today(), kind: 'practice' })).body.item;
    const body = { gameNumber: 1, frame: 1, delivery: 1, ballId: ball.id, standing: [] };
    expect((await api.post(`/api/sessions/${s.id}/shots`).set(coach.auth).set('Idempotency-Key', newKey()).send(body)).status).toBe(403);
    expect((await api.post(`/api/sessions/${s.id}/shots`).set(other.auth).set('Idempotency-Key', newKey()).send(body)).status).toBe(404);
    expect((await api.post(`/api/sessions/${s.id}/shots`).set('Idempotency-Key', newKey()).send(body)).status).toBe(401);
  });
});
