import escapeHtml from 'escape-html';
import { z } from 'zod';
import { route, type RouteGroup } from '../../http/route';
import { documentedRoutes, openApiDocument, toOpenApiPath, whoOf } from './openapi';

const DocumentSchema = z.record(z.string(), z.unknown()).meta({ description: 'The OpenAPI 3.1 document' });

/** The API's documentation, generated from the route table that `tableOf()` returns (this group included). */
export function docsRoutes(tableOf: () => readonly RouteGroup[]): RouteGroup {
  return {
    prefix: '/docs',
    routes: [
      route({
        method: 'get',
        path: '/openapi.json',
        summary: 'The OpenAPI 3.1 document of this API, generated from the route table',
        access: 'public',
        response: DocumentSchema,
        handler: () => openApiDocument(tableOf()),
      }),
      /** A readable page of the API (no scripts, no external assets); the document itself for a client asking for JSON. */
      route({
        method: 'get',
        path: '/',
        summary: 'A readable page listing every route (the OpenAPI document with Accept: application/json)',
        access: 'public',
        response: { contentType: 'text/html', description: 'The route list as a page' },
        handler: ({ req, res }) => {
          if (req.accepts(['html', 'json']) === 'json') {
            res.json(openApiDocument(tableOf()));
            return;
          }
          const rows = documentedRoutes(tableOf())
            .map(
              ({ path, route: r }) =>
                `<tr><td><code>${r.method.toUpperCase()}</code></td><td><code>${escapeHtml(toOpenApiPath(path))}</code></td><td>${escapeHtml(r.summary)}</td><td>${escapeHtml(whoOf(r))}</td></tr>`,
            )
            .join('\n');
          res.type('html').send(`<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Lanewright API</title>
<meta name="viewport" content="width=device-width, initial-scale=1">
<style>body{font-family:system-ui,sans-serif;margin:2rem;color:#12302f}table{border-collapse:collapse;width:100%}td,th{border-bottom:1px solid #d5e2e1;padding:.4rem .6rem;text-align:left;vertical-align:top}th{background:#e6f0ef}code{font-size:.9em}</style></head>
<body><main><h1>Lanewright API</h1><p>The machine-readable document is at <a href="/api/docs/openapi.json">/api/docs/openapi.json</a> (OpenAPI 3.1, generated from the route table whose zod schemas validate each route). Errors always have the shape <code>{ "error": { "code", "message", "fields"? } }</code>.</p>
<table><thead><tr><th>Method</th><th>Path</th><th>What it does</th><th>Who</th></tr></thead><tbody>
${rows}
</tbody></table></main></body></html>`);
        },
      }),
    ],
  };
}
