import { Router, type Request, type Response } from 'express';
import { IdParamSchema } from '../../../shared/auth';
import { ArsenalQuerySchema, ballCreateSchemaFor, BallPatchSchema, SurfaceChangeSchema, type ArsenalQuery, type BallCreate, type BallPatch, type SurfaceChange } from '../../../shared/balls';
import { currentUser, requireAuth } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { csvFile, imageFile } from '../../lib/upload';
import { arsenalService } from './arsenal.service';

/** The signed-in user's own balls. Another user's ball answers 404, so its existence never leaks. */
export const arsenalRouter = Router();
arsenalRouter.use(requireAuth);

const idOf = (req: Request) => (req.params as unknown as { id: number }).id;

arsenalRouter.get('/', validate({ query: ArsenalQuerySchema }), async (req: Request, res: Response) => {
  res.json(await arsenalService.list(currentUser(req).id, req.query as unknown as ArsenalQuery));
});
arsenalRouter.post('/import', csvFile, async (req: Request, res: Response) => {
  res.status(201).json(await arsenalService.importCsv(currentUser(req).id, req.file!.buffer));
});
arsenalRouter.post('/', validate({ body: ballCreateSchemaFor }), async (req: Request, res: Response) => {
  res.status(201).json({ item: await arsenalService.create(currentUser(req).id, req.body as BallCreate) });
});
arsenalRouter.get('/:id', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  res.json({ item: await arsenalService.get(currentUser(req).id, idOf(req)) });
});
arsenalRouter.patch('/:id', validate({ params: IdParamSchema, body: BallPatchSchema }), async (req: Request, res: Response) => {
  res.json({ item: await arsenalService.update(currentUser(req).id, idOf(req), req.body as BallPatch) });
});
arsenalRouter.delete('/:id', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  await arsenalService.remove(currentUser(req).id, idOf(req));
  res.status(204).end();
});
arsenalRouter.post('/:id/restore', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  res.json({ item: await arsenalService.restore(currentUser(req).id, idOf(req)) });
});
arsenalRouter.post('/:id/surface', validate({ params: IdParamSchema, body: SurfaceChangeSchema }), async (req: Request, res: Response) => {
  const me = currentUser(req);
  res.json({ item: await arsenalService.changeSurface(me.id, me.id, idOf(req), req.body as SurfaceChange) });
});
arsenalRouter.put('/:id/photo', validate({ params: IdParamSchema }), imageFile, async (req: Request, res: Response) => {
  res.json({ item: await arsenalService.setPhoto(currentUser(req).id, idOf(req), req.file!) });
});
arsenalRouter.get('/:id/photo', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  const photo = await arsenalService.getPhoto(currentUser(req).id, idOf(req));
  res.type(photo.type).setHeader('Cache-Control', 'private, max-age=300');
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.send(photo.bytes);
});
arsenalRouter.delete('/:id/photo', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  res.json({ item: await arsenalService.removePhoto(currentUser(req).id, idOf(req)) });
});
