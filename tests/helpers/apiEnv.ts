import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, inject } from 'vitest';
import { cloneDatabase, databaseUrl } from './database';

// Runs in each test worker before a test file imports the server: the file gets a database of its own, copied from
// the migrated template (a file-level copy, tens of milliseconds), so its rows and counts never meet another file's
// whatever order the files run in (`npm test -- --shuffle`). The copies go with the throwaway cluster at the end.
// TEST_SHARED_DB=1 puts every file on the one database instead, as a check that each test queries only its own rows.
process.env.DATABASE_URL =
  process.env.TEST_SHARED_DB === '1'
    ? databaseUrl(inject('pgAdminUrl'), inject('apiTemplate'))
    : (await cloneDatabase(inject('pgAdminUrl'), inject('apiTemplate'))).url;
process.env.NODE_ENV = 'test';
// Card payments always go to the project's own fake in tests, whatever the shell has configured.
process.env.STRIPE_SECRET_KEY = '';
process.env.STRIPE_WEBHOOK_SECRET = '';
process.env.STRIPE_API_URL = '';
// No metrics endpoint unless a test file configures one (tests/api/platform/metrics.test.ts).
process.env.METRICS_TOKEN = '';
process.env.METRICS_PORT = '';
// Free ports for the in-process mail capture and payment fake, even if the shell sets fixed ones for `npm start`.
process.env.DEV_SMTP_PORT = '0';
process.env.STRIPE_FAKE_PORT = '0';
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
