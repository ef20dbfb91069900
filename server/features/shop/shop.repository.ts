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
    userId: o.userId ?? 0,
    bowlerName: o.bowler?.displayName ?? o.customerName ?? '',
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
    walkIn: o.userId === null,
    customerContact: o.customerContact,
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
    fromStatus: OrderStatus | null = null,
  ): Promise<OrderEvent> {
    return OrderEvent.create(
      { orderId, status, at, byUserId: by?.id ?? null, byName: by?.displayName ?? null, note, fromStatus },
      { transaction },
    );
  },
  /** The newest step of an order's history, by when it was recorded (read inside the transaction that holds the order's lock). */
  lastEvent(orderId: number, transaction: Transaction): Promise<OrderEvent | null> {
    return OrderEvent.findOne({
      where: { orderId },
      order: [['id', 'DESC']],
      transaction,
    });
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
    return Promise.all([
      order.userId === null ? null : User.findByPk(order.userId, { transaction }),
      Center.findByPk(order.centerId, { transaction }),
    ]);
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
  /**
   * A center's takings per local day of `timeZone` for the local dates [from, to] (both included), in one currency:
   * orders paid and their amount, and refunds made, each on the local day it happened.
   */
  async takingsByDay(
    centerId: number,
    timeZone: string,
    from: string,
    to: string,
    currency: string,
  ): Promise<{ date: string; orders: number; paidCents: number; refundedCents: number }[]> {
    const [rows] = await sequelize.query(
      `WITH bounds AS (
         SELECT (CAST(:from AS date)::timestamp AT TIME ZONE :tz) AS lo,
                ((CAST(:to AS date) + 1)::timestamp AT TIME ZONE :tz) AS hi
       ),
       paid AS (
         SELECT to_char((o.paid_at AT TIME ZONE :tz)::date, 'YYYY-MM-DD') AS day, count(*)::int AS orders, sum(o.amount_cents)::bigint AS cents
           FROM orders o, bounds b
          WHERE o.center_id = :centerId AND o.currency = :currency AND o.paid_at >= b.lo AND o.paid_at < b.hi
          GROUP BY 1
       ),
       refunded AS (
         SELECT to_char((o.refunded_at AT TIME ZONE :tz)::date, 'YYYY-MM-DD') AS day, sum(o.amount_cents)::bigint AS cents
           FROM orders o, bounds b
          WHERE o.center_id = :centerId AND o.currency = :currency AND o.paid_at IS NOT NULL
            AND o.refunded_at >= b.lo AND o.refunded_at < b.hi
          GROUP BY 1
       )
       SELECT coalesce(p.day, r.day) AS date, coalesce(p.orders, 0) AS orders,
              coalesce(p.cents, 0)::text AS paid_cents, coalesce(r.cents, 0)::text AS refunded_cents
         FROM paid p FULL OUTER JOIN refunded r ON r.day = p.day
        ORDER BY 1`,
      { replacements: { centerId, tz: timeZone, from, to, currency } },
    );
    return (rows as { date: string; orders: number; paid_cents: string; refunded_cents: string }[]).map((r) => ({
      date: r.date,
      orders: Number(r.orders),
      paidCents: Number(r.paid_cents),
      refundedCents: Number(r.refunded_cents),
    }));
  },
  /** A center's takings by service over the local dates [from, to] of `timeZone`, in one currency. */
  async takingsByService(
    centerId: number,
    timeZone: string,
    from: string,
    to: string,
    currency: string,
  ): Promise<{ serviceId: number; name: string; count: number; cents: number }[]> {
    const [rows] = await sequelize.query(
      `SELECT coalesce(o.service_id, 0) AS service_id, min(o.service_name) AS name, count(*)::int AS count, sum(o.amount_cents)::text AS cents
         FROM orders o
        WHERE o.center_id = :centerId AND o.currency = :currency
          AND o.paid_at >= (CAST(:from AS date)::timestamp AT TIME ZONE :tz)
          AND o.paid_at < ((CAST(:to AS date) + 1)::timestamp AT TIME ZONE :tz)
        GROUP BY 1`,
      { replacements: { centerId, tz: timeZone, from, to, currency } },
    );
    return (rows as { service_id: number; name: string; count: number; cents: string }[]).map((r) => ({
      serviceId: Number(r.service_id),
      name: r.name,
      count: Number(r.count),
      cents: Number(r.cents),
    }));
  },
  /** The instants a local date of `timeZone` starts and ends at (PostgreSQL's time-zone rules). */
  async localDayBounds(date: string, timeZone: string): Promise<{ from: Date; to: Date }> {
    const [rows] = await sequelize.query(
      `SELECT (CAST(:date AS date)::timestamp AT TIME ZONE :tz) AS "from", ((CAST(:date AS date) + 1)::timestamp AT TIME ZONE :tz) AS "to"`,
      { replacements: { date, tz: timeZone } },
    );
    const r = (rows as { from: Date | string; to: Date | string }[])[0]!;
    return { from: new Date(r.from), to: new Date(r.to) };
  },
  /** The currency a center's takings are counted in: that of its newest paid order, else of its price list. */
  async takingsCurrency(centerId: number): Promise<string | null> {
    const o = await Order.findOne({
      where: { centerId, paidAt: { [Op.ne]: null } },
      order: [['paidAt', 'DESC']],
      attributes: ['currency'],
    });
    if (o) return o.currency;
    const s = await ShopService.findOne({ where: { centerId }, order: [['id', 'ASC']], attributes: ['currency'] });
    return s?.currency ?? null;
  },
  /** Refunds of a center's orders made during [from, to). */
  refundedBetween(centerId: number, from: Date, to: Date): Promise<Order[]> {
    return Order.findAll({ where: { centerId, refundedAt: { [Op.gte]: from, [Op.lt]: to }, paidAt: { [Op.ne]: null } } });
  },
};
