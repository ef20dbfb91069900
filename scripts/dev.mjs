// npm run dev: the API with reload (tsx watch) and Vite's dev server with HMR, proxied to the API.
import { spawn } from 'node:child_process';
import path from 'node:path';
import { ensureNodeModules, root, runBin } from './lib/deps.mjs';
import { projectClusterDir, startCluster, stopCluster } from './lib/pg.mjs';

const dataDir = projectClusterDir(root).dir;
ensureNodeModules();
const env = { ...process.env, PORT: process.env.PORT ?? '3000' };
let ownCluster = false;
if (!env.DATABASE_URL) {
  env.DATABASE_URL = await startCluster({ dataDir, port: Number(env.DB_PORT ?? 5433) });
  ownCluster = true;
}
runBin('tsx', ['server/db/migrate.ts', 'up'], { env });
runBin('tsx', ['seeders/index.ts'], { env });
const bin = (b) => path.join(root, 'node_modules', '.bin', b);
const api = spawn(bin('tsx'), ['watch', '--clear-screen=false', 'server/index.ts'], { cwd: root, env, stdio: 'inherit' });
const web = spawn(bin('vite'), [], { cwd: root, env, stdio: 'inherit' });
let exiting = false;
const stop = () => {
  if (exiting) return;
  exiting = true;
  api.kill('SIGTERM');
  web.kill('SIGTERM');
  setTimeout(() => {
    if (ownCluster) stopCluster(dataDir);
    process.exit(0);
  }, 1500);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
api.on('exit', stop);
web.on('exit', stop);
