import { Router, type NextFunction, type Request, type RequestHandler, type Response } from 'express';
import type { z } from 'zod';
import type { Role } from '../../shared/auth';
import { AppError } from '../lib/AppError';
import { currentUser, optionalAuth, requireAuth, requireRole, type AuthUser } from '../middleware/auth';
import { fieldErrors } from '../middleware/validate';

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

/**
 * Who may call a route: anyone (`public`), anyone with more for a signed-in user (`optional`), any signed-in
 * user (`signed-in`), or the signed-in users of these roles. `token` routes check their own credential.
 */
export type Access = 'public' | 'optional' | 'token' | 'signed-in' | readonly Role[];

/** A success answer that is not JSON (a PDF, a photo, a page): the handler writes it on `res` itself. */
export interface RawResponse {
  contentType: string;
  description: string;
}
/** A success answer with no body (204). */
export const NO_CONTENT = { noContent: true } as const;
export type ResponseDoc = z.ZodType | RawResponse | typeof NO_CONTENT;

/** A JSON answer with a status other than the route's usual one (a replayed request, a readiness check that fails). */
export class Reply<T> {
  constructor(
    readonly status: number,
    readonly body: T,
  ) {}
}

/** What a JSON route's handler returns when it has answered on `res` itself (or the client is gone). */
export const ANSWERED: unique symbol = Symbol('answered');

type Parsed<S> = S extends z.ZodType ? z.output<S> : undefined;
type UserFor<A> = A extends 'public' | 'optional' | 'token' ? AuthUser | undefined : AuthUser;
type Output<R> = R extends z.ZodType ? z.input<R> | Reply<z.input<R>> | typeof ANSWERED : void;

/** What a handler gets: the request parts already parsed by their schemas, and the caller. */
export interface RouteContext<P, Q, B, A> {
  params: Parsed<P>;
  query: Parsed<Q>;
  body: Parsed<B>;
  user: UserFor<A>;
  req: Request;
  res: Response;
}

/** One endpoint: how it is reached, who may call it, what it takes and answers, and its handler. */
export interface RouteSpec<P = unknown, Q = unknown, B = unknown, R = unknown, A extends Access = Access> {
  method: Method;
  /** The Express path below the group's prefix (`/:id/photo`). */
  path: string;
  summary: string;
  access: A;
  /** Overrides the "who" line of the docs when the handler narrows access further (owner or linked coach). */
  who?: string;
  params?: P;
  query?: Q;
  /** The body schema (documented and, without `bodyFor`, validated). */
  body?: B;
  /** Picks the schema that validates a body of two kinds, so field errors name the kind sent. */
  bodyFor?: (raw: unknown) => z.ZodType;
  /** Documented request headers (validated by the handler). */
  headers?: z.ZodObject;
  /** Middleware between the access check and validation (rate limits, a raw body parser). */
  before?: RequestHandler[];
  /** A multipart upload (`file`), read after validation. */
  upload?: RequestHandler;
  /** The success status (default 200, or 204 for NO_CONTENT). */
  status?: number;
  response: R & ResponseDoc;
  /** Other success statuses the handler may answer with through `Reply`. */
  alsoAnswers?: Record<number, string>;
  handler: (ctx: RouteContext<P, Q, B, A>) => Promise<Output<R>> | Output<R>;
}

/** A route of the table, its input types erased (what registration and the docs read). */
export type AnyRoute = RouteSpec<z.ZodType | undefined, z.ZodType | undefined, z.ZodType | undefined, ResponseDoc, Access>;

/** Declares one route; the handler's input and output types come from the schemas. */
export function route<
  P extends z.ZodType | undefined = undefined,
  Q extends z.ZodType | undefined = undefined,
  B extends z.ZodType | undefined = undefined,
  R extends ResponseDoc = ResponseDoc,
  const A extends Access = Access,
>(spec: RouteSpec<P, Q, B, R, A>): AnyRoute {
  return spec as unknown as AnyRoute;
}

/** The routes of one feature under one prefix. `guard` also answers unknown paths below the prefix (401/403 before 404). */
export interface RouteGroup {
  prefix: string;
  routes: AnyRoute[];
  guard?: RequestHandler[];
  /** Mounted before the JSON body parser (the payment webhook reads its body raw). */
  rawBody?: boolean;
  /** Development only: never mounted in production and not in the API document. */
  devOnly?: boolean;
}

export function accessMiddleware(access: Access): RequestHandler[] {
  if (access === 'public' || access === 'token') return [];
  if (access === 'optional') return [optionalAuth];
  if (access === 'signed-in') return [requireAuth];
  return [requireAuth, requireRole(...access)];
}

interface ParsedInput {
  params: unknown;
  query: unknown;
  body: unknown;
}

/** Parses params, query and body, reporting every bad field at once (400 validation_failed, `{ "body.email": … }`). */
function validateInput(r: AnyRoute): RequestHandler {
  return (req: Request, res: Response, next: NextFunction): void => {
    const fields: Record<string, string> = {};
    const input: ParsedInput = { params: undefined, query: undefined, body: undefined };
    const schemas = { params: r.params, query: r.query, body: r.bodyFor ? r.bodyFor(req.body ?? {}) : r.body };
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const raw: unknown = part === 'body' && req.body === undefined ? {} : req[part];
      const result = schema.safeParse(raw);
      if (result.success) input[part] = result.data;
      else Object.assign(fields, fieldErrors(part, result.error));
    }
    if (Object.keys(fields).length > 0) {
      next(AppError.badRequest('Some fields are not valid', fields));
      return;
    }
    res.locals.input = input;
    next();
  };
}

const isZod = (r: ResponseDoc): r is z.ZodType => typeof (r as { safeParse?: unknown }).safeParse === 'function';
const successStatus = (r: AnyRoute): number => r.status ?? ('noContent' in r.response ? 204 : 200);

function runHandler(r: AnyRoute): RequestHandler {
  return async (req: Request, res: Response): Promise<void> => {
    const input = res.locals.input as ParsedInput;
    const user = r.access === 'public' || r.access === 'optional' || r.access === 'token' ? req.user : currentUser(req);
    const out: unknown = await r.handler({ ...input, user, req, res } as RouteContext<unknown, unknown, unknown, Access> as never);
    if (res.headersSent || out === ANSWERED) return;
    if (out instanceof Reply) res.status(out.status).json(out.body);
    else if (isZod(r.response)) res.status(successStatus(r)).json(out);
    else res.status(successStatus(r)).end();
  };
}

/** The middleware chain of one route: access, `before`, validation, upload, handler. */
export function chainOf(r: AnyRoute): RequestHandler[] {
  return [...accessMiddleware(r.access), ...(r.before ?? []), validateInput(r), ...(r.upload ? [r.upload] : []), runHandler(r)];
}

/** An Express router serving one group's routes in table order, then its guard for unknown paths. */
export function groupRouter(group: RouteGroup): Router {
  const router = Router();
  for (const r of group.routes) router[r.method](r.path, ...chainOf(r));
  if (group.guard) router.use(...group.guard);
  return router;
}

/** The full Express path of a route of a group (`/api/arsenal/:id`). */
export const fullPath = (group: RouteGroup, r: AnyRoute): string => `/api${group.prefix}${r.path === '/' ? '' : r.path}`;
