import fs from 'node:fs';
import path from 'node:path';
import { z } from 'zod';
import { fullPath } from '../../../server/http/route';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api, app } from '../../helpers/api';
import { root } from '../../helpers/database';
import { buildFixture, ROLES, type Actor, type Fixture } from './fixture';
import { MATRIX, type CellRequest } from './matrix';
import { enumerateRoutes, fromOpenApi, SERVED_GROUPS, tableRoutes, type RouteKey } from './routes';

/** The matrix walks the route table: a route added to the table without a matrix entry fails below. */
const routes = tableRoutes();
/** Each JSON route's declared response schema, by route key. */
const RESPONSES = new Map<string, z.ZodType>(
  SERVED_GROUPS.flatMap((g) => g.routes.map((r) => [`${r.method.toUpperCase()} ${fullPath(g, r)}`, r.response] as const)).flatMap(
    ([k, doc]) => (doc instanceof z.ZodType ? [[k, doc] as const] : []),
  ),
);
/** Paths of the answer that parsing with the schema dropped: fields the server sends and the schema does not declare. */
function droppedKeys(sent: unknown, kept: unknown, at = 'body'): string[] {
  if (Array.isArray(sent) && Array.isArray(kept)) return sent.flatMap((x, i) => droppedKeys(x, kept[i], `${at}[${i}]`)).slice(0, 5);
  if (!sent || typeof sent !== 'object' || !kept || typeof kept !== 'object') return [];
  const k = kept as Record<string, unknown>;
  return Object.entries(sent as Record<string, unknown>).flatMap(([key, v]) =>
    key in k ? droppedKeys(v, k[key], `${at}.${key}`) : [`${at}.${key}`],
  );
}

let f: Fixture;

beforeAll(async () => {
  f = await buildFixture();
}, 60000);
afterAll(async () => f?.close());

async function send(route: RouteKey, r: CellRequest, actor: Actor) {
  const m = route.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
  let req = api[m](r.url)
    .set(f.as(actor))
    .set(r.headers ?? {});
  if (r.file) req = req.attach('file', r.file.buffer, { filename: r.file.filename, contentType: r.file.contentType });
  else if (r.body !== undefined) req = req.send(r.body as object);
  return req;
}

describe('the route list', () => {
  it('is the route table, mounted sub-routers included', () => {
    expect(routes.length).toBeGreaterThan(40);
    expect(routes.map((r) => r.key)).toContain('PATCH /api/admin/users/:id/role');
    expect(routes.map((r) => r.key)).toContain('GET /api/centers/:id/conditions/current.pdf');
  });

  it('is every route the app serves: nothing is registered outside the table', () => {
    const table = new Set(routes.map((r) => r.key));
    const served = new Set(enumerateRoutes(app).map((r) => r.key));
    expect({ outsideTable: [...served].filter((k) => !table.has(k)), notServed: [...table].filter((k) => !served.has(k)) }).toEqual({
      outsideTable: [],
      notServed: [],
    });
  });

  it('has a matrix entry for every route, and no entry for a route that is gone', () => {
    const served = new Set(routes.map((r) => r.key));
    const missing = [...served].filter((k) => !(k in MATRIX));
    const stale = Object.keys(MATRIX).filter((k) => !served.has(k));
    expect({ missing, stale }).toEqual({ missing: [], stale: [] });
  });

  it('gives every route but the development tools an operation in the OpenAPI document, with a success response', async () => {
    const res = await api.get('/api/docs/openapi.json');
    expect(res.status).toBe(200);
    const ops = Object.entries(res.body.paths as Record<string, Record<string, { responses: Record<string, unknown> }>>).flatMap(
      ([p, item]) => Object.entries(item).map(([m, op]) => ({ key: `${m.toUpperCase()} ${fromOpenApi(p)}`, op })),
    );
    const documented = new Set(ops.map((o) => o.key));
    const expected = tableRoutes(SERVED_GROUPS.filter((g) => !g.devOnly)).map((r) => r.key);
    expect(expected.length).toBe(routes.length - 1);
    expect({
      undocumented: expected.filter((k) => !documented.has(k)),
      notInTable: [...documented].filter((k) => !expected.includes(k)),
    }).toEqual({ undocumented: [], notInTable: [] });
    const withoutSuccess = ops.filter((o) => !Object.keys(o.op.responses).some((code) => /^2\d\d$/.test(code))).map((o) => o.key);
    expect(withoutSuccess).toEqual([]);
  });
});

describe('the notes', () => {
  it('name test files that exist, by their path from the repository root', () => {
    const cited = Object.entries(MATRIX).flatMap(([route, e]) =>
      [...(e.note ?? '').matchAll(/tests\/[\w./-]+/g)].map((m) => ({ route, file: m[0].replace(/[.,;)]+$/, '') })),
    );
    expect(cited.length).toBeGreaterThan(3);
    const missing = cited.filter((c) => !fs.existsSync(path.join(root, c.file)) || !c.file.endsWith('.ts'));
    expect(missing).toEqual([]);
  });
});

describe('access matrix (route × actor → status, real database)', () => {
  it('every actor gets the expected status on every route, refusals in the error shape', async () => {
    const mismatches: string[] = [];
    const badShape: string[] = [];
    const offSchema: string[] = [];
    let checkedBodies = 0;
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
        if (
          res.status >= 400 &&
          res.type === 'application/json' &&
          !(typeof res.body?.error?.code === 'string' && typeof res.body?.error?.message === 'string')
        ) {
          badShape.push(`${route.key} as ${actor}: ${JSON.stringify(res.body).slice(0, 200)}`);
        }
        if (res.status >= 500) badShape.push(`${route.key} as ${actor}: ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`);
        const schema = RESPONSES.get(route.key);
        if (schema && res.status < 300 && res.status !== 204) {
          checkedBodies += 1;
          const parsed = schema.safeParse(res.body);
          if (!parsed.success)
            offSchema.push(
              `${route.key} as ${actor}: ${parsed.error.issues
                .map((x) => `${x.path.join('.')}: ${x.message}`)
                .join('; ')
                .slice(0, 300)}`,
            );
          else
            for (const k of droppedKeys(res.body, parsed.data))
              offSchema.push(`${route.key} as ${actor}: ${k} is answered but not in the response schema`);
        }
        if (res.status !== row[i])
          mismatches.push(
            `${route.key} as ${actor}: expected ${row[i]}, got ${res.status} ${res.status >= 400 ? JSON.stringify(res.body).slice(0, 160) : ''}`,
          );
      }
      if (process.env.MATRIX_PRINT) console.log(`'${route.key}': [${actual.join(', ')}]`);
    }
    expect(mismatches).toEqual([]);
    expect(badShape).toEqual([]);
    // Every JSON success answer matches the response schema its route declares (the one the docs publish).
    expect(offSchema).toEqual([]);
    expect(checkedBodies).toBeGreaterThan(300);
    expect(cells).toBe(Object.keys(MATRIX).length * ROLES.length);
  }, 120000);
});
