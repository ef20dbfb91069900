/**
 * What the HTTP, reliability and engine-load benchmarks share: a throwaway PostgreSQL with the schema and the demo
 * seed, the production server started on it and awaited, a demo bowler signed in, the cleanup, and the figures
 * written to bench/results.json under the benchmark's own key.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { freePort, makeTempClusterDir, startCluster, stopCluster } from '../../scripts/lib/pg.mjs';

const benchDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
export const root = path.resolve(benchDir, '..');
export const bin = (b: string) => path.join(root, 'node_modules', '.bin', b);

export function run(cmd: string, args: string[], env: NodeJS.ProcessEnv): void {
  const r = spawnSync(cmd, args, { cwd: root, env, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')} failed:\n${r.stdout}\n${r.stderr}`);
}

/** A throwaway PostgreSQL cluster in a temp dir of its own: its admin URL and the dir to remove afterwards. */
export async function throwawayCluster(prefix: string): Promise<{ dir: string; adminUrl: string }> {
  const dir = makeTempClusterDir(prefix);
  const adminUrl = await startCluster({ dataDir: `${dir}/pg`, port: await freePort(), log: () => undefined });
  return { dir, adminUrl };
}

/** Migrates the database of `env` and loads the demo data, as a test database would be (never into production). */
export function migrateAndSeed(env: NodeJS.ProcessEnv): void {
  run(bin('tsx'), ['server/db/migrate.ts', 'up'], env);
  run(bin('tsx'), ['seeders/index.ts'], { ...env, NODE_ENV: 'test' });
}

/**
 * Starts the API server (`tsx server/index.ts`, or `node --import tsx` so its pid is the server itself) and waits
 * until /api/health answers, at most `tries` × 200 ms. With `collect`, its output is kept for `output()`.
 */
export async function startServer(opts: {
  env: NodeJS.ProcessEnv;
  port: number;
  tries: number;
  ownPid?: boolean;
  collect?: boolean;
}): Promise<{ server: ChildProcess; base: string; output: () => string }> {
  const [cmd, args] = opts.ownPid ? [process.execPath, ['--import', 'tsx', 'server/index.ts']] : [bin('tsx'), ['server/index.ts']];
  const server = spawn(cmd, args, {
    cwd: root,
    env: { ...opts.env, PORT: String(opts.port) },
    stdio: ['ignore', opts.collect ? 'pipe' : 'inherit', opts.collect ? 'pipe' : 'inherit'],
  });
  let out = '';
  if (opts.collect) {
    server.stdout!.on('data', (d: Buffer) => (out += d.toString()));
    server.stderr!.on('data', (d: Buffer) => (out += d.toString()));
  }
  const base = `http://127.0.0.1:${opts.port}`;
  for (let i = 0; i < opts.tries; i++) {
    try {
      if ((await fetch(`${base}/api/health`)).ok) break;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  return { server, base, output: () => out };
}

/** The first error lines (pino level 50) of a server's output. */
export const serverErrors = (out: string) =>
  out
    .split('\n')
    .filter((x) => x.includes('"level":50'))
    .slice(0, 5)
    .join('\n');

/** Signs a demo account in: the headers of its JSON requests. */
export async function signIn(base: string, email: string): Promise<Record<string, string>> {
  const login = (await (
    await fetch(`${base}/api/auth/login`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email, password: 'lanewright-demo' }),
    })
  ).json()) as { token: string };
  return { authorization: `Bearer ${login.token}`, 'content-type': 'application/json' };
}

/** Stops the server, gives it `graceMs` to finish, then stops the cluster and removes its dir. */
export async function stopAll(server: ChildProcess | null, dir: string, graceMs: number): Promise<void> {
  server?.kill('SIGTERM');
  await new Promise((r) => setTimeout(r, graceMs));
  stopCluster(`${dir}/pg`);
  fs.rmSync(dir, { recursive: true, force: true });
}

/** Writes a benchmark's figures to bench/results.json under `key`, keeping the other benchmarks' figures. */
export function writeResults(key: string, figures: unknown): void {
  const file = path.join(benchDir, 'results.json');
  const prev = fs.existsSync(file) ? (JSON.parse(fs.readFileSync(file, 'utf8')) as Record<string, unknown>) : {};
  fs.writeFileSync(file, `${JSON.stringify({ ...prev, [key]: figures }, null, 2)}\n`);
  console.log(`wrote bench/results.json (${key})`);
}
