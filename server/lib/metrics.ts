import type { NextFunction, Request, Response } from 'express';
import client from 'prom-client';
import { jobEvents, queueDepths, type QueueName } from './jobs';

/**
 * Prometheus metrics (prom-client): request durations by route, job-queue depth, job durations and failures,
 * ranking and calibration-fit times, and Node's default process metrics. Served at /api/health/metrics behind
 * METRICS_TOKEN, and/or on their own loopback listener (METRICS_PORT); see server/features/health.
 */
export const registry = new client.Registry();
client.collectDefaultMetrics({ register: registry, prefix: 'lanewright_' });

const buckets = [0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10];

export const httpDuration = new client.Histogram({
  name: 'lanewright_http_request_duration_seconds',
  help: 'HTTP request duration by method, route (the Express path) and status class',
  labelNames: ['method', 'route', 'status'] as const,
  buckets,
  registers: [registry],
});

export const rankingSeconds = new client.Histogram({
  name: 'lanewright_ranking_seconds',
  help: 'Time of one arsenal ranking in the engine threads',
  buckets,
  registers: [registry],
});
export const calibrationFitSeconds = new client.Histogram({
  name: 'lanewright_calibration_fit_seconds',
  help: 'Time of one calibration fit (job worker)',
  buckets,
  registers: [registry],
});

const jobSeconds = new client.Histogram({
  name: 'lanewright_job_duration_seconds',
  help: 'Job run time by queue',
  labelNames: ['queue'] as const,
  buckets,
  registers: [registry],
});
const jobFailures = new client.Counter({
  name: 'lanewright_job_failures_total',
  help: 'Job runs that failed (each is retried per its queue)',
  labelNames: ['queue'] as const,
  registers: [registry],
});
jobEvents.onDone = (q: QueueName, ms: number) => jobSeconds.observe({ queue: q }, ms / 1000);
jobEvents.onFailed = (q: QueueName) => jobFailures.inc({ queue: q });

new client.Gauge({
  name: 'lanewright_job_queue_depth',
  help: 'Jobs waiting (created or retrying) per queue',
  labelNames: ['queue'] as const,
  registers: [registry],
  async collect() {
    try {
      for (const [q, n] of Object.entries(await queueDepths())) this.set({ queue: q }, n);
    } catch {
      /* the queue is unreachable: the gauge keeps its last values */
    }
  },
});

/** Times every request; the label is the matched Express route (never the raw URL, whose ids would explode the series). */
export function metricsMiddleware(req: Request, res: Response, next: NextFunction): void {
  const end = httpDuration.startTimer();
  res.on('finish', () => {
    const route = req.route?.path
      ? `${req.baseUrl}${typeof req.route.path === 'string' ? req.route.path : ''}`
      : req.path.startsWith('/api/')
        ? 'unmatched'
        : 'static';
    end({ method: req.method, route, status: `${Math.floor(res.statusCode / 100)}xx` });
  });
  next();
}
