import { z } from 'zod';
import { IdParamSchema, PageQuerySchema } from '../../../shared/auth';
import { itemOf, itemsOf, pageOf } from '../../../shared/api';
import {
  AtQuerySchema,
  CenterInputSchema,
  CenterPatchSchema,
  CenterSchema,
  ConditionSchema,
  CurrentConditionSchema,
  FollowedCenterSchema,
  LaneGroupsSchema,
  PublishConditionSchema,
  UnsubscribeInfoSchema,
  UnsubscribeTokenSchema,
} from '../../../shared/centers';
import { AppError } from '../../lib/AppError';
import { linkTo } from '../../lib/publicUrl';
import { route, type RouteGroup } from '../../http/route';
import { centersService } from './centers.service';
import { conditionSheetPdf } from './conditionSheet';

const operators = ['proprietor', 'admin'] as const;

/** Centers and their published conditions: the list, a center, its condition and history are public. */
export const centersRoutes: RouteGroup = {
  prefix: '/centers',
  routes: [
    route({
      method: 'get',
      path: '/',
      summary: 'Centers (with `following` when signed in)',
      access: 'optional',
      query: PageQuerySchema,
      response: pageOf(CenterSchema),
      handler: ({ user, query }) => centersService.list(user, query.page, query.pageSize),
    }),
    route({
      method: 'get',
      path: '/mine',
      summary: 'The centers you operate (admin: all)',
      access: operators,
      response: itemsOf(CenterSchema),
      handler: async ({ user }) => ({ items: await centersService.mine(user) }),
    }),
    route({
      method: 'post',
      path: '/',
      status: 201,
      summary: 'Create a center and assign its proprietor',
      access: ['admin'],
      body: CenterInputSchema,
      response: itemOf(CenterSchema),
      handler: async ({ user, body }) => ({ item: await centersService.create(user, body) }),
    }),
    route({
      method: 'get',
      path: '/:id',
      summary: 'One center',
      access: 'optional',
      params: IdParamSchema,
      response: itemOf(CenterSchema),
      handler: async ({ user, params }) => ({ item: await centersService.get(user, params.id) }),
    }),
    route({
      method: 'patch',
      path: '/:id',
      summary: 'Edit a center (owner: name and town; admin: all)',
      access: operators,
      params: IdParamSchema,
      body: CenterPatchSchema,
      response: itemOf(CenterSchema),
      handler: async ({ user, params, body }) => ({ item: await centersService.update(user, params.id, body) }),
    }),
    route({
      method: 'get',
      path: '/:id/conditions/current',
      summary: 'The condition in force today (in the center’s time zone; `at` asks about another instant), every lane group',
      access: 'public',
      params: IdParamSchema,
      query: AtQuerySchema,
      response: CurrentConditionSchema,
      handler: ({ params, query }) => centersService.current(params.id, atOf(query.at)),
    }),
    route({
      method: 'get',
      path: '/:id/conditions/lane-groups',
      summary: 'Every lane group of the center with the publication in force and the next one (center’s time zone)',
      access: 'public',
      params: IdParamSchema,
      query: AtQuerySchema,
      response: LaneGroupsSchema,
      handler: ({ params, query }) => centersService.laneGroups(params.id, atOf(query.at)),
    }),
    route({
      method: 'get',
      path: '/:id/conditions/current.pdf',
      summary: 'The printable sheet of the condition in force',
      access: 'public',
      params: IdParamSchema,
      query: AtQuerySchema,
      response: { contentType: 'application/pdf', description: 'The condition sheet: every lane group' },
      handler: async ({ params, query, res }) => {
        const cur = await centersService.current(params.id, atOf(query.at));
        const pdf = await conditionSheetPdf(cur.center, cur.groups ?? [], { timeZone: cur.timeZone ?? 'UTC', today: cur.today ?? '' });
        res
          .type('application/pdf')
          .setHeader('Content-Disposition', `inline; filename="condition-${cur.center.id}-${cur.condition.id}.pdf"`);
        res.send(pdf);
      },
    }),
    route({
      method: 'get',
      path: '/:id/conditions',
      summary: 'Publication history, newest first',
      access: 'public',
      params: IdParamSchema,
      query: PageQuerySchema,
      response: pageOf(ConditionSchema),
      handler: ({ params, query }) => centersService.history(params.id, query.page, query.pageSize),
    }),
    route({
      method: 'post',
      path: '/:id/conditions',
      status: 201,
      summary: 'Publish a condition (the center’s proprietor only); followers are e-mailed',
      access: 'signed-in',
      params: IdParamSchema,
      body: PublishConditionSchema,
      response: itemOf(ConditionSchema),
      handler: async ({ user, params, body }) => ({ item: await centersService.publish(user, params.id, body) }),
    }),
    route({
      method: 'post',
      path: '/:id/follow',
      summary: 'Follow a center',
      access: 'signed-in',
      params: IdParamSchema,
      response: z.object({ following: z.literal(true) }),
      handler: async ({ user, params }) => {
        await centersService.follow(user, params.id);
        return { following: true as const };
      },
    }),
    route({
      method: 'delete',
      path: '/:id/follow',
      summary: 'Stop following a center',
      access: 'signed-in',
      params: IdParamSchema,
      response: z.object({ following: z.literal(false) }),
      handler: async ({ user, params }) => {
        await centersService.unfollow(user, params.id);
        return { following: false as const };
      },
    }),
  ],
};

export const followsRoutes: RouteGroup = {
  prefix: '/follows',
  routes: [
    route({
      method: 'get',
      path: '/',
      summary: 'Centers you follow with their current condition',
      access: 'signed-in',
      response: itemsOf(FollowedCenterSchema),
      handler: async ({ user }) => ({ items: await centersService.follows(user) }),
    }),
  ],
};

const TokenQuery = UnsubscribeTokenSchema;

/** An instant from `?at=` (validated by AtQuerySchema), or now. */
function atOf(at: string | undefined): Date {
  return at ? new Date(at) : new Date();
}

/**
 * The unsubscribe link of every follower e-mail works without sign-in. It opens the client's page
 * (`/unsubscribe?token=…`), which asks before it POSTs; a GET never unsubscribes (mail scanners follow links).
 */
export const unsubscribeRoutes: RouteGroup = {
  prefix: '/unsubscribe',
  routes: [
    route({
      method: 'get',
      path: '/',
      summary: 'Old unsubscribe link of follower e-mails: sends the browser to the page that asks first (changes nothing)',
      access: 'public',
      query: TokenQuery,
      response: { contentType: 'text/html', description: 'A redirect (303) to the unsubscribe page' },
      handler: ({ query, res }) => {
        res.redirect(303, linkTo(`/unsubscribe?token=${encodeURIComponent(query.token)}`));
      },
    }),
    route({
      method: 'get',
      path: '/info',
      summary: 'What an unsubscribe link is for: the center and whether the e-mails are still on (no sign-in)',
      access: 'public',
      query: TokenQuery,
      response: UnsubscribeInfoSchema,
      handler: async ({ query }) => {
        const info = await centersService.unsubscribeInfo(query.token);
        if (!info) throw new AppError(404, 'not_found', 'This link is not valid any more');
        return info;
      },
    }),
    route({
      method: 'post',
      path: '/undo',
      summary: 'Undo an unsubscribe from the same e-mail link (no sign-in)',
      access: 'public',
      body: TokenQuery.strict(),
      response: z.object({ ok: z.literal(true), center: z.string() }),
      handler: async ({ body }) => {
        const name = await centersService.resubscribe(body.token);
        if (!name) throw new AppError(404, 'not_found', 'This link is not valid any more');
        return { ok: true as const, center: name };
      },
    }),
    route({
      method: 'post',
      path: '/',
      summary: 'One-click unsubscribe of a follower e-mail (RFC 8058; no sign-in)',
      access: 'public',
      body: TokenQuery.strict(),
      response: z.object({ ok: z.literal(true), center: z.string() }),
      handler: async ({ body }) => {
        const name = await centersService.unsubscribe(body.token);
        if (!name) throw new AppError(404, 'not_found', 'This unsubscribe link is not valid');
        return { ok: true as const, center: name };
      },
    }),
  ],
};
