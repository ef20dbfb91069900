import Stripe from 'stripe';
import { Op, type WhereOptions } from 'sequelize';
import type { Page } from '../../../shared/auth';
import {
  formatMoney,
  SURFACE_KINDS,
  type CenterOrderQuery,
  type CheckoutStart,
  type Order as OrderDto,
  type OrderCreate,
  type OrderListQuery,
  type OrderStatus,
  type ServiceInput,
  type ServicePatch,
  type ShopService as ShopServiceDto,
  type Takings,
} from '../../../shared/shop';
import { publicUrl } from '../../lib/publicUrl';
import { AppError } from '../../lib/AppError';
import { audit } from '../../lib/audit';
import { logger } from '../../lib/logger';
import { stripeClient } from '../../lib/payments';
import type { AuthUser } from '../../middleware/auth';
import { Ball, Center, Order, Payment, sequelize, ShopService } from '../../models/index';
import { arsenalRepository } from '../arsenal/arsenal.repository';
import { refitBowlerAfterCommit } from '../stats/calibrationJobs';
import { markRefunded } from './payments.service';
import { enqueueOrderMail } from './shop.mail';
import { shopRepository, toOrderDto, toServiceDto } from './shop.repository';

const RANK: Record<OrderStatus, number> = { ordered: 0, paid: 1, in_progress: 2, ready: 3, collected: 4, cancelled: -1, refunded: -1 };
const REFUNDABLE: OrderStatus[] = ['paid', 'in_progress', 'ready'];

const todayUtc = () => new Date().toISOString().slice(0, 10);

async function centerOr404(id: number): Promise<Center> {
  const c = await Center.findByPk(id);
  if (!c) throw AppError.notFound('Center');
  return c;
}

async function ownedCenter(actor: AuthUser, id: number): Promise<Center> {
  const c = await centerOr404(id);
  if (c.ownerId !== actor.id) throw AppError.forbidden('Only this center’s proprietor manages its pro shop');
  return c;
}

/** A payment-service failure as our error shape (never its stack or raw body). */
function paymentError(err: unknown): AppError {
  if (err instanceof Stripe.errors.StripeError) {
    logger.warn({ type: err.type, code: err.code, requestId: err.requestId, message: err.message }, 'payment service refused a request');
    return new AppError(502, 'payment_service_error', `The card-payment service refused the request: ${err.message}`);
  }
  logger.error({ err }, 'payment service unreachable');
  return new AppError(502, 'payment_service_unavailable', 'The card-payment service could not be reached; try again shortly');
}

function ballLabel(b: Ball): string {
  return (b.nickname ? `${b.nickname} (${b.name})` : b.name).slice(0, 150);
}

/** The order as its bowler or its center's proprietor may see it; 404 for anyone else (existence never leaks). */
async function visibleOrder(user: AuthUser, id: number) {
  const o = await shopRepository.order(id);
  if (!o || (o.userId !== user.id && o.center?.ownerId !== user.id)) throw AppError.notFound('Order');
  return o;
}

async function fresh(id: number): Promise<OrderDto> {
  return toOrderDto((await shopRepository.order(id))!);
}

export const shopService = {
  // ---- price list -------------------------------------------------------------------------------------

  async services(user: AuthUser, centerId: number, all: boolean): Promise<ShopServiceDto[]> {
    const c = await centerOr404(centerId);
    return (await shopRepository.services(centerId, all && c.ownerId === user.id)).map(toServiceDto);
  },

  async createService(actor: AuthUser, centerId: number, input: ServiceInput): Promise<ShopServiceDto> {
    await ownedCenter(actor, centerId);
    return sequelize.transaction(async (transaction) => {
      const s = await ShopService.create(
        { centerId, kind: input.kind, name: input.name, grit: input.kind === 'resurface' ? (input.grit ?? null) : null, description: input.description ?? null, priceCents: input.priceCents, currency: input.currency ?? 'usd' },
        { transaction },
      );
      await audit({ actorId: actor.id, action: 'shop_service.created', subjectType: 'shop_service', subjectId: s.id, details: { centerId, kind: s.kind, priceCents: s.priceCents, currency: s.currency } }, transaction);
      return toServiceDto(s);
    });
  },

  async updateService(actor: AuthUser, centerId: number, serviceId: number, patch: ServicePatch): Promise<ShopServiceDto> {
    await ownedCenter(actor, centerId);
    return sequelize.transaction(async (transaction) => {
      const s = await ShopService.findOne({ where: { id: serviceId, centerId }, transaction, lock: transaction.LOCK.UPDATE });
      if (!s) throw AppError.notFound('Service');
      if (s.version !== patch.version) throw AppError.conflict('stale_version', 'This price-list entry was changed elsewhere; reload it and apply your edit again');
      const { version: _v, ...fields } = patch;
      const before = { priceCents: s.priceCents, currency: s.currency, active: s.active };
      s.set(Object.fromEntries(Object.entries(fields).filter(([, v]) => v !== undefined)));
      if (s.kind !== 'resurface') s.grit = null;
      if (s.kind === 'resurface' && !s.grit) throw AppError.badRequest('A resurface needs its target grit', { 'body.grit': 'A resurface needs its target grit' });
      await s.save({ transaction });
      await audit({ actorId: actor.id, action: 'shop_service.updated', subjectType: 'shop_service', subjectId: s.id, details: { before, after: { priceCents: s.priceCents, currency: s.currency, active: s.active } } }, transaction);
      return toServiceDto(s);
    });
  },

  // ---- orders -----------------------------------------------------------------------------------------

  /** A new order: the price comes from the price list (never from the client); the ball must be the caller's. */
  async createOrder(user: AuthUser, input: OrderCreate): Promise<OrderDto> {
    const id = await sequelize.transaction(async (transaction) => {
      const service = await shopRepository.service(input.serviceId, transaction);
      if (!service || !service.active) throw AppError.badRequest('That service is not on the price list', { 'body.serviceId': 'Not on the price list' });
      if (input.expectedAmountCents !== undefined && input.expectedAmountCents !== service.priceCents) {
        throw new AppError(400, 'price_mismatch', `The price of ${service.name} is ${formatMoney(service.priceCents, service.currency)}; review the order and try again`, {
          'body.expectedAmountCents': `The price is now ${formatMoney(service.priceCents, service.currency)}`,
        });
      }
      const ball = await arsenalRepository.findOwned(user.id, input.ballId, { transaction });
      if (!ball) throw AppError.badRequest('That ball is not in your arsenal', { 'body.ballId': 'Not in your arsenal' });
      const o = await Order.create(
        {
          userId: user.id, centerId: service.centerId, serviceId: service.id, ballId: ball.id, serviceKind: service.kind, serviceName: service.name, grit: service.grit,
          ballName: ballLabel(ball), amountCents: service.priceCents, currency: service.currency, notes: input.notes ?? null,
        },
        { transaction },
      );
      await shopRepository.addEvent(o.id, 'ordered', user, transaction);
      await audit({ actorId: user.id, action: 'order.created', subjectType: 'order', subjectId: o.id, details: { centerId: o.centerId, serviceId: service.id, ballId: ball.id, amountCents: o.amountCents, currency: o.currency } }, transaction);
      return o.id;
    });
    return fresh(id);
  },

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
      AppError.conflict('not_payable', order.status === 'ordered' ? 'This order is already paid' : `This order is ${order.status.replace('_', ' ')} and cannot be paid`);
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
        const usable = s.status === 'open' && s.url && s.amount_total === o.amountCents && s.currency === o.currency && s.expires_at > Date.now() / 1000 + 120;
        if (usable) return { url: s.url!, checkoutSessionId: s.id };
        if (s.status === 'complete') throw AppError.conflict('payment_pending', 'This order’s card payment went through and is being confirmed; reload in a moment');
        if (s.status === 'open') await stripe.checkout.sessions.expire(s.id);
        await Payment.update({ status: 'expired' }, { where: { id: p.id, status: 'open' } });
      }
    } catch (err) {
      if (err instanceof AppError) throw err;
      throw paymentError(err);
    }

    // 1. Record the attempt and its idempotency key (or take the one being created).
    const attempt = await sequelize.transaction(async (transaction) => {
      const order = (await shopRepository.lockOrder(o.id, transaction))!;
      if (!payable(order)) throw notPayable(order);
      const all = await shopRepository.payments(order.id, transaction);
      const creating = all.find((x) => x.status === 'creating');
      if (creating) return creating;
      return Payment.create(
        { orderId: order.id, status: 'creating', idempotencyKey: `lanewright-checkout-order-${order.id}-attempt-${all.length + 1}`, amountCents: order.amountCents, currency: order.currency },
        { transaction },
      );
    });

    // 2. The payment service, with no transaction open.
    let session: Stripe.Checkout.Session;
    try {
      session = await stripe.checkout.sessions.create(
        {
          mode: 'payment',
          line_items: [{ quantity: 1, price_data: { currency: o.currency, unit_amount: o.amountCents, product_data: { name: `${o.serviceName} — ${o.ballName}`.slice(0, 250), description: `${o.center?.name ?? 'Pro shop'} order #${o.id}` } } }],
          success_url: `${base}/orders/${o.id}?checkout=done`,
          cancel_url: `${base}/orders/${o.id}?checkout=cancelled`,
          client_reference_id: String(o.id),
          customer_email: o.bowler?.email,
          metadata: { orderId: String(o.id) },
          payment_intent_data: { metadata: { orderId: String(o.id) }, description: `${o.center?.name ?? 'Pro shop'} order #${o.id}: ${o.serviceName}` },
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
      const row = await Payment.findByPk(attempt.id, { transaction, lock: transaction.LOCK.UPDATE });
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
        await audit({ actorId: user.id, action: 'payment.checkout_started', subjectType: 'order', subjectId: order.id, details: { sessionId: session.id, amountCents: order.amountCents, currency: order.currency } }, transaction);
      }
      return 'open';
    });
    if (outcome === 'not_payable') {
      await stripe.checkout.sessions.expire(session.id).catch((err: unknown) => logger.info({ err, sessionId: session.id }, 'checkout already closed'));
      throw notPayable((await shopRepository.order(o.id))!);
    }
    return { url: session.url, checkoutSessionId: session.id };
  },

  async mine(user: AuthUser, q: OrderListQuery): Promise<Page<OrderDto>> {
    const where: WhereOptions<Order> = { userId: user.id, ...(q.status ? { status: q.status } : {}) };
    const { rows, count } = await shopRepository.page(where, q.page, q.pageSize);
    return { items: rows.map(toOrderDto), total: count, page: q.page, pageSize: q.pageSize };
  },

  async get(user: AuthUser, id: number): Promise<OrderDto> {
    return toOrderDto(await visibleOrder(user, id));
  },

  /** The bowler cancels an unpaid order; an open checkout is expired so it can no longer be paid. */
  async cancel(user: AuthUser, id: number): Promise<OrderDto> {
    const o = await visibleOrder(user, id);
    if (o.userId !== user.id) throw AppError.forbidden('Only the bowler who ordered can cancel; the shop refunds instead');
    const open = await sequelize.transaction(async (transaction) => {
      const order = (await shopRepository.lockOrder(id, transaction))!;
      if (order.status !== 'ordered' || order.paymentStatus === 'paid') throw AppError.conflict('not_cancellable', 'Only an unpaid order can be cancelled; ask the shop for a refund');
      order.set({ status: 'cancelled', cancelledAt: new Date(), paymentStatus: order.paymentStatus === 'processing' ? 'unpaid' : order.paymentStatus });
      await order.save({ transaction });
      await shopRepository.addEvent(order.id, 'cancelled', user, transaction);
      await audit({ actorId: user.id, action: 'order.cancelled', subjectType: 'order', subjectId: order.id }, transaction);
      return (await shopRepository.payments(order.id, transaction)).filter((p) => p.status === 'open' && p.checkoutSessionId);
    });
    if (open.length) {
      try {
        const stripe = await stripeClient();
        for (const p of open) await stripe.checkout.sessions.expire(p.checkoutSessionId!).catch((err: unknown) => logger.info({ err, sessionId: p.checkoutSessionId }, 'checkout already closed'));
      } catch (err) {
        logger.warn({ err }, 'could not expire the checkout of a cancelled order');
      }
    }
    return fresh(id);
  },

  async centerOrders(actor: AuthUser, centerId: number, q: CenterOrderQuery): Promise<Page<OrderDto>> {
    await ownedCenter(actor, centerId);
    const where: Record<string | symbol, unknown> = { centerId, ...(q.status ? { status: q.status } : {}) };
    if (q.date) {
      const from = new Date(`${q.date}T00:00:00Z`);
      where.createdAt = { [Op.gte]: from, [Op.lt]: new Date(from.getTime() + 86400000) };
    }
    const { rows, count } = await shopRepository.page(where as WhereOptions<Order>, q.page, q.pageSize);
    return { items: rows.map(toOrderDto), total: count, page: q.page, pageSize: q.pageSize };
  },

  /**
   * The shop moves a paid order forward (paid → in progress → ready → collected; 'ready' may skip 'in progress').
   * 'ready' on a surface service records the ball's surface event and sets its surface in the same
   * transaction, so the next matchup ranks the ball with it.
   */
  async setStatus(actor: AuthUser, id: number, status: 'in_progress' | 'ready' | 'collected'): Promise<OrderDto> {
    const o = await visibleOrder(actor, id);
    if (o.center?.ownerId !== actor.id) throw AppError.forbidden('Only the shop moves an order along');
    await sequelize.transaction(async (transaction) => {
      const order = (await shopRepository.lockOrder(id, transaction))!;
      const from: OrderStatus = order.status;
      const ok = RANK[from] >= 1 && RANK[status] > RANK[from] && !(status === 'collected' && from !== 'ready');
      if (!ok) throw AppError.conflict('bad_transition', from === 'ordered' ? 'The order is not paid yet' : `A ${from.replace('_', ' ')} order cannot move to ${status.replace('_', ' ')}`);
      const now = new Date();
      order.status = status;
      if (status === 'ready') order.readyAt = now;
      if (status === 'collected') order.collectedAt = now;
      if (status === 'ready' && SURFACE_KINDS.includes(order.serviceKind) && order.ballId) {
        const ball = await Ball.findOne({ where: { id: order.ballId, ownerId: order.userId }, paranoid: false, transaction, lock: transaction.LOCK.UPDATE });
        if (ball) {
          const toGrit = order.serviceKind === 'resurface' && order.grit ? order.grit : ball.surfaceGrit;
          const toPolished = order.serviceKind === 'polish' ? true : order.serviceKind === 'resurface' ? false : ball.polished;
          await arsenalRepository.addSurfaceEvent(
            { ballId: ball.id, fromGrit: ball.surfaceGrit, fromPolished: ball.polished, toGrit, toPolished, at: now, byUserId: actor.id, note: `${o.center?.name ?? 'Pro shop'}: ${order.serviceName} (order #${order.id})`.slice(0, 500) },
            transaction,
          );
          ball.set({ surfaceGrit: toGrit, polished: toPolished, ...(order.serviceKind === 'oil-extraction' ? {} : { gamesSinceResurface: 0 }) });
          await ball.save({ transaction });
          refitBowlerAfterCommit(order.userId, transaction);
        }
      }
      await order.save({ transaction });
      await shopRepository.addEvent(order.id, status, actor, transaction);
      await audit({ actorId: actor.id, action: 'order.status_changed', subjectType: 'order', subjectId: order.id, details: { from, to: status } }, transaction);
      if (status === 'ready') await enqueueOrderMail('ready', order, publicUrl(), transaction);
    });
    return fresh(id);
  },

  /** The shop refunds a paid order through the payment service; the order becomes refunded once (now, or when charge.refunded arrives). */
  async refund(actor: AuthUser, id: number): Promise<OrderDto> {
    const o = await visibleOrder(actor, id);
    if (o.center?.ownerId !== actor.id) throw AppError.forbidden('Only the shop refunds an order');
    if (!REFUNDABLE.includes(o.status)) throw AppError.conflict('not_refundable', o.status === 'refunded' ? 'This order is already refunded' : `A ${o.status.replace('_', ' ')} order cannot be refunded`);
    const payment = (await shopRepository.payments(o.id)).find((p) => p.status === 'paid' && p.paymentIntentId);
    if (!payment) throw AppError.conflict('not_refundable', 'No card payment of this order is on record');
    await audit({ actorId: actor.id, action: 'refund.requested', subjectType: 'order', subjectId: o.id, details: { intentId: payment.paymentIntentId, amountCents: o.amountCents, currency: o.currency } });
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
        markRefunded(o.id, { intentId: payment.paymentIntentId, refundId: refund?.id ?? null, amountCents: refund?.amount ?? o.amountCents, actor, base: publicUrl() }, transaction),
      );
    } else {
      await Payment.update({ refundId: refund.id }, { where: { id: payment.id } });
    }
    return fresh(id);
  },

  /** The day's takings of a center (UTC day): paid, refunded and net, by service. */
  async takings(actor: AuthUser, centerId: number, date = todayUtc()): Promise<Takings> {
    await ownedCenter(actor, centerId);
    const from = new Date(`${date}T00:00:00Z`);
    const to = new Date(from.getTime() + 86400000);
    const [paid, refunded, services] = await Promise.all([shopRepository.paidBetween(centerId, from, to), shopRepository.refundedBetween(centerId, from, to), shopRepository.services(centerId, true)]);
    const currency = paid[0]?.currency ?? refunded[0]?.currency ?? services[0]?.currency ?? 'usd';
    const inCur = (os: Order[]) => os.filter((x) => x.currency === currency);
    const byService = new Map<number, { serviceId: number; name: string; count: number; cents: number }>();
    for (const x of inCur(paid)) {
      const key = x.serviceId ?? 0;
      const row = byService.get(key) ?? { serviceId: key, name: x.serviceName, count: 0, cents: 0 };
      row.count += 1;
      row.cents += x.amountCents;
      byService.set(key, row);
    }
    const paidCents = inCur(paid).reduce((s, x) => s + x.amountCents, 0);
    const refundedCents = inCur(refunded).reduce((s, x) => s + x.amountCents, 0);
    return { date, currency, orders: inCur(paid).length, paidCents, refundedCents, netCents: paidCents - refundedCents, byService: [...byService.values()].sort((a, b) => b.cents - a.cents || a.serviceId - b.serviceId) };
  },
};
