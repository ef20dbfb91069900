import { Op, type WhereOptions } from 'sequelize';
import type { Page } from '../../../shared/auth';
import { ballLabel } from '../../../shared/balls';
import {
  canShopMove,
  formatMoney,
  SURFACE_KINDS,
  type CenterOrderQuery,
  type Order as OrderDto,
  type OrderCreate,
  type OrderListQuery,
  type OrderStatus,
  type ShopMove,
  type WalkInOrder,
  OPEN_ORDER_STATUSES,
  SHOP_UNDO_SECONDS,
} from '../../../shared/shop';
import { AppError } from '../../lib/AppError';
import { audit } from '../../lib/audit';
import { logger } from '../../lib/logger';
import { stripeClient } from '../../lib/payments';
import { publicUrl } from '../../lib/publicUrl';
import type { AuthUser } from '../../middleware/auth';
import { sequelize, type Order } from '../../models/index';
import { arsenalRepository } from '../arsenal/arsenal.repository';
import { refitBowlerAfterCommit } from '../stats/calibrationJobs';
import { freshOrder, ownedCenter, visibleOrder } from './shop.common';
import { enqueueOrderMail } from './shop.mail';
import { knownZone } from './takings.service';
import { shopRepository, toOrderDto } from './shop.repository';

/** Pro-shop orders: the bowler orders and cancels, the shop moves an order along its life. */
export const ordersService = {
  /** A new order: the price comes from the price list (never from the client); the ball must be the caller's. */
  async createOrder(user: AuthUser, input: OrderCreate): Promise<OrderDto> {
    const id = await sequelize.transaction(async (transaction) => {
      const service = await shopRepository.service(input.serviceId, transaction);
      if (!service || !service.active)
        throw AppError.badRequest('That service is not on the price list', { 'body.serviceId': 'Not on the price list' });
      if (input.expectedAmountCents !== undefined && input.expectedAmountCents !== service.priceCents) {
        throw new AppError(
          400,
          'price_mismatch',
          `The price of ${service.name} is ${formatMoney(service.priceCents, service.currency)}; review the order and try again`,
          {
            'body.expectedAmountCents': `The price is now ${formatMoney(service.priceCents, service.currency)}`,
          },
        );
      }
      const ball = await arsenalRepository.findOwned(user.id, input.ballId, { transaction });
      if (!ball) throw AppError.badRequest('That ball is not in your arsenal', { 'body.ballId': 'Not in your arsenal' });
      const o = await shopRepository.createOrder(
        {
          userId: user.id,
          centerId: service.centerId,
          serviceId: service.id,
          ballId: ball.id,
          serviceKind: service.kind,
          serviceName: service.name,
          grit: service.grit,
          ballName: ballLabel(ball).slice(0, 150),
          amountCents: service.priceCents,
          currency: service.currency,
          notes: input.notes ?? null,
        },
        transaction,
      );
      await shopRepository.addEvent(o.id, 'ordered', user, transaction);
      await audit(
        {
          actorId: user.id,
          action: 'order.created',
          subjectType: 'order',
          subjectId: o.id,
          details: { centerId: o.centerId, serviceId: service.id, ballId: ball.id, amountCents: o.amountCents, currency: o.currency },
        },
        transaction,
      );
      return o.id;
    });
    return freshOrder(id);
  },

  /**
   * A walk-in order taken at the counter by the center's proprietor for a customer without an account: the price
   * comes from the price list, the ball is described in words, and it is paid at the counter when taken.
   */
  async createWalkIn(actor: AuthUser, centerId: number, input: WalkInOrder): Promise<OrderDto> {
    await ownedCenter(actor, centerId);
    const id = await sequelize.transaction(async (transaction) => {
      const service = await shopRepository.service(input.serviceId, transaction);
      if (!service || !service.active || service.centerId !== centerId)
        throw AppError.badRequest('That service is not on this center’s price list', { 'body.serviceId': 'Not on the price list' });
      if (input.expectedAmountCents !== undefined && input.expectedAmountCents !== service.priceCents)
        throw new AppError(400, 'price_mismatch', `The price of ${service.name} is ${formatMoney(service.priceCents, service.currency)}`, {
          'body.expectedAmountCents': `The price is now ${formatMoney(service.priceCents, service.currency)}`,
        });
      const now = new Date();
      const o = await shopRepository.createOrder(
        {
          userId: null,
          customerName: input.customerName,
          customerContact: input.customerContact,
          centerId,
          serviceId: service.id,
          ballId: null,
          serviceKind: service.kind,
          serviceName: service.name,
          grit: service.grit,
          ballName: input.ballDescription,
          amountCents: service.priceCents,
          currency: service.currency,
          notes: input.notes ?? null,
          status: 'paid',
          paymentStatus: 'paid',
          paidAt: now,
        },
        transaction,
      );
      await shopRepository.addEvent(o.id, 'ordered', actor, transaction, 'Walk-in order at the counter', now);
      await shopRepository.addEvent(o.id, 'paid', actor, transaction, 'Paid at the counter', now);
      await audit(
        {
          actorId: actor.id,
          action: 'order.walk_in_created',
          subjectType: 'order',
          subjectId: o.id,
          details: { centerId, serviceId: service.id, amountCents: o.amountCents, currency: o.currency },
        },
        transaction,
      );
      return o.id;
    });
    return freshOrder(id);
  },

  async mine(user: AuthUser, q: OrderListQuery): Promise<Page<OrderDto>> {
    const where: WhereOptions<Order> = { userId: user.id, ...statusWhere(q) };
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
      if (order.status !== 'ordered' || order.paymentStatus === 'paid')
        throw AppError.conflict('not_cancellable', 'Only an unpaid order can be cancelled; ask the shop for a refund');
      order.set({
        status: 'cancelled',
        cancelledAt: new Date(),
        paymentStatus: order.paymentStatus === 'processing' ? 'unpaid' : order.paymentStatus,
      });
      await order.save({ transaction });
      await shopRepository.addEvent(order.id, 'cancelled', user, transaction);
      await audit({ actorId: user.id, action: 'order.cancelled', subjectType: 'order', subjectId: order.id }, transaction);
      return (await shopRepository.payments(order.id, transaction)).filter((p) => p.status === 'open' && p.checkoutSessionId);
    });
    if (open.length) {
      try {
        const stripe = await stripeClient();
        for (const p of open)
          await stripe.checkout.sessions
            .expire(p.checkoutSessionId!)
            .catch((err: unknown) => logger.info({ err, sessionId: p.checkoutSessionId }, 'checkout already closed'));
      } catch (err) {
        logger.warn({ err }, 'could not expire the checkout of a cancelled order');
      }
    }
    return freshOrder(id);
  },

  async centerOrders(actor: AuthUser, centerId: number, q: CenterOrderQuery): Promise<Page<OrderDto>> {
    const center = await ownedCenter(actor, centerId);
    const where: Record<string | symbol, unknown> = { centerId, ...statusWhere(q) };
    if (q.date) {
      // The center's local day.
      const bounds = await shopRepository.localDayBounds(q.date, knownZone(center.timeZone));
      where.createdAt = { [Op.gte]: bounds.from, [Op.lt]: bounds.to };
    }
    const { rows, count } = await shopRepository.page(where as WhereOptions<Order>, q.page, q.pageSize);
    return { items: rows.map(toOrderDto), total: count, page: q.page, pageSize: q.pageSize };
  },

  /**
   * The shop moves a paid order forward (paid → in progress → ready → collected; 'ready' may skip 'in progress').
   * 'ready' on a surface service records the ball's surface event and sets its surface in the same
   * transaction, so the next matchup ranks the ball with it.
   */
  async setStatus(actor: AuthUser, id: number, status: ShopMove): Promise<OrderDto> {
    const o = await visibleOrder(actor, id);
    if (o.center?.ownerId !== actor.id) throw AppError.forbidden('Only the shop moves an order along');
    await sequelize.transaction(async (transaction) => {
      const order = (await shopRepository.lockOrder(id, transaction))!;
      const from: OrderStatus = order.status;
      if (!canShopMove(from, status))
        throw AppError.conflict(
          'bad_transition',
          from === 'ordered' ? 'The order is not paid yet' : `A ${from.replace('_', ' ')} order cannot move to ${status.replace('_', ' ')}`,
        );
      const now = new Date();
      order.status = status;
      if (status === 'ready') order.readyAt = now;
      if (status === 'collected') order.collectedAt = now;
      if (status === 'ready' && SURFACE_KINDS.includes(order.serviceKind) && order.ballId) {
        const ball = order.userId ? await arsenalRepository.lockOwnedEvenRemoved(order.userId, order.ballId, transaction) : null;
        if (ball) {
          const toGrit = order.serviceKind === 'resurface' && order.grit ? order.grit : ball.surfaceGrit;
          const toPolished = order.serviceKind === 'polish' ? true : order.serviceKind === 'resurface' ? false : ball.polished;
          await arsenalRepository.addSurfaceEvent(
            {
              ballId: ball.id,
              fromGrit: ball.surfaceGrit,
              fromPolished: ball.polished,
              toGrit,
              toPolished,
              at: now,
              byUserId: actor.id,
              note: `${o.center?.name ?? 'Pro shop'}: ${order.serviceName} (order #${order.id})`.slice(0, 500),
            },
            transaction,
          );
          ball.set({
            surfaceGrit: toGrit,
            polished: toPolished,
            ...(order.serviceKind === 'oil-extraction'
              ? { gamesSinceExtraction: 0, extractionCountedAt: now }
              : { gamesSinceResurface: 0, resurfaceCountedAt: now }),
          });
          await ball.save({ transaction });
          refitBowlerAfterCommit(ball.ownerId, transaction);
        }
      }
      await order.save({ transaction });
      await shopRepository.addEvent(order.id, status, actor, transaction, null, now, from);
      await audit(
        { actorId: actor.id, action: 'order.status_changed', subjectType: 'order', subjectId: order.id, details: { from, to: status } },
        transaction,
      );
      if (status === 'ready' && order.userId) await enqueueOrderMail('ready', order, publicUrl(), transaction);
    });
    return freshOrder(id);
  },

  /**
   * Undoes the last move of an order within SHOP_UNDO_SECONDS, by the staff member who made it: in progress goes
   * back to paid, collected back to ready. 'Ready' is not undone (the bowler has been e-mailed and the ball's
   * surface recorded); nor is a move someone else made or one followed by another step.
   */
  async undoMove(actor: AuthUser, id: number): Promise<OrderDto> {
    const o = await visibleOrder(actor, id);
    if (o.center?.ownerId !== actor.id) throw AppError.forbidden('Only the shop moves an order along');
    await sequelize.transaction(async (transaction) => {
      const order = (await shopRepository.lockOrder(id, transaction))!;
      const last = await shopRepository.lastEvent(order.id, transaction);
      const undoable =
        last && last.fromStatus && last.status === order.status && (last.status === 'in_progress' || last.status === 'collected');
      if (!last || !undoable)
        throw AppError.conflict(
          'nothing_to_undo',
          last?.status === 'ready' && last.fromStatus
            ? 'Marking an order ready cannot be undone: the bowler has been told to collect it'
            : 'This order has no move to undo',
        );
      if (last.byUserId !== actor.id) throw AppError.conflict('nothing_to_undo', 'Only the person who made the move can undo it');
      if (Date.now() - last.at.getTime() > SHOP_UNDO_SECONDS * 1000)
        throw AppError.conflict('undo_expired', `A move can be undone for ${SHOP_UNDO_SECONDS / 60} minutes; this one is older`);
      const undone = last.status;
      const back = last.fromStatus!;
      order.status = back;
      if (undone === 'collected') order.collectedAt = null;
      await order.save({ transaction });
      await shopRepository.addEvent(order.id, back, actor, transaction, `Undone: ${undone.replace('_', ' ')}`);
      await audit(
        {
          actorId: actor.id,
          action: 'order.status_undone',
          subjectType: 'order',
          subjectId: order.id,
          details: { from: undone, to: back },
        },
        transaction,
      );
    });
    return freshOrder(id);
  },
};

/** The status filter of an order list: one status, or the open ones (the ball is at the shop). */
function statusWhere(q: OrderListQuery): WhereOptions<Order> {
  if (q.status) return { status: q.status };
  if (q.open === '1' || q.open === 'true') return { status: [...OPEN_ORDER_STATUSES] };
  return {};
}
