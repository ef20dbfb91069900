// The job worker tier: `npm run worker` (built: `node dist/server/worker.js`). It works the mail, refund and
// calibration queues (server/lib/jobs.ts) and runs no HTTP API; start as many as needed beside the API
// processes (set JOBS_IN_PROCESS=false on those). SIGTERM lets running jobs finish (10 s at most).
import { startMetricsListener } from './features/health/health.routes';
import { closeEnginePool, warmEnginePool } from './lib/enginePool';
import { stopJobs } from './lib/jobs';
import { logger } from './lib/logger';
import { closeMailer } from './lib/mailer';
import { stopMailSender } from './lib/outbox';
import { closePayments } from './lib/payments';
import { startWorkers } from './lib/workers';
import { sequelize } from './models/index';

warmEnginePool();
await startWorkers();
logger.info({ pid: process.pid }, 'Lanewright job worker started');

// Metrics of this worker on their own loopback listener when METRICS_PORT is set.
const metricsServer = startMetricsListener();
process.send?.({ type: 'worker-ready' });

let stopping = false;
async function shutdown(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'worker shutting down');
  stopMailSender();
  metricsServer?.close();
  await stopJobs(10000);
  await Promise.allSettled([sequelize.close(), closeMailer(), closeEnginePool(), closePayments()]);
  process.exit(0);
}
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));
