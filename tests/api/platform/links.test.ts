import Stripe from 'stripe';
import { describe, expect, it } from 'vitest';
import { stripeClient } from '../../../server/lib/payments';
import { publicUrl } from '../../../server/lib/publicUrl';
import { Payment } from '../../../server/models/index';
import { api, createUser, uniqueEmail } from '../../helpers/api';
import { createCenter, createPattern } from '../../helpers/fixtures';
import { waitForMail } from '../../helpers/mail';
import { payByWebhook, placeOrder, shopWorld } from '../shop/shopHelpers';

/** Finding 4: links are built from configuration only; the request's Host and X-Forwarded-* never reach one. */
const EVIL = 'attacker.example';
const spoof = { Host: EVIL, 'X-Forwarded-Host': EVIL, 'X-Forwarded-Proto': 'https', Forwarded: `host=${EVIL};proto=https` };
const urls = (text: string) => text.match(/https?:\/\/[^\s"<>]+/g) ?? [];

function expectOurLinks(text: string): void {
  expect(text).not.toContain(EVIL);
  const found = urls(text);
  expect(found.length).toBeGreaterThan(0);
  for (const u of found) expect(u.startsWith(publicUrl())).toBe(true);
}

describe('links in mails and checkout pages ignore the request’s host headers', () => {
  it('reset, verification and "already registered" mails', async () => {
    const { user } = await createUser();
    await api.post('/api/auth/forgot').set(spoof).send({ email: user.email });
    expectOurLinks((await waitForMail(user.email, 5000, /reset/i)).text);
    const email = uniqueEmail('hosted');
    await api.post('/api/auth/register').set(spoof).send({ email, password: 'amber-kettle-fjord-nine', displayName: 'Host Check' });
    expectOurLinks((await waitForMail(email, 5000, /confirm/i)).text);
    await api.post('/api/auth/register').set(spoof).send({ email, password: 'amber-kettle-fjord-nine', displayName: 'Host Check' });
    expectOurLinks((await waitForMail(email, 5000, /already/i)).text);
  });

  it('coaching invitation and plan mails', async () => {
    const coach = await createUser('coach');
    const student = await createUser();
    const inv = await api.post('/api/coach/invitations').set(coach.auth).set(spoof).send({ email: student.user.email });
    expect(inv.status).toBe(201);
    expectOurLinks((await waitForMail(student.user.email, 5000, /invites/i)).text);
    await api.post(`/api/coach/links/${inv.body.item.id}/accept`).set(student.auth).expect(200);
    await api
      .post(`/api/coach/students/${student.user.id}/plans`)
      .set(coach.auth)
      .set(spoof)
      .send({ title: 'Line plan', kind: 'line', body: 'Two left.' })
      .expect(201);
    expectOurLinks((await waitForMail(student.user.email, 5000, /plan/i)).text);
  });

  it('a follower’s condition mail (page and unsubscribe links)', async () => {
    const owner = await createUser('proprietor');
    const center = await createCenter(owner.user.id, 8);
    const pattern = await createPattern(owner.user.id);
    const follower = await createUser();
    await api.post(`/api/centers/${center.id}/follow`).set(follower.auth).expect(200);
    await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .set(spoof)
      .send({ patternId: pattern.id, lanes: [1], validFrom: new Date().toISOString().slice(0, 10) })
      .expect(201);
    expectOurLinks((await waitForMail(follower.user.email)).text);
  });

  it('checkout success and cancel pages, and the receipt mail', async () => {
    const w = await shopWorld();
    const order = await placeOrder(w.bowler, w.resurface.id, w.ball.id);
    const co = await api.post(`/api/orders/${order.id}/checkout`).set(w.bowler.auth).set(spoof);
    expect(co.status).toBe(200);
    const payment = await Payment.findOne({ where: { orderId: order.id } });
    const session: Stripe.Checkout.Session = await (await stripeClient()).checkout.sessions.retrieve(payment!.checkoutSessionId!);
    for (const u of [session.success_url!, session.cancel_url!]) {
      expect(u).not.toContain(EVIL);
      expect(u.startsWith(`${publicUrl()}/orders/${order.id}`)).toBe(true);
    }
    await payByWebhook(order);
    expectOurLinks((await waitForMail(w.bowler.user.email, 5000, /receipt|paid/i)).text);
  });
});
