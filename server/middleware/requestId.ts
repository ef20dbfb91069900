import crypto from 'node:crypto';
import type { NextFunction, Request, Response } from 'express';
import { logger, requestContext } from '../lib/logger';

/** A client-sent X-Request-Id is kept when it is short and plain (letters, digits, . _ : -); otherwise one is generated. */
export const SANE_REQUEST_ID = /^[A-Za-z0-9._:-]{8,128}$/;

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      requestId?: string;
    }
  }
}

/**
 * Gives every request an id: accepted from X-Request-Id when sane, else a new UUID; echoed in the
 * response's X-Request-Id and attached (through AsyncLocalStorage) to every log line written while the
 * request is served, including the one access-log line written when it ends.
 */
export function requestId(req: Request, res: Response, next: NextFunction): void {
  const sent = req.get('x-request-id');
  const id = sent && SANE_REQUEST_ID.test(sent) ? sent : crypto.randomUUID();
  req.requestId = id;
  res.setHeader('X-Request-Id', id);
  const started = process.hrtime.bigint();
  res.on('finish', () => {
    const ms = Number(process.hrtime.bigint() - started) / 1e6;
    const line = { method: req.method, path: req.originalUrl.split('?')[0], status: res.statusCode, ms: Math.round(ms * 10) / 10 };
    requestContext.run({ requestId: id }, () => {
      // 503 is the server shedding load or waiting for its database (expected, answered with Retry-After): a warning.
      if (res.statusCode === 503) logger.warn(line, 'request');
      else if (res.statusCode >= 500) logger.error(line, 'request');
      else logger.info(line, 'request');
    });
  });
  // A GET may read from a replica unless its user wrote a moment ago (auth.ts turns this off then).
  requestContext.run({ requestId: id, replicaReads: req.method === 'GET' || req.method === 'HEAD' }, () => next());
}
