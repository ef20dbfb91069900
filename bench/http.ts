/**
 * HTTP benchmarks (the second half of `npm run bench`): the real server on a throwaway PostgreSQL,
 * loaded with autocannon on loopback, each beside a bare-Express floor measured in the same run;
 * plus the client's initial JavaScript size. Figures are appended to bench/results.json under "http".
 *
 *  - POST /api/matchups for a 15-ball arsenal at 10 concurrent connections: p95 latency, repeated input (≤ 300 ms)
 *    and cold, every input new (≤ 150 ms); the size of the answer (≤ 40 kB)
 *  - GET /api/arsenal: requests per second against bare Express answering the same body (≥ 0.5 ×), and for a
 *    bowler with 1 000 balls (≥ 0.3 ×); the load average is written beside the figures
 *  - GET /api/stats over 10 000 shots: the first request, 10 concurrent answered from what was kept and 10 concurrent
 *    each with a new filter (≤ 100 ms p95), GET /api/arsenal's p95 beside the latter (≤ 50 ms), the peak RSS (< 400 MB)
 *  - the built client's initial JS (entry chunk + modulepreloads), kB gzip (target ≤ 350)
 */
import autocannon from 'autocannon';
import { spawn, spawnSync } from 'node:child_process';
import express from 'express';
import fs from 'node:fs';
import type { AddressInfo } from 'node:net';
import nodeHttp from 'node:http';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
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

type Loaded = autocannon.Result & { p95: number };

/** autocannon, with the 95th percentile computed from every response's latency (autocannon itself reports p97.5). */
async function load(opts: autocannon.Options): Promise<Loaded> {
  const latencies: number[] = [];
  const result = await new Promise<autocannon.Result>((resolve, reject) => {
    const inst = autocannon(opts, (err, res) => (err ? reject(err) : resolve(res)));
    inst.on('response', (_c: unknown, _status: number, _bytes: number, ms: number) => latencies.push(ms));
  });
  latencies.sort((a, b) => a - b);
  const p95 = latencies.length ? latencies[Math.min(latencies.length - 1, Math.ceil(0.95 * latencies.length) - 1)] : NaN;
  return Object.assign(result, { p95 });
}

/** Bare Express answering `body` (the same JSON the route under test answers): this machine's floor, now. */
async function bareFloor(body: unknown): Promise<{ rps: number; p95: number }> {
  const app = express();
  app.get('/x', (_req, res) => {
    res.json(body);
  });
  const server = app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const { port } = server.address() as AddressInfo;
  const r = await load({ url: `http://127.0.0.1:${port}/x`, connections: 10, duration: 5 });
  server.close();
  return { rps: r.requests.average, p95: r.p95 };
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

    const port = await freePort();
    // ENGINE_QUEUE 16: all 10 connections' rankings wait their turn (the default, 8 per thread, refuses the tenth with
    // a fast 503 that would flatter the latency); the server's own log stays quiet below errors.
    // Started as `node --import tsx` so server.pid is the server itself (its peak memory is read from /proc).
    server = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
      cwd: root,
      env: { ...env, PORT: String(port), CLIENT_DIST: distDir, RATE_LIMIT_AUTH: '100000', ENGINE_QUEUE: '16', LOG_LEVEL: 'error' },
      stdio: ['ignore', 'inherit', 'inherit'],
    });
    const base = `http://127.0.0.1:${port}`;
    for (let i = 0; i < 100; i++) {
      try {
        if ((await fetch(`${base}/api/health`)).ok) break;
      } catch {
        /* not up yet */
      }
      await new Promise((r) => setTimeout(r, 200));
    }
    const signIn = async (email: string) => {
      const login = (await (
        await fetch(`${base}/api/auth/login`, {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({ email, password: 'lanewright-demo' }),
        })
      ).json()) as { token: string };
      return { authorization: `Bearer ${login.token}`, 'content-type': 'application/json' };
    };
    const auth = await signIn('dana@copperline.example');
    // Bring dana's arsenal to 15 balls from the catalogue.
    const arsenal = (await (await fetch(`${base}/api/arsenal`, { headers: auth })).json()) as { total: number };
    const cat = (await (await fetch(`${base}/api/catalogue?pageSize=40`, { headers: auth })).json()) as {
      items: { id: number; coverType: string }[];
    };
    const extra = cat.items.filter((m) => m.coverType !== 'plastic').slice(0, Math.max(0, 15 - arsenal.total));
    for (const m of extra)
      await fetch(`${base}/api/arsenal`, {
        method: 'POST',
        headers: auth,
        body: JSON.stringify({ ballModelId: m.id, weightLb: 15, layout: { pinToPapIn: 4.5, drillingAngleDeg: 45 } }),
      });
    const patterns = (await (await fetch(`${base}/api/patterns`, { headers: auth })).json()) as { items: { id: number; name: string }[] };
    const heavy = patterns.items.find((p) => /Long/.test(p.name)) ?? patterns.items[0];
    // A second bowler with 1 000 balls (copies of his own, written straight to the database).
    const big = await signIn('lee@copperline.example');
    const db = new pg.Client({ connectionString: adminUrl });
    await db.connect();
    await db.query(`INSERT INTO balls (owner_id, ball_model_id, name, maker, nickname, weight_lb, rg, differential, intermediate_differential, cover_type, core_type,
        hardness_d, approval_year, surface_grit, polished, layout, games_since_resurface, status, version, created_at, updated_at)
      SELECT b.owner_id, b.ball_model_id, b.name, b.maker, 'copy ' || g, b.weight_lb, b.rg, b.differential, b.intermediate_differential, b.cover_type, b.core_type,
        b.hardness_d, b.approval_year, b.surface_grit, b.polished, b.layout, g % 120, b.status, 0, now() - g * interval '1 minute', now()
      FROM (SELECT * FROM balls WHERE owner_id = (SELECT id FROM users WHERE email = 'lee@copperline.example') AND deleted_at IS NULL ORDER BY id LIMIT 1) b,
        generate_series(1, 1000 - (SELECT count(*)::int FROM balls WHERE owner_id = (SELECT id FROM users WHERE email = 'lee@copperline.example') AND deleted_at IS NULL)) g`);
    await db.end();

    // The lists first, so no queued ranking from the matchup runs competes with them; each beside bare Express
    // answering the very body the route answers, measured just before it.
    const listBody = await (await fetch(`${base}/api/arsenal`, { headers: auth })).json();
    const bigBody = (await (await fetch(`${base}/api/arsenal`, { headers: big })).json()) as { total: number };
    const floor = await bareFloor(listBody);
    const list = await load({ url: `${base}/api/arsenal`, headers: auth, connections: 10, duration: 10 });
    const floorBig = await bareFloor(bigBody);
    const listBig = await load({ url: `${base}/api/arsenal`, headers: big, connections: 10, duration: 10 });

    await load({
      url: `${base}/api/matchups`,
      method: 'POST',
      headers: auth,
      body: JSON.stringify({ patternId: heavy.id }),
      connections: 2,
      duration: 2,
    }); // warm the workers
    const matchups = await load({
      url: `${base}/api/matchups`,
      method: 'POST',
      headers: auth,
      body: JSON.stringify({ patternId: heavy.id }),
      connections: 10,
      duration: 10,
    });
    // Cold: every request a different input (games bowled in steps of 0.001), so the ranking cache never answers.
    let n = 0;
    const cold = await load({
      url: `${base}/api/matchups`,
      connections: 10,
      duration: 10,
      requests: [
        {
          method: 'POST',
          headers: auth,
          setupRequest: (req) => ({ ...req, body: JSON.stringify({ patternId: heavy.id, gamesBowled: ((n++ % 29000) + 1) / 1000 }) }),
        },
      ],
    });
    // The answer's size: its JSON, and the bytes on the wire for a client that accepts gzip (every browser).
    const wire = await new Promise<Buffer>((resolve, reject) => {
      const req = nodeHttp.request(`${base}/api/matchups`, { method: 'POST', headers: { ...auth, 'accept-encoding': 'gzip' } }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => resolve(Buffer.concat(chunks)));
      });
      req.on('error', reject);
      req.end(JSON.stringify({ patternId: heavy.id, gamesBowled: 29.5 }));
    });
    const answerKb = wire.length / 1024;
    const answerJsonKb = zlib.gunzipSync(wire).length / 1024;
    // Statistics over 10 000 logged shots (lee's: copies of a demo session's games, written straight to the database).
    const db2 = new pg.Client({ connectionString: adminUrl });
    await db2.connect();
    const template = (
      await db2.query<{ id: number; pattern_id: number | null; n: number }>(
        'SELECT s.id, s.pattern_id, count(*)::int AS n FROM sessions s JOIN shots sh ON sh.session_id = s.id WHERE s.deleted_at IS NULL GROUP BY s.id ORDER BY n DESC LIMIT 1',
      )
    ).rows[0];
    const copies = Math.ceil(10000 / template.n);
    await db2.query(
      `WITH lee AS (SELECT u.id AS uid, (SELECT min(b.id) FROM balls b WHERE b.owner_id = u.id) AS ball FROM users u WHERE u.email = 'lee@copperline.example'),
       made AS (INSERT INTO sessions (user_id, date, kind, pattern_id, notes, version, created_at, updated_at)
         SELECT lee.uid, date '2025-01-01' + g, 'practice', $2, '', 0, now(), now() FROM lee, generate_series(1, $3) g RETURNING id)
       INSERT INTO shots (session_id, game_number, frame, delivery, ball_id, surface_grit, surface_polished, surface_key, feet_board, target_board, breakpoint_board,
         standing, foul, hit, note, idempotency_key, request_hash, response, created_at, updated_at)
       SELECT made.id, t.game_number, t.frame, t.delivery, lee.ball, t.surface_grit, t.surface_polished, t.surface_key, t.feet_board, t.target_board, t.breakpoint_board,
         t.standing, t.foul, t.hit, '', 'bench-' || made.id || '-' || t.id, '', '{}'::jsonb, now(), now()
       FROM made, lee, shots t WHERE t.session_id = $1`,
      [template.id, template.pattern_id, copies],
    );
    const statShots = Number(
      (
        await db2.query(
          `SELECT count(*)::int AS n FROM shots sh JOIN sessions s ON s.id = sh.session_id JOIN users u ON u.id = s.user_id WHERE u.email = 'lee@copperline.example' AND s.deleted_at IS NULL`,
        )
      ).rows[0].n,
    );
    await db2.end();
    const peakRssMb = () => {
      const m = /VmHWM:\s+(\d+) kB/.exec(fs.readFileSync(`/proc/${server!.pid}/status`, 'utf8'));
      return m ? Number(m[1]) / 1024 : NaN;
    };
    // Linux: writing 5 to clear_refs resets the peak (VmHWM), so the stats load's own peak is read apart.
    const rssBeforeStatsMb = peakRssMb();
    try {
      fs.writeFileSync(`/proc/${server.pid}/clear_refs`, '5');
    } catch {
      /* not allowed here: the peak then covers the whole run */
    }
    // The first request computes (off the main thread); the ones after it are answered from what was kept.
    const t0 = performance.now();
    const firstStats = await fetch(`${base}/api/stats`, { headers: big });
    const statsColdMs = performance.now() - t0;
    if (!firstStats.ok) throw new Error(`GET /api/stats answered ${firstStats.status}`);
    const statsWarm = await load({ url: `${base}/api/stats`, headers: big, connections: 10, duration: 10 });
    // Every request a different filter (a later `to` date), so every one computes: another route timed alongside.
    let day = 0;
    const statsColdLoad = load({
      url: `${base}/api/stats`,
      connections: 10,
      duration: 10,
      requests: [
        {
          method: 'GET',
          headers: big,
          setupRequest: (req) => ({
            ...req,
            path: `/api/stats?to=${new Date(Date.UTC(2030, 0, 1) + day++ * 86400000).toISOString().slice(0, 10)}`,
          }),
        },
      ],
    });
    const beside = await load({ url: `${base}/api/arsenal`, headers: auth, connections: 1, duration: 10 });
    const statsCold = await statsColdLoad;
    const rssMb = peakRssMb();

    const errors = [matchups, list, listBig, cold, statsWarm, statsCold, beside].reduce((n, r) => n + r.non2xx + r.errors, 0);
    const ratio = (x: number, f: number) => Math.round((x / f) * 1000) / 1000;

    const http = [
      {
        name: 'POST /api/matchups (15 balls, 10 concurrent) p95, repeated input',
        value: matchups.p95,
        unit: 'ms',
        target: '≤ 300 ms',
        floor: floor.p95,
        ratio: null,
        ok: matchups.p95 <= 300,
      },
      {
        name: 'POST /api/matchups (15 balls, 10 concurrent) p95, cold (every input new)',
        value: cold.p95,
        unit: 'ms',
        target: '≤ 150 ms',
        floor: floor.p95,
        ratio: null,
        ok: cold.p95 <= 150,
      },
      {
        name: 'POST /api/matchups cold median latency',
        value: cold.latency.p50,
        unit: 'ms',
        target: null,
        floor: null,
        ratio: null,
        ok: null,
      },
      {
        name: 'POST /api/matchups cold requests/s',
        value: cold.requests.average,
        unit: 'req/s',
        target: null,
        floor: null,
        ratio: null,
        ok: null,
      },
      {
        name: 'POST /api/matchups answer (15 balls), gzip on the wire',
        value: answerKb,
        unit: 'kB',
        target: '≤ 40 kB',
        floor: null,
        ratio: null,
        ok: answerKb <= 40,
      },
      {
        name: 'POST /api/matchups answer (15 balls), JSON',
        value: answerJsonKb,
        unit: 'kB',
        target: null,
        floor: null,
        ratio: null,
        ok: null,
      },
      {
        name: `GET /api/arsenal requests/s (10 concurrent, ${(listBody as { total: number }).total} balls)`,
        value: list.requests.average,
        unit: 'req/s',
        target: '≥ 0.5 × floor',
        floor: floor.rps,
        ratio: ratio(list.requests.average, floor.rps),
        ok: list.requests.average >= 0.5 * floor.rps,
      },
      {
        name: `GET /api/arsenal requests/s (10 concurrent, ${bigBody.total} balls)`,
        value: listBig.requests.average,
        unit: 'req/s',
        target: '≥ 0.3 × floor',
        floor: floorBig.rps,
        ratio: ratio(listBig.requests.average, floorBig.rps),
        ok: listBig.requests.average >= 0.3 * floorBig.rps,
      },
      {
        name: `GET /api/stats (${statShots} shots), first request (computes)`,
        value: statsColdMs,
        unit: 'ms',
        target: null,
        floor: null,
        ratio: null,
        ok: null,
      },
      {
        name: `GET /api/stats (${statShots} shots, 10 concurrent) p95, kept`,
        value: statsWarm.p95,
        unit: 'ms',
        target: '≤ 100 ms',
        floor: floor.p95,
        ratio: null,
        ok: statsWarm.p95 <= 100,
      },
      {
        name: `GET /api/stats (${statShots} shots, 10 concurrent) p95, every filter new`,
        value: statsCold.p95,
        unit: 'ms',
        target: '≤ 100 ms',
        floor: floor.p95,
        ratio: null,
        ok: statsCold.p95 <= 100,
      },
      {
        name: 'GET /api/stats every filter new: requests/s',
        value: statsCold.requests.average,
        unit: 'req/s',
        target: null,
        floor: null,
        ratio: null,
        ok: null,
      },
      {
        name: 'GET /api/arsenal p95 beside 10 stats computing',
        value: beside.p95,
        unit: 'ms',
        target: '≤ 50 ms',
        floor: floor.p95,
        ratio: null,
        ok: beside.p95 <= 50,
      },
      {
        name: 'server peak RSS (VmHWM) during the stats loads',
        value: rssMb,
        unit: 'MB',
        target: '< 400 MB',
        floor: null,
        ratio: null,
        ok: rssMb < 400,
      },
      {
        name: 'server peak RSS (VmHWM) before them (lists, matchups)',
        value: rssBeforeStatsMb,
        unit: 'MB',
        target: null,
        floor: null,
        ratio: null,
        ok: null,
      },
      { name: 'client initial JS (gzip)', value: jsKb, unit: 'kB', target: '≤ 350', floor: null, ratio: null, ok: jsKb <= 350 },
    ];
    const loadAvg = os.loadavg().map((x) => Math.round(x * 100) / 100);
    console.log(
      `\nHTTP (autocannon on loopback; floor = bare Express answering the same body, same run; load average ${loadAvg.join(' ')})`,
    );
    for (const h of http)
      console.log(
        `${h.name.padEnd(72)} ${h.value.toFixed(1).padStart(9)} ${h.unit.padEnd(6)} ${h.floor === null ? ''.padEnd(16) : `floor ${h.floor.toFixed(1)}`.padEnd(16)} ${h.ratio === null ? ''.padEnd(9) : `${h.ratio.toFixed(3)} ×`.padEnd(9)} ${h.target ?? ''} ${h.ok === null ? '' : h.ok ? 'ok' : 'MISSED'}`,
      );
    if (errors) console.log(`non-2xx or errors during the load: ${errors}`);

    const file = path.join(here, 'results.json');
    const prev = fs.existsSync(file) ? (JSON.parse(fs.readFileSync(file, 'utf8')) as Record<string, unknown>) : {};
    fs.writeFileSync(
      file,
      `${JSON.stringify({ ...prev, http: { date: new Date().toISOString(), loadAverage: loadAvg, cores: os.cpus().length, errors, results: http } }, null, 2)}\n`,
    );
    console.log('wrote bench/results.json (http)');
  } finally {
    server?.kill('SIGTERM');
    await new Promise((r) => setTimeout(r, 500));
    stopCluster(`${dir}/pg`);
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

await main();
