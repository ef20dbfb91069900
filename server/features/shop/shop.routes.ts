import { IdParamSchema } from '../../../shared/auth';
import { itemOf, itemsOf, pageOf } from '../../../shared/api';
import {
  CenterOrderQuerySchema,
  CheckoutStartSchema,
  OrderCreateSchema,
  OrderListQuerySchema,
  OrderSchema,
  OrderStatusChangeSchema,
  ServiceInputSchema,
  ServiceListQuerySchema,
  ServiceParamsSchema,
  ServicePatchSchema,
  ShopServiceSchema,
  TakingsQuerySchema,
  TakingsSchema,
  WalkInOrderSchema,
} from '../../../shared/shop';
import { requireAuth } from '../../middleware/auth';
import { route, type RouteGroup } from '../../http/route';
import { checkoutService } from './checkout.service';
import { ordersService } from './orders.service';
import { priceListService } from './priceList.service';
import { takingsService } from './takings.service';

const Order = itemOf(OrderSchema);

/** The pro shop of a center: price list, its orders board and the day's takings (under /api/centers). */
export const shopCenterRoutes: RouteGroup = {
  prefix: '/centers',
  routes: [
    route({
      method: 'get',
      path: '/:id/services',
      summary: 'A center’s pro-shop price list (active entries; its proprietor sees inactive ones too with ?all=1)',
      access: 'signed-in',
      params: IdParamSchema,
      query: ServiceListQuerySchema,
      response: itemsOf(ShopServiceSchema),
      handler: async ({ user, params, query }) => ({
        items: await priceListService.services(user, params.id, query.all === '1' || query.all === 'true'),
      }),
    }),
    route({
      method: 'post',
      path: '/:id/services',
      status: 201,
      summary: 'Add a price-list entry (the center’s proprietor; integer cents)',
      access: 'signed-in',
      params: IdParamSchema,
      body: ServiceInputSchema,
      response: itemOf(ShopServiceSchema),
      handler: async ({ user, params, body }) => ({ item: await priceListService.createService(user, params.id, body) }),
    }),
    route({
      method: 'patch',
      path: '/:id/services/:serviceId',
      summary: 'Edit or retire a price-list entry (the center’s proprietor; stale version → 409)',
      access: 'signed-in',
      params: ServiceParamsSchema,
      body: ServicePatchSchema,
      response: itemOf(ShopServiceSchema),
      handler: async ({ user, params, body }) => ({ item: await priceListService.updateService(user, params.id, params.serviceId, body) }),
    }),
    route({
      method: 'get',
      path: '/:id/orders',
      summary: 'The center’s pro-shop orders, newest first, by status and day (its proprietor only)',
      access: 'signed-in',
      params: IdParamSchema,
      query: CenterOrderQuerySchema,
      response: pageOf(OrderSchema),
      handler: ({ user, params, query }) => ordersService.centerOrders(user, params.id, query),
    }),
    route({
      method: 'get',
      path: '/:id/takings',
      summary:
        'Takings of a day (date) or a range (from, to; at most 92 days) in the center’s time zone: paid, refunded, net, each day and by service (its proprietor only)',
      access: 'signed-in',
      params: IdParamSchema,
      query: TakingsQuerySchema,
      response: itemOf(TakingsSchema),
      handler: async ({ user, params, query }) => ({ item: await takingsService.takings(user, params.id, query) }),
    }),
    route({
      method: 'get',
      path: '/:id/takings.csv',
      summary: 'The takings of a day or a range of days (from, to: the center’s local dates) as a CSV file (its proprietor only)',
      access: 'signed-in',
      params: IdParamSchema,
      query: TakingsQuerySchema,
      response: { contentType: 'text/csv', description: 'One line per day, a total line and the takings by service, as an attachment' },
      handler: async ({ user, params, query, res }) => {
        const f = await takingsService.takingsCsv(user, params.id, query);
        res.type('text/csv; charset=utf-8').setHeader('Content-Disposition', `attachment; filename="${f.filename}"`);
        res.send(f.csv);
      },
    }),
    route({
      method: 'post',
      path: '/:id/orders',
      status: 201,
      summary: 'Take a walk-in order at the counter for a customer without an account (its proprietor; paid at the counter)',
      access: 'signed-in',
      params: IdParamSchema,
      body: WalkInOrderSchema,
      response: Order,
      handler: async ({ user, params, body }) => ({ item: await ordersService.createWalkIn(user, params.id, body) }),
    }),
  ],
};

/** Orders: the bowler's own, and the moves of the shop that owns the order's center. */
export const ordersRoutes: RouteGroup = {
  prefix: '/orders',
  guard: [requireAuth],
  routes: [
    route({
      method: 'get',
      path: '/',
      summary: 'Your orders, newest first',
      access: 'signed-in',
      query: OrderListQuerySchema,
      response: pageOf(OrderSchema),
      handler: ({ user, query }) => ordersService.mine(user, query),
    }),
    route({
      method: 'post',
      path: '/',
      status: 201,
      access: 'signed-in',
      summary:
        'Order a pro-shop service for a ball of your arsenal; the price comes from the price list (any amount field → 400; expectedAmountCents ≠ price → 400 price_mismatch)',
      body: OrderCreateSchema,
      response: Order,
      handler: async ({ user, body }) => ({ item: await ordersService.createOrder(user, body) }),
    }),
    route({
      method: 'get',
      path: '/:id',
      summary: 'An order with its history (yours, or your center’s as its proprietor; else 404)',
      access: 'signed-in',
      params: IdParamSchema,
      response: Order,
      handler: async ({ user, params }) => ({ item: await ordersService.get(user, params.id) }),
    }),
    route({
      method: 'post',
      path: '/:id/checkout',
      summary: 'Start the card payment of your unpaid order: { url, checkoutSessionId } of the hosted payment page',
      access: 'signed-in',
      params: IdParamSchema,
      response: CheckoutStartSchema,
      handler: ({ user, params }) => checkoutService.checkout(user, params.id),
    }),
    route({
      method: 'post',
      path: '/:id/cancel',
      summary: 'Cancel your unpaid order',
      access: 'signed-in',
      params: IdParamSchema,
      response: Order,
      handler: async ({ user, params }) => ({ item: await ordersService.cancel(user, params.id) }),
    }),
    route({
      method: 'patch',
      path: '/:id/status',
      access: 'signed-in',
      summary: 'The shop moves a paid order forward (in_progress, ready, collected); ready on a surface service updates the ball’s surface',
      params: IdParamSchema,
      body: OrderStatusChangeSchema,
      response: Order,
      handler: async ({ user, params, body }) => ({ item: await ordersService.setStatus(user, params.id, body.status) }),
    }),
    route({
      method: 'post',
      path: '/:id/status/undo',
      access: 'signed-in',
      summary: 'Undo the shop’s last move of an order (in progress or collected) within two minutes, by whoever made it',
      params: IdParamSchema,
      response: Order,
      handler: async ({ user, params }) => ({ item: await ordersService.undoMove(user, params.id) }),
    }),
    route({
      method: 'post',
      path: '/:id/refund',
      summary: 'The shop refunds a paid order through the payment service',
      access: 'signed-in',
      params: IdParamSchema,
      response: Order,
      handler: async ({ user, params }) => ({ item: await checkoutService.refund(user, params.id) }),
    }),
  ],
};
