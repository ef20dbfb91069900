import Stripe from 'stripe';
import type { Order as OrderDto } from '../../../shared/shop';
import { AppError } from '../../lib/AppError';
import { logger } from '../../lib/logger';
import type { AuthUser } from '../../middleware/auth';
import type { Center } from '../../models/index';
import { centersRepository } from '../centers/centers.repository';
import { shopRepository, toOrderDto } from './shop.repository';

// What the pro-shop services share: the center and order lookups with their refusals, and payment-service errors.

export async function centerOr404(id: number): Promise<Center> {
  const c = await centersRepository.findById(id);
  if (!c) throw AppError.notFound('Center');
  return c;
}

export async function ownedCenter(actor: AuthUser, id: number): Promise<Center> {
  const c = await centerOr404(id);
  if (c.ownerId !== actor.id) throw AppError.forbidden('Only this center’s proprietor manages its pro shop');
  return c;
}

/** A payment-service failure as our error shape (never its stack or raw body). */
export function paymentError(err: unknown): AppError {
  if (err instanceof Stripe.errors.StripeError) {
    logger.warn({ type: err.type, code: err.code, requestId: err.requestId, message: err.message }, 'payment service refused a request');
    return new AppError(502, 'payment_service_error', `The card-payment service refused the request: ${err.message}`);
  }
  logger.error({ err }, 'payment service unreachable');
  return new AppError(502, 'payment_service_unavailable', 'The card-payment service could not be reached; try again shortly');
}

/** The order as its bowler or its center's proprietor may see it; 404 for anyone else (existence never leaks). */
export async function visibleOrder(user: AuthUser, id: number) {
  const o = await shopRepository.order(id);
  if (!o || (o.userId !== user.id && o.center?.ownerId !== user.id)) throw AppError.notFound('Order');
  return o;
}

export async function freshOrder(id: number): Promise<OrderDto> {
  return toOrderDto((await shopRepository.order(id))!);
}
