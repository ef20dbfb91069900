import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseForm } from '../../../server/dev/stripeFake/form';
import { startStripeFake, type StripeFake } from '../../../server/dev/stripeFake/index';
import { submitCard } from './shopHelpers';

// The fake on its own, driven by the official SDK: what it answers must be what the SDK understands.
const SECRET = 'whsec_fake_test_secret_0123456789';
let fake: StripeFake;
let stripe: Stripe;
let receiver: http.Server;
let receiverUrl: string;
const received: { event: Stripe.Event }[] = [];
let failFirst = 0;

beforeAll(async () => {
  receiver = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      if (failFirst > 0) {
        failFirst -= 1;
        res.writeHead(503).end();
        return;
      }
      try {
        received.push({ event: Stripe.webhooks.constructEvent(Buffer.concat(chunks), String(req.headers['stripe-signature']), SECRET) });
        res.writeHead(200, { 'Content-Type': 'application/json' }).end('{"received":true}');
      } catch {
        res.writeHead(400).end();
      }
    });
  });
  await new Promise<void>((r) => receiver.listen(0, '127.0.0.1', () => r()));
  receiverUrl = `http://127.0.0.1:${(receiver.address() as AddressInfo).port}/hook`;
  fake = await startStripeFake({ webhookSecret: SECRET, webhookUrl: receiverUrl, retryDelaysMs: [50, 100, 200], redirectWaitMs: 2000 });
  stripe = new Stripe('sk_test_fake_suite', { host: fake.host, port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
});
afterAll(async () => {
  await fake.close();
  await new Promise<void>((r) => receiver.close(() => r()));
});

const newSession = () =>
  stripe.checkout.sessions.create({
    mode: 'payment',
    line_items: [{ quantity: 2, price_data: { currency: 'usd', unit_amount: 1250, product_data: { name: 'Polish' } } }],
    success_url: 'http://shop.example.test/done?session={CHECKOUT_SESSION_ID}',
    cancel_url: 'http://shop.example.test/cancelled',
    metadata: { orderId: '7' },
    payment_intent_data: { metadata: { orderId: '7' } },
  });

describe('the payment fake through the SDK', () => {
  it('decodes the SDK’s nested form encoding', () => {
    expect(
      parseForm('line_items[0][price_data][unit_amount]=4500&line_items[0][quantity]=1&metadata[orderId]=7&mode=payment&__proto__[x]=1'),
    ).toEqual({
      line_items: [{ price_data: { unit_amount: '4500' }, quantity: '1' }],
      metadata: { orderId: '7' },
      mode: 'payment',
    });
  });

  it('creates and retrieves a checkout session shaped like the real one; the success URL gets the session id', async () => {
    const s = await newSession();
    expect(s).toMatchObject({
      object: 'checkout.session',
      amount_total: 2500,
      currency: 'usd',
      status: 'open',
      payment_status: 'unpaid',
      payment_intent: null,
      metadata: { orderId: '7' },
    });
    expect(s.url).toBe(`${fake.url}/pay/${s.id}`);
    expect((await stripe.checkout.sessions.retrieve(s.id)).id).toBe(s.id);
    const res = await submitCard(s.url!, '4242424242424242');
    expect(res.location).toBe(`http://shop.example.test/done?session=${s.id}`);
    const done = await stripe.checkout.sessions.retrieve(s.id);
    expect(done).toMatchObject({ status: 'complete', payment_status: 'paid', payment_intent: expect.stringMatching(/^pi_test_/) });
    const pi = await stripe.paymentIntents.retrieve(done.payment_intent as string);
    expect(pi).toMatchObject({ status: 'succeeded', amount: 2500, amount_received: 2500, metadata: { orderId: '7' } });
    await fake.idle();
    const types = received
      .filter((r) => (r.event.data.object as { metadata?: Record<string, string> }).metadata?.orderId === '7')
      .map((r) => r.event.type);
    expect(types).toEqual(expect.arrayContaining(['charge.succeeded', 'payment_intent.succeeded', 'checkout.session.completed']));
  });

  it('answers errors the SDK turns into its own error classes', async () => {
    await expect(stripe.checkout.sessions.retrieve('cs_test_nothing')).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      code: 'resource_missing',
      statusCode: 404,
    });
    await expect(stripe.refunds.create({ payment_intent: 'pi_test_nothing' })).rejects.toBeInstanceOf(
      Stripe.errors.StripeInvalidRequestError,
    );
    await expect(stripe.checkout.sessions.create({ mode: 'payment', success_url: 'http://x.test/' })).rejects.toMatchObject({
      code: 'parameter_missing',
      param: 'line_items',
    });
    const noKey = new Stripe('pk_test_not_a_secret', { host: fake.host, port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
    await expect(noKey.checkout.sessions.retrieve('cs_test_x')).rejects.toMatchObject({
      type: 'StripeAuthenticationError',
      statusCode: 401,
    });
  });

  it('refunds a paid intent once, sends charge.refunded, refuses a second; an idempotency key replays the first answer', async () => {
    const s = await newSession();
    await submitCard(s.url!, '4242424242424242');
    const pi = (await stripe.checkout.sessions.retrieve(s.id)).payment_intent as string;
    const r1 = await stripe.refunds.create({ payment_intent: pi }, { idempotencyKey: `refund-${pi}` });
    const r1again = await stripe.refunds.create({ payment_intent: pi }, { idempotencyKey: `refund-${pi}` });
    expect(r1).toMatchObject({ object: 'refund', status: 'succeeded', amount: 2500, payment_intent: pi });
    expect(r1again.id).toBe(r1.id);
    await expect(stripe.refunds.create({ payment_intent: pi })).rejects.toMatchObject({ code: 'charge_already_refunded' });
    await fake.idle();
    const refunded = received.filter(
      (r) => r.event.type === 'charge.refunded' && (r.event.data.object as Stripe.Charge).payment_intent === pi,
    );
    expect(refunded).toHaveLength(1);
    expect(refunded[0].event.data.object as Stripe.Charge).toMatchObject({ amount_refunded: 2500, refunded: true });
  });

  it('retries a webhook the receiver did not take until it answers 2xx, with a fresh signature each time', async () => {
    failFirst = 2;
    const s = await newSession();
    await fake.idle();
    const before = fake.deliveries.length;
    await stripe.checkout.sessions.expire(s.id);
    await fake.idle();
    const ev = fake.events.find((e) => e.type === 'checkout.session.expired' && (e.data.object as { id: string }).id === s.id)!;
    const attempts = fake.deliveries.slice(before).filter((d) => d.eventId === ev.id);
    expect(attempts.map((d) => d.status)).toEqual([503, 503, 200]);
    expect(received.filter((r) => r.event.id === ev.id)).toHaveLength(1);
    await expect(stripe.checkout.sessions.expire(s.id)).rejects.toMatchObject({ code: 'checkout_session_not_open' });
  });

  it('its Cancel button takes the browser back to cancel_url, the session still open', async () => {
    const s = await newSession();
    const res = await fetch(`${s.url}/cancel?`, { redirect: 'manual' });
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe('http://shop.example.test/cancelled');
    expect((await stripe.checkout.sessions.retrieve(s.id)).status).toBe('open');
  });

  it('its card page checks the number, the expiry and the CVC before charging', async () => {
    const s = await newSession();
    expect((await submitCard(s.url!, '4242424242424241')).html).toContain('Your card number is invalid.');
    expect((await submitCard(s.url!, '4242424242424242', { exp: '01 / 20' })).html).toContain('in the past');
    expect((await submitCard(s.url!, '4242424242424242', { cvc: '1' })).html).toContain('security code');
    expect((await stripe.checkout.sessions.retrieve(s.id)).status).toBe('open');
  });

  it('with a state file, a payment made before a restart can be refunded after it', async () => {
    const stateFile = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'lw-fake-')), 'state.json');
    const first = await startStripeFake({ webhookSecret: SECRET, stateFile });
    const sdk1 = new Stripe('sk_test_restart', { host: first.host, port: first.port, protocol: 'http', maxNetworkRetries: 0 });
    const s = await sdk1.checkout.sessions.create({
      mode: 'payment',
      line_items: [{ quantity: 1, price_data: { currency: 'usd', unit_amount: 3000, product_data: { name: 'Oil extraction' } } }],
      success_url: 'http://x.test/ok',
    });
    const open = await sdk1.checkout.sessions.create({
      mode: 'payment',
      line_items: [{ quantity: 1, price_data: { currency: 'usd', unit_amount: 3000, product_data: { name: 'Oil extraction' } } }],
      success_url: 'http://x.test/ok',
    });
    await submitCard(s.url!, '4242424242424242');
    await first.close();
    const second = await startStripeFake({ webhookSecret: SECRET, stateFile });
    try {
      const sdk2 = new Stripe('sk_test_restart', { host: second.host, port: second.port, protocol: 'http', maxNetworkRetries: 0 });
      const pi = (await sdk2.checkout.sessions.retrieve(s.id)).payment_intent as string;
      expect(await sdk2.refunds.create({ payment_intent: pi })).toMatchObject({ status: 'succeeded', amount: 3000 });
      expect((await sdk2.checkout.sessions.retrieve(open.id)).url).toBe(`${second.url}/pay/${open.id}`);
    } finally {
      await second.close();
      fs.rmSync(path.dirname(stateFile), { recursive: true, force: true });
    }
  });
});
