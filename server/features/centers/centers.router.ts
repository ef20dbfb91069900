import { Router, type Request, type Response } from 'express';
import { z } from 'zod';
import { IdParamSchema, PageQuerySchema } from '../../../shared/auth';
import { CenterInputSchema, CenterPatchSchema, PublishConditionSchema, type CenterInput, type PublishCondition } from '../../../shared/centers';
import { currentUser, optionalAuth, requireAuth, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { centersService } from './centers.service';
import { conditionSheetPdf } from './conditionSheet';

export const centersRouter = Router();

const idOf = (req: Request) => (req.params as unknown as { id: number }).id;
const pageOf = (req: Request) => req.query as unknown as z.infer<typeof PageQuerySchema>;

// Public: the list, a center, its current condition (JSON and PDF) and its history.
centersRouter.get('/', optionalAuth, validate({ query: PageQuerySchema }), async (req: Request, res: Response) => {
  const { page, pageSize } = pageOf(req);
  res.json(await centersService.list(req.user, page, pageSize));
});
centersRouter.get('/mine', requireAuth, requireRole('proprietor', 'admin'), async (req: Request, res: Response) => {
  res.json({ items: await centersService.mine(currentUser(req)) });
});
centersRouter.post('/', requireAuth, requireRole('admin'), validate({ body: CenterInputSchema }), async (req: Request, res: Response) => {
  res.status(201).json({ item: await centersService.create(currentUser(req), req.body as CenterInput) });
});
centersRouter.get('/:id', optionalAuth, validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  res.json({ item: await centersService.get(req.user, idOf(req)) });
});
centersRouter.patch('/:id', requireAuth, requireRole('proprietor', 'admin'), validate({ params: IdParamSchema, body: CenterPatchSchema }), async (req: Request, res: Response) => {
  res.json({ item: await centersService.update(currentUser(req), idOf(req), req.body as Partial<CenterInput>) });
});
centersRouter.get('/:id/conditions/current', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  res.json(await centersService.current(idOf(req)));
});
centersRouter.get('/:id/conditions/current.pdf', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  const cur = await centersService.current(idOf(req));
  const pdf = await conditionSheetPdf(cur.center, cur.condition);
  res.type('application/pdf').setHeader('Content-Disposition', `inline; filename="condition-${cur.center.id}-${cur.condition.id}.pdf"`);
  res.send(pdf);
});
centersRouter.get('/:id/conditions', validate({ params: IdParamSchema, query: PageQuerySchema }), async (req: Request, res: Response) => {
  const { page, pageSize } = pageOf(req);
  res.json(await centersService.history(idOf(req), page, pageSize));
});
centersRouter.post('/:id/conditions', requireAuth, validate({ params: IdParamSchema, body: PublishConditionSchema }), async (req: Request, res: Response) => {
  res.status(201).json({ item: await centersService.publish(currentUser(req), idOf(req), req.body as PublishCondition) });
});
centersRouter.post('/:id/follow', requireAuth, validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  await centersService.follow(currentUser(req), idOf(req));
  res.json({ following: true });
});
centersRouter.delete('/:id/follow', requireAuth, validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  await centersService.unfollow(currentUser(req), idOf(req));
  res.json({ following: false });
});

export const followsRouter = Router();
followsRouter.get('/', requireAuth, async (req: Request, res: Response) => {
  res.json({ items: await centersService.follows(currentUser(req)) });
});

const TokenQuery = z.object({ token: z.string().min(10, 'The link is incomplete').max(100) });
const TokenBody = TokenQuery.strict();

/** The unsubscribe link of every follower e-mail: works without sign-in. */
export const unsubscribeRouter = Router();
unsubscribeRouter.get('/', validate({ query: TokenQuery }), async (req: Request, res: Response) => {
  const name = await centersService.unsubscribe((req.query as unknown as { token: string }).token);
  const msg = name ? `You will no longer get condition e-mails from ${name}.` : 'This link was already used or is not valid; you are not subscribed through it.';
  res
    .status(name ? 200 : 404)
    .type('html')
    .send(`<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>Lanewright — e-mails</title></head><body style="font-family:system-ui,sans-serif;margin:2rem"><main><h1>Lanewright</h1><p>${msg.replace(/[<>&]/g, '')}</p><p><a href="/">Open Lanewright</a></p></main></body></html>`);
});
unsubscribeRouter.post('/', validate({ body: TokenBody }), async (req: Request, res: Response) => {
  const name = await centersService.unsubscribe((req.body as { token: string }).token);
  if (!name) {
    res.status(404).json({ error: { code: 'not_found', message: 'This unsubscribe link is not valid' } });
    return;
  }
  res.json({ ok: true, center: name });
});
