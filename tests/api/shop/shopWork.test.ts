import { describe, expect, it } from 'vitest';
import { AuditEvent, Ball, MailOutbox, SurfaceEvent } from '../../../server/models/index';
import { api, errorOf } from '../../helpers/api';
import { createPattern, LONG_HEAVY } from '../../helpers/fixtures';
import { capturedMail } from '../../../server/dev/mailCapture';
import { event, getOrder, payByWebhook, placeOrder, sendEvent, shopWorld, waitFor } from './shopHelpers';

const move = (auth: { Authorization: string }, id: number, status: string) =>
  api.patch(`/api/orders/${id}/status`).set(auth).send({ status });

describe('the shop’s moves', () => {
  it('only forward from paid: ordered → ready is 409, paid → collected is 409, backwards is 409; a bowler cannot move an order', async () => {
    const { resurface, owner, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, resurface.id, ball.id);
    const unpaid = await move(owner.auth, order.id, 'ready');
    expect(unpaid.status).toBe(409);
    expect(errorOf(unpaid.body).code).toBe('bad_transition');
    await payByWebhook(order);
    expect((await move(bowler.auth, order.id, 'in_progress')).status).toBe(403);
    expect((await move(owner.auth, order.id, 'collected')).status).toBe(409);
    expect((await move(owner.auth, order.id, 'paid')).status).toBe(400);
    expect((await move(owner.auth, order.id, 'in_progress')).body.item.status).toBe('in_progress');
    expect((await move(owner.auth, order.id, 'in_progress')).status).toBe(409);
    expect((await move(owner.auth, order.id, 'ready')).body.item.status).toBe('ready');
    const collected = await move(owner.auth, order.id, 'collected');
    expect(collected.body.item).toMatchObject({ status: 'collected', collectedAt: expect.any(String), readyAt: expect.any(String) });
    expect(collected.body.item.history.map((h: { status: string; by: string | null }) => [h.status, h.by])).toEqual([
      ['ordered', bowler.user.displayName],
      ['paid', null],
      ['in_progress', owner.user.displayName],
      ['ready', owner.user.displayName],
      ['collected', owner.user.displayName],
    ]);
    expect(await AuditEvent.count({ where: { action: 'order.status_changed', subjectId: String(order.id) } })).toBe(3);
    expect((await move(owner.auth, order.id, 'ready')).status).toBe(409);
  });

  it('marking a 4000-grit resurface ready sets the ball’s surface and history in the same step, mails the bowler, and the next matchup uses it', async () => {
    const { resurface, owner, bowler, ball } = await shopWorld();
    const pattern = await createPattern(owner.user.id, LONG_HEAVY);
    const before = await api
      .post('/api/matchups')
      .set(bowler.auth)
      .send({ patternId: pattern.id, ballIds: [ball.id] });
    expect(before.status).toBe(200);
    expect(before.body.rankings[0].ball).toMatchObject({ surfaceGrit: 2000, polished: false });

    const order = await placeOrder(bowler, resurface.id, ball.id);
    await payByWebhook(order);
    await move(owner.auth, order.id, 'in_progress');
    expect((await Ball.findByPk(ball.id))!.surfaceGrit).toBe(2000);
    const ready = await move(owner.auth, order.id, 'ready');
    expect(ready.status).toBe(200);

    const b = await api.get(`/api/arsenal/${ball.id}`).set(bowler.auth);
    expect(b.body.item).toMatchObject({ surfaceGrit: 4000, polished: false, gamesSinceResurface: 0, version: ball.version + 1 });
    const last = b.body.item.surfaceHistory.at(-1);
    expect(last).toMatchObject({ fromGrit: 2000, fromPolished: false, toGrit: 4000, toPolished: false, byUserId: owner.user.id });
    expect(last.note).toContain(`order #${order.id}`);

    const after = await api
      .post('/api/matchups')
      .set(bowler.auth)
      .send({ patternId: pattern.id, ballIds: [ball.id] });
    expect(after.body.rankings[0].ball).toMatchObject({ surfaceGrit: 4000, polished: false });
    // A smoother cover reads the oil less: the engine's answer differs (not a cached copy of the old one).
    expect(JSON.stringify(after.body.rankings[0].reasons)).not.toBe(JSON.stringify(before.body.rankings[0].reasons));

    expect(await MailOutbox.count({ where: { ref: `${order.id}:ready` } })).toBe(1);
    const mail = await waitFor(
      async () => capturedMail().find((m) => m.to.includes(bowler.user.email) && m.subject.includes('ready')),
      (m) => m !== undefined,
    );
    expect(mail!.text).toContain('4000 grit');
  });

  it('a polish marks the ball polished at its grit; a plug and redrill leaves the surface alone', async () => {
    const { polish, redrill, owner, bowler, ball } = await shopWorld();
    const p = await placeOrder(bowler, polish.id, ball.id);
    await payByWebhook(p);
    await move(owner.auth, p.id, 'ready');
    expect(await Ball.findByPk(ball.id)).toMatchObject({ surfaceGrit: 2000, polished: true });
    const events = await SurfaceEvent.count({ where: { ballId: ball.id } });
    const r = await placeOrder(bowler, redrill.id, ball.id);
    await payByWebhook(r);
    await move(owner.auth, r.id, 'ready');
    expect(await SurfaceEvent.count({ where: { ballId: ball.id } })).toBe(events);
    expect(await Ball.findByPk(ball.id)).toMatchObject({ surfaceGrit: 2000, polished: true });
  });

  it('an oil extraction records a surface event with the surface unchanged and keeps the games since resurface', async () => {
    const { center, owner, bowler, ball } = await shopWorld();
    const svc = await api
      .post(`/api/centers/${center.id}/services`)
      .set(owner.auth)
      .send({ kind: 'oil-extraction', name: 'Oil extraction', priceCents: 3000 });
    const o = await placeOrder(bowler, svc.body.item.id, ball.id);
    await payByWebhook(o);
    const before = (await Ball.findByPk(ball.id))!;
    await move(owner.auth, o.id, 'ready');
    const after = (await Ball.findByPk(ball.id))!;
    expect(after).toMatchObject({
      surfaceGrit: before.surfaceGrit,
      polished: before.polished,
      gamesSinceResurface: before.gamesSinceResurface,
    });
    const last = await SurfaceEvent.findOne({ where: { ballId: ball.id }, order: [['id', 'DESC']] });
    expect(last).toMatchObject({
      fromGrit: before.surfaceGrit,
      toGrit: before.surfaceGrit,
      note: expect.stringContaining('Oil extraction'),
    });
  });

  it('a refunded order cannot be moved on, and a ready order can still be refunded', async () => {
    const { resurface, owner, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, resurface.id, ball.id);
    const objs = await payByWebhook(order);
    await move(owner.auth, order.id, 'ready');
    await sendEvent(event('charge.refunded', objs.charge));
    expect((await getOrder(bowler, order.id)).status).toBe('refunded');
    expect((await move(owner.auth, order.id, 'collected')).status).toBe(409);
  });
});

describe('the day’s takings', () => {
  it('sums the day’s payments and refunds by service, for the proprietor only', async () => {
    const { center, resurface, polish, owner, bowler, ball } = await shopWorld();
    const a = await placeOrder(bowler, resurface.id, ball.id);
    const b = await placeOrder(bowler, resurface.id, ball.id);
    const c = await placeOrder(bowler, polish.id, ball.id);
    await placeOrder(bowler, polish.id, ball.id); // unpaid: not takings
    await payByWebhook(a);
    const paidB = await payByWebhook(b);
    await payByWebhook(c);
    await sendEvent(event('charge.refunded', paidB.charge));
    const today = new Date().toISOString().slice(0, 10);
    const res = await api.get(`/api/centers/${center.id}/takings?date=${today}`).set(owner.auth);
    expect(res.status).toBe(200);
    expect(res.body.item).toEqual({
      date: today,
      from: today,
      to: today,
      timeZone: 'UTC',
      days: [{ date: today, orders: 3, paidCents: 4500 + 4500 + 2500, refundedCents: 4500, netCents: 4500 + 2500 }],
      currency: 'usd',
      orders: 3,
      paidCents: 4500 + 4500 + 2500,
      refundedCents: 4500,
      netCents: 4500 + 2500,
      byService: [
        { serviceId: resurface.id, name: resurface.name, count: 2, cents: 9000 },
        { serviceId: polish.id, name: polish.name, count: 1, cents: 2500 },
      ],
    });
    expect((await api.get(`/api/centers/${center.id}/takings`).set(owner.auth)).body.item.date).toBe(today);
    const empty = await api.get(`/api/centers/${center.id}/takings?date=2001-02-03`).set(owner.auth);
    expect(empty.body.item).toMatchObject({ orders: 0, paidCents: 0, refundedCents: 0, netCents: 0, byService: [] });
    expect((await api.get(`/api/centers/${center.id}/takings`).set(bowler.auth)).status).toBe(403);
    expect((await api.get(`/api/centers/${center.id}/takings?date=tomorrow`).set(owner.auth)).status).toBe(400);
  });
});
