import { itemOf, itemsOf } from '../../../shared/api';
import { IdParamSchema } from '../../../shared/auth';
import { LeagueCreateSchema, LeaguePatchSchema, LeagueSchema, LeagueStandingSchema } from '../../../shared/leagues';
import { requireAuth } from '../../middleware/auth';
import { NO_CONTENT, route, type RouteGroup } from '../../http/route';
import { leaguesService } from './leagues.service';

/** A bowler's leagues and their seasons: the bowler's own only; anyone else 404. */
export const leaguesRoutes: RouteGroup = {
  prefix: '/leagues',
  guard: [requireAuth],
  routes: [
    route({
      method: 'get',
      path: '/',
      summary: 'My leagues, the newest season first',
      access: 'signed-in',
      who: 'owner',
      response: itemsOf(LeagueSchema),
      handler: async ({ user }) => ({ items: await leaguesService.list(user) }),
    }),
    route({
      method: 'post',
      path: '/',
      status: 201,
      summary: 'Add a league: its night, season, games a night and handicap rule (percentage of a basis; none for scratch)',
      access: 'signed-in',
      body: LeagueCreateSchema,
      response: itemOf(LeagueSchema),
      handler: async ({ user, body }) => ({ item: await leaguesService.create(user, body) }),
    }),
    route({
      method: 'get',
      path: '/:id',
      summary: 'One of my leagues',
      access: 'signed-in',
      who: 'owner',
      params: IdParamSchema,
      response: itemOf(LeagueSchema),
      handler: async ({ user, params }) => ({ item: await leaguesService.get(user, params.id) }),
    }),
    route({
      method: 'patch',
      path: '/:id',
      summary: 'Change a league (the standing is recomputed from the nights)',
      access: 'signed-in',
      who: 'owner',
      params: IdParamSchema,
      body: LeaguePatchSchema,
      response: itemOf(LeagueSchema),
      handler: async ({ user, params, body }) => ({ item: await leaguesService.update(user, params.id, body) }),
    }),
    route({
      method: 'delete',
      path: '/:id',
      summary: 'Delete a league; its sessions stay (no longer league nights of it)',
      access: 'signed-in',
      who: 'owner',
      params: IdParamSchema,
      response: NO_CONTENT,
      handler: ({ user, params }) => leaguesService.remove(user, params.id),
    }),
    route({
      method: 'get',
      path: '/:id/standing',
      summary: 'The season: each night’s series, the average and handicap it was bowled on, the running average',
      access: 'signed-in',
      who: 'owner',
      params: IdParamSchema,
      response: itemOf(LeagueStandingSchema),
      handler: async ({ user, params }) => ({ item: await leaguesService.standing(user, params.id) }),
    }),
    route({
      method: 'get',
      path: '/:id/season.csv',
      summary: 'The season as a CSV file, a row a night and a season row',
      access: 'signed-in',
      who: 'owner',
      params: IdParamSchema,
      response: { contentType: 'text/csv', description: 'The season, as an attachment' },
      handler: async ({ user, params, res }) => {
        const f = await leaguesService.seasonCsv(user, params.id);
        res.type('text/csv').setHeader('Content-Disposition', `attachment; filename="${f.filename}"`);
        res.send(f.body);
      },
    }),
  ],
};
