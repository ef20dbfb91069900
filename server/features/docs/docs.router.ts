import { Router } from 'express';
import { ROUTES, openApiDocument } from './openapi';

export const docsRouter = Router();

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

docsRouter.get('/openapi.json', (_req, res) => {
  res.json(openApiDocument());
});

/** A readable page of the API (no scripts, no external assets). */
docsRouter.get('/', (req, res) => {
  if (req.accepts(['html', 'json']) === 'json') {
    res.json(openApiDocument());
    return;
  }
  const rows = ROUTES.map(
    (r) => `<tr><td><code>${r.method.toUpperCase()}</code></td><td><code>${esc(r.path)}</code></td><td>${esc(r.summary)}</td><td>${esc(r.who)}</td></tr>`,
  ).join('\n');
  res.type('html').send(`<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Lanewright API</title>
<meta name="viewport" content="width=device-width, initial-scale=1">
<style>body{font-family:system-ui,sans-serif;margin:2rem;color:#12302f}table{border-collapse:collapse;width:100%}td,th{border-bottom:1px solid #d5e2e1;padding:.4rem .6rem;text-align:left;vertical-align:top}th{background:#e6f0ef}code{font-size:.9em}</style></head>
<body><main><h1>Lanewright API</h1><p>The machine-readable document is at <a href="/api/docs/openapi.json">/api/docs/openapi.json</a> (OpenAPI 3.1, generated from the zod schemas that validate each route). Errors always have the shape <code>{ "error": { "code", "message", "fields"? } }</code>.</p>
<table><thead><tr><th>Method</th><th>Path</th><th>What it does</th><th>Who</th></tr></thead><tbody>
${rows}
</tbody></table></main></body></html>`);
});
