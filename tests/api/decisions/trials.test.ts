import { describe, expect, it } from 'vitest';
import { probabilityBetter } from '../../../engine/index';
import { api, createUser, errorOf } from '../../helpers/api';
import { createBall, createPattern, POLISHED_PEARL } from '../../helpers/fixtures';
import { linkRow, logGame, type FrameLog } from '../sessions/shotlog';

const STRIKE_GAME: FrameLog[] = [...Array.from({ length: 9 }, () => [[]]), [[], [], []]];
/** Nine frames of a first ball leaving the 10 pin, spared, and a tenth frame the same with a strike fill ball. */
const TEN_PIN_GAME: FrameLog[] = [...Array.from({ length: 9 }, () => [[10], []]), [[10], [], []]];

async function session(auth: { Authorization: string }, date: string, patternId?: number): Promise<number> {
  const r = await api
    .post('/api/sessions')
    .set(auth)
    .send({ date, kind: 'practice', ...(patternId ? { patternId } : {}) });
  expect(r.status).toBe(201);
  return r.body.item.id as number;
}

describe('POST /api/trials', () => {
  it('refuses a trial of one ball, another bowler’s ball and a missing name, field by field', async () => {
    const me = await createUser();
    const other = await createUser();
    const mine = await createBall(me.user.id);
    const theirs = await createBall(other.user.id);
    const one = await api
      .post('/api/trials')
      .set(me.auth)
      .send({ name: 'Layouts', arms: [{ ballId: mine.id }] });
    expect(one.status).toBe(400);
    expect(errorOf(one.body).fields).toHaveProperty(['body.arms']);
    const foreign = await api
      .post('/api/trials')
      .set(me.auth)
      .send({ name: 'Layouts', arms: [{ ballId: mine.id }, { ballId: theirs.id }] });
    expect(foreign.status).toBe(400);
    expect(errorOf(foreign.body).fields).toEqual({ 'body.arms.1.ballId': 'Not a ball in this arsenal' });
    const unnamed = await api
      .post('/api/trials')
      .set(me.auth)
      .send({ name: ' ', arms: [{ ballId: mine.id }, { ballId: mine.id, surfaceKey: '4000 grit' }] });
    expect(unnamed.status).toBe(400);
    expect(errorOf(unnamed.body).fields).toHaveProperty(['body.name']);
    // a NUL or a text-direction control is refused on its field (a JSONB column cannot even hold the NUL)
    const nul = await api
      .post('/api/trials')
      .set(me.auth)
      .send({ name: 'Layouts', arms: [{ ballId: mine.id }, { ballId: mine.id, surfaceKey: '\u0000' }] });
    expect(nul.status).toBe(400);
    expect(errorOf(nul.body).fields).toHaveProperty(['body.arms.1.surfaceKey']);
    const twice = await api
      .post('/api/trials')
      .set(me.auth)
      .send({ name: 'Same', arms: [{ ballId: mine.id }, { ballId: mine.id }] });
    expect(twice.status).toBe(400);
    expect((await api.get('/api/trials').set(me.auth)).body.items).toEqual([]);
  });
});

describe('GET /api/trials/:id: the comparison of two layouts', () => {
  it('counts each arm’s shots since the start on the trial’s pattern, gives a clear verdict on a large difference after one game each, and says “not enough shots yet” for an arm with no shots', async () => {
    const me = await createUser();
    const pattern = await createPattern(null);
    const a = await createBall(me.user.id);
    const b = await createBall(me.user.id);
    await api
      .patch(`/api/arsenal/${a.id}`)
      .set(me.auth)
      .send({ version: a.version, layout: { pinToPapIn: 4.375, drillingAngleDeg: 50, valAngleDeg: 40 } })
      .expect(200);
    await api
      .patch(`/api/arsenal/${b.id}`)
      .set(me.auth)
      .send({ version: b.version, layout: { pinToPapIn: 2, drillingAngleDeg: 70 } })
      .expect(200);
    // shots before the trial and on another pattern do not count
    const before = await session(me.auth, '2026-11-01', pattern.id);
    await logGame(me.auth, before, 1, STRIKE_GAME, () => ({}), b.id);
    const created = await api
      .post('/api/trials')
      .set(me.auth)
      .send({ name: 'Pin up or pin down', patternId: pattern.id, startDate: '2026-11-10', arms: [{ ballId: a.id }, { ballId: b.id }] });
    expect(created.status).toBe(201);
    const trialId = created.body.item.id as number;
    expect(created.body.item.arms.map((x: { label: string }) => x.label)).toEqual([a.name, b.name]);
    const elsewhere = await session(me.auth, '2026-11-11', (await createPattern(null)).id);
    await logGame(me.auth, elsewhere, 1, STRIKE_GAME, () => ({}), b.id);

    const s1 = await session(me.auth, '2026-11-12', pattern.id);
    await logGame(
      me.auth,
      s1,
      1,
      STRIKE_GAME,
      (d) => (d.delivery === 1 && d.frame < 10 ? { feetBoard: 20, targetBoard: 12, breakpointBoard: 8, hit: 'pocket' } : {}),
      a.id,
    );
    await logGame(
      me.auth,
      s1,
      2,
      TEN_PIN_GAME,
      (d) => (d.delivery === 1 && d.frame < 10 ? { feetBoard: 20, targetBoard: 12, breakpointBoard: 6, hit: 'light' } : {}),
      b.id,
    );
    const early = await api.get(`/api/trials/${trialId}`).set(me.auth);
    expect(early.status).toBe(200);
    const [armA, armB] = early.body.item.comparison.arms;
    // counted by hand: game 1 has 12 first balls at a full rack, all strikes; game 2 has 10 first balls (one a frame) plus
    // the strike fill ball in the tenth (a full rack again), 1 strike in 11, and nine 10-pin leaves plus the tenth's
    expect(armA.strike).toMatchObject({ hits: 12, n: 12 });
    expect(armB.strike).toMatchObject({ hits: 1, n: 11 });
    expect(armB.pocketCorner).toMatchObject({ pin: 10, hits: 10 });
    expect(armA.breakpoint.mean).toBe(8);
    expect(armA.predictedVsObserved.predictedBoard).toEqual(expect.any(Number));
    const verdict = early.body.item.comparison.verdict;
    expect(verdict.probability).toBeCloseTo(probabilityBetter({ hits: 12, n: 12 }, { hits: 1, n: 11 }), 9);
    expect(verdict.kind).toBe('clear');

    // with only a few shots for one arm the verdict is "not enough shots yet"
    const few = await api
      .post('/api/trials')
      .set(me.auth)
      .send({
        name: 'Too early',
        patternId: pattern.id,
        startDate: '2026-11-12',
        arms: [{ ballId: a.id }, { ballId: b.id, surfaceKey: '4000 grit' }],
      });
    const fewRes = await api.get(`/api/trials/${few.body.item.id}`).set(me.auth);
    expect(fewRes.body.item.comparison.arms[1].strike.n).toBe(0);
    expect(fewRes.body.item.comparison.verdict.kind).toBe('not-enough');
    expect(fewRes.body.item.comparison.verdict.text).toMatch(/^Not enough shots yet/);
  });

  it('a linked coach reads the student’s trial and opens one for them; another bowler gets 404, and only the bowler deletes', async () => {
    const student = await createUser();
    const coach = await createUser('coach');
    const stranger = await createUser();
    await linkRow(coach.user.id, student.user);
    const ball = await createBall(student.user.id);
    const pearl = await createBall(student.user.id, POLISHED_PEARL);
    const byCoach = await api
      .post('/api/trials')
      .set(coach.auth)
      .send({ name: 'Solid or pearl', studentId: student.user.id, arms: [{ ballId: ball.id }, { ballId: pearl.id }] });
    expect(byCoach.status).toBe(201);
    expect(byCoach.body.item).toMatchObject({ userId: student.user.id, createdBy: coach.user.id });
    const id = byCoach.body.item.id as number;
    expect((await api.get(`/api/trials/${id}`).set(student.auth)).status).toBe(200);
    expect((await api.get(`/api/trials/${id}`).set(coach.auth)).status).toBe(200);
    expect((await api.get(`/api/trials/${id}`).set(stranger.auth)).status).toBe(404);
    expect((await api.get(`/api/trials?studentId=${student.user.id}`).set(stranger.auth)).status).toBe(404);
    expect((await api.delete(`/api/trials/${id}`).set(stranger.auth)).status).toBe(404);
    const own = await api
      .post('/api/trials')
      .set(student.auth)
      .send({ name: 'Mine', arms: [{ ballId: ball.id }, { ballId: pearl.id }] });
    expect((await api.delete(`/api/trials/${own.body.item.id}`).set(coach.auth)).status).toBe(403);
    expect((await api.delete(`/api/trials/${own.body.item.id}`).set(student.auth)).status).toBe(204);
    expect((await api.get(`/api/trials`).set(student.auth)).body.items.map((t: { id: number }) => t.id)).toEqual([id]);
  });
});
