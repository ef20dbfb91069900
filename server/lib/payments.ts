import path from 'node:path';
import Stripe from 'stripe';
import { config } from '../config/index';
import { startStripeFake, type StripeFake } from '../dev/stripeFake/index';
import { logger } from './logger';

/**
 * The one place the card-payment client is built from the configuration.
 * - STRIPE_SECRET_KEY + STRIPE_WEBHOOK_SECRET set: the official SDK talks to the real service
 *   (or to STRIPE_API_URL when given, e.g. the fake run on its own) — no code change.
 * - Neither set (development and tests only; production refuses to start): the project's own fake is
 *   started in-process on loopback and the SDK reaches it through its own host/port/protocol options.
 */

/** Development/test credentials of the in-process fake (never valid anywhere else). */
const FAKE_SECRET_KEY = 'sk_test_lanewright_local_fake';
const FAKE_WEBHOOK_SECRET = 'whsec_lanewright_local_fake_signing_secret';

export const usingPaymentFake = !config.STRIPE_SECRET_KEY;

let client: Stripe | null = null;
let fake: Promise<StripeFake> | null = null;
let webhookTarget: string | null = null;

function urlOptions(url: string): Pick<Stripe.StripeConfig, 'host' | 'port' | 'protocol'> {
  const u = new URL(url);
  const protocol = u.protocol === 'http:' ? 'http' : 'https';
  return { host: u.hostname, port: u.port ? Number(u.port) : protocol === 'http' ? 80 : 443, protocol };
}

/** Starts the in-process fake once (no-op with a configured key). */
export function paymentFake(): Promise<StripeFake> | null {
  if (!usingPaymentFake) return null;
  // In development its state survives restarts (a payment made before `tsx watch` reloaded can still be refunded).
  const stateFile = config.NODE_ENV === 'development' ? path.resolve('.data', 'payment-fake.json') : undefined;
  fake ??= startStripeFake({ port: config.STRIPE_FAKE_PORT, webhookSecret: FAKE_WEBHOOK_SECRET, webhookUrl: webhookTarget, stateFile }).then((f) => {
    logger.info({ url: f.url }, 'local payment fake listening');
    return f;
  });
  return fake;
}

/** Where the in-process fake delivers its webhook events (the server calls this once it listens). */
export async function setPaymentWebhookTarget(url: string | null): Promise<void> {
  webhookTarget = url;
  const f = paymentFake();
  if (f) (await f).setWebhookUrl(url);
}

/** The SDK client. */
export async function stripeClient(): Promise<Stripe> {
  if (client) return client;
  const common: Stripe.StripeConfig = { maxNetworkRetries: 2, timeout: 20000, appInfo: { name: 'Lanewright' }, telemetry: false };
  if (config.STRIPE_SECRET_KEY) {
    client = new Stripe(config.STRIPE_SECRET_KEY, { ...common, ...(config.STRIPE_API_URL ? urlOptions(config.STRIPE_API_URL) : {}) });
  } else {
    const f = await paymentFake()!;
    client = new Stripe(FAKE_SECRET_KEY, { ...common, host: f.host, port: f.port, protocol: 'http' });
  }
  return client;
}

/** The secret webhook signatures are checked with. */
export function webhookSecret(): string {
  return config.STRIPE_WEBHOOK_SECRET ?? FAKE_WEBHOOK_SECRET;
}

/** Verifies a webhook's signature (and its timestamp, 5 minutes' tolerance) with the SDK's helper; throws when it does not match. */
export function verifyWebhook(rawBody: Buffer | string, signature: string | undefined): Stripe.Event {
  return Stripe.webhooks.constructEvent(rawBody, signature ?? '', webhookSecret());
}

export async function closePayments(): Promise<void> {
  client = null;
  const f = fake;
  fake = null;
  if (f) await (await f).close();
}
