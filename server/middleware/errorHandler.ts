import type { NextFunction, Request, Response } from 'express';
import { AppError } from '../lib/AppError';
import { logger } from '../lib/logger';

interface HttpishError {
  status?: number;
  statusCode?: number;
  type?: string;
  expose?: boolean;
  message?: string;
}

/** PostgreSQL error classes meaning "the server is not there right now": connection exception (08…), shutdown / cannot connect now (57P01–57P03), too many connections (53300). */
const PG_UNAVAILABLE_CODE = /^(08|57P0[1-3]$|53300$)/;
/** What node-postgres says when the connection under a query died (the server stopped or restarted). */
const CONNECTION_LOST =
  /Connection terminated|connection error and is not queryable|Client was closed and is not queryable|ECONNREFUSED|ECONNRESET|EPIPE|terminating connection/i;

function isDbUnavailable(err: unknown): boolean {
  const name = (err as { name?: string })?.name ?? '';
  if (/Sequelize(Connection\w*Error|HostNotReachableError|AccessDeniedError)|ConnectionAcquireTimeoutError/.test(name)) return true;
  // A query whose connection was cut while it ran surfaces as a plain DatabaseError around the driver's error.
  if (!/^Sequelize/.test(name)) return false;
  const cause = (err as { parent?: { code?: unknown; message?: unknown } }).parent;
  const code = typeof cause?.code === 'string' ? cause.code : '';
  const message = typeof cause?.message === 'string' ? cause.message : '';
  return PG_UNAVAILABLE_CODE.test(code) || CONNECTION_LOST.test(message);
}

/** The one error handler: AppError → its status; body-parser errors → 400/413; database down → 503; anything else → a logged 500 with a generic message. */
export function errorHandler(err: unknown, req: Request, res: Response, next: NextFunction): void {
  if (res.headersSent) {
    next(err);
    return;
  }
  if (err instanceof AppError) {
    if (err.retryAfterS !== undefined) res.setHeader('Retry-After', String(Math.max(1, Math.ceil(err.retryAfterS))));
    res.status(err.status).json({ error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) } });
    return;
  }
  const e = err as HttpishError;
  const status = e?.status ?? e?.statusCode;
  if (e?.type === 'entity.too.large' || status === 413) {
    res.status(413).json({ error: { code: 'payload_too_large', message: 'The request body is too large' } });
    return;
  }
  if (e?.type === 'entity.parse.failed') {
    res.status(400).json({ error: { code: 'malformed_json', message: 'The request body is not valid JSON' } });
    return;
  }
  if (typeof status === 'number' && status >= 400 && status < 500 && e.expose !== false) {
    res
      .status(status)
      .json({ error: { code: e.type?.replace(/\./g, '_') ?? 'bad_request', message: 'The request could not be processed' } });
    return;
  }
  if ((err as { name?: string })?.name === 'SequelizeOptimisticLockError') {
    // Two requests saved the same versioned row at once and this one lost: a conflict, not a server fault.
    res.status(409).json({
      error: { code: 'stale_version', message: 'This record was changed by another request at the same time; reload it and try again' },
    });
    return;
  }
  if ((err as { name?: string })?.name === 'SequelizeUniqueConstraintError') {
    // Two requests created the same unique row at once and this one lost (the services use INSERT … ON CONFLICT
    // where a race is expected; anything left is a conflict to retry, not a server fault).
    res
      .status(409)
      .json({ error: { code: 'conflict', message: 'This record was created by another request at the same time; reload and try again' } });
    return;
  }
  if (isDbUnavailable(err)) {
    logger.warn({ err, path: req.path }, 'database unavailable');
    res.status(503).json({ error: { code: 'service_unavailable', message: 'The service is temporarily unavailable; try again shortly' } });
    return;
  }
  logger.error({ err, method: req.method, path: req.path }, 'unhandled error');
  res.status(500).json({ error: { code: 'internal_error', message: 'Something went wrong on our side' } });
}

/** Unknown API routes answer 404 in the error shape. */
export function notFound(req: Request, res: Response): void {
  res.status(404).json({ error: { code: 'not_found', message: `No route for ${req.method} ${req.originalUrl.split('?')[0]}` } });
}
