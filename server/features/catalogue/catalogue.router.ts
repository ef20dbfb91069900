import { Router, type Request, type Response } from 'express';
import { IdParamSchema } from '../../../shared/auth';
import { BallModelInputSchema, BallModelPatchSchema, CatalogueQuerySchema, type BallModelInput, type CatalogueQuery } from '../../../shared/balls';
import { currentUser, requireAuth, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { csvFile } from '../../lib/upload';
import { catalogueService } from './catalogue.service';

export const catalogueRouter = Router();
catalogueRouter.use(requireAuth);

const idOf = (req: Request) => (req.params as unknown as { id: number }).id;

catalogueRouter.get('/', validate({ query: CatalogueQuerySchema }), async (req: Request, res: Response) => {
  res.json(await catalogueService.list(req.query as unknown as CatalogueQuery));
});
catalogueRouter.get('/:id', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  res.json({ item: await catalogueService.get(idOf(req)) });
});
catalogueRouter.post('/import', requireRole('admin'), csvFile, async (req: Request, res: Response) => {
  res.status(201).json(await catalogueService.importCsv(currentUser(req).id, req.file!.buffer));
});
catalogueRouter.post('/', requireRole('admin'), validate({ body: BallModelInputSchema }), async (req: Request, res: Response) => {
  res.status(201).json({ item: await catalogueService.create(currentUser(req).id, req.body as BallModelInput) });
});
catalogueRouter.patch('/:id', requireRole('admin'), validate({ params: IdParamSchema, body: BallModelPatchSchema }), async (req: Request, res: Response) => {
  res.json({ item: await catalogueService.update(currentUser(req).id, idOf(req), req.body as Partial<BallModelInput> & { version: number }) });
});
