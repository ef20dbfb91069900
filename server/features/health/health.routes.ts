import crypto from 'node:crypto';
import http from 'node:http';
import nodemailer from 'nodemailer';
import { config } from '../../config/index';
import { AppError } from '../../lib/AppError';
import { mailCaptureEnabled } from '../../lib/mailer';
import { registry } from '../../lib/metrics';
import { logger } from '../../lib/logger';
import { pingPrimary } from '../../db/sequelize';
import { outboxSummary } from '../../lib/outbox';
import { Reply, route, type RouteGroup } from '../../http/route';
import { z } from 'zod';

let stopping = false;
/** Called when the process begins its graceful stop: readiness answers 503 so a load balancer drains it. */
export function markStopping(): void {
  stopping = true;
}

/** Liveness: the process answers (no dependency checked), so an orchestrator restarts only a hung process. */
const live = route({
  method: 'get',
  path: '/live',
  summary: 'Liveness: the process answers (no dependency checked)',
  access: 'public',
  response: z.object({ status: z.literal('ok') }),
  handler: () => ({ status: 'ok' as const }),
});

/**
 * Readiness: this process should get traffic — the primary answers and the process is not stopping. 503
 * otherwise (a load balancer takes it out of rotation; it comes back by itself).
 */
const ReadySchema = z.object({ status: z.enum(['ready', 'not_ready', 'stopping']), db: z.enum(['ok', 'unreachable']).optional() });
const ready = route({
  method: 'get',
  path: '/ready',
  summary: 'Readiness: the primary database answers and the process is not stopping (503 otherwise)',
  access: 'public',
  response: ReadySchema,
  alsoAnswers: { 503: 'Not ready: stopping, or the database does not answer' },
  handler: async () => {
    if (stopping) return new Reply(503, { status: 'stopping' as const });
    const db = await dbCheck();
    return db === 'ok' ? { status: 'ready' as const, db } : new Reply(503, { status: 'not_ready' as const, db });
  },
});

/** Constant-time comparison of a presented bearer token with METRICS_TOKEN. */
function tokenMatches(header: string | undefined): boolean {
  const sent = /^Bearer (.+)$/.exec(header ?? '')?.[1] ?? '';
  const want = config.METRICS_TOKEN ?? '';
  const a = crypto.createHash('sha256').update(sent).digest();
  const b = crypto.createHash('sha256').update(want).digest();
  return want.length > 0 && crypto.timingSafeEqual(a, b);
}

/**
 * Prometheus metrics for `Authorization: Bearer <METRICS_TOKEN>`: 404 while no token is configured (the route
 * does not exist then), 401 for a missing or wrong token.
 */
const metrics = route({
  method: 'get',
  path: '/metrics',
  summary: 'Prometheus metrics (text format); only with METRICS_TOKEN configured, for that bearer token',
  access: 'token',
  who: 'metrics token',
  response: { contentType: 'text/plain', description: 'The Prometheus text format' },
  handler: async ({ req, res }) => {
    if (!config.METRICS_TOKEN) throw AppError.notFound('Route');
    if (!tokenMatches(req.get('authorization'))) throw AppError.unauthorized('Send the metrics token as a bearer token');
    res.type(registry.contentType).send(await registry.metrics());
  },
});

/** With METRICS_PORT: /metrics on its own listener (METRICS_HOST, loopback by default), for a scraper on the same host or network. */
export function startMetricsListener(): http.Server | null {
  if (config.METRICS_PORT === undefined) return null;
  const srv = http.createServer((req, res) => {
    if (req.method !== 'GET' || req.url !== '/metrics') {
      res.writeHead(404).end();
      return;
    }
    registry.metrics().then(
      (body) => res.writeHead(200, { 'Content-Type': registry.contentType }).end(body),
      (err: unknown) => {
        logger.error({ err }, 'metrics failed');
        res.writeHead(500).end();
      },
    );
  });
  srv.listen(config.METRICS_PORT, config.METRICS_HOST, () =>
    logger.info({ host: config.METRICS_HOST, port: config.METRICS_PORT }, 'metrics listening'),
  );
  return srv;
}

const CHECK_TIMEOUT_MS = 3000;
/** The SMTP check opens a connection; its result is reused for a few seconds so polling health does not hammer the mail server. */
const MAIL_CHECK_TTL_MS = 2000;

function withTimeout<T>(p: Promise<T>, what: string): Promise<T> {
  return Promise.race([
    p,
    new Promise<never>((_, reject) => setTimeout(() => reject(new Error(`${what} timed out`)), CHECK_TIMEOUT_MS).unref()),
  ]);
}

let mailCheck: { at: number; result: Promise<'ok' | 'unreachable'> } | null = null;

/**
 * The mail server: with SMTP_URL, an SMTP connection and greeting (nodemailer's verify); in development
 * and tests the in-process capture server is always there ('ok', mode 'capture').
 */
function checkMail(): Promise<'ok' | 'unreachable'> {
  if (mailCaptureEnabled || !config.SMTP_URL) return Promise.resolve('ok');
  if (mailCheck && Date.now() - mailCheck.at < MAIL_CHECK_TTL_MS) return mailCheck.result;
  const t = nodemailer.createTransport({
    url: config.SMTP_URL,
    connectionTimeout: CHECK_TIMEOUT_MS,
    greetingTimeout: CHECK_TIMEOUT_MS,
    socketTimeout: CHECK_TIMEOUT_MS,
  } as Parameters<typeof nodemailer.createTransport>[0]);
  const result = withTimeout(t.verify(), 'mail check')
    .then(() => 'ok' as const)
    .catch(() => 'unreachable' as const)
    .finally(() => t.close());
  mailCheck = { at: Date.now(), result };
  return result;
}

/**
 * Liveness with its checks. `status` and `db` keep their meaning (an external monitor reads
 * `status: ok, db: ok`): 200 {status: ok, db: ok} or 503 {status: degraded, db: unreachable}. The mail
 * check is reported beside them and does not make the service degraded — mail waits in the outbox
 * (`outbox.pending`) and goes out when the mail server answers again.
 */
function dbCheck(): Promise<'ok' | 'unreachable'> {
  return withTimeout(pingPrimary(), 'database check').then(
    () => 'ok' as const,
    () => 'unreachable' as const,
  );
}

const HealthSchema = z.object({
  status: z.enum(['ok', 'degraded']),
  db: z.enum(['ok', 'unreachable']),
  mail: z.enum(['ok', 'unreachable']),
  mailMode: z.enum(['capture', 'smtp']),
  outbox: z
    .object({ pending: z.number().int(), failed: z.number().int(), oldestPendingSeconds: z.number().nullable() })
    .nullable()
    .optional(),
});

const health = route({
  method: 'get',
  path: '/',
  summary: 'Liveness and database reachability',
  access: 'public',
  response: HealthSchema,
  alsoAnswers: { 503: 'Degraded: the database does not answer' },
  handler: async () => {
    const [db, mail] = await Promise.all([dbCheck(), checkMail()]);
    const mailMode = mailCaptureEnabled || !config.SMTP_URL ? ('capture' as const) : ('smtp' as const);
    if (db !== 'ok') return new Reply(503, { status: 'degraded' as const, db: 'unreachable' as const, mail, mailMode });
    const outbox = await withTimeout(outboxSummary(), 'outbox check').catch(() => null);
    return { status: 'ok' as const, db: 'ok' as const, mail, mailMode, outbox };
  },
});

/** Health, liveness, readiness and metrics (public; metrics behind its own token). */
export const healthRoutes: RouteGroup = { prefix: '/health', routes: [health, live, ready, metrics] };
