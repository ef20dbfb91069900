/**
 * The environment a bench gives the production server it starts: NODE_ENV=production refuses to start without a
 * signing secret, a public address, mail and the payment keys. Every secret is generated at run time (throwaway,
 * never written down); payments point at a closed local port, so no bench ever reaches a payment service.
 */
import crypto from 'node:crypto';

const random = (bytes = 24) => crypto.randomBytes(bytes).toString('base64url');

export function productionEnv(databaseUrl: string, publicUrl = 'http://127.0.0.1'): NodeJS.ProcessEnv & { NODE_ENV: 'production' } {
  return {
    ...process.env,
    DATABASE_URL: databaseUrl,
    NODE_ENV: 'production',
    JWT_SECRET: random(48),
    PUBLIC_URL: publicUrl,
    SMTP_URL: 'smtp://127.0.0.1:9',
    STRIPE_SECRET_KEY: `sk_test_${random()}`,
    STRIPE_WEBHOOK_SECRET: `whsec_${random()}`,
    STRIPE_API_URL: 'http://127.0.0.1:9',
    LOG_LEVEL: 'warn',
  };
}
