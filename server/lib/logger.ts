import { AsyncLocalStorage } from 'node:async_hooks';
import pino from 'pino';
import { config } from '../config/index';

/** Per-request context (set by the requestId middleware): every log line written while serving a request carries its id. */
export const requestContext = new AsyncLocalStorage<{ requestId: string; replicaReads?: boolean }>();

/** The server's one logger (JSON lines; quiet in tests unless LOG_LEVEL says otherwise). */
export const logger = pino({
  level: config.LOG_LEVEL,
  redact: ['req.headers.authorization', 'password', 'passwordHash', '*.password'],
  mixin: () => {
    const ctx = requestContext.getStore();
    return ctx ? { requestId: ctx.requestId } : {};
  },
});
