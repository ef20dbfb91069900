// Runs the payment fake on its own, beside a server configured for it:
//   tsx server/dev/stripeFake/cli.ts --port 12111 --webhook http://127.0.0.1:3000/api/payments/webhook
// It prints a signing secret made for this run (or takes --secret whsec_…); start the server with
// STRIPE_SECRET_KEY=sk_test_local STRIPE_WEBHOOK_SECRET=<that secret> STRIPE_API_URL=http://127.0.0.1:12111
// (without a key the server starts its own fake in-process instead; nothing else is needed for development).
import crypto from 'node:crypto';
import { parseArgs } from 'node:util';
import { startStripeFake } from './server';

const { values } = parseArgs({
  options: {
    port: { type: 'string', default: '12111' },
    host: { type: 'string', default: '127.0.0.1' },
    webhook: { type: 'string' },
    secret: { type: 'string' },
  },
});

const secret = values.secret ?? `whsec_${crypto.randomBytes(24).toString('base64url')}`;
const fake = await startStripeFake({
  port: Number(values.port),
  host: values.host,
  webhookSecret: secret,
  webhookUrl: values.webhook ?? null,
});
console.log(
  `Payment fake on ${fake.url} (webhooks ${values.webhook ? `to ${values.webhook}` : 'kept, not delivered'}; signing secret ${secret}). Ctrl-C stops.`,
);
const stop = () => void fake.close().then(() => process.exit(0));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
