import { describe, expect, it } from 'vitest';
import { Ball, SurfaceEvent } from '../../../server/models/index';
import { api, createUser, errorOf } from '../../helpers/api';
import { createBall, createModel, POLISHED_PEARL } from '../../helpers/fixtures';

const HAND_ENTERED = {
  name: 'Garage Find',
  weightLb: 14,
  rg: 2.55,
  differential: 0.04,
  intermediateDifferential: 0,
  coverType: 'reactive-hybrid',
  coreType: 'symmetric',
  surfaceGrit: 3000,
  polished: false,
  layout: { pinToPapIn: 4, drillingAngleDeg: 50 },
};

describe('POST /api/arsenal', () => {
  it('adds a ball from the catalogue, copying its specs and factory surface, with a first surface event', async () => {
    const me = await createUser();
    const m = await createModel(POLISHED_PEARL);
    const res = await api
      .post('/api/arsenal')
      .set(me.auth)
      .send({ ballModelId: m.id, weightLb: 15, nickname: 'Shiny', layout: { pinToPapIn: 3.5, drillingAngleDeg: 60 } });
    expect(res.status).toBe(201);
    expect(res.body.item).toMatchObject({
      ballModelId: m.id,
      name: m.name,
      rg: 2.56,
      coverType: 'reactive-pearl',
      surfaceGrit: 5000,
      polished: true,
      weightLb: 15,
      nickname: 'Shiny',
      gamesSinceResurface: 0,
      status: 'active',
    });
    const row = await Ball.findByPk(res.body.item.id);
    expect(row!.ownerId).toBe(me.user.id);
    expect(await SurfaceEvent.count({ where: { ballId: row!.id } })).toBe(1);
  });

  it('adds a hand-entered ball', async () => {
    const me = await createUser();
    const res = await api.post('/api/arsenal').set(me.auth).send(HAND_ENTERED);
    expect(res.status).toBe(201);
    expect(res.body.item).toMatchObject({
      ballModelId: null,
      name: 'Garage Find',
      surfaceGrit: 3000,
      layout: { pinToPapIn: 4, drillingAngleDeg: 50 },
    });
  });

  it('refuses bad specs by field and an unknown catalogue id, saving nothing', async () => {
    const me = await createUser();
    const bad = await api
      .post('/api/arsenal')
      .set(me.auth)
      .send({ ...HAND_ENTERED, weightLb: -1, surfaceGrit: 0, coverType: 'rubber' });
    expect(bad.status).toBe(400);
    const fields = errorOf(bad.body).fields ?? {};
    for (const f of ['body.weightLb', 'body.surfaceGrit', 'body.coverType']) expect(fields).toHaveProperty([f]);
    const unknown = await api.post('/api/arsenal').set(me.auth).send({ ballModelId: 99999999, weightLb: 15 });
    expect(unknown.status).toBe(400);
    expect(errorOf(unknown.body).fields).toHaveProperty(['body.ballModelId']);
    expect(await Ball.count({ where: { ownerId: me.user.id } })).toBe(0);
  });
});

describe('GET /api/arsenal', () => {
  it('lists only my balls, with total, filters and paging', async () => {
    const me = await createUser();
    const other = await createUser();
    const a = await createBall(me.user.id);
    const b = await createBall(me.user.id, POLISHED_PEARL);
    await createBall(other.user.id);
    const res = await api.get('/api/arsenal').set(me.auth);
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(2);
    expect(res.body.items.map((x: { id: number }) => x.id).sort()).toEqual([a.id, b.id].sort());
    const pearls = await api.get('/api/arsenal').query({ coverType: 'reactive-pearl' }).set(me.auth);
    expect(pearls.body.items.map((x: { id: number }) => x.id)).toEqual([b.id]);
    const paged = await api.get('/api/arsenal').query({ pageSize: 1, page: 2, sort: 'createdAt' }).set(me.auth);
    expect(paged.body.items.map((x: { id: number }) => x.id)).toEqual([b.id]);
    expect(paged.body.total).toBe(2);
  });
});

describe('one ball', () => {
  it("answers 404 for another bowler's ball on every route, changing nothing", async () => {
    const me = await createUser();
    const other = await createUser();
    const theirs = await createBall(other.user.id);
    expect((await api.get(`/api/arsenal/${theirs.id}`).set(me.auth)).status).toBe(404);
    expect((await api.patch(`/api/arsenal/${theirs.id}`).set(me.auth).send({ version: theirs.version, nickname: 'mine now' })).status).toBe(
      404,
    );
    expect((await api.post(`/api/arsenal/${theirs.id}/surface`).set(me.auth).send({ surfaceGrit: 500, polished: false })).status).toBe(404);
    expect((await api.delete(`/api/arsenal/${theirs.id}`).set(me.auth)).status).toBe(404);
    const row = await Ball.findByPk(theirs.id);
    expect(row).toMatchObject({ nickname: null, surfaceGrit: theirs.surfaceGrit, deletedAt: null });
  });

  it('answers 400 for a malformed id', async () => {
    const me = await createUser();
    const res = await api.get('/api/arsenal/abc').set(me.auth);
    expect(res.status).toBe(400);
    expect(errorOf(res.body).fields).toHaveProperty(['params.id']);
  });

  it('edits with the current version, and a stale version gets 409 without changing the row', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id);
    const ok = await api
      .patch(`/api/arsenal/${ball.id}`)
      .set(me.auth)
      .send({ version: ball.version, nickname: 'Tank', layout: { pinToPapIn: 5, drillingAngleDeg: 40, valAngleDeg: 45 } });
    expect(ok.status).toBe(200);
    expect(ok.body.item.version).toBe(ball.version + 1);
    const stale = await api.patch(`/api/arsenal/${ball.id}`).set(me.auth).send({ version: ball.version, nickname: 'Lost edit' });
    expect(stale.status).toBe(409);
    expect(errorOf(stale.body).code).toBe('stale_version');
    expect((await Ball.findByPk(ball.id))!.nickname).toBe('Tank');
  });

  it('deletes softly and restores (undo)', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id);
    expect((await api.delete(`/api/arsenal/${ball.id}`).set(me.auth)).status).toBe(204);
    expect((await api.get('/api/arsenal').set(me.auth)).body.total).toBe(0);
    expect((await Ball.findByPk(ball.id, { paranoid: false }))!.deletedAt).not.toBeNull();
    const back = await api.post(`/api/arsenal/${ball.id}/restore`).set(me.auth);
    expect(back.status).toBe(200);
    expect((await api.get('/api/arsenal').set(me.auth)).body.total).toBe(1);
  });

  it('records a new surface as an event and resets games since resurface', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id, undefined, { surfaceGrit: 2000, polished: false });
    const res = await api
      .post(`/api/arsenal/${ball.id}/surface`)
      .set(me.auth)
      .send({ surfaceGrit: 4000, polished: false, note: 'For the fresh house shot' });
    expect(res.status).toBe(200);
    expect(res.body.item).toMatchObject({ surfaceGrit: 4000, polished: false, gamesSinceResurface: 0 });
    const history = res.body.item.surfaceHistory;
    expect(history).toHaveLength(2);
    expect(history[1]).toMatchObject({
      fromGrit: 2000,
      fromPolished: false,
      toGrit: 4000,
      toPolished: false,
      note: 'For the fresh house shot',
    });
    const detail = await api.get(`/api/arsenal/${ball.id}`).set(me.auth);
    expect(detail.body.item.surfaceHistory).toHaveLength(2);
    const bad = await api.post(`/api/arsenal/${ball.id}/surface`).set(me.auth).send({ surfaceGrit: 0 });
    expect(bad.status).toBe(400);
    expect(Object.keys(errorOf(bad.body).fields ?? {}).sort()).toEqual(['body.polished', 'body.surfaceGrit']);
  });
});

describe('POST /api/arsenal/import', () => {
  const header =
    'name,nickname,weightLb,coverType,coreType,rg,differential,intermediateDifferential,surfaceGrit,polished,pinToPapIn,drillingAngleDeg';

  it('imports all rows of a good file', async () => {
    const me = await createUser();
    const csv = `${header}\nOld Faithful,,15,urethane,symmetric,2.62,0.02,0,2000,no,5,45\nSpare One,Spare,14,plastic,symmetric,2.7,0.008,0,5000,yes,,\n`;
    const res = await api
      .post('/api/arsenal/import')
      .set(me.auth)
      .attach('file', Buffer.from(csv), { filename: 'arsenal.csv', contentType: 'text/csv' });
    expect(res.status).toBe(201);
    expect(res.body.imported).toBe(2);
    expect(await Ball.count({ where: { ownerId: me.user.id } })).toBe(2);
  });

  it('reports each bad row by line and imports nothing', async () => {
    const me = await createUser();
    const csv = `${header}\nGood Row,,15,urethane,symmetric,2.62,0.02,0,2000,no,5,45\nBad Weight,,heavy,urethane,symmetric,2.62,0.02,0,2000,no,5,45\nBad Cover,,15,granite,symmetric,2.62,0.02,0,2000,no,5,45\n`;
    const res = await api
      .post('/api/arsenal/import')
      .set(me.auth)
      .attach('file', Buffer.from(csv), { filename: 'arsenal.csv', contentType: 'text/csv' });
    expect(res.status).toBe(400);
    const fields = errorOf(res.body).fields ?? {};
    expect(Object.keys(fields).some((k) => k.startsWith('rows.3.'))).toBe(true);
    expect(Object.keys(fields).some((k) => k.startsWith('rows.4.'))).toBe(true);
    expect(Object.keys(fields).some((k) => k.startsWith('rows.2.'))).toBe(false);
    expect(await Ball.count({ where: { ownerId: me.user.id } })).toBe(0);
  });

  it('reads pin-to-PAP as a pro shop writes it ("4 3/8", "4-3/8", "3 3/8" or a decimal) and refuses other text by line', async () => {
    const me = await createUser();
    const rows = [
      ['Mixed', '4 3/8'],
      ['Dashed', '4-3/8'],
      ['Small', '3 3/8'],
      ['Decimal', '4.5'],
    ];
    const csv = `${header}\n${rows.map(([n, pin]) => `${n},,15,reactive-solid,symmetric,2.5,0.05,0,2000,no,"${pin}",45`).join('\n')}\n`;
    const res = await api
      .post('/api/arsenal/import')
      .set(me.auth)
      .attach('file', Buffer.from(csv), { filename: 'arsenal.csv', contentType: 'text/csv' });
    expect(res.status).toBe(201);
    const pins = Object.fromEntries((await Ball.findAll({ where: { ownerId: me.user.id } })).map((b) => [b.name, b.layout?.pinToPapIn]));
    expect(pins).toEqual({ Mixed: 4.375, Dashed: 4.375, Small: 3.375, Decimal: 4.5 });

    const other = await createUser();
    const bad = `${header}\nFine,,15,urethane,symmetric,2.62,0.02,0,2000,no,4 1/2,45\nWords,,15,urethane,symmetric,2.62,0.02,0,2000,no,four and a bit,45\nZero,,15,urethane,symmetric,2.62,0.02,0,2000,no,4 3/0,45\nLong,,15,urethane,symmetric,2.62,0.02,0,2000,no,7 1/8,45\n`;
    const refused = await api
      .post('/api/arsenal/import')
      .set(other.auth)
      .attach('file', Buffer.from(bad), { filename: 'arsenal.csv', contentType: 'text/csv' });
    expect(refused.status).toBe(400);
    const fields = errorOf(refused.body).fields ?? {};
    expect(Object.keys(fields).sort()).toEqual(['rows.3.layout.pinToPapIn', 'rows.4.layout.pinToPapIn', 'rows.5.layout.pinToPapIn']);
    expect(fields['rows.3.layout.pinToPapIn']).toMatch(/write 4 3\/8, 4-3\/8 or 4\.375/);
    expect(fields['rows.5.layout.pinToPapIn']).toMatch(/At most 6\.7 in/);
    expect(await Ball.count({ where: { ownerId: other.user.id } })).toBe(0);
  });
});
