import { Router, type Request, type Response } from 'express';
import { IdParamSchema } from '../../../shared/auth';
import { AnnotationCreateSchema, type AnnotationCreate } from '../../../shared/coaching';
import {
  IdempotencyKeySchema,
  SessionCreateSchema,
  SessionListQuerySchema,
  SessionPatchSchema,
  ShotCreateSchema,
  ShotParamsSchema,
  type SessionCreate,
  type SessionListQuery,
  type SessionPatch,
  type ShotCreate,
} from '../../../shared/sessions';
import { AppError } from '../../lib/AppError';
import { currentUser, requireAuth } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { sessionsService } from './sessions.service';

/** A bowler's sessions and shots; a linked coach reads them (and annotates). Anyone else gets 404. */
export const sessionsRouter = Router();
sessionsRouter.use(requireAuth);

const idOf = (req: Request) => (req.params as unknown as { id: number }).id;

/** The Idempotency-Key header, checked like any other input (400 on the header field). */
function idempotencyKey(req: Request): string {
  const parsed = IdempotencyKeySchema.safeParse(req.get('Idempotency-Key'));
  if (!parsed.success) {
    const message = parsed.error.issues[0]?.message ?? 'Send an Idempotency-Key header';
    throw new AppError(400, 'validation_failed', message, { 'headers.idempotency-key': message });
  }
  return parsed.data;
}

sessionsRouter.get('/', validate({ query: SessionListQuerySchema }), async (req: Request, res: Response) => {
  res.json(await sessionsService.list(currentUser(req), req.query as unknown as SessionListQuery));
});
sessionsRouter.post('/', validate({ body: SessionCreateSchema }), async (req: Request, res: Response) => {
  res.status(201).json({ item: await sessionsService.create(currentUser(req), req.body as SessionCreate) });
});
sessionsRouter.get('/:id', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  res.json({ item: await sessionsService.get(currentUser(req), idOf(req)) });
});
sessionsRouter.patch('/:id', validate({ params: IdParamSchema, body: SessionPatchSchema }), async (req: Request, res: Response) => {
  res.json({ item: await sessionsService.update(currentUser(req), idOf(req), req.body as SessionPatch) });
});
sessionsRouter.delete('/:id', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  await sessionsService.remove(currentUser(req), idOf(req));
  res.status(204).end();
});
sessionsRouter.post('/:id/restore', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  res.json({ item: await sessionsService.restore(currentUser(req), idOf(req)) });
});
sessionsRouter.post('/:id/shots', validate({ params: IdParamSchema, body: ShotCreateSchema }), async (req: Request, res: Response) => {
  const key = idempotencyKey(req);
  const out = await sessionsService.addShot(currentUser(req), idOf(req), key, req.body as ShotCreate);
  res.status(out.status).json(out.body);
});
sessionsRouter.delete('/:id/shots/:shotId', validate({ params: ShotParamsSchema }), async (req: Request, res: Response) => {
  const { id, shotId } = req.params as unknown as { id: number; shotId: number };
  await sessionsService.removeShot(currentUser(req), id, shotId);
  res.status(204).end();
});
sessionsRouter.post('/:id/annotations', validate({ params: IdParamSchema, body: AnnotationCreateSchema }), async (req: Request, res: Response) => {
  res.status(201).json({ item: await sessionsService.annotate(currentUser(req), idOf(req), req.body as AnnotationCreate) });
});
