import { itemOf, itemsOf } from '../../../shared/api';
import { IdParamSchema } from '../../../shared/auth';
import {
  CoverageResultSchema,
  LayoutLabResultSchema,
  LayoutLabSchema,
  TrialCreateSchema,
  TrialListQuerySchema,
  TrialResultSchema,
  TrialSchema,
} from '../../../shared/decisions';
import { requireAuth } from '../../middleware/auth';
import { NO_CONTENT, route, type RouteGroup } from '../../http/route';
import { decisionsService } from './coverage.service';
import { trialsService } from './trials.service';

/** Equipment trials: a bowler's own, or a linked coach's student's (studentId); anyone else 404. */
export const trialsRoutes: RouteGroup = {
  prefix: '/trials',
  guard: [requireAuth],
  routes: [
    route({
      method: 'get',
      path: '/',
      summary: 'My equipment trials (or a linked coach’s student’s with studentId), newest first',
      access: 'signed-in',
      who: 'owner or linked coach',
      query: TrialListQuerySchema,
      response: itemsOf(TrialSchema),
      handler: async ({ user, query }) => ({ items: await trialsService.list(user, query) }),
    }),
    route({
      method: 'post',
      path: '/',
      status: 201,
      summary: 'Open an equipment trial of two to four balls or surfaces (a linked coach for a student with studentId)',
      access: 'signed-in',
      body: TrialCreateSchema,
      response: itemOf(TrialSchema),
      handler: async ({ user, body }) => ({ item: await trialsService.create(user, body) }),
    }),
    route({
      method: 'get',
      path: '/:id',
      summary: 'A trial with each arm’s figures and the verdict',
      access: 'signed-in',
      who: 'owner or linked coach',
      params: IdParamSchema,
      response: itemOf(TrialResultSchema),
      handler: async ({ user, params }) => ({ item: await trialsService.get(user, params.id) }),
    }),
    route({
      method: 'delete',
      path: '/:id',
      summary: 'Delete a trial (its bowler, or the coach who opened it); the shots stay in their sessions',
      access: 'signed-in',
      who: 'owner or linked coach',
      params: IdParamSchema,
      response: NO_CONTENT,
      handler: ({ user, params }) => trialsService.remove(user, params.id),
    }),
  ],
};

/** Arsenal coverage across the followed centers' lane groups. */
export const coverageRoutes: RouteGroup = {
  prefix: '/coverage',
  guard: [requireAuth],
  routes: [
    route({
      method: 'get',
      path: '/',
      summary: 'Arsenal coverage across the followed centers’ lane groups: gaps, balls doing the same job, catalogue suggestions',
      access: 'signed-in',
      who: 'owner or linked coach',
      query: TrialListQuerySchema,
      response: itemOf(CoverageResultSchema),
      handler: async ({ user, query }) => ({ item: await decisionsService.coverage(user, query.studentId) }),
    }),
  ],
};

/** The layout lab: candidate layouts of one ball, drawn and simulated side by side. */
export const layoutLabRoutes: RouteGroup = {
  prefix: '/layout-lab',
  guard: [requireAuth],
  routes: [
    route({
      method: 'post',
      path: '/',
      summary: 'Candidate layouts of one of my balls, drawn with their flare rings and simulated on a pattern or condition',
      access: 'signed-in',
      body: LayoutLabSchema,
      response: itemOf(LayoutLabResultSchema),
      handler: async ({ user, body }) => ({ item: await decisionsService.layoutLab(user, body) }),
    }),
  ],
};
