/**
 * Reliability benchmark (the third part of `npm run bench`; alone: `npm run bench:reliability`): the real
 * server (NODE_ENV=production) on a throwaway PostgreSQL with the demo seed, loaded with autocannon on
 * loopback at 50 concurrent connections for 30 s per route, on the main read and write routes:
 *
 *  - GET  /api/arsenal                              (dana's arsenal, signed in)
 *  - GET  /api/centers/:id/conditions/current       (public)
 *  - POST /api/matchups                             (dana ranks her arsenal for the house pattern)
 *  - PUT  /api/profile                              (dana saves her release: one row, updated concurrently)
 *
 * For each: requests per second (mean over the run), p95 latency computed from every response's latency
 * (autocannon itself reports p97.5 and p99, listed beside it), and answers counted by class; the target is
 * 0 answers outside 2xx/4xx (5xx, socket errors, timeouts). Written to bench/results.json under "reliability".
 * Environment: BENCH_DURATION (s, default 30) and BENCH_CONNECTIONS (default 50).
 */
import autocannon from 'autocannon';
import type { ChildProcess } from 'node:child_process';
import os from 'node:os';
import { migrateAndSeed, serverErrors, signIn, startServer, stopAll, throwawayCluster, writeResults } from './lib/benchServer';
import { productionEnv } from './lib/productionEnv';
import { freePort } from '../scripts/lib/pg.mjs';

const DURATION = Number(process.env.BENCH_DURATION ?? 30);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 50);

interface Load {
  name: string;
  method: 'GET' | 'POST' | 'PUT';
  url: string;
  headers: Record<string, string>;
  body?: () => string;
}

interface Figures {
  name: string;
  connections: number;
  durationS: number;
  requests: number;
  rps: number;
  p50Ms: number;
  p95Ms: number;
  p97_5Ms: number;
  p99Ms: number;
  /** 503 is counted apart: the ranking queue refuses with Retry-After when full (bench/engineLoad.ts checks the header). */
  status: { '2xx': number; '4xx': number; '503': number; '5xx': number; other: number };
  errors: number;
  timeouts: number;
  /** Answers that are neither 2xx, 4xx nor a 503 refusal, plus socket errors (timeouts included): target 0. */
  bad: number;
}

/** Nearest-rank percentile of latencies in ms. */
function percentile(sorted: Float64Array, p: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))];
}

async function measure(load: Load): Promise<Figures> {
  const latencies: number[] = [];
  const status = { '2xx': 0, '4xx': 0, '503': 0, '5xx': 0, other: 0 };
  const result = await new Promise<autocannon.Result>((resolve, reject) => {
    const inst = autocannon(
      {
        url: load.url,
        connections: CONNECTIONS,
        duration: DURATION,
        timeout: 10,
        requests: [
          {
            method: load.method,
            headers: load.headers,
            ...(load.body ? { setupRequest: (req: autocannon.Request) => ({ ...req, body: load.body!() }) } : {}),
          },
        ],
      },
      (err, res) => (err ? reject(err) : resolve(res)),
    );
    inst.on('response', (_client: unknown, statusCode: number, _bytes: number, responseTime: number) => {
      latencies.push(responseTime);
      const k =
        statusCode >= 200 && statusCode < 300
          ? '2xx'
          : statusCode >= 400 && statusCode < 500
            ? '4xx'
            : statusCode === 503
              ? '503'
              : statusCode >= 500
                ? '5xx'
                : 'other';
      status[k] += 1;
    });
  });
  const sorted = Float64Array.from(latencies).sort();
  return {
    name: load.name,
    connections: CONNECTIONS,
    durationS: DURATION,
    requests: result.requests.total,
    rps: result.requests.average,
    p50Ms: percentile(sorted, 50),
    p95Ms: percentile(sorted, 95),
    p97_5Ms: result.latency.p97_5,
    p99Ms: result.latency.p99,
    status,
    errors: result.errors,
    timeouts: result.timeouts,
    bad: status['5xx'] + status.other + result.errors, // autocannon's errors include its timeouts
  };
}

async function main(): Promise<void> {
  const { dir, adminUrl: url } = await throwawayCluster('lanewright-reliability-');
  let server: ChildProcess | null = null;
  try {
    const env = productionEnv(url);
    migrateAndSeed(env);
    const port = await freePort();
    const started = await startServer({ env: { ...env, RATE_LIMIT_AUTH: '100000' }, port, tries: 150, collect: true });
    server = started.server;
    const { base, output } = started;
    const auth = await signIn(base, 'dana@copperline.example');
    const centers = (await (await fetch(`${base}/api/centers`)).json()) as { items: { id: number; name: string }[] };
    const patterns = (await (await fetch(`${base}/api/patterns`, { headers: auth })).json()) as { items: { id: number; name: string }[] };
    const center = centers.items[0];
    const pattern = patterns.items[0];
    let n = 0;

    const loads: Load[] = [
      { name: 'GET /api/arsenal', method: 'GET', url: `${base}/api/arsenal`, headers: auth },
      {
        name: 'GET /api/centers/:id/conditions/current',
        method: 'GET',
        url: `${base}/api/centers/${center.id}/conditions/current`,
        headers: {},
      },
      {
        name: 'POST /api/matchups',
        method: 'POST',
        url: `${base}/api/matchups`,
        headers: auth,
        body: () => JSON.stringify({ patternId: pattern.id }),
      },
      // Speeds in steps of 0.1 mph: every write changes the row.
      {
        name: 'PUT /api/profile',
        method: 'PUT',
        url: `${base}/api/profile`,
        headers: auth,
        body: () => JSON.stringify({ speedMph: 15 + (n++ % 40) / 10 }),
      },
    ];
    const figures: Figures[] = [];
    console.log(
      `\nReliability (autocannon on loopback, ${CONNECTIONS} connections × ${DURATION} s per route; p95 from every response's latency)`,
    );
    for (const l of loads) {
      const f = await measure(l);
      figures.push(f);
      console.log(
        `${f.name.padEnd(44)} ${f.rps.toFixed(0).padStart(6)} req/s  p50 ${f.p50Ms.toFixed(1).padStart(7)} ms  p95 ${f.p95Ms.toFixed(1).padStart(7)} ms  (p97.5 ${f.p97_5Ms.toFixed(1)}, p99 ${f.p99Ms.toFixed(1)})  2xx ${f.status['2xx']}  4xx ${f.status['4xx']}  503 ${f.status['503']}  5xx ${f.status['5xx']}  errors ${f.errors}  timeouts ${f.timeouts}  ${f.bad === 0 ? 'ok' : 'NOT 0'}`,
      );
    }
    const bad = figures.reduce((a, f) => a + f.bad, 0);
    if (bad) console.log(`answers outside 2xx/4xx, errors and timeouts: ${bad} (target 0)\n${serverErrors(output())}`);

    writeResults('reliability', {
      date: new Date().toISOString(),
      machine: { cpus: os.cpus().length, cpu: os.cpus()[0]?.model, node: process.version },
      connections: CONNECTIONS,
      durationS: DURATION,
      target: '0 answers outside 2xx/4xx',
      bad,
      results: figures,
    });
    if (bad) process.exitCode = 1;
  } finally {
    await stopAll(server, dir, 1000);
  }
}

await main();
