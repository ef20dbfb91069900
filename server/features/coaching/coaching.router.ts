import { Router, type Request, type Response } from 'express';
import { z } from 'zod';
import { IdParamSchema } from '../../../shared/auth';
import { CoachListQuerySchema, InvitationCreateSchema, PlanCreateSchema, StudentParamSchema, type InvitationCreate, type PlanCreate } from '../../../shared/coaching';
import { currentUser, requireAuth, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { coachingService } from './coaching.service';

type PageQuery = z.infer<typeof CoachListQuerySchema>;
const pageOf = (req: Request) => req.query as unknown as PageQuery;
const idOf = (req: Request) => (req.params as unknown as { id: number }).id;
const studentOf = (req: Request) => (req.params as unknown as { studentId: number }).studentId;

/** Coach ↔ student links, a coach's students and their plans. A coach who is not linked gets 404. */
export const coachRouter = Router();
coachRouter.use(requireAuth);

coachRouter.post('/invitations', requireRole('coach'), validate({ body: InvitationCreateSchema }), async (req: Request, res: Response) => {
  res.status(201).json({ item: await coachingService.invite(currentUser(req), (req.body as InvitationCreate).email) });
});
// Links where I am the coach or the (invited) student: any signed-in user.
coachRouter.get('/links', validate({ query: CoachListQuerySchema }), async (req: Request, res: Response) => {
  const { page, pageSize } = pageOf(req);
  res.json(await coachingService.links(currentUser(req), page, pageSize));
});
coachRouter.post('/links/:id/accept', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  res.json({ item: await coachingService.accept(currentUser(req), idOf(req)) });
});
coachRouter.delete('/links/:id', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  await coachingService.revoke(currentUser(req), idOf(req));
  res.status(204).end();
});
coachRouter.get('/students', requireRole('coach'), validate({ query: CoachListQuerySchema }), async (req: Request, res: Response) => {
  const { page, pageSize } = pageOf(req);
  res.json(await coachingService.students(currentUser(req), page, pageSize));
});
// A student's page answers 404 to anyone but their linked coach (never 403: existence does not leak).
coachRouter.get('/students/:studentId', validate({ params: StudentParamSchema }), async (req: Request, res: Response) => {
  res.json({ item: await coachingService.student(currentUser(req), studentOf(req)) });
});
coachRouter.get('/students/:studentId/plans', validate({ params: StudentParamSchema, query: CoachListQuerySchema }), async (req: Request, res: Response) => {
  const { page, pageSize } = pageOf(req);
  res.json(await coachingService.plansForStudent(currentUser(req), studentOf(req), page, pageSize));
});
coachRouter.post('/students/:studentId/plans', validate({ params: StudentParamSchema, body: PlanCreateSchema }), async (req: Request, res: Response) => {
  res.status(201).json({ item: await coachingService.sendPlan(currentUser(req), studentOf(req), req.body as PlanCreate) });
});

/** My plans as a student (Home). */
export const plansRouter = Router();
plansRouter.use(requireAuth);
plansRouter.get('/', validate({ query: CoachListQuerySchema }), async (req: Request, res: Response) => {
  const { page, pageSize } = pageOf(req);
  res.json(await coachingService.myPlans(currentUser(req), page, pageSize));
});
