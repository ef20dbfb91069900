import express from 'express';
import type Stripe from 'stripe';
import { z } from 'zod';
import { AppError } from '../../lib/AppError';
import { logger } from '../../lib/logger';
import { verifyWebhook } from '../../lib/payments';
import { route, type RouteGroup } from '../../http/route';
import { checkEvent } from './paymentEvents';
import { handlePaymentEvent } from './payments.service';

/**
 * The payment service's webhook (public; authenticity is the signature). Mounted before the JSON parser:
 * the signature covers the exact bytes, so the body is read raw (up to 1 MB) and verified with the SDK.
 */
export const paymentsRoutes: RouteGroup = {
  prefix: '/payments',
  rawBody: true,
  routes: [
    route({
      method: 'post',
      path: '/webhook',
      access: 'token',
      who: 'public (Stripe-Signature)',
      summary: 'Payment-service events (raw body, Stripe-Signature verified; each event id processed once)',
      before: [express.raw({ type: () => true, limit: '1mb' })],
      response: z.object({ received: z.literal(true), duplicate: z.literal(true).optional() }),
      handler: async ({ req }) => {
        const raw = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
        let event: Stripe.Event;
        try {
          event = verifyWebhook(raw, req.get('stripe-signature'));
        } catch (err) {
          logger.warn({ err: err instanceof Error ? err.message : String(err) }, 'webhook refused: bad signature');
          throw new AppError(400, 'bad_signature', 'The webhook signature is missing, invalid or too old');
        }
        const result = await handlePaymentEvent(checkEvent(event));
        return { received: true as const, ...(result === 'duplicate' ? { duplicate: true as const } : {}) };
      },
    }),
  ],
};
