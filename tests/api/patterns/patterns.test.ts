import { describe, expect, it } from 'vitest';
import { analyzePattern, oilAt } from '../../../engine/index';
import { Pattern } from '../../../server/models/index';
import { api, createUser, errorOf, uniqueMarker } from '../../helpers/api';
import { createPattern, LONG_HEAVY, SHORT_LIGHT } from '../../helpers/fixtures';

describe('GET /api/patterns', () => {
  it('lists patterns with their summary, filterable by class', async () => {
    const me = await createUser();
    // Both patterns carry one marker and the list is asked for it: the answer holds these two and nothing else.
    const tag = uniqueMarker('Class Filter');
    const long = await createPattern(null, LONG_HEAVY, `${tag} long`);
    const short = await createPattern(null, SHORT_LIGHT, `${tag} short`);
    const both = await api.get('/api/patterns').query({ q: tag }).set(me.auth);
    expect(both.status).toBe(200);
    expect(both.body).toMatchObject({ total: 2, page: 1 });
    expect(both.body.items.map((p: { id: number }) => p.id)).toEqual([long.id, short.id]);
    expect(both.body.items[0].summary).toEqual(long.summary);
    const res = await api.get('/api/patterns').query({ q: tag, lengthClass: 'long' }).set(me.auth);
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(1);
    expect(res.body.items.map((p: { id: number; summary: { lengthClass: string } }) => [p.id, p.summary.lengthClass])).toEqual([
      [long.id, 'long'],
    ]);
    const shortOnes = await api.get('/api/patterns').query({ q: tag, lengthClass: 'short' }).set(me.auth);
    expect(shortOnes.body.items.map((p: { id: number }) => p.id)).toEqual([short.id]);
  });

  it('gives one pattern with its sweeps, the engine summary and an oil grid', async () => {
    const me = await createUser();
    const p = await createPattern(null, LONG_HEAVY);
    const res = await api.get(`/api/patterns/${p.id}`).set(me.auth);
    expect(res.status).toBe(200);
    const a = analyzePattern({ name: p.name, sweeps: LONG_HEAVY });
    expect(res.body.item.summary).toEqual({ ...a });
    expect(res.body.item.sweeps).toEqual(LONG_HEAVY);
    const { boards, ft, values } = res.body.item.grid;
    expect(boards).toHaveLength(39);
    const bi = boards.indexOf(20);
    const fi = ft.indexOf(10);
    expect(values[bi][fi]).toBeCloseTo(oilAt({ name: p.name, sweeps: LONG_HEAVY }, 20, 10), 9);
  });

  it('answers 404 for an unknown pattern and 400 for a malformed id', async () => {
    const me = await createUser();
    expect((await api.get('/api/patterns/99999999').set(me.auth)).status).toBe(404);
    expect((await api.get('/api/patterns/x').set(me.auth)).status).toBe(400);
  });
});

describe('pattern editing', () => {
  it('lets a coach create a pattern; the stored summary is the engine’s', async () => {
    const coach = await createUser('coach');
    const res = await api.post('/api/patterns').set(coach.auth).send({ name: 'Coach Drill', sweeps: SHORT_LIGHT });
    expect(res.status).toBe(201);
    const row = await Pattern.findByPk(res.body.item.id);
    expect(row!.ownerId).toBe(coach.user.id);
    expect(row!.summary.lengthFt).toBe(analyzePattern({ name: 'x', sweeps: SHORT_LIGHT }).lengthFt);
  });

  it('refuses a bowler with 403', async () => {
    const b = await createUser();
    expect((await api.post('/api/patterns').set(b.auth).send({ name: 'Nope', sweeps: SHORT_LIGHT })).status).toBe(403);
  });

  it('refuses a sweep ending before it starts, board 41 and zero crossings, by field', async () => {
    const coach = await createUser('coach');
    const res = await api
      .post('/api/patterns')
      .set(coach.auth)
      .send({
        name: 'Broken',
        sweeps: [{ direction: 'forward', fromBoard: 41, toBoard: 10, startFt: 30, endFt: 12, crossings: 0, microlitersPerBoard: 50 }],
      });
    expect(res.status).toBe(400);
    const fields = errorOf(res.body).fields ?? {};
    expect(fields).toHaveProperty(['body.sweeps.0.fromBoard']);
    expect(fields).toHaveProperty(['body.sweeps.0.crossings']);
  });

  it('refuses oil past the headpin (60 ft) with 400, not 500', async () => {
    const coach = await createUser('coach');
    const res = await api
      .post('/api/patterns')
      .set(coach.auth)
      .send({
        name: 'Too Long',
        sweeps: [{ direction: 'forward', fromBoard: 2, toBoard: 38, startFt: 0, endFt: 65, crossings: 2, microlitersPerBoard: 50 }],
      });
    expect(res.status).toBe(400);
    expect(errorOf(res.body).fields).toHaveProperty(['body.sweeps.0.endFt']);
  });

  it('lets only the owner (or an admin) edit, and a stale version gets 409', async () => {
    const owner = await createUser('proprietor');
    const other = await createUser('coach');
    const admin = await createUser('admin');
    const p = await createPattern(owner.user.id, SHORT_LIGHT);
    expect((await api.patch(`/api/patterns/${p.id}`).set(other.auth).send({ version: p.version, name: 'Taken' })).status).toBe(403);
    const ok = await api.patch(`/api/patterns/${p.id}`).set(owner.auth).send({ version: p.version, sweeps: LONG_HEAVY });
    expect(ok.status).toBe(200);
    expect(ok.body.item.summary.lengthClass).toBe('long');
    const stale = await api.patch(`/api/patterns/${p.id}`).set(admin.auth).send({ version: p.version, name: 'Late' });
    expect(stale.status).toBe(409);
    expect((await Pattern.findByPk(p.id))!.name).toBe(p.name);
  });
});
