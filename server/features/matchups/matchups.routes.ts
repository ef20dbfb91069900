import { MatchupRequestSchema, MatchupResultSchema } from '../../../shared/matchups';
import { requireAuth } from '../../middleware/auth';
import { ANSWERED, route, type RouteGroup } from '../../http/route';
import { matchupsService } from './matchups.service';

/** The ranking of an arsenal for a pattern or a published condition. */
export const matchupsRoutes: RouteGroup = {
  prefix: '/matchups',
  guard: [requireAuth],
  routes: [
    route({
      method: 'post',
      path: '/',
      access: 'signed-in',
      summary:
        'Rank your arsenal for a pattern on a lane surface, or for a published condition (its pattern and lane surface); illegal balls are listed apart',
      body: MatchupRequestSchema,
      response: MatchupResultSchema,
      handler: async ({ user, body, res }) => {
        // A client that gives up (closed tab, new slider value) should not keep a worker busy.
        const gone = new AbortController();
        res.on('close', () => {
          if (!res.writableFinished) gone.abort();
        });
        try {
          return await matchupsService.run(user, body, gone.signal);
        } catch (err) {
          if (gone.signal.aborted) return ANSWERED; // nobody is listening any more
          throw err;
        }
      },
    }),
  ],
};
