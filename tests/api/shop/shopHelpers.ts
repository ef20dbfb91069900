import crypto from 'node:crypto';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import Stripe from 'stripe';
import { paymentFake, setPaymentWebhookTarget, webhookSecret } from '../../../server/lib/payments';
import { Order, Payment, ShopService } from '../../../server/models/index';
import type { Order as OrderDto } from '../../../shared/shop';
import { api, app, createUser } from '../../helpers/api';
import { createBall, createCenter, URETHANE } from '../../helpers/fixtures';
export { waitFor } from '../../helpers/wait';

export type TestUser = Awaited<ReturnType<typeof createUser>>;

/** A center with its proprietor and a price list, and a bowler with a ball (2000 grit, not polished). */
export async function shopWorld() {
  const owner = await createUser('proprietor');
  const center = await createCenter(owner.user.id);
  const resurface = await ShopService.create({
    centerId: center.id,
    kind: 'resurface',
    name: 'Resurface to 4000 grit',
    grit: 4000,
    description: null,
    priceCents: 4500,
    currency: 'usd',
  });
  const polish = await ShopService.create({
    centerId: center.id,
    kind: 'polish',
    name: 'Polish',
    grit: null,
    description: null,
    priceCents: 2500,
    currency: 'usd',
  });
  const redrill = await ShopService.create({
    centerId: center.id,
    kind: 'plug-redrill',
    name: 'Plug and redrill',
    grit: null,
    description: null,
    priceCents: 8000,
    currency: 'usd',
  });
  const bowler = await createUser('bowler');
  const ball = await createBall(bowler.user.id, URETHANE, { surfaceGrit: 2000, polished: false });
  return { owner, center, resurface, polish, redrill, bowler, ball };
}

/** A new order through the API (the price list's price). */
export async function placeOrder(bowler: TestUser, serviceId: number, ballId: number): Promise<OrderDto> {
  const res = await api.post('/api/orders').set(bowler.auth).send({ serviceId, ballId });
  if (res.status !== 201) throw new Error(`order not created: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.item as OrderDto;
}

export async function getOrder(user: TestUser, id: number): Promise<OrderDto> {
  const res = await api.get(`/api/orders/${id}`).set(user.auth);
  if (res.status !== 200) throw new Error(`order ${id}: ${res.status}`);
  return res.body.item as OrderDto;
}

const rid = (prefix: string) => `${prefix}_test_${crypto.randomBytes(10).toString('hex')}`;

/** An event shaped like the payment service's, around one of its objects. */
export function event(type: string, object: Record<string, unknown>, id = rid('evt')): { id: string; payload: string } {
  const ev = {
    id,
    object: 'event',
    api_version: Stripe.API_VERSION,
    created: Math.floor(Date.now() / 1000),
    data: { object },
    livemode: false,
    pending_webhooks: 1,
    request: { id: null, idempotency_key: null },
    type,
  };
  return { id, payload: JSON.stringify(ev) };
}

/** The Stripe-Signature header for a payload, made with the SDK's own test helper. */
export function signature(payload: string, opts: { secret?: string; timestamp?: number } = {}): string {
  return Stripe.webhooks.generateTestHeaderString({
    payload,
    secret: opts.secret ?? webhookSecret(),
    ...(opts.timestamp ? { timestamp: opts.timestamp } : {}),
  });
}

export function postWebhook(payload: string, header: string | null) {
  const req = api.post('/api/payments/webhook').set('Content-Type', 'application/json');
  if (header !== null) req.set('Stripe-Signature', header);
  return req.send(payload);
}

export function sendEvent(ev: { payload: string }) {
  return postWebhook(ev.payload, signature(ev.payload));
}

/** The objects a completed card payment of an order produces (ids shared between them). */
export function paymentObjects(order: Pick<OrderDto, 'id' | 'amountCents' | 'currency'>, sessionId = rid('cs')) {
  const intentId = rid('pi');
  const chargeId = rid('ch');
  const metadata = { orderId: String(order.id) };
  const session = {
    id: sessionId,
    object: 'checkout.session',
    amount_subtotal: order.amountCents,
    amount_total: order.amountCents,
    currency: order.currency,
    client_reference_id: String(order.id),
    metadata,
    mode: 'payment',
    payment_intent: intentId,
    payment_status: 'paid',
    status: 'complete',
    url: null,
    livemode: false,
  };
  const charge = {
    id: chargeId,
    object: 'charge',
    amount: order.amountCents,
    amount_captured: order.amountCents,
    amount_refunded: order.amountCents,
    captured: true,
    currency: order.currency,
    metadata,
    paid: true,
    payment_intent: intentId,
    refunded: true,
    status: 'succeeded',
    livemode: false,
  };
  const failedIntent = {
    id: intentId,
    object: 'payment_intent',
    amount: order.amountCents,
    currency: order.currency,
    metadata,
    status: 'requires_payment_method',
    last_payment_error: { type: 'card_error', code: 'card_declined', message: 'Your card was declined.' },
    livemode: false,
  };
  return { sessionId, intentId, session, charge, failedIntent };
}

/** Marks an order paid the way the payment service does: a signed checkout.session.completed (and the Payment row the checkout would have made). */
export async function payByWebhook(order: OrderDto) {
  const objs = paymentObjects(order);
  await Payment.create({ orderId: order.id, checkoutSessionId: objs.sessionId, amountCents: order.amountCents, currency: order.currency });
  const res = await sendEvent(event('checkout.session.completed', objs.session));
  if (res.status !== 200) throw new Error(`completion refused: ${res.status} ${JSON.stringify(res.body)}`);
  return objs;
}

/** Starts the app listening on loopback and points the in-process fake's webhook deliveries at it. */
export async function listenForWebhooks(): Promise<{ server: Server; close: () => Promise<void> }> {
  const server = app.listen(0, '127.0.0.1');
  await new Promise<void>((r) => server.once('listening', () => r()));
  const port = (server.address() as AddressInfo).port;
  await setPaymentWebhookTarget(`http://127.0.0.1:${port}/api/payments/webhook`);
  return {
    server,
    close: async () => {
      await setPaymentWebhookTarget(null);
      server.closeAllConnections();
      await new Promise<void>((r) => server.close(() => r()));
    },
  };
}

/** Waits until the fake has no webhook delivery pending. */
export async function fakeIdle(): Promise<void> {
  await (await paymentFake()!).idle();
}

/** Submits the fake's hosted card form like a browser (no redirect following). */
export async function submitCard(
  url: string,
  card: string,
  extra: Record<string, string> = {},
): Promise<{ status: number; location: string | null; html: string }> {
  const res = await fetch(url, {
    method: 'POST',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ cardnumber: card, exp: '12 / 34', cvc: '123', name: 'Test Bowler', ...extra }).toString(),
    redirect: 'manual',
  });
  return { status: res.status, location: res.headers.get('location'), html: await res.text() };
}

export const orderRow = (id: number) => Order.findByPk(id);
