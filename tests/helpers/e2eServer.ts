import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, inject } from 'vitest';
import { cloneDatabase, dropDatabase, root } from './database';

/**
 * Runs before each browser test file (a setup file of the `e2e` project): the file gets the real server of its own,
 * on a copy of the seeded demo database (`CREATE DATABASE … TEMPLATE`, tens of milliseconds) and the client built
 * once by the global setup. The file reads the server's address with `appUrl()` (tests/e2e/browser.ts); after the
 * file the server is stopped and its database dropped.
 */
const adminUrl = inject('pgAdminUrl');
const db = await cloneDatabase(adminUrl, inject('e2eTemplate'));
const uploads = fs.mkdtempSync(path.join(os.tmpdir(), 'lanewright-e2e-uploads-'));

const server: ChildProcess = spawn(path.join(root, 'node_modules', '.bin', 'tsx'), ['server/index.ts'], {
  cwd: root,
  env: {
    ...process.env,
    DATABASE_URL: db.url,
    NODE_ENV: 'test',
    PORT: '0',
    DEV_SMTP_PORT: '0',
    STRIPE_FAKE_PORT: '0',
    CLIENT_DIST: inject('e2eClientDist'),
    UPLOAD_DIR: uploads,
    RATE_LIMIT_AUTH: '500',
    LOG_LEVEL: 'warn',
    STRIPE_SECRET_KEY: '',
    STRIPE_WEBHOOK_SECRET: '',
    STRIPE_API_URL: '',
  },
  stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
});
const exited = new Promise<void>((resolve) => server.once('exit', () => resolve()));

async function stopServer(): Promise<void> {
  if (server.exitCode !== null || server.signalCode !== null) return;
  server.kill('SIGTERM'); // a graceful stop: in-flight requests finish, 10 s at most (server/index.ts)
  const killer = setTimeout(() => server.kill('SIGKILL'), 20000);
  await exited;
  clearTimeout(killer);
}

// The server says when it listens (and on which port) over the IPC channel; a loaded machine may take a while.
let port: number;
try {
  port = await new Promise<number>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error('the server did not start within 120 s')), 120000);
    server.on('message', (m: { type?: string; port?: number }) => {
      if (m?.type === 'listening' && m.port) {
        clearTimeout(timer);
        resolve(m.port);
      }
    });
    void exited.then(() => reject(new Error(`the server exited before listening (code ${server.exitCode})`)));
  });
} catch (err) {
  await stopServer();
  await dropDatabase(adminUrl, db.name);
  throw err;
}
process.env.LW_E2E_BASE_URL = `http://127.0.0.1:${port}`;

afterAll(async () => {
  await stopServer();
  await dropDatabase(adminUrl, db.name);
  fs.rmSync(uploads, { recursive: true, force: true });
}, 60000);
