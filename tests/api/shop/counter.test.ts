import { describe, expect, it } from 'vitest';
import { AuditEvent, Order, OrderEvent, sequelize, ShopService } from '../../../server/models/index';
import type { Order as OrderDto } from '../../../shared/shop';
import { api, createUser, errorOf } from '../../helpers/api';
import { createCenter } from '../../helpers/fixtures';
import { payByWebhook, placeOrder, shopWorld, type TestUser } from './shopHelpers';

/** An order of the center paid at an exact instant (the card payment itself is covered by the checkout tests). */
async function paidAt(centerId: number, bowlerId: number, service: ShopService, at: string, refundedAt: string | null = null) {
  return Order.create({
    userId: bowlerId,
    centerId,
    serviceId: service.id,
    ballId: null,
    serviceKind: service.kind,
    serviceName: service.name,
    grit: service.grit,
    ballName: 'Test ball',
    amountCents: service.priceCents,
    currency: 'usd',
    notes: null,
    status: refundedAt ? 'refunded' : 'paid',
    paymentStatus: refundedAt ? 'refunded' : 'paid',
    paidAt: new Date(at),
    refundedAt: refundedAt ? new Date(refundedAt) : null,
  });
}

const takings = (user: TestUser, centerId: number, query: Record<string, string>) =>
  api.get(`/api/centers/${centerId}/takings`).query(query).set(user.auth);

describe('takings by the center’s local day', () => {
  it('counts an evening sale on its own day for a center behind UTC (America/Denver), not on the next UTC day', async () => {
    const { owner, center, resurface, polish, bowler } = await shopWorld();
    await center.update({ timeZone: 'America/Denver' });
    // 20:30 on 10 November in Denver (UTC−7) is 03:30 on 11 November in UTC.
    await paidAt(center.id, bowler.user.id, resurface, '2026-11-11T03:30:00Z');
    // 09:00 on 10 November in Denver.
    await paidAt(center.id, bowler.user.id, polish, '2026-11-10T16:00:00Z');
    // 23:30 on 11 November in Denver is already 12 November in UTC; refunded at 18:00 local on 12 November.
    await paidAt(center.id, bowler.user.id, polish, '2026-11-12T06:30:00Z', '2026-11-13T01:00:00Z');

    const day = await takings(owner, center.id, { date: '2026-11-10' });
    expect(day.status).toBe(200);
    expect(day.body.item).toMatchObject({
      date: '2026-11-10',
      from: '2026-11-10',
      to: '2026-11-10',
      timeZone: 'America/Denver',
      currency: 'usd',
      orders: 2,
      paidCents: resurface.priceCents + polish.priceCents,
      refundedCents: 0,
      netCents: resurface.priceCents + polish.priceCents,
    });
    expect(day.body.item.byService).toEqual([
      { serviceId: resurface.id, name: resurface.name, count: 1, cents: resurface.priceCents },
      { serviceId: polish.id, name: polish.name, count: 1, cents: polish.priceCents },
    ]);
    const next = await takings(owner, center.id, { date: '2026-11-11' });
    expect(next.body.item).toMatchObject({ orders: 1, paidCents: polish.priceCents, refundedCents: 0 });

    const range = await takings(owner, center.id, { from: '2026-11-09', to: '2026-11-13' });
    expect(range.status).toBe(200);
    expect(range.body.item.days).toEqual([
      { date: '2026-11-09', orders: 0, paidCents: 0, refundedCents: 0, netCents: 0 },
      { date: '2026-11-10', orders: 2, paidCents: 7000, refundedCents: 0, netCents: 7000 },
      { date: '2026-11-11', orders: 1, paidCents: 2500, refundedCents: 0, netCents: 2500 },
      { date: '2026-11-12', orders: 0, paidCents: 0, refundedCents: 2500, netCents: -2500 },
      { date: '2026-11-13', orders: 0, paidCents: 0, refundedCents: 0, netCents: 0 },
    ]);
    expect(range.body.item).toMatchObject({ date: '2026-11-09', orders: 3, paidCents: 9500, refundedCents: 2500, netCents: 7000 });

    // The same sales for a center on UTC fall on the UTC days.
    await center.update({ timeZone: 'UTC' });
    const utc = await takings(owner, center.id, { date: '2026-11-10' });
    expect(utc.body.item).toMatchObject({ orders: 1, paidCents: polish.priceCents, timeZone: 'UTC' });
  });

  it('without a day answers the center’s today', async () => {
    const { owner, center } = await shopWorld();
    await center.update({ timeZone: 'Pacific/Kiritimati' });
    const res = await takings(owner, center.id, {});
    expect(res.status).toBe(200);
    const today = new Intl.DateTimeFormat('en-CA', { timeZone: 'Pacific/Kiritimati' }).format(new Date());
    expect(res.body.item).toMatchObject({ date: today, from: today, to: today });
    expect(res.body.item.days).toHaveLength(1);
  });

  it('refuses a bad range by field (400), and answers 401, 403 and 404 as the shop does', async () => {
    const { owner, center, bowler } = await shopWorld();
    const rival = await createUser('proprietor');
    const cases: [Record<string, string>, string][] = [
      [{ from: '2026-11-10', to: '2026-11-09' }, 'query.to'],
      [{ from: '2026-01-01', to: '2026-12-31' }, 'query.to'],
      [{ to: '2026-11-09' }, 'query.from'],
      [{ date: '2026-11-09', from: '2026-11-01' }, 'query.date'],
      [{ from: '2026-13-01' }, 'query.from'],
    ];
    for (const [query, field] of cases) {
      const res = await takings(owner, center.id, query);
      expect(res.status, JSON.stringify(query)).toBe(400);
      expect(errorOf(res.body).fields, JSON.stringify(query)).toHaveProperty([field]);
    }
    expect((await api.get(`/api/centers/${center.id}/takings`)).status).toBe(401);
    expect((await takings(bowler, center.id, {})).status).toBe(403);
    expect((await takings(rival, center.id, {})).status).toBe(403);
    expect((await takings(owner, 99999999, {})).status).toBe(404);
    expect((await api.get(`/api/centers/${center.id}/takings.csv`).set(rival.auth)).status).toBe(403);
  });

  it('exports the range as a CSV attachment, quoting names with commas and quotes', async () => {
    const { owner, center, bowler } = await shopWorld();
    await center.update({ timeZone: 'America/Denver' });
    const odd = await ShopService.create({
      centerId: center.id,
      kind: 'polish',
      name: 'Polish, "shine" finish',
      grit: null,
      description: null,
      priceCents: 3050,
      currency: 'usd',
    });
    await paidAt(center.id, bowler.user.id, odd, '2026-11-11T03:30:00Z');
    const res = await api
      .get(`/api/centers/${center.id}/takings.csv`)
      .query({ from: '2026-11-10', to: '2026-11-11' })
      .set(owner.auth)
      .buffer(true)
      .parse((r, cb) => {
        let text = '';
        r.on('data', (c: Buffer) => (text += c.toString('utf8')));
        r.on('end', () => cb(null, text));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toBe(`attachment; filename="takings-center-${center.id}-2026-11-10-to-2026-11-11.csv"`);
    const lines = (res.body as string).split('\r\n');
    expect(lines.slice(0, 4)).toEqual([
      'Date,Orders paid,Taken (USD),Refunded (USD),Net (USD)',
      '2026-11-10,1,30.50,0.00,30.50',
      '2026-11-11,0,0.00,0.00,0.00',
      'Total,1,30.50,0.00,30.50',
    ]);
    expect(lines).toContain('"Polish, ""shine"" finish",1,30.50');
    expect(lines).toContain('Time zone,America/Denver');
    const bad = await api.get(`/api/centers/${center.id}/takings.csv`).query({ from: '2026-11-12', to: '2026-11-10' }).set(owner.auth);
    expect(bad.status).toBe(400);
    expect(errorOf(bad.body).fields).toHaveProperty(['query.to']);
  });
});

describe('the orders board by day', () => {
  it('filters by the center’s local day: an evening order in Denver is on that day, not the next UTC one', async () => {
    const { owner, center, polish, bowler } = await shopWorld();
    await center.update({ timeZone: 'America/Denver' });
    const evening = await paidAt(center.id, bowler.user.id, polish, '2026-11-11T03:30:00Z');
    const morning = await paidAt(center.id, bowler.user.id, polish, '2026-11-11T16:00:00Z');
    for (const o of [evening, morning])
      await sequelize.query('UPDATE orders SET created_at = paid_at WHERE id = :id', { replacements: { id: o.id } });
    const ids = async (date: string) =>
      (await api.get(`/api/centers/${center.id}/orders`).query({ date }).set(owner.auth)).body.items.map((x: OrderDto) => x.id);
    expect(await ids('2026-11-10')).toEqual([evening.id]);
    expect(await ids('2026-11-11')).toEqual([morning.id]);
  });
});

describe('walk-in orders', () => {
  const walkIn = (serviceId: number, extra: Record<string, unknown> = {}) => ({
    serviceId,
    customerName: 'Dana Pinwheel',
    customerContact: '555-0142',
    ballDescription: 'Blue pearl reactive, 15 lb',
    ...extra,
  });

  it('the proprietor takes one at the counter: paid, on the board and in the takings, not in any bowler’s list', async () => {
    const { owner, center, polish, bowler } = await shopWorld();
    const res = await api
      .post(`/api/centers/${center.id}/orders`)
      .set(owner.auth)
      .send(walkIn(polish.id, { notes: 'Drop-off at 7' }));
    expect(res.status).toBe(201);
    const o = res.body.item as OrderDto;
    expect(o).toMatchObject({
      walkIn: true,
      userId: 0,
      ballId: 0,
      bowlerName: 'Dana Pinwheel',
      customerContact: '555-0142',
      ballName: 'Blue pearl reactive, 15 lb',
      serviceName: polish.name,
      amountCents: polish.priceCents,
      status: 'paid',
      paymentStatus: 'paid',
      notes: 'Drop-off at 7',
    });
    expect(o.history.map((h) => h.status)).toEqual(['ordered', 'paid']);
    const row = await Order.findByPk(o.id);
    expect(row).toMatchObject({ userId: null, customerName: 'Dana Pinwheel', centerId: center.id });
    expect(await AuditEvent.count({ where: { action: 'order.walk_in_created', subjectId: String(o.id) } })).toBe(1);

    const board = await api.get(`/api/centers/${center.id}/orders`).set(owner.auth);
    expect(board.body.items.map((x: OrderDto) => x.id)).toContain(o.id);
    const mine = await api.get('/api/orders').set(bowler.auth);
    expect(mine.body.items.map((x: OrderDto) => x.id)).not.toContain(o.id);
    expect((await api.get(`/api/orders/${o.id}`).set(bowler.auth)).status).toBe(404);

    const today = await takings(owner, center.id, {});
    expect(today.body.item.byService).toContainEqual({ serviceId: polish.id, name: polish.name, count: 1, cents: polish.priceCents });

    // It moves along like any paid order; ready sends no mail (there is no account) and a card refund is refused.
    expect((await api.patch(`/api/orders/${o.id}/status`).set(owner.auth).send({ status: 'ready' })).body.item.status).toBe('ready');
    const refund = await api.post(`/api/orders/${o.id}/refund`).set(owner.auth);
    expect(refund.status).toBe(409);
  });

  it('refuses missing customer fields and another center’s service by field; 401, 403 and 404 otherwise; nothing stored', async () => {
    const { owner, center, polish, bowler } = await shopWorld();
    const other = await createUser('proprietor');
    const otherCenter = await createCenter(other.user.id);
    const foreign = await ShopService.create({
      centerId: otherCenter.id,
      kind: 'polish',
      name: 'Polish elsewhere',
      grit: null,
      description: null,
      priceCents: 2000,
      currency: 'usd',
    });
    const bad = await api
      .post(`/api/centers/${center.id}/orders`)
      .set(owner.auth)
      .send({ serviceId: polish.id, customerName: ' ', ballDescription: '' });
    expect(bad.status).toBe(400);
    expect(Object.keys(errorOf(bad.body).fields ?? {}).sort()).toEqual([
      'body.ballDescription',
      'body.customerContact',
      'body.customerName',
    ]);
    const wrong = await api.post(`/api/centers/${center.id}/orders`).set(owner.auth).send(walkIn(foreign.id));
    expect(wrong.status).toBe(400);
    expect(errorOf(wrong.body).fields).toHaveProperty(['body.serviceId']);
    const priced = await api
      .post(`/api/centers/${center.id}/orders`)
      .set(owner.auth)
      .send(walkIn(polish.id, { amountCents: 1 }));
    expect(priced.status).toBe(400);
    expect((await api.post(`/api/centers/${center.id}/orders`).send(walkIn(polish.id))).status).toBe(401);
    expect((await api.post(`/api/centers/${center.id}/orders`).set(bowler.auth).send(walkIn(polish.id))).status).toBe(403);
    expect((await api.post(`/api/centers/${center.id}/orders`).set(other.auth).send(walkIn(polish.id))).status).toBe(403);
    expect((await api.post('/api/centers/99999999/orders').set(owner.auth).send(walkIn(polish.id))).status).toBe(404);
    expect(await Order.count({ where: { centerId: center.id } })).toBe(0);
  });
});

describe('undoing a move', () => {
  async function paidOrder() {
    const w = await shopWorld();
    const o = await placeOrder(w.bowler, w.redrill.id, w.ball.id);
    await payByWebhook(o);
    return { ...w, order: o };
  }
  const move = (u: TestUser, id: number, status: string) => api.patch(`/api/orders/${id}/status`).set(u.auth).send({ status });
  const undo = (u: TestUser, id: number) => api.post(`/api/orders/${id}/status/undo`).set(u.auth);

  it('puts a collected order back to ready and an in-progress one back to paid, audit-logged, once', async () => {
    const { owner, order } = await paidOrder();
    expect((await move(owner, order.id, 'in_progress')).status).toBe(200);
    const back = await undo(owner, order.id);
    expect(back.status).toBe(200);
    expect(back.body.item.status).toBe('paid');
    expect((await undo(owner, order.id)).status).toBe(409);

    expect((await move(owner, order.id, 'ready')).status).toBe(200);
    const ready = await undo(owner, order.id);
    expect(ready.status).toBe(409);
    expect(errorOf(ready.body).code).toBe('nothing_to_undo');

    expect((await move(owner, order.id, 'collected')).body.item.collectedAt).not.toBeNull();
    const uncollected = await undo(owner, order.id);
    expect(uncollected.status).toBe(200);
    expect(uncollected.body.item).toMatchObject({ status: 'ready', collectedAt: null });
    expect(uncollected.body.item.history.map((h: { status: string }) => h.status)).toEqual([
      'ordered',
      'paid',
      'in_progress',
      'paid',
      'ready',
      'collected',
      'ready',
    ]);
    const audits = await AuditEvent.findAll({
      where: { action: 'order.status_undone', subjectId: String(order.id) },
      order: [['id', 'ASC']],
    });
    expect(audits.map((a) => a.details)).toEqual([
      { from: 'in_progress', to: 'paid' },
      { from: 'collected', to: 'ready' },
    ]);
    expect((await Order.findByPk(order.id))!.status).toBe('ready');
  });

  it('refuses an undo after the window, and to anyone but the shop (bowler 403, others 404, anonymous 401)', async () => {
    const { owner, bowler, order } = await paidOrder();
    const stranger = await createUser('proprietor');
    expect((await move(owner, order.id, 'in_progress')).status).toBe(200);
    expect((await api.post(`/api/orders/${order.id}/status/undo`)).status).toBe(401);
    expect((await undo(bowler, order.id)).status).toBe(403);
    expect((await undo(stranger, order.id)).status).toBe(404);
    await OrderEvent.update({ at: new Date(Date.now() - 10 * 60 * 1000) }, { where: { orderId: order.id, status: 'in_progress' } });
    const late = await undo(owner, order.id);
    expect(late.status).toBe(409);
    expect(errorOf(late.body).code).toBe('undo_expired');
    expect((await Order.findByPk(order.id))!.status).toBe('in_progress');
  });
});

describe('a bowler’s open orders', () => {
  it('?open=1 lists the orders whose ball is at the shop (not collected, cancelled or refunded)', async () => {
    const { owner, bowler, polish, redrill, ball } = await shopWorld();
    const open = await placeOrder(bowler, polish.id, ball.id);
    const done = await placeOrder(bowler, redrill.id, ball.id);
    await payByWebhook(done);
    for (const s of ['ready', 'collected'])
      expect((await api.patch(`/api/orders/${done.id}/status`).set(owner.auth).send({ status: s })).status).toBe(200);
    const res = await api.get('/api/orders').query({ open: '1' }).set(bowler.auth);
    expect(res.status).toBe(200);
    const ids = res.body.items.map((x: OrderDto) => x.id);
    expect(ids).toContain(open.id);
    expect(ids).not.toContain(done.id);
    expect((await api.get('/api/orders').query({ open: 'maybe' }).set(bowler.auth)).status).toBe(400);
  });
});

describe('prices', () => {
  it('refuses a negative price and fractions of a cent with a message on the field, instead of correcting them', async () => {
    const owner = await createUser('proprietor');
    const center = await createCenter(owner.user.id);
    for (const priceCents of [-500, 25.5, 10]) {
      const res = await api.post(`/api/centers/${center.id}/services`).set(owner.auth).send({ kind: 'polish', name: 'Polish', priceCents });
      expect(res.status).toBe(400);
      expect(errorOf(res.body).fields?.['body.priceCents']).toMatch(/cents/);
    }
    expect(await ShopService.count({ where: { centerId: center.id } })).toBe(0);
  });
});
