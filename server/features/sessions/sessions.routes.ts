import { z } from 'zod';
import { IdParamSchema } from '../../../shared/auth';
import { itemOf, pageOf } from '../../../shared/api';
import { AnnotationCreateSchema, AnnotationSchema } from '../../../shared/coaching';
import {
  IdempotencyKeySchema,
  SessionCreateSchema,
  SessionDetailSchema,
  SessionListQuerySchema,
  SessionPatchSchema,
  SessionSchema,
  ShotCreatedSchema,
  ShotCreateSchema,
  ShotParamsSchema,
} from '../../../shared/sessions';
import { AppError } from '../../lib/AppError';
import { requireAuth } from '../../middleware/auth';
import { NO_CONTENT, Reply, route, type RouteGroup } from '../../http/route';
import { sessionsService } from './sessions.service';

/** The Idempotency-Key header, checked like any other input (400 on the header field). */
function idempotencyKey(header: string | undefined): string {
  const parsed = IdempotencyKeySchema.safeParse(header);
  if (!parsed.success) {
    const message = parsed.error.issues[0]?.message ?? 'Send an Idempotency-Key header';
    throw new AppError(400, 'validation_failed', message, { 'headers.idempotency-key': message });
  }
  return parsed.data;
}

const Item = itemOf(SessionSchema);

/** A bowler's sessions and shots; a linked coach reads them (and annotates). Anyone else gets 404. */
export const sessionsRoutes: RouteGroup = {
  prefix: '/sessions',
  guard: [requireAuth],
  routes: [
    route({
      method: 'get',
      path: '/',
      summary: 'My sessions, newest first (a linked coach: ?studentId)',
      access: 'signed-in',
      who: 'owner or linked coach',
      query: SessionListQuerySchema,
      response: pageOf(SessionSchema),
      handler: ({ user, query }) => sessionsService.list(user, query),
    }),
    route({
      method: 'post',
      path: '/',
      status: 201,
      summary: 'Start a session (center, condition or pattern, date, kind)',
      access: 'signed-in',
      body: SessionCreateSchema,
      response: Item,
      handler: async ({ user, body }) => ({ item: await sessionsService.create(user, body) }),
    }),
    route({
      method: 'get',
      path: '/:id',
      summary: 'A session: frame sheets scored by scoreGame, shots, stats, moves, annotations',
      access: 'signed-in',
      who: 'owner or linked coach',
      params: IdParamSchema,
      response: itemOf(SessionDetailSchema),
      handler: async ({ user, params }) => ({ item: await sessionsService.get(user, params.id) }),
    }),
    route({
      method: 'patch',
      path: '/:id',
      summary: 'Edit a session’s notes, kind or date',
      access: 'signed-in',
      params: IdParamSchema,
      body: SessionPatchSchema,
      response: Item,
      handler: async ({ user, params, body }) => ({ item: await sessionsService.update(user, params.id, body) }),
    }),
    route({
      method: 'delete',
      path: '/:id',
      summary: 'Remove a session (restorable)',
      access: 'signed-in',
      params: IdParamSchema,
      response: NO_CONTENT,
      handler: ({ user, params }) => sessionsService.remove(user, params.id),
    }),
    route({
      method: 'post',
      path: '/:id/restore',
      summary: 'Undo a session’s removal',
      access: 'signed-in',
      params: IdParamSchema,
      response: Item,
      handler: async ({ user, params }) => ({ item: await sessionsService.restore(user, params.id) }),
    }),
    route({
      method: 'post',
      path: '/:id/shots',
      status: 201,
      access: 'signed-in',
      summary: 'Log a delivery (header Idempotency-Key, 8–100 chars: a retry returns the first answer, 200)',
      headers: z.object({ 'idempotency-key': IdempotencyKeySchema }),
      params: IdParamSchema,
      body: ShotCreateSchema,
      response: ShotCreatedSchema,
      alsoAnswers: { 200: 'A retry with the same Idempotency-Key: the first answer again' },
      handler: async ({ user, params, body, req }) => {
        const out = await sessionsService.addShot(user, params.id, idempotencyKey(req.get('Idempotency-Key')), body);
        return out.replayed ? new Reply(200, out.shot) : out.shot;
      },
    }),
    route({
      method: 'delete',
      path: '/:id/shots/:shotId',
      summary: 'Undo a game’s last delivery (any other → 409)',
      access: 'signed-in',
      params: ShotParamsSchema,
      response: NO_CONTENT,
      handler: ({ user, params }) => sessionsService.removeShot(user, params.id, params.shotId),
    }),
    route({
      method: 'post',
      path: '/:id/annotations',
      status: 201,
      summary: 'Annotate a session',
      access: 'signed-in',
      who: 'owner or linked coach',
      params: IdParamSchema,
      body: AnnotationCreateSchema,
      response: itemOf(AnnotationSchema),
      handler: async ({ user, params, body }) => ({ item: await sessionsService.annotate(user, params.id, body) }),
    }),
  ],
};
