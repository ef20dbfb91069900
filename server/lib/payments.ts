import crypto from 'node:crypto';
import path from 'node:path';
import Stripe from 'stripe';
import { config } from '../config/index';
import type { StripeFake } from '../dev/stripeFake/index';
import { logger } from './logger';

/**
 * The one place the card-payment client is built from the configuration.
 * - STRIPE_SECRET_KEY + STRIPE_WEBHOOK_SECRET set: the official SDK talks to the real service
 *   (or to STRIPE_API_URL when given, e.g. the fake run on its own) — no code change.
 * - Neither set (development and tests only; production refuses to start): the project's own fake is
 *   imported on demand (production never loads its code) and started in-process on loopback; the SDK
 *   reaches it through its own host/port/protocol options.
 */

/**
 * The in-process fake's credentials: drawn at random for each start and shared only between the fake and
 * this process (its SDK client and its webhook check), so a signature can never be forged from the repository.
 */
const fakeCredentials = {
  apiKey: `sk_test_${crypto.randomBytes(24).toString('base64url')}`,
  webhookSecret: `whsec_${crypto.randomBytes(32).toString('base64url')}`,
};

export const usingPaymentFake = !config.STRIPE_SECRET_KEY;

let client: Stripe | null = null;
let fake: Promise<StripeFake> | null = null;
let webhookTarget: string | null = null;

function urlOptions(url: string): Pick<Stripe.StripeConfig, 'host' | 'port' | 'protocol'> {
  const u = new URL(url);
  const protocol = u.protocol === 'http:' ? 'http' : 'https';
  return { host: u.hostname, port: u.port ? Number(u.port) : protocol === 'http' ? 80 : 443, protocol };
}

/** Starts the in-process fake once (no-op with a configured key, and never in production). */
export function paymentFake(): Promise<StripeFake> | null {
  if (!usingPaymentFake || config.NODE_ENV === 'production') return null;
  // In development its state survives restarts (a payment made before `tsx watch` reloaded can still be refunded).
  const stateFile = config.NODE_ENV === 'development' ? path.resolve(config.DATA_DIR, 'payment-fake.json') : undefined;
  fake ??= import('../dev/stripeFake/index')
    .then(({ startStripeFake }) =>
      startStripeFake({
        port: config.STRIPE_FAKE_PORT,
        apiKey: fakeCredentials.apiKey,
        webhookSecret: fakeCredentials.webhookSecret,
        webhookUrl: webhookTarget,
        stateFile,
      }),
    )
    .then((f) => {
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
    const started = paymentFake();
    if (!started) throw new Error('no payment service is configured');
    const f = await started;
    client = new Stripe(fakeCredentials.apiKey, { ...common, host: f.host, port: f.port, protocol: 'http' });
  }
  return client;
}

/** The secret webhook signatures are checked with: the configured one, else the in-process fake's of this start. */
export function webhookSecret(): string {
  return config.STRIPE_WEBHOOK_SECRET ?? fakeCredentials.webhookSecret;
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
