/**
 * The statistics page under load (part of `npm run bench`): the production build (`node dist/server/index.js`, built
 * here with `node scripts/build.mjs --server`) on a throwaway PostgreSQL with the demo seed and a bowler with about
 * 10 000 logged shots. Written to bench/results.json under "stats":
 *  - the first GET /api/stats (counts every game of the season once: shot_aggregates were empty);
 *  - GET /api/stats one at a time, every request a new filter (nothing kept): p95 and median per request (≤ 100 ms),
 *    and the server's CPU time per request (user + system of all its threads, from /proc: far less sensitive to other
 *    processes on the machine than wall-clock latency — the verdict's figure on a shared machine);
 *  - 10 concurrent, every request a new filter, for 10 s: p95, requests/s, and GET /api/arsenal's p95 alongside
 *    (≤ 50 ms), with the server's peak RSS over that load (VmHWM reset before it; < 400 MB);
 *  - beside each latency the floor of this run: bare Express answering the same body (its p95 at 10 concurrent).
 * Timings are wall-clock on loopback and move with the machine's load (printed beside them).
 */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { migrateAndSeed, root, run, signIn, stopAll, throwawayCluster, writeResults } from './lib/benchServer';
import { tenThousandShots } from './lib/httpData';
import { bareFloor, load, type Loaded } from './lib/httpLoad';
import { productionEnv } from './lib/productionEnv';
import { freePort } from '../scripts/lib/pg.mjs';

const TICKS = 100; // USER_HZ on Linux: /proc/<pid>/stat counts CPU time in 1/100 s

/** User + system CPU time of a process (all its threads), ms. */
function cpuMs(pid: number): number {
  const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
  const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  return ((Number(fields[11]) + Number(fields[12])) * 1000) / TICKS;
}

/** The peak (VmHWM) or current (VmRSS) resident memory of a process, MB. */
function rssOf(pid: number, field: 'VmHWM' | 'VmRSS'): number {
  const m = new RegExp(`${field}:\\s+(\\d+) kB`).exec(fs.readFileSync(`/proc/${pid}/status`, 'utf8'));
  return m ? Number(m[1]) / 1024 : NaN;
}

const pct = (xs: number[], p: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.ceil(p * s.length) - 1)];
};

async function main(): Promise<void> {
  run(process.execPath, ['scripts/build.mjs', '--server', '--if-stale'], process.env);
  const { dir, adminUrl } = await throwawayCluster('lanewright-bench-stats-');
  let server: ChildProcess | null = null;
  try {
    const env = productionEnv(adminUrl);
    migrateAndSeed(env);
    const statShots = await tenThousandShots(adminUrl);
    const port = await freePort();
    server = spawn(process.execPath, [path.join(root, 'dist', 'server', 'index.js')], {
      cwd: root,
      env: { ...env, PORT: String(port), RATE_LIMIT_AUTH: '100000', LOG_LEVEL: 'error' },
      stdio: ['ignore', 'inherit', 'inherit'],
    });
    const base = `http://127.0.0.1:${port}`;
    for (let i = 0; i < 150; i++) {
      try {
        if ((await fetch(`${base}/api/health`)).ok) break;
      } catch {
        /* not up yet */
      }
      await new Promise((r) => setTimeout(r, 200));
    }
    const pid = server.pid!;
    const idleRssMb = rssOf(pid, 'VmRSS');
    const big = await signIn(base, 'lee@copperline.example');
    const other = await signIn(base, 'dana@copperline.example');

    // The first request: the season's games are counted once (on the stats thread).
    let t0 = performance.now();
    const first = await fetch(`${base}/api/stats`, { headers: big });
    const firstMs = performance.now() - t0;
    if (!first.ok) throw new Error(`GET /api/stats answered ${first.status}`);
    const body = (await first.json()) as { item: { overall: { shots: number } } };
    if (body.item.overall.shots !== statShots) throw new Error(`GET /api/stats counted ${body.item.overall.shots} of ${statShots} shots`);

    // One at a time, every request a new filter (a later `to` date), so nothing kept answers.
    let day = 0;
    const nextFilter = () => `/api/stats?to=${new Date(Date.UTC(2030, 0, 1) + day++ * 86400000).toISOString().slice(0, 10)}`;
    for (let i = 0; i < 5; i++) await fetch(`${base}${nextFilter()}`, { headers: big }); // warm the route and the stats thread
    const single: number[] = [];
    const cpuBefore = cpuMs(pid);
    const SINGLE = 60;
    for (let i = 0; i < SINGLE; i++) {
      t0 = performance.now();
      const r = await fetch(`${base}${nextFilter()}`, { headers: big });
      await r.arrayBuffer();
      if (!r.ok) throw new Error(`GET /api/stats answered ${r.status}`);
      single.push(performance.now() - t0);
    }
    const cpuPerRequestMs = (cpuMs(pid) - cpuBefore) / SINGLE;

    // Ten at once, every request a new filter, with another route timed alongside; the peak RSS of that load alone.
    const rssBeforeLoadMb = rssOf(pid, 'VmRSS');
    try {
      fs.writeFileSync(`/proc/${pid}/clear_refs`, '5');
    } catch {
      /* not allowed here: the peak then covers the whole run */
    }
    const concurrentLoad = load({
      url: `${base}/api/stats`,
      connections: 10,
      duration: 10,
      requests: [{ method: 'GET', headers: big, setupRequest: (req) => ({ ...req, path: nextFilter() }) }],
    });
    const beside = await load({ url: `${base}/api/arsenal`, headers: other, connections: 1, duration: 10 });
    const concurrent: Loaded = await concurrentLoad;
    const rssMb = rssOf(pid, 'VmHWM');

    const statsBody = await (await fetch(`${base}/api/stats`, { headers: big })).json();
    const floor = await bareFloor(statsBody);
    const arsenalBody = await (await fetch(`${base}/api/arsenal`, { headers: other })).json();
    const floorArsenal = await bareFloor(arsenalBody);
    const errors = concurrent.non2xx + concurrent.errors + beside.non2xx + beside.errors;
    const ratio = (x: number, f: number) => Math.round((x / f) * 1000) / 1000;
    const results = [
      {
        name: `GET /api/stats (${statShots} shots), first request (counts every game once)`,
        value: firstMs,
        unit: 'ms',
        target: null,
        floor: null,
        ratio: null,
        ok: null,
      },
      {
        name: `GET /api/stats (${statShots} shots) p95 per request, one at a time, every filter new`,
        value: pct(single, 0.95),
        unit: 'ms',
        target: '≤ 100 ms',
        floor: floor.p95,
        ratio: ratio(pct(single, 0.95), floor.p95),
        ok: pct(single, 0.95) <= 100,
      },
      {
        name: 'GET /api/stats median per request, one at a time',
        value: pct(single, 0.5),
        unit: 'ms',
        target: null,
        floor: null,
        ratio: null,
        ok: null,
      },
      {
        name: 'server CPU time per GET /api/stats (all threads, /proc)',
        value: cpuPerRequestMs,
        unit: 'ms',
        target: '≤ 100 ms',
        floor: null,
        ratio: null,
        ok: cpuPerRequestMs <= 100,
      },
      {
        name: `GET /api/stats (${statShots} shots, 10 concurrent, every filter new) p95`,
        value: concurrent.p95,
        unit: 'ms',
        target: null,
        floor: floor.p95,
        ratio: ratio(concurrent.p95, floor.p95),
        ok: null,
      },
      {
        name: 'GET /api/stats 10 concurrent: requests/s',
        value: concurrent.requests.average,
        unit: 'req/s',
        target: null,
        floor: floor.rps,
        ratio: ratio(concurrent.requests.average, floor.rps),
        ok: null,
      },
      {
        name: 'GET /api/arsenal p95 beside 10 concurrent stats',
        value: beside.p95,
        unit: 'ms',
        target: '≤ 50 ms',
        floor: floorArsenal.p95,
        ratio: ratio(beside.p95, floorArsenal.p95),
        ok: beside.p95 <= 50,
      },
      {
        name: 'server peak RSS (VmHWM) during the 10 concurrent stats',
        value: rssMb,
        unit: 'MB',
        target: '< 400 MB',
        floor: null,
        ratio: null,
        ok: rssMb < 400,
      },
      { name: 'server RSS once started', value: idleRssMb, unit: 'MB', target: null, floor: null, ratio: null, ok: null },
      {
        name: 'server RSS before the 10 concurrent (the season counted, 65 requests served)',
        value: rssBeforeLoadMb,
        unit: 'MB',
        target: null,
        floor: null,
        ratio: null,
        ok: null,
      },
    ];
    const loadAvg = os.loadavg().map((x) => Math.round(x * 100) / 100);
    console.log(`\nStats (production build; floor = bare Express answering the same body, same run; load average ${loadAvg.join(' ')})`);
    for (const h of results)
      console.log(
        `${h.name.padEnd(84)} ${h.value.toFixed(1).padStart(9)} ${h.unit.padEnd(6)} ${h.floor === null ? ''.padEnd(16) : `floor ${h.floor.toFixed(1)}`.padEnd(16)} ${h.ratio === null ? ''.padEnd(9) : `${h.ratio.toFixed(3)} ×`.padEnd(9)} ${h.target ?? ''} ${h.ok === null ? '' : h.ok ? 'ok' : 'MISSED'}`,
      );
    if (errors) console.log(`non-2xx or errors during the load: ${errors}`);
    writeResults('stats', { date: new Date().toISOString(), loadAverage: loadAvg, cores: os.cpus().length, errors, statShots, results });
    if (errors || results.some((r) => r.ok === false)) process.exitCode = 1;
  } finally {
    await stopAll(server, dir, 500);
  }
}

await main();
