import { parse as parseCsv } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { Ball, BowlerProfile, CoachLink, Order, Pattern, PaymentEvent } from '../../../server/models/index';
import { config } from '../../../server/config/index';
import { api, createUser, errorOf } from '../../helpers/api';
import { createBall, createPattern } from '../../helpers/fixtures';
import { event, paymentObjects, placeOrder, postWebhook, sendEvent, shopWorld, signature } from '../shop/shopHelpers';

/** Findings 7, 8, 12, 13 and 14 (photos): each shown against the real database over HTTP. */

describe('finding 7: concurrent first profile saves', () => {
  it('20 parallel first saves of a new account: no 5xx, one row, the last save stands', async () => {
    const { user, auth } = await createUser();
    const answers = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        api
          .put('/api/profile')
          .set(auth)
          .send({ speedMph: 15 + i / 10, revRpm: 300 + i }),
      ),
    );
    expect(answers.map((r) => r.status).filter((s) => s >= 500)).toEqual([]);
    expect(answers.every((r) => r.status === 200)).toBe(true);
    expect(await BowlerProfile.count({ where: { userId: user.id } })).toBe(1);
    const row = (await BowlerProfile.findByPk(user.id))!;
    expect(row.version).toBe(19);
    expect((await api.get('/api/profile').set(auth)).body.profile.revRpm).toBe(row.revRpm);
  });
});

describe('finding 8: coaching invitations', () => {
  it('the answer and the coach’s list show nothing of the invitee before acceptance, whether the address has an account or not', async () => {
    const coach = await createUser('coach');
    const student = await createUser();
    const known = await api.post('/api/coach/invitations').set(coach.auth).send({ email: student.user.email });
    const unknown = await api
      .post('/api/coach/invitations')
      .set(coach.auth)
      .send({ email: `nobody-${Date.now()}@example.test` });
    for (const r of [known, unknown]) {
      expect(r.status).toBe(201);
      expect(r.body.item.student).toBeNull();
      expect(JSON.stringify(r.body)).not.toContain(student.user.displayName);
      expect(Object.keys(r.body.item).sort()).toEqual(['acceptedAt', 'coach', 'createdAt', 'email', 'id', 'status', 'student']);
    }
    const list = await api.get('/api/coach/links').set(coach.auth);
    expect(JSON.stringify(list.body)).not.toMatch(new RegExp(`"id":${student.user.id}\\b.*Test bowler|${student.user.displayName}`));
    expect((await CoachLink.findByPk(known.body.item.id))!.studentId).toBeNull();
    await api.post(`/api/coach/links/${known.body.item.id}/accept`).set(student.auth).expect(200);
    const after = await api.get('/api/coach/links').set(coach.auth);
    expect(after.body.items.find((l: { id: number }) => l.id === known.body.item.id).student).toMatchObject({ id: student.user.id });
  });

  it(`a coach sends at most ${config.INVITATIONS_PER_DAY} invitations a day (429 with Retry-After, nothing stored past it)`, async () => {
    const coach = await createUser('coach');
    const statuses: number[] = [];
    for (let i = 0; i <= config.INVITATIONS_PER_DAY; i++)
      statuses.push(
        (
          await api
            .post('/api/coach/invitations')
            .set(coach.auth)
            .send({ email: `limit-${i}-${Date.now()}@example.test` })
        ).status,
      );
    expect(statuses.slice(0, config.INVITATIONS_PER_DAY).every((s) => s === 201)).toBe(true);
    const last = await api
      .post('/api/coach/invitations')
      .set(coach.auth)
      .send({ email: `limit-x-${Date.now()}@example.test` });
    expect(last.status).toBe(429);
    expect(errorOf(last.body).code).toBe('too_many_invitations');
    expect(last.headers['retry-after']).toBeDefined();
    expect(await CoachLink.count({ where: { coachId: coach.user.id } })).toBe(config.INVITATIONS_PER_DAY);
  });

  it('an unverified account with the invited address cannot claim the invitation; once verified it can', async () => {
    const coach = await createUser('coach');
    const squatter = await createUser('bowler', undefined, { verified: false });
    const inv = await api.post('/api/coach/invitations').set(coach.auth).send({ email: squatter.user.email });
    expect((await api.get('/api/coach/links').set(squatter.auth)).body.items).toEqual([]);
    const refused = await api.post(`/api/coach/links/${inv.body.item.id}/accept`).set(squatter.auth);
    expect(refused.status).toBe(403);
    expect(errorOf(refused.body).code).toBe('email_unverified');
    expect((await CoachLink.findByPk(inv.body.item.id))!.status).toBe('pending');
    await squatter.user.update({ emailVerifiedAt: new Date() });
    expect((await api.post(`/api/coach/links/${inv.body.item.id}/accept`).set(squatter.auth)).status).toBe(200);
  });
});

/** Nested `depth` levels of arrays around a value. */
const nested = (depth: number, inner = '1') => `${'['.repeat(depth)}${inner}${']'.repeat(depth)}`;

describe('finding 12: deep JSON and malformed webhook events are 400s', () => {
  it('a deeply nested request body or pattern file is 400 (never a parser overflow)', async () => {
    const { auth } = await createUser('proprietor');
    for (const depth of [33, 5000, 40000]) {
      const body = await api
        .post('/api/patterns')
        .set(auth)
        .set('Content-Type', 'application/json')
        .send(`{"name":"Deep","sweeps":${nested(depth)}}`);
      expect(body.status, `body depth ${depth}`).toBe(400);
      expect(errorOf(body.body).code).toBe('json_too_deep');
      const file = await api
        .post('/api/patterns/import')
        .set(auth)
        .attach('file', Buffer.from(`{"format":"lanewright-pattern","version":1,"name":"Deep","sweeps":${nested(depth)}}`), {
          filename: 'deep.json',
          contentType: 'application/json',
        });
      expect(file.status, `file depth ${depth}`).toBe(400);
      expect(errorOf(file.body).fields).toHaveProperty(['lines.1.json']);
    }
    // Brackets inside strings are text, not nesting.
    const ok = await api
      .post('/api/patterns')
      .set(auth)
      .send({
        name: `Brackets ${'['.repeat(40)}`.slice(0, 80),
        sweeps: [{ direction: 'forward', fromBoard: 2, toBoard: 38, startFt: 0, endFt: 40, crossings: 2, microlitersPerBoard: 65 }],
      });
    expect(ok.status).toBe(201);
  });

  it('a signed event whose object is null, missing or mistyped is 400 with field messages, and is not recorded', async () => {
    const w = await shopWorld();
    const order = await placeOrder(w.bowler, w.resurface.id, w.ball.id);
    const { session } = paymentObjects(order);
    const cases: { type: string; object: unknown }[] = [
      { type: 'checkout.session.completed', object: null },
      { type: 'checkout.session.completed', object: 'cs_test_x' },
      { type: 'checkout.session.completed', object: { ...session, id: undefined } },
      { type: 'checkout.session.completed', object: { ...session, amount_total: '4500' } },
      { type: 'charge.refunded', object: { id: 'ch_test_x', amount: null, amount_refunded: 1 } },
      { type: 'payment_intent.payment_failed', object: { id: 42 } },
    ];
    for (const c of cases) {
      const ev = event(c.type, {});
      const payload = ev.payload.replace('"object":{}', `"object":${JSON.stringify(c.object) ?? 'null'}`);
      const res = await postWebhook(payload, signature(payload));
      expect(res.status, JSON.stringify(c)).toBe(400);
      expect(errorOf(res.body).code).toBe('invalid_event');
      expect(Object.keys(errorOf(res.body).fields ?? {}).length).toBeGreaterThan(0);
      expect(await PaymentEvent.findOne({ where: { eventId: ev.id } })).toBeNull();
    }
    const nullData = JSON.stringify({ id: 'evt_test_nulldata', object: 'event', type: 'checkout.session.completed', data: null });
    expect((await postWebhook(nullData, signature(nullData))).status).toBe(400);
    expect((await postWebhook('null', signature('null'))).status).toBe(400);
    expect((await Order.findByPk(order.id))!.status).toBe('ordered');
    // A well-formed one still pays.
    expect((await sendEvent(event('checkout.session.completed', session))).status).toBe(200);
  });
});

describe('finding 13: CSV export cells cannot be formulas', () => {
  it('names with formula starts and commas are exported as text cells and import back unchanged', async () => {
    const coach = await createUser('coach');
    // Names are unique per owner: a second coach imports the files back under the same names.
    const second = await createUser('coach');
    for (const name of ['=1+2', '@SUM(1)', 'House,=1+2', '+cmd', '-2+3', 'Quote "x",@A1']) {
      const p = await createPattern(coach.user.id, undefined, name);
      await Pattern.update({ description: `Notes,=HYPERLINK("x"),\t@B2` }, { where: { id: p.id } });
      const file = await api.get(`/api/patterns/${p.id}/export`).query({ format: 'csv' }).set(coach.auth);
      expect(file.status).toBe(200);
      const cells = (parseCsv(file.text, { relax_column_count: true }) as string[][]).flat();
      for (const c of cells) expect(c, `cell of ${JSON.stringify(name)}`).not.toMatch(/^[=+\-@\t\r]/);
      const back = await api
        .post('/api/patterns/import')
        .set(second.auth)
        .attach('file', Buffer.from(file.text), { filename: 'back.csv', contentType: 'text/csv' });
      expect(back.status).toBe(201);
      expect(back.body.item.name).toBe(name);
    }
  });
});

describe('finding 14: photos are decoded, not sniffed', () => {
  const PNG_1X1 = Buffer.from(
    '89504e470d0a1a0a0000000d49484452000000010000000108000000003a7e9b550000000a49444154789c63000100000500010d0a2db40000000049454e44ae426082',
    'hex',
  );
  it('an 8-byte PNG signature, a truncated PNG, a JPEG start and a WebP header alone are refused; a real PNG passes', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id);
    const fakes: [string, Buffer, string][] = [
      ['signature only', PNG_1X1.subarray(0, 8), 'image/png'],
      ['signature and junk', Buffer.concat([PNG_1X1.subarray(0, 8), Buffer.from('<svg onload=alert(1)>')]), 'image/png'],
      ['truncated', PNG_1X1.subarray(0, 40), 'image/png'],
      ['JPEG start', Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0, 0x10]), 'image/jpeg'],
      ['WebP header', Buffer.from('RIFF\x00\x00\x00\x00WEBPVP8 ', 'latin1'), 'image/webp'],
    ];
    for (const [what, buf, type] of fakes) {
      const res = await api.put(`/api/arsenal/${ball.id}/photo`).set(me.auth).attach('file', buf, { filename: 'x.img', contentType: type });
      expect(res.status, what).toBe(400);
      expect(errorOf(res.body).code).toBe('unsupported_file');
    }
    expect((await Ball.findByPk(ball.id))!.photoUploadId).toBeNull();
    expect(
      (
        await api
          .put(`/api/arsenal/${ball.id}/photo`)
          .set(me.auth)
          .attach('file', PNG_1X1, { filename: 'ok.png', contentType: 'image/png' })
      ).status,
    ).toBe(200);
  });
});
