// npm start: the demo with one command. Installs what is missing, starts the project's PostgreSQL, builds
// (dist/: the server bundled by esbuild, the client by Vite; only what changed), migrates, seeds
// (development only) and runs the built server with node — the same files production runs.
// With NODE_ENV=production nothing is seeded (the demo accounts' password is published) and the server's
// configuration check refuses to start without JWT_SECRET, PUBLIC_URL, DATABASE_URL, SMTP_URL and the payment keys.
import { spawn, spawnSync } from 'node:child_process';
import path from 'node:path';
import { buildServer } from './build.mjs';
import { buildClientIfStale, ensureNodeModules, root } from './lib/deps.mjs';
import { projectClusterDir, startCluster, stopCluster } from './lib/pg.mjs';

const log = (m) => console.log(`[lanewright] ${m}`);
const built = (name) => path.join(root, 'dist', 'server', `${name}.js`);

function runBuilt(name, args, env) {
  const r = spawnSync(process.execPath, ['--enable-source-maps', built(name), ...args], { cwd: root, env, stdio: 'inherit' });
  if (r.status !== 0) throw new Error(`${name} ${args.join(' ')} failed (exit ${r.status ?? r.signal})`);
}

try {
  ensureNodeModules(log);
  const env = { ...process.env };
  let ownCluster = null;
  if (!env.DATABASE_URL) {
    const port = Number(env.DB_PORT ?? 5433);
    const { dir, relocated } = projectClusterDir(root);
    if (relocated) log(`The postgres user cannot enter this checkout, so the project's cluster lives in ${dir}.`);
    env.DATABASE_URL = await startCluster({ dataDir: dir, port, log });
    ownCluster = dir;
    log(`PostgreSQL on 127.0.0.1:${port} (data in ${relocated ? dir : '.data/pg'})`);
  }
  await buildServer({ ifStale: true, log });
  buildClientIfStale(log);
  runBuilt('migrate', ['up'], env);
  if ((env.NODE_ENV || 'development') === 'development') runBuilt('seed', ['--print'], env);
  else log(`NODE_ENV=${env.NODE_ENV}: no demo data is seeded (npm run db:seed loads it into a development database).`);

  const server = spawn(process.execPath, ['--enable-source-maps', built('index')], {
    cwd: root,
    env,
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  });
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
      stopCluster(ownCluster);
      log(`PostgreSQL stopped; data kept in ${ownCluster}.`);
    }
    process.exit(code ?? 0);
  });
} catch (err) {
  console.error(`[lanewright] ${err instanceof Error ? err.message : err}`);
  process.exit(1);
}
