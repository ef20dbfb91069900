// npm start: install what is missing, start the project's PostgreSQL, migrate, seed (development only), build, serve.
// With NODE_ENV=production nothing is seeded (the demo accounts' password is published) and the server's
// configuration check refuses to start without JWT_SECRET, PUBLIC_URL, DATABASE_URL, SMTP_URL and the payment keys.
import { spawn } from 'node:child_process';
import path from 'node:path';
import { buildClientIfStale, ensureNodeModules, root, runBin } from './lib/deps.mjs';
import { startCluster, stopCluster } from './lib/pg.mjs';

const log = (m) => console.log(`[lanewright] ${m}`);
const dataDir = path.join(root, '.data', 'pg');

try {
  ensureNodeModules(log);
  const env = { ...process.env };
  let ownCluster = false;
  if (!env.DATABASE_URL) {
    const port = Number(env.DB_PORT ?? 5433);
    env.DATABASE_URL = await startCluster({ dataDir, port, log });
    ownCluster = true;
    log(`PostgreSQL on 127.0.0.1:${port} (data in .data/pg)`);
  }
  runBin('tsx', ['server/db/migrate.ts', 'up'], { env });
  if ((env.NODE_ENV || 'development') === 'development') runBin('tsx', ['seeders/index.ts', '--print'], { env });
  else log(`NODE_ENV=${env.NODE_ENV}: no demo data is seeded (npm run db:seed loads it into a development database).`);
  buildClientIfStale(log);

  const server = spawn(path.join(root, 'node_modules', '.bin', 'tsx'), ['server/index.ts'], { cwd: root, env, stdio: ['ignore', 'inherit', 'inherit', 'ipc'] });
  server.on('message', (m) => {
    if (m && m.type === 'listening') log(`Open http://127.0.0.1:${m.port} — Ctrl-C stops.`);
  });
  let stopping = false;
  const stop = (sig) => {
    if (stopping) return;
    stopping = true;
    log('Stopping …');
    server.kill(sig);
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));
  server.on('exit', (code) => {
    if (ownCluster) {
      stopCluster(dataDir);
      log('PostgreSQL stopped; data kept in .data/pg.');
    }
    process.exit(code ?? 0);
  });
} catch (err) {
  console.error(`[lanewright] ${err instanceof Error ? err.message : err}`);
  process.exit(1);
}
