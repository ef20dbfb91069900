// npm run db:migrate | db:seed | worker: runs the built file (dist/server/<name>.js) when the build is current,
// else (development, with development dependencies installed) the TypeScript source through tsx.
// Production installs build first (`npm run build`) and may run `node dist/server/<name>.js` directly.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { newestMtime, root } from './lib/deps.mjs';

const SOURCES = { migrate: 'server/db/migrate.ts', seed: 'seeders/index.ts', worker: 'server/worker.ts', index: 'server/index.ts' };
const [name, ...args] = process.argv.slice(2);
if (!SOURCES[name]) {
  console.error(`usage: node scripts/run.mjs ${Object.keys(SOURCES).join('|')} [args]`);
  process.exit(2);
}
const built = path.join(root, 'dist', 'server', `${name}.js`);
const stamp = path.join(root, 'dist', 'server', '.built');
const current =
  fs.existsSync(built) && fs.existsSync(stamp) && fs.statSync(stamp).mtimeMs > newestMtime(['server', 'engine', 'shared', 'seeders']);
const tsx = path.join(root, 'node_modules', '.bin', 'tsx');
let r;
if (current || !fs.existsSync(tsx)) {
  if (!fs.existsSync(built)) {
    console.error(`dist/server/${name}.js is missing: run \`npm run build\` first.`);
    process.exit(1);
  }
  r = spawnSync(process.execPath, ['--enable-source-maps', built, ...args], { cwd: root, stdio: 'inherit' });
} else {
  r = spawnSync(tsx, [SOURCES[name], ...args], { cwd: root, stdio: 'inherit' });
}
process.exit(r.status ?? 1);
