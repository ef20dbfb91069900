import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import type { TestProject } from 'vitest/node';
import { freshDatabase, root, runTsx, throwawayCluster } from './database';

/**
 * Global setup of the browser tests: database `lw_e2e` with the demo seed, the client built by Vite,
 * and the real server listening on a free loopback port; its URL is provided as `baseUrl`.
 */
export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  const cluster = await throwawayCluster();
  const url = await freshDatabase(cluster.adminUrl, 'lw_e2e');
  runTsx(['seeders/index.ts'], url);
  const distDir = path.join(root, 'dist', `e2e-client-${process.pid}`);
  const build = spawnSync(path.join(root, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'error', '--outDir', distDir], { cwd: root, encoding: 'utf8' });
  if (build.status !== 0) throw new Error(`vite build failed:\n${build.stdout}\n${build.stderr}`);

  const server: ChildProcess = spawn(path.join(root, 'node_modules', '.bin', 'tsx'), ['server/index.ts'], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: url, NODE_ENV: 'test', PORT: '0', CLIENT_DIST: distDir, RATE_LIMIT_AUTH: '500', LOG_LEVEL: 'warn', STRIPE_SECRET_KEY: '', STRIPE_WEBHOOK_SECRET: '', STRIPE_API_URL: '' },
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  });
  const port = await new Promise<number>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error('the server did not start within 60 s')), 60000);
    server.on('message', (m: { type?: string; port?: number }) => {
      if (m?.type === 'listening' && m.port) {
        clearTimeout(timer);
        resolve(m.port);
      }
    });
    server.on('exit', (code) => reject(new Error(`the server exited early (code ${code})`)));
  });
  // The seed asked for the demo's calibration fits; the server works them in a few seconds. The browser tests start
  // once they are stored, as a demo user would find them a moment after `npm start`.
  const db = new pg.Client({ connectionString: url });
  await db.connect();
  try {
    const deadline = Date.now() + 120000;
    for (;;) {
      const { rows } = await db.query<{ n: string }>("SELECT count(*) AS n FROM pgboss.job WHERE name = 'calibration' AND state IN ('created', 'retry', 'active')");
      if (Number(rows[0].n) === 0) break;
      if (Date.now() > deadline) throw new Error('the demo calibration fits were not done within 120 s');
      await new Promise((r) => setTimeout(r, 200));
    }
  } finally {
    await db.end();
  }
  project.provide('baseUrl', `http://127.0.0.1:${port}`);
  project.provide('databaseUrl', url);

  return async () => {
    server.kill('SIGTERM');
    await new Promise((r) => server.once('exit', r));
    fs.rmSync(distDir, { recursive: true, force: true });
    cluster.stop();
  };
}
