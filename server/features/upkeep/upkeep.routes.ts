import { itemOf, itemsOf } from '../../../shared/api';
import { IdParamSchema } from '../../../shared/auth';
import { BallUpkeepSchema, UpkeepPatchSchema } from '../../../shared/upkeep';
import { requireAuth } from '../../middleware/auth';
import { route, type RouteGroup } from '../../http/route';
import { upkeepService } from './upkeep.service';

/** Ball upkeep reminders: the bowler's own balls only. */
export const upkeepRoutes: RouteGroup = {
  prefix: '/upkeep',
  guard: [requireAuth],
  routes: [
    route({
      method: 'get',
      path: '/',
      summary: 'My balls’ upkeep: games since the last resurface and oil extraction against the intervals, the most urgent first',
      access: 'signed-in',
      who: 'owner',
      response: itemsOf(BallUpkeepSchema),
      handler: async ({ user }) => ({ items: await upkeepService.list(user) }),
    }),
    route({
      method: 'patch',
      path: '/:id',
      summary: 'Set a ball’s own upkeep intervals (null for the defaults), or record an oil extraction done',
      access: 'signed-in',
      who: 'owner',
      params: IdParamSchema,
      body: UpkeepPatchSchema,
      response: itemOf(BallUpkeepSchema),
      handler: async ({ user, params, body }) => ({ item: await upkeepService.update(user, params.id, body) }),
    }),
  ],
};
