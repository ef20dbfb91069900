import express, { Router, type Request, type Response } from 'express';
import type Stripe from 'stripe';
import { logger } from '../../lib/logger';
import { verifyWebhook } from '../../lib/payments';
import { checkEvent } from './paymentEvents';
import { handlePaymentEvent } from './payments.service';

/**
 * The payment service's webhook (public; authenticity is the signature). Mounted before the JSON parser:
 * the signature covers the exact bytes, so the body is read raw (up to 1 MB) and verified with the SDK.
 */
export const paymentsRouter = Router();
paymentsRouter.post('/webhook', express.raw({ type: () => true, limit: '1mb' }), async (req: Request, res: Response) => {
  const raw = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
  let event: Stripe.Event;
  try {
    event = verifyWebhook(raw, req.get('stripe-signature'));
  } catch (err) {
    logger.warn({ err: err instanceof Error ? err.message : String(err) }, 'webhook refused: bad signature');
    res.status(400).json({ error: { code: 'bad_signature', message: 'The webhook signature is missing, invalid or too old' } });
    return;
  }
  const result = await handlePaymentEvent(checkEvent(event));
  res.json({ received: true, ...(result === 'duplicate' ? { duplicate: true } : {}) });
});
