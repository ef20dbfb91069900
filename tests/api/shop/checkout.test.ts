import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { publicUrl } from '../../../server/lib/publicUrl';
import { AuditEvent, MailOutbox, OrderEvent, Payment, PaymentEvent } from '../../../server/models/index';
import { paymentFake, setPaymentWebhookTarget, stripeClient } from '../../../server/lib/payments';
import { api, createUser, errorOf } from '../../helpers/api';
import { waitForMail } from '../../helpers/mail';
import {
  fakeIdle,
  getOrder,
  listenForWebhooks,
  placeOrder,
  postWebhook,
  shopWorld,
  signature,
  submitCard,
  waitFor,
  type TestUser,
} from './shopHelpers';

// The whole flow through the official SDK against the project's fake: checkout session → hosted card
// page → signed webhook delivered over HTTP to this app listening on loopback → the order is paid.
let listener: Awaited<ReturnType<typeof listenForWebhooks>>;
beforeAll(async () => {
  listener = await listenForWebhooks();
});
afterAll(async () => {
  await listener.close();
});

async function startCheckout(bowler: TestUser, orderId: number): Promise<{ url: string; checkoutSessionId: string }> {
  // A spoofed Host must not reach the return pages (links come from PUBLIC_URL only; tests/api/platform/links.test.ts).
  const res = await api.post(`/api/orders/${orderId}/checkout`).set(bowler.auth).set('Host', 'lanes.example.test');
  expect(res.status).toBe(200);
  return res.body as { url: string; checkoutSessionId: string };
}

const paid = (bowler: TestUser, id: number) =>
  waitFor(
    () => getOrder(bowler, id),
    (o) => o.status === 'paid',
  );

describe('paying by card through the SDK and the local fake', () => {
  it('4242 4242 4242 4242: checkout, card page, signed webhook to the listening server → paid, receipt mailed', async () => {
    const { resurface, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, resurface.id, ball.id);
    const { url, checkoutSessionId } = await startCheckout(bowler, order.id);
    const fake = await paymentFake()!;
    expect(url).toBe(`${fake.url}/pay/${checkoutSessionId}`);
    expect(checkoutSessionId).toMatch(/^cs_test_/);
    expect((await getOrder(bowler, order.id)).paymentStatus).toBe('processing');

    // The session the SDK created carries the server's price, not anything the client said.
    const stripe = await stripeClient();
    const session = await stripe.checkout.sessions.retrieve(checkoutSessionId);
    expect(session).toMatchObject({
      amount_total: 4500,
      currency: 'usd',
      mode: 'payment',
      status: 'open',
      client_reference_id: String(order.id),
      metadata: { orderId: String(order.id) },
    });
    expect(session.success_url).toBe(`${publicUrl()}/orders/${order.id}?checkout=done`);
    expect(session.cancel_url).toBe(`${publicUrl()}/orders/${order.id}?checkout=cancelled`);

    const page = await fetch(url);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('$45.00');
    expect(html).toContain('<label for="cardnumber">Card number</label>');

    const res = await submitCard(url, '4242 4242 4242 4242');
    expect(res.status).toBe(303);
    expect(res.location).toBe(`${publicUrl()}/orders/${order.id}?checkout=done`);
    const o = await paid(bowler, order.id);
    expect(o).toMatchObject({ paymentStatus: 'paid', amountCents: 4500, lastPaymentError: null });
    await fakeIdle();
    const completion = fake.events.find(
      (e) => e.type === 'checkout.session.completed' && (e.data.object as { id: string }).id === checkoutSessionId,
    )!;
    expect(fake.deliveries.filter((d) => d.eventId === completion.id).map((d) => d.status)).toEqual([200]);
    expect(await PaymentEvent.findByPk(completion.id)).toMatchObject({ outcome: 'paid' });
    const payment = await Payment.findOne({ where: { checkoutSessionId } });
    expect(payment).toMatchObject({ status: 'paid', paymentIntentId: expect.stringMatching(/^pi_test_/), amountCents: 4500 });
    expect((await waitForMail(bowler.user.email)).subject).toContain('receipt');
    // The paid session's page no longer takes a card.
    expect((await submitCard(url, '4242424242424242')).html).toContain('already paid');
  });

  it('4000 0000 0000 0002 is declined: the order stays unpaid with the reason, and can be paid with another card', async () => {
    const { polish, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, polish.id, ball.id);
    const { url } = await startCheckout(bowler, order.id);
    const res = await submitCard(url, '4000000000000002');
    expect(res.status).toBe(402);
    expect(res.html).toContain('Your card was declined.');
    await fakeIdle();
    const o = await getOrder(bowler, order.id);
    expect(o).toMatchObject({ status: 'ordered', paymentStatus: 'failed', lastPaymentError: 'Your card was declined.', paidAt: null });
    expect(await AuditEvent.count({ where: { action: 'payment.failed', subjectId: String(order.id) } })).toBe(1);
    expect(await MailOutbox.count({ where: { ref: `${order.id}:receipt` } })).toBe(0);
    // Retry on the same page with a good card.
    expect((await submitCard(url, '4242424242424242')).status).toBe(303);
    expect(await paid(bowler, order.id)).toMatchObject({ lastPaymentError: null });
  });

  it('4000 0025 0000 3155 asks for authentication: failing it leaves the order unpaid; approving it pays', async () => {
    const { redrill, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, redrill.id, ball.id);
    const { url } = await startCheckout(bowler, order.id);
    const challenge = await submitCard(url, '4000 0025 0000 3155');
    expect(challenge.status).toBe(200);
    expect(challenge.html).toContain('Confirm this payment');
    const intent = /name="payment_intent" value="([^"]+)"/.exec(challenge.html)![1];
    const failRes = await fetch(`${url}/challenge`, {
      method: 'POST',
      body: new URLSearchParams({ payment_intent: intent, outcome: 'fail' }),
      redirect: 'manual',
    });
    expect(failRes.status).toBe(402);
    await fakeIdle();
    const failed = await getOrder(bowler, order.id);
    expect(failed).toMatchObject({ status: 'ordered', paymentStatus: 'failed' });
    expect(failed.lastPaymentError).toMatch(/unable to authenticate/);
    // Again, approved this time.
    const again = await submitCard(url, '4000002500003155');
    const intent2 = /name="payment_intent" value="([^"]+)"/.exec(again.html)![1];
    const ok = await fetch(`${url}/challenge`, {
      method: 'POST',
      body: new URLSearchParams({ payment_intent: intent2, outcome: 'approve' }),
      redirect: 'manual',
    });
    expect(ok.status).toBe(303);
    expect(await paid(bowler, order.id)).toMatchObject({ paymentStatus: 'paid', amountCents: 8000 });
  });

  it('a second checkout resumes the open one; one closed at the service is replaced; only the bowler who ordered can start one; a paid order cannot be paid again', async () => {
    const { resurface, owner, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, resurface.id, ball.id);
    const first = await startCheckout(bowler, order.id);
    expect(await startCheckout(bowler, order.id)).toEqual(first);
    const stripe = await stripeClient();
    await stripe.checkout.sessions.expire(first.checkoutSessionId);
    const second = await startCheckout(bowler, order.id);
    expect(second.checkoutSessionId).not.toBe(first.checkoutSessionId);
    expect(await Payment.findOne({ where: { checkoutSessionId: first.checkoutSessionId } })).toMatchObject({ status: 'expired' });
    expect((await submitCard(first.url, '4242424242424242')).status).toBe(410);
    expect((await api.post(`/api/orders/${order.id}/checkout`).set(owner.auth)).status).toBe(403);
    expect((await api.post(`/api/orders/${order.id}/checkout`).set((await createUser()).auth)).status).toBe(404);
    await submitCard(second.url, '4242424242424242');
    await paid(bowler, order.id);
    const again = await api.post(`/api/orders/${order.id}/checkout`).set(bowler.auth);
    expect(again.status).toBe(409);
    expect(errorOf(again.body).code).toBe('not_payable');
  });

  it('paying again after a declined card goes back to the same open session', async () => {
    const { polish, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, polish.id, ball.id);
    const first = await startCheckout(bowler, order.id);
    await submitCard(first.url, '4000000000000002');
    await fakeIdle();
    expect((await getOrder(bowler, order.id)).paymentStatus).toBe('failed');
    const again = await startCheckout(bowler, order.id);
    expect(again.checkoutSessionId).toBe(first.checkoutSessionId);
    expect((await getOrder(bowler, order.id)).lastPaymentError).toBe('Your card was declined.');
    expect((await submitCard(again.url, '4242424242424242')).status).toBe(303);
    await paid(bowler, order.id);
  });

  it('two checkouts started at once (a double click) get the same session', async () => {
    const { polish, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, polish.id, ball.id);
    const results = await Promise.all([
      api.post(`/api/orders/${order.id}/checkout`).set(bowler.auth),
      api.post(`/api/orders/${order.id}/checkout`).set(bowler.auth),
    ]);
    expect(results.map((r) => r.status)).toEqual([200, 200]);
    expect(results[0].body.checkoutSessionId).toBe(results[1].body.checkoutSessionId);
    expect(await Payment.count({ where: { orderId: order.id } })).toBe(1);
  });

  it('cancelling an order with an open checkout expires it, so the page no longer takes a card', async () => {
    const { polish, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, polish.id, ball.id);
    const { url, checkoutSessionId } = await startCheckout(bowler, order.id);
    expect((await api.post(`/api/orders/${order.id}/cancel`).set(bowler.auth)).body.item.status).toBe('cancelled');
    expect((await (await stripeClient()).checkout.sessions.retrieve(checkoutSessionId)).status).toBe('expired');
    expect((await submitCard(url, '4242424242424242')).status).toBe(410);
    await fakeIdle();
    expect(await getOrder(bowler, order.id)).toMatchObject({ status: 'cancelled', paymentStatus: 'unpaid' });
  });
});

describe('refunds through the SDK', () => {
  it('the shop refunds a paid order: refunded at once, the later charge.refunded webhook changes nothing more; one mail, one audit', async () => {
    const { resurface, owner, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, resurface.id, ball.id);
    const { url } = await startCheckout(bowler, order.id);
    await submitCard(url, '4242424242424242');
    await paid(bowler, order.id);
    expect((await api.post(`/api/orders/${order.id}/refund`).set(bowler.auth)).status).toBe(403);
    const res = await api.post(`/api/orders/${order.id}/refund`).set(owner.auth);
    expect(res.status).toBe(200);
    expect(res.body.item).toMatchObject({ status: 'refunded', paymentStatus: 'refunded', refundedAt: expect.any(String) });
    await fakeIdle();
    const fake = await paymentFake()!;
    const refunded = fake.events.filter(
      (e) => e.type === 'charge.refunded' && (e.data.object as { metadata: { orderId: string } }).metadata.orderId === String(order.id),
    );
    expect(refunded).toHaveLength(1);
    expect(await PaymentEvent.findByPk(refunded[0].id)).toMatchObject({ outcome: 'already_refunded' });
    expect(await OrderEvent.count({ where: { orderId: order.id, status: 'refunded' } })).toBe(1);
    expect(await AuditEvent.count({ where: { action: 'order.refunded', subjectId: String(order.id) } })).toBe(1);
    expect(await AuditEvent.count({ where: { action: 'refund.requested', subjectId: String(order.id), actorId: owner.user.id } })).toBe(1);
    expect(await MailOutbox.count({ where: { ref: `${order.id}:refunded` } })).toBe(1);
    expect(await Payment.findOne({ where: { orderId: order.id, status: 'refunded' } })).toMatchObject({
      refundedCents: 4500,
      refundId: expect.stringMatching(/^re_test_/),
    });
    // A second refund is refused.
    const twice = await api.post(`/api/orders/${order.id}/refund`).set(owner.auth);
    expect(twice.status).toBe(409);
    expect(errorOf(twice.body).code).toBe('not_refundable');
  });

  it('an unpaid order cannot be refunded', async () => {
    const { polish, owner, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, polish.id, ball.id);
    const res = await api.post(`/api/orders/${order.id}/refund`).set(owner.auth);
    expect(res.status).toBe(409);
  });

  it('two refund clicks at once refund once at the payment service', async () => {
    const { resurface, owner, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, resurface.id, ball.id);
    const { url } = await startCheckout(bowler, order.id);
    await submitCard(url, '4242424242424242');
    await paid(bowler, order.id);
    const results = await Promise.all([
      api.post(`/api/orders/${order.id}/refund`).set(owner.auth),
      api.post(`/api/orders/${order.id}/refund`).set(owner.auth),
    ]);
    expect(results.every((r) => r.status === 200 || r.status === 409)).toBe(true);
    await fakeIdle();
    const fake = await paymentFake()!;
    expect(
      fake.events.filter(
        (e) => e.type === 'refund.created' && (e.data.object as { metadata: { orderId?: string } }).metadata.orderId === String(order.id),
      ),
    ).toHaveLength(1);
    expect(await OrderEvent.count({ where: { orderId: order.id, status: 'refunded' } })).toBe(1);
    expect(await MailOutbox.count({ where: { ref: `${order.id}:refunded` } })).toBe(1);
  });

  it('a payment that completes after the bowler cancelled is refunded automatically; the order stays cancelled', async () => {
    const { polish, bowler, ball } = await shopWorld();
    const order = await placeOrder(bowler, polish.id, ball.id);
    const { url, checkoutSessionId } = await startCheckout(bowler, order.id);
    const fake = await paymentFake()!;
    // The completion is held back (as if delayed in transit) while the bowler cancels.
    await setPaymentWebhookTarget(null);
    const from = fake.events.length;
    try {
      await submitCard(url, '4242424242424242');
      expect((await api.post(`/api/orders/${order.id}/cancel`).set(bowler.auth)).body.item.status).toBe('cancelled');
    } finally {
      await setPaymentWebhookTarget(`http://127.0.0.1:${(listener.server.address() as { port: number }).port}/api/payments/webhook`);
    }
    const completion = fake.events.slice(from).find((e) => e.type === 'checkout.session.completed')!;
    const payload = JSON.stringify(completion);
    expect((await postWebhook(payload, signature(payload))).status).toBe(200);
    expect(await PaymentEvent.findByPk(completion.id)).toMatchObject({ outcome: 'paid_after_cancel_refunding' });
    // The refund goes out after commit; its charge.refunded comes back through the listening server.
    const o = await waitFor(
      () => getOrder(bowler, order.id),
      (x) => x.paymentStatus === 'refunded',
    );
    expect(o).toMatchObject({ status: 'cancelled', paidAt: null });
    expect(await Payment.findOne({ where: { checkoutSessionId } })).toMatchObject({ status: 'refunded', refundedCents: 2500 });
    await waitFor(
      () => AuditEvent.count({ where: { action: 'payment.auto_refunded', subjectId: String(order.id) } }),
      (n) => n === 1,
    );
  });
});
