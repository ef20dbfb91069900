import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, inject } from 'vitest';

// Runs in each test worker before a test file imports the server: point its config at the test database.
process.env.DATABASE_URL = inject('databaseUrl');
process.env.NODE_ENV = 'test';
// Card payments always go to the project's own fake in tests, whatever the shell has configured.
process.env.STRIPE_SECRET_KEY = '';
process.env.STRIPE_WEBHOOK_SECRET = '';
process.env.STRIPE_API_URL = '';
// No metrics endpoint unless a test file configures one (tests/api/platform/metrics.test.ts).
process.env.METRICS_TOKEN = '';
process.env.METRICS_PORT = '';
process.env.RATE_LIMIT_AUTH ??= '40';
process.env.UPLOAD_DIR ??= path.join(os.tmpdir(), `lanewright-test-uploads-${process.pid}`);
// The tests play a load balancer on loopback: each test names its client address in X-Forwarded-For
// (tests/api/auth/throttle.test.ts checks the default, where no proxy is trusted).
process.env.TRUST_PROXY ??= 'loopback';

// Rate-limit counters live in the shared database (so several API processes count together). Test files run one
// at a time; each starts with no counters, as each started with a fresh in-memory store before.
{
  const c = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await c.connect();
  await c.query('DELETE FROM rate_limit_hits').finally(() => c.end());
}

// At the end of each test file its process stops working the job queue, letting running jobs finish, so no job is
// left active for the next file's process to wait out (the queue's expiry).
afterAll(async () => {
  const { stopJobs } = await import('../../server/lib/jobs');
  await stopJobs(10000);
});
