import { Router, type Request, type Response } from 'express';
import { MatchupRequestSchema, type MatchupRequest } from '../../../shared/matchups';
import { currentUser, requireAuth } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { matchupsService } from './matchups.service';

export const matchupsRouter = Router();
matchupsRouter.use(requireAuth);

matchupsRouter.post('/', validate({ body: MatchupRequestSchema }), async (req: Request, res: Response) => {
  // A client that gives up (closed tab, new slider value) should not keep a worker busy.
  const gone = new AbortController();
  res.on('close', () => {
    if (!res.writableFinished) gone.abort();
  });
  try {
    res.json(await matchupsService.run(currentUser(req), req.body as MatchupRequest, gone.signal));
  } catch (err) {
    if (gone.signal.aborted) return; // nobody is listening any more
    throw err;
  }
});
