/**
 * HTTP benchmarks (the second half of `npm run bench`): the real server on a throwaway PostgreSQL,
 * loaded with autocannon on loopback, each beside a bare-Express floor measured in the same run;
 * plus the client's initial JavaScript size. Figures are appended to bench/results.json under "http".
 *
 *  - POST /api/matchups for a 15-ball arsenal at 10 concurrent connections: p95 latency (target ≤ 300 ms)
 *  - GET /api/arsenal: requests per second (target ≥ 1000)
 *  - bare Express answering a fixed JSON body: the same machine's floor for both
 *  - the built client's initial JS (entry chunk + modulepreloads), kB gzip (target ≤ 350)
 */
import autocannon from 'autocannon';
import { spawn, spawnSync } from 'node:child_process';
import express from 'express';
import fs from 'node:fs';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import zlib from 'node:zlib';
import { productionEnv } from './lib/productionEnv';
import { freePort, makeTempClusterDir, startCluster, stopCluster } from '../scripts/lib/pg.mjs';

const here = path.dirname(fileURLToPath(import.meta.url));
const root = path.resolve(here, '..');
const bin = (b: string) => path.join(root, 'node_modules', '.bin', b);

function run(cmd: string, args: string[], env: NodeJS.ProcessEnv): void {
  const r = spawnSync(cmd, args, { cwd: root, env, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')} failed:\n${r.stdout}\n${r.stderr}`);
}

async function load(opts: autocannon.Options): Promise<autocannon.Result> {
  return new Promise((resolve, reject) => {
    autocannon(opts, (err, res) => (err ? reject(err) : resolve(res)));
  });
}

async function bareFloor(): Promise<{ rps: number; p95: number }> {
  const app = express();
  app.get('/x', (_req, res) => {
    res.json({ items: [], total: 0 });
  });
  const server = app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const { port } = server.address() as AddressInfo;
  const r = await load({ url: `http://127.0.0.1:${port}/x`, connections: 10, duration: 5 });
  server.close();
  return { rps: r.requests.average, p95: r.latency.p97_5 };
}

function clientInitialJsGzipKb(distDir: string): number {
  const html = fs.readFileSync(path.join(distDir, 'index.html'), 'utf8');
  const srcs = [...html.matchAll(/(?:src|href)="(\/assets\/[^"]+\.js)"/g)].map((m) => m[1]);
  let bytes = 0;
  for (const s of new Set(srcs)) bytes += zlib.gzipSync(fs.readFileSync(path.join(distDir, s))).length;
  return bytes / 1024;
}

async function main(): Promise<void> {
  const dir = makeTempClusterDir('lanewright-bench-');
  let server: ReturnType<typeof spawn> | null = null;
  try {
    const adminUrl = await startCluster({ dataDir: `${dir}/pg`, port: await freePort(), log: () => undefined });
    const env = productionEnv(adminUrl);
    run(bin('tsx'), ['server/db/migrate.ts', 'up'], env);
    run(bin('tsx'), ['seeders/index.ts'], { ...env, NODE_ENV: 'test' }); // the demo data, loaded as a test database would be (never into production)
    const distDir = path.join(root, 'dist', 'bench-client');
    run(bin('vite'), ['build', '--logLevel', 'error', '--outDir', distDir], env);
    const jsKb = clientInitialJsGzipKb(distDir);

    const floor = await bareFloor();

    const port = await freePort();
    server = spawn(bin('tsx'), ['server/index.ts'], { cwd: root, env: { ...env, PORT: String(port), CLIENT_DIST: distDir, RATE_LIMIT_AUTH: '100000' }, stdio: ['ignore', 'inherit', 'inherit'] });
    const base = `http://127.0.0.1:${port}`;
    for (let i = 0; i < 100; i++) {
      try {
        if ((await fetch(`${base}/api/health`)).ok) break;
      } catch {
        /* not up yet */
      }
      await new Promise((r) => setTimeout(r, 200));
    }
    const login = (await (await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'dana@copperline.example', password: 'lanewright-demo' }) })).json()) as { token: string };
    const auth = { authorization: `Bearer ${login.token}`, 'content-type': 'application/json' };
    // Bring dana's arsenal to 15 balls from the catalogue.
    const arsenal = (await (await fetch(`${base}/api/arsenal`, { headers: auth })).json()) as { total: number };
    const cat = (await (await fetch(`${base}/api/catalogue?pageSize=40`, { headers: auth })).json()) as { items: { id: number; coverType: string }[] };
    const extra = cat.items.filter((m) => m.coverType !== 'plastic').slice(0, Math.max(0, 15 - arsenal.total));
    for (const m of extra) await fetch(`${base}/api/arsenal`, { method: 'POST', headers: auth, body: JSON.stringify({ ballModelId: m.id, weightLb: 15, layout: { pinToPapIn: 4.5, drillingAngleDeg: 45 } }) });
    const patterns = (await (await fetch(`${base}/api/patterns`, { headers: auth })).json()) as { items: { id: number; name: string }[] };
    const heavy = patterns.items.find((p) => /Long/.test(p.name)) ?? patterns.items[0];

    // The list first, so no queued ranking from the matchup runs competes with it.
    const list = await load({ url: `${base}/api/arsenal`, headers: auth, connections: 10, duration: 10 });
    await load({ url: `${base}/api/matchups`, method: 'POST', headers: auth, body: JSON.stringify({ patternId: heavy.id }), connections: 2, duration: 2 }); // warm the workers
    const matchups = await load({ url: `${base}/api/matchups`, method: 'POST', headers: auth, body: JSON.stringify({ patternId: heavy.id }), connections: 10, duration: 10 });
    // Cold: every request a different input (games bowled in steps of 0.001), so the ranking cache never answers.
    let n = 0;
    const cold = await load({
      url: `${base}/api/matchups`,
      connections: 10,
      duration: 10,
      requests: [{ method: 'POST', headers: auth, setupRequest: (req) => ({ ...req, body: JSON.stringify({ patternId: heavy.id, gamesBowled: ((n++ % 29000) + 1) / 1000 }) }) }],
    });
    const errors = matchups.non2xx + list.non2xx + cold.non2xx + matchups.errors + list.errors + cold.errors;

    const http = [
      { name: 'POST /api/matchups (15 balls, 10 concurrent) p97.5, repeated input', value: matchups.latency.p97_5, unit: 'ms', target: '≤ 300 ms (p95)', floor: floor.p95, ok: matchups.latency.p97_5 <= 300 },
      { name: 'POST /api/matchups (15 balls, 10 concurrent) p97.5, cold (every input new)', value: cold.latency.p97_5, unit: 'ms', target: '≤ 300 ms (p95)', floor: floor.p95, ok: cold.latency.p97_5 <= 300 },
      { name: 'POST /api/matchups cold median latency', value: cold.latency.p50, unit: 'ms', target: null, floor: null, ok: null },
      { name: 'GET /api/arsenal requests/s (10 concurrent)', value: list.requests.average, unit: 'req/s', target: '≥ 1000', floor: floor.rps, ok: list.requests.average >= 1000 },
      { name: 'client initial JS (gzip)', value: jsKb, unit: 'kB', target: '≤ 350', floor: null, ok: jsKb <= 350 },
    ];
    console.log('\nHTTP (autocannon on loopback; floor = bare Express returning a fixed JSON, same run)');
    for (const h of http) console.log(`${h.name.padEnd(64)} ${h.value.toFixed(1).padStart(9)} ${h.unit.padEnd(6)} ${h.floor === null ? '' : `floor ${h.floor.toFixed(1)}`.padEnd(16)} ${h.target ?? ''} ${h.ok === null ? '' : h.ok ? 'ok' : 'MISSED'}`);
    if (errors) console.log(`non-2xx or errors during the load: ${errors}`);
    console.log('(autocannon reports p97.5, the nearest percentile it gives at or above p95.)');

    const file = path.join(here, 'results.json');
    const prev = fs.existsSync(file) ? (JSON.parse(fs.readFileSync(file, 'utf8')) as Record<string, unknown>) : {};
    fs.writeFileSync(file, `${JSON.stringify({ ...prev, http: { date: new Date().toISOString(), errors, results: http } }, null, 2)}\n`);
    console.log('wrote bench/results.json (http)');
  } finally {
    server?.kill('SIGTERM');
    await new Promise((r) => setTimeout(r, 500));
    stopCluster(`${dir}/pg`);
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

await main();
