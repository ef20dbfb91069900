import { IdParamSchema } from '../../../shared/auth';
import { itemOf, pageOf } from '../../../shared/api';
import {
  PatternDetailSchema,
  PatternExportQuerySchema,
  PatternImportConflictSchema,
  PatternInputSchema,
  PatternListItemSchema,
  PatternPatchSchema,
  PatternQuerySchema,
} from '../../../shared/patterns';
import { patternFile, uploadedFile } from '../../lib/upload';
import { requireAuth } from '../../middleware/auth';
import { NO_CONTENT, Reply, route, type RouteGroup } from '../../http/route';
import { patternsService } from './patterns.service';

const editors = ['coach', 'proprietor', 'admin'] as const;
const Item = itemOf(PatternDetailSchema);

/** Oil patterns: every signed-in user reads them; coaches, proprietors and admins create and edit. */
export const patternsRoutes: RouteGroup = {
  prefix: '/patterns',
  guard: [requireAuth],
  routes: [
    route({
      method: 'get',
      path: '/',
      summary: 'Oil patterns with their computed summary',
      access: 'signed-in',
      query: PatternQuerySchema,
      response: pageOf(PatternListItemSchema),
      handler: ({ user, query }) => patternsService.list(user, query),
    }),
    route({
      method: 'post',
      path: '/import',
      status: 201,
      summary:
        'Create a draft pattern from a Lanewright JSON or CSV file (errors by line; a name you already use is 409 unless onConflict is rename or replace)',
      access: editors,
      upload: patternFile,
      query: PatternImportConflictSchema,
      response: Item,
      alsoAnswers: { 200: 'Replaced your pattern of the same name (onConflict=replace)' },
      handler: async ({ user, req, query }) => {
        const file = uploadedFile(req);
        const out = await patternsService.importFile(user, file.originalname, file.buffer, query.onConflict);
        return out.replaced ? new Reply(200, { item: out.item }) : { item: out.item };
      },
    }),
    route({
      method: 'get',
      path: '/:id/export',
      summary: 'Download a pattern in Lanewright JSON or CSV (?format=json|csv)',
      access: 'signed-in',
      params: IdParamSchema,
      query: PatternExportQuerySchema,
      response: { contentType: 'application/json, text/csv', description: 'The pattern file, as an attachment' },
      handler: async ({ user, params, query, res }) => {
        const f = await patternsService.exportFile(user, params.id, query.format);
        res.type(f.type).setHeader('Content-Disposition', `attachment; filename="${f.filename}"`);
        res.send(f.body);
      },
    }),
    route({
      method: 'post',
      path: '/:id/duplicate',
      status: 201,
      summary: 'Copy a pattern as your own',
      access: editors,
      params: IdParamSchema,
      response: Item,
      handler: async ({ user, params }) => ({ item: await patternsService.duplicate(user, params.id) }),
    }),
    route({
      method: 'get',
      path: '/:id',
      summary: 'A pattern: sweeps, summary and oil grid',
      access: 'signed-in',
      params: IdParamSchema,
      response: Item,
      handler: async ({ user, params }) => ({ item: await patternsService.get(user, params.id) }),
    }),
    route({
      method: 'post',
      path: '/',
      status: 201,
      summary: 'Create a pattern',
      access: editors,
      body: PatternInputSchema,
      response: Item,
      handler: async ({ user, body }) => ({ item: await patternsService.create(user, body) }),
    }),
    route({
      method: 'patch',
      path: '/:id',
      summary: 'Edit your pattern (version required)',
      access: editors,
      params: IdParamSchema,
      body: PatternPatchSchema,
      response: Item,
      handler: async ({ user, params, body }) => ({ item: await patternsService.update(user, params.id, body) }),
    }),
    route({
      method: 'delete',
      path: '/:id',
      summary: 'Delete your pattern',
      access: editors,
      params: IdParamSchema,
      response: NO_CONTENT,
      handler: ({ user, params }) => patternsService.remove(user, params.id),
    }),
  ],
};
