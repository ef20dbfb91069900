import { Router, type Request, type Response } from 'express';
import type { z } from 'zod';
import { IdParamSchema } from '../../../shared/auth';
import {
  CenterOrderQuerySchema,
  OrderCreateSchema,
  OrderListQuerySchema,
  OrderStatusChangeSchema,
  ServiceInputSchema,
  ServiceListQuerySchema,
  ServiceParamsSchema,
  ServicePatchSchema,
  TakingsQuerySchema,
  type CenterOrderQuery,
  type OrderCreate,
  type OrderListQuery,
  type OrderStatusChange,
  type ServiceInput,
  type ServicePatch,
} from '../../../shared/shop';
import { currentUser, requireAuth } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { shopService } from './shop.service';

const idOf = (req: Request) => (req.params as unknown as { id: number }).id;

/** The pro shop of a center: price list, its orders board and the day's takings (mounted under /api/centers). */
export const shopCentersRouter = Router();
shopCentersRouter.get('/:id/services', requireAuth, validate({ params: IdParamSchema, query: ServiceListQuerySchema }), async (req: Request, res: Response) => {
  const all = (req.query as z.infer<typeof ServiceListQuerySchema>).all;
  res.json({ items: await shopService.services(currentUser(req), idOf(req), all === '1' || all === 'true') });
});
shopCentersRouter.post('/:id/services', requireAuth, validate({ params: IdParamSchema, body: ServiceInputSchema }), async (req: Request, res: Response) => {
  res.status(201).json({ item: await shopService.createService(currentUser(req), idOf(req), req.body as ServiceInput) });
});
shopCentersRouter.patch('/:id/services/:serviceId', requireAuth, validate({ params: ServiceParamsSchema, body: ServicePatchSchema }), async (req: Request, res: Response) => {
  const p = req.params as unknown as { id: number; serviceId: number };
  res.json({ item: await shopService.updateService(currentUser(req), p.id, p.serviceId, req.body as ServicePatch) });
});
shopCentersRouter.get('/:id/orders', requireAuth, validate({ params: IdParamSchema, query: CenterOrderQuerySchema }), async (req: Request, res: Response) => {
  res.json(await shopService.centerOrders(currentUser(req), idOf(req), req.query as unknown as CenterOrderQuery));
});
shopCentersRouter.get('/:id/takings', requireAuth, validate({ params: IdParamSchema, query: TakingsQuerySchema }), async (req: Request, res: Response) => {
  res.json({ item: await shopService.takings(currentUser(req), idOf(req), (req.query as { date?: string }).date) });
});

/** Orders: the bowler's own, and the moves of the shop that owns the order's center. */
export const ordersRouter = Router();
ordersRouter.use(requireAuth);
ordersRouter.get('/', validate({ query: OrderListQuerySchema }), async (req: Request, res: Response) => {
  res.json(await shopService.mine(currentUser(req), req.query as unknown as OrderListQuery));
});
ordersRouter.post('/', validate({ body: OrderCreateSchema }), async (req: Request, res: Response) => {
  res.status(201).json({ item: await shopService.createOrder(currentUser(req), req.body as OrderCreate) });
});
ordersRouter.get('/:id', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  res.json({ item: await shopService.get(currentUser(req), idOf(req)) });
});
ordersRouter.post('/:id/checkout', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  res.json(await shopService.checkout(currentUser(req), idOf(req)));
});
ordersRouter.post('/:id/cancel', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  res.json({ item: await shopService.cancel(currentUser(req), idOf(req)) });
});
ordersRouter.patch('/:id/status', validate({ params: IdParamSchema, body: OrderStatusChangeSchema }), async (req: Request, res: Response) => {
  res.json({ item: await shopService.setStatus(currentUser(req), idOf(req), (req.body as OrderStatusChange).status) });
});
ordersRouter.post('/:id/refund', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  res.json({ item: await shopService.refund(currentUser(req), idOf(req)) });
});
