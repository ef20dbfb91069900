import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROUTES } from '../../../server/features/docs/openapi';
import { api, app } from '../../helpers/api';
import { root } from '../../helpers/database';
import { buildFixture, ROLES, type Actor, type Fixture } from './fixture';
import { MATRIX, UNDOCUMENTED, type CellRequest } from './matrix';
import { enumerateRoutes, fromOpenApi, type RouteKey } from './routes';

const routes = enumerateRoutes(app);
let f: Fixture;

beforeAll(async () => {
  f = await buildFixture();
}, 60000);
afterAll(async () => f?.close());

async function send(route: RouteKey, r: CellRequest, actor: Actor) {
  const m = route.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
  let req = api[m](r.url).set(f.as(actor)).set(r.headers ?? {});
  if (r.file) req = req.attach('file', r.file.buffer, { filename: r.file.filename, contentType: r.file.contentType });
  else if (r.body !== undefined) req = req.send(r.body as object);
  return req;
}

describe('the route list', () => {
  it('is read from the router itself, mounted sub-routers included', () => {
    expect(routes.length).toBeGreaterThan(40);
    expect(routes.map((r) => r.key)).toContain('PATCH /api/admin/users/:id/role');
    expect(routes.map((r) => r.key)).toContain('GET /api/centers/:id/conditions/current.pdf');
  });

  it('has a matrix entry for every route, and no entry for a route that is gone', () => {
    const served = new Set(routes.map((r) => r.key));
    const missing = [...served].filter((k) => !(k in MATRIX));
    const stale = Object.keys(MATRIX).filter((k) => !served.has(k));
    expect({ missing, stale }).toEqual({ missing: [], stale: [] });
  });

  it('agrees with ROUTES in the OpenAPI document (both ways)', () => {
    const served = new Set(routes.map((r) => r.key));
    const documented = new Set(ROUTES.map((r) => `${r.method.toUpperCase()} ${fromOpenApi(r.path)}`));
    const undocumented = [...served].filter((k) => !documented.has(k) && !(k in UNDOCUMENTED));
    const notServed = [...documented].filter((k) => !served.has(k));
    expect({ undocumented, notServed }).toEqual({ undocumented: [], notServed: [] });
  });
});

describe('the notes', () => {
  it('name test files that exist, by their path from the repository root', () => {
    const cited = Object.entries(MATRIX).flatMap(([route, e]) => [...(e.note ?? '').matchAll(/tests\/[\w./-]+/g)].map((m) => ({ route, file: m[0].replace(/[.,;)]+$/, '') })));
    expect(cited.length).toBeGreaterThan(3);
    const missing = cited.filter((c) => !fs.existsSync(path.join(root, c.file)) || !c.file.endsWith('.ts'));
    expect(missing).toEqual([]);
  });
});

describe('access matrix (route × actor → status, real database)', () => {
  it('every actor gets the expected status on every route, refusals in the error shape', async () => {
    const mismatches: string[] = [];
    const badShape: string[] = [];
    let cells = 0;
    for (const route of routes) {
      const entry = MATRIX[route.key];
      if (!entry) continue; // reported by the coverage test above
      const row = typeof entry.expect === 'function' ? entry.expect(f) : entry.expect;
      const actual: number[] = [];
      for (const [i, actor] of ROLES.entries()) {
        const res = await send(route, await entry.req(f, actor), actor);
        cells += 1;
        actual.push(res.status);
        if (res.status >= 400 && res.type === 'application/json' && !(typeof res.body?.error?.code === 'string' && typeof res.body?.error?.message === 'string')) {
          badShape.push(`${route.key} as ${actor}: ${JSON.stringify(res.body).slice(0, 200)}`);
        }
        if (res.status >= 500) badShape.push(`${route.key} as ${actor}: ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`);
        if (res.status !== row[i]) mismatches.push(`${route.key} as ${actor}: expected ${row[i]}, got ${res.status} ${res.status >= 400 ? JSON.stringify(res.body).slice(0, 160) : ''}`);
      }
      if (process.env.MATRIX_PRINT) console.log(`'${route.key}': [${actual.join(', ')}]`);
    }
    expect(mismatches).toEqual([]);
    expect(badShape).toEqual([]);
    expect(cells).toBe(Object.keys(MATRIX).length * ROLES.length);
  }, 120000);
});
