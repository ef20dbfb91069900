import { PDFParse } from 'pdf-parse';
import { describe, expect, it } from 'vitest';
import { Op } from 'sequelize';
import { capturedMail } from '../../../server/dev/mailCapture';
import { requeuePendingMail } from '../../../server/lib/outbox';
import { Condition, Follow, MailOutbox } from '../../../server/models/index';
import { api, createUser, errorOf } from '../../helpers/api';
import { createCenter, createPattern, LONG_HEAVY, SHORT_LIGHT } from '../../helpers/fixtures';
import { waitForMail } from '../../helpers/mail';
import { waitFor } from '../../helpers/wait';

const today = () => new Date().toISOString().slice(0, 10);

/** One center as the public list shows it, read page by page (the list has no search: it holds every center there is). */
async function inCenterList(
  id: number,
  auth: { Authorization: string } | Record<string, never> = {},
): Promise<Record<string, unknown> | undefined> {
  for (let page = 1; ; page += 1) {
    const res = await api.get('/api/centers').query({ page, pageSize: 100 }).set(auth);
    expect(res.status).toBe(200);
    const hit = res.body.items.find((c: { id: number }) => c.id === id);
    if (hit || page * 100 >= res.body.total) return hit;
  }
}
const daysFromNow = (d: number) => new Date(Date.now() + d * 86400000).toISOString().slice(0, 10);

describe('publishing a condition', () => {
  it('lets the center’s proprietor publish; a bowler and another center’s proprietor get 403 and nothing is stored', async () => {
    const owner = await createUser('proprietor');
    const rival = await createUser('proprietor');
    const bowler = await createUser();
    const center = await createCenter(owner.user.id);
    await createCenter(rival.user.id);
    const pattern = await createPattern(owner.user.id, LONG_HEAVY);
    const body = { patternId: pattern.id, lanes: [1, 2, 3], validFrom: today() };
    expect((await api.post(`/api/centers/${center.id}/conditions`).set(bowler.auth).send(body)).status).toBe(403);
    expect((await api.post(`/api/centers/${center.id}/conditions`).set(rival.auth).send(body)).status).toBe(403);
    expect((await api.post(`/api/centers/${center.id}/conditions`).send(body)).status).toBe(401);
    expect(await Condition.count({ where: { centerId: center.id } })).toBe(0);
    const ok = await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({ ...body, notes: 'Fresh oil' });
    expect(ok.status).toBe(201);
    expect(ok.body.item).toMatchObject({
      centerId: center.id,
      lanes: [1, 2, 3],
      validFrom: today(),
      validTo: null,
      notes: 'Fresh oil',
      pattern: { id: pattern.id, name: pattern.name, summary: pattern.summary },
    });
  });

  it('refuses lanes the center does not have, an end before the start and an unknown pattern, by field', async () => {
    const owner = await createUser('proprietor');
    const center = await createCenter(owner.user.id, 12);
    const pattern = await createPattern(owner.user.id);
    const lanes = await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: pattern.id, lanes: [11, 12, 13], validFrom: today() });
    expect(lanes.status).toBe(400);
    expect(errorOf(lanes.body).fields).toHaveProperty(['body.lanes']);
    const dates = await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: pattern.id, lanes: [1], validFrom: today(), validTo: daysFromNow(-3) });
    expect(errorOf(dates.body).fields).toHaveProperty(['body.validTo']);
    const unknown = await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: 99999999, lanes: [1], validFrom: today() });
    expect(errorOf(unknown.body).fields).toHaveProperty(['body.patternId']);
    expect(await Condition.count({ where: { centerId: center.id } })).toBe(0);
  });

  it('keeps history immutable: a correction is a new publication, the old one unchanged and marked superseded, and the database refuses an UPDATE', async () => {
    const owner = await createUser('proprietor');
    const center = await createCenter(owner.user.id);
    const first = await createPattern(owner.user.id, LONG_HEAVY);
    const second = await createPattern(owner.user.id, SHORT_LIGHT);
    const a = (
      await api
        .post(`/api/centers/${center.id}/conditions`)
        .set(owner.auth)
        .send({ patternId: first.id, lanes: [1, 2], validFrom: today() })
    ).body.item;
    // The pattern is edited after publishing: the publication keeps its snapshot.
    await api.patch(`/api/patterns/${first.id}`).set(owner.auth).send({ version: first.version, sweeps: SHORT_LIGHT });
    const b = (
      await api
        .post(`/api/centers/${center.id}/conditions`)
        .set(owner.auth)
        .send({ patternId: second.id, lanes: [1, 2, 3], validFrom: today() })
    ).body.item;
    const history = await api.get(`/api/centers/${center.id}/conditions`);
    expect(history.status).toBe(200);
    expect(history.body.total).toBe(2);
    expect(history.body.items.map((c: { id: number }) => c.id)).toEqual([b.id, a.id]);
    expect(history.body.items[1]).toMatchObject({ id: a.id, supersededBy: b.id, pattern: { sweeps: LONG_HEAVY, summary: first.summary } });
    await expect(Condition.update({ notes: 'rewritten' }, { where: { id: a.id } })).rejects.toThrow(/immutable/);
    expect((await Condition.findByPk(a.id))!.notes).toBeNull();
  });
});

describe('the lane surface of a condition', () => {
  it('is published with the condition, stored, and shown by the current condition, the history and the sheet, in words', async () => {
    const owner = await createUser('proprietor');
    const center = await createCenter(owner.user.id);
    const pattern = await createPattern(owner.user.id, LONG_HEAVY);
    const res = await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: pattern.id, lanes: [1, 2], validFrom: today(), lane: { kind: 'wood', friction: 'high' } });
    expect(res.status).toBe(201);
    expect(res.body.item).toMatchObject({ lane: { kind: 'wood', friction: 'high' }, laneText: 'Wood lanes, high friction' });
    const row = (await Condition.findByPk(res.body.item.id))!;
    expect([row.laneKind, row.laneFriction]).toEqual(['wood', 'high']);
    const current = await api.get(`/api/centers/${center.id}/conditions/current`);
    expect(current.body).toMatchObject({
      lane: { kind: 'wood', friction: 'high' },
      laneText: 'Wood lanes, high friction',
      condition: { lane: { kind: 'wood', friction: 'high' } },
    });
    expect((await api.get(`/api/centers/${center.id}/conditions`)).body.items[0]).toMatchObject({ laneText: 'Wood lanes, high friction' });
    const pdf = await api
      .get(`/api/centers/${center.id}/conditions/current.pdf`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    const parser = new PDFParse({ data: new Uint8Array(pdf.body as Buffer) });
    const { text } = await parser.getText();
    await parser.destroy();
    expect(text.replace(/\s+/g, ' ')).toContain('Lane surface: Wood lanes, high friction');
  });

  it('defaults to synthetic lanes with medium friction, and refuses an unknown kind or friction by field, storing nothing', async () => {
    const owner = await createUser('proprietor');
    const center = await createCenter(owner.user.id);
    const pattern = await createPattern(owner.user.id);
    const plain = await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: pattern.id, lanes: [1], validFrom: today() });
    expect(plain.body.item).toMatchObject({
      lane: { kind: 'synthetic', friction: 'medium' },
      laneText: 'Synthetic lanes, medium friction',
    });
    const bad = await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: pattern.id, lanes: [1], validFrom: today(), lane: { kind: 'maple', friction: 'extreme' } });
    expect(bad.status).toBe(400);
    expect(errorOf(bad.body).fields).toMatchObject({
      'body.lane.kind': 'The lanes are wood or synthetic',
      'body.lane.friction': 'Lane friction is low, medium or high',
    });
    const missing = await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: pattern.id, lanes: [1], validFrom: today(), lane: { kind: 'wood' } });
    expect(errorOf(missing.body).fields).toHaveProperty(['body.lane.friction']);
    expect(await Condition.count({ where: { centerId: center.id } })).toBe(1);
  });

  it('the follower e-mail names the lane surface', async () => {
    const owner = await createUser('proprietor');
    const center = await createCenter(owner.user.id);
    const pattern = await createPattern(owner.user.id);
    const fan = await createUser();
    await api.post(`/api/centers/${center.id}/follow`).set(fan.auth);
    await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: pattern.id, lanes: [1], validFrom: today(), lane: { kind: 'synthetic', friction: 'low' } });
    expect((await waitForMail(fan.user.email)).text).toContain('Synthetic lanes, low friction.');
  });
});

describe('the public current condition', () => {
  it('answers without sign-in with the center, lanes, dates, notes and the pattern summary', async () => {
    const owner = await createUser('proprietor');
    const center = await createCenter(owner.user.id);
    const pattern = await createPattern(owner.user.id, LONG_HEAVY);
    await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: pattern.id, lanes: [5, 6], validFrom: daysFromNow(-1), validTo: daysFromNow(5), notes: 'League night' });
    // A future publication is not yet current.
    await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: pattern.id, lanes: [5], validFrom: daysFromNow(10) });
    const res = await api.get(`/api/centers/${center.id}/conditions/current`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      center: { id: center.id, name: center.name },
      lanes: [5, 6],
      validFrom: daysFromNow(-1),
      validTo: daysFromNow(5),
      notes: 'League night',
    });
    expect(res.body.pattern.summary.volumeMl).toBeCloseTo(pattern.summary.volumeMl, 9);
    expect(res.body.pattern.sweeps).toEqual(LONG_HEAVY);
  });

  it('answers 404 no_condition when nothing is in force, 404 for an unknown center, 400 for a malformed id', async () => {
    const center = await createCenter(null);
    const none = await api.get(`/api/centers/${center.id}/conditions/current`);
    expect(none.status).toBe(404);
    expect(errorOf(none.body).code).toBe('no_condition');
    expect((await api.get('/api/centers/99999999/conditions/current')).status).toBe(404);
    expect((await api.get('/api/centers/abc/conditions/current')).status).toBe(400);
  });

  it('prints a valid PDF sheet holding the pattern’s name and numbers', async () => {
    const owner = await createUser('proprietor');
    const center = await createCenter(owner.user.id);
    const pattern = await createPattern(owner.user.id, LONG_HEAVY);
    await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: pattern.id, lanes: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12], validFrom: today(), notes: 'Stripped nightly' });
    const res = await api
      .get(`/api/centers/${center.id}/conditions/current.pdf`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const pdf = res.body as Buffer;
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const parser = new PDFParse({ data: new Uint8Array(pdf) });
    const { text } = await parser.getText();
    await parser.destroy();
    const flat = text.replace(/\s+/g, ' ');
    expect(flat).toContain(center.name);
    expect(flat).toContain(pattern.name);
    expect(flat).toContain(`${pattern.summary.lengthFt} ft`);
    expect(flat).toContain(`${pattern.summary.volumeMl.toFixed(2)} mL`);
    expect(flat).toContain('Lanes 1–12');
    expect(flat).toContain('Stripped nightly');
  });
});

describe('followers', () => {
  it('each follower receives exactly one e-mail per publication, through the outbox and SMTP; a non-follower none', async () => {
    const owner = await createUser('proprietor');
    const center = await createCenter(owner.user.id);
    const pattern = await createPattern(owner.user.id);
    const f1 = await createUser();
    const f2 = await createUser();
    const outsider = await createUser();
    expect((await api.post(`/api/centers/${center.id}/follow`).set(f1.auth)).body).toEqual({ following: true });
    await api.post(`/api/centers/${center.id}/follow`).set(f2.auth);
    await api.post(`/api/centers/${center.id}/follow`).set(f2.auth); // twice: still one follow
    expect(await Follow.count({ where: { centerId: center.id } })).toBe(2);
    const pub = await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: pattern.id, lanes: [1], validFrom: today() });
    expect(pub.status).toBe(201);
    const m1 = await waitForMail(f1.user.email);
    await waitForMail(f2.user.email);
    // Every message of this publication is sent (none left for a retry), and the sweep for unsent mail finds nothing.
    const ofThis = { ref: { [Op.like]: `${pub.body.item.id}:%` } };
    await waitFor(
      () => MailOutbox.count({ where: { ...ofThis, status: { [Op.ne]: 'sent' } } }),
      (n) => n === 0,
    );
    expect(await MailOutbox.count({ where: ofThis })).toBe(2);
    expect(await requeuePendingMail()).toBe(0);
    expect(capturedMail().filter((m) => m.to.includes(f1.user.email))).toHaveLength(1);
    expect(capturedMail().filter((m) => m.to.includes(f2.user.email))).toHaveLength(1);
    expect(capturedMail().filter((m) => m.to.includes(outsider.user.email))).toHaveLength(0);
    expect(m1.subject).toContain(center.name);
    expect(m1.text).toContain(pattern.name);
    expect(await MailOutbox.count({ where: { ref: `${pub.body.item.id}:${f1.user.id}`, status: 'sent' } })).toBe(1);

    // The unsubscribe link opens a page that asks first; its POST works without sign-in, once.
    const link = /\/unsubscribe\?token=([\w-]+)/.exec(m1.text);
    expect(link).not.toBeNull();
    expect((await api.get(`/api/unsubscribe?token=${link![1]}`)).status).toBe(303);
    expect(await Follow.count({ where: { centerId: center.id, userId: f1.user.id } })).toBe(1);
    const un = await api.post('/api/unsubscribe').send({ token: link![1] });
    expect(un.status).toBe(200);
    expect(un.body.center).toBe(center.name);
    expect(await Follow.count({ where: { centerId: center.id, userId: f1.user.id } })).toBe(0);
    expect((await api.post('/api/unsubscribe').send({ token: link![1] })).status).toBe(404);
  });

  it('lists my followed centers with their current condition, and unfollow removes one', async () => {
    const owner = await createUser('proprietor');
    const center = await createCenter(owner.user.id);
    const pattern = await createPattern(owner.user.id);
    const me = await createUser();
    await api.post(`/api/centers/${center.id}/follow`).set(me.auth);
    await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: pattern.id, lanes: [1], validFrom: today() });
    const list = await api.get('/api/follows').set(me.auth);
    expect(list.status).toBe(200);
    expect(list.body.items).toHaveLength(1);
    expect(list.body.items[0]).toMatchObject({ center: { id: center.id, following: true }, current: { pattern: { id: pattern.id } } });
    expect((await api.delete(`/api/centers/${center.id}/follow`).set(me.auth)).body).toEqual({ following: false });
    expect((await api.get('/api/follows').set(me.auth)).body.items).toEqual([]);
    expect((await api.post('/api/centers/99999999/follow').set(me.auth)).status).toBe(404);
    expect((await api.get('/api/follows')).status).toBe(401);
  });

  it('gives each followed center its own newest condition in force (none where nothing is published)', async () => {
    const owner = await createUser('proprietor');
    const a = await createCenter(owner.user.id);
    const b = await createCenter(owner.user.id);
    const empty = await createCenter(owner.user.id);
    const p1 = await createPattern(owner.user.id, LONG_HEAVY);
    const p2 = await createPattern(owner.user.id, SHORT_LIGHT);
    const me = await createUser();
    for (const c of [a, b, empty]) await api.post(`/api/centers/${c.id}/follow`).set(me.auth);
    await api
      .post(`/api/centers/${a.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: p2.id, lanes: [1], validFrom: today() });
    await api
      .post(`/api/centers/${a.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: p1.id, lanes: [1], validFrom: today() });
    await api
      .post(`/api/centers/${b.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: p2.id, lanes: [1], validFrom: today() });
    const items = (await api.get('/api/follows').set(me.auth)).body.items as {
      center: { id: number };
      current: { pattern: { id: number } } | null;
    }[];
    const byCenter = new Map(items.map((i) => [i.center.id, i.current?.pattern.id ?? null]));
    expect(byCenter).toEqual(
      new Map([
        [a.id, p1.id],
        [b.id, p2.id],
        [empty.id, null],
      ]),
    );
  });

  it('lists every publication still in force at a followed center with the lanes it still governs, newest first', async () => {
    const owner = await createUser('proprietor');
    const center = await createCenter(owner.user.id, 8);
    const house = await createPattern(owner.user.id, LONG_HEAVY);
    const league = await createPattern(owner.user.id, SHORT_LIGHT);
    const me = await createUser();
    await api.post(`/api/centers/${center.id}/follow`).set(me.auth);
    const a = (
      await api
        .post(`/api/centers/${center.id}/conditions`)
        .set(owner.auth)
        .send({ patternId: house.id, lanes: [1, 2, 3, 4, 5, 6, 7, 8], validFrom: today(), lane: { kind: 'synthetic', friction: 'high' } })
    ).body.item;
    const b = (
      await api
        .post(`/api/centers/${center.id}/conditions`)
        .set(owner.auth)
        .send({ patternId: league.id, lanes: [1, 2, 3, 4], validFrom: today() })
    ).body.item;
    // Replaced everywhere it was: no longer listed.
    await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: league.id, lanes: [5], validFrom: daysFromNow(-3), validTo: daysFromNow(-1) });
    const [item] = (await api.get('/api/follows').set(me.auth)).body.items;
    expect(item.current.id).toBe(b.id);
    expect(
      item.inForce.map((x: { condition: { id: number; laneText: string }; lanes: number[] }) => [
        x.condition.id,
        x.lanes,
        x.condition.laneText,
      ]),
    ).toEqual([
      [b.id, [1, 2, 3, 4], 'Synthetic lanes, medium friction'],
      [a.id, [5, 6, 7, 8], 'Synthetic lanes, high friction'],
    ]);
  });

  it('retries a failed delivery on a doubling schedule capped at one hour', async () => {
    const { backoffMs } = await import('../../../server/lib/outbox');
    expect([1, 2, 3, 4].map(backoffMs)).toEqual([5000, 10000, 20000, 40000]);
    expect(backoffMs(50)).toBe(3600000);
  });
});

describe('centers', () => {
  it('lists centers publicly, and with a token says which I follow', async () => {
    const center = await createCenter(null);
    const other = await createCenter(null);
    const me = await createUser();
    await api.post(`/api/centers/${center.id}/follow`).set(me.auth);
    const mine = await inCenterList(center.id);
    expect(mine).toMatchObject({ id: center.id, name: center.name });
    expect(mine).not.toHaveProperty('following');
    expect(await inCenterList(center.id, me.auth)).toMatchObject({ id: center.id, following: true });
    expect(await inCenterList(other.id, me.auth)).toMatchObject({ id: other.id, following: false });
  });

  it('lets only an admin create a center and assign a proprietor; the proprietor sees it among theirs', async () => {
    const admin = await createUser('admin');
    const prop = await createUser('proprietor');
    const bowler = await createUser();
    expect((await api.post('/api/centers').set(prop.auth).send({ name: 'Mine', town: 'X', laneCount: 8 })).status).toBe(403);
    const notProp = await api
      .post('/api/centers')
      .set(admin.auth)
      .send({ name: 'Bad Owner', town: 'X', laneCount: 8, ownerId: bowler.user.id });
    expect(notProp.status).toBe(400);
    const res = await api
      .post('/api/centers')
      .set(admin.auth)
      .send({ name: 'Brine Street Lanes', town: 'Quayside', laneCount: 8, ownerId: prop.user.id });
    expect(res.status).toBe(201);
    const mine = await api.get('/api/centers/mine').set(prop.auth);
    expect(mine.body.items.map((c: { id: number }) => c.id)).toContain(res.body.item.id);
    expect((await api.get('/api/centers/mine').set(bowler.auth)).status).toBe(403);
  });
});
