import crypto from 'node:crypto';
import PgBoss from 'pg-boss';
import type { Transaction } from 'sequelize';
import { config } from '../config/index';
import { logger } from './logger';

/**
 * The job queue: pg-boss on the project's PostgreSQL (schema `pgboss`). Jobs are inserted in the same
 * transaction as their cause (the transactional-outbox pattern, common practice), fetched with
 * `FOR UPDATE SKIP LOCKED` by any number of worker processes, retried with exponential backoff, and a job
 * whose worker died is expired and retried after its `expireInSeconds` (pg-boss's maintenance). Job ids are
 * derived from what the job is about, so sending the same job twice inserts it once.
 *
 * Queues:
 *  - `mail`: one outbox row (claim, commit, send, mark; server/lib/outbox.ts);
 *  - `refund`: an automatic refund of a payment that must not stand (the payment service's idempotency key
 *    makes a retried job refund once);
 *  - `calibration`: the fit of one bowler on one pattern, stored for readers (policy `stately`: at most one
 *    queued and one running per bowler and pattern, so a burst of logged shots costs one or two fits).
 */
export type QueueName = 'mail' | 'refund' | 'calibration';

export const QUEUES: Record<QueueName, PgBoss.Queue & { expireInSeconds: number }> = {
  mail: { name: 'mail', policy: 'standard', retryLimit: 9, retryDelay: 5, retryBackoff: true, expireInSeconds: 60 },
  refund: { name: 'refund', policy: 'standard', retryLimit: 20, retryDelay: 10, retryBackoff: true, expireInSeconds: 120 },
  calibration: { name: 'calibration', policy: 'stately', retryLimit: 3, retryDelay: 5, retryBackoff: true, expireInSeconds: 300 },
};

export const JOB_SCHEMA = 'pgboss';

/** A job id (UUID form) derived from its queue and key: the same key always gives the same id. */
export function jobId(queue: QueueName, key: string): string {
  const h = crypto.createHash('sha256').update(`${queue}:${key}`).digest('hex');
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-4${h.slice(13, 16)}-a${h.slice(17, 20)}-${h.slice(20, 32)}`;
}

function newBoss(opts: { supervise: boolean; migrate: boolean }): PgBoss {
  const boss = new PgBoss({
    connectionString: config.databaseUrl,
    schema: JOB_SCHEMA,
    application_name: 'lanewright-jobs',
    max: config.JOBS_POOL_MAX,
    migrate: opts.migrate,
    supervise: opts.supervise,
    schedule: false,
    maintenanceIntervalSeconds: config.JOBS_MAINTENANCE_SECONDS,
  });
  boss.on('error', (err) => logger.error({ err }, 'job queue error'));
  return boss;
}

/** Creates (or updates) the job schema and the queues: run by `npm run db:migrate`, under its advisory lock. */
export async function installJobSchema(): Promise<void> {
  const boss = newBoss({ supervise: false, migrate: true });
  await boss.start();
  try {
    for (const q of Object.values(QUEUES)) {
      if (await boss.getQueue(q.name)) await boss.updateQueue(q.name, q);
      else await boss.createQueue(q.name, q);
    }
  } finally {
    await boss.stop({ graceful: false, wait: true });
  }
}

let boss: PgBoss | null = null;
/** Whether this process runs pg-boss's maintenance (expiring jobs of dead workers, archiving): processes that work queues do. */
let supervise = false;
export function superviseJobs(): void {
  supervise = true;
}
let starting: Promise<PgBoss> | null = null;
const workerIds = new Map<QueueName, string[]>();

/** The process's queue client (started on first use; it never migrates: `npm run db:migrate` does). */
export function jobs(): Promise<PgBoss> {
  if (boss) return Promise.resolve(boss);
  starting ??= (async () => {
    const b = newBoss({ supervise, migrate: false });
    await b.start();
    if (!(await b.getQueue('mail'))) throw new Error('the job queue is not installed: run `npm run db:migrate`');
    boss = b;
    return b;
  })().catch((err: unknown) => {
    starting = null;
    throw err;
  });
  return starting;
}

/** Sends a job, inside `transaction` when given (it is then committed or rolled back with it). Returns whether it was new. */
export async function sendJob(
  queue: QueueName,
  key: string,
  data: object,
  opts: { transaction?: Transaction; startAfterSeconds?: number; singletonKey?: string } = {},
): Promise<boolean> {
  const b = await jobs();
  const q = QUEUES[queue];
  // The transaction's own connection (Sequelize keeps the pg client on it), so the job commits with the cause.
  const conn = (
    opts.transaction as unknown as { connection?: { query: (text: string, values: unknown[]) => Promise<{ rows: unknown[] }> } } | undefined
  )?.connection;
  const id = await b.send(queue, data, {
    id: jobId(queue, key),
    expireInSeconds: config.JOBS_EXPIRE_SECONDS ?? q.expireInSeconds,
    ...(opts.singletonKey ? { singletonKey: opts.singletonKey } : {}),
    ...(opts.startAfterSeconds ? { startAfter: opts.startAfterSeconds } : {}),
    ...(conn ? { db: { executeSql: (text: string, values: unknown[]) => conn.query(text, values) as Promise<{ rows: unknown[] }> } } : {}),
  });
  const wake = () => {
    for (const w of workerIds.get(queue) ?? []) boss?.notifyWorker(w);
  };
  if (opts.transaction) opts.transaction.afterCommit(wake);
  else wake();
  return id !== null;
}

export type JobHandler = (data: Record<string, unknown>, job: PgBoss.JobWithMetadata<Record<string, unknown>>) => Promise<unknown>;

/** Hooks for metrics (set by server/lib/metrics.ts). */
export const jobEvents = { onDone: (_q: QueueName, _ms: number) => undefined as void, onFailed: (_q: QueueName) => undefined as void };

/** Works a queue in this process with `concurrency` workers; a handler that throws fails the job (retried per the queue). */
export async function workQueue(queue: QueueName, concurrency: number, handler: JobHandler): Promise<void> {
  const b = await jobs();
  for (let i = 0; i < concurrency; i++) {
    const id = await b.work<Record<string, unknown>>(
      queue,
      { batchSize: 1, includeMetadata: true, pollingIntervalSeconds: config.JOBS_POLL_SECONDS },
      async ([job]) => {
        const started = Date.now();
        try {
          const out = await handler(job.data, job);
          jobEvents.onDone(queue, Date.now() - started);
          return out;
        } catch (err) {
          jobEvents.onFailed(queue);
          logger.warn({ err, queue, jobId: job.id, retry: job.retryCount }, 'job failed; it will be retried');
          throw err;
        }
      },
    );
    workerIds.set(queue, [...(workerIds.get(queue) ?? []), id]);
  }
}

/** Jobs waiting (created or retrying) per queue: health and metrics. */
export async function queueDepths(): Promise<Record<QueueName, number>> {
  const b = await jobs();
  const out = {} as Record<QueueName, number>;
  for (const q of Object.keys(QUEUES) as QueueName[]) out[q] = await b.getQueueSize(q);
  return out;
}

/** Stops the workers (waiting up to `timeoutMs` for running jobs) and the queue client. */
export async function stopJobs(timeoutMs = 10000): Promise<void> {
  const b = boss;
  boss = null;
  starting = null;
  workerIds.clear();
  if (b)
    await b
      .stop({ graceful: true, wait: true, timeout: timeoutMs })
      .catch((err: unknown) => logger.warn({ err }, 'job queue did not stop cleanly'));
}
