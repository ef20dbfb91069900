import type Stripe from 'stripe';
import { z } from 'zod';
import { fieldErrors } from '../../middleware/validate';
import { AppError } from '../../lib/AppError';

/**
 * The parts of a webhook event the shop reads, checked after the signature and before anything is stored: a
 * signed but malformed event (a null object, a missing id, an amount that is not a number) is a 400 with
 * field messages, never a thrown TypeError. Unknown fields pass through (the service adds fields over time).
 */
const id = z.string({ error: 'an id (string)' }).min(1).max(255);
const metadata = z.record(z.string(), z.string()).nullable().optional();
const ref = z
  .union([z.string().max(255), z.object({ id }).passthrough()])
  .nullable()
  .optional();
const cents = z.number({ error: 'an amount in cents' }).int().min(0);

const Envelope = z
  .object({
    id,
    type: z.string({ error: 'an event type' }).min(1).max(255),
    data: z.object({ object: z.object({}, { error: 'the event object' }).passthrough() }, { error: 'the event data' }),
  })
  .passthrough();

const Session = z
  .object({
    id,
    metadata,
    client_reference_id: z.string().max(255).nullable().optional(),
    payment_status: z.string().max(64).optional(),
    amount_total: cents.nullable().optional(),
    currency: z.string().max(16).nullable().optional(),
    payment_intent: ref,
  })
  .passthrough();

const Intent = z
  .object({
    id,
    metadata,
    last_payment_error: z
      .object({ message: z.string().max(2000).optional() })
      .passthrough()
      .nullable()
      .optional(),
  })
  .passthrough();

const Charge = z
  .object({
    id,
    metadata,
    payment_intent: ref,
    amount: cents,
    amount_refunded: cents,
    refunds: z
      .object({ data: z.array(z.object({ id }).passthrough()) })
      .passthrough()
      .nullable()
      .optional(),
  })
  .passthrough();

const OBJECT_OF: Record<string, z.ZodType> = {
  'checkout.session.completed': Session,
  'checkout.session.async_payment_succeeded': Session,
  'checkout.session.async_payment_failed': Session,
  'checkout.session.expired': Session,
  'payment_intent.payment_failed': Intent,
  'charge.refunded': Charge,
};

/** The verified event, checked by schema (its envelope, and the object of every type the shop handles); 400 otherwise. */
export function checkEvent(event: unknown): Stripe.Event {
  const env = Envelope.safeParse(event);
  if (!env.success) throw new AppError(400, 'invalid_event', 'The webhook event is not well formed', fieldErrors('body', env.error));
  const schema = OBJECT_OF[env.data.type];
  if (schema) {
    const obj = schema.safeParse(env.data.data.object);
    if (!obj.success)
      throw new AppError(
        400,
        'invalid_event',
        `The ${env.data.type} event's object is not well formed`,
        fieldErrors('body.data.object', obj.error),
      );
  }
  return event as Stripe.Event;
}
