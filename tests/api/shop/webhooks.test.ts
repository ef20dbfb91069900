import { describe, expect, it } from 'vitest';
import { AuditEvent, MailOutbox, OrderEvent, Payment, PaymentEvent } from '../../../server/models/index';
import { errorOf } from '../../helpers/api';
import { waitForMail } from '../../helpers/mail';
import { event, getOrder, payByWebhook, paymentObjects, placeOrder, postWebhook, sendEvent, shopWorld, signature } from './shopHelpers';

describe('webhook authenticity (verified with the SDK’s constructEvent)', () => {
  it('rejects a bad signature, a missing one, one made with another secret and one with an old timestamp; nothing is processed', async () => {
    const { resurface, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, resurface.id, ball.id);
    const ev = event('checkout.session.completed', paymentObjects(order).session);
    const good = signature(ev.payload);
    const forged = good.replace(/v1=([0-9a-f])/, (_m, c: string) => `v1=${c === '0' ? '1' : '0'}`);
    const cases: [string, string | null][] = [
      ['forged', forged],
      ['missing', null],
      ['empty', ''],
      ['other secret', signature(ev.payload, { secret: 'whsec_someone_elses_secret' })],
      ['ten minutes old', signature(ev.payload, { timestamp: Math.floor(Date.now() / 1000) - 600 })],
      ['garbage', 'not a signature'],
    ];
    for (const [name, header] of cases) {
      const res = await postWebhook(ev.payload, header);
      expect(res.status, name).toBe(400);
      expect(errorOf(res.body).code, name).toBe('bad_signature');
    }
    // The body is signed byte for byte: the same signature over an altered body fails too.
    const altered = ev.payload.replace(`"amount_total":${order.amountCents}`, '"amount_total":1');
    expect((await postWebhook(altered, good)).status).toBe(400);
    expect(await PaymentEvent.count({ where: { eventId: ev.id } })).toBe(0);
    expect((await getOrder(bowler, order.id)).status).toBe('ordered');
    // The genuine delivery is accepted.
    const ok = await postWebhook(ev.payload, good);
    expect(ok.status).toBe(200);
    expect(ok.body).toEqual({ received: true });
  });
});

describe('webhook bodies', () => {
  it('a correctly signed body that is not JSON, or an empty one, is a 400 in the error shape, never a 500', async () => {
    for (const body of ['not json at all', '{"id": "evt_1", "type":', '']) {
      const res = await postWebhook(body, body ? signature(body) : signature('x'));
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(errorOf(res.body).code).toBe('bad_signature');
    }
  });
});

describe('processing each event once', () => {
  it('a repeated delivery of checkout.session.completed pays the order once: one history entry, one audit event, one receipt', async () => {
    const { resurface, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, resurface.id, ball.id);
    const objs = paymentObjects(order);
    await Payment.create({
      orderId: order.id,
      checkoutSessionId: objs.sessionId,
      amountCents: order.amountCents,
      currency: order.currency,
    });
    const ev = event('checkout.session.completed', objs.session);
    const first = await sendEvent(ev);
    const second = await sendEvent(ev);
    expect(first.status).toBe(200);
    expect(second.status).toBe(200);
    expect(second.body).toEqual({ received: true, duplicate: true });
    const o = await getOrder(bowler, order.id);
    expect(o).toMatchObject({ status: 'paid', paymentStatus: 'paid', paidAt: expect.any(String) });
    expect(o.history.map((h) => h.status)).toEqual(['ordered', 'paid']);
    expect(await AuditEvent.count({ where: { action: 'order.paid', subjectId: String(order.id) } })).toBe(1);
    expect(await MailOutbox.count({ where: { kind: 'order_receipt', ref: `${order.id}:receipt` } })).toBe(1);
    const mail = await waitForMail(bowler.user.email);
    expect(mail.subject).toContain(`receipt for order #${order.id}`);
    expect(mail.text).toContain('$45.00');
    expect(await PaymentEvent.findByPk(ev.id)).toMatchObject({ type: 'checkout.session.completed', orderId: order.id, outcome: 'paid' });
  });

  it('two concurrent deliveries of the same event are processed once', async () => {
    const { resurface, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, resurface.id, ball.id);
    const objs = paymentObjects(order);
    await Payment.create({
      orderId: order.id,
      checkoutSessionId: objs.sessionId,
      amountCents: order.amountCents,
      currency: order.currency,
    });
    const ev = event('checkout.session.completed', objs.session);
    const results = await Promise.all([sendEvent(ev), sendEvent(ev), sendEvent(ev)]);
    expect(results.map((r) => r.status)).toEqual([200, 200, 200]);
    expect(results.filter((r) => r.body.duplicate).length).toBe(2);
    expect(await OrderEvent.count({ where: { orderId: order.id, status: 'paid' } })).toBe(1);
    expect(await AuditEvent.count({ where: { action: 'order.paid', subjectId: String(order.id) } })).toBe(1);
    expect(await MailOutbox.count({ where: { ref: `${order.id}:receipt` } })).toBe(1);
  });

  it('an event for an unknown order or of a type it does not use is acknowledged and recorded, changing nothing', async () => {
    const unknown = event('checkout.session.completed', { ...paymentObjects({ id: 99999999, amountCents: 100, currency: 'usd' }).session });
    expect((await sendEvent(unknown)).status).toBe(200);
    expect(await PaymentEvent.findByPk(unknown.id)).toMatchObject({ outcome: 'unknown_order' });
    const other = event('customer.created', { id: 'cus_test_1', object: 'customer' });
    expect((await sendEvent(other)).status).toBe(200);
    expect(await PaymentEvent.findByPk(other.id)).toMatchObject({ outcome: 'ignored' });
  });
});

describe('events out of order', () => {
  it('a refund that arrives before the completion is not undone by the late completion', async () => {
    const { resurface, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, resurface.id, ball.id);
    const objs = paymentObjects(order);
    await Payment.create({
      orderId: order.id,
      checkoutSessionId: objs.sessionId,
      amountCents: order.amountCents,
      currency: order.currency,
    });
    expect((await sendEvent(event('charge.refunded', objs.charge))).status).toBe(200);
    expect((await getOrder(bowler, order.id)).status).toBe('refunded');
    expect((await sendEvent(event('checkout.session.completed', objs.session))).status).toBe(200);
    const o = await getOrder(bowler, order.id);
    expect(o).toMatchObject({ status: 'refunded', paymentStatus: 'refunded', refundedAt: expect.any(String) });
    expect(o.history.map((h) => h.status)).toEqual(['ordered', 'refunded']);
    expect(await MailOutbox.count({ where: { ref: `${order.id}:receipt` } })).toBe(0);
    expect(await MailOutbox.count({ where: { ref: `${order.id}:refunded` } })).toBe(1);
  });

  it('a failure that arrives after the success leaves the order paid', async () => {
    const { resurface, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, resurface.id, ball.id);
    const objs = await payByWebhook(order);
    expect((await sendEvent(event('payment_intent.payment_failed', objs.failedIntent))).status).toBe(200);
    expect(await getOrder(bowler, order.id)).toMatchObject({ status: 'paid', paymentStatus: 'paid', lastPaymentError: null });
  });

  it('a failure, then a success of a retried card, ends paid; a failure keeps the order unpaid and payable', async () => {
    const { resurface, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, resurface.id, ball.id);
    const objs = paymentObjects(order);
    await Payment.create({
      orderId: order.id,
      checkoutSessionId: objs.sessionId,
      amountCents: order.amountCents,
      currency: order.currency,
    });
    await sendEvent(event('payment_intent.payment_failed', objs.failedIntent));
    expect(await getOrder(bowler, order.id)).toMatchObject({
      status: 'ordered',
      paymentStatus: 'failed',
      lastPaymentError: 'Your card was declined.',
      paidAt: null,
    });
    await sendEvent(event('checkout.session.completed', objs.session));
    expect(await getOrder(bowler, order.id)).toMatchObject({ status: 'paid', paymentStatus: 'paid', lastPaymentError: null });
  });

  it('a completion whose amount differs from the order is not taken as payment', async () => {
    const { resurface, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, resurface.id, ball.id);
    const objs = paymentObjects({ ...order, amountCents: 50 });
    await sendEvent(event('checkout.session.completed', objs.session));
    expect((await getOrder(bowler, order.id)).status).toBe('ordered');
    expect(await AuditEvent.count({ where: { action: 'payment.amount_mismatch', subjectId: String(order.id) } })).toBe(1);
  });
});
