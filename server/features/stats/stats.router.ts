import { Router, type Request, type Response } from 'express';
import { CalibrationQuerySchema, StatsQuerySchema, type CalibrationQuery, type StatsQuery } from '../../../shared/sessions';
import { currentUser, requireAuth } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { statsService } from './stats.service';

/** The signed-in bowler's statistics (or a linked coach's student's with studentId; anyone else 404). */
export const statsRouter = Router();
statsRouter.use(requireAuth);
statsRouter.get('/', validate({ query: StatsQuerySchema }), async (req: Request, res: Response) => {
  res.json({ item: await statsService.stats(currentUser(req), req.query as unknown as StatsQuery) });
});

/** The bowler's calibration of the ball-motion model on one pattern, from their logged shots. */
export const calibrationRouter = Router();
calibrationRouter.use(requireAuth);
calibrationRouter.get('/', validate({ query: CalibrationQuerySchema }), async (req: Request, res: Response) => {
  res.json({ item: await statsService.calibration(currentUser(req), req.query as unknown as CalibrationQuery) });
});
