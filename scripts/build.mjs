// npm run build: the production build in dist/.
//   dist/server/  the API server (index.js), the job worker (worker.js), migrations (migrate.js), the demo seed
//                 (seed.js) and the ranking thread (engineWorker.js), bundled by esbuild into plain JavaScript
//                 that `node` runs (no TypeScript compiler at run time). Packages stay in node_modules.
//                 Development-only code (the mail capture server, the payment fake, the dev mailbox) is split into
//                 chunks that only a dynamic import outside production loads.
//   dist/client/  the Vue client (vite build).
// Flags: --server (server only), --client (client only), --if-stale (skip what is newer than its sources).
import fs from 'node:fs';
import path from 'node:path';
import { buildClientIfStale, ensureNodeModules, newestMtime, root, runBin } from './lib/deps.mjs';

const log = (m) => console.log(`[build] ${m}`);
const args = process.argv.slice(2);
const only = args.includes('--server') ? 'server' : args.includes('--client') ? 'client' : null;
const ifStale = args.includes('--if-stale');

export const SERVER_OUT = path.join(root, 'dist', 'server');
const ENTRIES = {
  index: 'server/index.ts',
  worker: 'server/worker.ts',
  migrate: 'server/db/migrate.ts',
  seed: 'seeders/index.ts',
  engineWorker: 'server/lib/engineWorker.ts',
};

function serverStale() {
  const stamp = path.join(SERVER_OUT, '.built');
  if (!fs.existsSync(stamp)) return true;
  const built = fs.statSync(stamp).mtimeMs;
  return (
    Math.max(newestMtime(['server', 'engine', 'shared', 'seeders']), fs.statSync(path.join(root, 'package-lock.json')).mtimeMs) >= built
  );
}

async function buildServer(opts = { ifStale, log }) {
  const say = opts.log ?? log;
  if (opts.ifStale && !serverStale()) return false;
  say('Building the server (esbuild) …');
  const started = Date.now();
  const { build } = await import(path.join(root, 'node_modules', 'esbuild', 'lib', 'main.js'));
  fs.rmSync(SERVER_OUT, { recursive: true, force: true });
  await build({
    absWorkingDir: root,
    entryPoints: Object.fromEntries(Object.entries(ENTRIES).map(([k, v]) => [k, path.join(root, v)])),
    outdir: SERVER_OUT,
    bundle: true,
    splitting: true,
    format: 'esm',
    platform: 'node',
    target: 'node20',
    packages: 'external',
    sourcemap: 'linked',
    chunkNames: 'chunks/[name]-[hash]',
    legalComments: 'none',
    logLevel: 'warning',
  });
  fs.writeFileSync(path.join(SERVER_OUT, 'package.json'), '{ "type": "module" }\n');
  fs.writeFileSync(path.join(SERVER_OUT, '.built'), `${new Date().toISOString()}\n`);
  say(`Server built into dist/server in ${Date.now() - started} ms.`);
  return true;
}

const isMain = process.argv[1] && path.resolve(process.argv[1]) === path.resolve(new URL(import.meta.url).pathname);
if (isMain) {
  try {
    ensureNodeModules(log);
    if (only !== 'client') await buildServer({ ifStale, log });
    if (only !== 'server') {
      if (ifStale) buildClientIfStale(log);
      else {
        log('Building the client (vite build) …');
        runBin('vite', ['build', '--logLevel', 'warn']);
      }
    }
  } catch (err) {
    console.error(`[build] ${err instanceof Error ? err.message : err}`);
    process.exit(1);
  }
}

export { buildServer };
