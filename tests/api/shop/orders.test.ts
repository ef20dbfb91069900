import { describe, expect, it } from 'vitest';
import { AuditEvent, Order, ShopService } from '../../../server/models/index';
import { api, createUser, errorOf } from '../../helpers/api';
import { createBall, createCenter } from '../../helpers/fixtures';
import { payByWebhook, placeOrder, shopWorld } from './shopHelpers';

describe('the price list', () => {
  it('is managed by the center’s proprietor only; others get 403 and nothing is stored', async () => {
    const owner = await createUser('proprietor');
    const rival = await createUser('proprietor');
    const bowler = await createUser();
    const center = await createCenter(owner.user.id);
    const body = { kind: 'resurface', name: 'Resurface to 3000 grit', grit: 3000, priceCents: 4200 };
    expect((await api.post(`/api/centers/${center.id}/services`).set(bowler.auth).send(body)).status).toBe(403);
    expect((await api.post(`/api/centers/${center.id}/services`).set(rival.auth).send(body)).status).toBe(403);
    expect((await api.post(`/api/centers/${center.id}/services`).send(body)).status).toBe(401);
    expect(await ShopService.count({ where: { centerId: center.id } })).toBe(0);
    const ok = await api.post(`/api/centers/${center.id}/services`).set(owner.auth).send(body);
    expect(ok.status).toBe(201);
    expect(ok.body.item).toMatchObject({
      centerId: center.id,
      kind: 'resurface',
      grit: 3000,
      priceCents: 4200,
      currency: 'usd',
      active: true,
      version: 0,
    });
  });

  it('refuses a resurface without its grit, fractional cents and unknown fields, by field', async () => {
    const owner = await createUser('proprietor');
    const center = await createCenter(owner.user.id);
    const noGrit = await api
      .post(`/api/centers/${center.id}/services`)
      .set(owner.auth)
      .send({ kind: 'resurface', name: 'Resurface', priceCents: 4000 });
    expect(noGrit.status).toBe(400);
    expect(errorOf(noGrit.body).fields).toHaveProperty(['body.grit']);
    const cents = await api
      .post(`/api/centers/${center.id}/services`)
      .set(owner.auth)
      .send({ kind: 'polish', name: 'Polish', priceCents: 25.5 });
    expect(errorOf(cents.body).fields).toHaveProperty(['body.priceCents']);
    const extra = await api
      .post(`/api/centers/${center.id}/services`)
      .set(owner.auth)
      .send({ kind: 'polish', name: 'Polish', priceCents: 2500, centerId: 1 });
    expect(extra.status).toBe(400);
  });

  it('lists active entries to any signed-in user and inactive ones to the proprietor with ?all=1; a stale version is 409', async () => {
    const { owner, center, polish, bowler } = await shopWorld();
    const retire = await api
      .patch(`/api/centers/${center.id}/services/${polish.id}`)
      .set(owner.auth)
      .send({ version: polish.version, active: false, priceCents: 2700 });
    expect(retire.status).toBe(200);
    expect(retire.body.item).toMatchObject({ active: false, priceCents: 2700, version: polish.version + 1 });
    const stale = await api
      .patch(`/api/centers/${center.id}/services/${polish.id}`)
      .set(owner.auth)
      .send({ version: polish.version, priceCents: 1 * 100 });
    expect(stale.status).toBe(409);
    expect(errorOf(stale.body).code).toBe('stale_version');
    const seen = await api.get(`/api/centers/${center.id}/services`).set(bowler.auth);
    expect(seen.status).toBe(200);
    expect(seen.body.items.map((s: { id: number }) => s.id)).not.toContain(polish.id);
    const bowlerAll = await api.get(`/api/centers/${center.id}/services?all=1`).set(bowler.auth);
    expect(bowlerAll.body.items.map((s: { id: number }) => s.id)).not.toContain(polish.id);
    const ownerAll = await api.get(`/api/centers/${center.id}/services?all=1`).set(owner.auth);
    expect(ownerAll.body.items.map((s: { id: number }) => s.id)).toContain(polish.id);
    expect((await api.get(`/api/centers/${center.id}/services`)).status).toBe(401);
    expect((await api.get('/api/centers/99999999/services').set(bowler.auth)).status).toBe(404);
  });
});

describe('ordering', () => {
  it('takes the price from the price list: an amount in the body or a different expected price is refused, nothing stored', async () => {
    const { resurface, bowler, ball } = await shopWorld();
    const before = await Order.count({ where: { userId: bowler.user.id } });
    const tampered = await api.post('/api/orders').set(bowler.auth).send({ serviceId: resurface.id, ballId: ball.id, amountCents: 1 });
    expect(tampered.status).toBe(400);
    expect(errorOf(tampered.body).code).toBe('validation_failed');
    const tampered2 = await api
      .post('/api/orders')
      .set(bowler.auth)
      .send({ serviceId: resurface.id, ballId: ball.id, priceCents: 1, currency: 'usd' });
    expect(tampered2.status).toBe(400);
    const mismatch = await api
      .post('/api/orders')
      .set(bowler.auth)
      .send({ serviceId: resurface.id, ballId: ball.id, expectedAmountCents: 100 });
    expect(mismatch.status).toBe(400);
    expect(errorOf(mismatch.body).code).toBe('price_mismatch');
    expect(errorOf(mismatch.body).fields).toHaveProperty(['body.expectedAmountCents']);
    expect(await Order.count({ where: { userId: bowler.user.id } })).toBe(before);

    const ok = await api
      .post('/api/orders')
      .set(bowler.auth)
      .send({ serviceId: resurface.id, ballId: ball.id, expectedAmountCents: 4500, notes: 'For the Saturday league' });
    expect(ok.status).toBe(201);
    expect(ok.body.item).toMatchObject({
      userId: bowler.user.id,
      serviceId: resurface.id,
      serviceKind: 'resurface',
      serviceName: 'Resurface to 4000 grit',
      grit: 4000,
      ballId: ball.id,
      ballName: ball.name,
      amountCents: 4500,
      currency: 'usd',
      status: 'ordered',
      paymentStatus: 'unpaid',
      lastPaymentError: null,
      notes: 'For the Saturday league',
      paidAt: null,
    });
    expect(ok.body.item.history).toEqual([{ status: 'ordered', at: expect.any(String), by: bowler.user.displayName }]);
    expect(await AuditEvent.count({ where: { action: 'order.created', subjectId: String(ok.body.item.id) } })).toBe(1);
  });

  it('keeps the price it was ordered at when the price list changes later', async () => {
    const { owner, center, polish, bowler, ball } = await shopWorld();
    const o = await placeOrder(bowler, polish.id, ball.id);
    await api.patch(`/api/centers/${center.id}/services/${polish.id}`).set(owner.auth).send({ version: polish.version, priceCents: 9900 });
    expect((await api.get(`/api/orders/${o.id}`).set(bowler.auth)).body.item.amountCents).toBe(2500);
  });

  it('refuses a ball outside the caller’s arsenal and a retired service', async () => {
    const { owner, center, resurface, polish, bowler } = await shopWorld();
    const other = await createUser();
    const theirs = await createBall(other.user.id);
    const res = await api.post('/api/orders').set(bowler.auth).send({ serviceId: resurface.id, ballId: theirs.id });
    expect(res.status).toBe(400);
    expect(errorOf(res.body).fields).toHaveProperty(['body.ballId']);
    await api.patch(`/api/centers/${center.id}/services/${polish.id}`).set(owner.auth).send({ version: polish.version, active: false });
    const mine = await createBall(bowler.user.id);
    const retired = await api.post('/api/orders').set(bowler.auth).send({ serviceId: polish.id, ballId: mine.id });
    expect(errorOf(retired.body).fields).toHaveProperty(['body.serviceId']);
    const unknown = await api.post('/api/orders').set(bowler.auth).send({ serviceId: 99999999, ballId: mine.id });
    expect(unknown.status).toBe(400);
  });

  it('lets the bowler cancel while unpaid, not after paying; a cancelled order cannot be paid', async () => {
    const { resurface, polish, bowler, ball } = await shopWorld();
    const a = await placeOrder(bowler, polish.id, ball.id);
    const stranger = await createUser();
    expect((await api.post(`/api/orders/${a.id}/cancel`).set(stranger.auth)).status).toBe(404);
    const cancelled = await api.post(`/api/orders/${a.id}/cancel`).set(bowler.auth);
    expect(cancelled.status).toBe(200);
    expect(cancelled.body.item).toMatchObject({ status: 'cancelled', cancelledAt: expect.any(String) });
    expect((await api.post(`/api/orders/${a.id}/checkout`).set(bowler.auth)).status).toBe(409);
    const b = await placeOrder(bowler, resurface.id, ball.id);
    await payByWebhook(b);
    const late = await api.post(`/api/orders/${b.id}/cancel`).set(bowler.auth);
    expect(late.status).toBe(409);
    expect(errorOf(late.body).code).toBe('not_cancellable');
  });
});

describe('who sees which orders', () => {
  it('a bowler sees only their own orders: another’s is 404 and absent from the list', async () => {
    const { resurface, bowler, ball } = await shopWorld();
    const mine = await placeOrder(bowler, resurface.id, ball.id);
    const other = await createUser();
    const otherBall = await createBall(other.user.id);
    const theirs = await placeOrder(other, resurface.id, otherBall.id);
    expect((await api.get(`/api/orders/${theirs.id}`).set(bowler.auth)).status).toBe(404);
    expect((await api.post(`/api/orders/${theirs.id}/checkout`).set(bowler.auth)).status).toBe(404);
    const list = await api.get('/api/orders').set(bowler.auth);
    expect(list.status).toBe(200);
    expect(list.body).toMatchObject({ total: 1, page: 1, pageSize: 20 });
    expect(list.body.items.map((o: { id: number }) => o.id)).toEqual([mine.id]);
    expect((await api.get('/api/orders')).status).toBe(401);
  });

  it('a proprietor sees only their own center’s orders; another center’s board is 403 and its orders 404', async () => {
    const a = await shopWorld();
    const b = await shopWorld();
    const oa = await placeOrder(a.bowler, a.resurface.id, a.ball.id);
    const ob = await placeOrder(b.bowler, b.resurface.id, b.ball.id);
    const board = await api.get(`/api/centers/${a.center.id}/orders`).set(a.owner.auth);
    expect(board.status).toBe(200);
    expect(board.body.items.map((o: { id: number }) => o.id)).toEqual([oa.id]);
    expect(board.body.items[0]).toMatchObject({ bowlerName: a.bowler.user.displayName, centerName: a.center.name });
    expect((await api.get(`/api/centers/${b.center.id}/orders`).set(a.owner.auth)).status).toBe(403);
    expect((await api.get(`/api/centers/${a.center.id}/orders`).set(a.bowler.auth)).status).toBe(403);
    expect((await api.get(`/api/orders/${ob.id}`).set(a.owner.auth)).status).toBe(404);
    expect((await api.get(`/api/orders/${oa.id}`).set(a.owner.auth)).status).toBe(200);
    expect((await api.patch(`/api/orders/${ob.id}/status`).set(a.owner.auth).send({ status: 'in_progress' })).status).toBe(404);
    expect((await api.post(`/api/orders/${ob.id}/refund`).set(a.owner.auth)).status).toBe(404);
    expect((await api.get(`/api/centers/${b.center.id}/takings`).set(a.owner.auth)).status).toBe(403);
  });

  it('filters the board by status and by day, and validates the filters', async () => {
    const { owner, center, resurface, polish, bowler, ball } = await shopWorld();
    const paid = await placeOrder(bowler, resurface.id, ball.id);
    await payByWebhook(paid);
    await placeOrder(bowler, polish.id, ball.id);
    const onlyPaid = await api.get(`/api/centers/${center.id}/orders?status=paid`).set(owner.auth);
    expect(onlyPaid.body.items.map((o: { id: number }) => o.id)).toEqual([paid.id]);
    const today = new Date().toISOString().slice(0, 10);
    expect((await api.get(`/api/centers/${center.id}/orders?date=${today}`).set(owner.auth)).body.total).toBe(2);
    expect((await api.get(`/api/centers/${center.id}/orders?date=2001-01-01`).set(owner.auth)).body.total).toBe(0);
    const bad = await api.get(`/api/centers/${center.id}/orders?status=lost&date=yesterday`).set(owner.auth);
    expect(bad.status).toBe(400);
    expect(Object.keys(errorOf(bad.body).fields ?? {})).toEqual(expect.arrayContaining(['query.status', 'query.date']));
  });
});
