import { IdParamSchema } from '../../../shared/auth';
import { itemOf, pageOf } from '../../../shared/api';
import {
  BallModelInputSchema,
  CatalogueImportResultSchema,
  BallModelPatchSchema,
  BallModelSchema,
  CatalogueQuerySchema,
} from '../../../shared/balls';
import { csvFile, uploadedFile } from '../../lib/upload';
import { requireAuth } from '../../middleware/auth';
import { route, type RouteGroup } from '../../http/route';
import { catalogueService } from './catalogue.service';

const admin = ['admin'] as const;

/** The shared ball catalogue: every signed-in user reads it, admins edit it. */
export const catalogueRoutes: RouteGroup = {
  prefix: '/catalogue',
  guard: [requireAuth],
  routes: [
    route({
      method: 'get',
      path: '/',
      summary: 'The shared ball catalogue, searchable and filterable',
      access: 'signed-in',
      query: CatalogueQuerySchema,
      response: pageOf(BallModelSchema),
      handler: ({ query }) => catalogueService.list(query),
    }),
    route({
      method: 'get',
      path: '/:id',
      summary: 'One catalogue ball',
      access: 'signed-in',
      params: IdParamSchema,
      response: itemOf(BallModelSchema),
      handler: async ({ params }) => ({ item: await catalogueService.get(params.id) }),
    }),
    route({
      method: 'post',
      path: '/import',
      status: 201,
      summary: 'Import catalogue balls from CSV (all rows or none)',
      access: admin,
      upload: csvFile,
      response: CatalogueImportResultSchema,
      handler: ({ user, req }) => catalogueService.importCsv(user.id, uploadedFile(req).buffer),
    }),
    route({
      method: 'post',
      path: '/',
      status: 201,
      summary: 'Add a catalogue ball',
      access: admin,
      body: BallModelInputSchema,
      response: itemOf(BallModelSchema),
      handler: async ({ user, body }) => ({ item: await catalogueService.create(user.id, body) }),
    }),
    route({
      method: 'patch',
      path: '/:id',
      summary: 'Edit a catalogue ball (version required)',
      access: admin,
      params: IdParamSchema,
      body: BallModelPatchSchema,
      response: itemOf(BallModelSchema),
      handler: async ({ user, params, body }) => ({ item: await catalogueService.update(user.id, params.id, body) }),
    }),
  ],
};
