import { spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import type { TestProject } from 'vitest/node';
import { freshDatabase, root, runTsx, throwawayCluster } from './database';
import './apiSetup'; // the ProvidedContext keys

/** The template every browser test file's server gets its own copy of. */
export const E2E_TEMPLATE = 'lw_e2e';

/**
 * Global setup of the browser tests: database `lw_e2e` migrated and seeded with the demo data, and the client built
 * once by Vite. Neither is used directly: each browser test file starts the real server on its own copy of the
 * seeded database (tests/helpers/e2eServer.ts), so what one file does to the demo accounts (a role changed, a ball
 * resurfaced, a profile saved) is never seen by another, whatever order the files run in.
 */
export default async function setup(project: TestProject): Promise<() => void> {
  const cluster = await throwawayCluster();
  const url = await freshDatabase(cluster.adminUrl, E2E_TEMPLATE);
  runTsx(['seeders/index.ts'], url);
  const distDir = path.join(root, 'dist', `e2e-client-${process.pid}`);
  const build = spawnSync(path.join(root, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'error', '--outDir', distDir], {
    cwd: root,
    encoding: 'utf8',
  });
  if (build.status !== 0) throw new Error(`vite build failed:\n${build.stdout}\n${build.stderr}`);
  project.provide('pgAdminUrl', cluster.adminUrl);
  project.provide('e2eTemplate', E2E_TEMPLATE);
  project.provide('e2eClientDist', distDir);

  // The seed asked for the demo's calibration fits. A job worker works them on the template once, and stops (so no
  // connection stays open on it): every file's copy starts with the fits stored, as a demo user finds them a moment
  // after `npm start`.
  await workCalibrationFits(url);

  return () => {
    fs.rmSync(distDir, { recursive: true, force: true });
    cluster.stop();
  };
}

/** Runs the job worker on `url` until no calibration fit is waiting or running, then stops it. */
async function workCalibrationFits(url: string): Promise<void> {
  const worker = spawn(path.join(root, 'node_modules', '.bin', 'tsx'), ['server/worker.ts'], {
    cwd: root,
    env: {
      ...process.env,
      DATABASE_URL: url,
      NODE_ENV: 'test',
      DEV_SMTP_PORT: '0',
      STRIPE_FAKE_PORT: '0',
      LOG_LEVEL: 'warn',
      STRIPE_SECRET_KEY: '',
      STRIPE_WEBHOOK_SECRET: '',
      STRIPE_API_URL: '',
    },
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  });
  const exited = new Promise<void>((resolve) => worker.once('exit', () => resolve()));
  const db = new pg.Client({ connectionString: url });
  await db.connect();
  try {
    const deadline = Date.now() + 180000;
    for (;;) {
      const { rows } = await db.query<{ n: string }>(
        "SELECT count(*) AS n FROM pgboss.job WHERE name = 'calibration' AND state IN ('created', 'retry', 'active')",
      );
      if (Number(rows[0].n) === 0) break;
      if (worker.exitCode !== null)
        throw new Error(`the job worker exited (code ${worker.exitCode}) before the demo calibration fits were done`);
      if (Date.now() > deadline) throw new Error('the demo calibration fits were not done within 180 s');
      await new Promise((r) => setTimeout(r, 200));
    }
  } finally {
    await db.end();
    if (worker.exitCode === null) worker.kill('SIGTERM');
    await exited;
  }
}
