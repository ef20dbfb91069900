// npm test: every check on a throwaway PostgreSQL — type-check, lint, then Vitest (engine, API, browser).
// The cluster lives in a temp dir on a free loopback port and is always stopped and removed.
import { spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import { ensureNodeModules, root, runBin } from './lib/deps.mjs';
import { freePort, makeTempClusterDir, startCluster, stopCluster } from './lib/pg.mjs';

const log = (m) => console.log(`[test] ${m}`);
const args = process.argv.slice(2);
const quick = args.includes('--quick'); // skip type-check and lint

/**
 * `--shuffle` runs the test files in a random order (Vitest's sequence.shuffle.files) to hunt tests that depend on
 * what another file left behind; `--seed N` (or TEST_SEED=N) replays one order, and implies --shuffle. TEST_SHUFFLE=1
 * does the same as --shuffle. Without a seed one is drawn and printed, so a failing order can be run again.
 */
function shuffleArgs(list) {
  const rest = [];
  let shuffle = process.env.TEST_SHUFFLE === '1' || process.env.TEST_SHUFFLE === 'true';
  let seed = process.env.TEST_SEED || null;
  for (let i = 0; i < list.length; i++) {
    const a = list[i];
    if (a === '--shuffle') shuffle = true;
    else if (a === '--seed') seed = list[++i] ?? '';
    else if (a.startsWith('--seed=')) seed = a.slice('--seed='.length);
    else rest.push(a);
  }
  if (seed !== null && !/^\d+$/.test(seed)) {
    console.error(`[test] --seed takes a whole number (got "${seed}")`);
    process.exit(2);
  }
  if (!shuffle && seed === null) return { rest, order: [] };
  seed ??= String(Math.floor(Math.random() * 1e6));
  log(`Test files in a random order, seed ${seed} (replay it: npm test -- --seed ${seed})`);
  return { rest, order: ['--sequence.shuffle.files', `--sequence.seed=${seed}`] };
}
const { rest, order } = shuffleArgs(args.filter((a) => a !== '--quick'));
const vitestArgs = [...order, ...rest];

function ensureChromium() {
  if (fs.existsSync('/usr/bin/chromium')) return;
  log('Chromium not found; installing Debian package "chromium" …');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  spawnSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  const r = spawnSync('apt-get', ['install', '-y', '-qq', 'chromium', 'fonts-dejavu-core'], { stdio: 'inherit', env });
  if (r.status !== 0 || !fs.existsSync('/usr/bin/chromium'))
    throw new Error('Could not install Chromium with apt-get; browser tests need /usr/bin/chromium.');
}

let dir = null;
let cleaned = false;
function cleanup() {
  if (cleaned || !dir) return;
  cleaned = true;
  try {
    stopCluster(`${dir}/pg`);
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}
process.on('exit', cleanup);
for (const sig of ['SIGINT', 'SIGTERM', 'SIGHUP']) {
  process.on(sig, () => {
    cleanup();
    process.exit(130);
  });
}

try {
  ensureNodeModules(log);
  ensureChromium();
  if (!quick) {
    log('Type-checking (vue-tsc) …');
    runBin('vue-tsc', ['--noEmit', '-p', 'tsconfig.json']);
    log('Linting (eslint) …');
    runBin('eslint', ['.', '--max-warnings=0']);
    log('Checking formatting (prettier) …');
    runBin('prettier', ['--check', '.', '--log-level', 'warn']);
  }
  dir = makeTempClusterDir('lanewright-test-');
  const port = await freePort();
  const url = await startCluster({ dataDir: `${dir}/pg`, port, database: 'postgres_admin', log });
  log(`Throwaway PostgreSQL on 127.0.0.1:${port}`);
  const env = { ...process.env, TEST_PG_ADMIN_URL: url, NODE_ENV: 'test' };
  const child = spawn(`${root}/node_modules/.bin/vitest`, ['run', ...vitestArgs], { cwd: root, env, stdio: 'inherit' });
  const code = await new Promise((resolve) => child.on('exit', (c, s) => resolve(c ?? (s ? 1 : 0))));
  cleanup();
  process.exit(code);
} catch (err) {
  console.error(`[test] ${err instanceof Error ? err.message : err}`);
  cleanup();
  process.exit(1);
}
