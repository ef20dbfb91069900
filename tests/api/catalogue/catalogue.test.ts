import { describe, expect, it } from 'vitest';
import { BallModel } from '../../../server/models/index';
import { api, createUser, errorOf, uniqueMarker } from '../../helpers/api';
import { createModel, PLASTIC, POLISHED_PEARL } from '../../helpers/fixtures';

const CSV_HEADER =
  'maker,name,coverType,coreType,rg,differential,intermediateDifferential,factoryGrit,factoryPolished,hardnessD,releaseYear';

describe('GET /api/catalogue', () => {
  it('filters by cover type, RG and differential ranges and text, paged', async () => {
    const { auth } = await createUser();
    // Both models carry one marker and every query asks for it: the answers hold these two and nothing else.
    const tag = uniqueMarker('Filter');
    const pearl = await createModel(POLISHED_PEARL, `${tag} Pearl`);
    const plastic = await createModel(PLASTIC, `${tag} Plastic`);
    const res = await api
      .get('/api/catalogue')
      .query({ coverType: 'reactive-pearl', rgMin: 2.55, rgMax: 2.57, diffMin: 0.03, diffMax: 0.04, q: tag })
      .set(auth);
    expect(res.status).toBe(200);
    expect(res.body.items.map((m: { id: number }) => m.id)).toEqual([pearl.id]);
    expect(res.body.total).toBe(1);
    expect((await api.get('/api/catalogue').query({ q: tag, rgMin: 2.6 }).set(auth)).body.items.map((m: { id: number }) => m.id)).toEqual([
      plastic.id,
    ]);
    // Paged by RG, highest first: the plastic (2.70) on page 1, the pearl (2.56) on page 2.
    const page = await api.get('/api/catalogue').query({ q: tag, pageSize: 1, page: 2, sort: 'rg', order: 'desc' }).set(auth);
    expect(page.body).toMatchObject({ total: 2, page: 2, pageSize: 1 });
    expect(page.body.items.map((m: { id: number }) => m.id)).toEqual([pearl.id]);
  });

  it('refuses a non-numeric range and an unknown cover type by field', async () => {
    const { auth } = await createUser();
    const res = await api.get('/api/catalogue').query({ rgMin: 'low', coverType: 'wood' }).set(auth);
    expect(res.status).toBe(400);
    expect(Object.keys(errorOf(res.body).fields ?? {}).sort()).toEqual(['query.coverType', 'query.rgMin']);
  });

  it('gives one model by id, 404 for an unknown one', async () => {
    const { auth } = await createUser();
    const m = await createModel(PLASTIC);
    const res = await api.get(`/api/catalogue/${m.id}`).set(auth);
    expect(res.status).toBe(200);
    expect(res.body.item).toMatchObject({ id: m.id, name: m.name, coverType: 'plastic', rg: 2.7 });
    expect((await api.get('/api/catalogue/99999999').set(auth)).status).toBe(404);
  });

  it('needs sign-in', async () => {
    expect((await api.get('/api/catalogue')).status).toBe(401);
  });
});

describe('catalogue editing (admin)', () => {
  it('creates and edits a model; a stale version gets 409', async () => {
    const admin = await createUser('admin');
    const created = await api
      .post('/api/catalogue')
      .set(admin.auth)
      .send({ maker: 'Test Foundry', name: uniqueMarker('Edit Me'), ...POLISHED_PEARL });
    expect(created.status).toBe(201);
    const { id, version } = created.body.item;
    const edit = await api.patch(`/api/catalogue/${id}`).set(admin.auth).send({ version, differential: 0.04 });
    expect(edit.status).toBe(200);
    expect((await BallModel.findByPk(id))!.differential).toBe(0.04);
    const stale = await api.patch(`/api/catalogue/${id}`).set(admin.auth).send({ version, differential: 0.041 });
    expect(stale.status).toBe(409);
    expect(errorOf(stale.body).code).toBe('stale_version');
    expect((await BallModel.findByPk(id))!.differential).toBe(0.04);
  });

  it('refuses a bowler (403) and bad specs (400 by field)', async () => {
    const bowler = await createUser();
    expect(
      (
        await api
          .post('/api/catalogue')
          .set(bowler.auth)
          .send({ maker: 'x', name: 'y', ...PLASTIC })
      ).status,
    ).toBe(403);
    const admin = await createUser('admin');
    const bad = await api
      .post('/api/catalogue')
      .set(admin.auth)
      .send({ maker: '', name: 'y', ...PLASTIC, rg: 9, coverType: 'glass' });
    expect(bad.status).toBe(400);
    expect(Object.keys(errorOf(bad.body).fields ?? {}).sort()).toEqual(['body.coverType', 'body.maker', 'body.rg']);
  });
});

describe('POST /api/catalogue/import', () => {
  it('imports every row of a good CSV', async () => {
    const admin = await createUser('admin');
    const t = uniqueMarker('Batch');
    const csv = `${CSV_HEADER}\nTest Foundry,Import A ${t},reactive-solid,asymmetric,2.49,0.052,0.015,2000,false,76,2026\nTest Foundry,Import B ${t},plastic,symmetric,2.7,0.008,,5000,true,83,\n`;
    const res = await api
      .post('/api/catalogue/import')
      .set(admin.auth)
      .attach('file', Buffer.from(csv), { filename: 'models.csv', contentType: 'text/csv' });
    expect(res.status).toBe(201);
    expect(res.body.imported).toBe(2);
    expect(await BallModel.count({ where: { name: [`Import A ${t}`, `Import B ${t}`] } })).toBe(2);
  });

  it('reports each bad row by line and imports nothing', async () => {
    const admin = await createUser('admin');
    const t = uniqueMarker('Batch');
    const csv = `${CSV_HEADER}\nTest Foundry,Good ${t},reactive-solid,asymmetric,2.49,0.052,0.015,2000,false,76,2026\nTest Foundry,Bad RG ${t},reactive-solid,symmetric,abc,0.05,0,2000,false,76,2026\n,No Maker ${t},glass,symmetric,2.5,0.05,0,2000,false,76,2026\n`;
    const res = await api
      .post('/api/catalogue/import')
      .set(admin.auth)
      .attach('file', Buffer.from(csv), { filename: 'models.csv', contentType: 'text/csv' });
    expect(res.status).toBe(400);
    const e = errorOf(res.body);
    expect(e.code).toBe('csv_invalid_rows');
    expect(Object.keys(e.fields ?? {}).sort()).toEqual(['rows.3.rg', 'rows.4.coverType', 'rows.4.maker']);
    expect(await BallModel.count({ where: { name: [`Good ${t}`, `Bad RG ${t}`, `No Maker ${t}`] } })).toBe(0);
  });

  it('refuses a file that is not CSV, and a missing file', async () => {
    const admin = await createUser('admin');
    const png = await api
      .post('/api/catalogue/import')
      .set(admin.auth)
      .attach('file', Buffer.from([0x89, 0x50, 0x4e, 0x47]), { filename: 'photo.png', contentType: 'image/png' });
    expect(png.status).toBe(400);
    expect(errorOf(png.body).code).toBe('unsupported_file');
    const none = await api.post('/api/catalogue/import').set(admin.auth);
    expect(none.status).toBe(400);
  });

  it('refuses a bowler with 403', async () => {
    const b = await createUser();
    const res = await api
      .post('/api/catalogue/import')
      .set(b.auth)
      .attach('file', Buffer.from(`${CSV_HEADER}\n`), { filename: 'm.csv', contentType: 'text/csv' });
    expect(res.status).toBe(403);
  });
});
