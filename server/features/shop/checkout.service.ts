import Stripe from 'stripe';
import { canRefund, type CheckoutStart, type Order as OrderDto } from '../../../shared/shop';
import { AppError } from '../../lib/AppError';
import { audit } from '../../lib/audit';
import { logger } from '../../lib/logger';
import { stripeClient } from '../../lib/payments';
import { publicUrl } from '../../lib/publicUrl';
import type { AuthUser } from '../../middleware/auth';
import { sequelize, type Order } from '../../models/index';
import { markRefunded } from './payments.service';
import { freshOrder, paymentError, visibleOrder } from './shop.common';
import { shopRepository } from './shop.repository';

/** The card side of an order: the checkout of the bowler and the refund of the shop, through the payment service. */
export const checkoutService = {
  /**
   * Starts (or resumes) the card payment of the bowler's unpaid order. An open checkout that still fits is
   * reused — reloading the page, a second tab or a declined card land on the same page — and a new one is
   * made only when there is none still open. No row lock is held while the payment service is called:
   *  1. a short transaction locks the order, checks it can be paid and records the attempt (status
   *     `creating`) with its idempotency key — or finds the attempt another request recorded a moment ago;
   *  2. the payment service is called with that key, outside any transaction (two requests at once send the
   *     same key and get the same session back: the service's idempotent replay);
   *  3. a second short transaction stores the session on the attempt.
   */
  async checkout(user: AuthUser, id: number): Promise<CheckoutStart> {
    const o = await visibleOrder(user, id);
    if (o.userId !== user.id) throw AppError.forbidden('Only the bowler who ordered pays for the order');
    const base = publicUrl();
    const notPayable = (order: Order) =>
      AppError.conflict(
        'not_payable',
        order.status === 'ordered' ? 'This order is already paid' : `This order is ${order.status.replace('_', ' ')} and cannot be paid`,
      );
    const payable = (order: Order) => order.status === 'ordered' && order.paymentStatus !== 'paid';

    let stripe: Stripe;
    try {
      stripe = await stripeClient();
    } catch (err) {
      throw paymentError(err);
    }
    // Open checkouts first: reuse one that still fits, close the others (each a call to the service, no lock held).
    const open = await sequelize.transaction(async (transaction) => {
      const order = (await shopRepository.lockOrder(o.id, transaction))!;
      if (!payable(order)) throw notPayable(order);
      return (await shopRepository.payments(order.id, transaction)).filter((x) => x.status === 'open' && x.checkoutSessionId);
    });
    try {
      for (const p of open) {
        const s = await stripe.checkout.sessions.retrieve(p.checkoutSessionId!);
        const usable =
          s.status === 'open' &&
          s.url &&
          s.amount_total === o.amountCents &&
          s.currency === o.currency &&
          s.expires_at > Date.now() / 1000 + 120;
        if (usable) return { url: s.url!, checkoutSessionId: s.id };
        if (s.status === 'complete')
          throw AppError.conflict('payment_pending', 'This order’s card payment went through and is being confirmed; reload in a moment');
        if (s.status === 'open') await stripe.checkout.sessions.expire(s.id);
        await shopRepository.expireOpenPayment(p.id);
      }
    } catch (err) {
      if (err instanceof AppError) throw err;
      throw paymentError(err);
    }

    // 1. Record the attempt and its idempotency key (or take the one being created, or opened a moment ago by a
    //    request that started at the same time: a double click gets one session).
    const attempt = await sequelize.transaction(async (transaction) => {
      const order = (await shopRepository.lockOrder(o.id, transaction))!;
      if (!payable(order)) throw notPayable(order);
      const all = await shopRepository.payments(order.id, transaction);
      const current = all.find((x) => x.status === 'creating') ?? all.find((x) => x.status === 'open' && x.checkoutSessionId);
      if (current) return current;
      return shopRepository.createPayment(
        {
          orderId: order.id,
          status: 'creating',
          idempotencyKey: `lanewright-checkout-order-${order.id}-attempt-${all.length + 1}`,
          amountCents: order.amountCents,
          currency: order.currency,
        },
        transaction,
      );
    });

    if (attempt.status === 'open' && attempt.checkoutSessionId) {
      let opened: Stripe.Checkout.Session;
      try {
        opened = await stripe.checkout.sessions.retrieve(attempt.checkoutSessionId);
      } catch (err) {
        throw paymentError(err);
      }
      if (opened.status === 'open' && opened.url) return { url: opened.url, checkoutSessionId: opened.id };
    }

    // 2. The payment service, with no transaction open.
    let session: Stripe.Checkout.Session;
    try {
      session = await stripe.checkout.sessions.create(
        {
          mode: 'payment',
          line_items: [
            {
              quantity: 1,
              price_data: {
                currency: o.currency,
                unit_amount: o.amountCents,
                product_data: {
                  name: `${o.serviceName} — ${o.ballName}`.slice(0, 250),
                  description: `${o.center?.name ?? 'Pro shop'} order #${o.id}`,
                },
              },
            },
          ],
          success_url: `${base}/orders/${o.id}?checkout=done`,
          cancel_url: `${base}/orders/${o.id}?checkout=cancelled`,
          client_reference_id: String(o.id),
          customer_email: o.bowler?.email,
          metadata: { orderId: String(o.id) },
          payment_intent_data: {
            metadata: { orderId: String(o.id) },
            description: `${o.center?.name ?? 'Pro shop'} order #${o.id}: ${o.serviceName}`,
          },
        },
        { idempotencyKey: attempt.idempotencyKey! },
      );
    } catch (err) {
      throw paymentError(err);
    }
    if (!session.url) throw new AppError(502, 'payment_service_error', 'The card-payment service did not return a payment page');

    // 3. Store the session on the attempt (once: a concurrent request with the same key finds it done).
    const outcome = await sequelize.transaction(async (transaction) => {
      const order = (await shopRepository.lockOrder(o.id, transaction))!;
      const row = await shopRepository.lockPayment(attempt.id, transaction);
      const other = await shopRepository.paymentBySession(session.id, transaction);
      if (other && other.id !== attempt.id) {
        // The session's completion arrived first and recorded the payment itself.
        if (row?.status === 'creating') await row.destroy({ transaction });
        return 'recorded';
      }
      if (!payable(order)) {
        if (row?.status === 'creating') await row.update({ status: 'expired', checkoutSessionId: session.id }, { transaction });
        return 'not_payable';
      }
      if (row && row.status === 'creating') {
        await row.update({ status: 'open', checkoutSessionId: session.id }, { transaction });
        order.paymentStatus = 'processing';
        await order.save({ transaction });
        await audit(
          {
            actorId: user.id,
            action: 'payment.checkout_started',
            subjectType: 'order',
            subjectId: order.id,
            details: { sessionId: session.id, amountCents: order.amountCents, currency: order.currency },
          },
          transaction,
        );
      }
      return 'open';
    });
    if (outcome === 'not_payable') {
      await stripe.checkout.sessions
        .expire(session.id)
        .catch((err: unknown) => logger.info({ err, sessionId: session.id }, 'checkout already closed'));
      throw notPayable((await shopRepository.order(o.id))!);
    }
    return { url: session.url, checkoutSessionId: session.id };
  },

  /** The shop refunds a paid order through the payment service; the order becomes refunded once (now, or when charge.refunded arrives). */
  async refund(actor: AuthUser, id: number): Promise<OrderDto> {
    const o = await visibleOrder(actor, id);
    if (o.center?.ownerId !== actor.id) throw AppError.forbidden('Only the shop refunds an order');
    if (!canRefund(o.status))
      throw AppError.conflict(
        'not_refundable',
        o.status === 'refunded' ? 'This order is already refunded' : `A ${o.status.replace('_', ' ')} order cannot be refunded`,
      );
    const payment = (await shopRepository.payments(o.id)).find((p) => p.status === 'paid' && p.paymentIntentId);
    if (!payment) throw AppError.conflict('not_refundable', 'No card payment of this order is on record');
    await audit({
      actorId: actor.id,
      action: 'refund.requested',
      subjectType: 'order',
      subjectId: o.id,
      details: { intentId: payment.paymentIntentId, amountCents: o.amountCents, currency: o.currency },
    });
    let refund: Stripe.Refund | null = null;
    try {
      const stripe = await stripeClient();
      refund = await stripe.refunds.create(
        { payment_intent: payment.paymentIntentId!, reason: 'requested_by_customer', metadata: { orderId: String(o.id) } },
        { idempotencyKey: `lanewright-refund-order-${o.id}-payment-${payment.id}` },
      );
    } catch (err) {
      // Already refunded at the service (e.g. from its dashboard): record it here too.
      if (!(err instanceof Stripe.errors.StripeError && err.code === 'charge_already_refunded')) throw paymentError(err);
    }
    if (!refund || refund.status === 'succeeded') {
      await sequelize.transaction((transaction) =>
        markRefunded(
          o.id,
          {
            intentId: payment.paymentIntentId,
            refundId: refund?.id ?? null,
            amountCents: refund?.amount ?? o.amountCents,
            actor,
            base: publicUrl(),
          },
          transaction,
        ),
      );
    } else {
      await shopRepository.setRefundId(payment.id, refund.id);
    }
    return freshOrder(id);
  },
};
