import { Router, type Request, type Response } from 'express';
import { IdParamSchema } from '../../../shared/auth';
import { LayoutLabSchema, TrialCreateSchema, TrialListQuerySchema, type LayoutLabRequest, type TrialCreate, type TrialListQuery } from '../../../shared/decisions';
import { currentUser, requireAuth } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { decisionsService } from './coverage.service';
import { trialsService } from './trials.service';

const idOf = (req: Request) => (req.params as unknown as { id: number }).id;

/** Equipment trials: a bowler's own, or a linked coach's student's (studentId); anyone else 404. */
export const trialsRouter = Router();
trialsRouter.use(requireAuth);
trialsRouter.get('/', validate({ query: TrialListQuerySchema }), async (req: Request, res: Response) => {
  res.json({ items: await trialsService.list(currentUser(req), req.query as unknown as TrialListQuery) });
});
trialsRouter.post('/', validate({ body: TrialCreateSchema }), async (req: Request, res: Response) => {
  res.status(201).json({ item: await trialsService.create(currentUser(req), req.body as TrialCreate) });
});
trialsRouter.get('/:id', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  res.json({ item: await trialsService.get(currentUser(req), idOf(req)) });
});
trialsRouter.delete('/:id', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  await trialsService.remove(currentUser(req), idOf(req));
  res.status(204).end();
});

/** Arsenal coverage across the followed centers' lane groups. */
export const coverageRouter = Router();
coverageRouter.use(requireAuth);
coverageRouter.get('/', validate({ query: TrialListQuerySchema }), async (req: Request, res: Response) => {
  res.json({ item: await decisionsService.coverage(currentUser(req), (req.query as unknown as TrialListQuery).studentId) });
});

/** The layout lab: candidate layouts of one ball, drawn and simulated side by side. */
export const layoutLabRouter = Router();
layoutLabRouter.use(requireAuth);
layoutLabRouter.post('/', validate({ body: LayoutLabSchema }), async (req: Request, res: Response) => {
  res.json({ item: await decisionsService.layoutLab(currentUser(req), req.body as LayoutLabRequest) });
});
