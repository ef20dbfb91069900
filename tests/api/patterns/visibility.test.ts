import { describe, expect, it } from 'vitest';
import { Center, Pattern } from '../../../server/models/index';
import { api, createUser, errorOf, uniqueMarker } from '../../helpers/api';
import { LONG_HEAVY, SHORT_LIGHT } from '../../helpers/fixtures';

const importFile = (auth: Record<string, string>, name: string, sweeps = SHORT_LIGHT, onConflict?: string) =>
  api
    .post('/api/patterns/import')
    .query(onConflict ? { onConflict } : {})
    .set(auth)
    .attach('file', Buffer.from(JSON.stringify({ format: 'lanewright-pattern', version: 1, name, sweeps })), {
      filename: 'p.json',
      contentType: 'application/json',
    });

describe('pattern visibility', () => {
  it('a new pattern is a draft: 404 to a bowler and another coach (read, list, export, matchup), seen by its owner and an admin', async () => {
    const coach = await createUser('coach');
    const bowler = await createUser('bowler');
    const other = await createUser('coach');
    const admin = await createUser('admin');
    const name = uniqueMarker('Draft Drill');
    const res = await api.post('/api/patterns').set(coach.auth).send({ name, sweeps: SHORT_LIGHT });
    expect(res.status).toBe(201);
    expect(res.body.item).toMatchObject({ visibility: 'draft', centerId: null, ownerName: coach.user.displayName });
    const id = res.body.item.id as number;
    expect((await Pattern.findByPk(id))!.visibility).toBe('draft');
    for (const who of [bowler, other]) {
      const get = await api.get(`/api/patterns/${id}`).set(who.auth);
      expect(get.status).toBe(404);
      expect(errorOf(get.body).code).toBe('not_found');
      expect((await api.get(`/api/patterns/${id}/export`).set(who.auth)).status).toBe(404);
      expect((await api.get('/api/patterns').query({ q: name }).set(who.auth)).body.total).toBe(0);
      expect((await api.post(`/api/patterns/${id}/duplicate`).set(other.auth)).status).toBe(404);
    }
    const matchup = await api.post('/api/matchups').set(bowler.auth).send({ patternId: id });
    expect(matchup.status).toBe(404);
    expect((await api.patch(`/api/patterns/${id}`).set(other.auth).send({ version: 0, name: 'Mine now' })).status).toBe(404);
    for (const who of [coach, admin]) {
      expect((await api.get(`/api/patterns/${id}`).set(who.auth)).status).toBe(200);
      expect((await api.get('/api/patterns').query({ q: name }).set(who.auth)).body.items.map((p: { id: number }) => p.id)).toEqual([id]);
    }
    // Published, everybody sees it.
    const pub = await api.patch(`/api/patterns/${id}`).set(coach.auth).send({ version: res.body.item.version, visibility: 'published' });
    expect(pub.status).toBe(200);
    expect((await api.get(`/api/patterns/${id}`).set(bowler.auth)).status).toBe(200);
  });

  it('a shared pattern is seen by the staff of its center only; shared needs a center', async () => {
    const owner = await createUser('proprietor');
    const staff = await createUser('proprietor');
    const elsewhere = await createUser('proprietor');
    const center = await Center.create({ name: uniqueMarker('Share Lanes'), town: 'Testford', laneCount: 8, ownerId: staff.user.id });
    const noCenter = await api
      .post('/api/patterns')
      .set(owner.auth)
      .send({ name: uniqueMarker('Shared'), sweeps: SHORT_LIGHT, visibility: 'shared' });
    expect(noCenter.status).toBe(400);
    expect(errorOf(noCenter.body).fields).toHaveProperty(['body.centerId']);
    const res = await api
      .post('/api/patterns')
      .set(owner.auth)
      .send({ name: uniqueMarker('Shared'), sweeps: SHORT_LIGHT, visibility: 'shared', centerId: center.id });
    expect(res.status).toBe(201);
    const id = res.body.item.id as number;
    expect((await api.get(`/api/patterns/${id}`).set(staff.auth)).status).toBe(200);
    expect((await api.get(`/api/patterns/${id}`).set(elsewhere.auth)).status).toBe(404);
    // The staff may publish it on their lanes; another proprietor may not name it.
    const today = new Date().toISOString().slice(0, 10);
    const published = await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(staff.auth)
      .send({ patternId: id, lanes: [1, 2], validFrom: today });
    expect(published.status).toBe(201);
  });

  it('names are unique per owner: create 409; an import asks to rename or replace', async () => {
    const coach = await createUser('coach');
    const other = await createUser('coach');
    const name = uniqueMarker('Same Name');
    expect((await api.post('/api/patterns').set(coach.auth).send({ name, sweeps: SHORT_LIGHT })).status).toBe(201);
    const again = await api.post('/api/patterns').set(coach.auth).send({ name: name.toUpperCase(), sweeps: SHORT_LIGHT });
    expect(again.status).toBe(409);
    expect(errorOf(again.body)).toMatchObject({ code: 'name_taken', fields: { 'body.name': expect.any(String) } });
    expect((await api.post('/api/patterns').set(other.auth).send({ name, sweeps: SHORT_LIGHT })).status).toBe(201);

    const asked = await importFile(coach.auth, name, LONG_HEAVY);
    expect(asked.status).toBe(409);
    expect(errorOf(asked.body).fields).toMatchObject({ suggestedName: `${name} (2)` });
    expect(await Pattern.count({ where: { ownerId: coach.user.id } })).toBe(1);

    const renamed = await importFile(coach.auth, name, LONG_HEAVY, 'rename');
    expect(renamed.status).toBe(201);
    expect(renamed.body.item).toMatchObject({ name: `${name} (2)`, visibility: 'draft' });

    const original = await Pattern.findOne({ where: { ownerId: coach.user.id, name } });
    const replaced = await importFile(coach.auth, name, LONG_HEAVY, 'replace');
    expect(replaced.status).toBe(200);
    expect(replaced.body.item).toMatchObject({ id: original!.id, name, sweeps: LONG_HEAVY });
    expect(await Pattern.count({ where: { ownerId: coach.user.id } })).toBe(2);
    const badChoice = await importFile(coach.auth, name, LONG_HEAVY, 'merge');
    expect(badChoice.status).toBe(400);
    expect(errorOf(badChoice.body).fields).toHaveProperty(['query.onConflict']);
  });
});
