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

/** Statuses of an order whose ball is at the shop: ordered, not yet collected, cancelled or refunded. */
export const OPEN_ORDER_STATUSES: readonly OrderStatus[] = ['ordered', 'paid', 'in_progress', 'ready'];

export const OrderListQuerySchema = PageQuerySchema.extend({
  status: OrderStatusSchema.optional(),
  /** 1: only open orders (the ball is at the shop). */
  open: z.enum(['0', '1', 'true', 'false'], { error: 'Use 1 or 0' }).optional(),
});
export type OrderListQuery = z.infer<typeof OrderListQuerySchema>;
export const CenterOrderQuerySchema = OrderListQuerySchema.extend({ date: isoDate.optional() });
export type CenterOrderQuery = z.infer<typeof CenterOrderQuerySchema>;

/** The longest takings range one request covers (about a quarter). */
export const TAKINGS_MAX_DAYS = 92;
const dayNumber = (iso: string) => Date.parse(`${iso}T00:00:00Z`) / 86400000;

/**
 * Takings of one day (`date`) or of a range of days (`from`–`to`, both included), as local dates of the center's
 * time zone; neither: the center's today.
 */
export const TakingsQuerySchema = z
  .object({ date: isoDate.optional(), from: isoDate.optional(), to: isoDate.optional() })
  .superRefine((q, ctx) => {
    if (q.date && (q.from || q.to)) ctx.addIssue({ code: 'custom', path: ['date'], message: 'Give a day or a range (from, to), not both' });
    if (q.to && !q.from) ctx.addIssue({ code: 'custom', path: ['from'], message: 'A range needs its first day' });
    if (q.from && q.to) {
      const days = dayNumber(q.to) - dayNumber(q.from) + 1;
      if (days < 1) ctx.addIssue({ code: 'custom', path: ['to'], message: 'The last day comes on or after the first' });
      else if (days > TAKINGS_MAX_DAYS) ctx.addIssue({ code: 'custom', path: ['to'], message: `At most ${TAKINGS_MAX_DAYS} days at once` });
    }
  });
export type TakingsQuery = z.infer<typeof TakingsQuerySchema>;

/** Seconds during which the staff member who moved an order can undo that move. */
export const SHOP_UNDO_SECONDS = 120;

const customerText = (label: string, max: number) =>
  z
    .string({ error: `${label} is required` })
    .trim()
    .min(1, `${label} is required`)
    .max(max, `At most ${max} characters`);

/**
 * A walk-in order taken at the counter for a customer without an account: who (name and a phone or e-mail), which
 * service of the price list (its price), and the ball in words. It is paid at the counter when taken.
 */
export const WalkInOrderSchema = z
  .object({
    serviceId: z.number({ error: 'Choose a service' }).int().positive().max(2147483647),
    customerName: customerText('The customer’s name', 80).refine(isSafeName, UNSAFE_NAME_MESSAGE),
    customerContact: customerText('A phone number or e-mail', 120),
    ballDescription: customerText('A description of the ball', 150),
    notes: z.string().trim().max(1000, 'At most 1000 characters').nullable().optional(),
    expectedAmountCents: z.number({ error: 'Must be a number of cents' }).int().min(0).max(100000000).optional(),
  })
  .strict();
export type WalkInOrder = z.infer<typeof WalkInOrderSchema>;

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
  /** Taken at the counter for a customer without an account (userId and ballId are then 0). */
  walkIn: z.boolean(),
  /** A walk-in customer's phone or e-mail (shown to the shop only; null otherwise). */
  customerContact: z.string().nullable(),
});
export type Order = z.infer<typeof OrderSchema>;

export const CheckoutStartSchema = z.object({
  /** Where the browser goes to pay (the payment service's hosted page). */
  url: z.string(),
  checkoutSessionId: z.string(),
});
export type CheckoutStart = z.infer<typeof CheckoutStartSchema>;

export const TakingsDaySchema = z.object({
  /** A local date of the center's time zone. */
  date: z.string(),
  orders: z.number().int(),
  paidCents: z.number().int(),
  refundedCents: z.number().int(),
  netCents: z.number().int(),
});
export type TakingsDay = z.infer<typeof TakingsDaySchema>;

export const TakingsSchema = z.object({
  /** The day asked for (the first day of a range). */
  date: z.string(),
  /** The range's first and last day (equal for one day), local dates of the center's time zone. */
  from: z.string(),
  to: z.string(),
  /** The center's IANA time zone its days are reckoned in. */
  timeZone: z.string(),
  /** Each day of the range, in order (days without takings included). */
  days: z.array(TakingsDaySchema),
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
