import { itemOf } from '../../../shared/api';
import { CalibrationQuerySchema, CalibrationSchema, StatsQuerySchema, StatsResultSchema } from '../../../shared/sessions';
import { requireAuth } from '../../middleware/auth';
import { route, type RouteGroup } from '../../http/route';
import { statsService } from './stats.service';

/** The signed-in bowler's statistics (or a linked coach's student's with studentId; anyone else 404). */
export const statsRoutes: RouteGroup = {
  prefix: '/stats',
  guard: [requireAuth],
  routes: [
    route({
      method: 'get',
      path: '/',
      summary: 'Shot statistics overall, per ball, per surface and per session, with moves and the calibration',
      access: 'signed-in',
      who: 'owner or linked coach',
      query: StatsQuerySchema,
      response: itemOf(StatsResultSchema),
      handler: async ({ user, query }) => ({ item: await statsService.stats(user, query) }),
    }),
  ],
};

/** The bowler's calibration of the ball-motion model on one pattern, from their logged shots. */
export const calibrationRoutes: RouteGroup = {
  prefix: '/calibration',
  guard: [requireAuth],
  routes: [
    route({
      method: 'get',
      path: '/',
      access: 'signed-in',
      who: 'owner or linked coach',
      summary: 'The ball-motion calibration from my logged shots on a pattern and lane surface, or on a published condition',
      query: CalibrationQuerySchema,
      response: itemOf(CalibrationSchema),
      handler: async ({ user, query }) => ({ item: await statsService.calibration(user, query) }),
    }),
  ],
};
