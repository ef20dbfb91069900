import { z } from 'zod';
import { isSafeName, UNSAFE_NAME_MESSAGE } from './text';
import { PageQuerySchema } from './auth';

// ---- the price list -------------------------------------------------------------------------------

export const SERVICE_KINDS = ['resurface', 'polish', 'oil-extraction', 'plug-redrill', 'drill'] as const;
export const ServiceKindSchema = z.enum(SERVICE_KINDS, { error: 'Choose a kind of service' });
export type ServiceKind = z.infer<typeof ServiceKindSchema>;

/** Services that change the ball's surface when done (the ball's surface history records them). */
export const SURFACE_KINDS: readonly ServiceKind[] = ['resurface', 'polish', 'oil-extraction'];
/** Services that drill or plug the ball. */
export const DRILLING_KINDS: readonly ServiceKind[] = ['plug-redrill', 'drill'];

export const CURRENCIES = ['usd', 'eur', 'gbp', 'cad', 'aud'] as const;
export const CurrencySchema = z.enum(CURRENCIES, { error: 'Choose a currency' });
export type Currency = z.infer<typeof CurrencySchema>;

/** Integer cents: $0.50 (the card networks' usual minimum) to $5,000. */
const priceCents = z
  .number({ error: 'Price is a number of cents' })
  .int('Price is a whole number of cents')
  .min(50, 'At least 50 cents')
  .max(500000, 'At most 5,000.00');
const grit = z.number({ error: 'Grit is a number' }).int('Whole grit').min(100, 'At least 100 grit').max(10000, 'At most 10000 grit');

const serviceFields = {
  kind: ServiceKindSchema,
  name: z
    .string({ error: 'Name is required' })
    .trim()
    .min(1, 'Name is required')
    .max(80, 'At most 80 characters')
    .refine(isSafeName, UNSAFE_NAME_MESSAGE),
  grit: grit.nullable().optional(),
  description: z.string().trim().max(500, 'At most 500 characters').nullable().optional(),
  priceCents,
  currency: CurrencySchema.optional(),
};

const gritRule = (s: { kind?: ServiceKind; grit?: number | null }) => s.kind !== 'resurface' || (s.grit !== undefined && s.grit !== null);
export const ServiceInputSchema = z
  .object(serviceFields)
  .strict()
  .refine(gritRule, { path: ['grit'], message: 'A resurface needs its target grit' });
export type ServiceInput = z.infer<typeof ServiceInputSchema>;

export const ServicePatchSchema = z
  .object({
    version: z.number({ error: 'The version you edited is required' }).int().min(0),
    kind: serviceFields.kind.optional(),
    name: serviceFields.name.optional(),
    grit: serviceFields.grit,
    description: serviceFields.description,
    priceCents: priceCents.optional(),
    currency: serviceFields.currency,
    active: z.boolean({ error: 'Active is yes or no' }).optional(),
  })
  .strict();
export type ServicePatch = z.infer<typeof ServicePatchSchema>;

export const ServiceListQuerySchema = z.object({ all: z.enum(['0', '1', 'true', 'false']).optional() });

export const ServiceParamsSchema = z.object({
  id: z.coerce.number({ error: 'Must be a number' }).int().positive().max(2147483647),
  serviceId: z.coerce.number({ error: 'Must be a number' }).int().positive().max(2147483647),
});

export const ShopServiceSchema = z.object({
  id: z.number().int(),
  centerId: z.number().int(),
  kind: z.enum(SERVICE_KINDS),
  name: z.string(),
  /** Target grit of a resurface (null for other services). */
  grit: z.number().int().nullable(),
  description: z.string().nullable(),
  priceCents: z.number().int(),
  currency: z.enum(CURRENCIES),
  active: z.boolean(),
  version: z.number().int(),
});
export type ShopService = z.infer<typeof ShopServiceSchema>;

// ---- orders ---------------------------------------------------------------------------------------

export const ORDER_STATUSES = ['ordered', 'paid', 'in_progress', 'ready', 'collected', 'cancelled', 'refunded'] as const;
export const OrderStatusSchema = z.enum(ORDER_STATUSES, { error: 'Unknown status' });
export type OrderStatus = z.infer<typeof OrderStatusSchema>;
export const PAYMENT_STATUSES = ['unpaid', 'processing', 'paid', 'failed', 'refunded'] as const;
export type PaymentStatus = (typeof PAYMENT_STATUSES)[number];

/** The shop's forward moves (from paid); 'ready' on a surface service updates the ball. */
export const SHOP_STATUS_MOVES = ['in_progress', 'ready', 'collected'] as const;
export const OrderStatusChangeSchema = z
  .object({ status: z.enum(SHOP_STATUS_MOVES, { error: 'Choose in_progress, ready or collected' }) })
  .strict();
export type OrderStatusChange = z.infer<typeof OrderStatusChangeSchema>;

/**
 * A new order. The price is never taken from the client: any amount field is refused (strict), and
 * `expectedAmountCents` — the price the bowler saw — must equal the price list's, else 400 price_mismatch.
 */
export const OrderCreateSchema = z
  .object({
    serviceId: z.number({ error: 'Choose a service' }).int().positive().max(2147483647),
    ballId: z.number({ error: 'Choose a ball' }).int().positive().max(2147483647),
    notes: z.string().trim().max(1000, 'At most 1000 characters').nullable().optional(),
    expectedAmountCents: z.number({ error: 'Must be a number of cents' }).int().min(0).max(100000000).optional(),
  })
  .strict();
export type OrderCreate = z.infer<typeof OrderCreateSchema>;

const isoDate = z.iso.date({ error: 'Use a date like 2026-12-01' });

export const OrderListQuerySchema = PageQuerySchema.extend({ status: OrderStatusSchema.optional() });
export type OrderListQuery = z.infer<typeof OrderListQuerySchema>;
export const CenterOrderQuerySchema = OrderListQuerySchema.extend({ date: isoDate.optional() });
export type CenterOrderQuery = z.infer<typeof CenterOrderQuerySchema>;
export const TakingsQuerySchema = z.object({ date: isoDate.optional() });

export const OrderHistoryEntrySchema = z.object({
  status: OrderStatusSchema,
  at: z.string(),
  /** Who made the change (display name); null for the payment service. */
  by: z.string().nullable(),
});
export type OrderHistoryEntry = z.infer<typeof OrderHistoryEntrySchema>;

export const OrderSchema = z.object({
  id: z.number().int(),
  userId: z.number().int(),
  bowlerName: z.string(),
  centerId: z.number().int(),
  centerName: z.string(),
  serviceId: z.number().int(),
  serviceKind: z.enum(SERVICE_KINDS),
  serviceName: z.string(),
  grit: z.number().int().nullable(),
  ballId: z.number().int(),
  ballName: z.string(),
  amountCents: z.number().int(),
  currency: z.enum(CURRENCIES),
  status: OrderStatusSchema,
  notes: z.string().nullable(),
  paymentStatus: z.enum(PAYMENT_STATUSES),
  lastPaymentError: z.string().nullable(),
  createdAt: z.string(),
  paidAt: z.string().nullable(),
  readyAt: z.string().nullable(),
  collectedAt: z.string().nullable(),
  refundedAt: z.string().nullable(),
  cancelledAt: z.string().nullable(),
  history: z.array(OrderHistoryEntrySchema),
});
export type Order = z.infer<typeof OrderSchema>;

export const CheckoutStartSchema = z.object({
  /** Where the browser goes to pay (the payment service's hosted page). */
  url: z.string(),
  checkoutSessionId: z.string(),
});
export type CheckoutStart = z.infer<typeof CheckoutStartSchema>;

export const TakingsSchema = z.object({
  date: z.string(),
  currency: z.enum(CURRENCIES),
  /** Orders paid on the day. */
  orders: z.number().int(),
  paidCents: z.number().int(),
  refundedCents: z.number().int(),
  netCents: z.number().int(),
  byService: z.array(z.object({ serviceId: z.number().int(), name: z.string(), count: z.number().int(), cents: z.number().int() })),
});
export type Takings = z.infer<typeof TakingsSchema>;

/** "$45.00" style text for integer cents (the amount and the code when the currency is unknown to Intl). */
export function formatMoney(cents: number, currency = 'usd', locale = 'en-US'): string {
  try {
    return new Intl.NumberFormat(locale, { style: 'currency', currency: currency.toUpperCase() }).format(cents / 100);
  } catch {
    return `${(cents / 100).toFixed(2)} ${currency.toUpperCase()}`;
  }
}

// ---- the order's life ------------------------------------------------------------------------------

/**
 * How far along an order is: ordered → paid → in progress → ready → collected; cancelled and refunded are
 * ends off that line. The shop moves a paid order forward ('ready' may skip 'in progress'); 'collected'
 * comes only after 'ready'.
 */
const ORDER_STEP: Readonly<Record<OrderStatus, number>> = {
  ordered: 0,
  paid: 1,
  in_progress: 2,
  ready: 3,
  collected: 4,
  cancelled: -1,
  refunded: -1,
};
export type ShopMove = (typeof SHOP_STATUS_MOVES)[number];

/** Whether the shop may move an order from `from` to `to`. */
export function canShopMove(from: OrderStatus, to: ShopMove): boolean {
  return ORDER_STEP[from] >= 1 && ORDER_STEP[to] > ORDER_STEP[from] && !(to === 'collected' && from !== 'ready');
}

/** The shop's next step for an order in this status (the one button of the orders board), or null. */
export function nextShopMove(status: OrderStatus): ShopMove | null {
  if (status === 'paid') return 'in_progress';
  if (status === 'in_progress') return 'ready';
  if (status === 'ready') return 'collected';
  return null;
}

/** A paid order not yet collected can be refunded. */
export function canRefund(status: OrderStatus): boolean {
  return status === 'paid' || status === 'in_progress' || status === 'ready';
}

// ---- cautions -------------------------------------------------------------------------------------

/** Lanewright's cautions for pro-shop work, by kind of service (shown in the order dialog). */
export const SHOP_CAUTIONS = {
  drilling:
    'Drilling, plugging and fitting are work for a qualified pro-shop technician; a new layout changes how the ball reacts, so talk the layout through with the technician first.',
  surface:
    'Resurfacing and polishing use abrasives and solvents: the shop works with eye and dust protection and follows the ball maker’s instructions. If you sand at home, do the same.',
  rules:
    'Check your league’s or tournament’s equipment rules before a surface change or a redrill (some events fix the surface or forbid changes during play).',
  oil: 'Oil extraction heats the ball: it is the shop’s job, not an oven at home.',
} as const;

/** The cautions that apply to one kind of service. */
export function cautionsFor(kind: ServiceKind): string[] {
  if (kind === 'drill' || kind === 'plug-redrill') return [SHOP_CAUTIONS.drilling, SHOP_CAUTIONS.rules];
  if (kind === 'oil-extraction') return [SHOP_CAUTIONS.oil, SHOP_CAUTIONS.rules];
  return [SHOP_CAUTIONS.surface, SHOP_CAUTIONS.rules];
}
