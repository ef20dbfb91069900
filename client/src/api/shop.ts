import type { Page } from '@shared/auth';
import { api } from './client';

/**
 * The pro shop: a center's price list, a bowler's orders and their card payment, and the proprietor's
 * orders board with the day's takings. Prices always come from the server's price list; the client only
 * echoes the price it showed (`expectedAmountCents`) so a price changed meanwhile is refused, never charged.
 */

import {
  ORDER_STATUSES,
  SERVICE_KINDS,
  SURFACE_KINDS,
  canRefund,
  cautionsFor,
  formatMoney,
  nextShopMove,
  type CheckoutStart,
  type Order,
  type OrderCreate,
  type OrderHistoryEntry,
  type OrderListQuery,
  type OrderStatus,
  type PaymentStatus,
  type ServiceInput,
  type ServiceKind,
  type ServicePatch,
  type ShopMove,
  type ShopService,
  type Takings,
  type TakingsDay,
  type WalkInOrder,
  SHOP_UNDO_SECONDS,
  TAKINGS_MAX_DAYS,
} from '@shared/shop';

export { ORDER_STATUSES, SERVICE_KINDS, SURFACE_KINDS, SHOP_UNDO_SECONDS, TAKINGS_MAX_DAYS, cautionsFor };
export type {
  CheckoutStart,
  Order,
  OrderCreate,
  OrderHistoryEntry,
  OrderStatus,
  PaymentStatus,
  ServiceInput,
  ServiceKind,
  ServicePatch,
  ShopMove,
  ShopService,
  Takings,
  TakingsDay,
  WalkInOrder,
};

/** The order's life (the shop's next move, refunds) and money formatting are the shared rules the server applies. */
export { canRefund, formatMoney, nextShopMove as nextMove };

export type OrderListParams = Partial<OrderListQuery>;

export const shopApi = {
  /** Active services of a center (`all`: the owner sees inactive ones too). */
  services: (centerId: number, options: { all?: boolean; signal?: AbortSignal } = {}) =>
    api.get<{ items: ShopService[] }>(`/centers/${centerId}/services`, {
      query: { all: options.all ? 1 : undefined },
      signal: options.signal,
    }),
  createService: (centerId: number, body: ServiceInput) => api.post<{ item: ShopService }>(`/centers/${centerId}/services`, body),
  /** `version` must be the one read; a stale one answers 409. */
  updateService: (centerId: number, serviceId: number, body: ServicePatch) =>
    api.patch<{ item: ShopService }>(`/centers/${centerId}/services/${serviceId}`, body),

  createOrder: (body: OrderCreate) => api.post<{ item: Order }>('/orders', body),
  checkout: (orderId: number) => api.post<CheckoutStart>(`/orders/${orderId}/checkout`),
  myOrders: (params: OrderListParams = {}, signal?: AbortSignal) => api.get<Page<Order>>('/orders', { query: { ...params }, signal }),
  order: (orderId: number, signal?: AbortSignal) => api.get<{ item: Order }>(`/orders/${orderId}`, { signal }),
  cancel: (orderId: number) => api.post<{ item: Order }>(`/orders/${orderId}/cancel`),

  centerOrders: (centerId: number, params: OrderListParams & { date?: string } = {}, signal?: AbortSignal) =>
    api.get<Page<Order>>(`/centers/${centerId}/orders`, { query: { ...params }, signal }),
  setStatus: (orderId: number, status: ShopMove) => api.patch<{ item: Order }>(`/orders/${orderId}/status`, { status }),
  refund: (orderId: number) => api.post<{ item: Order }>(`/orders/${orderId}/refund`),
  /** A range of the center's local dates (both included); null: the center's today. */
  takings: (centerId: number, range: { from: string; to: string } | null, signal?: AbortSignal) =>
    api.get<{ item: Takings }>(`/centers/${centerId}/takings`, { query: { ...range }, signal }),
  takingsCsv: (centerId: number, range: { from: string; to: string }) =>
    api.get<Blob>(`/centers/${centerId}/takings.csv`, { query: { ...range }, asBlob: true }),
  /** A walk-in order at the counter (paid there); the price is the price list's. */
  createWalkIn: (centerId: number, body: WalkInOrder) => api.post<{ item: Order }>(`/centers/${centerId}/orders`, body),
  /** Undo the shop's last move of an order (within SHOP_UNDO_SECONDS, by whoever made it). */
  undoMove: (orderId: number) => api.post<{ item: Order }>(`/orders/${orderId}/status/undo`),
};

/* ---- wording shared by the shop screens ------------------------------------------------------------ */

export const SERVICE_KIND_LABELS: Readonly<Record<ServiceKind, string>> = {
  resurface: 'Resurface',
  polish: 'Polish',
  'oil-extraction': 'Oil extraction',
  'plug-redrill': 'Plug and redrill',
  drill: 'Drilling',
};

export const ORDER_STATUS_LABELS: Readonly<Record<OrderStatus, string>> = {
  ordered: 'Ordered',
  paid: 'Paid',
  in_progress: 'In progress',
  ready: 'Ready to collect',
  collected: 'Collected',
  cancelled: 'Cancelled',
  refunded: 'Refunded',
};

export const PAYMENT_STATUS_LABELS: Readonly<Record<PaymentStatus, string>> = {
  unpaid: 'Not paid',
  processing: 'Card payment started',
  paid: 'Paid',
  failed: 'Payment failed',
  refunded: 'Refunded',
};

/** Element Plus tag type per order status. */
export const ORDER_STATUS_TAGS: Readonly<Record<OrderStatus, 'info' | 'primary' | 'success' | 'warning' | 'danger'>> = {
  ordered: 'info',
  paid: 'primary',
  in_progress: 'warning',
  ready: 'success',
  collected: 'success',
  cancelled: 'info',
  refunded: 'danger',
};

/** The button text of each shop move. */
export const MOVE_LABELS: Readonly<Record<ShopMove, string>> = {
  in_progress: 'Mark in progress',
  ready: 'Mark ready',
  collected: 'Mark collected',
};

/** "Resurface to 4000 grit — $45.00". */
export function serviceLabel(s: Pick<ShopService, 'name' | 'priceCents' | 'currency'>): string {
  return `${s.name} — ${formatMoney(s.priceCents, s.currency)}`;
}
