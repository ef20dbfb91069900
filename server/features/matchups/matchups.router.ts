import { Router, type Request, type Response } from 'express';
import { MatchupRequestSchema, type MatchupRequest } from '../../../shared/matchups';
import { currentUser, requireAuth } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { matchupsService } from './matchups.service';

export const matchupsRouter = Router();
matchupsRouter.use(requireAuth);

matchupsRouter.post('/', validate({ body: MatchupRequestSchema }), async (req: Request, res: Response) => {
  res.json(await matchupsService.run(currentUser(req), req.body as MatchupRequest));
});
