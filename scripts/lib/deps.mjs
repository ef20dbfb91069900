// Installs npm dependencies on a fresh clone, before anything else needs them.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

export const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..', '..');

/** Runs `npm ci` when node_modules is missing or older than package-lock.json. */
export function ensureNodeModules(log = console.log) {
  const nm = path.join(root, 'node_modules');
  const lock = path.join(root, 'package-lock.json');
  const marker = path.join(nm, '.package-lock.json');
  const stale = fs.existsSync(lock) && fs.existsSync(marker) && fs.statSync(lock).mtimeMs > fs.statSync(marker).mtimeMs + 1000;
  if (fs.existsSync(nm) && !stale) return;
  log(stale ? 'package-lock.json changed; reinstalling dependencies (npm ci) …' : 'Installing dependencies (npm ci) …');
  // Development dependencies too, whatever NODE_ENV says: the build (esbuild, Vite) needs them.
  const r = spawnSync('npm', ['ci', '--no-audit', '--no-fund', '--include=dev'], { cwd: root, stdio: 'inherit' });
  if (r.status !== 0) throw new Error('npm ci failed');
}

/** Runs a command from node_modules/.bin in the project root; throws when it fails. */
export function runBin(bin, args, opts = {}) {
  const r = spawnSync(path.join(root, 'node_modules', '.bin', bin), args, { cwd: root, stdio: 'inherit', ...opts });
  if (r.status !== 0) throw new Error(`${bin} ${args.join(' ')} failed (exit ${r.status ?? r.signal})`);
}

/** Newest modification time of any file under the given folders (skipping node_modules). */
export function newestMtime(dirs) {
  let newest = 0;
  const walk = (d) => {
    if (!fs.existsSync(d)) return;
    for (const e of fs.readdirSync(d, { withFileTypes: true })) {
      if (e.name === 'node_modules' || e.name.startsWith('.')) continue;
      const p = path.join(d, e.name);
      if (e.isDirectory()) walk(p);
      else newest = Math.max(newest, fs.statSync(p).mtimeMs);
    }
  };
  for (const d of dirs) walk(path.join(root, d));
  return newest;
}

/** Builds the client with Vite when dist/client is missing or older than its sources. */
export function buildClientIfStale(log = console.log) {
  const index = path.join(root, 'dist', 'client', 'index.html');
  const built = fs.existsSync(index) ? fs.statSync(index).mtimeMs : 0;
  const sources = Math.max(
    newestMtime(['client', 'shared', 'engine']),
    fs.statSync(path.join(root, 'vite.config.ts')).mtimeMs,
    fs.statSync(path.join(root, 'package-lock.json')).mtimeMs,
  );
  if (built > sources) return false;
  log('Building the client (vite build) …');
  runBin('vite', ['build', '--logLevel', 'warn']);
  return true;
}
