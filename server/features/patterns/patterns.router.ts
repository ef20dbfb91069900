import { Router, type Request, type Response } from 'express';
import { IdParamSchema } from '../../../shared/auth';
import { PatternInputSchema, PatternPatchSchema, PatternQuerySchema, type PatternInput, type PatternQuery } from '../../../shared/patterns';
import { currentUser, requireAuth, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { patternFile } from '../../lib/upload';
import { z } from 'zod';
import { patternsService } from './patterns.service';

/** Oil patterns: every signed-in user reads them; coaches, proprietors and admins create and edit. */
export const patternsRouter = Router();
patternsRouter.use(requireAuth);

const idOf = (req: Request) => (req.params as unknown as { id: number }).id;
const editors = requireRole('coach', 'proprietor', 'admin');

patternsRouter.get('/', validate({ query: PatternQuerySchema }), async (req: Request, res: Response) => {
  res.json(await patternsService.list(req.query as unknown as PatternQuery));
});
patternsRouter.post('/import', editors, patternFile, async (req: Request, res: Response) => {
  res.status(201).json({ item: await patternsService.importFile(currentUser(req), req.file!.originalname, req.file!.buffer) });
});
patternsRouter.get('/:id/export', validate({ params: IdParamSchema, query: z.object({ format: z.enum(['json', 'csv']).default('json') }) }), async (req: Request, res: Response) => {
  const f = await patternsService.exportFile(idOf(req), (req.query as unknown as { format: 'json' | 'csv' }).format);
  res.type(f.type).setHeader('Content-Disposition', `attachment; filename="${f.filename}"`);
  res.send(f.body);
});
patternsRouter.post('/:id/duplicate', editors, validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  res.status(201).json({ item: await patternsService.duplicate(currentUser(req), idOf(req)) });
});
patternsRouter.get('/:id', validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  res.json({ item: await patternsService.get(idOf(req)) });
});
patternsRouter.post('/', editors, validate({ body: PatternInputSchema }), async (req: Request, res: Response) => {
  res.status(201).json({ item: await patternsService.create(currentUser(req), req.body as PatternInput) });
});
patternsRouter.patch('/:id', editors, validate({ params: IdParamSchema, body: PatternPatchSchema }), async (req: Request, res: Response) => {
  res.json({ item: await patternsService.update(currentUser(req), idOf(req), req.body as Partial<PatternInput> & { version: number }) });
});
patternsRouter.delete('/:id', editors, validate({ params: IdParamSchema }), async (req: Request, res: Response) => {
  await patternsService.remove(currentUser(req), idOf(req));
  res.status(204).end();
});
