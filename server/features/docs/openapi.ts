import { OpenAPIRegistry, OpenApiGeneratorV31, type ResponseConfig, type RouteConfig } from '@asteasolutions/zod-to-openapi';
import type { z } from 'zod';
import { ApiErrorSchema } from '../../../shared/errors';
import type { AnyRoute, RouteGroup } from '../../http/route';

/** An OpenAPI path (`/api/arsenal/{id}`) from an Express one (`/api/arsenal/:id`). */
export const toOpenApiPath = (expressPath: string): string => expressPath.replace(/:(\w+)/g, '{$1}');

/** Who may call the route, in words (the docs page and each operation's description). */
export function whoOf(r: AnyRoute): string {
  if (r.who) return r.who;
  if (r.access === 'public' || r.access === 'optional' || r.access === 'token') return 'public';
  if (r.access === 'signed-in') return 'signed-in';
  return r.access.join(', ');
}

const isPublic = (r: AnyRoute) => r.access === 'public' || r.access === 'optional' || r.access === 'token';

/** One documented operation of the table: its full Express path and the route. */
export interface DocumentedRoute {
  path: string;
  route: AnyRoute;
}

/** Every route of the groups the API document covers (development-only groups are left out), in table order. */
export function documentedRoutes(groups: readonly RouteGroup[]): DocumentedRoute[] {
  return groups
    .filter((g) => !g.devOnly)
    .flatMap((g) => g.routes.map((route) => ({ path: `/api${g.prefix}${route.path === '/' ? '' : route.path}`, route })));
}

function successResponses(r: AnyRoute): Record<string, ResponseConfig> {
  const doc = r.response;
  const status = String(r.status ?? ('noContent' in doc ? 204 : 200));
  const content: ResponseConfig['content'] =
    'noContent' in doc
      ? undefined
      : 'contentType' in doc
        ? { [doc.contentType]: { schema: { type: 'string', format: 'binary', description: doc.description } } }
        : { 'application/json': { schema: doc } };
  const out: Record<string, ResponseConfig> = {
    [status]: {
      description: 'contentType' in doc ? doc.description : 'noContent' in doc ? 'Done; no body' : 'OK',
      ...(content ? { content } : {}),
    },
  };
  for (const [code, description] of Object.entries(r.alsoAnswers ?? {}))
    out[code] = { description, ...(content && !('contentType' in doc) ? { content } : {}) };
  return out;
}

const errorResponse = (description: string): ResponseConfig => ({
  description,
  content: { 'application/json': { schema: ApiErrorSchema } },
});

function operation(path: string, r: AnyRoute): RouteConfig {
  const upload = r.upload
    ? {
        content: {
          'multipart/form-data': {
            schema: { type: 'object' as const, properties: { file: { type: 'string' as const, format: 'binary' } }, required: ['file'] },
          },
        },
      }
    : undefined;
  return {
    method: r.method,
    path: toOpenApiPath(path),
    summary: r.summary,
    description: `Who: ${whoOf(r)}.`,
    ...(isPublic(r) ? {} : { security: [{ bearer: [] }] }),
    request: {
      // Params and query schemas are objects (refined ones too); the route type only says "a schema".
      ...(r.params ? { params: r.params as z.ZodObject } : {}),
      ...(r.query ? { query: r.query as z.ZodObject } : {}),
      ...(r.headers ? { headers: r.headers } : {}),
      ...(r.body
        ? { body: { required: true, content: { 'application/json': { schema: r.body } } } }
        : upload
          ? { body: { required: true, ...upload } }
          : {}),
    },
    responses: {
      ...successResponses(r),
      '400': errorResponse('Invalid input, every bad field listed'),
      ...(isPublic(r) ? {} : { '401': errorResponse('Not signed in'), '403': errorResponse('Role not allowed') }),
    },
  };
}

/** The OpenAPI 3.1 document of the route table: every route with its input and response schemas. */
export function openApiDocument(groups: readonly RouteGroup[]): Record<string, unknown> {
  const registry = new OpenAPIRegistry();
  registry.registerComponent('securitySchemes', 'bearer', { type: 'http', scheme: 'bearer', bearerFormat: 'JWT' });
  for (const { path, route } of documentedRoutes(groups)) registry.registerPath(operation(path, route));
  const doc = new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Lanewright API',
      version: '0.1.0',
      description: 'Lane-condition and ball-matchup advice. Errors: { error: { code, message, fields? } }.',
    },
  });
  // Path parameters are always required (OpenAPI 3.1 §4.8.12.1), whatever their schema's coercion says.
  for (const item of Object.values(doc.paths ?? {}))
    for (const op of Object.values(item as Record<string, { parameters?: { in: string; required?: boolean }[] }>))
      for (const p of op.parameters ?? []) if (p.in === 'path') p.required = true;
  return { ...doc };
}
