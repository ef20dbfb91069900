import escapeHtml from 'escape-html';
import { z } from 'zod';
import { IdParamSchema, PageQuerySchema } from '../../../shared/auth';
import { itemOf, itemsOf, pageOf } from '../../../shared/api';
import {
  CenterInputSchema,
  CenterPatchSchema,
  CenterSchema,
  ConditionSchema,
  CurrentConditionSchema,
  FollowedCenterSchema,
  PublishConditionSchema,
} from '../../../shared/centers';
import { AppError } from '../../lib/AppError';
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
      summary: 'The condition in force today',
      access: 'public',
      params: IdParamSchema,
      response: CurrentConditionSchema,
      handler: ({ params }) => centersService.current(params.id),
    }),
    route({
      method: 'get',
      path: '/:id/conditions/current.pdf',
      summary: 'The printable sheet of the condition in force',
      access: 'public',
      params: IdParamSchema,
      response: { contentType: 'application/pdf', description: 'The condition sheet' },
      handler: async ({ params, res }) => {
        const cur = await centersService.current(params.id);
        const pdf = await conditionSheetPdf(cur.center, cur.condition);
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

const TokenQuery = z.object({ token: z.string().min(10, 'The link is incomplete').max(100) });

/** The unsubscribe link of every follower e-mail: works without sign-in. */
export const unsubscribeRoutes: RouteGroup = {
  prefix: '/unsubscribe',
  routes: [
    route({
      method: 'get',
      path: '/',
      summary: 'Unsubscribe link of a follower e-mail (no sign-in)',
      access: 'public',
      query: TokenQuery,
      response: { contentType: 'text/html', description: 'A page saying the e-mails stopped (404 when the link is not valid)' },
      handler: async ({ query, res }) => {
        const name = await centersService.unsubscribe(query.token);
        const msg = name
          ? `You will no longer get condition e-mails from ${name}.`
          : 'This link was already used or is not valid; you are not subscribed through it.';
        res
          .status(name ? 200 : 404)
          .type('html')
          .send(
            `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>Lanewright — e-mails</title></head><body style="font-family:system-ui,sans-serif;margin:2rem"><main><h1>Lanewright</h1><p>${escapeHtml(msg)}</p><p><a href="/">Open Lanewright</a></p></main></body></html>`,
          );
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
