import type { Express } from 'express';
import { devRoutes } from '../../../server/features/dev/dev.routes';
import { fullPath, type RouteGroup } from '../../../server/http/route';
import { ROUTE_TABLE } from '../../../server/routes';

/** One API route as the Express router knows it: `GET /api/arsenal/:id`. */
export interface RouteKey {
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  path: string;
  key: string;
}

interface LayerLike {
  route?: { path: unknown; methods: Record<string, boolean> };
  handle?: { stack?: LayerLike[] };
  /** router v2 (Express 5) keeps the path each layer was registered with. */
  rawPath?: unknown;
  /** router v1 (Express 4) only keeps the compiled expression. */
  regexp?: RegExp;
}

const join = (prefix: string, p: string): string => {
  const s = `${prefix}/${p}`.replace(/\/+/g, '/');
  return s.length > 1 ? s.replace(/\/$/, '') : s;
};

function pathsOf(raw: unknown): string[] | null {
  if (typeof raw === 'string') return [raw];
  if (Array.isArray(raw) && raw.every((x) => typeof x === 'string')) return raw as string[];
  return null; // a RegExp route (the client's catch-all): not an API route
}

/**
 * Every route of the app, recovered from its router stack: mounted sub-routers are walked recursively
 * and each layer's registration path (`rawPath`, router v2) is joined onto its mount path. A layer whose
 * path cannot be recovered fails loudly instead of being skipped, so no route escapes the matrix.
 */
export function enumerateRoutes(app: Express, only = /^\/api(\/|$)/): RouteKey[] {
  const root =
    (app as unknown as { router?: { stack: LayerLike[] }; _router?: { stack: LayerLike[] } }).router ??
    (app as unknown as { _router: { stack: LayerLike[] } })._router;
  const out = new Map<string, RouteKey>();
  const walk = (stack: LayerLike[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const paths = pathsOf(layer.route.path);
        if (!paths) continue;
        for (const p of paths) {
          for (const [m, on] of Object.entries(layer.route.methods)) {
            if (!on || m === '_all') continue;
            const method = m.toUpperCase() as RouteKey['method'];
            const path = join(prefix, p);
            if (!only.test(path)) continue;
            const key = `${method} ${path}`;
            out.set(key, { method, path, key });
          }
        }
      } else if (layer.handle?.stack) {
        const mounts = pathsOf(layer.rawPath);
        if (!mounts)
          throw new Error(`a sub-router is mounted on a path this walker cannot read (${String(layer.rawPath ?? layer.regexp)})`);
        for (const m of mounts) walk(layer.handle.stack, join(prefix, m));
      }
    }
  };
  walk(root.stack, '');
  return [...out.values()].sort((a, b) => a.key.localeCompare(b.key));
}

/** The route table's groups as the test server mounts them (the development mailbox included). */
export const SERVED_GROUPS: readonly RouteGroup[] = [...ROUTE_TABLE, devRoutes];

/** Every route of the route table (the one list app.ts registers, the docs and the matrix read), sorted. */
export function tableRoutes(groups: readonly RouteGroup[] = SERVED_GROUPS): RouteKey[] {
  const out = new Map<string, RouteKey>();
  for (const g of groups)
    for (const r of g.routes) {
      const method = r.method.toUpperCase() as RouteKey['method'];
      const path = fullPath(g, r);
      out.set(`${method} ${path}`, { method, path, key: `${method} ${path}` });
    }
  return [...out.values()].sort((a, b) => a.key.localeCompare(b.key));
}

/** `/api/arsenal/{id}` (OpenAPI) → `/api/arsenal/:id` (Express). */
export const fromOpenApi = (p: string): string => p.replace(/\{(\w+)\}/g, ':$1');

export const isWrite = (r: RouteKey): boolean => r.method !== 'GET';
