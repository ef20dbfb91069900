import { IdParamSchema } from '../../../shared/auth';
import { itemOf, pageOf } from '../../../shared/api';
import {
  CoachLinkSchema,
  CoachListQuerySchema,
  InvitationCreateSchema,
  PlanCreateSchema,
  PlanReplyCreateSchema,
  PlanSchema,
  StudentDetailSchema,
  StudentParamSchema,
  StudentSummarySchema,
} from '../../../shared/coaching';
import { requireAuth } from '../../middleware/auth';
import { NO_CONTENT, route, type RouteGroup } from '../../http/route';
import { coachingService } from './coaching.service';

const coach = ['coach'] as const;

/** Coach ↔ student links, a coach's students and their plans. A coach who is not linked gets 404. */
export const coachRoutes: RouteGroup = {
  prefix: '/coach',
  guard: [requireAuth],
  routes: [
    route({
      method: 'post',
      path: '/invitations',
      status: 201,
      summary: 'Invite a student by e-mail (mailed; audited)',
      access: coach,
      body: InvitationCreateSchema,
      response: itemOf(CoachLinkSchema),
      handler: async ({ user, body }) => ({ item: await coachingService.invite(user, body.email) }),
    }),
    // Links where I am the coach or the (invited) student: any signed-in user.
    route({
      method: 'get',
      path: '/links',
      summary: 'Pending and active links where I am coach or student',
      access: 'signed-in',
      query: CoachListQuerySchema,
      response: pageOf(CoachLinkSchema),
      handler: ({ user, query }) => coachingService.links(user, query.page, query.pageSize),
    }),
    route({
      method: 'post',
      path: '/links/:id/accept',
      summary: 'Accept an invitation (the invited student only; audited)',
      access: 'signed-in',
      params: IdParamSchema,
      response: itemOf(CoachLinkSchema),
      handler: async ({ user, params }) => ({ item: await coachingService.accept(user, params.id) }),
    }),
    route({
      method: 'delete',
      path: '/links/:id',
      summary: 'End a link or withdraw/decline an invitation (either side; audited)',
      access: 'signed-in',
      params: IdParamSchema,
      response: NO_CONTENT,
      handler: ({ user, params }) => coachingService.revoke(user, params.id),
    }),
    route({
      method: 'get',
      path: '/students',
      summary: 'My students with their session counts',
      access: coach,
      query: CoachListQuerySchema,
      response: pageOf(StudentSummarySchema),
      handler: ({ user, query }) => coachingService.students(user, query.page, query.pageSize),
    }),
    // A student's page answers 404 to anyone but their linked coach (never 403: existence does not leak).
    route({
      method: 'get',
      path: '/students/:studentId',
      summary: 'A student’s profile and arsenal (linked coach only; else 404)',
      access: 'signed-in',
      who: 'coach',
      params: StudentParamSchema,
      response: itemOf(StudentDetailSchema),
      handler: async ({ user, params }) => ({ item: await coachingService.student(user, params.studentId) }),
    }),
    route({
      method: 'get',
      path: '/students/:studentId/plans',
      summary: 'The plans I sent a student',
      access: 'signed-in',
      who: 'coach',
      params: StudentParamSchema,
      query: CoachListQuerySchema,
      response: pageOf(PlanSchema),
      handler: ({ user, params, query }) => coachingService.plansForStudent(user, params.studentId, query.page, query.pageSize),
    }),
    route({
      method: 'post',
      path: '/students/:studentId/plans',
      status: 201,
      summary: 'Send a student a surface, layout or line plan (mailed; audited)',
      access: 'signed-in',
      who: 'coach',
      params: StudentParamSchema,
      body: PlanCreateSchema,
      response: itemOf(PlanSchema),
      handler: async ({ user, params, body }) => ({ item: await coachingService.sendPlan(user, params.studentId, body) }),
    }),
  ],
};

/** My plans as a student (Home). */
export const plansRoutes: RouteGroup = {
  prefix: '/plans',
  guard: [requireAuth],
  routes: [
    route({
      method: 'get',
      path: '/',
      summary: 'My coaches’ plans for me, newest first',
      access: 'signed-in',
      query: CoachListQuerySchema,
      response: pageOf(PlanSchema),
      handler: ({ user, query }) => coachingService.myPlans(user, query.page, query.pageSize),
    }),
    route({
      method: 'post',
      path: '/:id/replies',
      status: 201,
      summary: 'Answer a plan (its student or its coach; mailed to the other; audited)',
      access: 'signed-in',
      who: 'the plan’s student or coach',
      params: IdParamSchema,
      body: PlanReplyCreateSchema,
      response: itemOf(PlanSchema),
      handler: async ({ user, params, body }) => ({ item: await coachingService.replyToPlan(user, params.id, body) }),
    }),
  ],
};
