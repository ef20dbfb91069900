import type { Socket } from 'node:net';
import { createApp } from './app';
import { config } from './config/index';
import { drainBackground } from './lib/background';
import { closeEnginePool, warmEnginePool } from './lib/enginePool';
import { closeMailer } from './lib/mailer';
import { stopChangeFeed } from './lib/changeFeed';
import { stopJobs } from './lib/jobs';
import { stopMailSender } from './lib/outbox';
import { startMetricsListener } from './features/health/health.routes';
import { markStopping } from './features/health/health.routes';
import { startWorkers } from './lib/workers';
import { logger } from './lib/logger';
import { closePayments, paymentFake, setPaymentWebhookTarget } from './lib/payments';
import { publicUrl, setListeningPort } from './lib/publicUrl';
import { sequelize } from './models/index';

const app = createApp();
warmEnginePool();
const server = app.listen(config.PORT, config.HOST, () => {
  const addr = server.address();
  const port = typeof addr === 'object' && addr ? addr.port : config.PORT;
  setListeningPort(port);
  logger.info(
    { url: `http://${config.HOST}:${port}`, publicUrl: publicUrl(), jwtSecret: config.jwtSecretSource },
    'Lanewright is listening',
  );
  // Without a configured payment key the local fake runs in-process and delivers its webhooks here.
  const fake = paymentFake();
  void (
    fake
      ? setPaymentWebhookTarget(
          `http://${['0.0.0.0', '::', ''].includes(config.HOST) ? '127.0.0.1' : config.HOST}:${port}/api/payments/webhook`,
        )
      : Promise.resolve()
  )
    .catch((err: unknown) => logger.error({ err }, 'the local payment fake did not start'))
    .finally(() => process.send?.({ type: 'listening', port }));
});
server.keepAliveTimeout = 5000;
// One process does it all by default; with a separate worker tier (npm run worker) set JOBS_IN_PROCESS=false.
if (config.JOBS_IN_PROCESS) {
  startWorkers().catch((err: unknown) => {
    logger.fatal({ err }, 'the job queue did not start (run `npm run db:migrate`)');
    process.exit(1);
  });
}
const metricsServer = startMetricsListener();

const sockets = new Set<Socket>();
server.on('connection', (s) => {
  sockets.add(s);
  s.on('close', () => sockets.delete(s));
});

let stopping = false;
/** Graceful shutdown: stop accepting, let in-flight requests finish (10 s at most), close the pool. */
async function shutdown(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  markStopping();
  logger.info({ signal }, 'shutting down');
  const force = setTimeout(() => {
    for (const s of sockets) s.destroy();
  }, 10000);
  force.unref();
  server.closeIdleConnections();
  await new Promise<void>((resolve) => server.close(() => resolve()));
  metricsServer?.close();
  await drainBackground();
  stopMailSender();
  await stopJobs(10000);
  await Promise.allSettled([sequelize.close(), closeMailer(), closeEnginePool(), closePayments(), stopChangeFeed()]);
  clearTimeout(force);
  process.exit(0);
}
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));
