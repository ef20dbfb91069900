import type Stripe from 'stripe';
import type { Transaction } from 'sequelize';
import { publicUrl } from '../../lib/publicUrl';
import { audit } from '../../lib/audit';
import { sendJob } from '../../lib/jobs';
import { logger } from '../../lib/logger';
import { stripeClient } from '../../lib/payments';
import { sequelize, type Order, type Payment } from '../../models/index';
import { enqueueOrderMail } from './shop.mail';
import { shopRepository } from './shop.repository';

type Actor = { id: number; displayName: string } | null;

/** The order an object of the payment service belongs to (our metadata, or the session's client reference). */
function orderIdOf(obj: { metadata?: Stripe.Metadata | null; client_reference_id?: string | null }): number | null {
  const raw = obj.metadata?.orderId ?? obj.client_reference_id ?? null;
  const n = raw === null ? NaN : Number(raw);
  return Number.isInteger(n) && n > 0 ? n : null;
}

const idOf = (v: string | { id: string } | null | undefined): string | null => (typeof v === 'string' ? v : (v?.id ?? null));

/**
 * Refunds a payment that must not stand (paid after the order was cancelled, or a second payment of one
 * order): the reason is recorded on the payment and a `refund` job is sent in the caller's transaction, so the
 * refund is as durable as the event that called for it. The job is retried until the payment service answers;
 * its idempotency key makes every retry the same refund (exactly one in effect).
 */
async function queueAutoRefund(transaction: Transaction, payment: Payment, why: string): Promise<void> {
  payment.autoRefundReason = why.slice(0, 200);
  await payment.save({ transaction });
  await sendJob('refund', `payment-${payment.id}`, { paymentId: payment.id, why }, { transaction });
}

/** The `refund` job: asks the payment service to refund the payment (idempotent), then records it. */
export async function runAutoRefund(paymentId: number, why: string): Promise<'refunded' | 'nothing_to_do'> {
  const payment = await shopRepository.payment(paymentId);
  if (!payment?.paymentIntentId || payment.refundId || payment.status === 'refunded') return 'nothing_to_do';
  const stripe = await stripeClient();
  let refundId: string | null = null;
  try {
    const refund = await stripe.refunds.create(
      { payment_intent: payment.paymentIntentId, reason: 'duplicate', metadata: { orderId: String(payment.orderId), why } },
      { idempotencyKey: `lanewright-auto-refund-${payment.id}` },
    );
    refundId = refund.id;
  } catch (err) {
    // Refunded already (by an earlier run whose answer was lost, or by hand at the service): done.
    if (!(err && typeof err === 'object' && (err as { code?: string }).code === 'charge_already_refunded')) throw err;
  }
  await sequelize.transaction(async (transaction) => {
    await shopRepository.setRefundId(payment.id, refundId ?? payment.refundId, transaction);
    await audit(
      {
        actorId: null,
        action: 'payment.auto_refunded',
        subjectType: 'order',
        subjectId: payment.orderId,
        details: { paymentId: payment.id, refundId, why },
      },
      transaction,
    );
  });
  logger.info({ paymentId, refundId }, 'automatic refund done');
  return 'refunded';
}

/**
 * Moves an order to refunded, once: from the shop's refund (the SDK answered succeeded) or from the
 * charge.refunded webhook, whichever comes first; the other finds it done. Also safe before the payment's
 * completion arrives (the late completion does not undo it). Returns whether this call made the change.
 */
export async function markRefunded(
  orderId: number,
  info: { intentId: string | null; refundId: string | null; amountCents: number | null; actor: Actor; base: string },
  transaction: Transaction,
): Promise<boolean> {
  const order = await shopRepository.lockOrder(orderId, transaction);
  if (!order) return false;
  const payment = info.intentId ? await shopRepository.paymentByIntent(info.intentId, transaction) : null;
  if (payment && payment.orderId === order.id) {
    payment.set({
      status: 'refunded',
      refundId: info.refundId ?? payment.refundId,
      refundedCents: info.amountCents ?? payment.amountCents,
      refundedAt: payment.refundedAt ?? new Date(),
    });
    await payment.save({ transaction });
    // A second payment of the same order was refunded: the order itself stands.
    if (payment.checkoutSessionId && (await isDuplicate(order, payment, transaction))) return false;
  }
  if (order.status === 'refunded') return false;
  const now = new Date();
  if (order.status === 'cancelled') {
    order.set({ paymentStatus: 'refunded', refundedAt: now });
    await order.save({ transaction });
    return true;
  }
  order.set({ status: 'refunded', paymentStatus: 'refunded', refundedAt: now });
  await order.save({ transaction });
  await shopRepository.addEvent(order.id, 'refunded', info.actor, transaction);
  await audit(
    {
      actorId: info.actor?.id ?? null,
      action: 'order.refunded',
      subjectType: 'order',
      subjectId: order.id,
      details: { amountCents: order.amountCents, currency: order.currency, refundId: info.refundId, intentId: info.intentId },
    },
    transaction,
  );
  await enqueueOrderMail('refunded', order, info.base, transaction);
  return true;
}

/** True when the order was paid by another payment than this one (this one is the extra). */
async function isDuplicate(order: Order, payment: Payment, transaction: Transaction): Promise<boolean> {
  const all = await shopRepository.payments(order.id, transaction);
  return all.some((p) => p.id !== payment.id && p.paidAt && payment.paidAt && p.paidAt < payment.paidAt && p.status !== 'refunded');
}

async function onCompleted(
  session: Stripe.Checkout.Session,
  base: string,
  transaction: Transaction,
): Promise<{ orderId: number | null; outcome: string }> {
  const orderId = orderIdOf(session);
  if (!orderId) return { orderId: null, outcome: 'not_ours' };
  const order = await shopRepository.lockOrder(orderId, transaction);
  if (!order) return { orderId: null, outcome: 'unknown_order' };
  if (session.payment_status !== 'paid') return { orderId, outcome: `awaiting_${session.payment_status}` };
  if (session.amount_total !== order.amountCents || session.currency !== order.currency) {
    await audit(
      {
        actorId: null,
        action: 'payment.amount_mismatch',
        subjectType: 'order',
        subjectId: order.id,
        details: { sessionId: session.id, amount: session.amount_total, currency: session.currency },
      },
      transaction,
    );
    logger.error({ orderId, sessionId: session.id }, 'a completed checkout does not match the order amount; not marked paid');
    return { orderId, outcome: 'amount_mismatch' };
  }
  const now = new Date();
  const intentId = idOf(session.payment_intent);
  let payment = await shopRepository.paymentBySession(session.id, transaction);
  payment ??= await shopRepository.createPayment(
    { orderId, checkoutSessionId: session.id, amountCents: order.amountCents, currency: order.currency },
    transaction,
  );
  const others = (await shopRepository.payments(orderId, transaction)).filter((p) => p.id !== payment.id && p.paidAt);
  payment.set({ paymentIntentId: intentId, paidAt: payment.paidAt ?? now, ...(payment.status === 'refunded' ? {} : { status: 'paid' }) });

  if (order.status === 'ordered') {
    order.set({ status: 'paid', paymentStatus: 'paid', paidAt: now, lastPaymentError: null });
    await payment.save({ transaction });
    await order.save({ transaction });
    await shopRepository.addEvent(order.id, 'paid', null, transaction);
    await audit(
      {
        actorId: null,
        action: 'order.paid',
        subjectType: 'order',
        subjectId: order.id,
        details: { amountCents: order.amountCents, currency: order.currency, sessionId: session.id, intentId },
      },
      transaction,
    );
    await enqueueOrderMail('receipt', order, base, transaction);
    return { orderId, outcome: 'paid' };
  }
  if (order.status === 'refunded') {
    // The refund arrived first: the money moved in and out; the order stays refunded.
    await payment.save({ transaction });
    if (!order.paidAt) {
      order.paidAt = now;
      await order.save({ transaction });
    }
    return { orderId, outcome: 'late_completion_order_refunded' };
  }
  if (order.status === 'cancelled' || others.length > 0) {
    await payment.save({ transaction });
    await queueAutoRefund(
      transaction,
      payment,
      order.status === 'cancelled' ? 'paid after the order was cancelled' : 'second payment of one order',
    );
    await audit(
      {
        actorId: null,
        action: 'payment.refund_needed',
        subjectType: 'order',
        subjectId: order.id,
        details: { sessionId: session.id, intentId, orderStatus: order.status },
      },
      transaction,
    );
    return { orderId, outcome: order.status === 'cancelled' ? 'paid_after_cancel_refunding' : 'duplicate_payment_refunding' };
  }
  await payment.save({ transaction });
  return { orderId, outcome: 'already_paid' };
}

async function onFailed(
  obj: { metadata?: Stripe.Metadata | null; client_reference_id?: string | null },
  message: string,
  transaction: Transaction,
): Promise<{ orderId: number | null; outcome: string }> {
  const orderId = orderIdOf(obj);
  if (!orderId) return { orderId: null, outcome: 'not_ours' };
  const order = await shopRepository.lockOrder(orderId, transaction);
  if (!order) return { orderId: null, outcome: 'unknown_order' };
  // A failure that arrives after the success (or after a refund or cancellation) changes nothing.
  if (order.status !== 'ordered' || order.paymentStatus === 'paid' || order.paymentStatus === 'refunded')
    return { orderId, outcome: 'ignored_not_payable' };
  order.set({ paymentStatus: 'failed', lastPaymentError: message.slice(0, 500) });
  await order.save({ transaction });
  await audit({ actorId: null, action: 'payment.failed', subjectType: 'order', subjectId: order.id, details: { message } }, transaction);
  return { orderId, outcome: 'failed' };
}

async function onExpired(session: Stripe.Checkout.Session, transaction: Transaction): Promise<{ orderId: number | null; outcome: string }> {
  const payment = await shopRepository.paymentBySession(session.id, transaction);
  if (!payment) return { orderId: orderIdOf(session), outcome: 'unknown_session' };
  const order = await shopRepository.lockOrder(payment.orderId, transaction);
  if (payment.status === 'open') {
    payment.status = 'expired';
    await payment.save({ transaction });
  }
  if (order && order.status === 'ordered' && order.paymentStatus === 'processing') {
    const open = (await shopRepository.payments(order.id, transaction)).some((p) => p.status === 'open');
    if (!open) {
      order.paymentStatus = order.lastPaymentError ? 'failed' : 'unpaid';
      await order.save({ transaction });
    }
  }
  return { orderId: payment.orderId, outcome: 'expired' };
}

async function onChargeRefunded(
  charge: Stripe.Charge,
  base: string,
  transaction: Transaction,
): Promise<{ orderId: number | null; outcome: string }> {
  const intentId = idOf(charge.payment_intent);
  const payment = intentId ? await shopRepository.paymentByIntent(intentId, transaction) : null;
  const orderId = payment?.orderId ?? orderIdOf(charge);
  if (!orderId) return { orderId: null, outcome: 'not_ours' };
  if (charge.amount_refunded < charge.amount) {
    if (payment) {
      payment.refundedCents = charge.amount_refunded;
      await payment.save({ transaction });
    }
    return { orderId, outcome: 'partial_refund_recorded' };
  }
  const refundId = idOf(charge.refunds?.data?.[0]);
  const changed = await markRefunded(orderId, { intentId, refundId, amountCents: charge.amount_refunded, actor: null, base }, transaction);
  return { orderId, outcome: changed ? 'refunded' : 'already_refunded' };
}

/**
 * Processes one verified webhook event, at most once: its id is inserted first (unique); a repeat — even
 * a concurrent one, which waits on the first insert — finds it and does nothing. All changes, the audit
 * events and the mails commit together with the event id.
 */
export async function handlePaymentEvent(event: Stripe.Event): Promise<'processed' | 'duplicate'> {
  const base = publicUrl();
  return sequelize.transaction(async (transaction) => {
    if (!(await shopRepository.claimEvent(event.id, event.type, transaction))) return 'duplicate';
    let result: { orderId: number | null; outcome: string };
    switch (event.type) {
      case 'checkout.session.completed':
      case 'checkout.session.async_payment_succeeded':
        result = await onCompleted(event.data.object, base, transaction);
        break;
      case 'checkout.session.async_payment_failed':
        result = await onFailed(event.data.object, 'The payment did not go through', transaction);
        break;
      case 'payment_intent.payment_failed': {
        const pi = event.data.object;
        result = await onFailed(pi, pi.last_payment_error?.message ?? 'The payment failed', transaction);
        break;
      }
      case 'checkout.session.expired':
        result = await onExpired(event.data.object, transaction);
        break;
      case 'charge.refunded':
        result = await onChargeRefunded(event.data.object, base, transaction);
        break;
      default:
        result = { orderId: null, outcome: 'ignored' };
    }
    await shopRepository.recordEventOutcome(event.id, result.orderId, result.outcome, transaction);
    logger.info({ eventId: event.id, type: event.type, ...result }, 'payment event processed');
    return 'processed';
  });
}
