import { Op, type CreationAttributes, type Transaction, type WhereOptions } from 'sequelize';
import { SERVICE_KINDS, type Order as OrderDto, type OrderStatus, type ShopService as ShopServiceDto } from '../../../shared/shop';
import { Center, Order, OrderEvent, Payment, PaymentEvent, sequelize, ShopService, User } from '../../models/index';
import { NEWEST_FIRST, newestFirstPage } from '../../db/paging';

export function toServiceDto(s: ShopService): ShopServiceDto {
  return {
    id: s.id,
    centerId: s.centerId,
    kind: s.kind,
    name: s.name,
    grit: s.grit,
    description: s.description,
    priceCents: s.priceCents,
    currency: s.currency,
    active: s.active,
    version: s.version,
  };
}

type OrderRow = Order & { bowler?: User; center?: Center; events?: OrderEvent[] };

export function toOrderDto(o: OrderRow): OrderDto {
  const iso = (d: Date | null | undefined) => (d ? d.toISOString() : null);
  return {
    id: o.id,
    userId: o.userId,
    bowlerName: o.bowler?.displayName ?? '',
    centerId: o.centerId,
    centerName: o.center?.name ?? '',
    serviceId: o.serviceId ?? 0,
    serviceKind: o.serviceKind,
    serviceName: o.serviceName,
    grit: o.grit,
    ballId: o.ballId ?? 0,
    ballName: o.ballName,
    amountCents: o.amountCents,
    currency: o.currency,
    status: o.status,
    notes: o.notes,
    paymentStatus: o.paymentStatus,
    lastPaymentError: o.lastPaymentError,
    createdAt: o.createdAt.toISOString(),
    paidAt: iso(o.paidAt),
    readyAt: iso(o.readyAt),
    collectedAt: iso(o.collectedAt),
    refundedAt: iso(o.refundedAt),
    cancelledAt: iso(o.cancelledAt),
    history: [...(o.events ?? [])]
      .sort((a, b) => a.at.getTime() - b.at.getTime() || a.id - b.id)
      .map((e) => ({ status: e.status, at: e.at.toISOString(), by: e.byName })),
  };
}

const orderIncludes = [
  { model: User, as: 'bowler', attributes: ['id', 'displayName', 'email'] },
  { model: Center, as: 'center', attributes: ['id', 'name', 'ownerId'] },
  { model: OrderEvent, as: 'events' },
];

export const shopRepository = {
  /** The price list in the shop's order: resurfaces (finest grit first), polish, oil extraction, plug and redrill, drilling. */
  async services(centerId: number, includeInactive: boolean): Promise<ShopService[]> {
    const rows = await ShopService.findAll({ where: { centerId, ...(includeInactive ? {} : { active: true }) }, order: [['id', 'ASC']] });
    const rank = (k: ShopService['kind']) => SERVICE_KINDS.indexOf(k);
    return rows.sort((a, b) => rank(a.kind) - rank(b.kind) || (b.grit ?? 0) - (a.grit ?? 0) || a.priceCents - b.priceCents || a.id - b.id);
  },
  service(id: number, transaction?: Transaction): Promise<ShopService | null> {
    return ShopService.findByPk(id, { transaction });
  },
  createService(data: CreationAttributes<ShopService>, transaction: Transaction): Promise<ShopService> {
    return ShopService.create(data, { transaction });
  },
  /** Locks one price-list entry of a center for the rest of the transaction. */
  lockService(centerId: number, id: number, transaction: Transaction): Promise<ShopService | null> {
    return ShopService.findOne({ where: { id, centerId }, transaction, lock: transaction.LOCK.UPDATE });
  },
  createOrder(data: CreationAttributes<Order>, transaction: Transaction): Promise<Order> {
    return Order.create(data, { transaction });
  },
  /** One order with its bowler, center and history. */
  order(id: number, transaction?: Transaction): Promise<OrderRow | null> {
    return Order.findByPk(id, { include: orderIncludes, transaction }) as Promise<OrderRow | null>;
  },
  /** Locks the order row for the rest of the transaction (webhooks, status moves and refunds serialise on it). */
  lockOrder(id: number, transaction: Transaction): Promise<Order | null> {
    return Order.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
  },
  async page(where: WhereOptions<Order>, page: number, pageSize: number): Promise<{ rows: OrderRow[]; count: number }> {
    const count = await Order.count({ where });
    const ids = (
      await Order.findAll({
        where,
        attributes: ['id'],
        ...newestFirstPage(page, pageSize),
      })
    ).map((o) => o.id);
    const rows = ids.length
      ? ((await Order.findAll({
          where: { id: ids },
          include: orderIncludes,
          order: NEWEST_FIRST,
        })) as OrderRow[])
      : [];
    return { rows, count };
  },
  addEvent(
    orderId: number,
    status: OrderStatus,
    by: { id: number; displayName: string } | null,
    transaction: Transaction,
    note: string | null = null,
    at = new Date(),
  ): Promise<OrderEvent> {
    return OrderEvent.create({ orderId, status, at, byUserId: by?.id ?? null, byName: by?.displayName ?? null, note }, { transaction });
  },
  payments(orderId: number, transaction?: Transaction): Promise<Payment[]> {
    return Payment.findAll({ where: { orderId }, order: [['id', 'ASC']], transaction });
  },
  createPayment(data: CreationAttributes<Payment>, transaction: Transaction): Promise<Payment> {
    return Payment.create(data, { transaction });
  },
  lockPayment(id: number, transaction: Transaction): Promise<Payment | null> {
    return Payment.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
  },
  payment(id: number): Promise<Payment | null> {
    return Payment.findByPk(id);
  },
  /** Records a payment-service event id; false when it was recorded before (a duplicate delivery). */
  async claimEvent(eventId: string, type: string, transaction: Transaction): Promise<boolean> {
    const [rows] = await sequelize.query(
      'INSERT INTO payment_events (event_id, type, received_at) VALUES (:id, :type, now()) ON CONFLICT (event_id) DO NOTHING RETURNING event_id',
      {
        replacements: { id: eventId, type },
        transaction,
      },
    );
    return (rows as unknown[]).length > 0;
  },
  async recordEventOutcome(eventId: string, orderId: number | null, outcome: string, transaction: Transaction): Promise<void> {
    await PaymentEvent.update({ orderId, outcome }, { where: { eventId }, transaction });
  },
  /** The bowler and the center of an order (its mails). */
  async orderParties(order: Pick<Order, 'userId' | 'centerId'>, transaction?: Transaction): Promise<[User | null, Center | null]> {
    return Promise.all([User.findByPk(order.userId, { transaction }), Center.findByPk(order.centerId, { transaction })]);
  },
  /** Marks a checkout attempt expired if it is still open. */
  async expireOpenPayment(id: number): Promise<void> {
    await Payment.update({ status: 'expired' }, { where: { id, status: 'open' } });
  },
  async setRefundId(id: number, refundId: string | null, transaction?: Transaction): Promise<void> {
    await Payment.update({ refundId }, { where: { id }, transaction });
  },
  paymentBySession(sessionId: string, transaction?: Transaction): Promise<Payment | null> {
    return Payment.findOne({ where: { checkoutSessionId: sessionId }, transaction });
  },
  paymentByIntent(intentId: string, transaction?: Transaction): Promise<Payment | null> {
    return Payment.findOne({ where: { paymentIntentId: intentId }, transaction });
  },
  /** Orders of a center paid during [from, to). */
  paidBetween(centerId: number, from: Date, to: Date): Promise<Order[]> {
    return Order.findAll({ where: { centerId, paidAt: { [Op.gte]: from, [Op.lt]: to } } });
  },
  /** Refunds of a center's orders made during [from, to). */
  refundedBetween(centerId: number, from: Date, to: Date): Promise<Order[]> {
    return Order.findAll({ where: { centerId, refundedAt: { [Op.gte]: from, [Op.lt]: to }, paidAt: { [Op.ne]: null } } });
  },
};
