import { IdParamSchema } from '../../../shared/auth';
import { itemOf, pageOf } from '../../../shared/api';
import {
  ArsenalImportResultSchema,
  ArsenalQuerySchema,
  BallCreateSchema,
  ballCreateSchemaFor,
  BallPatchSchema,
  BallSchema,
  SurfaceChangeSchema,
} from '../../../shared/balls';
import { csvFile, imageFile, uploadedFile } from '../../lib/upload';
import { requireAuth } from '../../middleware/auth';
import { NO_CONTENT, route, type RouteGroup } from '../../http/route';
import { arsenalService } from './arsenal.service';

const Item = itemOf(BallSchema);

/** The signed-in user's own balls. Another user's ball answers 404, so its existence never leaks. */
export const arsenalRoutes: RouteGroup = {
  prefix: '/arsenal',
  guard: [requireAuth],
  routes: [
    route({
      method: 'get',
      path: '/',
      summary: 'Your balls',
      access: 'signed-in',
      query: ArsenalQuerySchema,
      response: pageOf(BallSchema),
      handler: ({ user, query }) => arsenalService.list(user.id, query),
    }),
    route({
      method: 'post',
      path: '/import',
      status: 201,
      summary: 'Import hand-entered balls from CSV (all rows or none)',
      access: 'signed-in',
      upload: csvFile,
      response: ArsenalImportResultSchema,
      handler: ({ user, req }) => arsenalService.importCsv(user.id, uploadedFile(req).buffer),
    }),
    route({
      method: 'post',
      path: '/',
      status: 201,
      summary: 'Add a ball from the catalogue or by hand',
      access: 'signed-in',
      body: BallCreateSchema,
      bodyFor: ballCreateSchemaFor,
      response: Item,
      handler: async ({ user, body }) => ({ item: await arsenalService.create(user.id, body) }),
    }),
    route({
      method: 'get',
      path: '/:id',
      summary: 'One of your balls with its surface history',
      access: 'signed-in',
      params: IdParamSchema,
      response: Item,
      handler: async ({ user, params }) => ({ item: await arsenalService.get(user.id, params.id) }),
    }),
    route({
      method: 'patch',
      path: '/:id',
      summary: 'Edit a ball (stale version → 409)',
      access: 'signed-in',
      params: IdParamSchema,
      body: BallPatchSchema,
      response: Item,
      handler: async ({ user, params, body }) => ({ item: await arsenalService.update(user.id, params.id, body) }),
    }),
    route({
      method: 'delete',
      path: '/:id',
      summary: 'Remove a ball (restorable)',
      access: 'signed-in',
      params: IdParamSchema,
      response: NO_CONTENT,
      handler: ({ user, params }) => arsenalService.remove(user.id, params.id),
    }),
    route({
      method: 'post',
      path: '/:id/restore',
      summary: 'Undo a removal',
      access: 'signed-in',
      params: IdParamSchema,
      response: Item,
      handler: async ({ user, params }) => ({ item: await arsenalService.restore(user.id, params.id) }),
    }),
    route({
      method: 'post',
      path: '/:id/surface',
      summary: 'Record a new surface; resets games since resurface',
      access: 'signed-in',
      params: IdParamSchema,
      body: SurfaceChangeSchema,
      response: Item,
      handler: async ({ user, params, body }) => ({ item: await arsenalService.changeSurface(user.id, user.id, params.id, body) }),
    }),
    route({
      method: 'put',
      path: '/:id/photo',
      summary: 'Set the ball’s photo (PNG, JPEG or WebP, ≤ 2 MiB)',
      access: 'signed-in',
      params: IdParamSchema,
      upload: imageFile,
      response: Item,
      handler: async ({ user, params, req }) => ({ item: await arsenalService.setPhoto(user.id, params.id, uploadedFile(req)) }),
    }),
    route({
      method: 'get',
      path: '/:id/photo',
      summary: 'The ball’s photo',
      access: 'signed-in',
      params: IdParamSchema,
      response: { contentType: 'image/*', description: 'The photo as uploaded (PNG, JPEG or WebP)' },
      handler: async ({ user, params, res }) => {
        const photo = await arsenalService.getPhoto(user.id, params.id);
        res.type(photo.type).setHeader('Cache-Control', 'private, max-age=300');
        res.setHeader('X-Content-Type-Options', 'nosniff');
        res.send(photo.bytes);
      },
    }),
    route({
      method: 'delete',
      path: '/:id/photo',
      summary: 'Remove the ball’s photo',
      access: 'signed-in',
      params: IdParamSchema,
      response: Item,
      handler: async ({ user, params }) => ({ item: await arsenalService.removePhoto(user.id, params.id) }),
    }),
  ],
};
